package figure

import (
	"image/color"
	"math"

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

func (s *mapState) legend() []legendEntry {
	var es []legendEntry
	for _, k := range []MarkerKind{MarkerWell, MarkerInjection, MarkerMonitoring, MarkerSpring} {
		if s.kinds[k] {
			es = append(es, legendEntry{label: markerNames[k], kind: legendGlyph, glyph: k.glyph(), fill: color.NRGBA{R: 0xbb, G: 0xbb, B: 0xbb, A: 0xff}})
		}
	}
	if s.noSI {
		es = append(es, legendEntry{label: "no SI value", kind: legendGlyph, glyph: glyphCircle, fill: color.White, cross: true})
	}
	if len(s.contour) > 0 {
		es = append(es, legendEntry{label: "SI = 0 (equilibrium)", kind: legendLine, line: contourStyle, halo: true})
	}
	seen := map[string]bool{}
	for _, f := range s.features {
		if f.Kind == FeaturePoint || seen[f.Kind+"\x00"+f.Name] {
			continue
		}
		seen[f.Kind+"\x00"+f.Name] = true
		name := f.Name
		if name == "" {
			name = map[string]string{FeaturePolygon: "site feature", FeatureLine: "line feature"}[f.Kind]
		}
		e := legendEntry{label: name, kind: legendLine, line: featureStyle(f.Kind)}
		if f.Kind == FeaturePolygon {
			e.kind = legendPatch
			e.fill = color.Transparent
		}
		es = append(es, e)
	}
	return es
}

var contourStyle = draw.LineStyle{Color: color.Black, Width: 1.3}

func featureStyle(kind string) draw.LineStyle {
	if kind == FeatureLine {
		return draw.LineStyle{Color: color.NRGBA{R: 0x2b, G: 0x2b, B: 0x2b, A: 0xff}, Width: 1.1, Dashes: []vg.Length{5, 2, 1.5, 2}}
	}
	return draw.LineStyle{Color: color.NRGBA{R: 0x40, G: 0x40, B: 0x40, A: 0xff}, Width: 1.0, Dashes: []vg.Length{3, 1.5}}
}

type mapLayout struct {
	p      *plot.Plot
	mapC   draw.Canvas
	da     draw.Canvas
	cbarX  vg.Length
	places []labelPlacement
	items  []labelItem
	texts  []string
	page   page
	legTop vg.Length
	capTop vg.Length
}

// colorBarWidth is the width reserved right of the map for the colour bar.
func colorBarWidth(lim float64) vg.Length {
	tw := textStyle(sizeTick).Width(formatTick(-lim, niceFloor(lim/2)))
	return 10 + 9 + 3 + tw + 6 + lineHeight(textStyle(sizeSmall)) + 4 + lineHeight(textStyle(sizeLabel))
}

func (s *mapState) layout(body draw.Canvas) mapLayout {
	var lay mapLayout
	mapC := body

	mapC.Max.X -= colorBarWidth(s.lim)
	p := newPlot()
	if s.m.degrees() {
		p.X.Label.Text, p.Y.Label.Text = "Longitude (°)", "Latitude (°)"
	} else {
		p.X.Label.Text, p.Y.Label.Text = "Easting (m)", "Northing (m)"
	}
	// As many x labels as fit side by side, about 1.6 label widths apart.
	big := math.Max(math.Abs(s.ext.x0), math.Abs(s.ext.x1))
	lw := float64(textStyle(sizeTick).Width(formatNum(big, 7)))
	nx := int(float64(mapC.Max.X-mapC.Min.X-60) / (1.6 * lw))
	ny := int(float64(mapC.Max.Y-mapC.Min.Y-30) / (3.5 * float64(lineHeight(textStyle(sizeTick)))))
	p.X.Tick.Marker = niceTicks{n: min(max(nx, 2), 6)}
	p.Y.Tick.Marker = niceTicks{n: min(max(ny, 2), 6)}
	if s.hasCells {
		p.Add(gridImage(s.grid, s.scale))
	}
	if len(s.features) > 0 {
		p.Add(&featurePlotter{s.features})
	}
	if len(s.contour) > 0 {
		p.Add(&contourPlotter{s.contour})
	}
	ov := &overlay{s: s, lay: &lay}
	p.Add(ov)
	x0, x1, y0, y1 := s.ext.x0, s.ext.x1, s.ext.y0, s.ext.y1
	// Equal scale: expand the shorter range until one unit (scaled by
	// aspectX along x) takes the same length on both axes. Two passes, as
	// tick labels change the data area a little.
	for pass := 0; pass < 3; pass++ {
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
		x0, x1 = cx-u*w/s.aspectX/2, cx+u*w/s.aspectX/2
		y0, y1 = cy-u*h/2, cy+u*h/2
	}
	p.X.Min, p.X.Max, p.Y.Min, p.Y.Max = x0, x1, y0, y1
	lay.p, lay.mapC = p, mapC
	lay.da = p.DataCanvas(mapC)
	lay.cbarX = lay.da.Max.X + 10
	lay.items, lay.texts, lay.places = s.placeLabels(p, lay.da)
	return lay
}

var wellLabelStyle = textStyle(7.5)

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
		items = append(items, labelItem{anchor: pt, r: wellRadius, w: wellLabelStyle.Width(w.Label) + 2, h: wellLabelStyle.Height(w.Label) + 1})
		texts = append(texts, w.Label)
	}
	for _, f := range s.features {
		if f.Kind != FeaturePoint {
			continue
		}
		for _, c := range f.Coords {
			pt := vg.Point{X: tx(c[0]), Y: ty(c[1])}
			if f.Name == "" {
				continue
			}
			items = append(items, labelItem{anchor: pt, r: 3, w: wellLabelStyle.Width(f.Name) + 2, h: wellLabelStyle.Height(f.Name) + 1})
			texts = append(texts, f.Name)
		}
	}
	if s.m.ScaleBar {
		obstacles = append(obstacles, s.scaleBarRect(p, da))
	}
	if s.m.NorthArrow {
		obstacles = append(obstacles, northArrowRect(da))
	}
	bounds := da.Rectangle
	return items, texts, placeLabels(items, obstacles, bounds)
}
