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

// ProfileLine is one well or nest in one sampling round: SI at each
// sampled depth (metres below ground, or elevation when the profile's
// Elevation is set).
type ProfileLine struct {
	// Label names the line when the profile has no rounds (e.g. a nest).
	Label string
	// Round names the sampling round; lines of one round share a dash
	// pattern and marker fill in every panel.
	Round string
	Depth []float64
	SI    []float64
	// Points draws the values as unconnected markers (e.g. single wells that
	// are not one nest), not as a line.
	Points bool
}

// ProfilePanel is one mineral's panel of a depth profile. Panels with the
// same Row (e.g. a well nest) form one row of the figure, minerals its
// columns.
type ProfilePanel struct {
	Mineral string
	Row     string
	Lines   []ProfileLine
}

// DepthProfile is SI against depth: one column per mineral and one row per
// distinct panel Row, sharing the depth axis, with depth increasing
// downward (or elevation increasing upward when Elevation is set), a
// shaded near-equilibrium band of half-width Band around SI = 0 (0:
// DefaultBand; negative: none) and a vertical line at SI = 0. Every mark of
// a panel takes its mineral's colour and marker (MineralStyle); the lines
// of a panel differ by round (or, without rounds, by label) in dash pattern
// and marker fill, the latest round solid and filled, earlier rounds
// dashed and lighter. The legend shows the rounds once for the figure.
type DepthProfile struct {
	Title, Caption string
	Panels         []ProfilePanel
	Band           float64
	Elevation      bool
	DepthLabel     string // default "Depth below ground (m)" or "Elevation (m)"
	// Rounds orders the rounds, earliest first (nil: as first met).
	Rounds []string
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
	ts := niceTicks{n: 4}.Ticks(-max, -min)
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
	ts := niceTicks(t).Ticks(min, max)
	for i := range ts {
		if ts[i].Value > 0 && ts[i].Label != "" && ts[i].Label != "0" {
			ts[i].Label = "+" + ts[i].Label
		}
	}
	return ts
}

type xyPoint struct{ x, y float64 }

// roundDashes are the dash patterns of the rounds, latest first: solid,
// dashed, dotted, dash-dot.
var roundDashes = [][]vg.Length{nil, {6, 3}, {1.5, 2.5}, {7, 2.5, 1.5, 2.5}, {12, 3}, {3, 3}}

// roundStyle is the style of round k of n (k = n-1 the latest) in a panel
// of style base: a dash pattern, and a marker fill from the full colour
// (latest) to a light tint (earliest).
func roundStyle(base seriesStyle, k, n int) (seriesStyle, color.Color) {
	age := n - 1 - k
	st := base.withDashes(roundDashes[age%len(roundDashes)])
	fill := color.Color(base.color)
	if n > 1 && age > 0 {
		fill = lighter(base.color, 0.25+0.6*float64(age)/float64(n-1))
	}
	return st, fill
}

func (d DepthProfile) depthLabel() string {
	switch {
	case d.DepthLabel != "":
		return d.DepthLabel
	case d.Elevation:
		return "Elevation (m)"
	}
	return "Depth below ground (m)"
}

// Draw draws the profile on c.
func (d DepthProfile) Draw(c draw.Canvas) error {
	band := d.band()
	type lineData struct {
		xys    plotter.XYs
		key    string
		points bool
	}
	type panelData struct {
		mineral, row string
		lines        []lineData
	}
	// Lines are keyed by round, or by label when no line has a round.
	byRound := false
	for _, p := range d.Panels {
		for _, l := range p.Lines {
			byRound = byRound || l.Round != ""
		}
	}
	var keys []string
	keyIdx := map[string]int{}
	used := map[string]bool{} // keys with a line: the only ones in the legend
	if byRound {
		for _, r := range d.Rounds {
			if _, ok := keyIdx[r]; !ok {
				keyIdx[r] = len(keys)
				keys = append(keys, r)
			}
		}
	}
	var rows, cols []string
	rowIdx, colIdx := map[string]int{}, map[string]int{}
	var pds []panelData
	y0, y1 := math.Inf(1), math.Inf(-1)
	anyPoint := false
	for pi, p := range d.Panels {
		pd := panelData{mineral: p.Mineral, row: p.Row}
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
			key := l.Label
			if byRound {
				key = l.Round
			}
			if _, ok := keyIdx[key]; !ok {
				keyIdx[key] = len(keys)
				keys = append(keys, key)
			}
			pd.lines = append(pd.lines, lineData{xys, key, l.Points})
			used[key] = true
			anyPoint = true
		}
		if _, ok := rowIdx[p.Row]; !ok {
			rowIdx[p.Row] = len(rows)
			rows = append(rows, p.Row)
		}
		if _, ok := colIdx[p.Mineral]; !ok {
			colIdx[p.Mineral] = len(cols)
			cols = append(cols, p.Mineral)
		}
		pds = append(pds, pd)
	}
	if !anyPoint {
		return fmt.Errorf("%w: depth profile %q has no finite (depth, SI) pair", ErrNoData, d.Title)
	}
	// Legend: one entry per round (or label), in neutral ink, latest solid.
	var legend []legendEntry
	ink := seriesStyle{line: draw.LineStyle{Color: inkColor, Width: 1.4}, color: inkColor, glyph: glyphCircle}
	for k, key := range keys {
		if !used[key] {
			continue // a round this profile has no sample of
		}
		st, fill := roundStyle(ink, k, len(keys))
		name := key
		switch {
		case name == "" && byRound:
			name = "round not given"
		case name == "":
			name = fmt.Sprintf("line %d", k+1)
		case byRound:
			name = "round " + name
		}
		e := st.legend(name)
		e.fill = fill
		legend = append(legend, e)
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
	// One SI range for every panel, so columns and rows compare.
	x0, x1 := -2*band, 2*band
	for _, pd := range pds {
		for _, l := range pd.lines {
			for _, q := range l.xys {
				x0, x1 = math.Min(x0, q.X), math.Max(x1, q.X)
			}
		}
	}
	x0, x1 = math.Min(x0, -0.25), math.Max(x1, 0.25)
	xp := 0.08 * (x1 - x0)

	pg := newPage(c, d.Title, d.Caption, legend, "")
	body, legTop, capTop := pg.layout(c)
	grid := make([][]*plot.Plot, len(rows))
	for r := range grid {
		grid[r] = make([]*plot.Plot, len(cols))
	}
	mk := func(r, col int) *plot.Plot {
		p := newPlot()
		p.X.Min, p.X.Max = x0-xp, x1+xp
		p.Y.Min, p.Y.Max = y0, y1
		if band > 0 {
			poly, _ := plotter.NewPolygon(plotter.XYs{{X: -band, Y: y0}, {X: band, Y: y0}, {X: band, Y: y1}, {X: -band, Y: y1}})
			poly.Color = bandColor
			poly.LineStyle.Width = 0
			p.Add(poly)
		}
		p.Add(&vline{x: 0, y0: y0, y1: y1, st: draw.LineStyle{Color: inkColor, Width: 0.9}})
		// Every panel carries its own SI axis, ticks and title: panels then
		// align exactly, and each reads on its own.
		p.X.Tick.Marker = siTicks{n: 2}
		p.X.Label.Text = "SI\n(log IAP/K)" // two short lines: a title wider than the panel would shrink it
		if d.Elevation {
			if col > 0 {
				p.Y.Tick.Marker = hiddenTicks{}
			}
		} else {
			p.Y.Tick.Marker = flipTicks{hideLabels: col > 0}
		}
		if col == 0 {
			p.Y.Label.Text = d.depthLabel()
			if rows[r] != "" {
				p.Y.Label.Text = rows[r] + "\n" + p.Y.Label.Text
			}
		}
		return p
	}
	for _, pd := range pds {
		r, col := rowIdx[pd.row], colIdx[pd.mineral]
		if grid[r][col] == nil {
			grid[r][col] = mk(r, col)
		}
		base := mineralSeriesStyle(pd.mineral)
		for _, l := range pd.lines {
			st, fill := roundStyle(base, keyIdx[l.key], len(keys))
			grid[r][col].Add(&seriesPlotter{xys: l.xys, st: st, fill: fill, glyphs: true, noLine: l.points})
		}
	}
	for r := range grid {
		for col := range grid[r] {
			if grid[r][col] == nil {
				grid[r][col] = mk(r, col) // an empty panel keeps the grid aligned
			}
		}
	}
	// Column titles (mineral, with its marker) above the aligned data areas.
	tsty := textStyle(sizeLabel)
	body.Max.Y -= lineHeight(tsty) + 2
	tiles := draw.Tiles{Rows: len(rows), Cols: len(cols), PadX: 8, PadY: 6}
	cs := plot.Align(grid, tiles, body)
	tsty.XAlign, tsty.YAlign = draw.XCenter, draw.YBottom
	for r := range grid {
		for col, p := range grid[r] {
			p.Draw(cs[r][col])
			if r > 0 {
				continue
			}
			da := p.DataCanvas(cs[r][col])
			st := mineralSeriesStyle(cols[col])
			cx := (da.Min.X + da.Max.X) / 2
			tw := tsty.Width(cols[col])
			c.FillText(tsty, vg.Point{X: cx + 5, Y: da.Max.Y + 4}, cols[col])
			drawGlyph(c, st.glyph, vg.Point{X: cx + 5 - tw/2 - 7, Y: da.Max.Y + 4 + tsty.Height(cols[col])/2 - 1}, 3, st.color, inkColor, 0.4)
		}
	}
	pg.draw(c, legTop, capTop)
	return nil
}

// vline is a vertical line from y0 to y1 at x.
type vline struct {
	x, y0, y1 float64
	st        draw.LineStyle
}

func (v *vline) Plot(c draw.Canvas, p *plot.Plot) {
	tx, ty := p.Transforms(&c)
	c.StrokeLine2(v.st, tx(v.x), ty(v.y0), tx(v.x), ty(v.y1))
}

var bandColor = color.NRGBA{R: 0xdd, G: 0xdd, B: 0xdd, A: 0xff}

// seriesPlotter draws a line with markers in a series style; NaN-free
// input only.
type seriesPlotter struct {
	xys    plotter.XYs
	st     seriesStyle
	fill   color.Color // marker fill; nil: the series colour
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
		drawn := newGlyphMemo(len(pts))
		for _, pt := range pts {
			if c.Contains(pt) {
				fill, outline := s.fill, color.Color(color.White)
				if fill == nil {
					fill = s.st.color
				}
				if fill != s.st.color {
					outline = s.st.color // a light fill keeps a coloured rim
				}
				drawn.draw(c, s.st.glyph, pt, 2.8, fill, outline, 0.6)
			}
		}
	}
}
