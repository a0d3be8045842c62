package inject

import (
	"fmt"
	"sort"

	"gonum.org/v1/plot/vg"

	"gwsat.dev/gwsat/assess"
	"gwsat.dev/gwsat/report"
	"gwsat.dev/gwsat/speciation"
	"gwsat.dev/gwsat/speciation/reaction"
)

// BlendOptions choose a blend sweep.
type BlendOptions struct {
	Native, Injectate string    // sample ids: share 0 is the native water, share 1 the injectate
	Shares            []float64 // shares of the injectate by mass of water, 0-1 (default 0, 0.05, ..., 1)
	// TempC is the temperature of every blend when FixedTemp is set (e.g. the
	// aquifer's); otherwise each blend is at the heat balance of the two.
	TempC     float64
	FixedTemp bool
	// Minerals drawn in the figure; nil: up to MaxCurves whose SI rises above
	// -NearEquilibriumBand somewhere.
	Minerals []string
}

// BlendResult is a blend sweep with what the command shows of it.
type BlendResult struct {
	Sweep             *reaction.Sweep
	Native, Injectate string
	Options           BlendOptions
	Model             string

	db    *speciation.Database
	model speciation.ActivityModel
}

// DefaultShares are the shares of a blend sweep when none are given.
func DefaultShares() []float64 {
	out := make([]float64, 21)
	for i := range out {
		out[i] = float64(i) / 20
	}
	return out
}

// Blend mixes the native water with the injectate at each share.
func (p *Planner) Blend(opt BlendOptions) (*BlendResult, error) {
	if opt.Shares == nil {
		opt.Shares = DefaultShares()
	}
	if opt.FixedTemp {
		if err := checkTemp("blend temperature", opt.TempC); err != nil {
			return nil, err
		}
	}
	wn, _, err := p.Water("native water", opt.Native)
	if err != nil {
		return nil, err
	}
	wi, _, err := p.Water("injectate", opt.Injectate)
	if err != nil {
		return nil, err
	}
	sw, err := p.reactor.Sweep(wn, wi, reaction.SweepOptions{Fractions: opt.Shares, TempC: opt.TempC, FixedTemp: opt.FixedTemp})
	if err != nil {
		return nil, err
	}
	return &BlendResult{Sweep: sw, Native: opt.Native, Injectate: opt.Injectate, Options: opt, Model: p.reactor.Model().Name(), db: p.db, model: p.reactor.Model()}, nil
}

// Table is one row per share with the SI of every mineral.
func (b *BlendResult) Table() *report.Table { return SweepTable(b.Sweep) }

// PeaksTable lists where each mineral's SI peaks along the sweep.
func (b *BlendResult) PeaksTable() *report.Table { return MaximaTable(b.Sweep) }

func (b *BlendResult) tempNote() string {
	if b.Options.FixedTemp {
		return fmt.Sprintf("every blend at %.1f C", b.Options.TempC)
	}
	return "each blend at the heat-balance temperature"
}

// Figure draws SI against the injectate's share.
func (b *BlendResult) Figure() report.Fig {
	mins := b.Options.Minerals
	if mins == nil {
		mins = Relevant(b.Sweep)
	}
	cap := fmt.Sprintf("Share 0 is the native water %s, 1 the injectate %s. Closed-system blending by mass of water, alkalinity and total carbon conserved, %s, %s model. Screening result, not a design.",
		b.Native, b.Injectate, b.tempNote(), b.Model)
	return report.Fig{Stem: "blend_si_share", Title: "SI against the injectate's share", Caption: cap,
		Figure: SweepFigure(b.Sweep, fmt.Sprintf("Blending %s (0) with %s (1)", b.Native, b.Injectate), "", false, mins),
		W:      16 * vg.Centimeter, H: 12 * vg.Centimeter}
}

// Summary is what the command prints: the blend and each mineral's peak.
func (b *BlendResult) Summary() []string {
	out := []string{fmt.Sprintf("gwsat inject blend: %s with %s, %d %s, %s", b.Native, b.Injectate, len(b.Sweep.Points), plural(len(b.Sweep.Points), "share", "shares"), b.tempNote())}
	for _, m := range b.Sweep.Maxima() {
		out = append(out, fmt.Sprintf("  %-16s peak SI %s at injectate share %.2f (%s)", m.Mineral, report.Signed(m.SI, 2), m.Fraction, assess.State(m.SI)))
	}
	maxI, temps := sweepRange(b.Sweep)
	out = append(out, rangeNotes(b.db, b.model, maxI, temps, b.Sweep.Minerals)...)
	return append(out, "  "+report.CautionLine)
}

// MaxCurves caps the minerals drawn in one curve figure, so that it stays
// readable.
const MaxCurves = 8

// Relevant lists the minerals whose SI rises above -NearEquilibriumBand
// somewhere along a sweep, the highest peaks first, at most MaxCurves.
func Relevant(sw *reaction.Sweep) []string {
	mx := sw.Maxima()
	sort.SliceStable(mx, func(i, j int) bool { return mx[i].SI > mx[j].SI })
	var out []string
	for _, m := range mx {
		if m.SI > -assess.NearEquilibriumBand && len(out) < MaxCurves {
			out = append(out, m.Mineral)
		}
	}
	return out
}

func plural(n int, one, many string) string {
	if n == 1 {
		return one
	}
	return many
}
