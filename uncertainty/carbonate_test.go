package uncertainty

import (
	"math"
	"testing"
)

// The SI of calcite rises by about one unit per pH unit at fixed alkalinity
// near neutral pH. Derivation (the carbonate equilibria as in Stumm & Morgan
// 1996, Aquatic Chemistry, 3rd ed., ch. 4, from memory): between pH 6.5 and
// 8.3 the alkalinity is nearly all bicarbonate, so fixing the alkalinity
// fixes a(HCO3-); the second dissociation, HCO3- = H+ + CO3 2-, gives
// a(CO3 2-) = K2 a(HCO3-) / a(H+), so log a(CO3 2-) = log K2 + log a(HCO3-)
// + pH, and log IAP = log a(Ca2+) + log a(CO3 2-) rises one unit per pH
// unit, as does SI = log IAP - log K. (Ion pairs and the carbonate share of
// the alkalinity bend this slightly, hence 0.9-1.1.)
func TestCalcitePHSensitivity(t *testing.T) {
	for _, ph := range []float64{6.8, 7.0, 7.3, 7.6} {
		e := newEstimator(t, Options{Draws: 4000, Seed: 7})
		c := Case{Water: carbonateWater(ph), Inputs: []Input{{Name: "pH", Kind: PH, Value: ph, SD: 0.05}}}
		lin, err := e.Linear(&c)
		if err != nil {
			t.Fatal(err)
		}
		li := lin.Interval("calcite")
		if li == nil {
			t.Fatalf("pH %.1f: no calcite interval", ph)
		}
		if d := li.Sensitivity[0]; d < 0.9 || d > 1.1 {
			t.Errorf("pH %.1f: dSI/dpH = %.3f, want 0.9-1.1", ph, d)
		}
		mc, err := e.MonteCarlo(&c, 0)
		if err != nil {
			t.Fatal(err)
		}
		mi := mc.Interval("calcite")
		t.Logf("pH %.1f: dSI/dpH %.3f; linear %.3f..%.3f; Monte Carlo %.3f..%.3f", ph, li.Sensitivity[0], li.Low, li.High, mi.Low, mi.High)
		wl, wm := li.High-li.Low, mi.High-mi.Low
		if math.Abs(wm-wl) > 0.1*wl {
			t.Errorf("pH %.1f: Monte Carlo width %.4f, linear %.4f: more than 10 %% apart", ph, wm, wl)
		}
		// Both centre on the SI as measured (the pH draws are symmetric).
		if mid := (mi.High + mi.Low) / 2; math.Abs(mid-li.Best) > 0.1*wl {
			t.Errorf("pH %.1f: Monte Carlo interval centred on %.4f, best %.4f", ph, mid, li.Best)
		}
	}
}

// With every input uncertain at once (the defaults) the linear estimate and
// Monte Carlo agree on the width of each closed interval within 15 % for
// invented waters of three kinds (fresh, sulfate-rich, barium-bearing); the
// SIs are nearly linear in the inputs over their spread, so the two
// estimates of one quantity must agree (a property, not a fitted value).
func TestLinearAgreesWithMonteCarlo(t *testing.T) {
	db, recs := assessCSV(t, seedCSV)
	mc, err := Run(t.Context(), db, recs, Options{Draws: 4000, Seed: 11})
	if err != nil {
		t.Fatal(err)
	}
	lin, err := Run(t.Context(), db, recs, Options{Linear: true})
	if err != nil {
		t.Fatal(err)
	}
	for i := range recs {
		for _, m := range []string{"calcite", "gypsum", "baryte", "celestine", "dolomite"} {
			a, b := mc[i].Interval(m), lin[i].Interval(m)
			if a == nil || b == nil {
				t.Fatalf("%s: no %s interval", recs[i].Sample().ID, m)
			}
			wm, wl := a.High-a.Low, b.High-b.Low
			if math.Abs(wm-wl) > 0.15*wl {
				t.Errorf("%s %s: Monte Carlo width %.3f, linear %.3f", recs[i].Sample().ID, m, wm, wl)
			}
		}
	}
}
