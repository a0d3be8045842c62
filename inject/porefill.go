package inject

import (
	"fmt"
	"math"

	"gwsat.dev/gwsat/report"
	"gwsat.dev/gwsat/speciation/reaction"
)

// Well describes the well and the injection of a pore-filling screen.
type Well struct {
	RateM3PerDay  float64 // injection rate (default 500)
	Days          float64 // duration (default 365)
	ScreenLengthM float64 // screen length (default 90)
	Porosity      float64 // effective porosity near the well (default 0.2)
	RadiusM       float64 // radius within which the filled share is reported (default 2)
	WellRadiusM   float64 // radius of the bore (default 0.15)
	FillShare     float64 // share of the porosity for the fill radius (default 0.1)
}

// DefaultWell is the well of a screen when none is described: 500 m3/day for a
// year into a 90 m screen at porosity 0.2 (invented round numbers, a common
// order of magnitude for aquifer storage wells; common practice).
func DefaultWell() Well {
	return Well{RateM3PerDay: 500, Days: 365, ScreenLengthM: 90, Porosity: 0.2, RadiusM: 2, WellRadiusM: 0.15, FillShare: 0.1}
}

// Check refuses numbers that cannot describe a well, before any chemistry.
func (w Well) Check() error {
	finite := func(v float64) bool { return !math.IsNaN(v) && !math.IsInf(v, 0) }
	switch {
	case !(w.RateM3PerDay >= 0) || !finite(w.RateM3PerDay):
		return fmt.Errorf("injection rate %g m3/day must be a finite number not below 0", w.RateM3PerDay)
	case !(w.Days > 0) || !finite(w.Days):
		return fmt.Errorf("duration %g days must be positive", w.Days)
	case !(w.ScreenLengthM > 0) || !finite(w.ScreenLengthM):
		return fmt.Errorf("screen length %g m must be positive", w.ScreenLengthM)
	case !(w.Porosity > 0 && w.Porosity < 1):
		return fmt.Errorf("porosity %g must lie in (0, 1)", w.Porosity)
	case !(w.RadiusM > w.WellRadiusM && w.WellRadiusM >= 0) || !finite(w.RadiusM):
		return fmt.Errorf("radius %g m must exceed the bore radius %g m", w.RadiusM, w.WellRadiusM)
	case !(w.FillShare > 0 && w.FillShare <= 1):
		return fmt.Errorf("fill share %g must lie in (0, 1]", w.FillShare)
	}
	return nil
}

// PoreFillOptions choose a pore-filling screen.
type PoreFillOptions struct {
	Deposit DepositOptions
	Well    Well
}

// PoreFillResult is an upper-bound screen of how fast the deposit of the chosen
// water fills the pores around the well.
type PoreFillResult struct {
	Deposit *DepositResult
	// Oxidation is the oxidation step of a blend (iron and manganese oxides),
	// nil when the blend has no oxidant meeting a reductant.
	Oxidation *Oxidation
	Clogging  *reaction.CloggingResult
	Well      Well
}

// PoreFill computes the deposit of the chosen water and the pore space its
// solids would fill near the well.
func (p *Planner) PoreFill(opt PoreFillOptions) (*PoreFillResult, error) {
	if err := opt.Well.Check(); err != nil {
		return nil, err
	}
	d, err := p.Deposit(opt.Deposit)
	if err != nil {
		return nil, err
	}
	ox := d.Oxidation
	w := opt.Well
	pr := d.Precipitation
	solids := reaction.SolidsPerM3(pr.Together.Amounts, pr.KgwPerL)
	if ox != nil {
		solids = append(solids, ox.Result.CloggingSolids()...)
	}
	c, err := reaction.Clogging(p.db, reaction.CloggingInput{Solids: solids,
		RateM3PerDay: w.RateM3PerDay, Days: w.Days, ScreenLengthM: w.ScreenLengthM, Porosity: w.Porosity,
		RadiusM: w.RadiusM, WellRadiusM: w.WellRadiusM, FillFraction: w.FillShare})
	if err != nil {
		return nil, err
	}
	return &PoreFillResult{Deposit: d, Oxidation: ox, Clogging: c, Well: w}, nil
}

// Table lists the solids per mineral and in total.
func (r *PoreFillResult) Table() *report.Table { return CloggingTable(r.Clogging) }

// Sentences words the screen for a report.
func (r *PoreFillResult) Sentences() []string {
	c, w := r.Clogging, r.Well
	out := []string{fmt.Sprintf("%s m3/day for %s days into a %s m screen at porosity %.2f deposits %s m3 of solids (%s m3 per year).",
		report.Sig(w.RateM3PerDay, 3), report.Sig(w.Days, 3), report.Sig(w.ScreenLengthM, 3), w.Porosity, report.Sig(c.SolidVolumeM3, 3), report.Sig(c.SolidVolumeM3PerYr, 3))}
	switch {
	case c.SolidVolumeM3 <= 0:
		out = append(out, "Nothing deposits: no pore space would be filled.")
	case c.FullyClogged:
		out = append(out, fmt.Sprintf("The pores within %s m of the well would be fully clogged after about %s days of injection.", report.Sig(w.RadiusM, 3), report.Sig(c.DaysToFull, 3)))
	default:
		out = append(out, fmt.Sprintf("That fills %s %% of the pore space within %s m of the well (%s %% per year; full after about %s days); %.0f %% of the porosity would be filled within %s m.",
			report.Sig(100*c.FilledFraction, 3), report.Sig(w.RadiusM, 3), report.Sig(100*c.FilledFractionPerYr, 3), report.Sig(c.DaysToFull, 3), 100*c.FillFraction, report.Sig(c.RadiusForFillM, 3)))
	}
	return append(out, c.Caution)
}

// Summary is what the command prints.
func (r *PoreFillResult) Summary() []string {
	out := []string{"gwsat inject porefill: " + r.Deposit.Name}
	if r.Oxidation != nil {
		for _, s := range r.Oxidation.Sentences() {
			out = append(out, "  "+s)
		}
	}
	for _, s := range r.Sentences() {
		out = append(out, "  "+s)
	}
	return out
}
