package figure

import (
	"image"
	"image/color"
	"testing"
)

// The PDF backend draws images upside down; flipVertical undoes it. A
// two-row image must come back with its rows swapped and nothing else
// changed.
func TestFlipVertical(t *testing.T) {
	img := image.NewNRGBA(image.Rect(0, 0, 3, 2))
	top, bottom := color.NRGBA{R: 255, A: 255}, color.NRGBA{B: 255, A: 255}
	for x := 0; x < 3; x++ {
		img.SetNRGBA(x, 0, top)
		img.SetNRGBA(x, 1, bottom)
	}
	f := flipVertical(img)
	if f.Bounds().Dx() != 3 || f.Bounds().Dy() != 2 {
		t.Fatalf("bounds %v", f.Bounds())
	}
	for x := 0; x < 3; x++ {
		if color.NRGBAModel.Convert(f.At(x, 0)) != bottom || color.NRGBAModel.Convert(f.At(x, 1)) != top {
			t.Fatalf("column %d not flipped: %v %v", x, f.At(x, 0), f.At(x, 1))
		}
	}
}

// Text for the PDF fonts is code page 1252: "±" is the single byte 0xB1
// and "°" 0xB0 (as in Latin-1), the en dash 0x96 (Microsoft's cp1252
// table), and the minus and "almost equal" signs, which cp1252 lacks,
// become "-" and "~".
func TestPDFText(t *testing.T) {
	got := pdfText("\u22120.5 \u2248 1 km, \u00b10.5 \u00b0C \u2013 x \u4e00")
	want := "-0.5 ~ 1 km, \xb10.5 \xb0C \x96 x ?"
	if got != want {
		t.Errorf("got %q, want %q", got, want)
	}
}
