package sitereport

import (
	"bytes"
	"fmt"
	"image"
	"image/color"
	"image/png"

	"gonum.org/v1/plot/vg"
	"gonum.org/v1/plot/vg/draw"
	"gonum.org/v1/plot/vg/vgimg"

	"gwsat.dev/gwsat/figure"
)

// ScreenDPI is the resolution of the figures embedded in index.html. 96 dots
// per inch is the CSS reference pixel (CSS Values and Units Level 3: 1in =
// 96px), so a figure shows on the page at the size it was drawn; the
// full-resolution PNG (figure.PNGDPI) is linked beside it.
const ScreenDPI = 96

// rasters are the two PNG encodings of one figure: the full-resolution file
// and the light copy embedded in the page.
type rasters struct {
	Full, Screen []byte
	W, H         int // pixels of Screen
}

// rasterise draws f once at figure.PNGDPI and returns it encoded at that
// resolution and, shrunk by area averaging, at ScreenDPI. Drawing once and
// shrinking costs a fraction of drawing twice, and the shrunk copy keeps thin
// lines and small text legible. A panic inside the plotting library comes back
// as an error, as figure.Render does.
func rasterise(f figure.Figure, w, h vg.Length) (out rasters, err error) {
	if f == nil {
		return rasters{}, fmt.Errorf("%w: nil figure", figure.ErrNoData)
	}
	if !(w > 0) || !(h > 0) {
		return rasters{}, fmt.Errorf("%w: %v x %v", figure.ErrSize, w, h)
	}
	defer func() {
		if r := recover(); r != nil {
			out, err = rasters{}, fmt.Errorf("figure: drawing failed: %v", r)
		}
	}()
	cv := vgimg.NewWith(vgimg.UseWH(w, h), vgimg.UseDPI(figure.PNGDPI), vgimg.UseBackgroundColor(color.White))
	if err := f.Draw(draw.New(cv)); err != nil {
		return rasters{}, err
	}
	full, ok := cv.Image().(*image.RGBA)
	if !ok {
		return rasters{}, fmt.Errorf("figure: unexpected image type %T", cv.Image())
	}
	// The full-resolution file favours speed (it is linked, not embedded:
	// encodeFigurePNG); the screen copy is embedded, so it is reduced to a
	// palette and compressed well.
	var fb, sb bytes.Buffer
	if err := encodeFigurePNG(&fb, full); err != nil {
		return rasters{}, fmt.Errorf("figure: encoding png: %w", err)
	}
	small := shrink(full, float64(figure.PNGDPI)/ScreenDPI)
	if err := png.Encode(&sb, paletted(small)); err != nil {
		return rasters{}, fmt.Errorf("figure: encoding png: %w", err)
	}
	return rasters{Full: fb.Bytes(), Screen: sb.Bytes(), W: small.Bounds().Dx(), H: small.Bounds().Dy()}, nil
}

// shrink reduces src by factor (> 1) with a box filter: each new pixel is the
// mean of the source pixels whose centres fall inside its footprint.
func shrink(src *image.RGBA, factor float64) *image.RGBA {
	sb := src.Bounds()
	dw := max(1, int(float64(sb.Dx())/factor+0.5))
	dh := max(1, int(float64(sb.Dy())/factor+0.5))
	dst := image.NewRGBA(image.Rect(0, 0, dw, dh))
	// Column ranges are the same for every row: compute them once.
	x0s := make([]int, dw+1)
	for x := 0; x <= dw; x++ {
		x0s[x] = min(sb.Dx(), int(float64(x)*factor+0.5))
	}
	sum := make([]uint32, 4*dw)
	for y := 0; y < dh; y++ {
		y0 := min(sb.Dy(), int(float64(y)*factor+0.5))
		y1 := min(sb.Dy(), int(float64(y+1)*factor+0.5))
		if y1 <= y0 {
			y1 = min(sb.Dy(), y0+1)
			y0 = y1 - 1
		}
		clear(sum)
		for sy := y0; sy < y1; sy++ {
			row := src.Pix[sy*src.Stride : sy*src.Stride+4*sb.Dx()]
			for x := 0; x < dw; x++ {
				s := sum[4*x : 4*x+4 : 4*x+4]
				for sx := x0s[x]; sx < x0s[x+1]; sx++ {
					p := row[4*sx : 4*sx+4 : 4*sx+4]
					s[0] += uint32(p[0])
					s[1] += uint32(p[1])
					s[2] += uint32(p[2])
					s[3] += uint32(p[3])
				}
			}
		}
		out := dst.Pix[y*dst.Stride : y*dst.Stride+4*dw]
		for x := 0; x < dw; x++ {
			n := uint32((y1 - y0) * (x0s[x+1] - x0s[x]))
			if n == 0 {
				continue
			}
			for c := 0; c < 4; c++ {
				out[4*x+c] = uint8((sum[4*x+c] + n/2) / n)
			}
		}
	}
	return dst
}
