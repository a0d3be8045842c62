package hydro

import (
	"fmt"

	"gwsat.dev/gwsat/speciation"
)

// Density sources reported in Water.DensitySource.
const (
	DensityMeasured = "measured"
	DensityFromTDS  = "estimated from TDS"
	DensityAssumed  = "assumed 1.000"
)

// densityPerTDS is the slope of the density estimate rho (kg/L) = 1.000 +
// densityPerTDS * TDS (mg/L). `common practice`: a linear rule that puts
// seawater (about 35 900 mg/L TDS) at 1.025 kg/L, its usual density near
// 20 C (`from memory`). Good to a few parts per thousand below about 50 g/L;
// for brines give a measured density.
const densityPerTDS = 7.0e-7

// Water is a sample converted for speciation: totals in mol per kilogram of
// water keyed by component name ("Ca2+", "SO4 2-", "H4SiO4", ...), and
// alkalinity in equivalents per kilogram of water.
//
// Alkalinity convention: AlkalinityEqKgw is the total (titration)
// alkalinity in eq/kgw. It comes from a reported alkalinity (as CaCO3,
// as HCO3 or in meq/L), or, when none was reported, from the HCO3 and CO3
// ions as HCO3 + 2 CO3 (each mole of carbonate takes two protons to the
// end point). "CO3 2-" in Molal holds total inorganic carbon, and only when
// TIC itself was measured.
type Water struct {
	TempC   float64
	HasTemp bool
	// PressureBar is the sample's absolute pressure in bar; valid when
	// HasPressure (a Pressure column).
	PressureBar     float64
	HasPressure     bool
	PH              float64
	HasPH           bool
	PHSource        string
	Molal           map[string]float64
	AlkalinityEqKgw float64
	HasAlkalinity   bool
	KgWaterPerL     float64
	DensityKgL      float64
	DensitySource   string
	// TDSMgL is the TDS used for the water content: measured, else the sum
	// of the reported constituents (TDSCalculated true).
	TDSMgL        float64
	TDSCalculated bool
}

// solution returns the density and water content the sample's numbers
// refer to: density measured, else estimated from TDS (measured, else the
// sum of the reported constituents), else 1.000 kg/L; kg water per litre =
// density - TDS/1e6 (`common practice`: the dissolved solids displace
// their own mass of water).
func (s *Sample) solution() (sol Solution, source string, tds float64, tdsCalc bool) {
	tds, tdsCalc = s.TDSMgL.V, false
	if !s.TDSMgL.OK {
		// Per-kilogram units need the density: the measured one, else
		// the estimate from a first sum at 1 kg/L (one step of a fixed
		// point that moves the sum by parts per million).
		rho := 1.0
		if s.Density.OK {
			rho = s.Density.V
		} else if first := s.constituentSumMgL(Dilute()); first > 0 {
			rho = s.densityFromTDS(first)
		}
		tds, tdsCalc = s.constituentSumMgL(Solution{DensityKgL: rho, KgWaterPerL: rho}), true
	}
	switch {
	case s.Density.OK:
		sol.DensityKgL, source = s.Density.V, DensityMeasured
	case tds > 0:
		sol.DensityKgL, source = s.densityFromTDS(tds), DensityFromTDS
	default:
		sol.DensityKgL, source = 1, DensityAssumed
	}
	sol.KgWaterPerL = sol.DensityKgL - tds/1e6
	return sol, source, tds, tdsCalc
}

// constituentSumMgL sums the reported analytes in mg/L (alkalinity as
// HCO3, 1.2192 = 61.016/50.043 mg HCO3 per mg CaCO3, when HCO3 itself is
// not reported), per-kilogram units converted with sol.
func (s *Sample) constituentSumMgL(sol Solution) float64 {
	sum := 0.0
	for k, m := range s.Analytes {
		a := analytes[k]
		if a == nil || k == "TIC" {
			continue
		}
		if k == "Alk" {
			if _, ok := s.Analytes["HCO3"]; ok {
				continue
			}
			if mm, err := m.MmolL(sol); err == nil {
				sum += mm * mmHCO3
			}
			continue
		}
		if v, err := m.MgL(sol); err == nil {
			sum += v
		}
	}
	return sum
}

// Water converts the sample to molalities. Issues report what could not be
// used (an analyte in a unit that cannot be converted, a water content out
// of range) and how the density was obtained.
func (s *Sample) Water() (Water, []Issue) {
	var issues []Issue
	sol, src, tds, tdsCalc := s.solution()
	w := Water{Molal: map[string]float64{}, DensityKgL: sol.DensityKgL, DensitySource: src, TDSMgL: tds, TDSCalculated: tdsCalc,
		TempC: s.TempC.V, HasTemp: s.TempC.OK, PressureBar: s.PressureBar.V, HasPressure: s.PressureBar.OK, PH: s.PH.V, HasPH: s.PH.OK, PHSource: s.PHSource}
	if !(sol.KgWaterPerL > 0.1) {
		issues = append(issues, Issue{Severity: Error, Code: CodeNoWater, Column: "TDS", Message: fmt.Sprintf("TDS %g mg/L leaves no water at density %g kg/L", tds, sol.DensityKgL)})
		return w, issues
	}
	w.KgWaterPerL = sol.KgWaterPerL
	if tdsCalc && tds > 0 && src == DensityFromTDS {
		issues = append(issues, Issue{Severity: Info, Code: CodeDensityEstimate, Message: fmt.Sprintf("TDS not reported: density estimated from the sum of the reported constituents, %.0f mg/L", tds)})
	}
	for _, k := range AnalyteKeys() {
		m, ok := s.Analytes[k]
		if !ok {
			continue
		}
		a := analytes[k]
		comp := a.Component
		if k == "TIC" {
			comp = "CO3 2-"
		}
		if comp == "" && k != "Alk" && k != "HCO3" && k != "CO3" {
			issues = append(issues, Issue{Severity: Info, Code: CodeNotComponent, Column: m.Column, Message: k + " is not a speciation component; used in the charge balance only"})
			continue
		}
		mm, err := m.MmolL(sol)
		if err != nil {
			issues = append(issues, Issue{Severity: Error, Code: CodeConversion, Column: m.Column, Message: err.Error()})
			continue
		}
		molal := mm / 1000 / sol.KgWaterPerL
		switch k {
		case "Alk":
			w.AlkalinityEqKgw, w.HasAlkalinity = molal, true
			continue
		case "HCO3", "CO3":
			// Counted as alkalinity below when no alkalinity was reported.
			continue
		}
		w.Molal[comp] = molal
	}
	if !w.HasAlkalinity {
		var alk float64
		var any bool
		for _, k := range []string{"HCO3", "CO3"} {
			if m, ok := s.Analytes[k]; ok {
				if meq, err := m.MeqL(sol); err == nil {
					alk += meq / 1000 / sol.KgWaterPerL
					any = true
				}
			}
		}
		if any {
			w.AlkalinityEqKgw, w.HasAlkalinity = alk, true
		}
	}
	return w, issues
}

// brineTDSMgL is the TDS above which the density of a water is estimated as a
// NaCl-equivalent brine instead of by the linear rule: there the linear rule's
// error grows past a few parts per thousand; at the switch the two differ by
// 0.2 % (50 g/L: 1.0350 and 1.0329 kg/L), a step of 0.2 % in the water content.
const brineTDSMgL = 50000

// densityFromTDS estimates the density (kg/L) of a water of TDS tdsMgL: the
// linear rule 1 + densityPerTDS x TDS for fresh and brackish water, and for
// brines the NaCl-equivalent density of speciation.BrineDensity (CRC Handbook
// NaCl table) at the sample's temperature (20 C when none), which holds to
// halite saturation.
func (s *Sample) densityFromTDS(tdsMgL float64) float64 {
	if tdsMgL <= brineTDSMgL {
		return 1 + densityPerTDS*tdsMgL
	}
	t := 20.0
	if s.TempC.OK && s.TempC.V >= speciation.MinTempC && s.TempC.V <= speciation.MaxTempC {
		t = s.TempC.V
	}
	if rho, err := speciation.BrineDensity(tdsMgL, t); err == nil {
		return rho
	}
	return 1 + densityPerTDS*tdsMgL
}
