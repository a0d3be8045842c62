package inject

import (
	"fmt"

	"gwsat.dev/gwsat/assess"
	"gwsat.dev/gwsat/report"
	"gwsat.dev/gwsat/speciation"
	"gwsat.dev/gwsat/speciation/reaction"
)

// redoxWater prepares a sample for the oxidation step: its water at the pe it
// was solved at (if any), split into its Fe(II)/Fe(III), sulfide and O2 content;
// dissolved oxygen measured on the row is the water's O2 even when it gave no pe.
func (p *Planner) redoxWater(role, id string) (reaction.Solution, reaction.RedoxInput, error) {
	_, rec, err := p.Water(role, id)
	if err != nil {
		return reaction.Solution{}, reaction.RedoxInput{}, err
	}
	var sw speciation.Water
	assess.SpeciationWater(&sw, &rec.Water, rec.TempC())
	sw.PressureBar = rec.PressureBar
	if rec.Result != nil && rec.Result.HasPE {
		sw.SetPE(rec.Result.PE)
	}
	sol, in, _, err := p.reactor.PrepareRedox(&sw)
	if err != nil {
		return sol, in, fmt.Errorf("%s %s: %w", role, id, err)
	}
	if s := rec.Sample(); in.O2 == 0 && s.DissolvedOxygenMgL.OK && s.DissolvedOxygenMgL.V > 0 {
		kgw := rec.Water.KgWaterPerL
		if kgw <= 0 {
			kgw = 1
		}
		if in.O2, err = speciation.OxygenMolKgw(s.DissolvedOxygenMgL.V, kgw); err != nil {
			return sol, in, fmt.Errorf("%s %s: %w", role, id, err)
		}
	}
	return sol, in, nil
}

// Oxidation is the oxidation step of a blend: the injectate's oxidants (O2,
// nitrate) meeting the native water's reductants (sulfide, Fe(II), Mn(II)).
type Oxidation struct {
	Result *reaction.Oxidation
	Name   string
}

// Oxidize computes the electron balance of the blend of c (a blend, not a single
// sample): which reductant is oxidised first, how much oxidant is used, what is
// left, and the ferrihydrite and manganese oxide formed per cubic metre. It
// returns nil when the blend carries no oxidant or no reductant.
func (p *Planner) Oxidize(c WaterChoice) (*Oxidation, error) { return p.oxidize(c, 1) }

// oxidize is Oxidize with the blend's kg of water per litre.
func (p *Planner) oxidize(c WaterChoice, kgw float64) (*Oxidation, error) {
	if c.Sample != "" {
		return nil, nil
	}
	if !(c.Share >= 0 && c.Share <= 1) {
		return nil, fmt.Errorf("injectate share %g outside 0-1", c.Share)
	}
	sn, rn, err := p.redoxWater("native water", c.Native)
	if err != nil {
		return nil, err
	}
	si, ri, err := p.redoxWater("injectate", c.Injectate)
	if err != nil {
		return nil, err
	}
	t := reaction.MixTempC(sn, si, c.Share)
	if c.TempC != nil {
		t = *c.TempC
	}
	ox, err := p.reactor.Oxidize(sn, si, rn, ri, c.Share, t, reaction.OxidationOptions{KgwPerL: kgw})
	if err != nil {
		return nil, err
	}
	if len(ox.Steps) == 0 {
		return nil, nil
	}
	return &Oxidation{Result: ox, Name: fmt.Sprintf("%.0f %% %s + %.0f %% %s at %.1f C", 100*(1-c.Share), c.Native, 100*c.Share, c.Injectate, t)}, nil
}

// negligibleMolKgw is the amount below which an oxidation step is not worded:
// 1e-12 mol/kg is far below any analysis (common practice).
const negligibleMolKgw = 1e-12

// Sentences words the oxidation step for a summary or a report.
func (o *Oxidation) Sentences() []string {
	ox := o.Result
	// Molar masses of Fe and Mn: IUPAC 2013 standard atomic weights (Meija et
	// al. 2016), from memory.
	out := []string{fmt.Sprintf("Oxidation on mixing (%s): the oxidants of the blend (O2 %s mg/L, nitrate) meet its reductants (Fe(II) %s mg/L, Mn(II) %s mg/L, sulfide); %s mg/L of O2 is left.",
		o.Name, report.Sig(1000*ox.Mixed.O2*speciation.MolarMassO2, 3), report.Sig(1000*ox.Mixed.FeII*55.845, 3), report.Sig(1000*ox.Mixed.MnII*54.938, 3),
		report.Sig(1000*ox.Left.O2*speciation.MolarMassO2, 3))}
	for _, st := range ox.Steps {
		if st.Oxidised < negligibleMolKgw {
			continue // a trace (e.g. sulfide at 1e-100 mol/kg in an oxic water)
		}
		out = append(out, fmt.Sprintf("%s oxidises %s mmol/kgw of %s, using %s mmol/kgw of %s.", st.Oxidant, report.Sig(1000*st.Oxidised, 3), st.Reductant, report.Sig(1000*st.Consumed, 3), st.Oxidant))
	}
	for _, s := range ox.Solids {
		out = append(out, fmt.Sprintf("%s forms: %s g per m3 of blend.", s.Mineral, report.Sig(s.GPerM3, 3)))
	}
	return append(out, "The order of oxidation: "+ox.Basis)
}
