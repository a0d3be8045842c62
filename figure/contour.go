package figure

import (
	"image"
	"image/color"
	"math"

	"gonum.org/v1/plot"
	"gonum.org/v1/plot/plotter"
	"gonum.org/v1/plot/vg"
	"gonum.org/v1/plot/vg/draw"
)

// This file holds what an SI map draws on its plot: the surface image, the
// SI = 0 contour, the site features and the well symbols.

// gridImage is the SI surface as a crisp nearest-neighbour image: each cell
// is repeated into a block of f x f pixels so that no renderer smooths
// between cells; blank cells are transparent.
// Cells within the near-equilibrium band (|SI| <= band, band > 0) are
// hatched with diagonal lines hatchPx image pixels apart, darkened towards
// black, so the zone reads as "sign not decided" in colour and in grey.
func gridImage(g *Grid, sc Diverging, band float64, hatchPx, f int) *plotter.Image {
	img := image.NewNRGBA(image.Rect(0, 0, g.NX*f, g.NY*f))
	for j := 0; j < g.NY; j++ {
		for i := 0; i < g.NX; i++ {
			k := j*g.NX + i
			if !g.ok(k) {
				continue
			}
			col := sc.Color(g.Z[k])
			inBand := band > 0 && hatchPx >= 3 && g.Z[k] >= -band && g.Z[k] <= band
			dark := darker(col, 0.45)
			row := g.NY - 1 - j
			for dy := 0; dy < f; dy++ {
				for dx := 0; dx < f; dx++ {
					x, y := i*f+dx, row*f+dy
					c := col
					if inBand && (x+y)%hatchPx < max(1, hatchPx/5) {
						c = dark
					}
					img.SetNRGBA(x, y, c)
				}
			}
		}
	}
	return plotter.NewImage(img, g.X0-g.DX/2, g.Y0-g.DY/2, g.X0+(float64(g.NX)-0.5)*g.DX, g.Y0+(float64(g.NY)-0.5)*g.DY)
}

// surfacePlotter draws the surface image, hatching the band about 4 pt
// apart on the page (as in the legend) whatever the figure's size. It has
// no glyph boxes, so it does not pad the data area.
type surfacePlotter struct {
	g    *Grid
	sc   Diverging
	band float64
}

func (sp *surfacePlotter) Plot(c draw.Canvas, p *plot.Plot) {
	g := sp.g
	// Build the image at about the output's own resolution (PNGDPI): each
	// cell a block of f x f pixels, so the library scales it little (a
	// large downscale costs most of a map's drawing time) and it stays
	// crisp.
	hatchPx, f := 0, 1
	if w := float64(c.Max.X - c.Min.X); w > 0 && p.X.Max > p.X.Min {
		cellPt := g.DX / (p.X.Max - p.X.Min) * w
		f = max(1, min(16, int(math.Ceil(cellPt*PNGDPI/72))))
		hatchPx = int(math.Round(4 * float64(f) / cellPt))
	}
	gridImage(g, sp.sc, sp.band, hatchPx, f).Plot(c, p)
}

// zeroContour traces SI = 0.
func zeroContour(g *Grid) [][][2]float64 { return contourAt(g, 0) }

// contourAt traces z = level by marching squares over the cell centres,
// using only squares whose four corners hold finite values, and chains the
// pieces into polylines.
func contourAt(g *Grid, level float64) [][][2]float64 {
	type seg struct {
		e [2]int
		p [2][2]float64
	}
	var segs []seg
	z := func(i, j int) float64 { return g.Z[j*g.NX+i] - level }
	pos := func(i, j int) [2]float64 { return [2]float64{g.X0 + float64(i)*g.DX, g.Y0 + float64(j)*g.DY} }
	// Edge ids: horizontal edge from (i,j) to (i+1,j) is 2k, vertical edge
	// from (i,j) to (i,j+1) is 2k+1, k = j*NX+i.
	cross := func(i0, j0, i1, j1 int) (float64, [2]float64) {
		a, b := z(i0, j0), z(i1, j1)
		t := a / (a - b)
		p0, p1 := pos(i0, j0), pos(i1, j1)
		return t, [2]float64{p0[0] + t*(p1[0]-p0[0]), p0[1] + t*(p1[1]-p0[1])}
	}
	for j := 0; j+1 < g.NY; j++ {
		for i := 0; i+1 < g.NX; i++ {
			k := j*g.NX + i
			if !g.ok(k) || !g.ok(k+1) || !g.ok(k+g.NX) || !g.ok(k+g.NX+1) {
				continue
			}
			// corners counter-clockwise: bl, br, tr, tl; edges bottom, right, top, left
			cs := [4][2]int{{i, j}, {i + 1, j}, {i + 1, j + 1}, {i, j + 1}}
			eid := [4]int{2 * k, 2*(k+1) + 1, 2 * (k + g.NX), 2*k + 1}
			var es []int
			var ps [][2]float64
			for e := 0; e < 4; e++ {
				a, b := cs[e], cs[(e+1)%4]
				za, zb := z(a[0], a[1]), z(b[0], b[1])
				if (za >= 0) != (zb >= 0) {
					_, p := cross(a[0], a[1], b[0], b[1])
					es = append(es, eid[e])
					ps = append(ps, p)
				}
			}
			switch len(es) {
			case 2:
				segs = append(segs, seg{[2]int{es[0], es[1]}, [2][2]float64{ps[0], ps[1]}})
			case 4:
				// Saddle: decide by the mean of the corners. Crossings are
				// on edges bottom, right, top, left in that order.
				mean := (z(i, j) + z(i+1, j) + z(i+1, j+1) + z(i, j+1)) / 4
				if (mean >= 0) == (z(i, j) >= 0) {
					segs = append(segs, seg{[2]int{es[0], es[1]}, [2][2]float64{ps[0], ps[1]}})
					segs = append(segs, seg{[2]int{es[2], es[3]}, [2][2]float64{ps[2], ps[3]}})
				} else {
					segs = append(segs, seg{[2]int{es[3], es[0]}, [2][2]float64{ps[3], ps[0]}})
					segs = append(segs, seg{[2]int{es[1], es[2]}, [2][2]float64{ps[1], ps[2]}})
				}
			}
		}
	}
	// Chain segments sharing an edge crossing.
	byEdge := map[int][]int{}
	for n, s := range segs {
		byEdge[s.e[0]] = append(byEdge[s.e[0]], n)
		byEdge[s.e[1]] = append(byEdge[s.e[1]], n)
	}
	used := make([]bool, len(segs))
	next := func(edge, from int) int {
		for _, n := range byEdge[edge] {
			if n != from && !used[n] {
				return n
			}
		}
		return -1
	}
	// walk follows the chain from segment cur through its crossing on edge,
	// collecting the far point of each segment it joins.
	walk := func(edge, cur int) [][2]float64 {
		var pts [][2]float64
		for {
			m := next(edge, cur)
			if m < 0 {
				return pts
			}
			used[m] = true
			if segs[m].e[0] == edge {
				pts = append(pts, segs[m].p[1])
				edge = segs[m].e[1]
			} else {
				pts = append(pts, segs[m].p[0])
				edge = segs[m].e[0]
			}
			cur = m
		}
	}
	var lines [][][2]float64
	for n := range segs {
		if used[n] {
			continue
		}
		used[n] = true
		forward := walk(segs[n].e[1], n)
		back := walk(segs[n].e[0], n)
		for a, b := 0, len(back)-1; a < b; a, b = a+1, b-1 {
			back[a], back[b] = back[b], back[a]
		}
		line := append(back, segs[n].p[0], segs[n].p[1])
		lines = append(lines, append(line, forward...))
	}
	return lines
}

// darker mixes c with black (f = 0: c, f = 1: black).
func darker(c color.NRGBA, f float64) color.NRGBA {
	m := func(v uint8) uint8 { return uint8(float64(v)*(1-f) + 0.5) }
	return color.NRGBA{R: m(c.R), G: m(c.G), B: m(c.B), A: c.A}
}

type contourPlotter struct {
	lines [][][2]float64
	st    draw.LineStyle
}

func (cp *contourPlotter) Plot(c draw.Canvas, p *plot.Plot) {
	tx, ty := p.Transforms(&c)
	var vls [][]vg.Point
	for _, l := range cp.lines {
		pts := make([]vg.Point, len(l))
		for i, q := range l {
			pts[i] = vg.Point{X: tx(q[0]), Y: ty(q[1])}
		}
		vls = append(vls, pts)
	}
	c.StrokeLines(cp.st, vls...)
}

// overlay draws the wells, their labels, the scale bar and the north arrow
// in the data area.
type overlay struct {
	s   *mapState
	lay *mapLayout
}

func (o *overlay) Plot(c draw.Canvas, p *plot.Plot) {
	s, lay := o.s, o.lay
	tx, ty := p.Transforms(&c)
	// Leader lines first, then label boxes, then symbols on top.
	leader := draw.LineStyle{Color: greyColor, Width: 0.5}
	for i, pl := range lay.places {
		if pl.placed && pl.leader {
			a := lay.items[i].anchor
			c.StrokeLine2(leader, a.X, a.Y, nearestOnRect(pl.rect, a).X, nearestOnRect(pl.rect, a).Y)
		}
	}
	for _, w := range s.wells {
		pt := vg.Point{X: tx(w.X), Y: ty(w.Y)}
		fill := color.Color(color.White)
		if finite(w.SI) {
			fill = s.scale.Color(w.SI)
		}
		r := vg.Length(wellRadius)
		if w.Marker == MarkerInjection {
			r = wellRadius * 1.1
		}
		// A white rim, then a dark outline: the symbol stands apart from a
		// surface of the same colour.
		drawGlyph(c, w.Marker.glyph(), pt, r+0.9, color.White, color.White, 0)
		drawGlyph(c, w.Marker.glyph(), pt, r, fill, color.Black, 1.0)
		if !finite(w.SI) {
			drawGlyph(c, glyphCross, pt, r*0.55, nil, inkColor, 0.35)
		}
	}
	for i, pl := range lay.places {
		if !pl.placed {
			continue
		}
		r := pl.rect
		c.FillPolygon(haloColor, []vg.Point{r.Min, {X: r.Max.X, Y: r.Min.Y}, r.Max, {X: r.Min.X, Y: r.Max.Y}})
		sty := wellLabelStyle
		sty.XAlign, sty.YAlign = draw.XCenter, draw.YCenter
		c.FillText(sty, vg.Point{X: (r.Min.X + r.Max.X) / 2, Y: (r.Min.Y + r.Max.Y) / 2}, lay.texts[i])
	}
	if s.m.ScaleBar {
		s.drawScaleBar(c, p)
	}
	if s.m.NorthArrow {
		drawNorthArrow(c)
	}
}
