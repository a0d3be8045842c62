package reaction

import (
	"fmt"
	"math"

	"gwsat.dev/gwsat/speciation"
)

// OxidationOrderBasis states why the reductants of a mixture are oxidised in the
// order of OxidationOrder.
const OxidationOrderBasis = "reductants are oxidised in the order of their redox couples' pe at " +
	"neutral pH, lowest first (the redox ladder: SO4 2-/HS- near pe -3.6, Fe(OH)3/Fe2+ near 0 to 2, " +
	"MnO2/Mn2+ near 10 at pH 7 with 1e-5 mol/kg of each metal; Stumm & Morgan 1996, Aquatic Chemistry, " +
	"ch. 8); Mn(II) is also the slowest to react with O2 without catalysis (years at pH below 8.5, " +
	"Diem & Stumm 1984, GCA 48, 1571), while Fe(II) reacts in minutes at pH 7 (Stumm & Lee 1961, " +
	"Ind. Eng. Chem. 53, 143; both from memory). Oxidants are used O2 first, " +
	"then nitrate (reduced to N2). Sulfide is taken to sulfate, Fe(II) to ferrihydrite Fe(OH)3 and " +
	"Mn(II) to MnO2, all of it: an upper bound for a screen"

// Electrons given or taken per mole, for the electron balance.
const (
	electronsSulfide = 8 // HS- to SO4 2-
	electronsFe      = 1 // Fe2+ to Fe(III)
	electronsMn      = 2 // Mn2+ to Mn(IV)
	electronsO2      = 4 // O2 to H2O
	electronsNO3     = 5 // NO3- to N2
)

// OxidationOrder lists the reductants in the order they are oxidised (see
// OxidationOrderBasis): total sulfide, Fe(II), Mn(II).
var OxidationOrder = []string{"sulfide", "Fe(II)", "Mn(II)"}

// RedoxInput is what a Solution does not carry about redox, mol/kgw: dissolved O2,
// total dissolved sulfide (H2S + HS-, not part of the SO4 2- total) and the part of
// the Fe2+ total that is Fe(III). The rest of the redox content comes from the
// Solution: Fe(II) = Fe2+ total - FeIII, Mn(II) = Mn2+ total, nitrate = NO3- total.
type RedoxInput struct {
	O2      float64
	Sulfide float64
	FeIII   float64
}

// RedoxAmounts is the redox-active content of a water, mol/kgw.
type RedoxAmounts struct {
	O2, NO3, FeII, FeIII, MnII, Sulfide float64
}

// OxidationStep is one reductant oxidised by one oxidant, mol/kgw.
type OxidationStep struct {
	Reductant string  // "sulfide", "Fe(II)" or "Mn(II)"
	Oxidant   string  // "O2" or "NO3-"
	Electrons float64 // mol e- per kg water
	Oxidised  float64 // mol of reductant per kg water
	Consumed  float64 // mol of oxidant per kg water
}

// OxidizedSolid is a solid formed by the oxidation, per kg of water and per cubic
// metre of mixture, with the density the clogging screen uses.
type OxidizedSolid struct {
	Mineral       string
	MolKgw        float64
	MolPerM3      float64
	GPerM3        float64
	DensityGCm3   float64
	DensitySource string
}

// OxidationOptions sets Oxidize. The zero value is the default.
type OxidationOptions struct {
	// FeSolid and MnSolid name the products (default "ferrihydrite" and "birnessite":
	// Mn(II) oxidation by O2 gives birnessite-type layered MnO2, and its lower
	// density makes the clogging screen an upper bound).
	FeSolid, MnSolid string
	// ExcludeNitrate keeps nitrate out of the electron balance (its reduction by
	// Fe(II) needs microbes; leaving it out gives the abiotic, O2-only answer).
	ExcludeNitrate bool
	// KgwPerL is kg of water per litre of mixture (default 1), for the per-m3 amounts.
	KgwPerL float64
}

// Oxidation is the outcome of Oxidize.
type Oxidation struct {
	Mixed  RedoxAmounts // conservative mixture, before any reaction
	Left   RedoxAmounts // after the electron balance (FeIII: precipitated, so 0)
	Steps  []OxidationStep
	Solids []OxidizedSolid
	// After is the mixture without the solids: Fe2+ and Mn2+ totals reduced to what
	// is left, SO4 2- raised by the sulfide oxidised, NO3- lowered by the nitrate
	// reduced, and the alkalinity changed by the protons of the reactions (-2 eq per
	// mol of Fe(II), Mn(II) or sulfide oxidised, +1 per mol of nitrate reduced to N2;
	// sulfide counted at the H2S reference level).
	After Solution
	// Result is After re-solved as a closed system at the temperature (pH by the
	// Reactor's PH mode), without a pe.
	Result *speciation.Result
	// PE and PEResult: when O2 is left, the pe of the O2/H2O couple in After and the
	// speciation at that pe (Fe(III) and Mn oxide SIs); HasPE false otherwise.
	PE       float64
	HasPE    bool
	PEResult *speciation.Result
	Basis    string // OxidationOrderBasis
}

func checkRedox(field string, in RedoxInput) error {
	for _, v := range []struct {
		name string
		x    float64
	}{{"O2", in.O2}, {"Sulfide", in.Sulfide}, {"FeIII", in.FeIII}} {
		if err := nonNeg(field+"."+v.name, v.x); err != nil {
			return err
		}
	}
	return nil
}

// redoxAmounts combines a Solution and its RedoxInput.
func redoxAmounts(s Solution, in RedoxInput) RedoxAmounts {
	fe := s.Total("Fe2+")
	return RedoxAmounts{O2: in.O2, NO3: s.Total("NO3-"), FeII: math.Max(fe-in.FeIII, 0), FeIII: math.Min(in.FeIII, fe),
		MnII: s.Total("Mn2+"), Sulfide: in.Sulfide}
}

// Oxidize mixes a and b (f the mass fraction of b's water, as in Mix) with their
// redox content ra and rb, oxidises the reductants of the mixture with its oxidants
// by an electron balance in the order of OxidationOrder, removes the ferrihydrite
// (Fe(II) oxidised plus any Fe(III) carried in) and MnO2 formed, and re-solves the
// rest at tempC. The Fe(OH)3 and MnO2 amounts follow 4 Fe2+ + O2 + 10 H2O = 4 Fe(OH)3
// + 8 H+ and 2 Mn2+ + O2 + 2 H2O = 2 MnO2 + 4 H+ (and with nitrate, 5 Fe2+ + NO3- +
// 12 H2O = 5 Fe(OH)3 + 1/2 N2 + 9 H+).
func (r *Reactor) Oxidize(a, b Solution, ra, rb RedoxInput, f, tempC float64, opt OxidationOptions) (*Oxidation, error) {
	if err := checkRedox("a", ra); err != nil {
		return nil, err
	}
	if err := checkRedox("b", rb); err != nil {
		return nil, err
	}
	if err := checkTemp("temperature", tempC); err != nil {
		return nil, err
	}
	if opt.KgwPerL == 0 {
		opt.KgwPerL = 1
	}
	if err := nonNeg("KgwPerL", opt.KgwPerL); err != nil || opt.KgwPerL == 0 {
		return nil, inputErr(ErrNegative, "KgwPerL", opt.KgwPerL)
	}
	if opt.FeSolid == "" {
		opt.FeSolid = "ferrihydrite"
	}
	if opt.MnSolid == "" {
		opt.MnSolid = "birnessite"
	}
	fe, mn := r.db.Mineral(opt.FeSolid), r.db.Mineral(opt.MnSolid)
	if fe == nil || fe.Gas {
		return nil, inputErr(ErrUnknownMineral, "FeSolid", opt.FeSolid)
	}
	if mn == nil || mn.Gas {
		return nil, inputErr(ErrUnknownMineral, "MnSolid", opt.MnSolid)
	}
	mix, err := MixSolutions(a, b, f)
	if err != nil {
		return nil, err
	}
	mix.TempC = tempC
	ma, mb := redoxAmounts(a, ra), redoxAmounts(b, rb)
	out := &Oxidation{Basis: OxidationOrderBasis}
	out.Mixed = RedoxAmounts{
		O2: (1-f)*ma.O2 + f*mb.O2, NO3: (1-f)*ma.NO3 + f*mb.NO3, FeII: (1-f)*ma.FeII + f*mb.FeII,
		FeIII: (1-f)*ma.FeIII + f*mb.FeIII, MnII: (1-f)*ma.MnII + f*mb.MnII, Sulfide: (1-f)*ma.Sulfide + f*mb.Sulfide,
	}
	left := out.Mixed
	out.Steps = electronBalance(&left, !opt.ExcludeNitrate)
	// What the steps did.
	var sOx, feOx, mnOx, no3 float64
	for _, st := range out.Steps {
		switch st.Reductant {
		case "sulfide":
			sOx += st.Oxidised
		case "Fe(II)":
			feOx += st.Oxidised
		case "Mn(II)":
			mnOx += st.Oxidised
		}
		if st.Oxidant == "NO3-" {
			no3 += st.Consumed
		}
	}
	feSolid := feOx + out.Mixed.FeIII
	left.FeIII = 0
	out.Left = left
	for _, s := range []struct {
		m   *speciation.Mineral
		mol float64
	}{{fe, feSolid}, {mn, mnOx}} {
		if s.mol <= 0 {
			continue
		}
		perM3 := s.mol * opt.KgwPerL * 1000
		out.Solids = append(out.Solids, OxidizedSolid{Mineral: s.m.Name, MolKgw: s.mol, MolPerM3: perM3,
			GPerM3: perM3 * s.m.MolarMass, DensityGCm3: s.m.Density, DensitySource: s.m.DensitySource})
	}
	// The water left.
	after := mix.Clone()
	after.setTotal("Fe2+", left.FeII)
	after.setTotal("Mn2+", left.MnII)
	if sOx > 0 {
		after.setTotal("SO4 2-", after.Total("SO4 2-")+sOx)
	}
	if no3 > 0 {
		after.setTotal("NO3-", math.Max(after.Total("NO3-")-no3, 0))
	}
	after.Alkalinity += -2*(feOx+mnOx+sOx) + no3
	after, res, err := r.Speciate(after)
	if err != nil {
		return nil, err
	}
	out.After, out.Result = after, res
	if left.O2 > 0 && r.db.ElectronIndex() >= 0 {
		w := speciation.Water{TempC: after.TempC, PH: res.PH}
		for _, t := range after.Totals {
			if t.MolKgw > 0 {
				w.SetTotal(t.Component, t.MolKgw)
			}
		}
		cr, err := speciation.PEFromCouple(speciation.NewSolver(r.db, r.Model()), &w,
			speciation.CoupleMeasurement{Couple: speciation.CoupleO2, Oxidized: left.O2})
		if err != nil {
			return nil, &SolveError{Step: "pe of the O2 left after oxidation", Err: err}
		}
		out.PE, out.HasPE, out.PEResult = cr.PE, true, cr.Result
	}
	return out, nil
}

// electronBalance oxidises the reductants of m in OxidationOrder with O2, then (if
// nitrate) NO3-, changing m in place, and returns the steps.
func electronBalance(m *RedoxAmounts, nitrate bool) []OxidationStep {
	type ox struct {
		name string
		amt  *float64
		ne   float64
	}
	oxidants := []ox{{"O2", &m.O2, electronsO2}}
	if nitrate {
		oxidants = append(oxidants, ox{"NO3-", &m.NO3, electronsNO3})
	}
	reductants := []struct {
		name string
		amt  *float64
		ne   float64
	}{{"sulfide", &m.Sulfide, electronsSulfide}, {"Fe(II)", &m.FeII, electronsFe}, {"Mn(II)", &m.MnII, electronsMn}}
	var steps []OxidationStep
	for _, rd := range reductants {
		for _, o := range oxidants {
			need := *rd.amt * rd.ne // electrons the reductant can give
			have := *o.amt * o.ne   // electrons the oxidant can take
			if need <= 0 || have <= 0 {
				continue
			}
			e := math.Min(need, have)
			st := OxidationStep{Reductant: rd.name, Oxidant: o.name, Electrons: e, Oxidised: e / rd.ne, Consumed: e / o.ne}
			// exact zeros for the one used up (no rounding residue)
			if need <= have {
				*rd.amt = 0
				*o.amt = math.Max(*o.amt-st.Consumed, 0)
			} else {
				*o.amt = 0
				*rd.amt = math.Max(*rd.amt-st.Oxidised, 0)
			}
			steps = append(steps, st)
		}
	}
	return steps
}

// CloggingSolids returns the solids as clogging-screen input (per m3 of mixture).
func (o *Oxidation) CloggingSolids() []Solid {
	out := make([]Solid, 0, len(o.Solids))
	for _, s := range o.Solids {
		out = append(out, Solid{Mineral: s.Mineral, MolPerM3: s.MolPerM3})
	}
	return out
}

// String summarises the oxidation in one line.
func (o *Oxidation) String() string {
	s := fmt.Sprintf("O2 %.3g -> %.3g, Fe(II) %.3g -> %.3g, Mn(II) %.3g -> %.3g, sulfide %.3g -> %.3g mol/kgw",
		o.Mixed.O2, o.Left.O2, o.Mixed.FeII, o.Left.FeII, o.Mixed.MnII, o.Left.MnII, o.Mixed.Sulfide, o.Left.Sulfide)
	for _, x := range o.Solids {
		s += fmt.Sprintf("; %s %.4g g/m3", x.Mineral, x.GPerM3)
	}
	return s
}
