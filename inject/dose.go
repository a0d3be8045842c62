package inject

import (
	"errors"
	"fmt"

	"gwsat.dev/gwsat/report"
	"gwsat.dev/gwsat/speciation/reaction"
)

// DoseOptions choose a dosing run: a pure salt or a second water added step by
// step to a water.
type DoseOptions struct {
	Sample string // the water dosed
	// Salt is a pure salt written as components, e.g. "2 Na+ + SO4 2-" (amounts
	// in mol per kg of water); SaltLabel names it in outputs (default: Salt).
	Salt, SaltLabel string
	// AddWater is the sample id of a water added instead of a salt (amounts in kg
	// of its water per kg).
	AddWater string
	// UpTo is the largest amount added (default 0.1 mol/kgw of salt, 10 kg/kg of
	// a water).
	UpTo float64
	// CleanRemoval is the share of an earlier mineral's cation that must be gone
	// before the next mineral starts, for a clean separation (default 0.999).
	CleanRemoval float64
	// Candidates that may deposit; nil: reaction.ScaleMinerals.
	Candidates []string
}

// DoseResult is the order in which the candidates saturate.
type DoseResult struct {
	Sequence *reaction.SequenceResult
	Sample   string
	UpTo     float64
}

// Dose adds the reagent step by step and finds the order of saturation.
func (p *Planner) Dose(opt DoseOptions) (*DoseResult, error) {
	if opt.CleanRemoval == 0 {
		opt.CleanRemoval = 0.999
	}
	if !(opt.CleanRemoval > 0 && opt.CleanRemoval < 1) {
		return nil, fmt.Errorf("clean removal %g must lie in (0, 1)", opt.CleanRemoval)
	}
	if !(opt.UpTo >= 0) {
		return nil, fmt.Errorf("largest amount %g must not be negative", opt.UpTo)
	}
	w, _, err := p.Water("water", opt.Sample)
	if err != nil {
		return nil, err
	}
	var g reaction.Reagent
	switch {
	case opt.Salt != "" && opt.AddWater != "":
		return nil, errors.New("give a salt or a water to add, not both")
	case opt.Salt != "":
		name := opt.SaltLabel
		if name == "" {
			name = opt.Salt
		}
		if g, err = reaction.ParseSalt(p.db, name, opt.Salt); err != nil {
			return nil, fmt.Errorf("salt to add: %w", err)
		}
		if opt.UpTo == 0 {
			opt.UpTo = 0.1
		}
	case opt.AddWater != "":
		rw, _, err := p.Water("added water", opt.AddWater)
		if err != nil {
			return nil, err
		}
		g = reaction.Reagent{Name: opt.AddWater, Water: &rw}
		if opt.UpTo == 0 {
			opt.UpTo = 10
		}
	default:
		return nil, errors.New("give a salt or a water to add")
	}
	res, err := p.reactor.Sequence(w, g, reaction.SequenceOptions{Minerals: opt.Candidates, MaxAmount: opt.UpTo, CleanRemoval: opt.CleanRemoval})
	if err != nil {
		return nil, err
	}
	return &DoseResult{Sequence: res, Sample: opt.Sample, UpTo: opt.UpTo}, nil
}

// Table lists the onsets in order.
func (d *DoseResult) Table() *report.Table { return SequenceTable(d.Sequence) }

// Summary is what the command prints.
func (d *DoseResult) Summary() []string {
	res := d.Sequence
	out := []string{fmt.Sprintf("gwsat inject dose: %s added to %s (up to %g %s)", res.Reagent, d.Sample, d.UpTo, res.Unit)}
	if len(res.Onsets) == 0 {
		out = append(out, "  no candidate mineral reaches saturation in that range")
	}
	for i, o := range res.Onsets {
		line := fmt.Sprintf("  %d. %-14s saturates at %s %s", i+1, o.Mineral, report.Sig(o.Amount, 4), res.Unit)
		for _, r := range o.Residual {
			line += fmt.Sprintf("; %s %s still dissolved: %s %%", r.Mineral, r.Component, report.Sig(100*r.Fraction, 3))
		}
		out = append(out, line)
	}
	if len(res.Onsets) > 1 {
		out = append(out, fmt.Sprintf("  clean separation (>= %.1f %% removed before the next begins): %v", 100*res.CleanRemoval, res.Clean))
	}
	return append(out, "  "+report.CautionLine)
}
