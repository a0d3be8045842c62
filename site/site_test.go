package site

import (
	"math"
	"strings"
	"testing"

	"github.com/paulmach/orb"
	"gwsat.dev/gwsat/figure"
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

// surfaceFor draws a surface only from enough wells and with a leave-one-out
// error below the near-equilibrium band, and says why in the note.
func TestSurfaceForRules(t *testing.T) {
	grid := func(n int, field func(x, y float64) float64) ([]orb.Point, []float64) {
		var pts []orb.Point
		var vals []float64
		side := int(math.Ceil(math.Sqrt(float64(n))))
		for k := 0; k < n; k++ {
			x, y := float64(k%side)*200, float64(k/side)*200
			pts = append(pts, orb.Point{x, y})
			vals = append(vals, field(x, y))
		}
		return pts, vals
	}
	smooth := func(x, y float64) float64 { return -0.3 + 0.0004*x }
	// Alternating +-2 SI between neighbours: no interpolator predicts a
	// left-out well to within 0.5.
	rough := func(x, y float64) float64 { return 2 * math.Cos(math.Pi*(x+y)/200) }
	for _, c := range []struct {
		name    string
		n       int
		field   func(x, y float64) float64
		method  string
		drawn   bool
		method0 string // prefix of the method used
		note    string
	}{
		{"too few wells", MinWellsSurface - 1, smooth, "", false, "none", "fewer than the 10"},
		{"IDW below the kriging minimum", 12, smooth, "", true, "IDW", "a variogram needs"},
		{"kriging from enough wells", 36, smooth, "", true, "ordinary kriging", "surface drawn"},
		{"IDW asked", 36, smooth, "idw", true, "IDW", "surface drawn"},
		{"error above the band", 25, rough, "idw", false, "IDW", "not below the near-equilibrium band"},
	} {
		pts, vals := grid(c.n, c.field)
		var row SurfaceRow
		s := surfaceFor(pts, vals, c.method, &row)
		if (s != nil) != c.drawn || row.Drawn != c.drawn {
			t.Errorf("%s: drawn %v (surface %v), want %v; note %q", c.name, row.Drawn, s != nil, c.drawn, row.Note)
		}
		if !strings.HasPrefix(row.Method, c.method0) {
			t.Errorf("%s: method %q, want prefix %q", c.name, row.Method, c.method0)
		}
		if !strings.Contains(row.Note, c.note) {
			t.Errorf("%s: note %q lacks %q", c.name, row.Note, c.note)
		}
		if row.HasCV && row.Drawn != (row.CVRMSE < MaxSurfaceCVRMSE) {
			t.Errorf("%s: CV %v but drawn %v", c.name, row.CVRMSE, row.Drawn)
		}
	}
}

// Samples at one position are one well of a surface, at their mean value; points
// a metre apart or more stay apart.
func TestMeanByPosition(t *testing.T) {
	pts := []orb.Point{{100, 200}, {100.2, 199.9}, {300, 400}, {100, 200}}
	vals := []float64{1, 2, 5, 3}
	p, v := meanByPosition(pts, vals)
	if len(p) != 2 || v[0] != 2 || v[1] != 5 {
		t.Fatalf("%v %v, want two wells at 2 and 5", p, v)
	}
}

// Two samples of one well in one round are one symbol at their mean SI.
func TestMergeWells(t *testing.T) {
	ws := mergeWells([]figure.Well{{X: 1, Y: 1, SI: 0.2, Label: "A"}, {X: 50, Y: 1, SI: -1, Label: "B"}, {X: 1.3, Y: 0.8, SI: 0.6, Label: "A"}})
	if len(ws) != 2 || ws[0].Label != "A" || math.Abs(ws[0].SI-0.4) > 1e-12 {
		t.Fatalf("%+v", ws)
	}
}
