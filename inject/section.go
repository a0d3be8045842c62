package inject

import (
	"fmt"
	"math"
	"strings"

	"gwsat.dev/gwsat/report"
	"gwsat.dev/gwsat/speciation/reaction"
)

// SectionOptions choose the injection-planning section of a site report.
type SectionOptions struct {
	// Injectate and Native are sample ids; "" picks the first speciated row
	// whose sample type says "injectate" or "native" (see ByType).
	Injectate, Native string
	// AquiferTempC is the temperature of the blends; NaN: the native water's.
	AquiferTempC float64
	Well         Well
}

// Section builds the injection-planning section of a report: the blend curve at
// the aquifer temperature, the warming curve of the injectate, the deposit at
// the blend where the scale minerals are most supersaturated, and a pore-filling
// screen of that blend. It returns nil when the input names no end-members.
func (p *Planner) Section(opt SectionOptions) (*report.Section, []report.Fig, error) {
	inj, nat := opt.Injectate, opt.Native
	if inj == "" {
		inj = ByType(p.recs, "injectate")
	}
	if nat == "" {
		nat = ByType(p.recs, "native")
	}
	if inj == "" || nat == "" {
		return nil, nil, nil
	}
	if err := opt.Well.Check(); err != nil {
		return nil, nil, err
	}
	_, rn, err := p.Water("native water", nat)
	if err != nil {
		return nil, nil, err
	}
	t := opt.AquiferTempC
	if math.IsNaN(t) {
		t = rn.TempC()
	}
	blend, err := p.Blend(BlendOptions{Native: nat, Injectate: inj, TempC: t, FixedTemp: true})
	if err != nil {
		return nil, nil, err
	}
	warm, err := p.Warm(WarmOptions{Sample: inj})
	if err != nil {
		return nil, nil, err
	}
	share := p.worstShare(blend.Sweep)
	pf, err := p.PoreFill(PoreFillOptions{Deposit: DepositOptions{Water: WaterChoice{Native: nat, Injectate: inj, Share: share, TempC: &t}}, Well: opt.Well})
	if err != nil {
		return nil, nil, err
	}
	prec := pf.Deposit.Precipitation
	sec := &report.Section{Title: "Injection planning: " + inj + " into " + nat}
	sec.Paragraphs = append(sec.Paragraphs,
		fmt.Sprintf("The injectate %s is blended with the native water %s by mass of water, each blend re-solved as a closed system at the aquifer temperature %.1f C (alkalinity and total carbon conserved).", inj, nat, t),
		fmt.Sprintf("The deposit is computed for the blend where the scale minerals are most supersaturated: %s.", pf.Deposit.Name))
	for _, a := range prec.Together.Amounts {
		sec.Paragraphs = append(sec.Paragraphs, fmt.Sprintf("%s (SI %+.2f) would deposit %s mmol/kgw (%s mg/L) to reach equilibrium with the others.", a.Mineral, a.SIBefore, report.Sig(a.MmolKgw, 3), report.Sig(a.MgL, 3)))
	}
	if len(prec.Together.Amounts) == 0 {
		sec.Paragraphs = append(sec.Paragraphs, "No common scale mineral is supersaturated in that blend: nothing would deposit.")
	}
	if prec.HasCCPP {
		sec.Paragraphs = append(sec.Paragraphs, fmt.Sprintf("Calcium carbonate precipitation potential (Standard Methods 2330) of that blend: %.1f mg/L as CaCO3.", prec.CCPP))
	}
	sec.Paragraphs = append(sec.Paragraphs, "Pore-filling screen, if every m3 injected were that blend: "+strings.Join(pf.Sentences(), " "))
	sec.Tables = []*report.PageTable{report.NewPageTable(blend.PeaksTable(), "Peak saturation index of each mineral along the blend", nil)}
	figs := []report.Fig{blend.Figure(), warm.Figure()}
	if pf.Deposit.HasFigure() {
		figs = append(figs, pf.Deposit.Figure())
	}
	sec.Figures = make([]report.IndexFigure, len(figs))
	return sec, figs, nil
}

// worstShare is the injectate share, among true blends (0 < share < 1), where the
// sum of the positive SIs of the scale minerals peaks.
func (p *Planner) worstShare(sw *reaction.Sweep) float64 {
	scale := map[string]bool{}
	for _, s := range p.reactor.KnownMinerals(reaction.ScaleMinerals()) {
		scale[s] = true
	}
	best, bestScore := 0.5, -1.0
	for _, pt := range sw.Points {
		if pt.Fraction <= 0 || pt.Fraction >= 1 {
			continue // an end-member, not a blend
		}
		score := 0.0
		for i, mn := range sw.Minerals {
			if pt.Defined[i] && scale[mn] && pt.SI[i] > 0 {
				score += pt.SI[i]
			}
		}
		if score > bestScore {
			best, bestScore = pt.Fraction, score
		}
	}
	return best
}
