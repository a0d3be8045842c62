package speciation

import (
	"errors"
	"math"
	"math/rand/v2"
	"reflect"
	"strings"
	"testing"
)

// The analytic Jacobian (d m_s/d log a_j = ln10 nu_sj m_s, plus the ionic-strength
// column through d log gamma/dI) must match central finite differences of the residuals.
func TestJacobianFiniteDifference(t *testing.T) {
	db := mustDefault(t)
	for _, model := range []ActivityModel{TruesdellJones{}, Davies{}} {
		s := NewSolver(db, model)
		w := nativeWater()
		w.ChargeBalanceIon = "Cl-"
		w.Equilibrate("calcite", 0)
		if err := s.setup(&w); err != nil {
			t.Fatal(err)
		}
		s.initialGuess(0)
		n := s.n
		u := append([]float64(nil), s.u[:n]...)
		u[s.iCol] *= 1.3 // away from the solution
		s.evaluate(u)
		s.jacobian(u)
		J := append([]float64(nil), s.jac[:n*n]...)
		rp, rm := make([]float64, n), make([]float64, n)
		for c := 0; c < n; c++ {
			h := 1e-6
			if c == s.iCol {
				h = 1e-6 * u[c]
			}
			up := append([]float64(nil), u...)
			up[c] += h
			s.evaluate(up)
			copy(rp, s.resid[:n])
			up[c] -= 2 * h
			s.evaluate(up)
			copy(rm, s.resid[:n])
			s.evaluate(u)
			for r := 0; r < n; r++ {
				fd := (rp[r] - rm[r]) / (2 * h)
				an := J[r*n+c] * s.scale[r] // the Jacobian rows are scaled
				if math.Abs(fd-an) > 1e-6*(math.Abs(an)+s.scale[r]) {
					t.Errorf("%s: J[%d][%d] analytic %.8g, finite difference %.8g", model.Name(), r, c, an, fd)
				}
			}
		}
	}
}

func checkFinite(t *testing.T, label string, res *Result) {
	t.Helper()
	bad := func(x float64) bool { return math.IsNaN(x) || math.IsInf(x, 0) }
	v := reflect.ValueOf(res).Elem()
	var walk func(v reflect.Value, path string)
	walk = func(v reflect.Value, path string) {
		switch v.Kind() {
		case reflect.Float64:
			if bad(v.Float()) {
				t.Errorf("%s: %s is %v", label, path, v.Float())
			}
		case reflect.Struct:
			for i := 0; i < v.NumField(); i++ {
				walk(v.Field(i), path+"."+v.Type().Field(i).Name)
			}
		case reflect.Slice:
			for i := 0; i < v.Len(); i++ {
				walk(v.Index(i), path)
			}
		}
	}
	walk(v, "Result")
}

// Fuzz-ish robustness: random plausible (and some implausible) waters either converge,
// with every balance closed and no NaN or Inf anywhere in the result, or return a
// *SolveError. Fixed seed.
func TestRandomWatersConvergeOrError(t *testing.T) {
	db := mustDefault(t)
	rng := rand.New(rand.NewPCG(1, 2))
	comps := []string{"Ca2+", "Mg2+", "Na+", "K+", "Sr2+", "Ba2+", "Fe2+", "Mn2+", "Cl-", "SO4 2-", "F-", "H4SiO4", "NO3-", "Br-"}
	models := []ActivityModel{Davies{}, TruesdellJones{}, Ideal{}}
	solvers := make([]*Solver, len(models))
	for i, m := range models {
		solvers[i] = NewSolver(db, m)
	}
	n := 600
	if testing.Short() {
		n = 150
	}
	failures := 0
	var res Result
	for i := 0; i < n; i++ {
		w := Water{TempC: rng.Float64() * 100, PH: 4 + 6*rng.Float64()}
		for _, c := range comps {
			if rng.Float64() < 0.8 {
				w.SetTotal(c, math.Pow(10, -7+5.5*rng.Float64())) // 1e-7 .. 0.3 mol/kgw
			}
		}
		switch rng.IntN(4) {
		case 0:
			w.SetAlkalinity(math.Pow(10, -5+3.5*rng.Float64()))
		case 1:
			w.SetTotal("CO3 2-", math.Pow(10, -5+3.5*rng.Float64()))
		case 2:
			w.PHFromChargeBalance = true
			w.SetTotal("CO3 2-", math.Pow(10, -5+3*rng.Float64()))
		}
		if rng.Float64() < 0.2 {
			w.ChargeBalanceIon = "Cl-"
			w.PHFromChargeBalance = false
		}
		if rng.Float64() < 0.1 {
			if _, ok := w.Total("Ca2+"); ok {
				if c, ok2 := w.Total("CO3 2-"); ok2 && c > 0 {
					w.Equilibrate("calcite", 0)
				}
			}
		}
		s := solvers[i%len(solvers)]
		s.WarmStart = i%2 == 0
		err := s.SolveInto(&res, &w)
		if err != nil {
			var se *SolveError
			if !errors.As(err, &se) {
				t.Fatalf("water %d: error %T %v", i, err, err)
			}
			failures++
			if strings.Contains(se.Reason, "stalled with") || strings.Contains(se.Reason, "no convergence after") || errors.Is(err, ErrSingular) {
				t.Errorf("water %d: unexplained failure: %v", i, err)
			}
			if testing.Verbose() {
				t.Logf("water %d (%s, cb=%v ion=%q eq=%d): %v", i, s.model.Name(), w.PHFromChargeBalance, w.ChargeBalanceIon, len(w.equilibria), err)
			}
			continue
		}
		checkFinite(t, "random water", &res)
		for _, tt := range w.Totals() {
			if tt.MolKgw == 0 || tt.Component == w.ChargeBalanceIon {
				continue
			}
			ci := db.ComponentIndex(tt.Component)
			got := 0.0 // sum over species of nu m
			for _, sp := range res.Species {
				got += nuOf(db.species[db.SpeciesIndex(sp.Name)].Terms, ci) * sp.Molality
			}
			want := tt.MolKgw
			for _, p := range res.Phases {
				want += p.Dissolved * nuOf(db.Mineral(p.Name).Terms, db.ComponentIndex(tt.Component))
			}
			if math.Abs(got-want) > 1e-9*want {
				t.Errorf("water %d: %s species sum %.12g, want %.12g", i, tt.Component, got, want)
			}
			if rep, _ := res.Total(tt.Component); math.Abs(rep-want) > 1e-12*want {
				t.Errorf("water %d: %s reported total %.15g, want %.15g", i, tt.Component, rep, want)
			}
		}
	}
	t.Logf("%d of %d random waters returned an error (inconsistent inputs: alkalinity below the non-carbonate alkalinity, or a charge balance the chosen ion cannot close)", failures, n)
}

// Plausible groundwaters (charge balanced by chloride, pH 6-9, alkalinity 0.5-10 meq,
// 0-60 C) must all converge, with every model, cold or warm.
func TestPlausibleWatersConverge(t *testing.T) {
	db := mustDefault(t)
	rng := rand.New(rand.NewPCG(7, 11))
	cations := []struct {
		name string
		z    float64
		lo   float64
		hi   float64
	}{{"Ca2+", 2, -4, -2}, {"Mg2+", 2, -4.5, -2.3}, {"Na+", 1, -4, -1.5}, {"K+", 1, -5, -3}, {"Sr2+", 2, -6, -4},
		{"Ba2+", 2, -7.5, -5.5}, {"Fe2+", 2, -7, -4}, {"Mn2+", 2, -7.5, -5}}
	var res Result
	for _, model := range []ActivityModel{Davies{}, TruesdellJones{}, Ideal{}} {
		s := NewSolver(db, model)
		for i := 0; i < 200; i++ {
			s.WarmStart = i%3 != 0
			w := Water{TempC: 60 * rng.Float64(), PH: 6 + 3*rng.Float64()}
			eq := 0.0
			for _, c := range cations {
				m := math.Pow(10, c.lo+(c.hi-c.lo)*rng.Float64())
				w.SetTotal(c.name, m)
				eq += c.z * m
			}
			alk := math.Pow(10, -3.3+1.3*rng.Float64())
			so4 := math.Pow(10, -4.5+2.5*rng.Float64())
			f := math.Pow(10, -6+2*rng.Float64())
			w.SetAlkalinity(alk)
			w.SetTotal("SO4 2-", so4)
			w.SetTotal("F-", f)
			w.SetTotal("H4SiO4", math.Pow(10, -4.5+1.5*rng.Float64()))
			w.SetTotal("NO3-", math.Pow(10, -5+1.5*rng.Float64()))
			w.SetTotal("Cl-", math.Max(eq-alk-2*so4-f, 1e-5))
			if err := s.SolveInto(&res, &w); err != nil {
				t.Errorf("%s water %d: %v", model.Name(), i, err)
				continue
			}
			checkFinite(t, "plausible water", &res)
		}
	}
}

// Warm and cold starts agree within the convergence tolerance.
func TestWarmStartAgrees(t *testing.T) {
	db := mustDefault(t)
	warm, cold := NewSolver(db, TruesdellJones{}), NewSolver(db, TruesdellJones{})
	cold.WarmStart = false
	w := seaWater()
	if _, err := warm.Solve(&w); err != nil {
		t.Fatal(err)
	}
	w2 := nativeWater()
	w2.SetAlkalinity(0)
	w2 = nativeWater()
	a, err := warm.Solve(&w2)
	if err != nil {
		t.Fatal(err)
	}
	b, err := cold.Solve(&w2)
	if err != nil {
		t.Fatal(err)
	}
	for i := range a.Species {
		if math.Abs(a.Species[i].Molality-b.Species[i].Molality) > 1e-9*b.Species[i].Molality {
			t.Errorf("%s warm %.12g cold %.12g", a.Species[i].Name, a.Species[i].Molality, b.Species[i].Molality)
		}
	}
}

// A Database is shared read-only by solvers in several goroutines (run with -race).
func TestConcurrentSolvers(t *testing.T) {
	db := mustDefault(t)
	waters := nativeVariants(16)
	done := make(chan float64)
	for g := 0; g < 4; g++ {
		go func() {
			s := NewSolver(db, TruesdellJones{})
			sum := 0.0
			for i := range waters {
				res, err := s.Solve(&waters[i])
				if err != nil {
					t.Error(err)
					break
				}
				sum += res.IonicStrength
			}
			done <- sum
		}()
	}
	first := <-done
	for g := 1; g < 4; g++ {
		if v := <-done; math.Abs(v-first) > 1e-9*first {
			t.Errorf("goroutines disagree: %g vs %g", v, first)
		}
	}
}
