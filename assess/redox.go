package assess

import (
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
// order: dissolved oxygen above AnoxicDOMgL (the O2/H2O couple), Eh on the
// hydrogen scale, ORP against the reference electrode of Options.ORPReference.
// Without any, the water is solved without a pe (oxide and sulfide SIs are then
// not computed, and the result says so).
func solveWithRedox(r *Record, solver *speciation.Solver, sw *speciation.Water, tempC float64, opt Options) (*speciation.Result, error) {
	s := r.Sample()
	switch {
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
	case s.ORPMV.OK:
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
