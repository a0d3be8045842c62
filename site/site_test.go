package site

import (
	"testing"
)

// Nested wells at 40, 70 and 108-128 m split into three zones at the gaps;
// a continuous spread of depths stays one zone.
func TestDepthZones(t *testing.T) {
	mk := func(ds ...float64) []placedRec {
		var out []placedRec
		for _, d := range ds {
			out = append(out, placedRec{depth: d, hasD: true})
		}
		return out
	}
	z := depthZones(mk(40, 40, 70, 70, 108, 108, 128), nil)
	if len(z) != 3 || z[0].Label != "40 m depth" || z[2].Label != "108-128 m depth" {
		t.Fatalf("zones %+v", z)
	}
	for _, p := range mk(40, 70, 108, 128) {
		n := 0
		for _, zz := range z {
			if zz.contains(p) {
				n++
			}
		}
		if n != 1 {
			t.Errorf("depth %g lies in %d zones", p.depth, n)
		}
	}
	if z := depthZones(mk(10, 15, 20, 25, 30, 35), nil); len(z) != 1 {
		t.Errorf("continuous depths gave %d zones", len(z))
	}
	if z := depthZones(mk(10, 60), []float64{0, 50, 100}); len(z) != 2 || z[1].Label != "50-100 m depth" {
		t.Errorf("given edges gave %+v", z)
	}
}

func TestCommonPrefix(t *testing.T) {
	for _, c := range []struct {
		in   []string
		want string
	}{
		{[]string{"A1-S", "A1-I", "A1-D"}, "A1"},
		{[]string{"MW-7"}, "MW-7"},
		{[]string{"X", "Y"}, "X..."},
	} {
		if got := commonPrefix(c.in); got != c.want {
			t.Errorf("commonPrefix(%v) = %q, want %q", c.in, got, c.want)
		}
	}
}
