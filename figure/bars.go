package figure

import (
	"fmt"
	"image/color"
	"math"

	"gonum.org/v1/plot"
	"gonum.org/v1/plot/vg"
	"gonum.org/v1/plot/vg/draw"
)

// Bars is a bar chart with one bar (or a pair, when Secondary is given) per
// label, for example the precipitation potential of each mineral in mg/L
// alone (Values) and together (Secondary). Values are printed on the bars;
// a non-finite value draws no bar and prints "n/a". A horizontal line marks
// zero.
type Bars struct {
	Title, YLabel, Caption string
	Labels                 []string
	Values                 []float64
	Secondary              []float64 // optional, same length as Values
	PrimaryName            string    // legend names, used when Secondary is set
	SecondaryName          string
	// Digits is the number of significant digits printed (default 3).
	Digits int
}

// Skipped counts the values that are not finite.
func (b Bars) Skipped() int {
	n := 0
	for _, v := range b.Values {
		if !finite(v) {
			n++
		}
	}
	for _, v := range b.Secondary {
		if !finite(v) {
			n++
		}
	}
	return n
}

var (
	barPrimary   = color.NRGBA{R: 0x2b, G: 0x5c, B: 0x8a, A: 0xff} // dark blue, L* about 38
	barSecondary = color.NRGBA{R: 0xf1, G: 0xb0, B: 0x6c, A: 0xff} // light orange, L* about 77
)

// Draw draws the chart on c.
func (b Bars) Draw(c draw.Canvas) error {
	if len(b.Labels) != len(b.Values) {
		return fmt.Errorf("%w: bar chart %q: %d labels but %d values", ErrInput, b.Title, len(b.Labels), len(b.Values))
	}
	if b.Secondary != nil && len(b.Secondary) != len(b.Values) {
		return fmt.Errorf("%w: bar chart %q: %d values but %d secondary values", ErrInput, b.Title, len(b.Values), len(b.Secondary))
	}
	sets := [][]float64{b.Values}
	if b.Secondary != nil {
		sets = append(sets, b.Secondary)
	}
	lo, hi := 0.0, 0.0
	n := 0
	for _, s := range sets {
		for _, v := range s {
			if finite(v) {
				lo, hi = math.Min(lo, v), math.Max(hi, v)
				n++
			}
		}
	}
	if n == 0 {
		return fmt.Errorf("%w: bar chart %q has no finite value", ErrNoData, b.Title)
	}
	if hi-lo <= 0 {
		hi = 1
	}
	var legend []legendEntry
	if b.Secondary != nil {
		outline := draw.LineStyle{Color: inkColor, Width: 0.5}
		legend = []legendEntry{
			{label: nonEmpty(b.PrimaryName, "primary"), kind: legendPatch, fill: barPrimary, line: outline},
			{label: nonEmpty(b.SecondaryName, "secondary"), kind: legendPatch, fill: barSecondary, line: outline},
		}
	}
	pg := newPage(c, b.Title, b.Caption, legend, "")
	body, legTop, capTop := pg.layout(c)
	p := newPlot()
	p.Y.Label.Text = b.YLabel
	p.Y.Tick.Marker = niceTicks{n: 6}
	p.X.Tick.Marker = plot.ConstantTicks(nil)
	names := make([]plot.Tick, len(b.Labels))
	for i, l := range b.Labels {
		names[i] = plot.Tick{Value: float64(i), Label: l}
	}
	p.X.Tick.Marker = plot.ConstantTicks(names)
	p.X.Tick.Length = 0
	p.X.LineStyle.Width = 0
	digits := b.Digits
	if digits <= 0 {
		digits = 3
	}
	p.Add(&hline{y: 0, st: draw.LineStyle{Color: inkColor, Width: 0.8}})
	p.Add(&barPlotter{sets: sets, digits: digits})
	span := hi - lo
	p.X.Min, p.X.Max = -0.6, float64(len(b.Values))-0.4
	p.Y.Min, p.Y.Max = lo, hi
	if lo < 0 {
		p.Y.Min = lo - 0.12*span
	}
	if hi > 0 {
		p.Y.Max = hi + 0.12*span
	}
	p.Draw(body)
	pg.draw(c, legTop, capTop)
	return nil
}

func nonEmpty(s, def string) string {
	if s == "" {
		return def
	}
	return s
}

type barPlotter struct {
	sets   [][]float64
	digits int
}

func (bp *barPlotter) Plot(c draw.Canvas, p *plot.Plot) {
	tx, ty := p.Transforms(&c)
	k := len(bp.sets)
	groupW := 0.7
	w := groupW / float64(k)
	sty := textStyle(sizeSmall)
	outline := draw.LineStyle{Color: inkColor, Width: 0.5}
	fills := []color.Color{barPrimary, barSecondary}
	for s, vals := range bp.sets {
		for i, v := range vals {
			xl := float64(i) - groupW/2 + float64(s)*w
			xr := xl + w
			xc := tx((xl + xr) / 2)
			if !finite(v) {
				st := sty
				st.Color = greyColor
				st.XAlign, st.YAlign = draw.XCenter, draw.YBottom
				c.FillText(st, vg.Point{X: xc, Y: ty(0) + 2}, "n/a")
				continue
			}
			pts := []vg.Point{{X: tx(xl), Y: ty(0)}, {X: tx(xr), Y: ty(0)}, {X: tx(xr), Y: ty(v)}, {X: tx(xl), Y: ty(v)}}
			if v != 0 {
				c.FillPolygon(fills[s%2], pts)
				c.StrokeLines(outline, append(pts, pts[0]))
			}
			st := sty
			st.XAlign = draw.XCenter
			y := ty(v) + 2
			st.YAlign = draw.YBottom
			if v < 0 {
				y = ty(v) - 2
				st.YAlign = draw.YTop
			}
			c.FillText(st, vg.Point{X: xc, Y: y}, formatNum(v, bp.digits))
		}
	}
}
