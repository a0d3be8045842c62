package speciation

import (
	"math"
	"testing"
)

// Property: pow10 (and its loop form pow10s) agree with math.Pow to full double
// precision: a relative difference below 2e-15 (about ten units in the last place,
// which bounds both functions' rounding) everywhere in [-300, 300], and outside that
// range they are math.Pow itself.
func TestPow10FullPrecision(t *testing.T) {
	tests := []struct {
		name     string
		lo, hi   float64
		n        int
		maxRelEr float64
	}{
		{"solver range of log m", -40, 4.5, 200003, 2e-15},
		{"whole fast range", -300, 300, 600011, 2e-15},
		{"near zero", -1e-3, 1e-3, 20001, 2e-15},
	}
	for _, tc := range tests {
		xs := make([]float64, tc.n)
		for i := range xs {
			xs[i] = tc.lo + (tc.hi-tc.lo)*float64(i)/float64(tc.n-1)
		}
		ys := make([]float64, len(xs))
		pow10s(ys, xs)
		worst := 0.0
		for i, x := range xs {
			want := math.Pow(10, x)
			got := pow10(x)
			if e := math.Abs(got-want) / want; e > worst {
				worst = e
			}
			if math.Float64bits(ys[i]) != math.Float64bits(got) {
				t.Fatalf("%s: pow10s(%g) = %g differs from pow10 %g", tc.name, x, ys[i], got)
			}
		}
		if worst > tc.maxRelEr {
			t.Errorf("%s: largest relative difference from math.Pow %.3g (limit %.3g)", tc.name, worst, tc.maxRelEr)
		}
	}
	// outside the fast range and special values: exactly math.Pow
	for _, x := range []float64{-300.5, 300.5, -400, 400, math.Inf(1), math.Inf(-1), math.NaN()} {
		got, want := pow10(x), math.Pow(10, x)
		if !(got == want || math.IsNaN(got) && math.IsNaN(want)) {
			t.Errorf("pow10(%g) = %g, math.Pow %g", x, got, want)
		}
	}
}

// Property: the solver's molalities agree with a reference computed with math.Pow from
// the converged activities and the log K values (log m = log K + sum nu log a -
// log gamma) within 1e-12 relative, its activity coefficients with math.Pow of log
// gamma, and the reference molalities close every given balance within the solver's
// convergence tolerance: the fast power of ten costs no accuracy.
func TestSolveAgreesWithMathPow(t *testing.T) {
	db := mustDefault(t)
	cb := nativeWater()
	cb.ChargeBalanceIon = "Cl-"
	ph := seaWater()
	ph.PHFromChargeBalance = true
	warm := nativeWater()
	warm.TempC = 60
	tests := []struct {
		name  string
		model ActivityModel
		w     Water
	}{
		{"native water, Truesdell-Jones", TruesdellJones{}, nativeWater()},
		{"native water, Davies", Davies{}, nativeWater()},
		{"native water at 60 C", TruesdellJones{}, warm},
		{"Cl- from charge balance", TruesdellJones{}, cb},
		{"seawater, pH from charge balance", Davies{}, ph},
		{"seawater", TruesdellJones{}, seaWater()},
	}
	for _, tc := range tests {
		s := NewSolver(db, tc.model)
		s.WarmStart = false
		res, err := s.Solve(&tc.w)
		if err != nil {
			t.Fatalf("%s: %v", tc.name, err)
		}
		// log activity of each component's free species (H+ from the pH)
		la := make([]float64, len(db.components))
		for _, sp := range res.Species {
			if c := db.species[db.SpeciesIndex(sp.Name)].Master; c >= 0 {
				la[c] = sp.LogActivity
			}
		}
		la[db.hplus] = -res.PH
		la[db.water] = math.Log10(res.WaterActivity)
		T := tc.w.TempC + 273.15
		ref := make([]float64, len(res.Species))
		for k, sp := range res.Species {
			dsp := &db.species[db.SpeciesIndex(sp.Name)]
			f := &dsp.LogK
			logm := f.At(T) - sp.LogGamma
			for _, term := range dsp.Terms {
				logm += term.Nu * la[term.Index]
			}
			ref[k] = math.Pow(10, logm)
			if d := math.Abs(sp.Molality-ref[k]) / ref[k]; d > 1e-12 {
				t.Errorf("%s: %s molality %.15g, math.Pow reference %.15g (relative %.2g)", tc.name, sp.Name, sp.Molality, ref[k], d)
			}
			if g := math.Pow(10, sp.LogGamma); math.Abs(sp.Gamma-g) > 1e-12*g {
				t.Errorf("%s: %s gamma %.15g, math.Pow %.15g", tc.name, sp.Name, sp.Gamma, g)
			}
		}
		for _, tt := range tc.w.Totals() {
			if tt.Component == tc.w.ChargeBalanceIon {
				continue
			}
			ci := db.ComponentIndex(tt.Component)
			sum := 0.0
			for k, sp := range res.Species {
				sum += nuOf(db.species[db.SpeciesIndex(sp.Name)].Terms, ci) * ref[k]
			}
			// the convergence test: |balance| <= Tolerance x the sum of its terms (here
			// the total), with room for the rounding of the reference's logarithms
			if d := math.Abs(sum-tt.MolKgw) / tt.MolKgw; d > Tolerance+1e-12 {
				t.Errorf("%s: %s balance from the math.Pow reference off by %.3g relative", tc.name, tt.Component, d)
			}
		}
	}
}
