package figure

import (
	"fmt"
	"image/color"
	"math"
	"strconv"

	"gonum.org/v1/plot/vg"
	"gonum.org/v1/plot/vg/draw"
)

// PiperPoint is one water analysis for a Piper diagram: the major ions in
// meq/L (the caller converts from mg/L), a label naming the sample and a
// group that sets the marker (for example "injectate", "native",
// "monitoring" or a cluster name).
type PiperPoint struct {
	Label, Group                      string
	Ca, Mg, Na, K, Cl, SO4, HCO3, CO3 float64
}

// Piper is the trilinear diagram of Piper (1944, "A graphic procedure in
// the geochemical interpretation of water-analyses", Trans. AGU 25,
// 914-928): the cation triangle at the lower left (Ca, Mg, Na + K as
// percent of the cation meq), the anion triangle at the lower right (Cl,
// SO4, HCO3 + CO3 as percent of the anion meq) and the diamond above them,
// where each sample is projected from both triangles. Each sample is a
// marker in all three fields, styled by its Group (colour and shape both
// differ, colour-blind safe) and listed in a legend of groups. Up to ten
// groups get a style of their own, in order of first appearance; with more,
// the first nine keep theirs and the rest share "other", as do points
// without a group. Labels are not printed (the fields get crowded). The
// figure has a 20 % grid and percentage ticks on the outer edges, and no
// axes; it keeps an equal scale in x and y, so the triangles stay
// equilateral on any page shape.
//
// A point with a negative or non-finite ion, or a zero cation or anion sum,
// is left out and counted by Skipped. Mixtures of two waters fall on a
// straight line in each triangle (the percentages are ratios of meq, so a
// mixture's point is a weighted mean of the end members' points, weighted
// by their meq sums); in the diamond the line is straight when the cation
// and anion weights agree, as they do for charge-balanced waters.
type Piper struct {
	Title, Caption string
	Points         []PiperPoint
}

// piperGap is the horizontal gap between the two triangles, in units of a
// triangle side (Piper's layout leaves a narrow gap; 0.1-0.2 is usual,
// common practice).
const piperGap = 0.15

// piperMaxGroups is the number of groups with a style of their own; the
// last style is "other".
const piperMaxGroups = 10

// sin60 is the height of an equilateral triangle of side 1.
var sin60 = math.Sqrt(3) / 2

// piperXY returns the page-independent positions, in units of a triangle
// side, of a sample in the cation triangle, the anion triangle and the
// diamond. Arguments are percentages of the cation sum (ca, mg, nak) and of
// the anion sum (cl, so4, hco3); each triple is divided by its own sum, so
// that rounding does not move a point off the field. Both sums must be
// positive.
//
// Layout: the cation triangle has Ca at (0, 0), Na + K at (1, 0) and Mg at
// the apex (1/2, sin60); the anion triangle has HCO3 + CO3 at (1+g, 0), Cl
// at (2+g, 0) and SO4 at its apex, g = piperGap. The diamond stands on its
// lower vertex (1+g/2, g sin60), with Ca-HCO3 water at its left vertex,
// Na-Cl at its right vertex, Ca-SO4/Cl at the top and Na-HCO3 at the
// bottom. A cation point is projected into the diamond along lines of
// constant Na + K (direction (1/2, sin60)), an anion point along lines of
// constant HCO3 + CO3 (direction (-1/2, sin60)); the diamond point is where
// the two projections cross.
func piperXY(ca, mg, nak, cl, so4, hco3 float64) (cat, an, dia [2]float64) {
	cs, as := ca+mg+nak, cl+so4+hco3 // 100 each, up to rounding
	mg, nak, cl, so4 = mg/cs, nak/cs, cl/as, so4/as
	cat = [2]float64{nak + mg/2, sin60 * mg}
	an = [2]float64{1 + piperGap + cl + so4/2, sin60 * so4}
	camg, so4cl := 1-nak, cl+so4
	bx, by := 1+piperGap/2, piperGap*sin60
	dia = [2]float64{bx + (so4cl-camg)/2, by + sin60*(so4cl+camg)}
	return cat, an, dia
}

// piperPercent converts a point to percentages; ok is false when the point
// cannot be drawn.
func piperPercent(p PiperPoint) (ca, mg, nak, cl, so4, hco3 float64, ok bool) {
	ions := []float64{p.Ca, p.Mg, p.Na, p.K, p.Cl, p.SO4, p.HCO3, p.CO3}
	for _, v := range ions {
		if !finite(v) || v < 0 {
			return 0, 0, 0, 0, 0, 0, false
		}
	}
	cs := p.Ca + p.Mg + p.Na + p.K
	as := p.Cl + p.SO4 + p.HCO3 + p.CO3
	if !(cs > 0) || !(as > 0) || !finite(cs, as) {
		return 0, 0, 0, 0, 0, 0, false
	}
	return 100 * p.Ca / cs, 100 * p.Mg / cs, 100 * (p.Na + p.K) / cs,
		100 * p.Cl / as, 100 * p.SO4 / as, 100 * (p.HCO3 + p.CO3) / as, true
}

// Skipped counts the points left out: a negative or non-finite ion, or a
// zero cation or anion sum.
func (pd Piper) Skipped() int {
	n := 0
	for _, p := range pd.Points {
		if _, _, _, _, _, _, ok := piperPercent(p); !ok {
			n++
		}
	}
	return n
}

type piperSample struct {
	cat, an, dia [2]float64
	group        int
}

// piperGroups assigns style indices to groups in order of first
// appearance. With more than piperMaxGroups groups, the first
// piperMaxGroups-1 keep their own style and the rest share "other", as do
// points without a group.
func piperGroups(pts []PiperPoint) (idx []int, names []string) {
	var order []string
	seen := map[string]bool{}
	for _, p := range pts {
		if p.Group != "" && !seen[p.Group] {
			seen[p.Group] = true
			order = append(order, p.Group)
		}
	}
	if len(order) > piperMaxGroups {
		order = order[:piperMaxGroups-1]
	}
	byName := map[string]int{}
	for i, n := range order {
		byName[n] = i
	}
	names = order
	other, hasOther := byName["other"]
	idx = make([]int, len(pts))
	for i, p := range pts {
		k, ok := byName[p.Group]
		if !ok || p.Group == "" {
			if !hasOther {
				other, hasOther = len(names), true
				names = append(names, "other")
			}
			k = other
		}
		idx[i] = k
	}
	return idx, names
}

// Draw draws the diagram on c, or returns ErrNoData when no point can be
// drawn.
func (pd Piper) Draw(c draw.Canvas) error {
	var good []PiperPoint
	var samples []piperSample
	for _, p := range pd.Points {
		ca, mg, nak, cl, so4, hco3, ok := piperPercent(p)
		if !ok {
			continue
		}
		cat, an, dia := piperXY(ca, mg, nak, cl, so4, hco3)
		good = append(good, p)
		samples = append(samples, piperSample{cat: cat, an: an, dia: dia})
	}
	if len(samples) == 0 {
		return fmt.Errorf("%w: Piper diagram %q has no point with positive cation and anion sums", ErrNoData, pd.Title)
	}
	idx, names := piperGroups(good)
	for i := range samples {
		samples[i].group = idx[i]
	}
	var legend []legendEntry
	if len(names) > 1 || names[0] != "other" {
		for k, name := range names {
			st := styleFor(k)
			legend = append(legend, legendEntry{label: name, kind: legendGlyph, fill: st.color, glyph: st.glyph})
		}
	}
	// The note under the legend is one line; on a narrow page it goes to
	// the end of the caption instead, which wraps.
	note := "Percent of the cation and of the anion sums in meq/L."
	if n := pd.Skipped(); n > 0 {
		note += fmt.Sprintf(" %d sample(s) left out (zero or invalid ion sums).", n)
	}
	caption := pd.Caption
	if textStyle(sizeSmall).Width(note) > c.Max.X-c.Min.X-2*pageMargin {
		if caption != "" {
			caption += " "
		}
		caption, note = caption+note, ""
	}
	pg := newPage(c, pd.Title, caption, legend, note)
	body, legTop, capTop := pg.layout(c)
	drawPiperFrame(body, samples)
	pg.draw(c, legTop, capTop)
	return nil
}

var (
	piperGridStyle  = draw.LineStyle{Color: color.NRGBA{R: 0xcc, G: 0xcc, B: 0xcc, A: 0xff}, Width: 0.5}
	piperFrameStyle = draw.LineStyle{Color: inkColor, Width: 0.9}
	piperTickStyle  = draw.LineStyle{Color: inkColor, Width: 0.6}
)

const (
	piperTickLen = 3   // points
	piperPad     = 1.5 // points between a tick and its label
	piperMarkerR = 2.6 // points
)

// drawPiperFrame fits the diagram into body at equal scale in x and y and
// draws grid, frame, labels and the samples.
func drawPiperFrame(body draw.Canvas, samples []piperSample) {
	tick := textStyle(sizeSmall)
	tick.Color = greyColor
	vlab := textStyle(sizeLabel)
	tickW := tick.Width("80")
	tickH := lineHeight(tick)
	vlabH := lineHeight(vlab)
	// Room for labels outside the frame, in points: tick labels left of the
	// cation and right of the anion triangle, tick labels and corner names
	// below. The apex names and the diamond's labels lie within the
	// diagram's bounding box, so only a little room above.
	mX := piperTickLen + piperPad + tickW + 2
	mB := piperTickLen + piperPad + tickH + vlabH + 5
	mT := vg.Length(4)
	const g = piperGap
	w := 2 + g
	h := sin60 * (2 + g)
	bw := body.Max.X - body.Min.X - 2*mX
	bh := body.Max.Y - body.Min.Y - mB - mT
	side := vg.Length(math.Min(float64(bw)/w, float64(bh)/h))
	if !(side > 0) {
		return
	}
	x0 := body.Min.X + mX + (bw-side*vg.Length(w))/2
	y0 := body.Min.Y + mB + (bh-side*vg.Length(h))/2
	pt := func(q [2]float64) vg.Point {
		return vg.Point{X: x0 + side*vg.Length(q[0]), Y: y0 + side*vg.Length(q[1])}
	}
	add := func(a [2]float64, t float64, d [2]float64) [2]float64 {
		return [2]float64{a[0] + t*d[0], a[1] + t*d[1]}
	}
	off := func(p vg.Point, d [2]float64, l vg.Length) vg.Point {
		return vg.Point{X: p.X + l*vg.Length(d[0]), Y: p.Y + l*vg.Length(d[1])}
	}
	line := func(st draw.LineStyle, qs ...[2]float64) {
		ps := make([]vg.Point, len(qs))
		for i, q := range qs {
			ps[i] = pt(q)
		}
		body.StrokeLines(st, ps)
	}
	up := [2]float64{0.5, sin60}     // up and to the right
	upL := [2]float64{-0.5, sin60}   // up and to the left
	nLeft := [2]float64{-sin60, 0.5} // outward normal of a left edge (along up)
	nRight := [2]float64{sin60, 0.5} // outward normal of a right edge (along upL)
	catO, anO := [2]float64{0, 0}, [2]float64{1 + g, 0}
	dB := [2]float64{1 + g/2, g * sin60}
	dL, dR := add(dB, 1, upL), add(dB, 1, up)
	dT := add(dB, 2, [2]float64{0, sin60})

	// 20 % grid lines: in each triangle one family per component, in the
	// diamond one per projection direction.
	for k := 1; k <= 4; k++ {
		f := float64(k) / 5
		for _, o := range [][2]float64{catO, anO} {
			line(piperGridStyle, add(o, 1, [2]float64{f / 2, f * sin60}), add(o, 1, [2]float64{1 - f/2, f * sin60}))
			line(piperGridStyle, add(o, f, [2]float64{1, 0}), add(o, 1, [2]float64{(1 + f) / 2, sin60 * (1 - f)}))
			line(piperGridStyle, add(o, f, [2]float64{1, 0}), add(o, 1, [2]float64{f / 2, sin60 * f}))
		}
		line(piperGridStyle, add(dB, f, up), add(dL, f, up))
		line(piperGridStyle, add(dB, f, upL), add(dR, f, upL))
	}
	// Frames.
	for _, o := range [][2]float64{catO, anO} {
		line(piperFrameStyle, o, add(o, 1, [2]float64{1, 0}), add(o, 1, up), o)
	}
	line(piperFrameStyle, dB, dR, dT, dL, dB)

	// Ticks and percentage labels on the outer edges: Ca along the cation
	// base (100 at the Ca corner), Mg up its left side, Cl along the anion
	// base, SO4 up its right side, SO4 + Cl up the diamond's upper-left
	// side and Ca + Mg down its upper-right side.
	tickAt := func(q, n [2]float64, value float64) {
		p := pt(q)
		e := off(p, n, piperTickLen)
		body.StrokeLine2(piperTickStyle, p.X, p.Y, e.X, e.Y)
		s := tick
		switch {
		case n[1] < -0.5:
			s.XAlign, s.YAlign = draw.XCenter, draw.YTop
		case n[0] < 0:
			s.XAlign, s.YAlign = draw.XRight, draw.YCenter
		default:
			s.XAlign, s.YAlign = draw.XLeft, draw.YCenter
		}
		body.FillText(s, off(e, n, piperPad), strconv.Itoa(int(math.Round(value))))
	}
	for _, tk := range piperTicks() {
		tickAt(tk.at, tk.out, tk.value)
	}

	// Corner names below the bases (under the tick labels), kept inside
	// the triangles' width so that the two in the gap do not meet.
	below := piperTickLen + piperPad + tickH + 1
	corner := func(q [2]float64, xa draw.XAlignment, dx vg.Length, name string) {
		s := vlab
		s.XAlign, s.YAlign = xa, draw.YTop
		p := pt(q)
		body.FillText(s, vg.Point{X: p.X + dx, Y: p.Y - below}, name)
	}
	corner(catO, draw.XLeft, -3, "Ca2+")
	corner(add(catO, 1, [2]float64{1, 0}), draw.XRight, 3, "Na+ + K+")
	corner(anO, draw.XLeft, -3, "HCO3- + CO3 2-")
	corner(add(anO, 1, [2]float64{1, 0}), draw.XRight, 3, "Cl-")
	// Apex names beside the apexes, on the side away from the diamond,
	// whose lower corners come close above them on small pages.
	apex := func(q [2]float64, xa draw.XAlignment, dx vg.Length, name string) {
		s := vlab
		s.XAlign, s.YAlign = xa, draw.YCenter
		p := pt(q)
		body.FillText(s, vg.Point{X: p.X + dx, Y: p.Y + 1}, name)
	}
	apex(add(catO, 1, up), draw.XRight, -4, "Mg2+")
	apex(add(anO, 1, up), draw.XLeft, 4, "SO4 2-")

	// Diamond side titles, along the upper sides beyond their tick labels.
	titleOff := piperTickLen + piperPad + tickW + 5
	dl := vlab
	dl.Rotation = math.Pi / 3
	dl.XAlign, dl.YAlign = draw.XCenter, draw.YBottom
	body.FillText(dl, off(pt(add(dL, 0.5, up)), nLeft, titleOff), "SO4 2- + Cl-")
	dr := vlab
	dr.Rotation = -math.Pi / 3
	dr.XAlign, dr.YAlign = draw.XCenter, draw.YBottom
	body.FillText(dr, off(pt(add(dR, 0.5, upL)), nRight, titleOff), "Ca2+ + Mg2+")

	// Samples, in all three fields.
	drawn := newGlyphMemo(3 * len(samples))
	for _, s := range samples {
		st := styleFor(s.group)
		for _, q := range [][2]float64{s.cat, s.an, s.dia} {
			drawn.draw(body, st.glyph, pt(q), piperMarkerR, st.color, inkColor, 0.4)
		}
	}
}

// piperTick is a labelled tick on an outer edge of the diagram.
type piperTick struct {
	axis  string     // the component read on this edge
	at    [2]float64 // position on the edge, as piperXY
	out   [2]float64 // outward unit normal of the edge
	value float64    // percent
}

// piperTicks lists the 20 % ticks on the outer edges: Ca along the cation
// base (100 at the Ca corner), Mg up its left side, Cl along the anion base,
// SO4 up its right side, SO4 + Cl up the diamond's upper-left side and
// Ca + Mg up its upper-right side (100 at the top).
func piperTicks() []piperTick {
	const g = piperGap
	up := [2]float64{0.5, sin60}
	upL := [2]float64{-0.5, sin60}
	down := [2]float64{0, -1}
	nLeft := [2]float64{-sin60, 0.5}
	nRight := [2]float64{sin60, 0.5}
	dB := [2]float64{1 + g/2, g * sin60}
	at := func(o [2]float64, f float64, d [2]float64) [2]float64 {
		return [2]float64{o[0] + f*d[0], o[1] + f*d[1]}
	}
	var ts []piperTick
	for k := 1; k <= 4; k++ {
		f := float64(k) / 5
		ts = append(ts,
			piperTick{"Ca", at([2]float64{0, 0}, f, [2]float64{1, 0}), down, 100 * (1 - f)},
			piperTick{"Mg", at([2]float64{0, 0}, f, up), nLeft, 100 * f},
			piperTick{"Cl", at([2]float64{1 + g, 0}, f, [2]float64{1, 0}), down, 100 * f},
			piperTick{"SO4", at([2]float64{2 + g, 0}, f, upL), nRight, 100 * f},
			piperTick{"SO4 + Cl", at(at(dB, 1, upL), f, up), nLeft, 100 * f},
			piperTick{"Ca + Mg", at(at(dB, 1, up), f, upL), nRight, 100 * f},
		)
	}
	return ts
}
