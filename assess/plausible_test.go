package assess

import (
	"context"
	"fmt"
	"math"
	"strings"
	"testing"

	"gwsat.dev/gwsat/hydro"
	"gwsat.dev/gwsat/speciation"
)

func assessCSV(t *testing.T, csv string) []Record {
	t.Helper()
	b, err := hydro.Read(strings.NewReader(csv), "p.csv", hydro.Options{})
	if err != nil {
		t.Fatal(err)
	}
	db, err := speciation.Default()
	if err != nil {
		t.Fatal(err)
	}
	recs, err := Run(context.Background(), db, []*hydro.Batch{b}, Options{})
	if err != nil {
		t.Fatal(err)
	}
	return recs
}

func hasCode(r *Record, code hydro.Code) bool {
	for _, is := range r.Issues {
		if is.Code == code {
			return true
		}
	}
	return false
}

// A pH typed 2.06 for 7.06 with a normal alkalinity (180 mg/L as CaCO3): to carry
// 3.6 meq/kg of alkalinity as HCO3- at pH 2, where HCO3-/CO2(aq) = K1/a(H+) =
// 10^-6.35/10^-2.06 (Plummer & Busenberg 1982, K1 at 25 C), the water would need
// about 10^4.3 times more CO2(aq) than HCO3-, i.e. tens of mol/kg of CO2: a partial
// pressure of hundreds of atm. A groundwater at 20 m holds at most 1 + 20/10.33 atm
// (hydrostatics), so the row is a warning naming the likely cause.
func TestPHTypoWithAlkalinityIsWarned(t *testing.T) {
	head := "Sample,Depth (m),pH,Temp,Ca,Mg,Na,K,Cl,SO4,Alkalinity as CaCO3\n"
	recs := assessCSV(t, head+"typo,20,2.06,15,60,12,20,2,30,40,180\nfine,20,7.06,15,60,12,20,2,30,40,180\n")
	if !hasCode(&recs[0], CodePCO2) || recs[0].Status != hydro.StatusWarning {
		t.Errorf("pH 2.06: status %s, issues %v", recs[0].Status, recs[0].Reasons())
	}
	if !strings.Contains(strings.Join(recs[0].Reasons(), ";"), "typing error in pH or alkalinity") {
		t.Errorf("the warning must name the likely cause: %v", recs[0].Reasons())
	}
	if hasCode(&recs[1], CodePCO2) {
		t.Errorf("pH 7.06 flagged: %v", recs[1].Reasons())
	}
}

// Totals beyond the solubility of the most soluble salt are rejected with the
// column named: 400 g/L of calcium is 10 mol/kg water, above the 8.8 mol/kg of a
// saturated Ca(NO3)2 solution (CRC Handbook, from memory); values too large to
// compute with never reach a number.
func TestBeyondNaturalWaterRejected(t *testing.T) {
	head := "Sample,pH,Temp,Ca (mg/L),Mg,Na,K,Cl (mg/L),SO4,Alkalinity as CaCO3\n"
	recs := assessCSV(t, head+
		"huge,7.2,15,1e308,12,20,2,30,40,180\n"+
		"salty,7.2,15,400000,12,20,2,30,40,180\n"+
		"brine,7.2,15,60,12,20,2,180000,40,180\n")
	for i, r := range recs[:2] {
		if r.Status != hydro.StatusRejected || r.Result != nil {
			t.Errorf("row %d: status %s", i, r.Status)
		}
		if i == 0 {
			continue // rejected by the unit conversion already, which names its own column
		}
		found := false
		for _, is := range r.Issues {
			if is.Severity == hydro.Error && is.Column == "Ca (mg/L)" {
				found = true
			}
		}
		if !found {
			t.Errorf("row %d: no error naming the Ca column: %v", i, r.Reasons())
		}
	}
	// 180 g/L of chloride is about 5.5 mol/kg water: a brine, not an error.
	if hasCode(&recs[2], CodeBeyondNature) {
		t.Errorf("a plausible brine rejected: %v", recs[2].Reasons())
	}
}

// The automatic model choice: a fresh water is solved with Truesdell-Jones, a
// brine (ionic strength above AutoModelSwitch) with Pitzer's equations, and the
// model is recorded on the row.
func TestAutoModelByIonicStrength(t *testing.T) {
	head := "Sample,pH,Temp,Ca (mg/L),Mg (mg/L),Na (mg/L),K (mg/L),Cl (mg/L),SO4 (mg/L),Alkalinity (mg/L as CaCO3)\n"
	recs := assessCSV(t, head+"fresh,7.2,15,60,12,20,2,30,40,180\nbrine,6.8,40,9000,1500,60000,900,115000,300,150\n")
	if recs[0].Result == nil || recs[0].Result.Model != "truesdell-jones" {
		t.Fatalf("fresh water: %+v", recs[0].Reasons())
	}
	if recs[1].Result == nil || recs[1].Result.Model != "pitzer" || recs[1].Result.IonicStrength <= AutoModelSwitch {
		t.Fatalf("brine: model %v, reasons %v", recs[1].Result, recs[1].Reasons())
	}
	if hasCode(&recs[1], CodeIonicStrength) {
		t.Errorf("a brine within Pitzer's range warned: %v", recs[1].Reasons())
	}
}

// Redox readings set the pe: dissolved oxygen through the O2/H2O couple (an
// air-saturated water at pH 7 and 25 C has pe near 13.6; Stumm & Morgan 1996,
// from memory), Eh by pe = F Eh / (ln10 R T) (59.16 mV per pe unit at 25 C), and a
// water without readings is solved without a pe and says so.
func TestRedoxReadingsSetThePE(t *testing.T) {
	head := "Sample,pH,Temp (C),Ca (mg/L),Mg (mg/L),Na (mg/L),K (mg/L),Cl (mg/L),SO4 (mg/L),Alkalinity (mg/L as CaCO3),Fe (mg/L),DO (mg/L),Eh (mV)\n"
	recs := assessCSV(t, head+
		"oxic,7.0,25,60,12,20,2,30,40,180,0.05,8.26,\n"+
		"eh,7.0,25,60,12,20,2,30,40,180,0.05,,100\n"+
		"none,7.0,25,60,12,20,2,30,40,180,0.05,,\n")
	r := recs[0].Result
	if r == nil || !r.HasPE || recs[0].PESource != "O2/H2O" || r.PE < 13.2 || r.PE > 14 {
		t.Fatalf("oxic water: result %v, source %q, reasons %v", r != nil && r.HasPE, recs[0].PESource, recs[0].Reasons())
	}
	if _, ok := r.SI("ferrihydrite"); !ok {
		t.Error("no ferrihydrite SI with a pe")
	}
	r = recs[1].Result
	if r == nil || !r.HasPE || recs[1].PESource != "Eh" || math.Abs(r.PE-100/59.16) > 0.01 {
		t.Fatalf("Eh water: %v %q %v", r != nil && r.HasPE, recs[1].PESource, recs[1].Reasons())
	}
	if !hasCode(&recs[2], CodeNoRedox) || recs[2].Result.HasPE {
		t.Errorf("a water without redox readings: %v", recs[2].Reasons())
	}
}

// A measured Fe(II)/Fe(III) pair sets the pe at which the speciated water holds
// the two in the measured ratio (the definition of a couple's pe; the Nernst
// equation of Fe3+/Fe2+, E0 = 0.771 V, Bard, Parsons & Jordan 1985); a total-iron
// column with Fe(III) gives the same pair.
func TestMeasuredIronPairSetsThePE(t *testing.T) {
	db, err := speciation.Default()
	if err != nil {
		t.Fatal(err)
	}
	head := "Sample,pH,Temp (C),Ca (mg/L),Mg (mg/L),Na (mg/L),K (mg/L),Cl (mg/L),SO4 (mg/L),Alkalinity (mg/L as CaCO3),%s,Fe(III) (mg/L)\n"
	for _, c := range []struct{ col, fe string }{{"Fe(II) (mg/L)", "1.0"}, {"Fe (mg/L)", "1.1"}} {
		recs := assessCSV(t, fmt.Sprintf(head, c.col)+"A,6.5,15,60,12,20,2,30,40,180,"+c.fe+",0.1\n")
		r := recs[0].Result
		if r == nil || !r.HasPE || !strings.HasPrefix(recs[0].PESource, "Fe") {
			t.Fatalf("%s: pe %v, source %q, reasons %v", c.col, r != nil && r.HasPE, recs[0].PESource, recs[0].Reasons())
		}
		fe3 := db.StateTotal(r, "Fe2+", -1)
		fe2 := db.StateTotal(r, "Fe2+", 0)
		if ratio := fe3 / fe2; math.Abs(ratio-0.1) > 0.002 {
			t.Errorf("%s: speciated Fe(III)/Fe(II) = %.4f, measured 0.1", c.col, ratio)
		}
	}
}

// A pe column is used as given (it comes first of all readings).
func TestPEColumn(t *testing.T) {
	head := "Sample,pH,Temp (C),Ca (mg/L),Mg (mg/L),Na (mg/L),K (mg/L),Cl (mg/L),SO4 (mg/L),Alkalinity (mg/L as CaCO3),Fe (mg/L),pe,DO (mg/L)\n"
	recs := assessCSV(t, head+"A,7.0,15,60,12,20,2,30,40,180,0.5,2.5,6\n")
	r := recs[0].Result
	if r == nil || !r.HasPE || math.Abs(r.PE-2.5) > 1e-9 || recs[0].PESource == "" {
		t.Fatalf("result %v, source %q, reasons %v", r != nil, recs[0].PESource, recs[0].Reasons())
	}
}

// Sulfate with sulfide sets the pe at which the speciated water holds them in the
// measured ratio, near pe -3.6 at pH 7 for equal amounts (the SO4 2-/HS- couple
// on the redox ladder, Stumm & Morgan 1996, from memory): here sulfate is ten
// times the sulfide, which moves the pe up by only log10(10)/8 = 0.125.
func TestMeasuredSulfurPairSetsThePE(t *testing.T) {
	db, err := speciation.Default()
	if err != nil {
		t.Fatal(err)
	}
	// 96 mg/L SO4 = 1 mmol; 3.2 mg/L sulfide as S = 0.1 mmol.
	head := "Sample,pH,Temp (C),Ca (mg/L),Mg (mg/L),Na (mg/L),K (mg/L),Cl (mg/L),SO4 (mg/L),Alkalinity (mg/L as CaCO3),Sulfide (mg/L)\n"
	recs := assessCSV(t, head+"A,7.0,25,60,12,40,2,30,96.056,180,3.206\n")
	r := recs[0].Result
	if r == nil || !r.HasPE || recs[0].PESource == "" {
		t.Fatalf("result %v, source %q, reasons %v", r != nil, recs[0].PESource, recs[0].Reasons())
	}
	ox := db.StateTotal(r, "SO4 2-", 0)
	red := db.StateTotal(r, "SO4 2-", 8)
	if math.Abs(red/ox-0.1/1.0) > 0.002 {
		t.Errorf("speciated sulfide/sulfate %.4f, measured 0.1", red/ox)
	}
	if r.PE > -2 || r.PE < -6 {
		t.Errorf("pe %.2f, expected near -3.6", r.PE)
	}
}
