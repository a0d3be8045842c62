package figure

import (
	"image/color"
	"math"
	"strconv"
	"strings"

	"gonum.org/v1/plot"
	"gonum.org/v1/plot/font"
	"gonum.org/v1/plot/text"
	"gonum.org/v1/plot/vg"
	"gonum.org/v1/plot/vg/draw"
)

// Type sizes in points, chosen for a figure about 16 x 12 cm printed at
// full size (common practice: 8-10 pt in report figures).
const (
	sizeTitle   = 11
	sizeLabel   = 9.5
	sizeTick    = 8.5
	sizeSmall   = 8
	sizeCaption = 8
)

var (
	sansFont  = font.Font{Typeface: "Liberation", Variant: "Sans"}
	inkColor  = color.NRGBA{R: 0x22, G: 0x22, B: 0x22, A: 0xff}
	greyColor = color.NRGBA{R: 0x66, G: 0x66, B: 0x66, A: 0xff}
	haloColor = color.NRGBA{R: 0xff, G: 0xff, B: 0xff, A: 0xd8}
)

func textStyle(size vg.Length) text.Style {
	return text.Style{
		Color:   inkColor,
		Font:    font.From(sansFont, size),
		Handler: plot.DefaultTextHandler,
	}
}

func boldStyle(size vg.Length) text.Style {
	// Regular weight: vgpdf v0.17 fails on bold Liberation Sans ("undefined
	// font"), so titles differ by size only.
	return textStyle(size)
}

// newPlot returns a plot in the house style: sans-serif type at report
// sizes, no title (figures draw their own), dark axes.
func newPlot() *plot.Plot {
	p := plot.New()
	for _, a := range []*plot.Axis{&p.X, &p.Y} {
		// Keep the axis' own alignments and rotation; set type and colour.
		a.Label.TextStyle.Font = font.From(sansFont, sizeLabel)
		a.Label.TextStyle.Color = inkColor
		a.Tick.Label.Font = font.From(sansFont, sizeTick)
		a.Tick.Label.Color = inkColor
		a.Color = inkColor
		a.Tick.Color = inkColor
		a.LineStyle.Color = inkColor
		a.Tick.LineStyle.Color = inkColor
	}
	p.Legend.TextStyle.Font = font.From(sansFont, sizeSmall)
	p.Title.TextStyle.Font = font.From(sansFont, sizeLabel)
	p.Title.TextStyle.Color = inkColor
	p.BackgroundColor = color.Transparent
	return p
}

func finite(v ...float64) bool {
	for _, x := range v {
		if math.IsNaN(x) || math.IsInf(x, 0) {
			return false
		}
	}
	return true
}

// niceNumber returns a number 1, 2 or 5 times a power of ten that is not
// greater than v (v > 0).
func niceFloor(v float64) float64 {
	if !(v > 0) || math.IsInf(v, 0) {
		return 1
	}
	e := math.Floor(math.Log10(v))
	base := math.Pow(10, e)
	f := v / base
	switch {
	case f >= 5:
		return 5 * base
	case f >= 2:
		return 2 * base
	}
	return base
}

// formatNum prints v with at most prec significant digits, no exponent for
// everyday magnitudes, and a true minus sign.
func formatNum(v float64, prec int) string {
	if v == 0 {
		return "0"
	}
	s := strconv.FormatFloat(v, 'g', prec, 64)
	if a := math.Abs(v); a >= 1e-3 && a < 1e6 && strings.ContainsAny(s, "e") {
		s = strconv.FormatFloat(v, 'f', -1, 64)
	}
	return strings.Replace(s, "-", "\u2212", 1)
}

// formatTick prints a tick value for the step used between ticks.
func formatTick(v, step float64) string {
	dec := 0
	if step > 0 && step < 1 {
		dec = int(math.Ceil(-math.Log10(step) - 1e-9))
		if math.Abs(step*math.Pow(10, float64(dec))-math.Round(step*math.Pow(10, float64(dec)))) > 1e-6 {
			dec++
		}
	}
	if math.Abs(v) < step*1e-9 {
		v = 0
	}
	s := strconv.FormatFloat(v, 'f', dec, 64)
	return strings.Replace(s, "-", "\u2212", 1)
}

// wrapText breaks s into lines no wider than w in style sty.
func wrapText(sty text.Style, s string, w vg.Length) []string {
	var lines []string
	for _, para := range strings.Split(s, "\n") {
		words := strings.Fields(para)
		line := ""
		for _, wd := range words {
			try := wd
			if line != "" {
				try = line + " " + wd
			}
			if line != "" && sty.Width(try) > w {
				lines = append(lines, line)
				line = wd
				continue
			}
			line = try
		}
		if line != "" {
			lines = append(lines, line)
		}
	}
	return lines
}

func lineHeight(sty text.Style) vg.Length {
	e := sty.FontExtents()
	return e.Height * 1.05
}

// drawTextBlock draws lines top-down starting at the top-left (x, top),
// returning the height used. If centred, x is the centre.
func drawTextBlock(c draw.Canvas, sty text.Style, lines []string, x, top vg.Length, centred bool) vg.Length {
	lh := lineHeight(sty)
	sty.YAlign = draw.YTop
	sty.XAlign = draw.XLeft
	if centred {
		sty.XAlign = draw.XCenter
	}
	for i, l := range lines {
		c.FillText(sty, vg.Point{X: x, Y: top - vg.Length(i)*lh}, l)
	}
	return vg.Length(len(lines)) * lh
}

// page splits a canvas into a title strip, a body, a legend strip and a
// caption, laid out top to bottom.
type page struct {
	title, caption []string
	legend         []legendEntry
	legendNote     string
}

const pageMargin = 4 // points

func (pg page) layout(c draw.Canvas) (body draw.Canvas, legendTop vg.Length, captionTop vg.Length) {
	w := c.Max.X - c.Min.X - 2*pageMargin
	top := c.Max.Y - pageMargin
	if len(pg.title) > 0 {
		top -= vg.Length(len(pg.title))*lineHeight(boldStyle(sizeTitle)) + 3
	}
	bottom := c.Min.Y + pageMargin
	capH := vg.Length(len(pg.caption)) * lineHeight(textStyle(sizeCaption))
	captionTop = bottom + capH
	legH := legendHeight(pg.legend, pg.legendNote, w)
	legendTop = captionTop + legH
	if capH > 0 {
		legendTop += 3
	}
	if legH > 0 {
		legendTop += 2
	}
	body = c
	body.Min.X += pageMargin
	body.Max.X -= pageMargin
	body.Max.Y = top
	body.Min.Y = legendTop + 2
	return body, legendTop, captionTop
}

func (pg page) draw(c draw.Canvas, legendTop, captionTop vg.Length) {
	w := c.Max.X - c.Min.X - 2*pageMargin
	cx := (c.Min.X + c.Max.X) / 2
	if len(pg.title) > 0 {
		drawTextBlock(c, boldStyle(sizeTitle), pg.title, cx, c.Max.Y-pageMargin, true)
	}
	drawLegend(c, pg.legend, pg.legendNote, c.Min.X+pageMargin, legendTop, w)
	drawTextBlock(c, textStyle(sizeCaption), pg.caption, c.Min.X+pageMargin, captionTop, false)
}

func newPage(c draw.Canvas, title, caption string, legend []legendEntry, note string) page {
	w := c.Max.X - c.Min.X - 2*pageMargin
	return page{
		title:      wrapText(boldStyle(sizeTitle), title, w),
		caption:    wrapText(textStyle(sizeCaption), caption, w),
		legend:     legend,
		legendNote: note,
	}
}

// Legend strip: entries laid out left to right, wrapping, under the body.

type legendKind int

const (
	legendLine legendKind = iota
	legendPatch
	legendGlyph
)

type legendEntry struct {
	label string
	kind  legendKind
	line  draw.LineStyle
	halo  bool // draw a white halo under the line
	fill  color.Color
	glyph glyphShape
	// glyph fill colour is fill; outline is inkColor.
	withGlyph bool // line with a glyph on it
	cross     bool // glyph with a cross inside (well without a value)
	hatch     bool // patch with diagonal hatching
}

const legendSwatch = 20

func legendItemWidth(e legendEntry) vg.Length {
	return legendSwatch + 4 + textStyle(sizeSmall).Width(e.label) + 12
}

func legendRows(entries []legendEntry, note string, w vg.Length) [][]int {
	var rows [][]int
	var cur []int
	var x vg.Length
	for i, e := range entries {
		iw := legendItemWidth(e)
		if len(cur) > 0 && x+iw > w {
			rows = append(rows, cur)
			cur, x = nil, 0
		}
		cur = append(cur, i)
		x += iw
	}
	if len(cur) > 0 {
		rows = append(rows, cur)
	}
	if note != "" {
		rows = append(rows, nil)
	}
	return rows
}

func legendHeight(entries []legendEntry, note string, w vg.Length) vg.Length {
	return vg.Length(len(legendRows(entries, note, w))) * lineHeight(textStyle(sizeSmall)) * 1.25
}

func drawLegend(c draw.Canvas, entries []legendEntry, note string, x0, top, w vg.Length) {
	sty := textStyle(sizeSmall)
	rh := lineHeight(sty) * 1.25
	rows := legendRows(entries, note, w)
	for r, row := range rows {
		yc := top - vg.Length(r)*rh - rh/2
		if row == nil && note != "" {
			s := sty
			s.Color = greyColor
			s.YAlign = draw.YCenter
			c.FillText(s, vg.Point{X: x0, Y: yc}, note)
			continue
		}
		// centre the row
		var rw vg.Length
		for _, i := range row {
			rw += legendItemWidth(entries[i])
		}
		x := x0 + (w-rw+12)/2
		if x < x0 {
			x = x0
		}
		for _, i := range row {
			e := entries[i]
			drawSwatch(c, e, x, yc)
			s := sty
			s.YAlign = draw.YCenter
			c.FillText(s, vg.Point{X: x + legendSwatch + 4, Y: yc}, e.label)
			x += legendItemWidth(e)
		}
	}
}

func drawSwatch(c draw.Canvas, e legendEntry, x, yc vg.Length) {
	switch e.kind {
	case legendPatch:
		h := vg.Length(7)
		pts := []vg.Point{{X: x, Y: yc - h/2}, {X: x + legendSwatch, Y: yc - h/2}, {X: x + legendSwatch, Y: yc + h/2}, {X: x, Y: yc + h/2}}
		c.FillPolygon(e.fill, pts)
		if e.hatch {
			hatch(c, vg.Rectangle{Min: pts[0], Max: pts[2]})
		}
		if e.line.Width > 0 {
			c.StrokeLines(e.line, append(pts, pts[0]))
		}
	case legendLine:
		if e.halo {
			h := e.line
			h.Width += 2
			h.Color = color.White
			h.Dashes = nil
			c.StrokeLine2(h, x, yc, x+legendSwatch, yc)
		}
		c.StrokeLine2(e.line, x, yc, x+legendSwatch, yc)
		if e.withGlyph {
			drawGlyph(c, e.glyph, vg.Point{X: x + legendSwatch/2, Y: yc}, 3, e.fill, inkColor, 0.5)
		}
	case legendGlyph:
		drawGlyph(c, e.glyph, vg.Point{X: x + legendSwatch/2, Y: yc}, 3.5, e.fill, inkColor, 0.6)
		if e.cross {
			drawGlyph(c, glyphCross, vg.Point{X: x + legendSwatch/2, Y: yc}, 3.5*0.55, nil, inkColor, 0.35)
		}
	}
}

// Glyphs with a fill and an outline.

type glyphShape int

const (
	glyphCircle glyphShape = iota
	glyphTriangle
	glyphSquare
	glyphDiamond
	glyphTriangleDown
	glyphCross
	glyphPlus
)

func glyphPath(shape glyphShape, pt vg.Point, r vg.Length) (p vg.Path, fillable bool) {
	switch shape {
	case glyphTriangle, glyphTriangleDown:
		s := vg.Length(1)
		if shape == glyphTriangleDown {
			s = -1
		}
		r *= 1.25
		p.Move(vg.Point{X: pt.X, Y: pt.Y + s*r})
		p.Line(vg.Point{X: pt.X + r*0.866, Y: pt.Y - s*r*0.5})
		p.Line(vg.Point{X: pt.X - r*0.866, Y: pt.Y - s*r*0.5})
		p.Close()
		return p, true
	case glyphSquare:
		r *= 0.9
		p.Move(vg.Point{X: pt.X - r, Y: pt.Y - r})
		p.Line(vg.Point{X: pt.X + r, Y: pt.Y - r})
		p.Line(vg.Point{X: pt.X + r, Y: pt.Y + r})
		p.Line(vg.Point{X: pt.X - r, Y: pt.Y + r})
		p.Close()
		return p, true
	case glyphDiamond:
		r *= 1.2
		p.Move(vg.Point{X: pt.X, Y: pt.Y + r})
		p.Line(vg.Point{X: pt.X + r, Y: pt.Y})
		p.Line(vg.Point{X: pt.X, Y: pt.Y - r})
		p.Line(vg.Point{X: pt.X - r, Y: pt.Y})
		p.Close()
		return p, true
	case glyphCross:
		p.Move(vg.Point{X: pt.X - r, Y: pt.Y - r})
		p.Line(vg.Point{X: pt.X + r, Y: pt.Y + r})
		p.Move(vg.Point{X: pt.X - r, Y: pt.Y + r})
		p.Line(vg.Point{X: pt.X + r, Y: pt.Y - r})
		return p, false
	case glyphPlus:
		p.Move(vg.Point{X: pt.X - r, Y: pt.Y})
		p.Line(vg.Point{X: pt.X + r, Y: pt.Y})
		p.Move(vg.Point{X: pt.X, Y: pt.Y - r})
		p.Line(vg.Point{X: pt.X, Y: pt.Y + r})
		return p, false
	}
	p.Move(vg.Point{X: pt.X + r, Y: pt.Y})
	p.Arc(pt, r, 0, 2*math.Pi)
	p.Close()
	return p, true
}

func drawGlyph(c draw.Canvas, shape glyphShape, pt vg.Point, r vg.Length, fill, outline color.Color, width vg.Length) {
	p, fillable := glyphPath(shape, pt, r)
	if fillable && fill != nil {
		c.SetColor(fill)
		c.Fill(p)
	}
	if !fillable {
		width *= 2.2
		if fill != nil {
			outline = fill
		}
	}
	c.SetLineDash(nil, 0)
	c.SetLineWidth(width)
	c.SetColor(outline)
	c.Stroke(p)
}

// Series styles: colour AND dash AND marker differ, so that lines stay apart
// for colour-blind readers and in grey-scale print. Colours are the
// colour-blind-safe set of Okabe & Ito (2008, "Color Universal Design"),
// without yellow, which is too light on white.
var seriesColors = []color.NRGBA{
	{R: 0x00, G: 0x72, B: 0xB2, A: 0xff}, // blue
	{R: 0xD5, G: 0x5E, B: 0x00, A: 0xff}, // vermillion
	{R: 0x00, G: 0x9E, B: 0x73, A: 0xff}, // bluish green
	{R: 0xCC, G: 0x79, B: 0xA7, A: 0xff}, // reddish purple
	{R: 0x00, G: 0x00, B: 0x00, A: 0xff}, // black
	{R: 0xE6, G: 0x9F, B: 0x00, A: 0xff}, // orange
	{R: 0x56, G: 0xB4, B: 0xE9, A: 0xff}, // sky blue
}

var seriesDashes = [][]vg.Length{
	nil,
	{6, 3},
	{1.5, 2.5},
	{7, 2.5, 1.5, 2.5},
	{12, 3},
	{3, 3},
	{7, 2, 1.5, 2, 1.5, 2},
}

var seriesGlyphs = []glyphShape{glyphCircle, glyphTriangle, glyphSquare, glyphDiamond, glyphTriangleDown, glyphCross, glyphPlus}

type seriesStyle struct {
	line  draw.LineStyle
	color color.Color
	glyph glyphShape
}

func styleFor(i int) seriesStyle {
	c := seriesColors[i%len(seriesColors)]
	// Colours cycle every 7, dashes every 7 but shifted after a full cycle so
	// that combinations do not repeat for 49 series.
	d := seriesDashes[(i+i/len(seriesColors))%len(seriesDashes)]
	g := seriesGlyphs[(i+2*(i/len(seriesColors)))%len(seriesGlyphs)]
	return seriesStyle{
		line:  draw.LineStyle{Color: c, Width: 1.4, Dashes: d},
		color: c,
		glyph: g,
	}
}

func (s seriesStyle) legend(label string) legendEntry {
	return legendEntry{label: label, kind: legendLine, line: s.line, withGlyph: true, fill: s.color, glyph: s.glyph}
}

// niceTicks places n+1 or fewer (but at least about n/2) labelled ticks at 1, 2, 2.5 or 5 times a power
// of ten, labelled without spurious decimals, with unlabelled minor ticks
// halfway.
type niceTicks struct{ n int }

func (t niceTicks) Ticks(min, max float64) []plot.Tick {
	n := t.n
	if n < 2 {
		n = 5
	}
	if !(max > min) {
		return nil
	}
	raw := (max - min) / float64(n+1)
	e := math.Floor(math.Log10(raw))
	base := math.Pow(10, e)
	step := 10 * base
	for _, m := range []float64{1, 2, 2.5, 5, 10} {
		if m*base >= raw {
			step = m * base
			break
		}
	}
	var ts []plot.Tick
	first := math.Ceil(min/step-1e-9) * step
	for v := first - step/2; v <= max+step*1e-9; v += step / 2 {
		if v < min-step*1e-9 {
			continue
		}
		k := math.Round((v - first) / (step / 2))
		if int(k)%2 == 0 {
			ts = append(ts, plot.Tick{Value: v, Label: formatTick(v, step)})
		} else {
			ts = append(ts, plot.Tick{Value: v})
		}
	}
	return ts
}

// glyphQuantum is the grid on which glyphs are taken as drawn at the same
// place: a quarter point, about one pixel at PNGDPI. Thousands of samples of
// one well and event land there, and drawing each again adds nothing a
// reader can see but costs the time of a glyph.
const glyphQuantum = 0.25

// glyphMemoAbove is the number of glyphs of a plot above which glyphMemo
// leaves out glyphs drawn again: a plot of fewer draws every one, exactly
// as before.
const glyphMemoAbove = 500

// glyphMemo remembers the glyphs drawn on one plot, so that a glyph of the
// same shape, size and colours in the same glyphQuantum cell as one already
// drawn is left out. The nil memo draws every glyph.
type glyphMemo map[glyphKey]struct{}

// newGlyphMemo returns a memo for a plot of n glyphs: nil (every glyph
// drawn) up to glyphMemoAbove.
func newGlyphMemo(n int) glyphMemo {
	if n <= glyphMemoAbove {
		return nil
	}
	return glyphMemo{}
}

type glyphKey struct {
	x, y          int64
	shape         glyphShape
	r, width      vg.Length
	fill, outline color.Color
}

// draw is drawGlyph unless the same glyph is already in pt's cell.
func (m glyphMemo) draw(c draw.Canvas, shape glyphShape, pt vg.Point, r vg.Length, fill, outline color.Color, width vg.Length) {
	if m == nil {
		drawGlyph(c, shape, pt, r, fill, outline, width)
		return
	}
	k := glyphKey{x: int64(math.Floor(float64(pt.X) / glyphQuantum)), y: int64(math.Floor(float64(pt.Y) / glyphQuantum)),
		shape: shape, r: r, width: width, fill: fill, outline: outline}
	if _, ok := m[k]; ok {
		return
	}
	m[k] = struct{}{}
	drawGlyph(c, shape, pt, r, fill, outline, width)
}
