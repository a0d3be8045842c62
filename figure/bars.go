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
// zero. Each bar takes the colour of its label by MineralStyle (the
// secondary bar a light tint of it, hatched), so a mineral looks the same
// as in every other figure. When all values are at least zero and the
// positive ones span more than LogSpan (a factor of 100, common practice
// for readable bar lengths), the value axis is logarithmic from the decade
// below the decade of the smallest positive value, and its label says so.
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

// LogSpan is the ratio of the largest to the smallest positive bar above
// which Bars switches to a logarithmic value axis (common practice).
const LogSpan = 100

// secondaryTint is how far a secondary bar's colour is mixed towards white.
const secondaryTint = 0.6

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
	minPos := math.Inf(1)
	n := 0
	for _, s := range sets {
		for _, v := range s {
			if finite(v) {
				lo, hi = math.Min(lo, v), math.Max(hi, v)
				if v > 0 {
					minPos = math.Min(minPos, v)
				}
				n++
			}
		}
	}
	logAxis := lo >= 0 && hi > 0 && hi/minPos > LogSpan
	floor := 0.0
	if logAxis {
		// One decade below the smallest amount's decade: its bar keeps a
		// visible length.
		floor = math.Pow(10, math.Floor(math.Log10(minPos))-1)
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
			{label: nonEmpty(b.PrimaryName, "primary") + " (solid)", kind: legendPatch, fill: greyColor, line: outline},
			{label: nonEmpty(b.SecondaryName, "secondary") + " (light, hatched)", kind: legendPatch, fill: lighter(greyColor, secondaryTint), line: outline, hatch: true},
		}
	}
	pg := newPage(c, b.Title, b.Caption, legend, "")
	body, legTop, capTop := pg.layout(c)
	p := newPlot()
	p.Y.Label.Text = b.YLabel
	p.Y.Tick.Marker = niceTicks{n: 6}
	if logAxis {
		p.Y.Label.Text += ", log scale"
		p.Y.Scale = plot.LogScale{}
		p.Y.Tick.Marker = decadeTicks{}
	}
	// The value-axis title is drawn here, not by the plotting library,
	// which places it by the linear middle of the range even on a log
	// axis and then shrinks the plot to fit it; long titles wrap.
	ylab := wrapText(textStyle(sizeLabel), p.Y.Label.Text, 0.9*(body.Max.Y-body.Min.Y))
	p.Y.Label.Text = ""
	labelX := body.Min.X
	body.Min.X += vg.Length(len(ylab))*lineHeight(textStyle(sizeLabel)) + 4
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
	p.Add(&hline{y: floor, st: draw.LineStyle{Color: inkColor, Width: 0.8}})
	p.Add(&barPlotter{sets: sets, digits: digits, labels: b.Labels, base: floor})
	span := hi - lo
	p.X.Min, p.X.Max = -0.6, float64(len(b.Values))-0.4
	p.Y.Min, p.Y.Max = lo, hi
	if lo < 0 {
		p.Y.Min = lo - 0.12*span
	}
	if hi > 0 {
		p.Y.Max = hi + 0.12*span
	}
	if logAxis {
		// Room above the tallest bar for its value: a quarter decade.
		p.Y.Min, p.Y.Max = floor, hi*math.Pow(10, 0.25)
	}
	p.Draw(body)
	da := p.DataCanvas(body)
	ls := textStyle(sizeLabel)
	ls.Rotation = math.Pi / 2
	ls.XAlign, ls.YAlign = draw.XCenter, draw.YTop
	for i, l := range ylab {
		c.FillText(ls, vg.Point{X: labelX + vg.Length(i)*lineHeight(ls), Y: (da.Min.Y + da.Max.Y) / 2}, l)
	}
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
	labels []string
	base   float64 // bar foot: 0, or the floor of a log axis
}

func (bp *barPlotter) Plot(c draw.Canvas, p *plot.Plot) {
	tx, ty := p.Transforms(&c)
	k := len(bp.sets)
	groupW := 0.7
	w := groupW / float64(k)
	sty := textStyle(sizeSmall)
	outline := draw.LineStyle{Color: inkColor, Width: 0.5}
	for s, vals := range bp.sets {
		for i, v := range vals {
			xl := float64(i) - groupW/2 + float64(s)*w
			xr := xl + w
			xc := tx((xl + xr) / 2)
			if !finite(v) {
				st := sty
				st.Color = greyColor
				st.XAlign, st.YAlign = draw.XCenter, draw.YBottom
				c.FillText(st, vg.Point{X: xc, Y: ty(bp.base) + 2}, "n/a")
				continue
			}
			top := v
			if bp.base > 0 && v < bp.base {
				top = bp.base // zero (or below the floor) on a log axis: no bar
			}
			pts := []vg.Point{{X: tx(xl), Y: ty(bp.base)}, {X: tx(xr), Y: ty(bp.base)}, {X: tx(xr), Y: ty(top)}, {X: tx(xl), Y: ty(top)}}
			if top != bp.base {
				fill := color.Color(mineralSeriesStyle(bp.labels[i]).color)
				if s == 1 {
					fill = lighter(fill, secondaryTint)
				}
				c.FillPolygon(fill, pts)
				if s == 1 {
					hatch(c, vg.Rectangle{Min: pts[0], Max: pts[2]})
				}
				c.StrokeLines(outline, append(pts, pts[0]))
			}
			st := sty
			st.XAlign = draw.XCenter
			y := ty(top) + 2
			st.YAlign = draw.YBottom
			if v < 0 {
				y = ty(top) - 2
				st.YAlign = draw.YTop
			}
			c.FillText(st, vg.Point{X: xc, Y: y}, formatNum(v, bp.digits))
		}
	}
}

// hatch draws thin diagonal lines across r (a secondary bar), so the two
// bars of a pair differ in print without colour.
func hatch(c draw.Canvas, r vg.Rectangle) {
	if r.Max.Y < r.Min.Y {
		r.Min.Y, r.Max.Y = r.Max.Y, r.Min.Y
	}
	const step = 4
	ls := draw.LineStyle{Color: color.NRGBA{A: 0x90}, Width: 0.4}
	h := r.Max.Y - r.Min.Y
	for x := r.Min.X - h; x < r.Max.X; x += step {
		// Line from (x, min.Y) to (x+h, max.Y), clipped to r.
		x0, y0, x1, y1 := x, r.Min.Y, x+h, r.Max.Y
		if x0 < r.Min.X {
			y0 += r.Min.X - x0
			x0 = r.Min.X
		}
		if x1 > r.Max.X {
			y1 -= x1 - r.Max.X
			x1 = r.Max.X
		}
		if x1 > x0 {
			c.StrokeLine2(ls, x0, y0, x1, y1)
		}
	}
}

// decadeTicks labels the powers of ten of a log axis (1, 10, 100 or 0.1,
// 0.01), with unlabelled ticks at 2 and 5 times each.
type decadeTicks struct{}

func (decadeTicks) Ticks(min, max float64) []plot.Tick {
	var ts []plot.Tick
	if !(min > 0) || !(max > min) {
		return nil
	}
	for e := math.Floor(math.Log10(min)); e <= math.Ceil(math.Log10(max)); e++ {
		d := math.Pow(10, e)
		for _, m := range []float64{1, 2, 5} {
			v := m * d
			if v < min*(1-1e-9) || v > max*(1+1e-9) {
				continue
			}
			t := plot.Tick{Value: v}
			if m == 1 {
				t.Label = formatNum(v, 3)
			}
			ts = append(ts, t)
		}
	}
	return ts
}
