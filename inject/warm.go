package inject

import (
	"fmt"

	"gonum.org/v1/plot/vg"

	"gwsat.dev/gwsat/report"
	"gwsat.dev/gwsat/speciation"
	"gwsat.dev/gwsat/speciation/reaction"
)

// WarmOptions choose a temperature sweep of one water.
type WarmOptions struct {
	Sample   string
	TempsC   []float64 // default 10, 15, ..., 90 C
	Minerals []string  // drawn in the figure; nil: Relevant
}

// WarmResult is a temperature sweep with what the command shows of it.
type WarmResult struct {
	Sweep   *reaction.Sweep
	Sample  string
	Options WarmOptions
	Model   string

	db    *speciation.Database
	model speciation.ActivityModel
}

// DefaultTemps are the temperatures of a warming sweep when none are given.
func DefaultTemps() []float64 {
	var out []float64
	for t := 10.0; t <= 90; t += 5 {
		out = append(out, t)
	}
	return out
}

// Warm heats or cools one water as a closed system.
func (p *Planner) Warm(opt WarmOptions) (*WarmResult, error) {
	if opt.TempsC == nil {
		opt.TempsC = DefaultTemps()
	}
	for _, t := range opt.TempsC {
		if err := checkTemp("temperature", t); err != nil {
			return nil, err
		}
	}
	w, _, err := p.Water("water", opt.Sample)
	if err != nil {
		return nil, err
	}
	sw, err := p.reactor.TemperatureSweep(w, opt.TempsC, nil)
	if err != nil {
		return nil, err
	}
	return &WarmResult{Sweep: sw, Sample: opt.Sample, Options: opt, Model: p.reactor.Model().Name(), db: p.db, model: p.reactor.Model()}, nil
}

// Table is one row per temperature with the SI of every mineral.
func (r *WarmResult) Table() *report.Table { return SweepTable(r.Sweep) }

// Figure draws SI against temperature.
func (r *WarmResult) Figure() report.Fig {
	mins := r.Options.Minerals
	if mins == nil {
		mins = Relevant(r.Sweep)
	}
	cap := fmt.Sprintf("Closed system: totals and alkalinity fixed, pH recomputed at each temperature; %s model. Screening result, not a design.", r.Model)
	return report.Fig{Stem: "warm_si_temperature", Title: "SI against temperature: " + r.Sample, Caption: cap,
		Figure: SweepFigure(r.Sweep, "Warming or cooling "+r.Sample, "", true, mins), W: 16 * vg.Centimeter, H: 12 * vg.Centimeter}
}

// Summary is what the command prints.
func (r *WarmResult) Summary() []string {
	ts := r.Options.TempsC
	out := []string{fmt.Sprintf("gwsat inject warm: %s over %g-%g C", r.Sample, ts[0], ts[len(ts)-1])}
	for _, m := range r.Sweep.Maxima() {
		out = append(out, fmt.Sprintf("  %-16s peak SI %s at %.0f C", m.Mineral, report.Signed(m.SI, 2), m.TempC))
	}
	maxI, temps := sweepRange(r.Sweep)
	out = append(out, rangeNotes(r.db, r.model, maxI, temps, r.Sweep.Minerals)...)
	return append(out, "  "+report.CautionLine)
}
