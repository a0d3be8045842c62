package speciation

import (
	"fmt"
	"math"
)

// Couple is a measured redox pair whose equilibrium fixes the pe of a water.
type Couple int

// Couples.
const (
	// CoupleO2: dissolved oxygen (Oxidized, mol/kgw) with water.
	CoupleO2 Couple = iota + 1
	// CoupleFe: Fe(III) (Oxidized) and Fe(II) (Reduced), mol/kgw.
	CoupleFe
	// CoupleN: nitrate (Oxidized) and ammonium (Reduced), mol N/kgw.
	CoupleN
	// CoupleS: sulfate (Oxidized) and total dissolved sulfide (Reduced), mol S/kgw.
	CoupleS
)

// coupleDef is what the solver needs of a couple: the component that carries both
// states, the electrons per unit between them, the species whose formation constant
// gives the starting guess, and the source recorded.
type coupleDef struct {
	component string
	electrons float64 // of the reduced state relative to the oxidized one, per unit
	redState  float64 // electrons of the reduced state on the component (Database.Electrons)
	oxState   float64
	marker    string
	src       PESource
}

var couples = map[Couple]coupleDef{
	CoupleO2: {component: NameH2O, electrons: 4, marker: "O2(aq)", src: PESourceO2},
	CoupleFe: {component: "Fe2+", electrons: 1, redState: 0, oxState: -1, marker: "Fe3+", src: PESourceFe},
	CoupleN:  {component: "NO3-", electrons: 8, redState: 8, oxState: 0, marker: "NH4+", src: PESourceN},
	CoupleS:  {component: "SO4 2-", electrons: 8, redState: 8, oxState: 0, marker: "HS-", src: PESourceS},
}

// String names the couple.
func (c Couple) String() string {
	if d, ok := couples[c]; ok {
		return d.src.String()
	}
	return "unknown couple"
}

// Source is the PESource a pe from this couple records.
func (c Couple) Source() PESource { return couples[c].src }

// CoupleMeasurement is a measured couple: the amounts of the oxidized and reduced
// states in mol per kg of water (Reduced is not used for CoupleO2).
type CoupleMeasurement struct {
	Couple   Couple
	Oxidized float64
	Reduced  float64
}

// FeCoupleFromTotal builds the Fe couple from measured Fe(II) and total iron
// (mol/kgw): Fe(III) = total - Fe(II). Both states must be present.
func FeCoupleFromTotal(feII, feTotal float64) (CoupleMeasurement, error) {
	if !finite(feII) || !finite(feTotal) || feII <= 0 || feTotal-feII <= 0 {
		return CoupleMeasurement{}, fmt.Errorf("%w: Fe(II) %g and total Fe %g mol/kgw: a pe needs both Fe(II) and Fe(III) above zero", ErrRedoxInput, feII, feTotal)
	}
	return CoupleMeasurement{Couple: CoupleFe, Oxidized: feTotal - feII, Reduced: feII}, nil
}

// CoupleResult is the pe at which a measured couple is in equilibrium, with the
// speciation at that pe and the water that was solved (its total of the couple's
// component set to the sum of both states).
type CoupleResult struct {
	PE         float64
	Source     PESource
	Iterations int
	Water      Water
	Result     *Result
}

// PEFromCouple finds the pe at which the measured couple m is in equilibrium in w:
// the speciated amounts of the two states have the measured ratio (for CoupleO2, the
// O2(aq) molality equals the measured one). The total of the couple's component in
// the water (Fe2+, NO3- or SO4 2-) is set to Oxidized + Reduced. Each step moves the
// pe by the log of the ratio of measured to computed state ratios divided by the
// electrons between the states, which is exact when the complexing of each state does
// not change; it converges in a few solves. w is not modified.
func PEFromCouple(s *Solver, w *Water, m CoupleMeasurement) (CoupleResult, error) {
	def, ok := couples[m.Couple]
	if !ok {
		return CoupleResult{}, fmt.Errorf("%w: unknown couple %d", ErrRedoxInput, int(m.Couple))
	}
	if !finite(m.Oxidized) || m.Oxidized <= 0 || (m.Couple != CoupleO2 && (!finite(m.Reduced) || m.Reduced <= 0)) {
		return CoupleResult{}, fmt.Errorf("%w: %s couple needs both states above zero (oxidized %g, reduced %g mol/kgw)", ErrRedoxInput, def.src, m.Oxidized, m.Reduced)
	}
	db := s.db
	ci := db.ComponentIndex(def.component)
	mk := db.SpeciesIndex(def.marker)
	if ci < 0 || mk < 0 || db.electron < 0 {
		return CoupleResult{}, fmt.Errorf("%w: the database lacks %s or %s", ErrRedoxInput, def.component, def.marker)
	}
	out := CoupleResult{Source: def.src, Water: w.Clone()}
	ww := &out.Water
	target := math.Log10(m.Oxidized)
	if m.Couple != CoupleO2 {
		ww.SetTotal(def.component, m.Oxidized+m.Reduced)
		target = math.Log10(m.Oxidized / m.Reduced)
	}
	pe := s.couplePEGuess(ww, mk, def, m)
	res := new(Result)
	for it := 1; it <= 60; it++ {
		ww.SetPE(pe)
		if err := s.SolveInto(res, ww); err != nil {
			return out, fmt.Errorf("pe from the %s couple at pe %.3g: %w", def.src, pe, err)
		}
		var got float64
		if m.Couple == CoupleO2 {
			got = math.Log10(res.Molality(def.marker))
		} else {
			ox := db.StateTotal(res, def.component, def.oxState)
			red := db.StateTotal(res, def.component, def.redState)
			got = math.Log10(ox / red)
		}
		if !finite(got) {
			return out, fmt.Errorf("%w: the %s couple cannot be evaluated at pe %.3g", ErrRedoxInput, def.src, pe)
		}
		step := (target - got) / def.electrons
		out.Iterations = it
		if math.Abs(step) < 1e-9 {
			out.PE, out.Result = pe, res
			return out, nil
		}
		pe += max(-5, min(5, step))
		if pe < -MaxAbsPE || pe > MaxAbsPE {
			return out, fmt.Errorf("%w: the %s couple gives a pe beyond +/-%g", ErrRedoxInput, def.src, MaxAbsPE)
		}
	}
	return out, fmt.Errorf("%w: pe from the %s couple did not converge", ErrNoConvergence, def.src)
}

// couplePEGuess estimates the pe from the marker species' formation constant with
// activities equal to the measured amounts: log a(marker) = log K + sum nu log a.
func (s *Solver) couplePEGuess(w *Water, mk int, def coupleDef, m CoupleMeasurement) float64 {
	db := s.db
	sp := &db.species[mk]
	ph := w.PH
	if w.PHFromChargeBalance || ph <= 0 {
		ph = 7
	}
	lk := sp.LogK.At(w.TempC + 273.15)
	rest := lk
	var nuE float64
	for _, t := range sp.Terms {
		switch t.Index {
		case db.hplus:
			rest -= t.Nu * ph
		case db.electron:
			nuE = t.Nu
		}
	}
	// log a(marker) - log a(component state) = rest - nuE pe
	var lhs float64
	switch m.Couple {
	case CoupleO2:
		lhs = math.Log10(m.Oxidized)
	case CoupleFe:
		lhs = math.Log10(m.Oxidized / m.Reduced) // marker Fe3+ is the oxidized state
	default:
		lhs = math.Log10(m.Reduced / m.Oxidized) // markers HS-, NH4+ are reduced
	}
	if nuE == 0 {
		return 0
	}
	pe := (rest - lhs) / nuE
	return max(-MaxAbsPE+1, min(MaxAbsPE-1, pe))
}
