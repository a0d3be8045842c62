package assess

import (
	"gwsat.dev/gwsat/hydro"
	"gwsat.dev/gwsat/speciation"
)

// Detailer gives back the full speciation (every species and the distribution of
// each component) of records that were assessed without it (Options.Detail
// false), by assessing their rows again: a large file's records stay small, and
// the detail exists only while it is written. Rows are solved from a cold start,
// so the detail is that of the first assessment exactly. A Detailer is for one
// goroutine.
type Detailer struct {
	solver, brine *speciation.Solver
	sw            speciation.Water
	opt           Options
}

// NewDetailer returns a Detailer for records assessed with opt.
func NewDetailer(db *speciation.Database, opt Options) *Detailer {
	auto := opt.Model == nil
	if auto {
		opt.Model = speciation.TruesdellJones{}
	}
	d := &Detailer{solver: speciation.NewSolver(db, opt.Model), opt: opt}
	d.solver.WarmStart = false
	if auto {
		d.brine = speciation.NewSolver(db, speciation.NewPitzer())
		d.brine.WarmStart = false
	}
	d.opt.Detail = true
	d.opt.Progress = nil
	return d
}

// Record returns a copy of r with its detail, or r itself when it has no
// result or already has the detail.
func (d *Detailer) Record(r *Record) *Record {
	if r.Result == nil || len(r.Result.Species) > 0 {
		return r
	}
	out := Record{File: r.File, Row: r.Row}
	out.Row.Issues = append([]hydro.Issue(nil), r.Row.Issues...)
	assessOne(&out, d.solver, d.brine, &d.sw, d.opt)
	if out.Result == nil {
		return r
	}
	return &out
}
