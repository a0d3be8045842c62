package assess

import (
	"fmt"
	"math"
	"strings"

	"gwsat.dev/gwsat/hydro"
	"gwsat.dev/gwsat/speciation"
)

// Codes of the plausibility checks.
const (
	CodeBeyondNature hydro.Code = "beyond-natural-water" // a total above the solubility of its most soluble salt
	CodePCO2         hydro.Code = "implausible-pco2"     // pH and alkalinity that cannot coexist in an aquifer
	CodeNotFinite    hydro.Code = "not-finite"           // a number too large to compute with
)

// saltLimit is the largest molality a component can reach in water: its
// concentration in a saturated solution of the most soluble of its common salts
// (chlorides, nitrates, sulfates, carbonates) at 25 C. Solubilities from the CRC
// Handbook of Chemistry and Physics, "Aqueous solubility of inorganic compounds"
// (g per 100 g water, converted with IUPAC molar masses), from memory; they are
// generous bounds: a reported total above its bound is not a natural water but a
// unit or typing error.
type saltLimit struct {
	molKgw float64
	salt   string
}

var saltLimits = map[string]saltLimit{
	"Ca2+":   {8.8, "Ca(NO3)2"},
	"Mg2+":   {5.9, "MgCl2"},
	"Na+":    {10.7, "NaNO3"},
	"K+":     {8.1, "K2CO3"},
	"Sr2+":   {3.8, "Sr(NO3)2"},
	"Ba2+":   {1.8, "BaCl2"},
	"Fe2+":   {5.4, "FeCl2"},
	"Mn2+":   {6.1, "MnCl2"},
	"Cl-":    {14.7, "CaCl2"},
	"SO4 2-": {5.8, "(NH4)2SO4"},
	"CO3 2-": {8.1, "K2CO3"},
	"F-":     {17.5, "KF"},
	"NO3-":   {17.6, "Ca(NO3)2"},
	"Br-":    {15.6, "CaBr2"},
	"H4SiO4": {1.0, "silica (no natural water holds a tenth of this)"},
}

// checkPlausible rejects totals that no natural water can hold, naming the
// column they came from, and any total too large to compute with.
func checkPlausible(r *Record, w *hydro.Water) {
	for comp, m := range w.Molal {
		col := analyteColumn(r.Sample(), comp)
		if math.IsNaN(m) || math.IsInf(m, 0) {
			r.Add(hydro.Issue{Severity: hydro.Error, Code: CodeNotFinite, Column: col, Message: "value too large to compute with"})
			continue
		}
		if lim, ok := saltLimits[comp]; ok && m > lim.molKgw {
			r.Add(hydro.Issue{Severity: hydro.Error, Code: CodeBeyondNature, Column: col,
				Message: fmt.Sprintf("%s mol/kg water of %s is above the solubility of %s (%.3g mol/kg at 25 C): not a natural water; check the unit and the digits",
					sig3(m), comp, lim.salt, lim.molKgw)})
		}
	}
	if math.IsNaN(w.AlkalinityEqKgw) || math.IsInf(w.AlkalinityEqKgw, 0) {
		r.Add(hydro.Issue{Severity: hydro.Error, Code: CodeNotFinite, Column: analyteColumn(r.Sample(), "Alk"), Message: "alkalinity too large to compute with"})
	}
}

// analyteColumn finds the input column of a component's analyte ("Ca2+" ->
// the column the Ca value came from), or "".
func analyteColumn(s *hydro.Sample, comp string) string {
	key := strings.TrimRight(comp, " +-0123456789")
	if comp == speciation.NameCarbonate {
		for _, k := range []string{"Alk", "HCO3", "CO3", "TIC"} {
			if m, ok := s.Analytes[k]; ok {
				return m.Column
			}
		}
	}
	if comp == "H4SiO4" {
		key = "SiO2"
	}
	if m, ok := s.Analytes[key]; ok {
		return m.Column
	}
	if m, ok := s.Analytes[comp]; ok {
		return m.Column
	}
	return ""
}

// checkPCO2 warns when the CO2 partial pressure the pH and alkalinity imply
// exceeds what the water could hold in the aquifer: 1 atm plus the hydrostatic
// pressure at the sample depth (10.33 m of water per atm; common practice: gas
// would exsolve above it). The usual cause is a typing error in pH or alkalinity.
func checkPCO2(r *Record, res *speciation.Result) {
	if !res.HasLogPCO2 {
		return
	}
	limit := 1.0
	where := "at the surface"
	if d, ok := DepthM(r.Sample()); ok && d > 0 {
		limit += d / 10.33
		where = fmt.Sprintf("at %.0f m depth", d)
	}
	if res.LogPCO2 > math.Log10(limit) {
		r.Note(hydro.Warning, CodePCO2, "pH %.2f with this alkalinity implies a CO2 partial pressure of %s atm, more than the %.2g atm a groundwater can hold %s: likely a typing error in pH or alkalinity",
			res.PH, sig3(math.Pow(10, res.LogPCO2)), limit, where)
	}
}

func sig3(v float64) string { return fmt.Sprintf("%.3g", v) }
