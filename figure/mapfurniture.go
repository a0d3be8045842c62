package figure

import (
	"image"
	"image/color"
	"math"

	"gonum.org/v1/plot"
	"gonum.org/v1/plot/vg"
	"gonum.org/v1/plot/vg/draw"
)

// This file holds the furniture of a map: scale bar, north arrow and colour bar.

// scaleBarGeom returns the bar length in map units and in metres and the
// bar's box in canvas coordinates (lower left of the data area).
func (s *mapState) scaleBarGeom(p *plot.Plot, da draw.Canvas) (units, metres float64, bar vg.Rectangle) {
	span := (p.X.Max - p.X.Min) * s.mPerUnitX
	metres = niceFloor(span / 4)
	units = metres / s.mPerUnitX
	w := vg.Length(units/(p.X.Max-p.X.Min)) * (da.Max.X - da.Min.X)
	x0, y0 := da.Min.X+8, da.Min.Y+8
	if s.sbCorner&1 != 0 { // right
		tw := textStyle(sizeSmall).Width(scaleLabel(metres, s.m.degrees()))
		x0 = da.Max.X - 8 - max(w, tw+4)
	}
	if s.sbCorner&2 != 0 { // top
		y0 = da.Max.Y - 8 - 4 - lineHeight(textStyle(sizeSmall)) - 3
	}
	return units, metres, vg.Rectangle{Min: vg.Point{X: x0, Y: y0}, Max: vg.Point{X: x0 + w, Y: y0 + 4}}
}

func (s *mapState) scaleBarRect(p *plot.Plot, da draw.Canvas) vg.Rectangle {
	_, m, bar := s.scaleBarGeom(p, da)
	lh := lineHeight(textStyle(sizeSmall))
	r := bar
	r.Min.X -= 4
	r.Min.Y -= 4
	r.Max.Y += lh + 3
	if tw := textStyle(sizeSmall).Width(scaleLabel(m, s.m.degrees())); r.Max.X-r.Min.X < tw+8 {
		r.Max.X = r.Min.X + tw + 8
	}
	r.Max.X += 4
	return r
}

func scaleLabel(m float64, approx bool) string {
	s := formatNum(m, 3) + " m"
	if m >= 1000 {
		s = formatNum(m/1000, 3) + " km"
	}
	if approx {
		s = "≈ " + s
	}
	return s
}

func (s *mapState) drawScaleBar(c draw.Canvas, p *plot.Plot) {
	_, m, bar := s.scaleBarGeom(p, c)
	box := s.scaleBarRect(p, c)
	c.FillPolygon(haloColor, []vg.Point{box.Min, {X: box.Max.X, Y: box.Min.Y}, box.Max, {X: box.Min.X, Y: box.Max.Y}})
	// Two halves, black then white, outlined.
	mid := (bar.Min.X + bar.Max.X) / 2
	c.FillPolygon(color.Black, []vg.Point{bar.Min, {X: mid, Y: bar.Min.Y}, {X: mid, Y: bar.Max.Y}, {X: bar.Min.X, Y: bar.Max.Y}})
	c.FillPolygon(color.White, []vg.Point{{X: mid, Y: bar.Min.Y}, {X: bar.Max.X, Y: bar.Min.Y}, bar.Max, {X: mid, Y: bar.Max.Y}})
	out := draw.LineStyle{Color: color.Black, Width: 0.6}
	c.StrokeLines(out, []vg.Point{bar.Min, {X: bar.Max.X, Y: bar.Min.Y}, bar.Max, {X: bar.Min.X, Y: bar.Max.Y}, bar.Min})
	sty := textStyle(sizeSmall)
	sty.XAlign, sty.YAlign = draw.XLeft, draw.YBottom
	c.FillText(sty, vg.Point{X: bar.Min.X, Y: bar.Max.Y + 2}, scaleLabel(m, s.m.degrees()))
}

const northSize = 18

func northArrowRect(da draw.Canvas) vg.Rectangle {
	lh := lineHeight(textStyle(sizeLabel))
	x1, y1 := da.Max.X-6, da.Max.Y-6
	return vg.Rectangle{Min: vg.Point{X: x1 - northSize*0.7, Y: y1 - northSize - lh - 2}, Max: vg.Point{X: x1, Y: y1}}
}

func drawNorthArrow(c draw.Canvas) {
	r := northArrowRect(c)
	c.FillPolygon(haloColor, []vg.Point{r.Min, {X: r.Max.X, Y: r.Min.Y}, r.Max, {X: r.Min.X, Y: r.Max.Y}})
	cx := (r.Min.X + r.Max.X) / 2
	lh := lineHeight(textStyle(sizeLabel))
	tip := vg.Point{X: cx, Y: r.Max.Y - lh - 1}
	base := r.Min.Y + 2
	hw := vg.Length(northSize * 0.25)
	notch := vg.Point{X: cx, Y: base + northSize*0.28}
	// Half-filled arrowhead: left half black, right half white, outlined.
	left := []vg.Point{tip, {X: cx - hw, Y: base}, notch}
	right := []vg.Point{tip, notch, {X: cx + hw, Y: base}}
	c.FillPolygon(color.Black, left)
	c.FillPolygon(color.White, right)
	c.StrokeLines(draw.LineStyle{Color: color.Black, Width: 0.7}, []vg.Point{tip, {X: cx - hw, Y: base}, notch, {X: cx + hw, Y: base}, tip})
	sty := boldStyle(sizeLabel)
	sty.XAlign, sty.YAlign = draw.XCenter, draw.YTop
	c.FillText(sty, vg.Point{X: cx, Y: r.Max.Y}, "N")
}

// drawColorBar draws a vertical colour bar for Diverging{lim} from y0 to y1
// with its left edge at x, the near-equilibrium band (|SI| <= band, when
// band > 0) hatched as on the map.
func drawColorBar(c draw.Canvas, x, y0, y1 vg.Length, lim, band float64, label string) {
	const barW = 9
	if y1-y0 < 20 {
		return
	}
	sc := Diverging{Limit: lim}
	n := 256
	img := image.NewNRGBA(image.Rect(0, 0, 4, n))
	for r := 0; r < n; r++ {
		v := lim - (float64(r)+0.5)/float64(n)*2*lim
		col := sc.Color(v)
		for k := 0; k < 4; k++ {
			img.SetNRGBA(k, r, col)
		}
	}
	c.DrawImage(vg.Rectangle{Min: vg.Point{X: x, Y: y0}, Max: vg.Point{X: x + barW, Y: y1}}, img)
	out := draw.LineStyle{Color: inkColor, Width: 0.6}
	c.StrokeLines(out, []vg.Point{{X: x, Y: y0}, {X: x + barW, Y: y0}, {X: x + barW, Y: y1}, {X: x, Y: y1}, {X: x, Y: y0}})
	yOf := func(v float64) vg.Length { return y0 + vg.Length((v+lim)/(2*lim))*(y1-y0) }
	if b := math.Min(band, lim); b > 0 {
		r := vg.Rectangle{Min: vg.Point{X: x, Y: yOf(-b)}, Max: vg.Point{X: x + barW, Y: yOf(b)}}
		hatch(c, r)
		c.StrokeLine2(bandEdgeStyle, x, r.Min.Y, x+barW, r.Min.Y)
		c.StrokeLine2(bandEdgeStyle, x, r.Max.Y, x+barW, r.Max.Y)
	}
	// Equilibrium mark across the bar.
	c.StrokeLine2(draw.LineStyle{Color: color.Black, Width: 0.8}, x, yOf(0), x+barW, yOf(0))
	step := niceFloor(lim / 2)
	tsty := textStyle(sizeTick)
	tsty.XAlign, tsty.YAlign = draw.XLeft, draw.YCenter
	var tw vg.Length
	for v := math.Ceil(-lim/step-1e-9) * step; v <= lim+step*1e-9; v += step {
		y := yOf(v)
		c.StrokeLine2(out, x+barW, y, x+barW+3, y)
		l := formatTick(v, step)
		if v > step*1e-9 {
			l = "+" + l
		}
		c.FillText(tsty, vg.Point{X: x + barW + 5, Y: y}, l)
		tw = max(tw, tsty.Width(l))
	}
	// End labels along the bar, then the main label.
	xe := x + barW + 5 + tw + 4
	es := textStyle(sizeSmall)
	es.Rotation = math.Pi / 2
	es.YAlign = draw.YTop
	half := (y1 - y0) / 2
	if es.Width("undersaturated") < half-6 {
		es.XAlign = draw.XRight
		c.FillText(es, vg.Point{X: xe, Y: y1}, "supersaturated")
		es.XAlign = draw.XLeft
		c.FillText(es, vg.Point{X: xe, Y: y0}, "undersaturated")
	}
	ls := textStyle(sizeLabel)
	ls.Rotation = math.Pi / 2
	ls.XAlign, ls.YAlign = draw.XCenter, draw.YTop
	c.FillText(ls, vg.Point{X: xe + lineHeight(es) + 3, Y: (y0 + y1) / 2}, label)
}
