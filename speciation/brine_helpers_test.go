package speciation

import "testing"

// pitzerSolver returns a solver with a new Pitzer model on the default database.
func pitzerSolver(t testing.TB) *Solver {
	t.Helper()
	db, err := Default()
	if err != nil {
		t.Fatal(err)
	}
	return NewSolver(db, NewPitzer())
}

// solubilityInNaCl dissolves mineral (a 1:1 sulfate: cation and SO4 2-) into a NaCl
// solution of molality mNaCl at tempC until SI = 0 and returns the amount dissolved
// (mol/kgw), with the pH from the charge balance.
func solubilityInNaCl(t testing.TB, s *Solver, mineral, cation string, mNaCl, tempC float64) float64 {
	t.Helper()
	w := Water{TempC: tempC, PHFromChargeBalance: true}
	if mNaCl > 0 {
		w.SetTotal("Na+", mNaCl)
		w.SetTotal("Cl-", mNaCl)
	}
	w.SetTotal(cation, 1e-9)
	w.SetTotal("SO4 2-", 1e-9)
	w.Equilibrate(mineral, 0)
	r, err := s.Solve(&w)
	if err != nil {
		t.Fatalf("%s in %g m NaCl at %g C: %v", mineral, mNaCl, tempC, err)
	}
	return r.Phases[0].Dissolved + 1e-9
}

// haliteSaturation returns the NaCl molality at which the SI of halite is 0 at tempC
// (bisection on the molality, each step a full speciation).
func haliteSaturation(t testing.TB, s *Solver, tempC float64) float64 {
	t.Helper()
	si := func(m float64) float64 {
		w := Water{TempC: tempC, PH: 7}
		w.SetTotal("Na+", m)
		w.SetTotal("Cl-", m)
		r, err := s.Solve(&w)
		if err != nil {
			t.Fatalf("NaCl %g m at %g C: %v", m, tempC, err)
		}
		v, _ := r.SI("halite")
		return v
	}
	lo, hi := 4.0, 9.0
	if si(lo) > 0 || si(hi) < 0 {
		t.Fatalf("halite saturation at %g C outside 4-9 mol/kg", tempC)
	}
	for hi-lo > 1e-5 {
		mid := 0.5 * (lo + hi)
		if si(mid) < 0 {
			lo = mid
		} else {
			hi = mid
		}
	}
	return 0.5 * (lo + hi)
}

// relDev returns (got - want) / want.
func relDev(got, want float64) float64 { return (got - want) / want }

// molalFromWtPercent converts a mass percentage of a salt of molar mass g/mol into
// mol per kg of water.
func molalFromWtPercent(w, molarMass float64) float64 {
	return w / (100 - w) * 1000 / molarMass
}
