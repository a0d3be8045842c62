package figure

import (
	"fmt"
	"image/color"
	"strings"

	"gonum.org/v1/plot"
	"gonum.org/v1/plot/vg"
	"gonum.org/v1/plot/vg/draw"
)

// This file holds how site features look on a map and in its legend: one
// line style per feature class, so a river never looks like a pipeline.

// Feature classes with their own look; any other class (or none) is drawn
// in a neutral style by geometry.
const (
	ClassBoundary      = "boundary"
	ClassRiver         = "river"
	ClassPipeline      = "pipeline"
	ClassInjectionWell = "injection_well"
)

var (
	riverColor    = color.NRGBA{R: 0x1f, G: 0x4e, B: 0x99, A: 0xff} // dark blue
	pipelineColor = color.NRGBA{R: 0x6b, G: 0x3e, B: 0x1e, A: 0xff} // dark brown
)

func (f Feature) class() string { return strings.ToLower(strings.TrimSpace(f.Class)) }

// featureLook is the line style of a feature and whether it has a white
// halo under it.
func featureLook(f Feature) (draw.LineStyle, bool) {
	switch f.class() {
	case ClassBoundary:
		return draw.LineStyle{Color: color.Black, Width: 1.1, Dashes: []vg.Length{8, 3}}, false
	case ClassRiver:
		return draw.LineStyle{Color: riverColor, Width: 1.8}, true
	case ClassPipeline:
		return draw.LineStyle{Color: pipelineColor, Width: 1.2, Dashes: []vg.Length{6, 2, 1.5, 2}}, true
	}
	if f.Kind == FeatureLine {
		return draw.LineStyle{Color: greyColor, Width: 1.0, Dashes: []vg.Length{1.5, 2}}, false
	}
	return draw.LineStyle{Color: greyColor, Width: 1.0, Dashes: []vg.Length{3, 1.5}}, false
}

// featureLegendKey groups features that look the same.
func featureLegendKey(f Feature) string {
	if c := f.class(); c != "" {
		return c
	}
	return f.Kind
}

// featureLegend returns one legend entry per look: the feature's name when
// it is the only one of its class, else the class and a count.
func featureLegend(fs []Feature) []legendEntry {
	var order []string
	groups := map[string][]Feature{}
	for _, f := range fs {
		k := featureLegendKey(f)
		if _, ok := groups[k]; !ok {
			order = append(order, k)
		}
		groups[k] = append(groups[k], f)
	}
	var es []legendEntry
	for _, k := range order {
		g := groups[k]
		f := g[0]
		what := strings.ReplaceAll(k, "_", " ")
		switch k {
		case FeaturePolygon:
			what = "site area"
		case FeatureLine:
			what = "site line"
		case FeaturePoint:
			what = "site point"
		}
		label := what
		if len(g) == 1 && f.Name != "" {
			label = f.Name
			if !strings.Contains(strings.ToLower(f.Name), strings.ToLower(what)) {
				label = what + ": " + f.Name
			}
		} else if len(g) > 1 {
			label = fmt.Sprintf("%s (%d)", what, len(g))
		}
		switch {
		case f.Kind == FeaturePoint && f.class() == ClassInjectionWell:
			es = append(es, legendEntry{label: label, kind: legendGlyph, glyph: glyphTriangle, fill: color.White})
		case f.Kind == FeaturePoint:
			es = append(es, legendEntry{label: label, kind: legendGlyph, glyph: glyphPlus, fill: nil})
		default:
			st, halo := featureLook(f)
			es = append(es, legendEntry{label: label, kind: legendLine, line: st, halo: halo})
		}
	}
	return es
}

type featurePlotter struct{ fs []Feature }

func (fp *featurePlotter) Plot(c draw.Canvas, p *plot.Plot) {
	tx, ty := p.Transforms(&c)
	for _, f := range fp.fs {
		pts := make([]vg.Point, 0, len(f.Coords)+1)
		for _, q := range f.Coords {
			pts = append(pts, vg.Point{X: tx(q[0]), Y: ty(q[1])})
		}
		if f.Kind == FeaturePoint {
			for _, pt := range pts {
				if !c.Contains(pt) {
					continue
				}
				if f.class() == ClassInjectionWell {
					drawGlyph(c, glyphTriangle, pt, wellRadius*1.2, color.White, color.Black, 1.0)
				} else {
					drawGlyph(c, glyphPlus, pt, 3.5, nil, color.Black, 0.7)
				}
			}
			continue
		}
		if f.Kind == FeaturePolygon && pts[0] != pts[len(pts)-1] {
			pts = append(pts, pts[0])
		}
		st, halo := featureLook(f)
		if halo {
			h := st
			h.Width += 1.6
			h.Dashes = nil
			h.Color = color.NRGBA{R: 255, G: 255, B: 255, A: 0xc0}
			c.StrokeLines(h, c.ClipLinesXY(pts)...)
		}
		c.StrokeLines(st, c.ClipLinesXY(pts)...)
	}
}
