package speciation

import (
	"errors"
	"math"
	"testing"
)

// FuzzSolve: any water (temperature, pH, totals, alkalinity, each possibly absurd)
// is either solved with every number of the result finite, or refused with a
// *SolveError; never a panic, never NaN or Inf.
func FuzzSolve(f *testing.F) {
	// Seeds: a fresh groundwater, seawater-like, a dilute rain water, an acid water.
	f.Add(15.0, 7.3, 2e-3, 0.5e-3, 1e-3, 1e-3, 0.5e-3, 4e-3, 1e-7, 2e-4)
	f.Add(25.0, 8.1, 0.0103, 0.0528, 0.469, 0.546, 0.0282, 2.3e-3, 1e-7, 1e-4)
	f.Add(5.0, 5.6, 1e-6, 1e-6, 1e-5, 1e-5, 1e-6, 1e-6, 0.0, 0.0)
	f.Add(40.0, 3.0, 1e-2, 1e-3, 1e-3, 1e-3, 2e-2, 1e-9, 1e-6, 1e-3)
	db, err := Default()
	if err != nil {
		f.Fatal(err)
	}
	f.Fuzz(func(t *testing.T, tempC, pH, ca, mg, na, cl, so4, alk, ba, si float64) {
		var w Water
		w.TempC, w.PH = tempC, pH
		for _, c := range []struct {
			name string
			v    float64
		}{{"Ca2+", ca}, {"Mg2+", mg}, {"Na+", na}, {"Cl-", cl}, {"SO4 2-", so4}, {"Ba2+", ba}, {"H4SiO4", si}} {
			if c.v != 0 {
				w.SetTotal(c.name, c.v)
			}
		}
		if alk != 0 {
			w.SetAlkalinity(alk)
		}
		res, err := NewSolver(db, TruesdellJones{}).Solve(&w)
		if err != nil {
			var se *SolveError
			if !errors.As(err, &se) {
				t.Fatalf("error %T is not a *SolveError: %v", err, err)
			}
			return
		}
		bad := func(name string, v float64) {
			if math.IsNaN(v) || math.IsInf(v, 0) {
				t.Fatalf("%s = %v for water %+v", name, v, w)
			}
		}
		bad("ionic strength", res.IonicStrength)
		bad("pH", res.PH)
		bad("charge balance", res.ChargeBalance)
		for _, m := range res.Minerals {
			bad(m.Name, m.SI)
		}
		for _, s := range res.Species {
			bad(s.Name, s.Molality)
			bad(s.Name+" gamma", s.Gamma)
		}
		if res.HasLogPCO2 {
			bad("log pCO2", res.LogPCO2)
		}
	})
}
