package reaction

import (
	"fmt"
	"math"

	"gwsat.dev/gwsat/speciation"
)

// PHMode says what fixes the pH of a water that has been mixed, heated, cooled or has
// lost a precipitate.
type PHMode int

const (
	// ConserveAlkalinity (the default) treats total alkalinity, like every component
	// total, as a conserved quantity: it is the proton balance of the water relative to
	// CO2(aq), H4SiO4, SO4 2- and F-, so it mixes linearly and changes only by the
	// alkalinity carried away in a precipitate (2 eq per mol of CaCO3, 0 for BaSO4). The
	// pH is the one at which the speciated water has that alkalinity with its total
	// inorganic carbon. A water whose laboratory charge balance is not perfect keeps its
	// measured pH (the imbalance is carried along as a conserved quantity).
	ConserveAlkalinity PHMode = iota
	// ChargeBalance computes H+ from electroneutrality, with total inorganic carbon
	// conserved. For a water that is charge balanced this gives the same answer as
	// ConserveAlkalinity; for an imbalanced one the imbalance is put on H+ and the pH
	// of an unmixed end-member can differ from the measured one.
	ChargeBalance
	// HoldPH keeps the pH of the Solution (a pH-controlled vessel: acid or base added as
	// needed). Used for hand-calculation checks with databases that have no
	// proton-bearing species.
	HoldPH
)

func (m PHMode) String() string {
	switch m {
	case ConserveAlkalinity:
		return "conserve alkalinity"
	case ChargeBalance:
		return "charge balance"
	case HoldPH:
		return "hold pH"
	}
	return fmt.Sprintf("PHMode(%d)", int(m))
}

// Solution is a water reduced to what is conserved when waters mix, change
// temperature or lose a precipitate: the component totals (mol/kgw; CO3 2- is total
// inorganic carbon) and the total alkalinity (eq/kgw), at a temperature. PH is the pH
// of the last speciation (the measured pH for a prepared end-member); it is a start
// guess, and the held value in HoldPH mode.
type Solution struct {
	TempC      float64
	PH         float64
	Totals     []speciation.ComponentTotal
	Alkalinity float64
}

// Total returns the total of a component (0 if absent).
func (s *Solution) Total(component string) float64 {
	for _, t := range s.Totals {
		if t.Component == component {
			return t.MolKgw
		}
	}
	return 0
}

// Clone returns a deep copy.
func (s Solution) Clone() Solution {
	s.Totals = append([]speciation.ComponentTotal(nil), s.Totals...)
	return s
}

func (s *Solution) setTotal(component string, v float64) {
	for i := range s.Totals {
		if s.Totals[i].Component == component {
			s.Totals[i].MolKgw = v
			return
		}
	}
	s.Totals = append(s.Totals, speciation.ComponentTotal{Component: component, MolKgw: v})
}

// Reactor mixes, heats and equilibrates waters against one database and activity
// model. It holds a speciation.Solver and scratch space, so it is not safe for
// concurrent use: use one per goroutine.
type Reactor struct {
	// PH selects how the pH of a changed water is found (default ConserveAlkalinity).
	PH PHMode
	// PressureBar is the absolute pressure, bar, at which every changed water is
	// solved (speciation.Water.PressureBar; 0 means 1 bar). Prepare solves a water
	// at its own pressure.
	PressureBar float64

	db *speciation.Database
	s  *speciation.Solver
	w  speciation.Water
}

// New returns a Reactor for db and model. It panics if either is nil (programmer error).
func New(db *speciation.Database, model speciation.ActivityModel) *Reactor {
	if db == nil || model == nil {
		panic("reaction: New needs a database and an activity model")
	}
	return &Reactor{db: db, s: speciation.NewSolver(db, model)}
}

// Database returns the reactor's database.
func (r *Reactor) Database() *speciation.Database { return r.db }

// Model returns the reactor's activity model.
func (r *Reactor) Model() speciation.ActivityModel { return r.s.Model() }

func checkTemp(field string, tempC float64) error {
	if math.IsNaN(tempC) || tempC < speciation.MinTempC || tempC > speciation.MaxTempC {
		return &InputError{Field: field, Value: fmt.Sprintf("%g C (supported %g-%g C)", tempC, speciation.MinTempC, speciation.MaxTempC), Err: ErrTemperature}
	}
	return nil
}

// Prepare speciates a water as it was given (pH and alkalinity or total carbon, its
// own temperature) and returns its conserved content: the totals after the solve
// (total inorganic carbon computed from the alkalinity when that is what was given)
// and the alkalinity from the speciation.
func (r *Reactor) Prepare(w *speciation.Water) (Solution, *speciation.Result, error) {
	if err := checkTemp("temperature", w.TempC); err != nil {
		return Solution{}, nil, err
	}
	res, err := r.s.Solve(w)
	if err != nil {
		return Solution{}, nil, &SolveError{Step: "speciating the water as given", Err: err}
	}
	sol := Solution{
		TempC:      w.TempC,
		PH:         res.PH,
		Totals:     append([]speciation.ComponentTotal(nil), res.Totals...),
		Alkalinity: res.Alkalinity,
	}
	return sol, res, nil
}

// Speciate solves sol at its temperature as a closed system (pH by r.PH) and returns
// the result, with sol's PH updated to the solved pH.
func (r *Reactor) Speciate(sol Solution) (Solution, *speciation.Result, error) {
	if err := checkTemp("temperature", sol.TempC); err != nil {
		return Solution{}, nil, err
	}
	res, err := r.solve(&sol, nil)
	if err != nil {
		return Solution{}, nil, err
	}
	out := sol.Clone()
	out.PH = res.PH
	if r.PH != ConserveAlkalinity {
		// the alkalinity is not a constraint in these modes: report the speciated one
		out.Alkalinity = res.Alkalinity
	}
	return out, res, nil
}

// mineralAlk is the alkalinity (eq) carried by one mole of the mineral's dissolution
// products: the sum over its reaction of nu times the component's alkalinity.
func (r *Reactor) mineralAlk(name string) float64 {
	m := r.db.Mineral(name)
	a := 0.0
	for _, t := range m.Terms {
		a += t.Nu * r.db.Component(t.Index).Alkalinity
	}
	return a
}

// solve speciates sol with the minerals eq held at SI = 0 (their amounts unknown),
// finding the pH by r.PH.
func (r *Reactor) solve(sol *Solution, eq []string) (*speciation.Result, error) {
	build := func(ph float64, cb bool) *speciation.Water {
		w := &r.w
		w.Reset()
		w.TempC = sol.TempC
		w.PressureBar = r.PressureBar
		w.PH = ph
		w.PHFromChargeBalance = cb
		for _, t := range sol.Totals {
			if t.MolKgw > 0 {
				w.SetTotal(t.Component, t.MolKgw)
			}
		}
		for _, m := range eq {
			w.Equilibrate(m, 0)
		}
		return w
	}
	switch r.PH {
	case HoldPH:
		res, err := r.s.Solve(build(sol.PH, false))
		if err != nil {
			return nil, &SolveError{Step: "speciating at the held pH", Err: err}
		}
		return res, nil
	case ChargeBalance:
		res, err := r.s.Solve(build(7, true))
		if err != nil {
			return nil, &SolveError{Step: "speciating with H+ from charge balance", Err: err}
		}
		return res, nil
	}
	// ConserveAlkalinity: h(pH) = alkalinity of the speciated water minus the conserved
	// alkalinity less what the precipitates carried away. h rises with pH (it is the
	// strong base needed to hold that pH), so bracket its root and refine.
	alkOf := make([]float64, len(eq))
	for k, m := range eq {
		alkOf[k] = r.mineralAlk(m)
	}
	var last *speciation.Result
	h := func(ph float64) (float64, error) {
		res, err := r.s.Solve(build(ph, false))
		if err != nil {
			return 0, err
		}
		want := sol.Alkalinity
		for k, p := range res.Phases {
			want += p.Dissolved * alkOf[k]
		}
		last = res
		return res.Alkalinity - want, nil
	}
	ph0 := sol.PH
	if !(ph0 > 1 && ph0 < 13.5) {
		ph0 = 7
	}
	root, err := bracketRoot(h, ph0, 0.02, 1, 13.5, 1e-12)
	if err != nil {
		return nil, &SolveError{Step: "finding the pH that conserves alkalinity", Err: err}
	}
	if last == nil || last.PH != root {
		if _, err := h(root); err != nil {
			return nil, &SolveError{Step: "finding the pH that conserves alkalinity", Err: err}
		}
	}
	return last, nil
}

// bracketRoot finds a root of an increasing function f on [lo, hi], starting at x0
// with step dx: it walks outward, doubling the step, until the sign changes (halving
// the step when f fails), then refines by false position with the Illinois
// modification until the bracket is narrower than tol. It returns the last point
// evaluated, which lies within the final bracket.
func bracketRoot(f func(float64) (float64, error), x0, dx, lo, hi, tol float64) (float64, error) {
	f0, err := f(x0)
	if err != nil {
		return 0, err
	}
	if f0 == 0 {
		return x0, nil
	}
	dir := -1.0
	if f0 < 0 {
		dir = 1
	}
	a, fa := x0, f0
	var b, fb float64
	found := false
	step := dx
	for it := 0; it < 200; it++ {
		x := a + dir*step
		x = math.Max(lo, math.Min(hi, x))
		if x == a {
			return 0, fmt.Errorf("%w: no sign change between %g and the bound %g", ErrNoSolution, x0, x)
		}
		fx, err := f(x)
		if err != nil {
			step /= 4
			if step < 1e-9 {
				return 0, err
			}
			continue
		}
		if fx == 0 {
			return x, nil
		}
		if (fx > 0) != (fa > 0) {
			b, fb = x, fx
			found = true
			break
		}
		a, fa = x, fx
		step *= 2
	}
	if !found {
		return 0, fmt.Errorf("%w: no sign change found from %g", ErrNoSolution, x0)
	}
	// Illinois false position on [a, b] (in either order); b is the newest point.
	c := b
	for it := 0; it < 200; it++ {
		if math.Abs(b-a) < tol {
			break
		}
		c = b - fb*(b-a)/(fb-fa)
		if !(c > math.Min(a, b) && c < math.Max(a, b)) {
			c = 0.5 * (a + b)
		}
		fc, err := f(c)
		if err != nil {
			return 0, err
		}
		if fc == 0 {
			return c, nil
		}
		if (fc > 0) == (fb > 0) {
			fa /= 2 // a kept again: halve its weight
		} else {
			a, fa = b, fb
		}
		b, fb = c, fc
	}
	return c, nil
}
