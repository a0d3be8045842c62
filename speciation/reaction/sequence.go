package reaction

import (
	"fmt"
	"math"
	"strconv"
	"strings"

	"gwsat.dev/gwsat/speciation"
)

// Reagent is what is added step by step in a precipitation sequence: a pure salt
// (Salt: moles of each component per mole of salt, e.g. Na2SO4 = 2 Na+ + SO4 2-; the
// amount added is in mol per kg of water of the starting water, no water added) or a
// water (Water, prepared; the amount added is in kg of its water per kg of water of
// the starting water, and the totals dilute accordingly).
type Reagent struct {
	Name  string
	Salt  []speciation.ComponentTotal
	Water *Solution
}

// Unit names the unit of the added amount.
func (g Reagent) Unit() string {
	if g.Water != nil {
		return "kg/kgw"
	}
	return "mol/kgw"
}

// ParseSalt builds a salt reagent from a formula of components such as
// "2 Na+ + SO4 2-" (terms joined by " + ", each an optional coefficient and a component
// of db). The salt must be electrically neutral. An acid may be written with H+
// ("H+ + Cl-"); a base cannot (OH- is not a component).
func ParseSalt(db *speciation.Database, name, formula string) (Reagent, error) {
	g := Reagent{Name: name}
	var charge float64
	for i, term := range strings.Split(formula, " + ") {
		f := strings.Fields(term)
		if len(f) == 0 {
			return Reagent{}, inputErr(ErrReagent, fmt.Sprintf("%s term %d", name, i+1), term)
		}
		nu := 1.0
		if v, err := strconv.ParseFloat(f[0], 64); err == nil {
			if !(v > 0) || math.IsInf(v, 0) || len(f) == 1 {
				return Reagent{}, inputErr(ErrReagent, fmt.Sprintf("%s term %d", name, i+1), term)
			}
			nu, f = v, f[1:]
		}
		// A name may hold a space before its charge ("SO4 2-").
		c := strings.Join(f, " ")
		ci := db.ComponentIndex(c)
		if ci < 0 || c == speciation.NameH2O {
			return Reagent{}, inputErr(ErrReagent, fmt.Sprintf("%s term %d (unknown component)", name, i+1), c)
		}
		comp := db.Component(ci)
		charge += nu * comp.Charge
		g.Salt = append(g.Salt, speciation.ComponentTotal{Component: comp.Name, MolKgw: nu})
	}
	if math.Abs(charge) > 1e-12 {
		return Reagent{}, inputErr(ErrReagent, name+" (not neutral)", formula)
	}
	return g, nil
}

// SequenceOptions sets Sequence.
type SequenceOptions struct {
	// Minerals that may precipitate; nil: ScaleMinerals (those of the database).
	Minerals []string
	// MaxAmount is the largest addition (mol/kgw of salt, or kg of reagent water per
	// kg of water). Required, > 0.
	MaxAmount float64
	// MinAmount is the first addition after zero (default MaxAmount x 1e-9); the
	// additions are spaced evenly in log between MinAmount and MaxAmount.
	MinAmount float64
	// Steps is the number of additions scanned (default 60); each saturation onset is
	// then located between two additions by bisection.
	Steps int
	// Tolerance is the relative width in added amount to which an onset is located
	// (default 1e-10).
	Tolerance float64
	// CleanRemoval is the fraction of an earlier mineral's cation that must have
	// precipitated before the next mineral begins for the separation to count as clean
	// (default 0.999, common practice).
	CleanRemoval float64
}

// Residual is how much of an earlier mineral's cation is still dissolved at a later
// onset, as a fraction of the moles supplied (by the starting water and the reagent).
type Residual struct {
	Mineral   string
	Component string
	Fraction  float64
}

// Onset is a mineral reaching saturation as the reagent is added.
type Onset struct {
	Mineral string
	// Amount added when the mineral reaches SI = 0 (unit: Reagent.Unit).
	Amount float64
	// Residual of each earlier mineral's cations at this onset (the earlier minerals
	// having precipitated to equilibrium as the addition went on).
	Residual []Residual
	// Clean: every earlier mineral's cations were removed by at least CleanRemoval.
	Clean  bool
	Result *speciation.Result // the water at the onset
}

// SequenceResult is the order in which minerals reach saturation.
type SequenceResult struct {
	Reagent      string
	Unit         string
	CleanRemoval float64
	Onsets       []Onset
	// Clean: every onset after the first is clean.
	Clean bool
}

// Sequence adds the reagent to the water step by step and reports the order in which
// the candidate minerals reach saturation (SI crossing 0), the amount added at each
// onset, and at each later onset how much of the earlier minerals' cations remains
// dissolved. Between onsets the minerals already saturated precipitate to equilibrium
// (closed system, see Equilibrate), so the residuals reflect their removal. The
// temperature is that of the starting water.
func (r *Reactor) Sequence(sol Solution, g Reagent, opt SequenceOptions) (*SequenceResult, error) {
	if (g.Water == nil) == (len(g.Salt) == 0) {
		return nil, inputErr(ErrReagent, "reagent", "give either a salt or a water")
	}
	if math.IsNaN(opt.MaxAmount) || math.IsInf(opt.MaxAmount, 0) || opt.MaxAmount <= 0 {
		return nil, inputErr(ErrNegative, "maximum amount added", opt.MaxAmount)
	}
	if opt.MinAmount == 0 {
		opt.MinAmount = opt.MaxAmount * 1e-9
	}
	if !(opt.MinAmount > 0 && opt.MinAmount < opt.MaxAmount) {
		return nil, inputErr(ErrInput, "minimum amount added", opt.MinAmount)
	}
	if opt.Steps == 0 {
		opt.Steps = 60
	}
	if opt.Steps < 2 {
		return nil, inputErr(ErrInput, "steps", opt.Steps)
	}
	if opt.Tolerance == 0 {
		opt.Tolerance = 1e-10
	}
	if !(opt.Tolerance > 0 && opt.Tolerance < 0.1) {
		return nil, inputErr(ErrInput, "tolerance", opt.Tolerance)
	}
	if opt.CleanRemoval == 0 {
		opt.CleanRemoval = 0.999
	}
	if !(opt.CleanRemoval > 0 && opt.CleanRemoval < 1) {
		return nil, inputErr(ErrInput, "clean removal fraction", opt.CleanRemoval)
	}
	if err := r.checkMinerals(opt.Minerals); err != nil {
		return nil, err
	}
	if err := checkTemp("temperature", sol.TempC); err != nil {
		return nil, err
	}
	cands := opt.Minerals
	if cands == nil {
		cands = r.KnownMinerals(ScaleMinerals())
	}
	out := &SequenceResult{Reagent: g.Name, Unit: g.Unit(), CleanRemoval: opt.CleanRemoval, Clean: true}
	var onset []string // minerals that have reached saturation, in order

	// state at an addition with the minerals of set allowed to precipitate
	state := func(x float64, set []string) (*Equilibrium, error) {
		return r.Equilibrate(r.added(sol, g, x), set, 1)
	}
	record := func(m string, x float64, eq *Equilibrium) {
		o := Onset{Mineral: m, Amount: x, Clean: true, Result: eq.Result}
		for _, prev := range onset {
			for _, t := range r.db.Mineral(prev).Terms {
				if r.db.Component(t.Index).Charge <= 0 || t.Index == r.db.ComponentIndex(speciation.NameHPlus) {
					continue
				}
				supplied := r.supplied(sol, g, x, t.Component)
				if supplied <= 0 {
					continue
				}
				left, _ := eq.Result.Total(t.Component)
				if g.Water != nil {
					left *= 1 + x // per kg of the starting water's water
				}
				f := left / supplied
				o.Residual = append(o.Residual, Residual{Mineral: prev, Component: t.Component, Fraction: f})
				if f > 1-opt.CleanRemoval {
					o.Clean = false
				}
			}
		}
		if len(onset) > 0 && !o.Clean {
			out.Clean = false
		}
		out.Onsets = append(out.Onsets, o)
		onset = append(onset, m)
	}
	// already saturated at the start
	eq0, err := state(0, cands)
	if err != nil {
		return nil, err
	}
	for _, a := range eq0.Amounts {
		if a.MolKgw > 0 {
			record(a.Mineral, 0, eq0)
		}
	}
	lo := 0.0
	ratio := math.Pow(opt.MaxAmount/opt.MinAmount, 1/float64(opt.Steps-1))
	for i := 0; i < opt.Steps; i++ {
		x := opt.MinAmount * math.Pow(ratio, float64(i))
		if i == opt.Steps-1 {
			x = opt.MaxAmount
		}
		for guard := 0; guard < len(cands)+1; guard++ {
			// which not-yet-saturated candidate is supersaturated at x, with the
			// saturated ones precipitating?
			eq, err := state(x, onset)
			if err != nil {
				return nil, fmt.Errorf("addition %g %s: %w", x, g.Unit(), err)
			}
			var fresh []string
			for _, m := range cands {
				if si, ok := eq.Result.SI(m); ok && si > AddSI && !contains(onset, m) {
					fresh = append(fresh, m)
				}
			}
			if len(fresh) == 0 {
				break
			}
			// locate the earliest crossing among them by bisection on [lo, x]
			first, at := "", x
			var atEq *Equilibrium
			for _, m := range fresh {
				xm, em, err := r.bisectOnset(lo, x, m, onset, opt.Tolerance, state)
				if err != nil {
					return nil, err
				}
				if xm < at || first == "" {
					first, at, atEq = m, xm, em
				}
			}
			record(first, at, atEq)
			lo = at
		}
		lo = x
	}
	return out, nil
}

// bisectOnset finds the smallest addition in (lo, hi] at which mineral m reaches SI = 0
// while the minerals of set precipitate, by bisection (in log of the amount when lo > 0)
// to a relative width tol. It returns the upper end of the final bracket (SI >= 0).
func (r *Reactor) bisectOnset(lo, hi float64, m string, set []string, tol float64,
	state func(float64, []string) (*Equilibrium, error)) (float64, *Equilibrium, error) {
	eqHi, err := state(hi, set)
	if err != nil {
		return 0, nil, err
	}
	for it := 0; it < 300 && hi-lo > tol*hi; it++ {
		mid := 0.5 * (lo + hi)
		if lo > 0 && hi/lo > 4 {
			mid = math.Sqrt(lo * hi)
		}
		eq, err := state(mid, set)
		if err != nil {
			return 0, nil, err
		}
		if si, ok := eq.Result.SI(m); ok && si >= 0 {
			hi, eqHi = mid, eq
		} else {
			lo = mid
		}
	}
	return hi, eqHi, nil
}

// added returns the starting water plus x of the reagent.
func (r *Reactor) added(sol Solution, g Reagent, x float64) Solution {
	if g.Water != nil {
		f := x / (1 + x)
		// f = x/(1+x) lies in [0, 1) for x >= 0, the only fractions MixSolutions
		// accepts, so it cannot fail here.
		m, _ := MixSolutions(sol, *g.Water, f)
		m.TempC = sol.TempC
		return m
	}
	out := sol.Clone()
	for _, t := range g.Salt {
		// An acid (H+ in the formula) has no total of its own: it lowers the alkalinity
		// (ConserveAlkalinity) or is balanced by its anion (ChargeBalance).
		if t.Component != speciation.NameHPlus {
			out.setTotal(t.Component, out.Total(t.Component)+x*t.MolKgw)
		}
		out.Alkalinity += x * t.MolKgw * r.db.Component(r.db.ComponentIndex(t.Component)).Alkalinity
	}
	return out
}

// supplied is the moles of a component per kg of the starting water's water, from the
// starting water and x of the reagent.
func (r *Reactor) supplied(sol Solution, g Reagent, x float64, c string) float64 {
	s := sol.Total(c)
	if g.Water != nil {
		return s + x*g.Water.Total(c)
	}
	for _, t := range g.Salt {
		if t.Component == c {
			s += x * t.MolKgw
		}
	}
	return s
}
