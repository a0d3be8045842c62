package hydro

import (
	"math"
	"strings"
	"testing"
)

// Pressure units: 1 MPa = 10 bar, 1 kPa = 0.01 bar, 1 atm = 1.01325 bar (exact
// definitions), 1 psi = 6894.757 Pa (NIST SP 811, Appendix B).
func TestParsePressureBar(t *testing.T) {
	for _, tc := range []struct {
		in   string
		want float64
		ok   bool
	}{
		{"250", 250, true}, {"250 bar", 250, true}, {"25MPa", 250, true}, {"25 MPa", 250, true},
		{"3600psi", 3600 * 6894.757 / 1e5, true}, {"1 atm", 1.01325, true}, {"5000 kPa", 50, true},
		{"0", 0, false}, {"1500", 0, false}, {"abc", 0, false}, {"20 furlongs", 0, false}, {"NaN", 0, false},
	} {
		got, err := ParsePressureBar(tc.in)
		if tc.ok != (err == nil) || (tc.ok && math.Abs(got-tc.want) > 1e-6*tc.want) {
			t.Errorf("%q: %g, %v; want %g (ok %v)", tc.in, got, err, tc.want, tc.ok)
		}
	}
}

// A Pressure column is read in its unit into bar, and a value outside the supported
// range is a warning on the row and not used (the rest of the row stays good).
func TestPressureColumn(t *testing.T) {
	in := "Sample,pH,Ca (mg/L),Reservoir pressure (MPa)\nA,7,40,20\nB,7,40,150\n"
	b, err := Read(strings.NewReader(in), "p.csv", Options{})
	if err != nil {
		t.Fatal(err)
	}
	if p := b.Rows[0].Sample.PressureBar; !p.OK || math.Abs(p.V-200) > 1e-9 {
		t.Errorf("row A pressure %+v, want 200 bar", p)
	}
	if b.Rows[1].Sample.PressureBar.OK {
		t.Errorf("row B: 1500 bar accepted")
	}
	found := false
	for _, is := range b.Rows[1].Issues {
		found = found || (is.Code == CodeOutOfRange && is.Severity == Warning && strings.Contains(is.Message, "ignored"))
	}
	if !found {
		t.Errorf("row B: no out-of-range warning: %+v", b.Rows[1].Issues)
	}
}
