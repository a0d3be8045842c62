package figure

import (
	"hash/fnv"
	"image/color"
	"strings"

	"gonum.org/v1/plot/vg"
	"gonum.org/v1/plot/vg/draw"
)

// mineralOrder fixes the style of each mineral: the k-th name takes colour
// k mod 11 of mineralColors (colour-blind-safe qualitative colours), and a
// filled marker and dash pattern that together with the colour are unique
// for the first 55 names. The order puts minerals often shown together (carbonates,
// sulfates, silica) in different colours. A name not listed gets a style
// fixed by a hash of its name, so it too is the same in every figure.
var mineralOrder = []string{
	"calcite", "dolomite", "gypsum", "baryte", "chalcedony", "aragonite", "siderite",
	"quartz", "magnesite", "celestine", "fluorite",
	"anhydrite", "halite", "strontianite", "witherite", "rhodochrosite", "amorphous silica",
}

// mineralColors: the seven darker colours of Okabe & Ito (2008, "Color
// Universal Design"; yellow left out, too light on white) followed by wine,
// olive and indigo of Tol's muted qualitative scheme (Tol 2021, "Colour
// Schemes", SRON/EPS/TN/09-002) and a neutral grey, so that the eleven
// minerals most often shown together all differ in colour.
var mineralColors = []color.NRGBA{
	{R: 0x00, G: 0x72, B: 0xB2, A: 0xff}, // blue
	{R: 0xD5, G: 0x5E, B: 0x00, A: 0xff}, // vermillion
	{R: 0x00, G: 0x9E, B: 0x73, A: 0xff}, // bluish green
	{R: 0xCC, G: 0x79, B: 0xA7, A: 0xff}, // reddish purple
	{R: 0x00, G: 0x00, B: 0x00, A: 0xff}, // black
	{R: 0xE6, G: 0x9F, B: 0x00, A: 0xff}, // orange
	{R: 0x56, G: 0xB4, B: 0xE9, A: 0xff}, // sky blue
	{R: 0x88, G: 0x22, B: 0x55, A: 0xff}, // wine (Tol muted)
	{R: 0x99, G: 0x99, B: 0x33, A: 0xff}, // olive (Tol muted)
	{R: 0x33, G: 0x22, B: 0x88, A: 0xff}, // indigo (Tol muted)
	{R: 0x88, G: 0x88, B: 0x88, A: 0xff}, // grey
}

// Style is how a mineral is drawn in line figures, profiles and bar charts.
type Style struct {
	Color  color.NRGBA
	Marker string // "circle", "triangle", "square", "diamond" or "triangle-down"
	Dashes []vg.Length
}

var glyphNames = map[glyphShape]string{
	glyphCircle: "circle", glyphTriangle: "triangle", glyphSquare: "square", glyphDiamond: "diamond",
	glyphTriangleDown: "triangle-down", glyphCross: "cross", glyphPlus: "plus",
}

// MineralStyle returns the style of a mineral (case and surrounding blanks
// ignored): the same in every figure of every report.
func MineralStyle(name string) Style {
	st := mineralSeriesStyle(name)
	return Style{Color: st.color.(color.NRGBA), Marker: glyphNames[st.glyph], Dashes: st.line.Dashes}
}

func mineralIndex(name string) int {
	n := strings.ToLower(strings.TrimSpace(name))
	for i, m := range mineralOrder {
		if m == n {
			return i
		}
	}
	h := fnv.New32a()
	h.Write([]byte(n))
	return len(mineralOrder) + int(h.Sum32()%32)
}

// mineralGlyphs are the markers of minerals: only shapes with a fill, so
// that profiles can tell rounds apart by marker fill.
var mineralGlyphs = []glyphShape{glyphCircle, glyphTriangle, glyphSquare, glyphDiamond, glyphTriangleDown}

func mineralSeriesStyle(name string) seriesStyle {
	k := mineralIndex(name)
	nc := len(mineralColors)
	// Two names with the same colour (k mod 11) differ in k/11, hence in
	// marker, for the first 55 names.
	c := mineralColors[k%nc]
	return seriesStyle{
		line:  draw.LineStyle{Color: c, Width: 1.4, Dashes: seriesDashes[(k%nc+k/nc)%len(seriesDashes)]},
		color: c,
		glyph: mineralGlyphs[(k%nc+k/nc)%len(mineralGlyphs)],
	}
}

// lighter mixes c with white (f = 0: c, f = 1: white).
func lighter(c color.Color, f float64) color.NRGBA {
	r, g, b, _ := c.RGBA()
	mix := func(v uint32) uint8 { return uint8(float64(v>>8)*(1-f) + 255*f + 0.5) }
	return color.NRGBA{R: mix(r), G: mix(g), B: mix(b), A: 0xff}
}

// withDashes returns st with another dash pattern (e.g. one per sampling
// round) and the same colour and marker.
func (st seriesStyle) withDashes(d []vg.Length) seriesStyle {
	st.line = draw.LineStyle{Color: st.line.Color, Width: st.line.Width, Dashes: d}
	return st
}

// MineralOrder returns a copy of mineralOrder (read-only package data).
func MineralOrder() []string { return append([]string(nil), mineralOrder...) }
