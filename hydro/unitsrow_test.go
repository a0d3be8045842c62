package hydro

import (
	"strings"
	"testing"

	"gonum.org/v1/gonum/floats/scalar"
)

// A units row under the header gives the same Ba as a unit in the header;
// Ba's molar mass, 137.327 g/mol, is the IUPAC 2013 standard atomic weight
// (Meija et al. 2016, Table 1), so 120 ug/L is 120e-6/137.327 mol/L.
func TestUnitsRowLikeHeaderUnit(t *testing.T) {
	inHeader := "Sample,Ba (ug/L),Cl (mg/L)\nA,120,10\n"
	inRow := "Lab report (invented)\nClient: nobody\n\nSample,Ba,Cl\n,µg/L,mg/L\nA,120,10\n"
	a := mustRead(t, inHeader, Options{})
	b := mustRead(t, inRow, Options{})
	if len(b.Rows) != 1 || b.Rows[0].Status != StatusOK {
		t.Fatalf("units-row file: %d rows %+v", len(b.Rows), b.Rows)
	}
	wa, _ := a.Rows[0].Sample.Water()
	wb, _ := b.Rows[0].Sample.Water()
	want := 120e-6 / 137.327 / wa.KgWaterPerL
	if !scalar.EqualWithinRel(wa.Molal["Ba2+"], want, 1e-12) || !scalar.EqualWithinRel(wb.Molal["Ba2+"], wa.Molal["Ba2+"], 1e-12) {
		t.Errorf("Ba2+ %g (header) %g (units row), want %g", wa.Molal["Ba2+"], wb.Molal["Ba2+"], want)
	}
	if b.HeaderLine != 4 || b.UnitsLine != 5 {
		t.Errorf("header line %d units line %d, want 4 and 5", b.HeaderLine, b.UnitsLine)
	}
	var kinds []string
	for _, s := range b.Skipped {
		kinds = append(kinds, string(s.Kind))
	}
	if strings.Join(kinds, ",") != "preamble,preamble,units row" {
		t.Errorf("skipped %v", b.Skipped)
	}
	for _, m := range b.Mapping {
		if m.Param == "Ba" && (m.UnitSource != UnitFromUnitsRow || m.Unit != "ug/L") {
			t.Errorf("Ba mapping %+v", m)
		}
	}
	if m := b.Rows[0].Sample.Analytes["Ba"]; m.Unit.Conc != UgL || m.UnitSource != UnitFromUnitsRow || !m.MgPerL.OK || !scalar.EqualWithinRel(m.MgPerL.V, 0.12, 1e-12) {
		t.Errorf("Ba as reported %+v", m)
	}
}

// With no unit anywhere each row is a warning naming the assumed mg/L,
// unless the user confirms it (option or column map).
func TestAssumedUnits(t *testing.T) {
	in := "Sample,Ca,Cl,Temp\nA,40,10,12\nB,41,11,12\n"
	tests := []struct {
		name   string
		opt    Options
		status Status
	}{
		{"assumed", Options{}, StatusWarning},
		{"confirmed by option", Options{ConfirmUnits: true}, StatusOK},
		{"stated in a column map", Options{ColumnMap: map[string]string{"Ca": "Ca (mg/L)", "Cl": "Cl (mg/L)"}}, StatusOK},
	}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			b := mustRead(t, in, tt.opt)
			for _, r := range b.Rows {
				if r.Status != tt.status {
					t.Errorf("line %d: %s %v", r.Line, r.Status, r.Issues)
				}
				if tt.status == StatusWarning && !hasCode(r, CodeUnitAssumed, "mg/L assumed") {
					t.Errorf("line %d: no unit-assumed warning: %v", r.Line, r.Issues)
				}
			}
		})
	}
}

func hasCode(r Row, code Code, frag string) bool {
	for _, is := range r.Issues {
		if is.Code == code && strings.Contains(is.Message, frag) {
			return true
		}
	}
	return false
}

// A units row is never a sample, and a row of numbers under the header is
// never a units row.
func TestUnitsRowDetection(t *testing.T) {
	tests := []struct {
		name  string
		in    string
		units bool
		rows  int
	}{
		{"units row", "Sample,Ca,Cl,pH,Temp\nUnits,mg/L,mg/L,SU,°C\nA,1,2,7,10\n", true, 1},
		{"blank id cell", "Sample,Ca,Cl\n,mmol/L,mmol/L\nA,1,2\n", true, 1},
		{"first sample", "Sample,Ca (mg/L),Cl (mg/L)\nA,1,2\n", false, 1},
		{"text in an analyte cell", "Sample,Ca,Cl\nA,n.a.,2\n", false, 1},
	}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			b := mustRead(t, tt.in, Options{ConfirmUnits: true})
			if (b.UnitsLine > 0) != tt.units || len(b.Rows) != tt.rows {
				t.Errorf("units line %d, %d rows", b.UnitsLine, len(b.Rows))
			}
		})
	}
	b := mustRead(t, "Sample,Ca,Cl\n,mmol/L,mmol/L\nA,1,2\n", Options{})
	if m := b.Rows[0].Sample.Analytes["Ca"]; m.Unit.Conc != MmolL || b.Rows[0].Status != StatusOK {
		t.Errorf("Ca %+v %s", m, b.Rows[0].Status)
	}
}

// Units per row: ppm needs a density; the conversion is stated in the
// row's notes.
func TestUnitPerRow(t *testing.T) {
	in := "Sample,Unit,Density,Ca,Cl\nA,ppm,1.1,100,200\nB,mg/L,1.1,100,200\nC,ug/L,,100,200\n"
	b := mustRead(t, in, Options{})
	a := b.Rows[0]
	if v := a.Sample.Analytes["Ca"].MgPerL; !scalar.EqualWithinRel(v.V, 110, 1e-12) || !hasCode(a, CodePerMassUnit, "1.1 kg/L (measured)") {
		t.Errorf("ppm row: Ca %v mg/L, issues %v", v, a.Issues)
	}
	if v := b.Rows[1].Sample.Analytes["Ca"].MgPerL; v.V != 100 {
		t.Errorf("mg/L row: Ca %v", v)
	}
	if v := b.Rows[2].Sample.Analytes["Ca"].MgPerL; !scalar.EqualWithinRel(v.V, 0.1, 1e-12) {
		t.Errorf("ug/L row: Ca %v", v)
	}
	for _, r := range b.Rows {
		if r.Status != StatusOK {
			t.Errorf("line %d: %s %v", r.Line, r.Status, r.Issues)
		}
	}
}
