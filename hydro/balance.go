package hydro

import (
	"fmt"
	"math"
	"sort"
)

// BalanceStatus is the verdict of a charge balance.
type BalanceStatus string

const (
	BalancePass BalanceStatus = "pass"
	BalanceWarn BalanceStatus = "warn"
	BalanceFail BalanceStatus = "fail"
	// BalanceIncomplete: a required major ion is missing, no verdict.
	BalanceIncomplete BalanceStatus = "incomplete"
)

// Balance is the anion-cation balance of one sample from its analytical
// totals in meq/L.
type Balance struct {
	CationsMeqL float64
	AnionsMeqL  float64
	// ErrorPct = 100 (cations - anions) / (cations + anions).
	ErrorPct float64
	// DiffMeqL = cations - anions.
	DiffMeqL float64
	Status   BalanceStatus
	// Criterion names the acceptance band applied, e.g. "|cations - anions|
	// <= 0.2 meq/L (anion sum 0-3.0 meq/L)".
	Criterion string
	// Complete is true when every required major ion was reported: Ca, Mg,
	// Na, K, Cl, SO4 and alkalinity (Alk, or HCO3/CO3).
	Complete bool
	Missing  []string
	// Ions lists the ions counted, in key order.
	Ions []string

	// TDS check of 1030 E (informational): measured TDS over calculated TDS,
	// acceptable between 1.0 and 1.2.
	TDSCalcMgL  float64
	TDSRatio    float64
	HasTDSRatio bool
	TDSRatioOK  bool
}

// Required ions for a complete balance.
var requiredIons = []string{"Ca", "Mg", "Na", "K", "Cl", "SO4"}

// ChargeBalance computes the anion-cation balance of a sample and judges it
// by the acceptance criteria of Standard Methods for the Examination of
// Water and Wastewater, 23rd edition (2017), section 1030 E ("Checking
// analyses' correctness"), from memory: for an anion sum of 0-3.0 meq/L the
// difference cations - anions must be within +/-0.2 meq/L; for 3.0-10.0
// meq/L within +/-2 %; for 10-800 meq/L within +/-5 % (% difference =
// 100 (sum cations - sum anions)/(sum cations + sum anions)). An anion sum
// exactly on a band edge belongs to the lower band. Above 800 meq/L the 5 %
// band is kept and the criterion says so.
//
// Status: pass within the criterion; warn up to twice the criterion; fail
// beyond (`common practice`: the doubled band separates a result worth a
// second look from one to re-analyse). Incomplete when a required major ion
// is missing; the sums are still reported.
//
// Ions counted: the majors Ca, Mg, Na, K, Cl, SO4 and alkalinity always;
// Sr, Ba, Fe (as Fe2+, or Fe3+ when reported as Fe(III)), Mn, Li, NH4, F,
// NO3, NO2 and Br when reported. Alkalinity counts as reported when given
// (it includes carbonate); otherwise HCO3 + 2 CO3. Al and PO4 are left out
// (their charge depends on pH), as are H+ and OH-.
func ChargeBalance(s *Sample) Balance {
	var b Balance
	sol, _, _, _ := s.solution()
	if !(sol.KgWaterPerL > 0) {
		sol = Dilute()
	}
	keys := make([]string, 0, len(s.Analytes))
	for k := range s.Analytes {
		keys = append(keys, k)
	}
	sort.Strings(keys)
	_, hasAlk := s.Analytes["Alk"]
	for _, k := range keys {
		a := analytes[k]
		if a == nil || !a.Balance {
			continue
		}
		if hasAlk && (k == "HCO3" || k == "CO3") {
			continue
		}
		meq, err := s.Analytes[k].MeqL(sol)
		if err != nil {
			continue
		}
		if a.Z > 0 {
			b.CationsMeqL += meq
		} else {
			b.AnionsMeqL += meq
		}
		b.Ions = append(b.Ions, k)
	}
	b.Complete = true
	for _, k := range requiredIons {
		if k == "K" && s.Analytes["Na"].SodiumPlusPotassium {
			continue // K is inside the Na value
		}
		if _, ok := s.Analytes[k]; !ok {
			b.Complete = false
			b.Missing = append(b.Missing, k)
		}
	}
	_, hasHCO3 := s.Analytes["HCO3"]
	_, hasCO3 := s.Analytes["CO3"]
	if !hasAlk && !hasHCO3 && !hasCO3 {
		b.Complete = false
		b.Missing = append(b.Missing, "Alk")
	}
	judge(&b)
	if !b.Complete {
		b.Status = BalanceIncomplete
	}
	tdsCheck(s, &b)
	return b
}

// judge fills ErrorPct, DiffMeqL, Status and Criterion from the sums.
func judge(b *Balance) {
	b.DiffMeqL = b.CationsMeqL - b.AnionsMeqL
	if sum := b.CationsMeqL + b.AnionsMeqL; sum > 0 {
		b.ErrorPct = 100 * b.DiffMeqL / sum
	}
	var within float64 // ratio of the deviation to the allowed one
	switch an := b.AnionsMeqL; {
	case an <= 3.0:
		b.Criterion = "|cations - anions| <= 0.2 meq/L (anion sum 0-3.0 meq/L; Standard Methods 1030 E, 23rd ed.)"
		within = math.Abs(b.DiffMeqL) / 0.2
	case an <= 10:
		b.Criterion = "|% difference| <= 2 % (anion sum 3.0-10.0 meq/L; Standard Methods 1030 E, 23rd ed.)"
		within = math.Abs(b.ErrorPct) / 2
	case an <= 800:
		b.Criterion = "|% difference| <= 5 % (anion sum 10-800 meq/L; Standard Methods 1030 E, 23rd ed.)"
		within = math.Abs(b.ErrorPct) / 5
	default:
		b.Criterion = fmt.Sprintf("|%% difference| <= 5 %% (anion sum %.0f meq/L, beyond the 800 meq/L of Standard Methods 1030 E; its last band applied)", an)
		within = math.Abs(b.ErrorPct) / 5
	}
	// A relative tolerance of 1e-9 keeps a result that sits on the band
	// edge (as written in the lab file) from failing on rounding.
	switch {
	case within <= 1+1e-9:
		b.Status = BalancePass
	case within <= 2+1e-9:
		b.Status = BalanceWarn
	default:
		b.Status = BalanceFail
	}
}

// tdsCheck computes the measured/calculated TDS ratio of 1030 E:
// calculated TDS = 0.6 (alkalinity as CaCO3) + Na + K + Ca + Mg + Cl + SO4 +
// SiO2 + NO3 (as NO3) + F, in mg/L; acceptable when 1.0 <= ratio <= 1.2
// (Standard Methods 1030 E, 23rd ed., 2017, `from memory`). An analyte whose
// unit cannot be converted (only possible in a Sample built by hand; Read
// refuses such units) leaves the ratio out rather than using a partial sum.
func tdsCheck(s *Sample, b *Balance) {
	if !s.TDSMgL.OK {
		return
	}
	sum := 0.0
	for _, k := range []string{"Na", "K", "Ca", "Mg", "Cl", "SO4", "SiO2", "NO3", "F"} {
		if m, ok := s.Analytes[k]; ok {
			v, err := m.MgL(Dilute())
			if err != nil {
				return
			}
			sum += v
		}
	}
	alkKeys := []string{"HCO3", "CO3"}
	if _, ok := s.Analytes["Alk"]; ok {
		alkKeys = []string{"Alk"}
	}
	alkMeq := 0.0
	for _, k := range alkKeys {
		if m, ok := s.Analytes[k]; ok {
			v, err := m.MeqL(Dilute())
			if err != nil {
				return
			}
			alkMeq += v
		}
	}
	sum += 0.6 * alkMeq * mmCaCO3 / 2
	if !(sum > 0) || math.IsInf(sum, 0) {
		return
	}
	b.TDSCalcMgL = sum
	b.TDSRatio = s.TDSMgL.V / sum
	if math.IsNaN(b.TDSRatio) || math.IsInf(b.TDSRatio, 0) {
		b.TDSCalcMgL, b.TDSRatio = 0, 0
		return
	}
	b.HasTDSRatio = true
	b.TDSRatioOK = b.TDSRatio >= 1.0 && b.TDSRatio <= 1.2
}
