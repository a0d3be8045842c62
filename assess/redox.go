package assess

import (
	"strings"

	"gwsat.dev/gwsat/hydro"
	"gwsat.dev/gwsat/speciation"
)

// AnoxicDOMgL is the dissolved oxygen at and below which a reading is not used for
// the pe: field probes are not reliable below a few tenths of a mg/L, and the O2
// couple is not in equilibrium with the reduced species of an anoxic water
// (common practice).
const AnoxicDOMgL = 0.2

// Codes of the redox notes.
const (
	CodeRedox        hydro.Code = "redox"           // where the pe came from
	CodeRedoxUnknown hydro.Code = "redox-not-used"  // a redox reading that could not be used
	CodeRedoxFailed  hydro.Code = "redox-pe-failed" // the pe could not be found from the readings
)

// solveWithRedox speciates sw with the pe from the row's redox readings, in this
// order: a pe reported as such; dissolved oxygen above AnoxicDOMgL (the O2/H2O couple); a measured pair,
// Fe(II) with Fe(III) (or with total iron), else nitrate with ammonium; Eh on the
// hydrogen scale; ORP against the reference electrode of Options.ORPReference.
// (The iron pair comes before sulfate/sulfide when both are measured.)
// Without any, the water is solved without a pe (oxide and sulfide SIs are then
// not computed, and the result says so).
func solveWithRedox(r *Record, solver *speciation.Solver, sw *speciation.Water, tempC float64, opt Options) (*speciation.Result, error) {
	s := r.Sample()
	switch {
	case s.PE.OK:
		sw.SetPE(s.PE.V)
		r.PESource = speciation.PESourceGiven.String()
		r.Note(hydro.Info, CodeRedox, "pe %.2f as reported", s.PE.V)
	case s.DissolvedOxygenMgL.OK && s.DissolvedOxygenMgL.V > AnoxicDOMgL:
		kgw := r.Water.KgWaterPerL
		if kgw <= 0 {
			kgw = 1
		}
		o2, err := speciation.OxygenMolKgw(s.DissolvedOxygenMgL.V, kgw)
		if err == nil {
			var cr speciation.CoupleResult
			if cr, err = speciation.PEFromCouple(solver, sw, speciation.CoupleMeasurement{Couple: speciation.CoupleO2, Oxidized: o2}); err == nil {
				r.PESource = cr.Source.String()
				r.Note(hydro.Info, CodeRedox, "pe %.2f from dissolved oxygen %.2f mg/L (the O2/H2O couple)", cr.PE, s.DissolvedOxygenMgL.V)
				res := *cr.Result
				return &res, nil
			}
		}
		r.Note(hydro.Warning, CodeRedoxFailed, "pe from dissolved oxygen %.2f mg/L failed (%v): solved without a pe", s.DissolvedOxygenMgL.V, err)
	case pairFound(r, s, false):
		m, what := measuredPair(r, s, false)
		cr, err := speciation.PEFromCouple(solver, sw, m)
		if err == nil {
			r.PESource = cr.Source.String()
			r.Note(hydro.Info, CodeRedox, "pe %.2f from the measured %s pair", cr.PE, what)
			res := *cr.Result
			return &res, nil
		}
		r.Note(hydro.Warning, CodeRedoxFailed, "pe from the measured %s pair failed (%v): solved without a pe", what, err)
	case s.EhMV.OK:
		pe := speciation.PEFromEhMV(s.EhMV.V, tempC)
		sw.SetPE(pe)
		r.PESource = speciation.PESourceEh.String()
		r.Note(hydro.Info, CodeRedox, "pe %.2f from Eh %.0f mV at %.1f C", pe, s.EhMV.V, tempC)
	case s.ORPMV.OK && opt.ORPReference != "":
		ref, err := speciation.ParseReferenceElectrode(opt.ORPReference)
		if err == nil {
			var pe float64
			var src speciation.PESource
			if pe, src, err = speciation.PEFromORP(s.ORPMV.V, ref, tempC); err == nil {
				sw.SetPE(pe)
				r.PESource = src.String()
				r.Note(hydro.Info, CodeRedox, "pe %.2f from ORP %.0f mV against %s at %.1f C", pe, s.ORPMV.V, opt.ORPReference, tempC)
				break
			}
		}
		r.Note(hydro.Warning, CodeRedoxUnknown, "ORP %.0f mV not used: %v", s.ORPMV.V, err)
	case pairFound(r, s, true):
		// The nitrogen pair is the last resort: nitrate and ammonium are seldom
		// in equilibrium with each other in groundwater (common practice).
		m, what := measuredPair(r, s, true)
		cr, err := speciation.PEFromCouple(solver, sw, m)
		if err == nil {
			r.PESource = cr.Source.String()
			r.Note(hydro.Info, CodeRedox, "pe %.2f from the measured %s pair (nitrogen species are seldom in equilibrium: a rough pe)", cr.PE, what)
			res := *cr.Result
			return &res, nil
		}
		r.Note(hydro.Warning, CodeRedoxFailed, "pe from the measured %s pair failed (%v): solved without a pe", what, err)
	}
	if s.ORPMV.OK && opt.ORPReference == "" && r.PESource == "" {
		r.Note(hydro.Info, CodeRedoxUnknown, "ORP %.0f mV not used: name the meter's reference electrode (--orp-electrode) to convert it to Eh", s.ORPMV.V)
	}
	res, err := solver.Solve(sw)
	if err != nil && r.PESource != "" {
		// A pe the water cannot take (beyond the stability of water, or a
		// couple far from the rest): report it and solve without it.
		r.Note(hydro.Warning, CodeRedoxFailed, "the solve with pe failed (%v): solved without a pe", err)
		r.PESource = ""
		sw.ClearPE()
		return solver.Solve(sw)
	}
	return res, err
}

// Molar masses of the pair analytes in g/mol: IUPAC 2013 standard atomic weights
// (Meija et al. 2016), from memory.
const (
	molarFe  = 55.845
	molarNO3 = 62.004
	molarNH4 = 18.038
	molarSO4 = 96.056
	molarS   = 32.06
)

// pairMolKgw is an analyte of the row in mol/kgw (mg/L of its own formula),
// and whether it was reported above zero.
func pairMolKgw(r *Record, s *hydro.Sample, key string, molar float64) (float64, bool) {
	m, ok := s.Analytes[key]
	if !ok || !m.MgPerL.OK || !(m.MgPerL.V > 0) || m.NonDetect {
		return 0, false
	}
	kgw := r.Water.KgWaterPerL
	if kgw <= 0 {
		kgw = 1
	}
	return m.MgPerL.V / molar / 1000 / kgw, true
}

// ferrousColumn says whether the Fe column holds Fe(II) (its header names the
// ferrous state), not total iron.
func ferrousColumn(s *hydro.Sample) bool {
	h := strings.ToLower(s.Analytes["Fe"].Column)
	return strings.Contains(h, "ferrous") || strings.Contains(h, "fe2") || strings.Contains(h, "fe(ii)") || strings.Contains(h, "fe ii") || strings.Contains(h, "feii")
}

func pairFound(r *Record, s *hydro.Sample, nitrogen bool) bool {
	m, _ := measuredPair(r, s, nitrogen)
	return m.Couple != 0
}

// measuredPair finds a redox pair measured on the row: Fe(III) with Fe(II) or
// with total iron, else sulfate with sulfide; or, when nitrogen is set, nitrate
// with ammonium.
func measuredPair(r *Record, s *hydro.Sample, nitrogen bool) (speciation.CoupleMeasurement, string) {
	if nitrogen {
		no3, okN := pairMolKgw(r, s, "NO3", molarNO3)
		nh4, okA := pairMolKgw(r, s, "NH4", molarNH4)
		if okN && okA {
			return speciation.CoupleMeasurement{Couple: speciation.CoupleN, Oxidized: no3, Reduced: nh4}, "NO3-/NH4+"
		}
		return speciation.CoupleMeasurement{}, ""
	}
	// Sulfate with sulfide (as S): in sulfidic water the most trusted pair after
	// iron (the SO4 2-/HS- couple; Stumm & Morgan 1996, from memory).
	if so4, ok := pairMolKgw(r, s, "SO4", molarSO4); ok {
		if hs, ok := pairMolKgw(r, s, "HS", molarS); ok {
			return speciation.CoupleMeasurement{Couple: speciation.CoupleS, Oxidized: so4, Reduced: hs}, "SO4 2-/sulfide"
		}
	}
	fe3, ok3 := pairMolKgw(r, s, "Fe3", molarFe)
	fe, ok := pairMolKgw(r, s, "Fe", molarFe)
	if ok3 && ok {
		if ferrousColumn(s) {
			return speciation.CoupleMeasurement{Couple: speciation.CoupleFe, Oxidized: fe3, Reduced: fe}, "Fe(III)/Fe(II)"
		}
		if m, err := speciation.FeCoupleFromTotal(fe-fe3, fe); err == nil {
			return m, "Fe(III)/total Fe"
		}
	}
	return speciation.CoupleMeasurement{}, ""
}
