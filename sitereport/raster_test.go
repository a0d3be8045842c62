package sitereport

import (
	"image"
	"image/color"
	"math/rand/v2"
	"testing"
)

func TestShrink(t *testing.T) {
	// A 2x2 black-and-white checker of 1-pixel squares averages to mid grey
	// when halved; the size is the source's over the factor, rounded.
	src := image.NewRGBA(image.Rect(0, 0, 300, 150))
	for y := 0; y < 150; y++ {
		for x := 0; x < 300; x++ {
			v := uint8(255 * ((x + y) % 2))
			src.Set(x, y, color.RGBA{v, v, v, 255})
		}
	}
	for _, c := range []struct {
		factor float64
		w, h   int
	}{{2, 150, 75}, {300.0 / 96, 96, 48}} {
		dst := shrink(src, c.factor)
		if b := dst.Bounds(); b.Dx() != c.w || b.Dy() != c.h {
			t.Errorf("factor %.3f: %v, want %dx%d", c.factor, b, c.w, c.h)
		}
		if c.factor == 2 {
			for _, p := range []image.Point{{0, 0}, {75, 40}, {149, 74}} {
				if r := dst.RGBAAt(p.X, p.Y).R; r < 127 || r > 128 {
					t.Errorf("pixel %v = %d, want 127 or 128", p, r)
				}
			}
		}
	}
}

func TestPalettedExactWhenFewColours(t *testing.T) {
	src := image.NewRGBA(image.Rect(0, 0, 40, 30))
	r := rand.New(rand.NewPCG(3, 4))
	cols := []color.RGBA{{255, 255, 255, 255}, {0, 0, 0, 255}, {200, 100, 50, 255}, {10, 20, 240, 255}}
	for y := 0; y < 30; y++ {
		for x := 0; x < 40; x++ {
			src.SetRGBA(x, y, cols[r.IntN(len(cols))])
		}
	}
	dst := paletted(src)
	if len(dst.Palette) != len(cols) {
		t.Errorf("%d palette entries, want %d", len(dst.Palette), len(cols))
	}
	for y := 0; y < 30; y++ {
		for x := 0; x < 40; x++ {
			if got := color.RGBAModel.Convert(dst.At(x, y)).(color.RGBA); got != src.RGBAAt(x, y) {
				t.Fatalf("pixel %d,%d = %v, want %v", x, y, got, src.RGBAAt(x, y))
			}
		}
	}
}

// A smooth ramp of thousands of colours keeps at most 256, each pixel within
// a few levels of its colour (the 5-bit bins are 8 levels wide).
func TestPalettedRamp(t *testing.T) {
	src := image.NewRGBA(image.Rect(0, 0, 256, 64))
	for y := 0; y < 64; y++ {
		for x := 0; x < 256; x++ {
			src.SetRGBA(x, y, color.RGBA{uint8(x), uint8(255 - x), uint8(4 * y), 255})
		}
	}
	dst := paletted(src)
	if len(dst.Palette) > 256 {
		t.Fatalf("%d colours", len(dst.Palette))
	}
	worst := 0
	for y := 0; y < 64; y++ {
		for x := 0; x < 256; x++ {
			a, b := src.RGBAAt(x, y), color.RGBAModel.Convert(dst.At(x, y)).(color.RGBA)
			for _, d := range []int{int(a.R) - int(b.R), int(a.G) - int(b.G), int(a.B) - int(b.B)} {
				worst = max(worst, d, -d)
			}
		}
	}
	// 16384 distinct colours into 256 entries: an error of a few bins at most.
	if worst > 48 {
		t.Errorf("largest channel error %d", worst)
	}
}
