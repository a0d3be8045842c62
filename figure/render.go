package figure

import (
	"bytes"
	"errors"
	"fmt"
	"image"
	"image/color"
	"image/png"
	"io"
	"math"
	"strings"

	"gonum.org/v1/plot/font"
	"gonum.org/v1/plot/vg"
	"gonum.org/v1/plot/vg/draw"
	"gonum.org/v1/plot/vg/vgimg"
	"gonum.org/v1/plot/vg/vgpdf"
	"gonum.org/v1/plot/vg/vgsvg"
)

// Errors returned by the package.
var (
	// ErrNoData reports a figure with nothing to draw.
	ErrNoData = errors.New("figure: no data to draw")
	// ErrFormat reports an output format other than png, svg or pdf.
	ErrFormat = errors.New("figure: unknown output format")
	// ErrSize reports a non-positive or non-finite page size.
	ErrSize = errors.New("figure: invalid figure size")
	// ErrInput reports malformed input (mismatched lengths, bad grid shape).
	ErrInput = errors.New("figure: invalid input")
)

// PNGDPI is the resolution of rendered PNG images, in dots per inch.
const PNGDPI = 300

// Figure is anything that can draw itself onto a canvas. The figure types of
// this package (SIMap, DepthProfile, Curves, Bars) implement it, and so does
// the result of Panels. Draw returns ErrNoData when there is nothing to draw.
type Figure interface {
	Draw(c draw.Canvas) error
}

// FigureFunc adapts a plain function to a Figure, for example to draw a
// *plot.Plot: FigureFunc(func(c draw.Canvas) error { p.Draw(c); return nil }).
type FigureFunc func(c draw.Canvas) error

// Draw calls f(c).
func (f FigureFunc) Draw(c draw.Canvas) error { return f(c) }

// Render draws f on a page of the given size and returns the encoded bytes
// in format "png" (PNGDPI dots per inch, so width*300/72 pixels across),
// "svg" (fonts embedded) or "pdf" (fonts embedded). A panic inside the
// plotting library is recovered and returned as an error; no partial output
// is returned with an error.
func Render(f Figure, format string, width, height vg.Length) (out []byte, err error) {
	if f == nil {
		return nil, fmt.Errorf("%w: nil figure", ErrNoData)
	}
	if !(width > 0) || !(height > 0) || math.IsInf(float64(width), 0) || math.IsInf(float64(height), 0) {
		return nil, fmt.Errorf("%w: %v x %v", ErrSize, width, height)
	}
	defer func() {
		if r := recover(); r != nil {
			out = nil
			err = fmt.Errorf("figure: drawing failed: %v", r)
		}
	}()
	var cw vg.CanvasWriterTo
	switch strings.ToLower(format) {
	case "png":
		cw = fastPNG{vgimg.NewWith(vgimg.UseWH(width, height), vgimg.UseDPI(PNGDPI))}
	case "svg":
		cw = vgsvg.NewWith(vgsvg.UseWH(width, height), vgsvg.EmbedFonts(true))
	case "pdf":
		pc := vgpdf.New(width, height)
		pc.EmbedFonts(true)
		cw = pdfCanvas{pc}
	default:
		return nil, fmt.Errorf("%w: %q (want png, svg or pdf)", ErrFormat, format)
	}
	dc := draw.New(cw)
	dc.FillPolygon(color.White, []vg.Point{
		{X: dc.Min.X, Y: dc.Min.Y}, {X: dc.Max.X, Y: dc.Min.Y},
		{X: dc.Max.X, Y: dc.Max.Y}, {X: dc.Min.X, Y: dc.Max.Y},
	})
	if err := f.Draw(dc); err != nil {
		return nil, err
	}
	var buf bytes.Buffer
	if _, err := cw.WriteTo(&buf); err != nil {
		return nil, fmt.Errorf("figure: encoding %s: %w", format, err)
	}
	return buf.Bytes(), nil
}

// fastPNG encodes with zlib's fastest level: a report figure at 300 dpi
// encodes about twice as fast as at the default level, for files a little
// larger (measured with BenchmarkRenderSIMapsThreePanelsPNG).
type fastPNG struct{ *vgimg.Canvas }

func (c fastPNG) WriteTo(w io.Writer) (int64, error) {
	cw := &countWriter{w: w}
	err := (&png.Encoder{CompressionLevel: png.BestSpeed}).Encode(cw, c.Image())
	return cw.n, err
}

type countWriter struct {
	w io.Writer
	n int64
}

func (c *countWriter) Write(p []byte) (int, error) {
	n, err := c.w.Write(p)
	c.n += int64(n)
	return n, err
}

// Panels tiles figs on one page, cols to a row (cols < 1 means one row), in
// reading order. Empty slots stay blank. The returned Figure fails with the
// first panel's error, naming the panel.
func Panels(figs []Figure, cols int) Figure {
	return panels{figs: figs, cols: cols}
}

type panels struct {
	figs []Figure
	cols int
}

func (ps panels) Draw(c draw.Canvas) error {
	n := len(ps.figs)
	if n == 0 {
		return fmt.Errorf("%w: no panels", ErrNoData)
	}
	cols := ps.cols
	if cols < 1 || cols > n {
		cols = n
	}
	rows := (n + cols - 1) / cols
	t := draw.Tiles{Rows: rows, Cols: cols, PadX: 0.3 * vg.Centimeter, PadY: 0.3 * vg.Centimeter}
	for i, f := range ps.figs {
		if f == nil {
			continue
		}
		if err := f.Draw(t.At(c, i%cols, i/cols)); err != nil {
			return fmt.Errorf("panel %d: %w", i+1, err)
		}
	}
	return nil
}

// pdfCanvas works around two limits of the PDF backend of gonum/plot
// v0.17, seen by rendering the same figure to PNG and PDF and reading the
// PDF back: its DrawImage places images upside down (the surface and colour
// bar of a map came out flipped north-south), and it embeds fonts encoded in
// code page 1252 but writes strings as UTF-8 bytes, so "±" came out as
// "Â±". Images are therefore flipped before drawing, and text is converted
// to code page 1252 (pdfText).
type pdfCanvas struct{ *vgpdf.Canvas }

// SetColor lays a translucent colour over white: the PDF backend takes
// the premultiplied components as the colour and drops alpha, so a white
// label halo at 85 % opacity came out mid-grey. Over white is what the
// PNG shows wherever the halo lies on paper.
func (c pdfCanvas) SetColor(col color.Color) {
	if col == nil {
		c.Canvas.SetColor(col)
		return
	}
	r, g, b, a := col.RGBA()
	if a == 0xffff {
		c.Canvas.SetColor(col)
		return
	}
	over := func(v uint32) uint8 { return uint8((v + (0xffff - a)) >> 8) }
	c.Canvas.SetColor(color.NRGBA{R: over(r), G: over(g), B: over(b), A: 0xff})
}

func (c pdfCanvas) DrawImage(rect vg.Rectangle, img image.Image) {
	c.Canvas.DrawImage(rect, flipVertical(img))
}

func (c pdfCanvas) FillString(f font.Face, pt vg.Point, text string) {
	c.Canvas.FillString(f, pt, pdfText(text))
}

// cp1252 maps the characters our figures use outside Latin-1 to code page
// 1252 (Microsoft's published table); the minus and "almost equal" signs,
// which it lacks, become "-" and "~".
var cp1252 = map[rune]byte{
	'\u2212': '-', '\u2248': '~', '\u2013': 0x96, '\u2014': 0x97, '\u2026': 0x85,
	'\u2018': 0x91, '\u2019': 0x92, '\u201c': 0x93, '\u201d': 0x94, '\u2022': 0x95, '\u20ac': 0x80,
}

// pdfText converts UTF-8 text to code page 1252 bytes: ASCII and Latin-1
// (U+00A0-U+00FF, identical in both) as they are, the characters of cp1252
// by table, anything else as "?".
func pdfText(s string) string {
	b := make([]byte, 0, len(s))
	for _, r := range s {
		switch {
		case r < 0x80 || (r >= 0xa0 && r <= 0xff):
			b = append(b, byte(r))
		case cp1252[r] != 0:
			b = append(b, cp1252[r])
		default:
			b = append(b, '?')
		}
	}
	return string(b)
}

// flipVertical returns img mirrored top to bottom.
func flipVertical(img image.Image) image.Image {
	b := img.Bounds()
	out := image.NewNRGBA(image.Rect(0, 0, b.Dx(), b.Dy()))
	for y := 0; y < b.Dy(); y++ {
		for x := 0; x < b.Dx(); x++ {
			out.Set(x, b.Dy()-1-y, img.At(b.Min.X+x, b.Min.Y+y))
		}
	}
	return out
}
