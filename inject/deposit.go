package inject

import (
	"fmt"

	"gonum.org/v1/plot/vg"

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

// solution prepares the chosen water and names it.
func (p *Planner) solution(c WaterChoice) (reaction.Solution, string, error) {
	if c.TempC != nil {
		if err := checkTemp("temperature", *c.TempC); err != nil {
			return reaction.Solution{}, "", err
		}
	}
	if c.Sample != "" {
		w, rec, err := p.Water("water", c.Sample)
		if err != nil {
			return w, "", err
		}
		if c.TempC != nil {
			w.TempC = *c.TempC
		}
		return w, rec.Sample().ID, nil
	}
	if !(c.Share >= 0 && c.Share <= 1) {
		return reaction.Solution{}, "", fmt.Errorf("injectate share %g outside 0-1", c.Share)
	}
	wn, _, err := p.Water("native water", c.Native)
	if err != nil {
		return wn, "", err
	}
	wi, _, err := p.Water("injectate", c.Injectate)
	if err != nil {
		return wi, "", err
	}
	t := reaction.MixTempC(wn, wi, c.Share)
	if c.TempC != nil {
		t = *c.TempC
	}
	mix, _, err := p.reactor.Mix(wn, wi, c.Share, t)
	name := fmt.Sprintf("%.0f %% %s + %.0f %% %s at %.1f C", 100*(1-c.Share), c.Native, 100*c.Share, c.Injectate, t)
	return mix, name, err
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
}

// Deposit computes how much of each supersaturated candidate mineral would
// deposit from the chosen water.
func (p *Planner) Deposit(opt DepositOptions) (*DepositResult, error) {
	sol, name, err := p.solution(opt.Water)
	if err != nil {
		return nil, err
	}
	pr, err := p.reactor.Precipitate(sol, reaction.PrecipOptions{Minerals: opt.Candidates})
	if err != nil {
		return nil, err
	}
	ox, err := p.Oxidize(opt.Water)
	if err != nil {
		return nil, err
	}
	return &DepositResult{Precipitation: pr, Oxidation: ox, Name: name, Model: p.reactor.Model().Name()}, nil
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
	return append(out, "  "+report.CautionLine)
}
