package figure

import (
	"fmt"
	"image/color"
	"math"
	"sort"

	"gonum.org/v1/plot"
	"gonum.org/v1/plot/plotter"
	"gonum.org/v1/plot/vg"
	"gonum.org/v1/plot/vg/draw"
)

// Series is one named curve, e.g. one mineral's SI against mixing fraction.
type Series struct {
	Name string
	X, Y []float64
}

// Curves is a line figure such as SI against mixing fraction or against
// temperature: one line per series, told apart by colour, dash pattern and
// marker. A series is styled by its name with MineralStyle, so a mineral
// looks the same here as in every other figure. ZeroLine marks y = 0 (the
// equilibrium line for SI); AnnotateMax marks each series' maximum with a
// marker and its value and position, placed off every curve (an
// annotation with no free place is left out; its marker stays).
type Curves struct {
	Title, XLabel, YLabel, Caption string
	Series                         []Series
	ZeroLine                       bool
	AnnotateMax                    bool
}

// Skipped counts the points left out because x or y is not finite.
func (cv Curves) Skipped() int {
	n := 0
	for _, s := range cv.Series {
		for i := range s.X {
			if i < len(s.Y) && !finite(s.X[i], s.Y[i]) {
				n++
			}
		}
	}
	return n
}

// Draw draws the curves on c.
func (cv Curves) Draw(c draw.Canvas) error {
	type ser struct {
		xys plotter.XYs
		k   int
		st  seriesStyle
	}
	var ss []ser
	var legend []legendEntry
	x0, x1, y0, y1 := math.Inf(1), math.Inf(-1), math.Inf(1), math.Inf(-1)
	for i, s := range cv.Series {
		if len(s.X) != len(s.Y) {
			return fmt.Errorf("%w: series %d (%s): %d x values but %d y values", ErrInput, i+1, s.Name, len(s.X), len(s.Y))
		}
		var xys plotter.XYs
		for j := range s.X {
			if finite(s.X[j], s.Y[j]) {
				xys = append(xys, plotter.XY{X: s.X[j], Y: s.Y[j]})
				x0, x1 = math.Min(x0, s.X[j]), math.Max(x1, s.X[j])
				y0, y1 = math.Min(y0, s.Y[j]), math.Max(y1, s.Y[j])
			}
		}
		if len(xys) == 0 {
			continue
		}
		sort.SliceStable(xys, func(a, b int) bool { return xys[a].X < xys[b].X })
		k := len(ss)
		name := s.Name
		if name == "" {
			name = fmt.Sprintf("series %d", i+1)
		}
		ss = append(ss, ser{xys, k, mineralSeriesStyle(name)})
		legend = append(legend, ss[k].st.legend(name))
	}
	if len(ss) == 0 {
		return fmt.Errorf("%w: curves %q have no finite point", ErrNoData, cv.Title)
	}
	if cv.ZeroLine {
		y0, y1 = math.Min(y0, 0), math.Max(y1, 0)
		legend = append(legend, legendEntry{label: "SI = 0 (equilibrium)", kind: legendLine, line: zeroStyle})
	}
	if x1-x0 <= 0 {
		x0, x1 = x0-0.5, x1+0.5
	}
	if y1-y0 <= 0 {
		y0, y1 = y0-0.5, y1+0.5
	}
	pg := newPage(c, cv.Title, cv.Caption, legend, "")
	body, legTop, capTop := pg.layout(c)
	p := newPlot()
	p.X.Label.Text, p.Y.Label.Text = cv.XLabel, cv.YLabel
	p.Y.Tick.Marker = siTicks{n: 7}
	p.X.Tick.Marker = niceTicks{n: 8}
	if cv.ZeroLine {
		p.Add(&hline{y: 0, st: zeroStyle})
	}
	ann := &maxAnnotations{}
	for _, s := range ss {
		sp := &curvePlotter{xys: s.xys, st: s.st, every: markerEvery(len(s.xys)), start: s.k}
		p.Add(sp)
		if cv.AnnotateMax {
			best := 0
			for j, q := range s.xys {
				if q.Y > s.xys[best].Y {
					best = j
				}
			}
			ann.pts = append(ann.pts, s.xys[best])
			ann.st = append(ann.st, s.st)
		}
	}
	if cv.AnnotateMax {
		for _, s := range ss {
			ann.lines = append(ann.lines, s.xys)
		}
		p.Add(ann)
	}
	xp, yp := 0.02*(x1-x0), 0.08*(y1-y0)
	p.X.Min, p.X.Max = x0-xp, x1+xp
	p.Y.Min, p.Y.Max = y0-yp, y1+yp*2
	p.Draw(body)
	pg.draw(c, legTop, capTop)
	return nil
}

var zeroStyle = draw.LineStyle{Color: color.NRGBA{R: 0x44, G: 0x44, B: 0x44, A: 0xff}, Width: 0.9, Dashes: []vg.Length{2, 2}}

func markerEvery(n int) int {
	if n <= 8 {
		return 1
	}
	return (n + 6) / 7
}

type hline struct {
	y  float64
	st draw.LineStyle
}

func (h *hline) Plot(c draw.Canvas, p *plot.Plot) {
	_, ty := p.Transforms(&c)
	c.StrokeLine2(h.st, c.Min.X, ty(h.y), c.Max.X, ty(h.y))
}

type curvePlotter struct {
	xys          plotter.XYs
	st           seriesStyle
	every, start int
}

func (s *curvePlotter) Plot(c draw.Canvas, p *plot.Plot) {
	tx, ty := p.Transforms(&c)
	pts := make([]vg.Point, len(s.xys))
	for i, q := range s.xys {
		pts[i] = vg.Point{X: tx(q.X), Y: ty(q.Y)}
	}
	c.StrokeLines(s.st.line, c.ClipLinesXY(pts)...)
	for i := s.start % s.every; i < len(pts); i += s.every {
		if c.Contains(pts[i]) {
			drawGlyph(c, s.st.glyph, pts[i], 2.6, s.st.color, color.White, 0.4)
		}
	}
}

// maxAnnotations marks each series' maximum and writes "max +0.82 at 0.35"
// next to it, placing the texts so they do not overlap.
type maxAnnotations struct {
	pts   plotter.XYs
	st    []seriesStyle
	lines []plotter.XYs // every curve: annotations keep off them
}

// curveObstacles returns small boxes every few points along the curves,
// which annotations must not cover.
func curveObstacles(lines []plotter.XYs, tx, ty func(float64) vg.Length) []vg.Rectangle {
	const step, half = 3, 1.2
	var out []vg.Rectangle
	for _, l := range lines {
		for i := 0; i+1 < len(l); i++ {
			a := vg.Point{X: tx(l[i].X), Y: ty(l[i].Y)}
			b := vg.Point{X: tx(l[i+1].X), Y: ty(l[i+1].Y)}
			n := int(math.Hypot(float64(b.X-a.X), float64(b.Y-a.Y))/step) + 1
			for k := 0; k <= n; k++ {
				t := vg.Length(float64(k) / float64(n))
				p := vg.Point{X: a.X + t*(b.X-a.X), Y: a.Y + t*(b.Y-a.Y)}
				out = append(out, vg.Rectangle{Min: vg.Point{X: p.X - half, Y: p.Y - half}, Max: vg.Point{X: p.X + half, Y: p.Y + half}})
			}
		}
	}
	return out
}

func (a *maxAnnotations) Plot(c draw.Canvas, p *plot.Plot) {
	tx, ty := p.Transforms(&c)
	sty := textStyle(sizeSmall)
	var items []labelItem
	var texts []string
	for _, q := range a.pts {
		pt := vg.Point{X: tx(q.X), Y: ty(q.Y)}
		t := fmt.Sprintf("max %s at %s", signed(q.Y), formatNum(q.X, 3))
		items = append(items, labelItem{anchor: pt, r: 4.5, w: sty.Width(t) + 2, h: sty.Height(t) + 1})
		texts = append(texts, t)
	}
	places := placeLabels(items, curveObstacles(a.lines, tx, ty), c.Rectangle)
	for i, pl := range places {
		if pl.placed && pl.leader {
			a0 := items[i].anchor
			q := nearestOnRect(pl.rect, a0)
			c.StrokeLine2(draw.LineStyle{Color: greyColor, Width: 0.5}, a0.X, a0.Y, q.X, q.Y)
		}
	}
	for i, it := range items {
		drawGlyph(c, a.st[i].glyph, it.anchor, 4.5, a.st[i].color, color.Black, 0.8)
		pl := places[i]
		if !pl.placed {
			continue
		}
		r := pl.rect
		c.FillPolygon(haloColor, []vg.Point{r.Min, {X: r.Max.X, Y: r.Min.Y}, r.Max, {X: r.Min.X, Y: r.Max.Y}})
		s := sty
		s.Color = a.st[i].color
		if lightness(s.Color) > 60 {
			s.Color = inkColor
		}
		s.XAlign, s.YAlign = draw.XCenter, draw.YCenter
		c.FillText(s, vg.Point{X: (r.Min.X + r.Max.X) / 2, Y: (r.Min.Y + r.Max.Y) / 2}, texts[i])
	}
}

func signed(v float64) string {
	s := formatNum(v, 2)
	if math.Abs(v) >= 0.1 {
		s = formatTick(v, 0.01)
	}
	if v > 0 {
		s = "+" + s
	}
	return s
}
