package figure

import (
	"fmt"
	"image/color"
	"math"
	"strings"

	"gonum.org/v1/plot/vg"
	"gonum.org/v1/plot/vg/draw"
)

// StiffWater is one water analysis for a Stiff diagram: the major ions in
// meq/L (the caller converts from mg/L) and the well or sample it belongs
// to, which titles its panel.
type StiffWater struct {
	Well                              string
	Na, K, Ca, Mg, Cl, HCO3, CO3, SO4 float64
}

// Stiff is the pattern diagram of Stiff (1951, "The interpretation of
// chemical water analysis by means of patterns", J. Petroleum Technology
// 3(10), 15-17) for one water: a polygon whose vertices lie on three
// horizontal rows, cations to the left of a vertical zero line (Na + K,
// Ca, Mg from top to bottom) and anions to the right (Cl, HCO3 + CO3,
// SO4), each at its concentration in meq/L on one linear horizontal scale.
// The cation half and the anion half are filled in two tints, so a wide
// left or right side reads at a glance. The title defaults to the well.
//
// MaxMeqL sets the half-width of the scale; 0 (or a non-finite value)
// fits the largest ion, rounded up to 1, 2, 2.5 or 5 times a power of ten.
// An ion beyond a set scale is drawn at its edge, marked with an outward
// arrowhead, and counted in the note under the diagram. A water with a
// negative or non-finite ion, or with all ions zero, is not drawn
// (ErrNoData).
type Stiff struct {
	Title, Caption string
	Water          StiffWater
	MaxMeqL        float64
}

// StiffGrid draws one Stiff diagram per water as small multiples on one
// page, in reading order, each titled with its well, all on the same
// horizontal scale so that their shapes and widths compare directly. It is
// meant for up to about 30 waters on a report page; split longer lists
// over several pages, with MaxMeqL set to the same value on each.
//
// Cols is the number of panels to a row; 0 chooses it from the page shape.
// MaxMeqL is as for Stiff, fitted to the largest ion of all waters when 0.
// Waters that cannot be drawn (a negative or non-finite ion, or all ions
// zero) are left out and counted by Skipped and in the note.
type StiffGrid struct {
	Title, Caption string
	Waters         []StiffWater
	Cols           int
	MaxMeqL        float64
}

// Row positions of the ions, top to bottom, and their labels.
var (
	stiffCationNames = [3]string{"Na + K", "Ca", "Mg"}
	stiffAnionNames  = [3]string{"Cl", "HCO3 + CO3", "SO4"}
)

// Fill colours of the two halves (our own: a light steel blue for cations
// and a light terracotta for anions, L* about 68 and 75, which stay
// distinct in grey-scale print), with a dark outline.
var (
	stiffCationFill = color.NRGBA{R: 0x86, G: 0xa8, B: 0xcf, A: 0xff}
	stiffAnionFill  = color.NRGBA{R: 0xe6, G: 0xa5, B: 0x80, A: 0xff}
	stiffOutline    = draw.LineStyle{Color: inkColor, Width: 0.8}
	stiffAxisStyle  = draw.LineStyle{Color: inkColor, Width: 0.7}
	stiffGridStyle  = draw.LineStyle{Color: color.NRGBA{R: 0xcc, G: 0xcc, B: 0xcc, A: 0xff}, Width: 0.4}
)

// stiffVertices returns the six vertices of a water's polygon in
// diagram units: x in meq/L (cations negative, anions positive) and y the
// row (2 top, 1 middle, 0 bottom). The order runs down the cation side and
// up the anion side: Na + K, Ca, Mg, SO4, HCO3 + CO3, Cl.
func stiffVertices(w StiffWater) [6][2]float64 {
	return [6][2]float64{
		{-(w.Na + w.K), 2},
		{-w.Ca, 1},
		{-w.Mg, 0},
		{w.SO4, 0},
		{w.HCO3 + w.CO3, 1},
		{w.Cl, 2},
	}
}

// stiffValid reports whether w can be drawn: all ions finite and not
// negative, and at least one above zero.
func stiffValid(w StiffWater) bool {
	any := false
	for _, v := range []float64{w.Na, w.K, w.Ca, w.Mg, w.Cl, w.HCO3, w.CO3, w.SO4} {
		if !finite(v) || v < 0 {
			return false
		}
		if v > 0 {
			any = true
		}
	}
	return any && finite(w.Na+w.K, w.HCO3+w.CO3)
}

// stiffExtent is the largest |x| of the polygon.
func stiffExtent(w StiffWater) float64 {
	m := 0.0
	for _, v := range stiffVertices(w) {
		m = math.Max(m, math.Abs(v[0]))
	}
	return m
}

// niceCeil returns the smallest number 1, 2, 2.5 or 5 times a power of ten
// that is not less than v (v > 0 and finite; 1 otherwise).
func niceCeil(v float64) float64 {
	if !(v > 0) || math.IsInf(v, 0) {
		return 1
	}
	base := math.Pow(10, math.Floor(math.Log10(v)))
	for _, m := range []float64{1, 2, 2.5, 5, 10} {
		if m*base >= v*(1-1e-12) {
			return m * base
		}
	}
	return 10 * base
}

// stiffScale returns the half-width of the scale for the given waters.
func stiffScale(set float64, ws []StiffWater) float64 {
	if set > 0 && finite(set) {
		return set
	}
	m := 0.0
	for _, w := range ws {
		m = math.Max(m, stiffExtent(w))
	}
	return niceCeil(m)
}

// stiffClipped counts the ions of w beyond the scale.
func stiffClipped(w StiffWater, scale float64) int {
	n := 0
	for _, v := range stiffVertices(w) {
		if math.Abs(v[0]) > scale {
			n++
		}
	}
	return n
}

// Skipped is 1 when the water cannot be drawn, else 0.
func (s Stiff) Skipped() int {
	if stiffValid(s.Water) {
		return 0
	}
	return 1
}

// Draw draws the diagram on c, or returns ErrNoData when the water cannot
// be drawn.
func (s Stiff) Draw(c draw.Canvas) error {
	if !stiffValid(s.Water) {
		return fmt.Errorf("%w: Stiff diagram of %q needs finite, non-negative ions, not all zero", ErrNoData, s.Water.Well)
	}
	title := s.Title
	if title == "" {
		title = s.Water.Well
	}
	scale := stiffScale(s.MaxMeqL, []StiffWater{s.Water})
	pg := newPage(c, title, s.Caption, stiffLegend(), stiffNote(0, stiffClipped(s.Water, scale)))
	body, legTop, capTop := pg.layout(c)
	// One diagram on a whole page: keep the rows from spreading too far
	// apart (height at most 0.55 of the width, common practice for a
	// readable pattern), centred vertically.
	w := body.Max.X - body.Min.X
	if h := body.Max.Y - body.Min.Y; h > 0.55*w {
		mid := (body.Min.Y + body.Max.Y) / 2
		body.Min.Y, body.Max.Y = mid-0.275*w, mid+0.275*w
	}
	drawStiffPanel(body, s.Water, scale, "", stiffLarge)
	pg.draw(c, legTop, capTop)
	return nil
}

// StiffPerPage is the default number of panels per page of
// StiffGrid.Pages: 30 panels (6 x 5) stay legible on an A4 or letter page
// in landscape (common practice for small multiples).
const StiffPerPage = 30

// Pages splits g into pages of at most perPage waters (StiffPerPage when
// perPage < 1), in order. All pages get the same MaxMeqL: g's own when
// set, otherwise the scale fitted to all of g's waters, so that diagrams
// on different pages compare. With more than one page, titles end in
// " (page i of n)". An empty g gives one page, which draws ErrNoData.
func (g StiffGrid) Pages(perPage int) []StiffGrid {
	if perPage < 1 {
		perPage = StiffPerPage
	}
	var good []StiffWater
	for _, w := range g.Waters {
		if stiffValid(w) {
			good = append(good, w)
		}
	}
	scale := g.MaxMeqL
	if len(good) > 0 {
		scale = stiffScale(g.MaxMeqL, good)
	}
	n := (len(g.Waters) + perPage - 1) / perPage
	if n == 0 {
		return []StiffGrid{g}
	}
	pages := make([]StiffGrid, 0, n)
	for i := 0; i < n; i++ {
		p := g
		p.Waters = g.Waters[i*perPage : min((i+1)*perPage, len(g.Waters))]
		p.MaxMeqL = scale
		if n > 1 {
			p.Title = strings.TrimSpace(fmt.Sprintf("%s (page %d of %d)", g.Title, i+1, n))
		}
		pages = append(pages, p)
	}
	return pages
}

// Skipped counts the waters left out.
func (g StiffGrid) Skipped() int {
	n := 0
	for _, w := range g.Waters {
		if !stiffValid(w) {
			n++
		}
	}
	return n
}

// Draw draws the panels on c, or returns ErrNoData when no water can be
// drawn.
func (g StiffGrid) Draw(c draw.Canvas) error {
	var good []StiffWater
	for _, w := range g.Waters {
		if stiffValid(w) {
			good = append(good, w)
		}
	}
	if len(good) == 0 {
		return fmt.Errorf("%w: Stiff diagrams %q have no water with finite, non-negative ions", ErrNoData, g.Title)
	}
	scale := stiffScale(g.MaxMeqL, good)
	clipped := 0
	for _, w := range good {
		clipped += stiffClipped(w, scale)
	}
	pg := newPage(c, g.Title, g.Caption, stiffLegend(), stiffNote(len(g.Waters)-len(good), clipped))
	body, legTop, capTop := pg.layout(c)
	cols := g.Cols
	if cols < 1 {
		cols = gridCols(len(good), float64(body.Max.X-body.Min.X), float64(body.Max.Y-body.Min.Y))
	}
	if cols > len(good) {
		cols = len(good)
	}
	rows := (len(good) + cols - 1) / cols
	t := draw.Tiles{Rows: rows, Cols: cols, PadX: 6, PadY: 4}
	for i, w := range good {
		name := w.Well
		if name == "" {
			name = fmt.Sprintf("sample %d", i+1)
		}
		drawStiffPanel(t.At(body, i%cols, i/cols), w, scale, name, stiffSmall)
	}
	pg.draw(c, legTop, capTop)
	return nil
}

// gridCols chooses the number of columns for n panels so that they come
// out about 1.5 times as wide as high on a body of the given size.
func gridCols(n int, w, h float64) int {
	best, bestErr := 1, math.Inf(1)
	for cols := 1; cols <= n; cols++ {
		rows := (n + cols - 1) / cols
		aspect := (w / float64(cols)) / (h / float64(rows))
		if e := math.Abs(math.Log(aspect / 1.5)); e < bestErr {
			best, bestErr = cols, e
		}
	}
	return best
}

func stiffLegend() []legendEntry {
	edge := draw.LineStyle{Color: inkColor, Width: 0.5}
	return []legendEntry{
		{label: "cations (left)", kind: legendPatch, fill: stiffCationFill, line: edge},
		{label: "anions (right)", kind: legendPatch, fill: stiffAnionFill, line: edge},
	}
}

func stiffNote(skipped, clipped int) string {
	note := "meq/L on one scale."
	if clipped > 0 {
		note += fmt.Sprintf(" %d value(s) beyond the scale drawn at its edge (arrowhead).", clipped)
	}
	if skipped > 0 {
		note += fmt.Sprintf(" %d water(s) left out (invalid ions).", skipped)
	}
	return note
}

// stiffSize holds the type sizes of a panel.
type stiffSize struct {
	title, label, tick vg.Length
	short              bool // short ion names ("Na+K", "HCO3")
}

var (
	stiffLarge = stiffSize{title: sizeLabel, label: sizeLabel, tick: sizeTick}
	stiffSmall = stiffSize{title: sizeLabel, label: 6.5, tick: 6.5, short: true}
)

// drawStiffPanel draws one water's diagram in c: the title on top, ion
// names outside the ends of the rows, the scale (absolute meq/L both
// ways) below.
func drawStiffPanel(c draw.Canvas, w StiffWater, scale float64, title string, sz stiffSize) {
	lab := textStyle(sz.label)
	tick := textStyle(sz.tick)
	tick.Color = greyColor
	left, right := stiffCationNames, stiffAnionNames
	if sz.short {
		left = [3]string{"Na+K", "Ca", "Mg"}
		right = [3]string{"Cl", "HCO3", "SO4"}
	}
	var lw, rw vg.Length
	for i := range left {
		lw = max(lw, lab.Width(left[i]))
		rw = max(rw, lab.Width(right[i]))
	}
	const gap = 3
	top := c.Max.Y
	if title != "" {
		ts := boldStyle(sz.title)
		ts.XAlign, ts.YAlign = draw.XCenter, draw.YTop
		c.FillText(ts, vg.Point{X: (c.Min.X + c.Max.X) / 2, Y: top}, title)
		top -= lineHeight(ts) + 1
	}
	x0, x1 := c.Min.X+lw+gap, c.Max.X-rw-gap
	y0 := c.Min.Y + lineHeight(tick) + 4
	if !sz.short {
		y0 += lineHeight(lab) + 2 // room for the unit under the scale
	}
	y1 := top - 2
	if !(x1 > x0) || !(y1 > y0) {
		return
	}
	px := func(v float64) vg.Length {
		v = math.Max(-scale, math.Min(scale, v))
		return x0 + (x1-x0)*vg.Length((v+scale)/(2*scale))
	}
	// Rows sit at 1/6, 3/6 and 5/6 of the height: equal spacing with half
	// a row of room above and below.
	py := func(row float64) vg.Length { return y0 + (y1-y0)*vg.Length((2*row+1)/6) }

	// Scale: vertical grid lines at the ticks, labels below.
	step := niceFloor(scale / 2)
	if scale/step > 4 {
		step = niceCeil(scale / 4)
	}
	ts := tick
	ts.XAlign, ts.YAlign = draw.XCenter, draw.YTop
	for k := -math.Floor(scale/step + 1e-9); k <= math.Floor(scale/step+1e-9); k++ {
		v := k * step
		x := px(v)
		if k != 0 {
			c.StrokeLine2(stiffGridStyle, x, y0, x, y1)
		}
		c.StrokeLine2(stiffAxisStyle, x, y0, x, y0-2)
		c.FillText(ts, vg.Point{X: x, Y: y0 - 3}, formatTick(math.Abs(v), step))
	}
	c.StrokeLine2(stiffAxisStyle, x0, y0, x1, y0)
	if !sz.short {
		us := lab
		us.XAlign, us.YAlign = draw.XCenter, draw.YTop
		c.FillText(us, vg.Point{X: px(0), Y: y0 - 3 - lineHeight(tick) - 2}, "meq/L")
	}
	for r := 0.0; r < 3; r++ {
		c.StrokeLine2(stiffGridStyle, x0, py(r), x1, py(r))
	}

	// The two halves, then the outline and the zero line over them.
	v := stiffVertices(w)
	pts := make([]vg.Point, 6)
	for i, q := range v {
		pts[i] = vg.Point{X: px(q[0]), Y: py(q[1])}
	}
	zx := px(0)
	c.FillPolygon(stiffCationFill, []vg.Point{{X: zx, Y: pts[0].Y}, pts[0], pts[1], pts[2], {X: zx, Y: pts[2].Y}})
	c.FillPolygon(stiffAnionFill, []vg.Point{{X: zx, Y: pts[3].Y}, pts[3], pts[4], pts[5], {X: zx, Y: pts[5].Y}})
	c.StrokeLines(stiffOutline, append(pts, pts[0]))
	c.StrokeLine2(stiffAxisStyle, zx, y0, zx, y1)
	for i, q := range v {
		if math.Abs(q[0]) > scale {
			drawStiffArrow(c, pts[i], q[0] > 0)
		}
	}

	// Ion names outside the row ends.
	ls := lab
	ls.YAlign = draw.YCenter
	for i := 0; i < 3; i++ {
		y := py(float64(2 - i))
		ls.XAlign = draw.XRight
		c.FillText(ls, vg.Point{X: x0 - gap, Y: y}, left[i])
		ls.XAlign = draw.XLeft
		c.FillText(ls, vg.Point{X: x1 + gap, Y: y}, right[i])
	}
}

// drawStiffArrow marks a vertex clipped at the edge of the scale with a
// small filled arrowhead pointing outward.
func drawStiffArrow(c draw.Canvas, at vg.Point, right bool) {
	const l, h = 5, 3
	d := vg.Length(1)
	if !right {
		d = -1
	}
	c.FillPolygon(inkColor, []vg.Point{
		{X: at.X + d*1, Y: at.Y},
		{X: at.X - d*(l-1), Y: at.Y + h},
		{X: at.X - d*(l-1), Y: at.Y - h},
	})
}
