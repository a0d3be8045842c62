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

// EhPHField is one predominance field of a pe-pH (Eh-pH) diagram: an aqueous
// species or a solid, as convex polygons of (pH, pe) vertices.
type EhPHField struct {
	Name     string
	Solid    bool
	Polygons [][][2]float64 // each vertex is {pH, pe}
}

// EhPHSample is a water plotted on the diagram.
type EhPHSample struct {
	Label  string
	PH, PE float64
}

// EhPHDiagram is a pe-pH stability diagram: fields filled (aqueous species in
// cool tints, solids in warm ones), their boundaries, the stability limits of
// water and the samples as points. The drawing takes plain values; the
// geometry is computed elsewhere.
type EhPHDiagram struct {
	Title, Caption             string
	PHMin, PHMax, PEMin, PEMax float64
	Fields                     []EhPHField
	Boundaries                 [][4]float64 // pH0, pe0, pH1, pe1
	// WaterUpper and WaterLower are the limits of water (O2 and H2 at 1 atm),
	// each as pH0, pe0, pH1, pe1.
	WaterUpper, WaterLower [4]float64
	Samples                []EhPHSample
	// EhPerPE, when positive, labels the right-hand axis in Eh volts
	// (Eh = EhPerPE x pe; 0.05916 V at 25 C).
	EhPerPE float64
}

// Skipped counts the samples and vertices left out because they are not finite.
func (d EhPHDiagram) Skipped() int {
	n := 0
	for _, s := range d.Samples {
		if !finite(s.PH, s.PE) {
			n++
		}
	}
	for _, f := range d.Fields {
		for _, p := range f.Polygons {
			for _, v := range p {
				if !finite(v[0], v[1]) {
					n++
				}
			}
		}
	}
	return n
}

// Fill colours of our own: aqueous fields in pale blue-greens, solids in pale
// ochres (iron oxides), greys and lilacs; lightness kept high so that the
// boundary lines, labels and points stay legible in grey-scale print.
var (
	aqueousFills = []color.NRGBA{
		{R: 0xdd, G: 0xee, B: 0xf6, A: 0xff}, {R: 0xe4, G: 0xf2, B: 0xe6, A: 0xff}, {R: 0xd2, G: 0xe4, B: 0xf0, A: 0xff},
		{R: 0xec, G: 0xf4, B: 0xf8, A: 0xff}, {R: 0xd8, G: 0xec, B: 0xe8, A: 0xff}, {R: 0xe8, G: 0xee, B: 0xf8, A: 0xff},
		{R: 0xcf, G: 0xe8, B: 0xdf, A: 0xff},
	}
	solidFills = []color.NRGBA{
		{R: 0xf3, G: 0xd9, B: 0xb4, A: 0xff}, {R: 0xe9, G: 0xe2, B: 0xc8, A: 0xff}, {R: 0xe6, G: 0xd6, B: 0xe8, A: 0xff},
		{R: 0xdd, G: 0xdd, B: 0xdd, A: 0xff}, {R: 0xf1, G: 0xe6, B: 0xa9, A: 0xff},
	}
	boundaryStyle = draw.LineStyle{Color: inkColor, Width: 0.8}
	waterStyle    = draw.LineStyle{Color: color.NRGBA{R: 0x1f, G: 0x5f, B: 0xa8, A: 0xff}, Width: 1.0, Dashes: []vg.Length{4, 2.5}}
	sampleFill    = color.NRGBA{R: 0xc0, G: 0x30, B: 0x20, A: 0xff}
)

// Draw draws the diagram on c.
func (d EhPHDiagram) Draw(c draw.Canvas) error {
	if !finite(d.PHMin, d.PHMax, d.PEMin, d.PEMax) || !(d.PHMax > d.PHMin) || !(d.PEMax > d.PEMin) {
		return fmt.Errorf("%w: pe-pH window pH %g-%g, pe %g-%g", ErrInput, d.PHMin, d.PHMax, d.PEMin, d.PEMax)
	}
	if len(d.Fields) == 0 {
		return fmt.Errorf("%w: pe-pH diagram %q has no field", ErrNoData, d.Title)
	}
	legend := []legendEntry{
		{label: "aqueous species", kind: legendPatch, fill: aqueousFills[0], line: draw.LineStyle{Color: greyColor, Width: 0.4}},
		{label: "solid", kind: legendPatch, fill: solidFills[0], line: draw.LineStyle{Color: greyColor, Width: 0.4}},
		{label: "water stability limits (O2, H2 at 1 atm)", kind: legendLine, line: waterStyle},
	}
	var pts []EhPHSample
	for _, s := range d.Samples {
		if finite(s.PH, s.PE) {
			pts = append(pts, s)
		}
	}
	if len(pts) > 0 {
		legend = append(legend, legendEntry{label: "sample", kind: legendGlyph, glyph: glyphCircle, fill: sampleFill})
	}
	note := ""
	if n := d.Skipped(); n > 0 {
		note = fmt.Sprintf("%d value(s) not finite, not drawn", n)
	}
	pg := newPage(c, d.Title, d.Caption, legend, note)
	body, legTop, capTop := pg.layout(c)
	p := newPlot()
	p.X.Label.Text, p.Y.Label.Text = "pH", "pe"
	p.X.Tick.Marker = niceTicks{n: 8}
	p.Y.Tick.Marker = niceTicks{n: 8}
	p.X.Min, p.X.Max, p.Y.Min, p.Y.Max = d.PHMin, d.PHMax, d.PEMin, d.PEMax
	p.Add(&ehphLayer{d: d, pts: pts})
	if d.EhPerPE > 0 {
		// room on the right for the Eh axis
		body.Max.X -= 40
	}
	p.Draw(body)
	if d.EhPerPE > 0 {
		d.drawEhAxis(body, p)
	}
	pg.draw(c, legTop, capTop)
	return nil
}

// ehphLayer draws fields, boundaries, water lines, labels and samples.
type ehphLayer struct {
	d   EhPHDiagram
	pts []EhPHSample
}

func (l *ehphLayer) Plot(c draw.Canvas, p *plot.Plot) {
	tx, ty := p.Transforms(&c)
	d := l.d
	na, ns := 0, 0
	type label struct {
		text string
		at   vg.Point
	}
	var labels []label
	for _, f := range d.Fields {
		var fill color.Color
		if f.Solid {
			fill = solidFills[ns%len(solidFills)]
			ns++
		} else {
			fill = aqueousFills[na%len(aqueousFills)]
			na++
		}
		best, bestA := -1, 0.0
		for k, poly := range f.Polygons {
			var vs []vg.Point
			for _, v := range poly {
				if finite(v[0], v[1]) {
					vs = append(vs, vg.Point{X: tx(v[0]), Y: ty(v[1])})
				}
			}
			if len(vs) < 3 {
				continue
			}
			clipped := c.ClipPolygonXY(vs)
			c.FillPolygon(fill, clipped)
			// the same colour along the edges hides the hairline seams between the
			// convex pieces of one field
			if len(clipped) > 2 {
				c.StrokeLines(draw.LineStyle{Color: fill, Width: 0.7}, append(clipped, clipped[0]))
			}
			if a := math.Abs(polyArea(poly)); a > bestA {
				best, bestA = k, a
			}
		}
		if best >= 0 {
			cx, cy := polyCentroid(f.Polygons[best])
			labels = append(labels, label{f.Name, vg.Point{X: tx(cx), Y: ty(cy)}})
		}
	}
	for _, b := range d.Boundaries {
		if finite(b[0], b[1], b[2], b[3]) {
			c.StrokeLines(boundaryStyle, c.ClipLinesXY([]vg.Point{{X: tx(b[0]), Y: ty(b[1])}, {X: tx(b[2]), Y: ty(b[3])}})...)
		}
	}
	for _, w := range [][4]float64{d.WaterUpper, d.WaterLower} {
		if finite(w[0], w[1], w[2], w[3]) && (w[0] != w[2] || w[1] != w[3]) {
			c.StrokeLines(waterStyle, c.ClipLinesXY([]vg.Point{{X: tx(w[0]), Y: ty(w[1])}, {X: tx(w[2]), Y: ty(w[3])}})...)
		}
	}
	sty := textStyle(sizeSmall)
	sty.XAlign, sty.YAlign = draw.XCenter, draw.YCenter
	for _, lb := range labels {
		if !c.Contains(lb.at) {
			continue
		}
		w, h := sty.Width(lb.text)+3, sty.Height(lb.text)+1
		// keep the label inside the plot area
		lb.at.X = max(c.Min.X+w/2, min(lb.at.X, c.Max.X-w/2))
		lb.at.Y = max(c.Min.Y+h/2, min(lb.at.Y, c.Max.Y-h/2))
		r := []vg.Point{{X: lb.at.X - w/2, Y: lb.at.Y - h/2}, {X: lb.at.X + w/2, Y: lb.at.Y - h/2},
			{X: lb.at.X + w/2, Y: lb.at.Y + h/2}, {X: lb.at.X - w/2, Y: lb.at.Y + h/2}}
		c.FillPolygon(haloColor, r)
		c.FillText(sty, lb.at, lb.text)
	}
	ps := textStyle(sizeSmall)
	ps.YAlign = draw.YCenter
	drawn := newGlyphMemo(len(l.pts))
	for _, s := range l.pts {
		pt := vg.Point{X: tx(s.PH), Y: ty(s.PE)}
		if !c.Contains(pt) {
			continue
		}
		drawn.draw(c, glyphCircle, pt, 3, sampleFill, inkColor, 0.6)
		if s.Label != "" {
			c.FillText(ps, vg.Point{X: pt.X + 5, Y: pt.Y}, s.Label)
		}
	}
}

// drawEhAxis writes an Eh (V) scale on the right of the plot area.
func (d EhPHDiagram) drawEhAxis(body draw.Canvas, p *plot.Plot) {
	da := p.DataCanvas(body)
	_, ty := p.Transforms(&da)
	x := da.Max.X
	body.StrokeLine2(draw.LineStyle{Color: inkColor, Width: 0.5}, x, da.Min.Y, x, da.Max.Y)
	sty := textStyle(sizeTick)
	sty.YAlign = draw.YCenter
	lo, hi := d.PEMin*d.EhPerPE, d.PEMax*d.EhPerPE
	step := 0.2
	if hi-lo > 2.4 {
		step = 0.4
	}
	for k := math.Ceil(lo / step); k*step <= hi+1e-9; k++ {
		v := k * step // integer multiples: no rounding noise such as -6e-17
		y := ty(v / d.EhPerPE)
		body.StrokeLine2(draw.LineStyle{Color: inkColor, Width: 0.5}, x, y, x+3, y)
		body.FillText(sty, vg.Point{X: x + 4, Y: y}, strings.Replace(strconv.FormatFloat(v, 'f', 1, 64), "-", "\u2212", 1))
	}
	ls := textStyle(sizeLabel)
	ls.Rotation = -math.Pi / 2
	ls.XAlign, ls.YAlign = draw.XCenter, draw.YCenter
	body.FillText(ls, vg.Point{X: x + 34, Y: (da.Min.Y + da.Max.Y) / 2}, "Eh (V)")
}

func polyArea(p [][2]float64) float64 {
	s := 0.0
	for i := range p {
		a, b := p[i], p[(i+1)%len(p)]
		s += a[0]*b[1] - b[0]*a[1]
	}
	return s / 2
}

// polyCentroid is the area centroid of a simple polygon (the vertex mean when the
// area vanishes).
func polyCentroid(p [][2]float64) (float64, float64) {
	a := polyArea(p)
	if math.Abs(a) < 1e-12 {
		var x, y float64
		for _, v := range p {
			x, y = x+v[0], y+v[1]
		}
		n := float64(max(len(p), 1))
		return x / n, y / n
	}
	var cx, cy float64
	for i := range p {
		u, v := p[i], p[(i+1)%len(p)]
		f := u[0]*v[1] - v[0]*u[1]
		cx += (u[0] + v[0]) * f
		cy += (u[1] + v[1]) * f
	}
	return cx / (6 * a), cy / (6 * a)
}
