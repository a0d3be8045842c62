package sitereport

import (
	"image"
	"image/color"
	"sort"
)

// paletted reduces an opaque RGBA image to at most 256 colours for the page
// copy of a figure: a paletted PNG is a third of the bytes per pixel and
// compresses far better than the smooth colour ramps of the maps do in RGB.
// An image of 256 colours or fewer is converted exactly. Otherwise colours
// are binned at 5 bits per channel and the bins grouped into 256 boxes by
// median cut (medianCut); every pixel takes its box's mean colour. On figures
// (flat fills, anti-aliased lines and text, pastel ramps) the difference is
// below what a screen shows.
func paletted(src *image.RGBA) *image.Paletted {
	b := src.Bounds()
	exact := map[uint32]int{}
	for y := b.Min.Y; y < b.Max.Y && len(exact) <= 256; y++ {
		row := src.Pix[(y-b.Min.Y)*src.Stride:]
		for x := 0; x < b.Dx(); x++ {
			p := row[4*x : 4*x+4 : 4*x+4]
			k := uint32(p[0])<<16 | uint32(p[1])<<8 | uint32(p[2])
			if _, ok := exact[k]; !ok {
				exact[k] = len(exact)
				if len(exact) > 256 {
					break
				}
			}
		}
	}
	if len(exact) <= 256 {
		pal := make(color.Palette, len(exact))
		for k, i := range exact {
			pal[i] = color.RGBA{uint8(k >> 16), uint8(k >> 8), uint8(k), 255}
		}
		dst := image.NewPaletted(b, pal)
		for y := b.Min.Y; y < b.Max.Y; y++ {
			row := src.Pix[(y-b.Min.Y)*src.Stride:]
			out := dst.Pix[(y-b.Min.Y)*dst.Stride:]
			for x := 0; x < b.Dx(); x++ {
				p := row[4*x : 4*x+4 : 4*x+4]
				out[x] = uint8(exact[uint32(p[0])<<16|uint32(p[1])<<8|uint32(p[2])])
			}
		}
		return dst
	}
	return medianCut(src)
}

// bin5 is the 15-bit bin of a colour (5 bits per channel).
func bin5(p []uint8) int { return int(p[0]>>3)<<10 | int(p[1]>>3)<<5 | int(p[2]>>3) }

// binStat is an occupied colour bin: its pixel count and channel sums.
type binStat struct{ key, n, r, g, b int }

func (s binStat) mean(c int) int {
	switch c {
	case 0:
		return s.r / s.n
	case 1:
		return s.g / s.n
	}
	return s.b / s.n
}

// medianCut quantises src: the occupied 5-bit bins are split, box by box, at
// the pixel-weighted median of the longest channel of the widest box, until
// there are 256 boxes (Heckbert 1982, "Color image quantization for frame
// buffer display", from memory); each box's mean colour is a palette entry.
func medianCut(src *image.RGBA) *image.Paletted {
	b := src.Bounds()
	bins := make([]binStat, 1<<15)
	for y := 0; y < b.Dy(); y++ {
		row := src.Pix[y*src.Stride:]
		for x := 0; x < b.Dx(); x++ {
			p := row[4*x : 4*x+4 : 4*x+4]
			k := bin5(p)
			a := &bins[k]
			a.key = k
			a.n++
			a.r += int(p[0])
			a.g += int(p[1])
			a.b += int(p[2])
		}
	}
	var used []binStat
	for _, s := range bins {
		if s.n > 0 {
			used = append(used, s)
		}
	}
	boxes := [][]binStat{used}
	for len(boxes) < 256 {
		// The box with the widest channel range (ties: the first) is split.
		bi, bc, bw := -1, 0, 0
		for i, bx := range boxes {
			if len(bx) < 2 {
				continue
			}
			for c := 0; c < 3; c++ {
				lo, hi := 255, 0
				for _, s := range bx {
					m := s.mean(c)
					lo, hi = min(lo, m), max(hi, m)
				}
				if hi-lo > bw {
					bi, bc, bw = i, c, hi-lo
				}
			}
		}
		if bi < 0 {
			break // every box is a single bin
		}
		bx := boxes[bi]
		sort.Slice(bx, func(i, j int) bool { return bx[i].mean(bc) < bx[j].mean(bc) })
		total := 0
		for _, s := range bx {
			total += s.n
		}
		cut, acc := 1, 0
		for i, s := range bx[:len(bx)-1] {
			acc += s.n
			cut = i + 1
			if 2*acc >= total {
				break
			}
		}
		boxes = append(boxes, bx[cut:])
		boxes[bi] = bx[:cut]
	}
	pal := make(color.Palette, len(boxes))
	index := make([]uint8, 1<<15)
	for i, bx := range boxes {
		var n, r, g, bl int
		for _, s := range bx {
			n, r, g, bl = n+s.n, r+s.r, g+s.g, bl+s.b
			index[s.key] = uint8(i)
		}
		pal[i] = color.RGBA{uint8(r / n), uint8(g / n), uint8(bl / n), 255}
	}
	dst := image.NewPaletted(b, pal)
	for y := 0; y < b.Dy(); y++ {
		row := src.Pix[y*src.Stride:]
		out := dst.Pix[y*dst.Stride:]
		for x := 0; x < b.Dx(); x++ {
			out[x] = index[bin5(row[4*x:4*x+4:4*x+4])]
		}
	}
	return dst
}
