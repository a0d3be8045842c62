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
	// Injectate is a sample id; "" picks the first speciated row whose sample
	// type says "injectate" (see ByType).
	Injectate string
	// Native is a sample id evaluated first; every other row whose sample type
	// says "native" is evaluated too (NativeWaters), one per zone of a
	// stratified aquifer.
	Native string
	// AquiferTempC is the temperature of the blends with the injectate; NaN:
	// each native water's own.
	AquiferTempC float64
	Well         Well
	// NoCrossFlow leaves out the blends of native waters of adjacent zones
	// (water moving along a long screen open to both).
	NoCrossFlow bool
	// Minerals are always drawn in the blend figures (e.g. those the maps
	// show), besides the ones whose SI rises near zero.
	Minerals []string
}

// Section builds the injection-planning section of a report. Every native
// water is blended with the injectate at its zone's temperature and, unless
// NoCrossFlow, each pair of native waters of adjacent zones with each other
// (cross-flow). The worst blend with the injectate (where the positive SIs of
// the scale minerals sum highest) gets the blend curve, the deposit and the
// pore-filling screen; the worst cross-flow blend gets its own curve. The table
// lists every blend, so tables, text and figures name the same worst case. It
// returns nil when the input names no injectate or no native water.
func (p *Planner) Section(opt SectionOptions) (*report.Section, []report.Fig, error) {
	inj := opt.Injectate
	if inj == "" {
		inj = ByType(p.recs, "injectate")
	}
	// Zones by depth (adjacent zones are neighbours in this list); the native
	// water asked for is evaluated with them, first when it has no type.
	zones, dropped := p.fewNatives(NativeWaters(p.recs))
	natives := zones
	if opt.Native != "" && !contains(zones, opt.Native) {
		natives = append([]string{opt.Native}, zones...)
	}
	if inj == "" || len(natives) == 0 {
		return nil, nil, nil
	}
	if err := opt.Well.Check(); err != nil {
		return nil, nil, err
	}
	scale := map[string]bool{}
	for _, s := range p.reactor.KnownMinerals(reaction.ScaleMinerals()) {
		scale[s] = true
	}
	var pairs []pairing
	for _, nat := range natives {
		_, rn, err := p.Water("native water", nat)
		if err != nil {
			return nil, nil, err
		}
		t := opt.AquiferTempC
		if math.IsNaN(t) {
			t = rn.TempC()
		}
		b, err := p.Blend(BlendOptions{Native: nat, Injectate: inj, TempC: t, FixedTemp: true})
		if err != nil {
			return nil, nil, err
		}
		pairs = append(pairs, pairing{First: nat, Second: inj, Blend: b, Worst: worst(b.Sweep, scale)})
	}
	if !opt.NoCrossFlow {
		for i := 0; i+1 < len(zones); i++ {
			// Deeper water first: share 1 is the shallower one flowing down.
			b, err := p.Blend(BlendOptions{Native: zones[i+1], Injectate: zones[i]})
			if err != nil {
				return nil, nil, err
			}
			pairs = append(pairs, pairing{First: zones[i+1], Second: zones[i], CrossFlow: true, Blend: b, Worst: worst(b.Sweep, scale)})
		}
	}
	wi, wc := worstOf(pairs, false), worstOf(pairs, true)
	w := pairs[wi]
	t := w.Blend.Options.TempC
	pf, err := p.PoreFill(PoreFillOptions{Deposit: DepositOptions{Water: WaterChoice{Native: w.First, Injectate: inj, Share: w.Worst.Share, TempC: &t}}, Well: opt.Well})
	if err != nil {
		return nil, nil, err
	}
	warm, err := p.Warm(WarmOptions{Sample: inj})
	if err != nil {
		return nil, nil, err
	}
	sec := &report.Section{Title: "Injection planning: " + inj + " into " + strings.Join(natives, ", ")}
	sec.Paragraphs = append(sec.Paragraphs, fmt.Sprintf(
		"The injectate %s is blended with each native water (%s) by mass of water, every blend re-solved as a closed system (alkalinity and total carbon conserved) at that zone's temperature, with shares of the injectate from 0 to 1 in steps of 0.05.",
		inj, strings.Join(natives, ", ")))
	if dropped > 0 {
		sec.Paragraphs = append(sec.Paragraphs, fmt.Sprintf(
			"The input has %d rows of native water; to keep the section readable and quick, only the first row of each native well is evaluated, and at most %d of them, shallowest first (%d rows left out). Name one with --native to evaluate it too.",
			dropped+len(zones), MaxNativeWaters, dropped))
	}
	if len(zones) > 1 && !opt.NoCrossFlow {
		sec.Paragraphs = append(sec.Paragraphs, "A long injection screen open to several zones lets native water flow from one zone into another (cross-flow). Each pair of native waters of adjacent zones is therefore blended too, at the heat-balance temperature: sulfate-rich water meeting barium-bearing water can deposit baryte even where no injectate arrives.")
	}
	sec.Paragraphs = append(sec.Paragraphs, worstSentence(w, inj))
	if wc >= 0 {
		c := pairs[wc]
		sec.Paragraphs = append(sec.Paragraphs, worstSentence(c, ""))
		if c.Worst.Score > 0 {
			d, err := p.Deposit(DepositOptions{Water: WaterChoice{Native: c.First, Injectate: c.Second, Share: c.Worst.Share}})
			if err != nil {
				return nil, nil, err
			}
			sec.Paragraphs = append(sec.Paragraphs, depositSentence("That cross-flow blend ("+d.Name+")", d.Precipitation))
		}
	}
	prec := pf.Deposit.Precipitation
	sec.Paragraphs = append(sec.Paragraphs, fmt.Sprintf("The deposit is computed for that worst blend with the injectate: %s.", pf.Deposit.Name))
	for _, a := range prec.Together.Amounts {
		sec.Paragraphs = append(sec.Paragraphs, fmt.Sprintf("%s (SI %s) would deposit %s mmol/kg water (%s mg/L) to reach equilibrium with the others.", a.Mineral, report.Signed(a.SIBefore, 2), report.Sig(a.MmolKgw, 3), report.Sig(a.MgL, 3)))
	}
	if len(prec.Together.Amounts) == 0 {
		sec.Paragraphs = append(sec.Paragraphs, "No common scale mineral is supersaturated in that blend: nothing would deposit.")
	}
	if prec.HasCCPP {
		sec.Paragraphs = append(sec.Paragraphs, fmt.Sprintf("Calcium carbonate precipitation potential (Standard Methods 2330) of that blend: %.1f mg/L as CaCO3.", prec.CCPP))
	}
	if pf.Oxidation != nil {
		// Oxygenated injectate meeting iron- and manganese-bearing native water:
		// the oxides it forms come on top of the deposit, and into the screen.
		sec.Paragraphs = append(sec.Paragraphs, strings.Join(pf.Oxidation.Sentences(), " "))
	}
	sec.Paragraphs = append(sec.Paragraphs, "Pore-filling screen, if every m3 injected were that blend: "+strings.Join(pf.Sentences(), " "))

	shown := figureMinerals(w.Blend.Sweep, opt.Minerals)
	sec.Tables = []*report.PageTable{
		report.NewPageTable(pairingsTable(pairs, shown), "Every blend evaluated: the worst share (scale minerals most supersaturated) and the peak SI of each mineral along the blend", nil),
		report.NewPageTable(w.Blend.PeaksTable(), fmt.Sprintf("Peak SI of each mineral along the worst blend with the injectate (%s with %s)", w.First, inj), nil),
	}
	w.Blend.Options.Minerals = shown
	bf := w.Blend.Figure()
	bf.Title = fmt.Sprintf("SI against the injectate's share: %s with %s (the worst blend)", w.First, inj)
	figs := []report.Fig{bf}
	if wc >= 0 {
		c := pairs[wc]
		c.Blend.Options.Minerals = figureMinerals(c.Blend.Sweep, opt.Minerals)
		cf := c.Blend.Figure()
		cf.Stem = "blend_si_crossflow"
		cf.Title = fmt.Sprintf("Cross-flow: SI against the share of %s in %s", c.Second, c.First)
		cf.Caption = fmt.Sprintf("Share 0 is the native water %s, 1 the native water %s of the zone above. Closed-system blending by mass of water at the heat-balance temperature, %s model. Screening result, not a design.",
			c.First, c.Second, c.Blend.Model)
		figs = append(figs, cf)
	}
	figs = append(figs, warm.Figure())
	if pf.Deposit.HasFigure() {
		figs = append(figs, pf.Deposit.Figure())
	}
	sec.Figures = make([]report.IndexFigure, len(figs))
	return sec, figs, nil
}

// worstSentence words the worst point of a blend.
func worstSentence(p pairing, inj string) string {
	what := fmt.Sprintf("Of the blends with the injectate, the worst is %s with %s", p.First, inj)
	if p.CrossFlow {
		what = fmt.Sprintf("Of the cross-flow blends, the worst is %s with %s", p.First, p.Second)
	}
	if !p.Worst.Defined {
		return what + ": no scale mineral has a saturation index there."
	}
	if p.Worst.Score <= 0 {
		return fmt.Sprintf("%s: no scale mineral is supersaturated at any share; the closest is %s (SI %s at share %.2f).", what, p.Worst.Mineral, report.Signed(p.Worst.SI, 2), p.Worst.Share)
	}
	return fmt.Sprintf("%s at a share of %.2f, where %s is the most supersaturated scale mineral (SI %s).", what, p.Worst.Share, p.Worst.Mineral, report.Signed(p.Worst.SI, 2))
}

// depositSentence words what a water would deposit, all candidates together.
func depositSentence(where string, pr *reaction.Precipitation) string {
	if len(pr.Together.Amounts) == 0 {
		return where + ": no common scale mineral would deposit."
	}
	var parts []string
	for _, a := range pr.Together.Amounts {
		parts = append(parts, fmt.Sprintf("%s %s mg/L (SI %s before)", a.Mineral, report.Sig(a.MgL, 3), report.Signed(a.SIBefore, 2)))
	}
	return where + " would deposit, to equilibrium: " + strings.Join(parts, ", ") + "."
}

// worstOf returns the index of the pairing (cross-flow or with the
// injectate) with the highest scale score, or -1 when there is none.
func worstOf(ps []pairing, crossFlow bool) int {
	best := -1
	for i, p := range ps {
		if p.CrossFlow != crossFlow {
			continue
		}
		if best < 0 || p.Worst.Score > ps[best].Worst.Score {
			best = i
		}
	}
	return best
}

// figureMinerals are the minerals drawn in a blend figure: the ones asked for
// (the maps' minerals) and those whose SI rises near zero (Relevant), at most
// MaxCurves, the asked-for ones first.
func figureMinerals(sw *reaction.Sweep, asked []string) []string {
	known := map[string]bool{}
	for _, m := range sw.Minerals {
		known[m] = true
	}
	var out []string
	seen := map[string]bool{}
	for _, list := range [][]string{asked, Relevant(sw)} {
		for _, m := range list {
			if known[m] && !seen[m] && len(out) < MaxCurves {
				seen[m] = true
				out = append(out, m)
			}
		}
	}
	return out
}

func contains(list []string, s string) bool {
	for _, x := range list {
		if x == s {
			return true
		}
	}
	return false
}
