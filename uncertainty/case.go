package uncertainty

import (
	"fmt"

	"gwsat.dev/gwsat/assess"
	"gwsat.dev/gwsat/hydro"
	"gwsat.dev/gwsat/speciation"
)

// Kind is what an Input sets in the water.
type Kind int

const (
	PH         Kind = iota // Water.PH
	TempC                  // Water.TempC
	Total                  // a component total, mol/kgw
	Alkalinity             // the alkalinity, eq/kgw
)

// Input is one uncertain input of a Case.
type Input struct {
	// Name is "pH", "temperature", or the analyte key ("Ca", "Alk", ...).
	Name      string
	Kind      Kind
	Component string // for Total: the component ("Ca2+")
	// Value is the best value and SD its standard uncertainty, in the unit
	// of the kind (pH, C, mol/kgw, eq/kgw).
	Value, SD float64
	// NonDetect marks a result below its detection limit: it is drawn
	// between zero and LimitMolKgw (see the package documentation) and SD is
	// not used.
	NonDetect   bool
	LimitMolKgw float64
}

// set puts v into the water.
func (in *Input) set(w *speciation.Water, v float64) {
	switch in.Kind {
	case PH:
		w.PH = v
	case TempC:
		w.TempC = v
	case Total:
		w.SetTotal(in.Component, v)
	case Alkalinity:
		w.SetAlkalinity(v)
	}
}

// Case is one water with its uncertain inputs.
type Case struct {
	// Water is the water as measured (best values); the estimates vary a
	// copy of it.
	Water  speciation.Water
	Inputs []Input
}

// CaseOf builds the case of an assessed record: the water it was speciated
// as (assess.SpeciationWater, with opt.BalanceOn) and one input for the pH,
// the temperature, the alkalinity and each analyte passed on as a component
// total, with the uncertainties of opt. It returns ErrNoResult for a record
// without a speciation result.
func CaseOf(r *assess.Record, opt Options) (Case, error) {
	if r.Result == nil {
		why := r.SolveError
		if why == "" {
			why = string(r.Status)
			if p := r.FirstProblem(); p != "" {
				why = p
			}
		}
		return Case{}, fmt.Errorf("%w: %s", ErrNoResult, why)
	}
	o, err := opt.resolved()
	if err != nil {
		return Case{}, err
	}
	var c Case
	assess.SpeciationWater(&c.Water, &r.Water, r.TempC())
	if o.BalanceOn != "" {
		c.Water.ChargeBalanceIon = o.BalanceOn
	}
	add := func(in Input) {
		if in.SD > 0 || in.NonDetect {
			c.Inputs = append(c.Inputs, in)
		}
	}
	phSD := o.PHLabSD
	if r.Water.PHSource == "field" {
		phSD = o.PHFieldSD
	}
	add(Input{Name: "pH", Kind: PH, Value: c.Water.PH, SD: phSD})
	tSD := o.TempSD
	if !r.Water.HasTemp {
		tSD = o.AssumedTempSD
	}
	add(Input{Name: "temperature", Kind: TempC, Value: c.Water.TempC, SD: tSD})
	if alk, ok := c.Water.Alkalinity(); ok {
		name := "Alk"
		if _, reported := r.Row.Sample.Analytes["Alk"]; !reported {
			name = "HCO3"
		}
		add(Input{Name: "Alk", Kind: Alkalinity, Value: alk, SD: alk * relSD(o, name, "Alk")})
	}
	sol := hydro.Solution{DensityKgL: r.Water.DensityKgL, KgWaterPerL: r.Water.KgWaterPerL}
	for _, key := range hydro.AnalyteKeys() {
		m, ok := r.Row.Sample.Analytes[key]
		if !ok {
			continue
		}
		comp, ok := hydro.SpeciationComponent(key)
		if !ok || comp == o.BalanceOn {
			continue
		}
		v, set := c.Water.Total(comp)
		if !set || v <= 0 {
			// not in the speciation (zero substituted for a non-detect):
			// minerals of the ion were not computed
			continue
		}
		in := Input{Name: key, Kind: Total, Component: comp, Value: v, SD: v * relSD(o, key, "")}
		if m.NonDetect && m.DetectionLimit > 0 && sol.KgWaterPerL > 0 {
			lim := m
			lim.Value = m.DetectionLimit
			if mm, err := lim.MmolL(sol); err == nil && mm > 0 {
				in.NonDetect, in.LimitMolKgw, in.SD = true, mm/1000/sol.KgWaterPerL, 0
			}
		}
		add(in)
	}
	return c, nil
}

// relSD is the relative uncertainty of an analyte: its override, else the
// override of the fallback key, else the general one.
func relSD(o Options, key, fallback string) float64 {
	if v, ok := o.RelSDByAnalyte[key]; ok {
		return v
	}
	if v, ok := o.RelSDByAnalyte[fallback]; ok && fallback != "" {
		return v
	}
	return o.RelSD
}
