package main

import (
	"flag"
	"fmt"
	"math"
	"strings"

	"gonum.org/v1/plot/vg"

	"gwsat.dev/gwsat/assess"
	"gwsat.dev/gwsat/report"
	"gwsat.dev/gwsat/speciation"
	"gwsat.dev/gwsat/speciation/reaction"
)

// mixFlags choose the end-members of a report's injection-planning section.
type mixFlags struct {
	inject, native string
	aquiferTemp    float64
	rate, screen   float64
	porosity       float64
}

func (m *mixFlags) registerReport(fs *flag.FlagSet) {
	fs.StringVar(&m.inject, "inject", "", "sample id of the injectate (default: the first row whose sample type is injectate; demo: "+demoInject+")")
	fs.StringVar(&m.native, "native", "", "sample id of the native groundwater (default: the first row whose sample type is native; demo: "+demoNative+")")
	fs.Float64Var(&m.aquiferTemp, "aquifer-temp", math.NaN(), "aquifer temperature for the mixtures, C (default: the native water's)")
	fs.Float64Var(&m.rate, "rate", 500, "injection rate for the clogging screen, m3/day")
	fs.Float64Var(&m.screen, "screen", 90, "screen length for the clogging screen, m")
	fs.Float64Var(&m.porosity, "porosity", 0.2, "aquifer porosity for the clogging screen")
}

// validate checks the numbers of the section before anything is computed
// or written.
func (m *mixFlags) validate() error {
	switch {
	case !math.IsNaN(m.aquiferTemp) && (m.aquiferTemp < speciation.MinTempC || m.aquiferTemp > speciation.MaxTempC):
		return fmt.Errorf("-aquifer-temp %g C outside the supported %g-%g C", m.aquiferTemp, speciation.MinTempC, speciation.MaxTempC)
	case !(m.rate >= 0) || math.IsInf(m.rate, 0):
		return fmt.Errorf("-rate %g must be a number not below 0", m.rate)
	case !(m.screen > 0) || math.IsInf(m.screen, 0):
		return fmt.Errorf("-screen %g must be positive", m.screen)
	case !(m.porosity > 0 && m.porosity < 1):
		return fmt.Errorf("-porosity %g must lie in (0, 1)", m.porosity)
	}
	return nil
}

// byType finds the first usable row whose sample-type column (e.g. "Sample
// type", "type", "role") says kind.
func byType(recs []assess.Record, kind string) string {
	for i := range recs {
		r := &recs[i]
		if r.Result == nil {
			continue
		}
		for k, v := range r.Sample().Extra {
			k = strings.ToLower(strings.TrimSpace(k))
			if (k == "sample type" || k == "type" || k == "role" || k == "sample_type") && strings.EqualFold(strings.TrimSpace(v), kind) {
				return r.Sample().ID
			}
		}
	}
	return ""
}

// section builds the injection-planning section of a report: mixing curve at
// the aquifer temperature, heating curve of the injectate, precipitation at
// the most supersaturated mixture, the sulfate sequence and a clogging
// screen. It returns nil when the input has no end-members.
func (m *mixFlags) section(e *env, recs []assess.Record, db *speciation.Database, model speciation.ActivityModel) (*report.Section, []report.Fig, error) {
	inj, nat := m.inject, m.native
	if inj == "" {
		inj = byType(recs, "injectate")
	}
	if nat == "" {
		nat = byType(recs, "native")
	}
	if inj == "" || nat == "" {
		return nil, nil, nil
	}
	l := &loaded{recs: recs, db: db, reactor: reaction.New(db, model)}
	wn, rn, err := l.water("native", nat)
	if err != nil {
		return nil, nil, err
	}
	wi, _, err := l.water("inject", inj)
	if err != nil {
		return nil, nil, err
	}
	t := m.aquiferTemp
	if math.IsNaN(t) {
		t = rn.TempC()
	}
	opt := reaction.SweepOptions{TempC: t, FixedTemp: true}
	sw, err := l.reactor.Sweep(wn, wi, opt)
	if err != nil {
		return nil, nil, err
	}
	heat, err := l.reactor.TemperatureSweep(wi, nil, nil)
	if err != nil {
		return nil, nil, err
	}
	// The mixture to precipitate from: where the sum of positive SIs of the
	// scale minerals peaks, among true mixtures (0 < fraction < 1).
	scale := map[string]bool{}
	for _, s := range l.reactor.KnownMinerals(reaction.ScaleMinerals()) {
		scale[s] = true
	}
	best, bestScore := 0.5, -1.0
	for _, p := range sw.Points {
		if p.Fraction <= 0 || p.Fraction >= 1 {
			continue // a mixture, not an end-member
		}
		score := 0.0
		for i, mn := range sw.Minerals {
			if p.Defined[i] && scale[mn] && p.SI[i] > 0 {
				score += p.SI[i]
			}
		}
		if score > bestScore {
			best, bestScore = p.Fraction, score
		}
	}
	mix, _, err := l.reactor.Mix(wn, wi, best, t)
	if err != nil {
		return nil, nil, err
	}
	prec, err := l.reactor.Precipitate(mix, reaction.PrecipOptions{})
	if err != nil {
		return nil, nil, err
	}
	clog, err := reaction.Clogging(db, reaction.CloggingInput{Solids: reaction.SolidsPerM3(prec.Together.Amounts, prec.KgwPerL),
		RateM3PerDay: m.rate, ScreenLengthM: m.screen, Porosity: m.porosity, RadiusM: 2, WellRadiusM: 0.15})
	if err != nil {
		return nil, nil, err
	}
	mixName := fmt.Sprintf("%.0f %% %s + %.0f %% %s at %.1f C", 100*(1-best), nat, 100*best, inj, t)
	sec := &report.Section{Title: "Injection planning: " + inj + " into " + nat}
	sec.Paragraphs = append(sec.Paragraphs,
		fmt.Sprintf("The injectate %s is mixed with the native water %s by mass of water, each mixture re-solved as a closed system at the aquifer temperature %.1f C (alkalinity and total carbon conserved).", inj, nat, t),
		fmt.Sprintf("Precipitation is computed for the mixture where the scale minerals are most supersaturated: %s.", mixName))
	for _, a := range prec.Together.Amounts {
		sec.Paragraphs = append(sec.Paragraphs, fmt.Sprintf("%s (SI %+.2f) would precipitate %.3g mmol/kgw (%.3g mg/L) to reach equilibrium with the others.", a.Mineral, a.SIBefore, a.MmolKgw, a.MgL))
	}
	if len(prec.Together.Amounts) == 0 {
		sec.Paragraphs = append(sec.Paragraphs, "No common scale mineral is supersaturated in that mixture: nothing would precipitate.")
	}
	if prec.HasCCPP {
		sec.Paragraphs = append(sec.Paragraphs, fmt.Sprintf("Calcium carbonate precipitation potential (Standard Methods 2330) of that mixture: %.1f mg/L as CaCO3.", prec.CCPP))
	}
	sec.Paragraphs = append(sec.Paragraphs,
		fmt.Sprintf("Clogging screen, if every m3 injected were that mixture: %.0f m3/day for a year into a %.0f m screen at porosity %.2f deposits %.3g m3 of solids, filling %.3g %% of the pore space within 2 m of the well; %.0f %% of it would be filled within %.3g m.",
			m.rate, m.screen, m.porosity, clog.SolidVolumeM3PerYr, 100*clog.FilledFractionPerYr, 100*clog.FillFraction, clog.RadiusForFillM),
		clog.Caution)
	sec.Table = report.MaximaTable(sw)
	mixMinerals := relevant(sw, -0.5)
	figs := []report.Fig{
		{Stem: "mix_si_fraction", Title: "SI against mixing fraction", Caption: "Fraction 0 is the native water, 1 the injectate. " + mixCaption(opt, l),
			Figure: report.SweepFigure(sw, fmt.Sprintf("Mixing %s (0) with %s (1)", nat, inj), "", false, mixMinerals), W: 16 * vg.Centimeter, H: 12 * vg.Centimeter},
		{Stem: "mix_si_temperature", Title: "SI of the injectate against temperature", Caption: "Closed system: totals and alkalinity fixed, pH recomputed at each temperature.",
			Figure: report.SweepFigure(heat, "Heating or cooling "+inj, "", true, relevant(heat, -0.5)), W: 16 * vg.Centimeter, H: 12 * vg.Centimeter},
	}
	if len(prec.Alone) > 0 {
		figs = append(figs, report.Fig{Stem: "mix_precipitation", Title: "Precipitation potential", Caption: mixName + "; each mineral alone and all together, closed system to SI = 0.",
			Figure: report.PrecipitationFigure(prec, "Precipitation potential", ""), W: 16 * vg.Centimeter, H: 11 * vg.Centimeter})
	}
	sec.Figures = make([]report.IndexFigure, len(figs))
	return sec, figs, nil
}
