package speciation

import (
	"math"
	"strings"
	"testing"
)

// TestFuossCaSO4 checks the Fuoss (1958) temperature function of the CaSO4 pair against
// outside numbers: the contact distance solved from log K 2.30 (thermo.txt, CaSO4(aq))
// must be a contact of two hydrated ions, a few tenths of a nanometre (Fuoss 1958 uses
// the sum of ionic radii; common practice); and the association enthalpy it implies at
// 25 C, dH = R T^2 d(ln K)/dT, must agree with the measured 1.65 kcal (6.9 kJ) of
// thermo.txt (compilation value after Nordstrom et al. 1990, from memory) within 15 %.
func TestFuossCaSO4(t *testing.T) {
	a, err := fuossDistance(4, 2.30)
	if err != nil {
		t.Fatal(err)
	}
	t.Logf("contact distance %.3f nm", a*1e9)
	if a < 0.3e-9 || a > 0.5e-9 {
		t.Errorf("contact distance %.3f nm, want 0.3-0.5 nm", a*1e9)
	}
	if got := fuossLogK(4, a, T25); math.Abs(got-2.30) > 1e-9 {
		t.Errorf("log K at the solved distance %.12f, want 2.30", got)
	}
	b, err := fuossExponent(4, 2.30)
	if err != nil {
		t.Fatal(err)
	}
	const h = 0.01
	dlnK := (math.Log(fuossRatio(b, T25+h)) - math.Log(fuossRatio(b, T25-h))) / (2 * h)
	dH := gasConstant * T25 * T25 * dlnK
	const measured = 1.65 * 4184
	t.Logf("association enthalpy from the Fuoss equation %.0f J/mol, measured %.0f", dH, measured)
	if math.Abs(dH-measured)/measured > 0.15 {
		t.Errorf("association enthalpy %.0f J/mol, measured %.0f (more than 15 %% apart)", dH, measured)
	}
}

// TestFuossRatio checks properties of the temperature function: 1 at 25 C, rising with
// temperature (eps_r T falls from 0 to 100 C, so b rises), and steeper above 25 C than the
// van 't Hoff line with the 25 C enthalpy (the association enthalpy grows with T).
func TestFuossRatio(t *testing.T) {
	b, err := fuossExponent(4, 2.30)
	if err != nil {
		t.Fatal(err)
	}
	if r := fuossRatio(b, T25); math.Abs(r-1) > 1e-12 {
		t.Errorf("ratio at 25 C = %v, want 1", r)
	}
	prev := 0.0
	for tc := 0.0; tc <= 100; tc += 5 {
		r := fuossRatio(b, tc+273.15)
		if r <= prev {
			t.Errorf("ratio %.4f at %g C is not above %.4f at %g C", r, tc, prev, tc-5)
		}
		prev = r
	}
	const h = 0.01
	dH25 := gasConstant * T25 * T25 * (math.Log(fuossRatio(b, T25+h)) - math.Log(fuossRatio(b, T25-h))) / (2 * h)
	T := 373.15
	vantHoff := math.Exp(dH25 / gasConstant * (1/T25 - 1/T))
	if r := fuossRatio(b, T); r <= vantHoff {
		t.Errorf("ratio at 100 C %.3f, not above the van 't Hoff %.3f with the same 25 C enthalpy", r, vantHoff)
	}
}

func TestParseFuossErrors(t *testing.T) {
	for _, s := range []string{"fuoss 4", "fuoss 0 2.3", "fuoss 4 x", "fuoss 4 0.5"} {
		if _, err := parseTempFunc(s); err == nil {
			t.Errorf("%q: no error", s)
		} else if !strings.Contains(err.Error(), "fuoss") {
			t.Errorf("%q: error %q does not name the function", s, err)
		}
	}
}

// TestFuossHeatCapacityCaSO4 checks the CaSO4(aq) entry of thermo.txt
// (heat_capacity = fuoss 4): at 25 C its log K and enthalpy are the measured
// ones (2.30 and 1.65 kcal, compilation after Nordstrom et al. 1990, from
// memory); away from 25 C it lies above the van 't Hoff line of that enthalpy,
// by the Fuoss equation's curvature (a positive heat capacity of association).
func TestFuossHeatCapacityCaSO4(t *testing.T) {
	db, err := Default()
	if err != nil {
		t.Fatal(err)
	}
	i := db.SpeciesIndex("CaSO4(aq)")
	if i < 0 {
		t.Fatal("no CaSO4(aq)")
	}
	f := db.species[i].LogK
	vh := vantHoff(2.30, 1.65*4184)
	if d := f.At(T25) - 2.30; math.Abs(d) > 1e-12 {
		t.Errorf("log K at 25 C off by %g", d)
	}
	const h = 0.01
	slope := (f.At(T25+h) - f.At(T25-h)) / (2 * h)
	want := (vh.At(T25+h) - vh.At(T25-h)) / (2 * h)
	if math.Abs(slope-want) > 1e-6*math.Abs(want) {
		t.Errorf("d log K/dT at 25 C %g, van 't Hoff with the measured enthalpy %g", slope, want)
	}
	for _, tc := range []float64{0, 50, 100} {
		got, line := f.At(tc+273.15), vh.At(tc+273.15)
		t.Logf("%3.0f C: log K %.4f, van 't Hoff %.4f", tc, got, line)
		if got <= line {
			t.Errorf("%g C: log K %.4f not above the van 't Hoff line %.4f", tc, got, line)
		}
	}
}

// Gypsum solubility in pure water with the ion-association model
// (Truesdell-Jones), against the handbook values of REFERENCES 2.1 (from
// memory, tolerance 7 %), from 0 to 60 C. At 80 and 100 C this model stays
// 8 and 16 % low (its ion-size parameters are 25 C values), which the README
// states; those two temperatures are logged, not asserted.
func TestGypsumSolubilityWaterTruesdellJones(t *testing.T) {
	db, err := Default()
	if err != nil {
		t.Fatal(err)
	}
	s := NewSolver(db, TruesdellJones{})
	for _, tc := range []struct {
		tempC, mmol float64
		assert      bool
	}{{0, 12.9, true}, {20, 14.8, true}, {40, 15.4, true}, {60, 14.2, true}, {80, 13.6, false}, {100, 11.9, false}} {
		got := 1000 * solubilityInNaCl(t, s, "gypsum", "Ca2+", 0, tc.tempC)
		d := relDev(got, tc.mmol)
		t.Logf("%3.0f C: gypsum %.2f mmol/kg, handbook %.1f (%+.1f %%)", tc.tempC, got, tc.mmol, 100*d)
		if tc.assert && math.Abs(d) > 0.07 {
			t.Errorf("%g C: gypsum %.2f mmol/kg, handbook %.1f (%.1f %% off)", tc.tempC, got, tc.mmol, 100*d)
		}
	}
}
