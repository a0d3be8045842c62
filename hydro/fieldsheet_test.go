package hydro

import (
	"math"
	"strings"
	"testing"
)

// A lab file plus a field sheet give the same water as one file holding
// both (a property); field rows and lab rows that match nothing are listed.
func TestJoinFieldSheet(t *testing.T) {
	lab := "Sample ID,Well,Date,pH,Ca (mg/L),Mg (mg/L),Na (mg/L),K (mg/L),Cl (mg/L),SO4 (mg/L),HCO3 (mg/L)\n" +
		"L-1,MW-1,2025-03-13,7.6,80,24,46,3.9,71,96,244\n" +
		"L-2,MW-2,2025-03-13,7.4,41.5,8.2,20.1,2.2,30.5,21,130\n" +
		"L-3,MW-3,2025-03-14,7.5,41.5,8.2,20.1,2.2,30.5,21,130\n"
	// Field ids differ from the lab's: MW-1 matches on well and date;
	// L-2 on its sample id; MW-9 and MW-3 on another day match nothing.
	field := "Well,Sample ID,Date,pH,Temp (°C),EC (µS/cm),DO (mg/L),ORP (mV)\n" +
		"MW-1,F-1,13/03/2025,7.05,14.2,650,0.4,-120\n" +
		"MW-2,L-2,13/03/2025,6.95,13.1,410,3.2,85\n" +
		"MW-9,F-9,13/03/2025,7.00,13.0,300,1.0,10\n" +
		"MW-3,F-3,15/03/2025,7.10,13.5,350,2.0,20\n"
	merged := "Sample ID,Well,Date,pH (field),Temp (°C),EC (µS/cm),DO (mg/L),ORP (mV),Ca (mg/L),Mg (mg/L),Na (mg/L),K (mg/L),Cl (mg/L),SO4 (mg/L),HCO3 (mg/L)\n" +
		"L-1,MW-1,2025-03-13,7.05,14.2,650,0.4,-120,80,24,46,3.9,71,96,244\n" +
		"L-2,MW-2,2025-03-13,6.95,13.1,410,3.2,85,41.5,8.2,20.1,2.2,30.5,21,130\n"
	lb := mustRead(t, lab, Options{})
	fb, err := ReadFieldSheet(strings.NewReader(field), "field.csv", Options{})
	if err != nil {
		t.Fatal(err)
	}
	mb := mustRead(t, merged, Options{})
	j := JoinFieldSheet(lb, fb)
	if j.Joined != 2 || len(j.UnmatchedLab) != 1 || j.UnmatchedLab[0] != 2 || len(j.UnmatchedField) != 2 ||
		j.UnmatchedField[0].Sample.WellID != "MW-9" || j.UnmatchedField[1].Sample.WellID != "MW-3" {
		t.Fatalf("join %+v", j)
	}
	for i := 0; i < 2; i++ {
		got, want := lb.Rows[i].Sample, mb.Rows[i].Sample
		wg, _ := got.Water()
		ww, _ := want.Water()
		if wg.PH != ww.PH || wg.TempC != ww.TempC || got.SpecCondUScm != want.SpecCondUScm ||
			got.DissolvedOxygenMgL != want.DissolvedOxygenMgL || got.ORPMV != want.ORPMV {
			t.Errorf("row %d: pH %v T %v EC %v DO %v ORP %v, want %v %v %v %v %v", i, wg.PH, wg.TempC, got.SpecCondUScm, got.DissolvedOxygenMgL, got.ORPMV,
				ww.PH, ww.TempC, want.SpecCondUScm, want.DissolvedOxygenMgL, want.ORPMV)
		}
		for c, m := range ww.Molal {
			if math.Abs(wg.Molal[c]-m) > 1e-15 {
				t.Errorf("row %d: %s %g, want %g", i, c, wg.Molal[c], m)
			}
		}
		if got.PHSource != PHFromSheet || got.TempSource != TempFromField || got.FieldLine != i+2 {
			t.Errorf("row %d: sources %q %q line %d", i, got.PHSource, got.TempSource, got.FieldLine)
		}
		if !hasCode(lb.Rows[i], CodeFieldSheet, "the lab file's") {
			t.Errorf("row %d: %v", i, lb.Rows[i].Issues)
		}
	}
}

// A site temperature fills samples without one, and a field temperature
// replaces it.
func TestSiteTemperature(t *testing.T) {
	b := mustRead(t, "Sample,Temp,Ca (mg/L)\nA,,40\nB,9.5,40\n", Options{SiteTempC: Some(11)})
	a, bb := b.Rows[0].Sample, b.Rows[1].Sample
	if a.TempC != Some(11) || a.TempSource != TempFromSite || !hasCode(b.Rows[0], CodeSiteTemp, "11 C") {
		t.Errorf("A: %v %q %v", a.TempC, a.TempSource, b.Rows[0].Issues)
	}
	if bb.TempC != Some(9.5) || bb.TempSource != TempFromLab {
		t.Errorf("B: %v %q", bb.TempC, bb.TempSource)
	}
	fb, err := ReadFieldSheet(strings.NewReader("Sample,Temperature (C)\nA,12.5\n"), "f.csv", Options{})
	if err != nil {
		t.Fatal(err)
	}
	JoinFieldSheet(b, fb)
	if s := b.Rows[0].Sample; s.TempC != Some(12.5) || s.TempSource != TempFromField || hasCode(b.Rows[0], CodeSiteTemp, "") {
		t.Errorf("A after join: %v %q %v", s.TempC, s.TempSource, b.Rows[0].Issues)
	}
	if _, err := Read(strings.NewReader("Sample,Ca\nA,1\n"), "x.csv", Options{SiteTempC: Some(150)}); err == nil {
		t.Error("site temperature 150 C accepted")
	}
}
