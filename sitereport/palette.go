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
// are binned at 5 bits per channel, the 256 most frequent bins (by pixel
// count; popularity quantisation, common practice) become the palette, at
// their mean colour, and every pixel takes the palette colour nearest its
// bin. On figures (flat fills, anti-aliased lines and text, pastel ramps)
// the difference is below what a screen shows.
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
	return popularity(src)
}

// bin5 is the 15-bit bin of a colour (5 bits per channel).
func bin5(p []uint8) int { return int(p[0]>>3)<<10 | int(p[1]>>3)<<5 | int(p[2]>>3) }

func popularity(src *image.RGBA) *image.Paletted {
	b := src.Bounds()
	type acc struct{ n, r, g, b int }
	bins := make([]acc, 1<<15)
	for y := 0; y < b.Dy(); y++ {
		row := src.Pix[y*src.Stride:]
		for x := 0; x < b.Dx(); x++ {
			p := row[4*x : 4*x+4 : 4*x+4]
			a := &bins[bin5(p)]
			a.n++
			a.r += int(p[0])
			a.g += int(p[1])
			a.b += int(p[2])
		}
	}
	var used []int
	for i := range bins {
		if bins[i].n > 0 {
			used = append(used, i)
		}
	}
	sort.SliceStable(used, func(i, j int) bool { return bins[used[i]].n > bins[used[j]].n })
	top := used[:min(256, len(used))]
	pal := make(color.Palette, len(top))
	for i, k := range top {
		a := bins[k]
		pal[i] = color.RGBA{uint8(a.r / a.n), uint8(a.g / a.n), uint8(a.b / a.n), 255}
	}
	// Nearest palette entry per occupied bin, by squared RGB distance.
	index := make([]uint8, 1<<15)
	for _, k := range used {
		a := bins[k]
		r, g, bl := a.r/a.n, a.g/a.n, a.b/a.n
		best, bestD := 0, 1<<30
		for i, c := range pal {
			cc := c.(color.RGBA)
			dr, dg, db := r-int(cc.R), g-int(cc.G), bl-int(cc.B)
			if d := dr*dr + dg*dg + db*db; d < bestD {
				best, bestD = i, d
			}
		}
		index[k] = uint8(best)
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
