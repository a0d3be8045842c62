package sitereport

import (
	"bytes"
	"image"
	"image/color"
	"image/png"
	"math/rand/v2"
	"testing"
)

// figureLike is white with coloured bands, lines and noise in a corner: the
// mix of flat fills and detail of a drawn figure (invented).
func figureLike(w, h int, opaque bool) *image.RGBA {
	img := image.NewRGBA(image.Rect(0, 0, w, h))
	r := rand.New(rand.NewPCG(5, 6))
	for y := 0; y < h; y++ {
		for x := 0; x < w; x++ {
			c := color.RGBA{255, 255, 255, 255}
			switch {
			case x < w/4 && y < h/4:
				c = color.RGBA{uint8(r.IntN(256)), uint8(r.IntN(256)), uint8(r.IntN(256)), 255}
			case (x+y)%97 == 0:
				c = color.RGBA{20, 40, 60, 255}
			case y > h/2:
				c = color.RGBA{uint8(200 + x%50), uint8(150 + y%100), 90, 255}
			}
			if !opaque && x%7 == 0 {
				c.A = uint8(y % 256)
				c.R, c.G, c.B = min(c.R, c.A), min(c.G, c.A), min(c.B, c.A) // premultiplied
			}
			img.SetRGBA(x, y, c)
		}
	}
	return img
}

func TestEncodeFigurePNGRoundTrip(t *testing.T) {
	for _, opaque := range []bool{true, false} {
		src := figureLike(301, 97, opaque)
		var buf bytes.Buffer
		if err := encodeFigurePNG(&buf, src); err != nil {
			t.Fatal(err)
		}
		got, err := png.Decode(&buf)
		if err != nil {
			t.Fatalf("opaque %v: image/png cannot read it: %v", opaque, err)
		}
		if got.Bounds() != src.Bounds() {
			t.Fatalf("bounds %v, want %v", got.Bounds(), src.Bounds())
		}
		for y := 0; y < 97; y++ {
			for x := 0; x < 301; x++ {
				// Exact when opaque; with alpha, PNG stores colours unpremultiplied,
				// so a channel may come back one level off.
				c, w := color.RGBAModel.Convert(got.At(x, y)).(color.RGBA), src.RGBAAt(x, y)
				tol := 0
				if !opaque {
					tol = 1
				}
				for _, d := range []int{int(c.R) - int(w.R), int(c.G) - int(w.G), int(c.B) - int(w.B), int(c.A) - int(w.A)} {
					if d > tol || -d > tol {
						t.Fatalf("opaque %v: pixel %d,%d = %v, want %v", opaque, x, y, c, w)
					}
				}
			}
		}
	}
}

// On a figure the fixed filter costs little size against image/png's best
// choice per row.
func TestEncodeFigurePNGSize(t *testing.T) {
	src := figureLike(1200, 800, true)
	var ours, std bytes.Buffer
	if err := encodeFigurePNG(&ours, src); err != nil {
		t.Fatal(err)
	}
	if err := (&png.Encoder{CompressionLevel: png.BestSpeed}).Encode(&std, src); err != nil {
		t.Fatal(err)
	}
	if ours.Len() > std.Len()*3/2 {
		t.Errorf("%d bytes, image/png %d", ours.Len(), std.Len())
	}
}

func BenchmarkEncodeFigurePNG(b *testing.B) {
	src := figureLike(2000, 1500, true)
	for b.Loop() {
		var buf bytes.Buffer
		if err := encodeFigurePNG(&buf, src); err != nil {
			b.Fatal(err)
		}
		b.SetBytes(int64(len(src.Pix)))
	}
}

func BenchmarkEncodeImagePNGBestSpeed(b *testing.B) {
	src := figureLike(2000, 1500, true)
	enc := png.Encoder{CompressionLevel: png.BestSpeed}
	for b.Loop() {
		var buf bytes.Buffer
		if err := enc.Encode(&buf, src); err != nil {
			b.Fatal(err)
		}
		b.SetBytes(int64(len(src.Pix)))
	}
}
