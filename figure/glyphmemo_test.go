package figure

import (
	"image/color"
	"testing"

	"gonum.org/v1/plot/vg"
)

// A plot of up to glyphMemoAbove glyphs draws every one (nil memo); above,
// a glyph is drawn once per glyphQuantum cell, shape, size and colours:
// again in the same cell it is left out, in the next cell or in another
// colour it is drawn.
func TestGlyphMemo(t *testing.T) {
	if m := newGlyphMemo(glyphMemoAbove); m != nil {
		t.Fatalf("memo for %d glyphs, want none", glyphMemoAbove)
	}
	m := newGlyphMemo(glyphMemoAbove + 1)
	if m == nil {
		t.Fatal("no memo for a plot of many glyphs")
	}
	c := newTestCanvas()
	red := color.NRGBA{R: 255, A: 255}
	at := func(x, y vg.Length) vg.Point { return vg.Point{X: x, Y: y} }
	m.draw(c, glyphCircle, at(10, 10), 2, red, inkColor, 0.4)
	m.draw(c, glyphCircle, at(10+glyphQuantum/4, 10), 2, red, inkColor, 0.4) // same cell
	if len(m) != 1 {
		t.Fatalf("%d glyphs drawn, want 1 for two in one cell", len(m))
	}
	m.draw(c, glyphCircle, at(10+glyphQuantum, 10), 2, red, inkColor, 0.4)            // next cell
	m.draw(c, glyphCircle, at(10, 10), 2, color.NRGBA{B: 255, A: 255}, inkColor, 0.4) // other colour
	m.draw(c, glyphTriangle, at(10, 10), 2, red, inkColor, 0.4)                       // other shape
	if len(m) != 4 {
		t.Errorf("%d glyphs drawn, want 4", len(m))
	}
}
