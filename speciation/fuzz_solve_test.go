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

// FuzzSolveBrine is FuzzSolve for brines: Pitzer's equations (with the Fuoss
// temperature function of the sulfate pairs) at a fuzzed temperature and
// pressure. A solve either succeeds without NaN or Inf anywhere, or returns a
// *SolveError (or the pressure-range error) naming what was infeasible.
func FuzzSolveBrine(f *testing.F) {
	// Seeds: a 3 mol/kg NaCl brine with Ca, Ba and Sr at 80 C and 300 bar;
	// seawater at 1 bar; a near-halite-saturated brine at 100 C; an absurd one.
	f.Add(80.0, 6.5, 0.2, 3.0, 3.4, 2e-3, 2e-3, 1e-5, 5e-3, 300.0)
	f.Add(25.0, 8.1, 0.0103, 0.469, 0.546, 0.0282, 2.3e-3, 1e-7, 9e-5, 1.0)
	f.Add(100.0, 6.0, 0.5, 6.0, 7.0, 1e-3, 1e-3, 1e-4, 1e-2, 500.0)
	f.Add(0.0, 12.0, 10.0, 1e-9, 20.0, 5.0, 1e-9, 1.0, 1.0, 999.0)
	db, err := Default()
	if err != nil {
		f.Fatal(err)
	}
	pz := NewPitzer()
	f.Fuzz(func(t *testing.T, tempC, pH, ca, na, cl, so4, alk, ba, sr, bar float64) {
		var w Water
		w.TempC, w.PH, w.PressureBar = tempC, pH, bar
		for _, c := range []struct {
			name string
			v    float64
		}{{"Ca2+", ca}, {"Na+", na}, {"Cl-", cl}, {"SO4 2-", so4}, {"Ba2+", ba}, {"Sr2+", sr}} {
			if c.v != 0 {
				w.SetTotal(c.name, c.v)
			}
		}
		if alk != 0 {
			w.SetAlkalinity(alk)
		}
		res, err := NewSolver(db, pz).Solve(&w)
		if err != nil {
			var se *SolveError
			if !errors.As(err, &se) && !errors.Is(err, ErrPressure) {
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
		bad("water activity", res.WaterActivity)
		for _, m := range res.Minerals {
			bad(m.Name, m.SI)
		}
		for _, s := range res.Species {
			bad(s.Name, s.Molality)
			bad(s.Name+" gamma", s.Gamma)
		}
	})
}
