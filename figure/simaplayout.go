package figure

import (
	"fmt"
	"image/color"
	"math"
	"strconv"
	"strings"

	"gonum.org/v1/plot"
	"gonum.org/v1/plot/vg"
	"gonum.org/v1/plot/vg/draw"
)

// This file holds the layout of an SI map: legend entries, the placement of the
// panel, colour bar and labels.

func (s *mapState) colorLabel() string {
	if s.m.ColorLabel != "" {
		return s.m.ColorLabel
	}
	return DefaultColorLabel
}

// wellFill is the legend fill of a well symbol whose colour shows SI.
var wellFill = color.NRGBA{R: 0xbb, G: 0xbb, B: 0xbb, A: 0xff}

// bandEdgeStyle edges the hatched near-equilibrium zone.
var bandEdgeStyle = draw.LineStyle{Color: color.NRGBA{R: 0x55, G: 0x55, B: 0x55, A: 0xff}, Width: 0.6}

func (s *mapState) legend() []legendEntry {
	var es []legendEntry
	for _, k := range []MarkerKind{MarkerWell, MarkerInjection, MarkerMonitoring, MarkerSpring} {
		if s.kinds[k] {
			es = append(es, legendEntry{label: markerNames[k] + " (fill: its SI)", kind: legendGlyph, glyph: k.glyph(), fill: wellFill})
		}
	}
	if s.noSI {
		es = append(es, legendEntry{label: "no SI value", kind: legendGlyph, glyph: glyphCircle, fill: color.White, cross: true})
	}
	if s.hasCells && s.band > 0 {
		es = append(es, bandLegend(s.band))
	}
	return append(es, featureLegend(s.features)...)
}

func bandLegend(band float64) legendEntry {
	return legendEntry{label: fmt.Sprintf("near equilibrium, SI within ±%s (sign not decided)", formatNum(band, 2)),
		kind: legendPatch, fill: color.NRGBA{R: 0xf4, G: 0xf4, B: 0xf4, A: 0xff}, hatch: true, line: bandEdgeStyle}
}

type mapLayout struct {
	p      *plot.Plot
	mapC   draw.Canvas
	da     draw.Canvas
	places []labelPlacement
	items  []labelItem
	texts  []string
}

// colorBarWidth is the width reserved right of the map for the colour bar.
func colorBarWidth(lim float64) vg.Length {
	tw := textStyle(sizeTick).Width(formatTick(-lim, niceFloor(lim/2)))
	return 10 + 9 + 3 + tw + 6 + lineHeight(textStyle(sizeSmall)) + 4 + lineHeight(textStyle(sizeLabel))
}

func (s *mapState) axisLabels() (string, string) {
	x, y := "Easting (m)", "Northing (m)"
	if s.m.degrees() {
		x, y = "Longitude (°)", "Latitude (°)"
	}
	if s.m.XLabel != "" {
		x = s.m.XLabel
	}
	if s.m.YLabel != "" {
		y = s.m.YLabel
	}
	return x, y
}

// layout places the map in body (colour bar excluded). hideY drops the y
// axis title (panels after the first in a row).
func (s *mapState) layout(body draw.Canvas, hideY bool) mapLayout {
	var lay mapLayout
	mapC := body
	p := newPlot()
	p.X.Label.Text, p.Y.Label.Text = s.axisLabels()
	if hideY {
		p.Y.Label.Text = ""
	}
	// As many x labels as fit side by side, about 1.6 label widths apart.
	big := math.Max(math.Abs(s.ext.x0), math.Abs(s.ext.x1))
	lw := float64(textStyle(sizeTick).Width(formatNum(big, 7)))
	nx := int(float64(mapC.Max.X-mapC.Min.X-60) / (1.6 * lw))
	ny := int(float64(mapC.Max.Y-mapC.Min.Y-30) / (3.5 * float64(lineHeight(textStyle(sizeTick)))))
	p.X.Tick.Marker = innerTicks{niceTicks{n: min(max(nx, 2), 6)}, 0.06}
	p.Y.Tick.Marker = innerTicks{niceTicks{n: min(max(ny, 2), 6)}, 0.03}
	x0, x1, y0, y1 := s.ext.x0, s.ext.x1, s.ext.y0, s.ext.y1
	// Equal scale: expand the shorter range until one unit (scaled by
	// aspectX along x) takes the same length on both axes. Several passes,
	// as tick labels change the data area a little.
	for pass := 0; pass < 8; pass++ {
		p.X.Min, p.X.Max, p.Y.Min, p.Y.Max = x0, x1, y0, y1
		da := p.DataCanvas(mapC)
		w, h := float64(da.Max.X-da.Min.X), float64(da.Max.Y-da.Min.Y)
		if w <= 1 || h <= 1 {
			break
		}
		ux := (s.ext.x1 - s.ext.x0) * s.aspectX / w
		uy := (s.ext.y1 - s.ext.y0) / h
		u := math.Max(ux, uy)
		cx, cy := (s.ext.x0+s.ext.x1)/2, (s.ext.y0+s.ext.y1)/2
		nx0, nx1 := cx-u*w/s.aspectX/2, cx+u*w/s.aspectX/2
		ny0, ny1 := cy-u*h/2, cy+u*h/2
		stable := math.Abs(nx1-nx0-(x1-x0)) < 1e-4*(x1-x0) && math.Abs(ny1-ny0-(y1-y0)) < 1e-4*(y1-y0)
		x0, x1, y0, y1 = nx0, nx1, ny0, ny1
		if stable && pass > 0 {
			break
		}
	}
	p.X.Min, p.X.Max, p.Y.Min, p.Y.Max = x0, x1, y0, y1
	lay.p, lay.mapC = p, mapC
	lay.da = p.DataCanvas(mapC)
	if s.hasCells {
		p.Add(&surfacePlotter{g: s.grid, sc: s.scale, band: s.band})
	}
	if len(s.bandEdges) > 0 {
		p.Add(&contourPlotter{lines: s.bandEdges, st: bandEdgeStyle})
	}
	if len(s.features) > 0 {
		p.Add(&featurePlotter{s.features})
	}
	p.Add(&overlay{s: s, lay: &lay})
	lay.items, lay.texts, lay.places = s.placeLabels(p, lay.da)
	return lay
}

var wellLabelStyle = textStyle(sizeSmall)

const wellRadius = 3.4

func (s *mapState) placeLabels(p *plot.Plot, da draw.Canvas) ([]labelItem, []string, []labelPlacement) {
	tx, ty := p.Transforms(&da)
	var items []labelItem
	var texts []string
	// Injection wells first: they matter most to the reader.
	order := make([]int, 0, len(s.wells))
	for i, w := range s.wells {
		if w.Marker == MarkerInjection {
			order = append(order, i)
		}
	}
	for i, w := range s.wells {
		if w.Marker != MarkerInjection {
			order = append(order, i)
		}
	}
	// Every symbol blocks labels, labelled or not.
	var obstacles []vg.Rectangle
	for _, i := range order {
		w := s.wells[i]
		pt := vg.Point{X: tx(w.X), Y: ty(w.Y)}
		if w.Label == "" {
			obstacles = append(obstacles, vg.Rectangle{Min: vg.Point{X: pt.X - wellRadius, Y: pt.Y - wellRadius}, Max: vg.Point{X: pt.X + wellRadius, Y: pt.Y + wellRadius}})
			continue
		}
		t := w.Label
		if s.m.PostValues {
			if finite(w.SI) {
				t += " " + fixedSigned(w.SI)
			} else {
				t += " (no SI)"
			}
		}
		items = append(items, labelItem{anchor: pt, r: wellRadius, w: wellLabelStyle.Width(t) + 2, h: wellLabelStyle.Height(t) + 1})
		texts = append(texts, t)
	}
	for _, f := range s.features {
		if f.Kind != FeaturePoint {
			continue
		}
		for _, c := range f.Coords {
			pt := vg.Point{X: tx(c[0]), Y: ty(c[1])}
			if f.Name == "" {
				obstacles = append(obstacles, vg.Rectangle{Min: vg.Point{X: pt.X - 3, Y: pt.Y - 3}, Max: vg.Point{X: pt.X + 3, Y: pt.Y + 3}})
				continue
			}
			items = append(items, labelItem{anchor: pt, r: 3, w: wellLabelStyle.Width(f.Name) + 2, h: wellLabelStyle.Height(f.Name) + 1})
			texts = append(texts, f.Name)
		}
	}
	if s.m.ScaleBar {
		// The corner (bottom left, bottom right, top left) whose scale bar
		// covers the fewest wells; the north arrow holds the top right.
		best, bestN := 0, len(s.wells)+1
		for _, corner := range []int{0, 1, 2} {
			s.sbCorner = corner
			r := s.scaleBarRect(p, da)
			n := 0
			for _, w := range s.wells {
				if overlaps(r, grow(vg.Rectangle{Min: vg.Point{X: tx(w.X), Y: ty(w.Y)}, Max: vg.Point{X: tx(w.X), Y: ty(w.Y)}}, wellRadius)) {
					n++
				}
			}
			if n < bestN {
				best, bestN = corner, n
			}
		}
		s.sbCorner = best
		obstacles = append(obstacles, s.scaleBarRect(p, da))
	}
	if s.m.NorthArrow {
		obstacles = append(obstacles, northArrowRect(da))
	}
	bounds := da.Rectangle
	return items, texts, placeLabels(items, obstacles, bounds)
}

// fixedSigned prints an SI with a sign and two decimals (a true minus).
func fixedSigned(v float64) string {
	s := strconv.FormatFloat(v, 'f', 2, 64)
	if s == "-0.00" {
		return "0.00" // no signed zero
	}
	if v >= 0 && s != "0.00" {
		s = "+" + s
	}
	return strings.Replace(s, "-", "\u2212", 1)
}

// innerTicks drops the labels of ticks within frac of the axis ends, so no
// label hangs over the end of the axis: the plotting library would shrink
// the data area for it, which breaks the equal scale of a map.
type innerTicks struct {
	m    plot.Ticker
	frac float64
}

func (t innerTicks) Ticks(min, max float64) []plot.Tick {
	ts := t.m.Ticks(min, max)
	d := t.frac * (max - min)
	for i := range ts {
		if ts[i].Value < min+d || ts[i].Value > max-d {
			ts[i].Label = ""
		}
	}
	return ts
}
