package uncertainty

import (
	"fmt"
	"math"
)

// Finite-difference steps of Linear: small enough that the SI is linear
// over them, large enough against the solver's 1e-10 convergence.
const (
	stepPH    = 0.01
	stepTempC = 0.1
	stepRel   = 1e-3
)

// Linear estimates the intervals of c from the sensitivity of each SI to
// each input (central differences) combined in quadrature; see the package
// documentation.
func (e *Estimator) Linear(c *Case) (Result, error) {
	r := Result{Method: MethodLinear, Inputs: c.Inputs}
	minerals, err := e.best(c)
	if err != nil {
		return r, err
	}
	nm, ni := len(minerals), len(c.Inputs)
	e.pos = e.pos[:0]
	for k := range minerals {
		e.pos = append(e.pos, k)
	}
	sens := make([]float64, nm*ni)
	rise := make([]float64, nm) // from the non-detects, at the top
	siAt := func(in *Input, v float64, dst []float64) error {
		in.set(&e.w, v)
		err := e.solver.SolveInto(&e.res, &e.w)
		in.set(&e.w, in.Value)
		if err != nil {
			return fmt.Errorf("%w: %s at %g: %w", ErrDraws, in.Name, v, err)
		}
		for k := range minerals {
			si, ok := e.mineralSI(k, minerals[k].Name)
			if !ok {
				return fmt.Errorf("%w: %s at %g: no SI for %s", ErrDraws, in.Name, v, minerals[k].Name)
			}
			dst[k] = si
		}
		return nil
	}
	up, down := make([]float64, nm), make([]float64, nm)
	for i := range c.Inputs {
		in := &c.Inputs[i]
		if in.NonDetect {
			if err := siAt(in, in.LimitMolKgw, up); err != nil {
				return r, err
			}
			for k := range minerals {
				rise[k] += math.Max(0, up[k]-minerals[k].SI)
			}
			continue
		}
		a, b := in.Value-step(in), in.Value+step(in)
		if in.Kind == TempC {
			a, b = math.Max(a, 0), math.Min(b, 100)
		}
		if err := siAt(in, b, up); err != nil {
			return r, err
		}
		if e.opt.Forward && b > in.Value {
			// One-sided: the SI as measured stands for the lower point.
			a = in.Value
			for k := range minerals {
				down[k] = minerals[k].SI
			}
		} else if err := siAt(in, a, down); err != nil {
			return r, err
		}
		for k := range minerals {
			sens[k*ni+i] = (up[k] - down[k]) / (b - a)
		}
	}
	open := e.openBottom(c, minerals)
	r.Intervals = make([]Interval, nm)
	for k, m := range minerals {
		var v float64
		for i := range c.Inputs {
			d := sens[k*ni+i] * c.Inputs[i].SD
			v += d * d
		}
		sd := math.Sqrt(v)
		iv := Interval{Mineral: m.Name, Best: m.SI, SD: sd, LowOpen: open[k], Sensitivity: sens[k*ni : (k+1)*ni : (k+1)*ni]}
		iv.Low, iv.High = m.SI-e.z*sd, m.SI+e.z*sd+rise[k]
		iv.Verdict = verdict(iv.Low, iv.High, iv.LowOpen, e.opt.Band)
		r.Intervals[k] = iv
	}
	return r, nil
}

// step is the finite-difference half-step of an input.
func step(in *Input) float64 {
	switch in.Kind {
	case PH:
		return stepPH
	case TempC:
		return stepTempC
	}
	return stepRel * in.Value
}
