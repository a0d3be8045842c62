package inject

import (
	"fmt"

	"gonum.org/v1/plot/vg"

	"gwsat.dev/gwsat/assess"
	"gwsat.dev/gwsat/report"
	"gwsat.dev/gwsat/speciation/reaction"
)

// WaterChoice names the water to deposit from: one sample, or a blend of a
// native water and an injectate at a share of the injectate.
type WaterChoice struct {
	Sample            string  // one water; when set, the blend fields are ignored
	Native, Injectate string  // a blend
	Share             float64 // share of the injectate by mass of water, 0-1
	// TempC, when not nil, sets the temperature (default: the water's own, or
	// the heat balance of a blend).
	TempC *float64
}

// kgwPerL is the kg of water per litre of a row's solution (1 when unknown), so
// that amounts per litre are per litre of solution, not per kg of water.
func kgwPerL(rec *assess.Record) float64 {
	if k := rec.Water.KgWaterPerL; k > 0 {
		return k
	}
	return 1
}

// solution prepares the chosen water and names it; kgw is its kg of water per
// litre of solution (for a blend, the shares' average: volumes taken as
// additive, common practice).
func (p *Planner) solution(c WaterChoice) (sol reaction.Solution, name string, kgw float64, err error) {
	if c.TempC != nil {
		if err := checkTemp("temperature", *c.TempC); err != nil {
			return reaction.Solution{}, "", 0, err
		}
	}
	if c.Sample != "" {
		w, rec, err := p.Water("water", c.Sample)
		if err != nil {
			return w, "", 0, err
		}
		if c.TempC != nil {
			w.TempC = *c.TempC
		}
		return w, rec.Sample().ID, kgwPerL(rec), nil
	}
	if !(c.Share >= 0 && c.Share <= 1) {
		return reaction.Solution{}, "", 0, fmt.Errorf("injectate share %g outside 0-1", c.Share)
	}
	wn, rn, err := p.Water("native water", c.Native)
	if err != nil {
		return wn, "", 0, err
	}
	wi, ri, err := p.Water("injectate", c.Injectate)
	if err != nil {
		return wi, "", 0, err
	}
	kgw = (1-c.Share)*kgwPerL(rn) + c.Share*kgwPerL(ri)
	t := reaction.MixTempC(wn, wi, c.Share)
	if c.TempC != nil {
		t = *c.TempC
	}
	mix, _, err := p.reactor.Mix(wn, wi, c.Share, t)
	name = fmt.Sprintf("%.0f %% %s + %.0f %% %s at %.1f C", 100*(1-c.Share), c.Native, 100*c.Share, c.Injectate, t)
	return mix, name, kgw, err
}

// DepositOptions choose a deposit computation.
type DepositOptions struct {
	Water WaterChoice
	// Candidates that may deposit; nil: reaction.ScaleMinerals.
	Candidates []string
}

// DepositResult is the amount of each supersaturated candidate that deposits
// to reach SI = 0, alone and together, with what the command shows of it.
type DepositResult struct {
	Precipitation *reaction.Precipitation
	// Oxidation is the oxidation step of a blend, nil when there is none; its
	// oxides come on top of the minerals of Precipitation.
	Oxidation *Oxidation
	Name      string // the water, in words
	Model     string
	notes     []string // range warnings, in the words of the row checks
}

// Deposit computes how much of each supersaturated candidate mineral would
// deposit from the chosen water.
func (p *Planner) Deposit(opt DepositOptions) (*DepositResult, error) {
	sol, name, kgw, err := p.solution(opt.Water)
	if err != nil {
		return nil, err
	}
	pr, err := p.reactor.Precipitate(sol, reaction.PrecipOptions{Minerals: opt.Candidates, KgwPerL: kgw})
	if err != nil {
		return nil, err
	}
	ox, err := p.oxidize(opt.Water, kgw)
	if err != nil {
		return nil, err
	}
	var notes []string
	if br := pr.BeforeResult; br != nil {
		var names []string
		for _, m := range br.Minerals {
			names = append(names, m.Name)
		}
		notes = rangeNotes(p.db, p.reactor.Model(), br.IonicStrength, []float64{br.TempC}, names)
	}
	return &DepositResult{Precipitation: pr, Oxidation: ox, Name: name, Model: p.reactor.Model().Name(), notes: notes}, nil
}

// Table lists each candidate deposited alone and all together.
func (d *DepositResult) Table() *report.Table { return PrecipitationTable(d.Precipitation) }

// ResidualTable lists the water before and after depositing the candidates together.
func (d *DepositResult) ResidualTable() *report.Table { return WaterLeftTable(d.Precipitation) }

// HasFigure reports whether anything deposits (the bar chart is empty otherwise).
func (d *DepositResult) HasFigure() bool { return len(d.Precipitation.Together.Amounts) > 0 }

// Figure is a bar chart of the amounts.
func (d *DepositResult) Figure() report.Fig {
	cap := fmt.Sprintf("%s; each mineral alone and all together, closed system to SI = 0, %s model. Screening result: no kinetics.", d.Name, d.Model)
	return report.Fig{Stem: "deposit_amounts", Title: "Deposit potential", Caption: cap,
		Figure: PrecipitationFigure(d.Precipitation, "Deposit potential", ""), W: 16 * vg.Centimeter, H: 11 * vg.Centimeter}
}

// Summary is what the command prints.
func (d *DepositResult) Summary() []string {
	pr := d.Precipitation
	out := []string{fmt.Sprintf("gwsat inject deposit: %s, pH %.2f", d.Name, pr.Before.PH)}
	if len(pr.Together.Amounts) == 0 {
		out = append(out, "  no candidate mineral is supersaturated: nothing deposits")
	}
	for _, a := range pr.Together.Amounts {
		out = append(out, fmt.Sprintf("  %-16s SI %+.2f -> %s mmol/kgw (%s mg/L) together", a.Mineral, a.SIBefore, report.Sig(a.MmolKgw, 3), report.Sig(a.MgL, 3)))
	}
	if len(pr.Together.Amounts) > 0 {
		out = append(out, fmt.Sprintf("  water left: pH %.2f", pr.Together.After.PH))
	}
	if pr.HasCCPP {
		out = append(out, fmt.Sprintf("  calcium carbonate precipitation potential (Standard Methods 2330): %.1f mg/L as CaCO3", pr.CCPP))
	}
	if d.Oxidation != nil {
		for _, s := range d.Oxidation.Sentences() {
			out = append(out, "  "+s)
		}
	}
	out = append(out, d.notes...)
	return append(out, "  "+report.CautionLine)
}
