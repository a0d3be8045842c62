package hydro

import "fmt"

// usualMaxMgL is, per analyte, a concentration (mg/L) that fresh and
// brackish groundwater seldom exceeds. A value above it in a water that is
// not saline most often means the column is in ug/L although mg/L was
// stated or assumed. Source: Hem, J.D. (1985), Study and Interpretation of
// the Chemical Characteristics of Natural Water, 3rd ed., USGS Water-Supply
// Paper 2254, the chapters on each constituent (`from memory`; the limits
// are set well above the ranges given there, so that only a unit error
// trips them).
var usualMaxMgL = map[string]float64{
	"Ba": 5,   // usually < 0.1 mg/L; a few mg/L in sulfate-free water
	"Sr": 50,  // usually < 5 mg/L; tens in water from gypsum or celestite beds
	"Fe": 100, // usually < 10 mg/L in reducing groundwater; more only in acid mine water
	"Mn": 20,  // usually < 1 mg/L
	"Al": 20,  // usually < 0.1 mg/L at near-neutral pH
	"Li": 20,  // usually < 0.1 mg/L
	"F":  30,  // usually < 1 mg/L; rarely above 10-20 mg/L
}

// salineClMgL is the chloride above which the limits above are not
// applied: brines carry far more barium, strontium, iron and manganese
// (common practice: 5000 mg/L Cl is about a quarter of seawater's, well
// into the brackish range).
const salineClMgL = 5000

// salineTDSMgL is the same threshold on measured TDS (common practice:
// 10 000 mg/L is the usual upper end of brackish water).
const salineTDSMgL = 10000

// checkPlausible warns on analytes far above their usual range in a water
// that is not saline, naming the column and the likely unit error.
func checkPlausible(row *Row, confirmed bool) {
	s := &row.Sample
	if s.TDSMgL.OK && s.TDSMgL.V >= salineTDSMgL {
		return
	}
	if cl, ok := s.Analytes["Cl"]; ok {
		if v, err := cl.MgL(Dilute()); err == nil && v >= salineClMgL {
			return
		}
	}
	for _, k := range AnalyteKeys() {
		limit, ok := usualMaxMgL[k]
		if !ok {
			continue
		}
		m, ok := s.Analytes[k]
		if !ok || m.NonDetect {
			continue
		}
		v, err := m.MgL(Dilute())
		if err != nil || v <= limit {
			continue
		}
		sev := Warning
		if confirmed {
			sev = Info
		}
		row.add(sev, CodeImplausible, row.Line, m.Column, "%s %s mg/L is far above what fresh and brackish groundwater shows (seldom above %g mg/L): if the column is in ug/L it is %s mg/L; confirm the unit", k, fmtG(v), limit, fmtG(v/1000))
	}
}

func fmtG(v float64) string { return fmt.Sprintf("%.4g", v) }
