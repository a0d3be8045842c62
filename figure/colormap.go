package figure

import (
	"image/color"
	"math"
)

// Diverging is the saturation-index colour scale: dark blue for
// undersaturated water, near-white at SI = 0 and orange-brown for
// supersaturated water, symmetric over [-Limit, +Limit] and clamped outside.
//
// The scale is built in CIE L*a*b* (D65): from the neutral centre
// (L* 97) the lightness falls monotonically (piecewise linearly) on each
// side, to L* 27 at -Limit (blue) and L* 55 at +Limit (orange-brown). Blue against
// orange is the pair that stays apart for red-green colour-blind readers
// (the usual choice in diverging schemes for them, common practice), and the
// 28-unit difference in L* between the ends keeps strong undersaturation
// darker than strong supersaturation in grey-scale print. The supersaturated
// side spans 42 units of L* against 70 for the undersaturated side, so equal
// |SI| on both sides departs from the centre by a similar, not identical,
// amount of lightness (ratio 0.6). In grey-scale, moderate values on the two
// sides can share a grey; the SI = 0 contour drawn on every map separates
// them.
type Diverging struct {
	// Limit is the |SI| mapped to the ends of the scale; values <= 0 or
	// non-finite are taken as 1.
	Limit float64
}

// lab is a colour in CIE L*a*b*.
type lab struct{ L, A, B float64 }

// Control points of the scale, from SI = 0 outwards (t = 0, 0.5, 1).
var (
	labNeutral = lab{97, 0, 1}
	labUnder   = [2]lab{{61, -4, -35}, {27, 9, -47}}
	labSuper   = [2]lab{{78, 17, 50}, {55, 30, 55}}
)

// Neutral is the colour of SI = 0.
func (d Diverging) Neutral() color.NRGBA { return labToSRGB(labNeutral) }

// Color returns the colour for saturation index si. A non-finite si gives a
// fully transparent colour.
func (d Diverging) Color(si float64) color.NRGBA {
	if math.IsNaN(si) {
		return color.NRGBA{}
	}
	lim := d.Limit
	if !(lim > 0) || math.IsInf(lim, 0) {
		lim = 1
	}
	t := si / lim
	if t > 1 {
		t = 1
	}
	if t < -1 {
		t = -1
	}
	side := labSuper
	if t < 0 {
		side = labUnder
		t = -t
	}
	var c lab
	if t <= 0.5 {
		c = mixLab(labNeutral, side[0], t/0.5)
	} else {
		c = mixLab(side[0], side[1], (t-0.5)/0.5)
	}
	return labToSRGB(c)
}

func mixLab(a, b lab, f float64) lab {
	return lab{a.L + (b.L-a.L)*f, a.A + (b.A-a.A)*f, a.B + (b.B-a.B)*f}
}

// labToSRGB converts CIE L*a*b* (D65 white) to 8-bit sRGB, clipping out of
// gamut channels. Formulas: CIE 15:2004 (L*a*b* inverse) and IEC 61966-2-1
// (sRGB matrix and transfer curve).
func labToSRGB(c lab) color.NRGBA {
	fy := (c.L + 16) / 116
	fx := fy + c.A/500
	fz := fy - c.B/200
	finv := func(t float64) float64 {
		const d = 6.0 / 29
		if t > d {
			return t * t * t
		}
		return 3 * d * d * (t - 4.0/29)
	}
	x, y, z := 0.95047*finv(fx), finv(fy), 1.08883*finv(fz)
	r := 3.2406*x - 1.5372*y - 0.4986*z
	g := -0.9689*x + 1.8758*y + 0.0415*z
	b := 0.0557*x - 0.2040*y + 1.0570*z
	return color.NRGBA{R: gammaByte(r), G: gammaByte(g), B: gammaByte(b), A: 0xff}
}

func gammaByte(v float64) uint8 {
	if v <= 0.0031308 {
		v *= 12.92
	} else {
		v = 1.055*math.Pow(v, 1/2.4) - 0.055
	}
	return uint8(math.Round(255 * math.Max(0, math.Min(1, v))))
}

func linearise(u uint8) float64 {
	v := float64(u) / 255
	if v <= 0.04045 {
		return v / 12.92
	}
	return math.Pow((v+0.055)/1.055, 2.4)
}

// relativeLuminance is the CIE Y of an sRGB colour, 0 (black) to 1 (white),
// as defined in IEC 61966-2-1 and used by WCAG 2.x.
func relativeLuminance(c color.Color) float64 {
	n := color.NRGBAModel.Convert(c).(color.NRGBA)
	return 0.2126*linearise(n.R) + 0.7152*linearise(n.G) + 0.0722*linearise(n.B)
}

// lightness is CIE L* of an sRGB colour (0-100).
func lightness(c color.Color) float64 {
	y := relativeLuminance(c)
	if y > 216.0/24389 {
		return 116*math.Cbrt(y) - 16
	}
	return y * 24389.0 / 27
}
