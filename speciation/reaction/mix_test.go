package reaction

import (
	"math"
	"math/rand/v2"
	"testing"

	"gwsat.dev/gwsat/speciation"
)

// randomWater is an invented fresh-to-brackish water (not a real sample): random
// totals of the major components, pH and alkalinity, at a random temperature.
func randomWater(rng *rand.Rand) speciation.Water {
	w := speciation.Water{TempC: 5 + 60*rng.Float64(), PH: 6.5 + 1.8*rng.Float64()}
	lg := func(lo, hi float64) float64 { return math.Pow(10, lo+(hi-lo)*rng.Float64()) }
	w.SetTotal("Ca2+", lg(-4, -2))
	w.SetTotal("Mg2+", lg(-4.5, -2.5))
	w.SetTotal("Na+", lg(-4, -1.5))
	w.SetTotal("K+", lg(-5, -3))
	w.SetTotal("Cl-", lg(-4, -1.5))
	w.SetTotal("SO4 2-", lg(-4.5, -2))
	w.SetTotal("H4SiO4", lg(-4.5, -3.3))
	if rng.IntN(2) == 0 {
		w.SetTotal("Ba2+", lg(-7, -5.5))
	}
	w.SetAlkalinity(lg(-3.5, -2))
	return w
}

// Property (Wigley & Plummer 1976 [V]: totals mix linearly by mass
// fraction): the mixture's totals and alkalinity are (1-f) a + f b exactly (to
// rounding), and the speciated mixture reproduces them within the solver tolerance.
func TestMixConservesTotals(t *testing.T) {
	db := defaultDB(t)
	rng := rand.New(rand.NewPCG(5, 1))
	for _, mode := range []PHMode{ConserveAlkalinity, ChargeBalance} {
		r := New(db, speciation.TruesdellJones{})
		r.PH = mode
		for trial := 0; trial < 12; trial++ {
			a := prepare(t, r, randomWater(rng))
			b := prepare(t, r, randomWater(rng))
			f := rng.Float64()
			m, res, err := r.Mix(a, b, f, MixTempC(a, b, f))
			if err != nil {
				t.Fatalf("%v trial %d: %v", mode, trial, err)
			}
			names := map[string]bool{}
			for _, c := range append(append([]speciation.ComponentTotal(nil), a.Totals...), b.Totals...) {
				names[c.Component] = true
			}
			for c := range names {
				want := (1-f)*a.Total(c) + f*b.Total(c)
				if got := m.Total(c); math.Abs(got-want) > 1e-15*want {
					t.Errorf("%v trial %d %s: mixed %.17g, (1-f)a+fb %.17g", mode, trial, c, got, want)
				}
				got, _ := res.Total(c)
				if !relClose(got, want, 1e-9) {
					t.Errorf("%v trial %d %s: speciated total %.12g, want %.12g", mode, trial, c, got, want)
				}
			}
			if mode == ConserveAlkalinity {
				want := (1-f)*a.Alkalinity + f*b.Alkalinity
				if !relClose(res.Alkalinity, want, 1e-9) {
					t.Errorf("trial %d: alkalinity %.12g, want %.12g", trial, res.Alkalinity, want)
				}
			}
		}
	}
}

// Property: a water mixed with itself is that water: same totals, pH and every SI as
// the water speciated as given (here with its measured pH and alkalinity, including a
// water whose charge balance is far from zero).
func TestMixWithItself(t *testing.T) {
	db := defaultDB(t)
	r := New(db, speciation.TruesdellJones{})
	rng := rand.New(rand.NewPCG(9, 2))
	for trial := 0; trial < 6; trial++ {
		w := randomWater(rng)
		a, res0, err := r.Prepare(&w)
		if err != nil {
			t.Fatal(err)
		}
		for _, f := range []float64{0, 0.3, 0.77, 1} {
			_, res, err := r.Mix(a, a, f, a.TempC)
			if err != nil {
				t.Fatal(err)
			}
			if math.Abs(res.PH-res0.PH) > 1e-9 {
				t.Errorf("trial %d f %.2f: pH %.10f, water as given %.10f", trial, f, res.PH, res0.PH)
			}
			for _, m := range res0.Minerals {
				si, ok := res.SI(m.Name)
				if !ok || math.Abs(si-m.SI) > 1e-8 {
					t.Errorf("trial %d f %.2f %s: SI %.10f, water as given %.10f", trial, f, m.Name, si, m.SI)
				}
			}
			for _, c := range res0.Totals {
				got, _ := res.Total(c.Component)
				if !relClose(got, c.MolKgw, 1e-9) {
					t.Errorf("trial %d f %.2f %s: %.12g vs %.12g", trial, f, c.Component, got, c.MolKgw)
				}
			}
		}
	}
}

// Wigley & Plummer (1976), "Mixing of carbonate waters", GCA 40, 989-995
// ([V]): closed-system mixing of two calcite-saturated waters at
// different pCO2 gives a mixture undersaturated with calcite at intermediate
// fractions. The end-members (calcite + CO2 at 25 C, log pCO2 -1 and -3.5) are ours.
func TestWigleyPlummerUndersaturatedMixture(t *testing.T) {
	db := defaultDB(t)
	for _, model := range []speciation.ActivityModel{speciation.TruesdellJones{}, speciation.Davies{}} {
		r := New(db, model)
		a := calciteSaturated(t, r, 25, -1)
		b := calciteSaturated(t, r, 25, -3.5)
		sw, err := r.Sweep(a, b, SweepOptions{FixedTemp: true, TempC: 25, Minerals: []string{"calcite"}})
		if err != nil {
			t.Fatal(err)
		}
		for _, p := range sw.Points {
			end := p.Fraction == 0 || p.Fraction == 1
			switch {
			case end && math.Abs(p.SI[0]) > 1e-6:
				t.Errorf("%s: end-member f=%.2f SI %.3g, want 0", model.Name(), p.Fraction, p.SI[0])
			case !end && !(p.SI[0] < 0):
				t.Errorf("%s: mixture f=%.2f SI %.4f, want < 0", model.Name(), p.Fraction, p.SI[0])
			}
		}
		mx := sw.Maxima()
		if len(mx) != 1 || math.Abs(mx[0].SI) > 1e-6 {
			t.Errorf("%s: maxima %+v, want SI 0 at an end-member", model.Name(), mx)
		}
	}
}

// The converse (Water 2013, 5(4), 1712-1722 [V]): mixing two waters
// undersaturated with calcite, one Ca-rich and one bicarbonate-rich, can give a
// supersaturated mixture. End-members invented: CaCl2 water and NaHCO3 water.
func TestUndersaturatedWatersMixToSupersaturation(t *testing.T) {
	db := defaultDB(t)
	r := New(db, speciation.TruesdellJones{})
	ca := speciation.Water{TempC: 20, PH: 7.0}
	ca.SetTotal("Ca2+", 5e-3)
	ca.SetTotal("Cl-", 10e-3)
	ca.SetTotal(speciation.NameCarbonate, 1e-5)
	hc := speciation.Water{TempC: 20, PH: 8.3}
	hc.SetTotal("Na+", 8e-3)
	hc.SetTotal("Cl-", 0.1e-3)
	hc.SetAlkalinity(8e-3)
	hc.SetTotal("Ca2+", 1e-6)
	a, ra, err := r.Prepare(&ca)
	if err != nil {
		t.Fatal(err)
	}
	b, rb, err := r.Prepare(&hc)
	if err != nil {
		t.Fatal(err)
	}
	sa, _ := ra.SI("calcite")
	sb, _ := rb.SI("calcite")
	if sa >= 0 || sb >= 0 {
		t.Fatalf("end-members should be undersaturated: %.2f %.2f", sa, sb)
	}
	sw, err := r.Sweep(a, b, SweepOptions{Minerals: []string{"calcite"}})
	if err != nil {
		t.Fatal(err)
	}
	mx := sw.Maxima()
	if len(mx) != 1 || mx[0].SI <= 0 || mx[0].Fraction <= 0 || mx[0].Fraction >= 1 {
		t.Errorf("maximum %+v: want SI > 0 at an intermediate fraction", mx)
	}
	// Maxima property: no point exceeds the reported maximum.
	for _, p := range sw.Points {
		if p.Defined[0] && p.SI[0] > mx[0].SI {
			t.Errorf("f %.2f SI %.4f above the maximum %.4f", p.Fraction, p.SI[0], mx[0].SI)
		}
	}
}

// Calcite solubility falls with temperature (log K from -8.48 at 25 C to -9.12 at
// 90 C: Plummer & Busenberg 1982 [V-calc]), so a closed water saturated
// at 25 C becomes supersaturated on heating and undersaturated on cooling; its totals
// do not change.
func TestTemperatureSweepCalcite(t *testing.T) {
	db := defaultDB(t)
	r := New(db, speciation.TruesdellJones{})
	a := calciteSaturated(t, r, 25, -2)
	sw, err := r.TemperatureSweep(a, nil, []string{"calcite"})
	if err != nil {
		t.Fatal(err)
	}
	for i, p := range sw.Points {
		si := p.SI[0]
		switch {
		case p.TempC < 25 && si >= 0, p.TempC > 25 && si <= 0, p.TempC == 25 && math.Abs(si) > 1e-6:
			t.Errorf("%.0f C: SI %.4f", p.TempC, si)
		}
		if i > 0 && si <= sw.Points[i-1].SI[0] {
			t.Errorf("%.0f C: SI %.4f not above %.4f", p.TempC, si, sw.Points[i-1].SI[0])
		}
		for _, c := range a.Totals {
			got, _ := p.Result.Total(c.Component)
			if !relClose(got, c.MolKgw, 1e-9) {
				t.Errorf("%.0f C: %s %.10g, want %.10g", p.TempC, c.Component, got, c.MolKgw)
			}
		}
	}
	if mx := sw.Maxima(); mx[0].TempC != 90 {
		t.Errorf("maximum at %.0f C, want 90", mx[0].TempC)
	}
}
