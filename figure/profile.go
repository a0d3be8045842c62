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

// DefaultBand is the default half-width of the near-equilibrium band, in SI
// units. Bands of ±0.2 to ±0.5 are common practice, set by the uncertainty
// of the data; 0.5 is the cautious end.
const DefaultBand = 0.5

// ProfileLine is one well or nest: SI at each sampled depth (metres below
// ground, or elevation when the profile's Elevation is set).
type ProfileLine struct {
	Label string
	Depth []float64
	SI    []float64
	// Points draws the values as unconnected markers (e.g. single wells that
	// are not one nest), not as a line.
	Points bool
}

// ProfilePanel is one mineral's panel of a depth profile.
type ProfilePanel struct {
	Mineral string
	Lines   []ProfileLine
}

// DepthProfile is SI against depth, one panel per mineral side by side
// sharing the depth axis, with depth increasing downward (or elevation
// increasing upward when Elevation is set), a shaded near-equilibrium band
// of half-width Band around SI = 0 (0: DefaultBand; negative: none), a
// vertical line at SI = 0, and one line with markers per well or nest. A
// label keeps the same colour, dash and marker in every panel.
type DepthProfile struct {
	Title, Caption string
	Panels         []ProfilePanel
	Band           float64
	Elevation      bool
	DepthLabel     string // default "Depth (m)" or "Elevation (m)"
}

// Skipped counts the (depth, SI) pairs left out because one of them is not
// finite.
func (d DepthProfile) Skipped() int {
	n := 0
	for _, p := range d.Panels {
		for _, l := range p.Lines {
			for i := range l.Depth {
				if i < len(l.SI) && !finite(l.Depth[i], l.SI[i]) {
					n++
				}
			}
		}
	}
	return n
}

func (d DepthProfile) band() float64 {
	switch {
	case d.Band < 0 || math.IsNaN(d.Band):
		return 0
	case d.Band == 0 || math.IsInf(d.Band, 0):
		return DefaultBand
	}
	return d.Band
}

// flipTicks labels the axis of -depth with positive depths.
type flipTicks struct{ hideLabels bool }

func (f flipTicks) Ticks(min, max float64) []plot.Tick {
	ts := niceTicks{n: 7}.Ticks(-max, -min)
	for i := range ts {
		ts[i].Value = -ts[i].Value
		if f.hideLabels {
			ts[i].Label = ""
		}
	}
	return ts
}

type hiddenTicks struct{}

func (hiddenTicks) Ticks(min, max float64) []plot.Tick {
	ts := niceTicks{n: 6}.Ticks(min, max)
	for i := range ts {
		ts[i].Label = ""
	}
	return ts
}

// siTicks labels SI with a + sign above zero and a true minus sign.
type siTicks struct{ n int }

func (t siTicks) Ticks(min, max float64) []plot.Tick {
	ts := niceTicks{n: t.n}.Ticks(min, max)
	for i := range ts {
		if ts[i].Value > 0 && ts[i].Label != "" && ts[i].Label != "0" {
			ts[i].Label = "+" + ts[i].Label
		}
	}
	return ts
}

type xyPoint struct{ x, y float64 }

// Draw draws the profile on c.
func (d DepthProfile) Draw(c draw.Canvas) error {
	band := d.band()
	styles := map[string]int{}
	var legend []legendEntry
	type panelData struct {
		title  string
		lines  []plotter.XYs
		idx    []int
		points []bool
	}
	var pds []panelData
	y0, y1 := math.Inf(1), math.Inf(-1)
	any := false
	for pi, p := range d.Panels {
		pd := panelData{title: p.Mineral}
		for li, l := range p.Lines {
			if len(l.Depth) != len(l.SI) {
				return fmt.Errorf("%w: profile panel %d (%s) line %d (%s): %d depths but %d SI values", ErrInput, pi+1, p.Mineral, li+1, l.Label, len(l.Depth), len(l.SI))
			}
			var pts []xyPoint
			for i := range l.Depth {
				if finite(l.Depth[i], l.SI[i]) {
					y := -l.Depth[i]
					if d.Elevation {
						y = l.Depth[i]
					}
					pts = append(pts, xyPoint{l.SI[i], y})
					y0, y1 = math.Min(y0, y), math.Max(y1, y)
				}
			}
			if len(pts) == 0 {
				continue
			}
			sort.SliceStable(pts, func(a, b int) bool { return pts[a].y > pts[b].y })
			xys := make(plotter.XYs, len(pts))
			for i, q := range pts {
				xys[i].X, xys[i].Y = q.x, q.y
			}
			k, ok := styles[l.Label]
			if !ok {
				k = len(styles)
				styles[l.Label] = k
				name := l.Label
				if name == "" {
					name = fmt.Sprintf("line %d", k+1)
				}
				legend = append(legend, styleFor(k).legend(name))
			}
			pd.lines = append(pd.lines, xys)
			pd.idx = append(pd.idx, k)
			pd.points = append(pd.points, l.Points)
			any = true
		}
		pds = append(pds, pd)
	}
	if !any {
		return fmt.Errorf("%w: depth profile %q has no finite (depth, SI) pair", ErrNoData, d.Title)
	}
	if band > 0 {
		legend = append(legend, legendEntry{label: fmt.Sprintf("near equilibrium (SI within ±%s)", formatNum(band, 2)), kind: legendPatch, fill: bandColor})
	}
	if y1-y0 < 1 {
		m := (y0 + y1) / 2
		y0, y1 = m-0.5, m+0.5
	}
	pad := 0.04 * (y1 - y0)
	y0, y1 = y0-pad, y1+pad
	if !d.Elevation && y1 < 0 && -y1 < 0.25*(y1-y0) {
		y1 = 0 // show the ground surface when the shallowest sample is near it
	}

	pg := newPage(c, d.Title, d.Caption, legend, "")
	body, legTop, capTop := pg.layout(c)
	row := make([]*plot.Plot, len(pds))
	for i, pd := range pds {
		p := newPlot()
		p.X.Label.Text = "SI (log IAP/K)"
		p.X.Tick.Marker = siTicks{n: 4}
		// Show at least twice the band so the near-equilibrium strip reads as
		// a strip, not as the background.
		x0, x1 := -2*band, 2*band
		for _, l := range pd.lines {
			for _, q := range l {
				x0, x1 = math.Min(x0, q.X), math.Max(x1, q.X)
			}
		}
		x0, x1 = math.Min(x0, -0.25), math.Max(x1, 0.25)
		xp := 0.08 * (x1 - x0)
		p.X.Min, p.X.Max = x0-xp, x1+xp
		if band > 0 {
			poly, err := plotter.NewPolygon(plotter.XYs{{X: -band, Y: y0}, {X: band, Y: y0}, {X: band, Y: y1}, {X: -band, Y: y1}})
			if err != nil {
				return err
			}
			poly.Color = bandColor
			poly.LineStyle.Width = 0
			p.Add(poly)
		}
		zero, err := plotter.NewLine(plotter.XYs{{X: 0, Y: y0}, {X: 0, Y: y1}})
		if err != nil {
			return err
		}
		zero.LineStyle = draw.LineStyle{Color: inkColor, Width: 0.9}
		p.Add(zero)
		for j, l := range pd.lines {
			p.Add(&seriesPlotter{xys: l, st: styleFor(pd.idx[j]), glyphs: true, noLine: pd.points[j]})
		}
		p.X.Min, p.X.Max = x0-xp, x1+xp
		p.Y.Min, p.Y.Max = y0, y1
		if d.Elevation {
			if i > 0 {
				p.Y.Tick.Marker = hiddenTicks{}
			}
		} else {
			p.Y.Tick.Marker = flipTicks{hideLabels: i > 0}
		}
		if i == 0 {
			p.Y.Label.Text = d.DepthLabel
			if p.Y.Label.Text == "" {
				p.Y.Label.Text = "Depth (m)"
				if d.Elevation {
					p.Y.Label.Text = "Elevation (m)"
				}
			}
		}
		row[i] = p
	}
	// Panel titles are drawn above the aligned data areas, so that they
	// line up whatever the tick labels of each panel need.
	tsty := textStyle(sizeLabel)
	body.Max.Y -= lineHeight(tsty) + 2
	tiles := draw.Tiles{Rows: 1, Cols: len(row), PadX: 8}
	cs := plot.Align([][]*plot.Plot{row}, tiles, body)
	tsty.XAlign, tsty.YAlign = draw.XCenter, draw.YBottom
	for i, p := range row {
		p.Draw(cs[0][i])
		da := p.DataCanvas(cs[0][i])
		c.FillText(tsty, vg.Point{X: (da.Min.X + da.Max.X) / 2, Y: da.Max.Y + 4}, pds[i].title)
	}
	pg.draw(c, legTop, capTop)
	return nil
}

var bandColor = color.NRGBA{R: 0xdd, G: 0xdd, B: 0xdd, A: 0xff}

// seriesPlotter draws a line with markers in a series style; NaN-free
// input only.
type seriesPlotter struct {
	xys    plotter.XYs
	st     seriesStyle
	glyphs bool
	noLine bool // markers only (unconnected points)
}

func (s *seriesPlotter) Plot(c draw.Canvas, p *plot.Plot) {
	tx, ty := p.Transforms(&c)
	pts := make([]vg.Point, len(s.xys))
	for i, q := range s.xys {
		pts[i] = vg.Point{X: tx(q.X), Y: ty(q.Y)}
	}
	if !s.noLine {
		c.StrokeLines(s.st.line, c.ClipLinesXY(pts)...)
	}
	if s.glyphs {
		for _, pt := range pts {
			if c.Contains(pt) {
				drawGlyph(c, s.st.glyph, pt, 2.8, s.st.color, color.White, 0.4)
			}
		}
	}
}
