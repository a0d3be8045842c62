package figure

import (
	"fmt"
	"math"
	"sort"

	"gonum.org/v1/plot"
	"gonum.org/v1/plot/vg"
	"gonum.org/v1/plot/vg/draw"
)

// SITimeSeries is one well's saturation index over time. Time is in any
// increasing unit (decimal years, sampling round). Low and High, when not
// nil, have the length of SI and bound an interval around each value (for
// example from the analytical uncertainty); a non-finite bound draws no
// bar for that point. When HasTrend is set, the line
// TrendIntercept + TrendSlope*t (for example a Sen slope) is drawn over the
// series' time span.
type SITimeSeries struct {
	Well                       string
	Time, SI                   []float64
	Low, High                  []float64
	HasTrend                   bool
	TrendSlope, TrendIntercept float64
}

// SITime draws SI against time for many wells as small multiples, one
// panel per well, in reading order, titled with the well. All panels share
// the time axis and the SI axis, so they compare directly; SI tick labels
// are printed on the left column only. Panels need about 4 x 3 cm each to
// stay legible. Each panel has a
// shaded near-equilibrium band of half-width Band around SI = 0 (0:
// DefaultBand; negative: none), a line at SI = 0, the values as markers
// joined in time order, vertical bars from Low to High, and the trend line
// where given.
//
// Cols is the number of panels to a row; 0 chooses it from the page shape.
// Points with a non-finite time or SI are left out and counted by Skipped;
// a series without any finite point gets no panel.
type SITime struct {
	Title, Caption string
	// Mineral names the SI on the vertical axis ("SI calcite").
	Mineral   string
	TimeLabel string // default "Year"
	Series    []SITimeSeries
	Cols      int
	Band      float64
}

// Skipped counts the points left out because their time or SI is not
// finite.
func (s SITime) Skipped() int {
	n := 0
	for _, ser := range s.Series {
		for i := range ser.Time {
			if i < len(ser.SI) && !finite(ser.Time[i], ser.SI[i]) {
				n++
			}
		}
	}
	return n
}

func (s SITime) band() float64 {
	return DepthProfile{Band: s.Band}.band()
}

// siTimePoint is one finite value with its bar (lo, hi finite, or hasBar
// false).
type siTimePoint struct {
	t, si, lo, hi float64
	hasBar        bool
}

type siTimePanel struct {
	title  string
	pts    []siTimePoint
	trend  bool
	a, b   float64 // trend intercept and slope
	t0, t1 float64 // time span of the points
}

// siTimePanels checks the input and returns one panel per series with a
// finite point.
func (s SITime) panels() ([]siTimePanel, error) {
	var ps []siTimePanel
	for k, ser := range s.Series {
		if len(ser.Time) != len(ser.SI) {
			return nil, fmt.Errorf("%w: SI-time series %d (%s): %d times but %d SI values", ErrInput, k+1, ser.Well, len(ser.Time), len(ser.SI))
		}
		if (ser.Low != nil && len(ser.Low) != len(ser.SI)) || (ser.High != nil && len(ser.High) != len(ser.SI)) {
			return nil, fmt.Errorf("%w: SI-time series %d (%s): %d SI values but %d low and %d high bounds", ErrInput, k+1, ser.Well, len(ser.SI), len(ser.Low), len(ser.High))
		}
		p := siTimePanel{title: ser.Well, t0: math.Inf(1), t1: math.Inf(-1)}
		if p.title == "" {
			p.title = fmt.Sprintf("series %d", k+1)
		}
		for i := range ser.Time {
			if !finite(ser.Time[i], ser.SI[i]) {
				continue
			}
			q := siTimePoint{t: ser.Time[i], si: ser.SI[i]}
			if ser.Low != nil && ser.High != nil && finite(ser.Low[i], ser.High[i]) {
				q.lo = math.Min(math.Min(ser.Low[i], ser.High[i]), q.si)
				q.hi = math.Max(math.Max(ser.Low[i], ser.High[i]), q.si)
				q.hasBar = true
			}
			p.pts = append(p.pts, q)
			p.t0, p.t1 = math.Min(p.t0, q.t), math.Max(p.t1, q.t)
		}
		if len(p.pts) == 0 {
			continue
		}
		sort.SliceStable(p.pts, func(a, b int) bool { return p.pts[a].t < p.pts[b].t })
		if ser.HasTrend && finite(ser.TrendSlope, ser.TrendIntercept, ser.TrendIntercept+ser.TrendSlope*p.t0, ser.TrendIntercept+ser.TrendSlope*p.t1) {
			p.trend, p.a, p.b = true, ser.TrendIntercept, ser.TrendSlope
		}
		ps = append(ps, p)
	}
	return ps, nil
}

// siTimeRanges returns the common axis ranges of all panels, padded, with
// the SI range covering twice the band (so the band reads as a strip) and
// at least ±0.25.
func siTimeRanges(ps []siTimePanel, band float64) (t0, t1, y0, y1 float64) {
	t0, t1 = math.Inf(1), math.Inf(-1)
	y0, y1 = math.Min(-2*band, -0.25), math.Max(2*band, 0.25)
	for _, p := range ps {
		t0, t1 = math.Min(t0, p.t0), math.Max(t1, p.t1)
		for _, q := range p.pts {
			y0, y1 = math.Min(y0, q.si), math.Max(y1, q.si)
			if q.hasBar {
				y0, y1 = math.Min(y0, q.lo), math.Max(y1, q.hi)
			}
		}
		if p.trend {
			for _, t := range []float64{p.t0, p.t1} {
				v := p.a + p.b*t
				y0, y1 = math.Min(y0, v), math.Max(y1, v)
			}
		}
	}
	if t1-t0 < 1 {
		m := (t0 + t1) / 2
		t0, t1 = m-0.5, m+0.5
	}
	tp, yp := 0.06*(t1-t0), 0.06*(y1-y0)
	return t0 - tp, t1 + tp, y0 - yp, y1 + yp
}

var (
	siTimeColor    = seriesColors[0]
	siTimeBarStyle = draw.LineStyle{Color: greyColor, Width: 0.8}
	siTimeLine     = draw.LineStyle{Color: seriesColors[0], Width: 0.8}
	siTimeTrend    = draw.LineStyle{Color: seriesColors[1], Width: 1.2, Dashes: []vg.Length{5, 2.5}}
)

// Draw draws the panels on c.
func (s SITime) Draw(c draw.Canvas) error {
	ps, err := s.panels()
	if err != nil {
		return err
	}
	if len(ps) == 0 {
		return fmt.Errorf("%w: SI-time figure %q has no finite (time, SI) pair", ErrNoData, s.Title)
	}
	band := s.band()
	t0, t1, y0, y1 := siTimeRanges(ps, band)

	legend := []legendEntry{{label: "SI", kind: legendLine, line: siTimeLine, withGlyph: true, fill: siTimeColor, glyph: glyphCircle}}
	anyBar, anyTrend := false, false
	for _, p := range ps {
		anyTrend = anyTrend || p.trend
		for _, q := range p.pts {
			anyBar = anyBar || q.hasBar
		}
	}
	if anyBar {
		legend = append(legend, legendEntry{label: "interval (low to high)", kind: legendLine, line: siTimeBarStyle})
	}
	if anyTrend {
		legend = append(legend, legendEntry{label: "trend", kind: legendLine, line: siTimeTrend})
	}
	if band > 0 {
		legend = append(legend, legendEntry{label: fmt.Sprintf("near equilibrium (SI within ±%s)", formatNum(band, 2)), kind: legendPatch, fill: bandColor})
	}
	note := ""
	if n := s.Skipped(); n > 0 {
		note = fmt.Sprintf("%d point(s) left out (time or SI not finite).", n)
	}
	pg := newPage(c, s.Title, s.Caption, legend, note)
	body, legTop, capTop := pg.layout(c)

	tsty := textStyle(sizeSmall + 0.5)
	titleH := lineHeight(tsty) + 2
	cols := s.Cols
	if cols < 1 {
		cols = gridCols(len(ps), float64(body.Max.X-body.Min.X), float64(body.Max.Y-body.Min.Y))
	}
	if cols > len(ps) {
		cols = len(ps)
	}
	rows := (len(ps) + cols - 1) / cols
	// As many SI ticks as the panel height holds: about one labelled tick
	// per 2 lines of tick type, between 2 and 5.
	tickH := lineHeight(textStyle(sizeSmall))
	panelH := (body.Max.Y-body.Min.Y)/vg.Length(rows) - titleH - 3*tickH
	nY := max(2, min(5, int(panelH/(2*tickH))))
	grid := make([][]*plot.Plot, rows)
	for r := range grid {
		grid[r] = make([]*plot.Plot, cols)
	}
	ylabel := "SI"
	if s.Mineral != "" {
		ylabel = "SI " + s.Mineral
	}
	tlabel := s.TimeLabel
	if tlabel == "" {
		tlabel = "Year"
	}
	for i, p := range ps {
		r, col := i/cols, i%cols
		pl := newPlot()
		pl.X.Tick.Label.Font.Size = sizeSmall
		pl.Y.Tick.Label.Font.Size = sizeSmall
		pl.X.Min, pl.X.Max = t0, t1
		pl.Y.Min, pl.Y.Max = y0, y1
		// Time tick labels on every panel, so that every row has the same
		// height and a panel with none below it still reads; the time axis
		// title on the last row and SI labels on the left column only.
		pl.X.Tick.Marker = niceTicks{n: 4}
		pl.Y.Tick.Marker = labelTicks{m: siTicks{n: nY}, show: col == 0}
		if r == rows-1 {
			pl.X.Label.Text = tlabel
		}
		if col == 0 {
			pl.Y.Label.Text = ylabel
		}
		pl.Add(&siTimePlotter{p: p, band: band})
		grid[r][col] = pl
	}
	// Empty slots of the last row stay nil; plot.Align leaves them blank.
	tiles := draw.Tiles{Rows: rows, Cols: cols, PadX: 6, PadY: titleH + 2, PadTop: titleH}
	cs := plot.Align(grid, tiles, body)
	tsty.XAlign, tsty.YAlign = draw.XCenter, draw.YBottom
	for i, p := range ps {
		r, col := i/cols, i%cols
		pl := grid[r][col]
		pl.Draw(cs[r][col])
		da := pl.DataCanvas(cs[r][col])
		c.FillText(tsty, vg.Point{X: (da.Min.X + da.Max.X) / 2, Y: da.Max.Y + 2}, p.title)
	}
	pg.draw(c, legTop, capTop)
	return nil
}

// labelTicks keeps the tick positions of m and blanks the labels unless
// show is set, so that panels share their grid of ticks.
type labelTicks struct {
	m    plot.Ticker
	show bool
}

func (l labelTicks) Ticks(min, max float64) []plot.Tick {
	ts := l.m.Ticks(min, max)
	if !l.show {
		for i := range ts {
			ts[i].Label = ""
		}
	}
	return ts
}

// siTimePlotter draws one panel's band, zero line, bars, line, markers and
// trend; its input is finite.
type siTimePlotter struct {
	p    siTimePanel
	band float64
}

func (sp *siTimePlotter) Plot(c draw.Canvas, pl *plot.Plot) {
	tx, ty := pl.Transforms(&c)
	if sp.band > 0 {
		c.FillPolygon(bandColor, c.ClipPolygonXY([]vg.Point{
			{X: c.Min.X, Y: ty(-sp.band)}, {X: c.Max.X, Y: ty(-sp.band)},
			{X: c.Max.X, Y: ty(sp.band)}, {X: c.Min.X, Y: ty(sp.band)},
		}))
	}
	c.StrokeLine2(draw.LineStyle{Color: inkColor, Width: 0.7}, c.Min.X, ty(0), c.Max.X, ty(0))
	const capW = 2
	// A bar drawn again on the same pixels (many samples of one well and
	// event) is drawn once, as glyphs are (glyphMemo).
	type barKey struct{ x, lo, hi int64 }
	var bars map[barKey]bool // nil: every bar drawn
	if len(sp.p.pts) > glyphMemoAbove {
		bars = map[barKey]bool{}
	}
	cell := func(v vg.Length) int64 { return int64(math.Floor(float64(v) / glyphQuantum)) }
	for _, q := range sp.p.pts {
		if q.hasBar {
			x := tx(q.t)
			k := barKey{cell(x), cell(ty(q.lo)), cell(ty(q.hi))}
			if bars != nil {
				if bars[k] {
					continue
				}
				bars[k] = true
			}
			c.StrokeLine2(siTimeBarStyle, x, ty(q.lo), x, ty(q.hi))
			c.StrokeLine2(siTimeBarStyle, x-capW, ty(q.lo), x+capW, ty(q.lo))
			c.StrokeLine2(siTimeBarStyle, x-capW, ty(q.hi), x+capW, ty(q.hi))
		}
	}
	if sp.p.trend {
		a, b := sp.p.a, sp.p.b
		c.StrokeLines(siTimeTrend, c.ClipLinesXY([]vg.Point{
			{X: tx(sp.p.t0), Y: ty(a + b*sp.p.t0)}, {X: tx(sp.p.t1), Y: ty(a + b*sp.p.t1)},
		})...)
	}
	pts := make([]vg.Point, len(sp.p.pts))
	for i, q := range sp.p.pts {
		pts[i] = vg.Point{X: tx(q.t), Y: ty(q.si)}
	}
	if len(pts) > 1 {
		c.StrokeLines(siTimeLine, c.ClipLinesXY(pts)...)
	}
	drawn := newGlyphMemo(len(pts))
	for _, pt := range pts {
		drawn.draw(c, glyphCircle, pt, 2.2, siTimeColor, inkColor, 0.4)
	}
}
