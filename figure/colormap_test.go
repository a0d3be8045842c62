package figure

import (
	"image/color"
	"math"
	"testing"
)

// CIE L*a*b* of sRGB primaries and white (D65), as tabulated in colour
// science references (e.g. Lindbloom's calculator; from memory): red
// (53.24, 80.09, 67.20), green (87.73, -86.18, 83.18), blue
// (32.30, 79.19, -107.86), white (100, 0, 0).
func TestLabToSRGB(t *testing.T) {
	cases := []struct {
		in   lab
		want color.NRGBA
	}{
		{lab{53.24, 80.09, 67.20}, color.NRGBA{255, 0, 0, 255}},
		{lab{87.73, -86.18, 83.18}, color.NRGBA{0, 255, 0, 255}},
		{lab{32.30, 79.19, -107.86}, color.NRGBA{0, 0, 255, 255}},
		{lab{100, 0, 0}, color.NRGBA{255, 255, 255, 255}},
		{lab{0, 0, 0}, color.NRGBA{0, 0, 0, 255}},
	}
	for _, c := range cases {
		got := labToSRGB(c.in)
		for i, pair := range [][2]uint8{{got.R, c.want.R}, {got.G, c.want.G}, {got.B, c.want.B}} {
			if d := int(pair[0]) - int(pair[1]); d < -2 || d > 2 {
				t.Errorf("labToSRGB(%v) channel %d = %d, want %d ± 2", c.in, i, pair[0], pair[1])
			}
		}
	}
}

// WCAG 2.x relative luminance: #767676 on white has a contrast ratio of
// 4.54:1 (the commonly quoted darkest-grey-passing-AA example; from
// memory), contrast = (1 + 0.05) / (Y + 0.05).
func TestRelativeLuminance(t *testing.T) {
	y := relativeLuminance(color.NRGBA{0x76, 0x76, 0x76, 0xff})
	if ratio := 1.05 / (y + 0.05); math.Abs(ratio-4.54) > 0.01 {
		t.Errorf("contrast of #767676 on white = %.3f, want 4.54", ratio)
	}
	if l := lightness(color.White); math.Abs(l-100) > 0.01 {
		t.Errorf("L* of white = %v", l)
	}
}

func TestDivergingProperties(t *testing.T) {
	for _, lim := range []float64{0.5, 1, 2.5} {
		d := Diverging{Limit: lim}
		if d.Color(0) != d.Neutral() {
			t.Errorf("limit %v: Color(0) = %v, want neutral %v", lim, d.Color(0), d.Neutral())
		}
		l0 := lightness(d.Neutral())
		if l0 < 95 {
			t.Errorf("neutral L* = %.1f, want a near-white centre (>= 95)", l0)
		}
		// Monotonic lightness on each side: darker as |SI| grows.
		prevU, prevS := l0, l0
		for k := 1; k <= 50; k++ {
			v := lim * float64(k) / 50
			lu, ls := lightness(d.Color(-v)), lightness(d.Color(v))
			if lu > prevU+0.5 || ls > prevS+0.5 {
				t.Errorf("limit %v: lightness not monotonic at |SI| = %v (%.1f, %.1f after %.1f, %.1f)", lim, v, lu, ls, prevU, prevS)
			}
			prevU, prevS = lu, ls
		}
		// The ends differ in lightness by at least 20 units of L*, so that
		// strong under- and supersaturation stay apart in grey-scale print.
		lu, ls := lightness(d.Color(-lim)), lightness(d.Color(lim))
		if ls-lu < 20 {
			t.Errorf("limit %v: end L* %.1f (under) and %.1f (super) differ by less than 20", lim, lu, ls)
		}
		// Symmetric values depart from the neutral by similar lightness:
		// the supersaturated side's departure is 0.5 to 1 times the other's.
		for _, f := range []float64{0.25, 0.5, 0.75, 1} {
			du := l0 - lightness(d.Color(-f*lim))
			ds := l0 - lightness(d.Color(f*lim))
			if r := ds / du; r < 0.5 || r > 1 {
				t.Errorf("limit %v, |SI| = %v: lightness departures %.1f (under) %.1f (super), ratio %.2f outside [0.5, 1]", lim, f*lim, du, ds, r)
			}
		}
		// Clamped beyond the limit.
		if d.Color(10*lim) != d.Color(lim) || d.Color(-10*lim) != d.Color(-lim) {
			t.Errorf("limit %v: not clamped", lim)
		}
	}
	if c := (Diverging{Limit: 1}).Color(math.NaN()); c.A != 0 {
		t.Errorf("NaN colour %v, want transparent", c)
	}
	if (Diverging{}).Color(1) != (Diverging{Limit: 1}).Color(1) {
		t.Error("zero limit should act as 1")
	}
}

// Colour-vision-deficiency simulation with the severity-1.0 matrices of
// Machado, Oliveira & Fernandes (2009), "A physiologically-based model for
// simulation of color vision deficiency", IEEE TVCG 15(6) (from memory),
// applied in linear RGB. Under the simulation, undersaturated colours stay
// bluish (B > R) and supersaturated colours stay reddish-yellow (R > B), by
// a clear margin, so the two sides keep distinct hues.
func TestDivergingColourBlindSafe(t *testing.T) {
	mats := map[string][3][3]float64{
		"protanopia":   {{0.152286, 1.052583, -0.204868}, {0.114503, 0.786281, 0.099216}, {-0.003882, -0.048116, 1.051998}},
		"deuteranopia": {{0.367322, 0.860646, -0.227968}, {0.280085, 0.672501, 0.047413}, {-0.011820, 0.042940, 0.968881}},
	}
	d := Diverging{Limit: 1}
	for name, m := range mats {
		for _, v := range []float64{0.3, 0.6, 1} {
			for _, sign := range []float64{-1, 1} {
				c := d.Color(sign * v)
				lin := [3]float64{linearise(c.R), linearise(c.G), linearise(c.B)}
				var sim [3]float64
				for i := 0; i < 3; i++ {
					for j := 0; j < 3; j++ {
						sim[i] += m[i][j] * lin[j]
					}
				}
				diff := sim[2] - sim[0] // blue minus red, linear light
				if sign < 0 && diff < 0.03 {
					t.Errorf("%s: SI %v simulated as %v, not bluish", name, sign*v, sim)
				}
				if sign > 0 && diff > -0.03 {
					t.Errorf("%s: SI %v simulated as %v, not reddish-yellow", name, sign*v, sim)
				}
			}
		}
	}
}

// In grey-scale (Go's color.GrayModel, Rec. 601 luma 0.299 R + 0.587 G +
// 0.114 B) the two ends of the scale stay at least 50 grey levels apart
// and the centre stays the lightest.
func TestDivergingGreyScale(t *testing.T) {
	d := Diverging{Limit: 1.5}
	grey := func(v float64) int { return int(color.GrayModel.Convert(d.Color(v)).(color.Gray).Y) }
	if g := grey(1.5) - grey(-1.5); g < 50 {
		t.Errorf("ends %d and %d grey levels apart: %d, want >= 50", grey(-1.5), grey(1.5), g)
	}
	for _, v := range []float64{-1.5, -0.5, 0.5, 1.5} {
		if grey(v) >= grey(0) {
			t.Errorf("grey(%v) = %d not darker than the centre %d", v, grey(v), grey(0))
		}
	}
}
