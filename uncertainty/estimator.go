package uncertainty

import (
	"fmt"
	"math"
	"math/rand/v2"
	"slices"

	"gwsat.dev/gwsat/speciation"
)

// Estimator computes intervals for one case at a time. It keeps a solver,
// a working water and scratch space, so repeated estimates do not allocate
// per draw; it is not safe for concurrent use: use one per goroutine.
type Estimator struct {
	opt    Options
	z      float64
	solver *speciation.Solver
	db     *speciation.Database
	w      speciation.Water
	res    speciation.Result
	pcg    rand.PCG
	rng    *rand.Rand
	vals   []float64 // draws x minerals, by mineral
	pos    []int     // position of each reported mineral in the draw's result
	comps  map[string][]string
}

// NewEstimator returns an estimator for db with opt (defaults filled).
func NewEstimator(db *speciation.Database, opt Options) (*Estimator, error) {
	o, err := opt.resolved()
	if err != nil {
		return nil, err
	}
	e := &Estimator{opt: o, z: o.z(), solver: speciation.NewSolver(db, o.Model), db: db, comps: map[string][]string{}}
	e.rng = rand.New(&e.pcg)
	return e, nil
}

// Options returns the options in use, defaults filled.
func (e *Estimator) Options() Options { return e.opt }

// Result is the estimate for one case.
type Result struct {
	// Method is "monte-carlo" or "linear".
	Method string
	// Seed and Stream seed the draws (rand.NewPCG(Seed, Stream)); Draws
	// counts the draws that solved and Failed those that did not.
	Seed, Stream  uint64
	Draws, Failed int
	Intervals     []Interval
	// Inputs are the inputs varied, in the order of Interval.Sensitivity.
	Inputs []Input
}

// Interval returns the interval of the named mineral, or nil.
func (r *Result) Interval(mineral string) *Interval {
	for i := range r.Intervals {
		if r.Intervals[i].Mineral == mineral {
			return &r.Intervals[i]
		}
	}
	return nil
}

// MethodMonteCarlo and MethodLinear name the estimates.
const (
	MethodMonteCarlo = "monte-carlo"
	MethodLinear     = "linear"
)

// best solves the case as measured and returns its minerals (copied).
func (e *Estimator) best(c *Case) ([]speciation.MineralSI, error) {
	e.w = c.Water.Clone()
	// A cold start: the warm start would begin from whatever case this
	// estimator solved before, and the numbers of a case must not depend on
	// which worker got it (they would differ within the solver's 1e-10).
	e.solver.WarmStart = false
	err := e.solver.SolveInto(&e.res, &e.w)
	e.solver.WarmStart = true
	if err != nil {
		return nil, fmt.Errorf("%w: the water as measured: %w", ErrDraws, err)
	}
	return slices.Clone(e.res.Minerals), nil
}

// openBottom says, per mineral, whether a non-detect of the case is one of
// its components.
func (e *Estimator) openBottom(c *Case, minerals []speciation.MineralSI) []bool {
	open := make([]bool, len(minerals))
	for k, m := range minerals {
		for _, in := range c.Inputs {
			if in.NonDetect && slices.Contains(e.componentsOf(m.Name), in.Component) {
				open[k] = true
			}
		}
	}
	return open
}

// componentsOf lists the components of a mineral's reaction.
func (e *Estimator) componentsOf(mineral string) []string {
	if cs, ok := e.comps[mineral]; ok {
		return cs
	}
	var cs []string
	if m := e.db.Mineral(mineral); m != nil {
		for _, t := range m.Terms {
			cs = append(cs, e.db.Component(t.Index).Name)
		}
	}
	e.comps[mineral] = cs
	return cs
}

// draw returns a random value of input in.
func (e *Estimator) draw(in *Input) float64 {
	if in.NonDetect {
		return in.LimitMolKgw * math.Max(NonDetectFloor, e.rng.Float64())
	}
	var v float64
	if e.opt.Dist == Uniform {
		v = in.Value + in.SD*math.Sqrt(3)*(2*e.rng.Float64()-1)
	} else {
		v = in.Value + in.SD*e.rng.NormFloat64()
	}
	return clampInput(in, v)
}

// clampInput keeps a value where the solver accepts it: concentrations above
// 1e-3 of their value, temperatures within 0-100 C, pH within 0-14.
func clampInput(in *Input, v float64) float64 {
	switch in.Kind {
	case Total, Alkalinity:
		return math.Max(v, 1e-3*in.Value)
	case TempC:
		return math.Min(math.Max(v, 0), 100)
	}
	return math.Min(math.Max(v, 0), 14)
}

// mineralSI returns the SI of minerals[k] in e.res, finding its position
// once and checking the name each time.
func (e *Estimator) mineralSI(k int, name string) (float64, bool) {
	if p := e.pos[k]; p >= 0 && p < len(e.res.Minerals) && e.res.Minerals[p].Name == name {
		return e.res.Minerals[p].SI, true
	}
	for p := range e.res.Minerals {
		if e.res.Minerals[p].Name == name {
			e.pos[k] = p
			return e.res.Minerals[p].SI, true
		}
	}
	return 0, false
}

// MonteCarlo estimates the intervals of c by drawing every input
// Options.Draws times, seeded with (Options.Seed, stream).
func (e *Estimator) MonteCarlo(c *Case, stream uint64) (Result, error) {
	r := Result{Method: MethodMonteCarlo, Seed: e.opt.Seed, Stream: stream, Inputs: c.Inputs}
	minerals, err := e.best(c)
	if err != nil {
		return r, err
	}
	nm, nd := len(minerals), e.opt.Draws
	e.vals = slices.Grow(e.vals[:0], nm*nd)[:nm*nd]
	e.pos = slices.Grow(e.pos[:0], nm)[:nm]
	for k := range e.pos {
		e.pos[k] = k
	}
	e.pcg.Seed(e.opt.Seed, stream)
	good := 0
	for d := 0; d < nd; d++ {
		for i := range c.Inputs {
			c.Inputs[i].set(&e.w, e.draw(&c.Inputs[i]))
		}
		if err := e.solver.SolveInto(&e.res, &e.w); err != nil {
			r.Failed++
			continue
		}
		ok := true
		for k := range minerals {
			si, found := e.mineralSI(k, minerals[k].Name)
			if !found || math.IsNaN(si) || math.IsInf(si, 0) {
				ok = false
				break
			}
			e.vals[k*nd+good] = si
		}
		if !ok {
			r.Failed++
			continue
		}
		good++
	}
	r.Draws = good
	if good < 2 || float64(r.Failed) > MaxFailedShare*float64(nd) {
		return r, fmt.Errorf("%w: %d of %d draws failed (more than %.0f %%)", ErrDraws, r.Failed, nd, 100*MaxFailedShare)
	}
	open := e.openBottom(c, minerals)
	lo, hi := (1-e.opt.Coverage)/2, (1+e.opt.Coverage)/2
	r.Intervals = make([]Interval, nm)
	for k, m := range minerals {
		x := e.vals[k*nd : k*nd+good]
		_, sd := meanSD(x)
		slices.Sort(x)
		iv := Interval{Mineral: m.Name, Best: m.SI, Low: quantile(x, lo), High: quantile(x, hi), LowOpen: open[k], SD: sd}
		iv.Verdict = verdict(iv.Low, iv.High, iv.LowOpen, e.opt.Band)
		r.Intervals[k] = iv
	}
	return r, nil
}
