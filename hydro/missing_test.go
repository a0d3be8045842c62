package hydro

import (
	"errors"
	"fmt"
	"os"
	"path/filepath"
	"strings"
	"testing"
)

// Every spelling of a missing or censored value, in pH, temperature and an
// analyte: none rejects its row. Documented results (package doc,
// "Missing and censored values"): a missing analyte is absent with an
// info note (row ok); a censored one is a non-detect, at half its limit
// (info, row ok) or at 0 without a limit (warning); a missing or censored
// pH or temperature is absent with a warning.
func TestMissingAndCensored(t *testing.T) {
	missing := []string{"", "n.a.", "n/a", "NA", "-", "–", "not analysed", "ns"}
	censored := []struct {
		cell string
		dl   float64 // limit read from the cell, 0 when it has none
	}{
		{"<0.5", 0.5}, {"< 0.5", 0.5}, {"<LOR", 0}, {"<LOQ", 0}, {"<MDL", 0}, {"<PQL", 0},
		{"<RL", 0}, {"ND", 0}, {"BDL", 0}, {"0.5U", 0.5}, {"0.5 <", 0.5},
	}
	type want struct {
		status Status
		code   Code
	}
	check := func(t *testing.T, cell, column string, r Row, w want) {
		t.Helper()
		if r.Status != w.status || (w.code != "" && !hasCode(r, w.code, "")) {
			t.Errorf("%q in %s: %s %v, want %s with %s", cell, column, r.Status, r.Issues, w.status, w.code)
		}
	}
	for _, cell := range missing {
		for _, col := range []string{"pH", "Temp (C)", "Ba (ug/L)"} {
			t.Run(fmt.Sprintf("missing %q in %s", cell, col), func(t *testing.T) {
				in := fmt.Sprintf("Sample,pH,Temp (C),Ca (mg/L),Ba (ug/L)\nA,%s,%s,40,%s\n",
					pick(col == "pH", cell, "7.1"), pick(col == "Temp (C)", cell, "12"), pick(col == "Ba (ug/L)", cell, "30"))
				r := mustRead(t, in, Options{}).Rows[0]
				w := want{StatusOK, CodeMissing}
				switch {
				case cell == "":
					w.code = ""
				case col != "Ba (ug/L)":
					w.status = StatusWarning
				}
				check(t, cell, col, r, w)
				s := r.Sample
				if col == "pH" && s.PH.OK || col == "Temp (C)" && s.TempC.OK {
					t.Errorf("%q read as a value", cell)
				}
				if _, ok := s.Analytes["Ba"]; col == "Ba (ug/L)" && ok {
					t.Errorf("%q read as a Ba value", cell)
				}
			})
		}
	}
	for _, c := range censored {
		for _, col := range []string{"pH", "Temp (C)", "Ba (ug/L)"} {
			t.Run(fmt.Sprintf("censored %q in %s", c.cell, col), func(t *testing.T) {
				in := fmt.Sprintf("Sample,pH,Temp (C),Ca (mg/L),Ba (ug/L)\nA,%s,%s,40,%s\n",
					pick(col == "pH", c.cell, "7.1"), pick(col == "Temp (C)", c.cell, "12"), pick(col == "Ba (ug/L)", c.cell, "30"))
				r := mustRead(t, in, Options{}).Rows[0]
				switch {
				case col != "Ba (ug/L)":
					check(t, c.cell, col, r, want{StatusWarning, CodeMissing})
				case c.dl > 0:
					check(t, c.cell, col, r, want{StatusOK, CodeNonDetect})
					if m := r.Sample.Analytes["Ba"]; m.Value != c.dl/2 || !m.NonDetect {
						t.Errorf("Ba %+v, want half of %g", m, c.dl)
					}
				default:
					check(t, c.cell, col, r, want{StatusWarning, CodeNonDetectNoDL})
				}
			})
		}
	}
}

func pick(cond bool, a, b string) string {
	if cond {
		return a
	}
	return b
}

// A censored value without a number takes the column's limit: from a
// limits row, or from Options.DetectionLimits.
func TestColumnDetectionLimit(t *testing.T) {
	tests := []struct {
		name string
		in   string
		opt  Options
	}{
		{"limits row", "Sample,Ca (mg/L),Ba (ug/L)\nLOR,0.1,2\nA,40,<LOR\n", Options{}},
		{"limits row under a units row", "Sample,Ca,Ba\nunit,mg/L,ug/L\nLOR,0.1,2\nA,40,ND\n", Options{}},
		{"option", "Sample,Ca (mg/L),Ba (ug/L)\nA,40,<LOR\n", Options{DetectionLimits: map[string]float64{"ba (ug/l)": 2}}},
	}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			b := mustRead(t, tt.in, tt.opt)
			if len(b.Rows) != 1 {
				t.Fatalf("%d rows", len(b.Rows))
			}
			r := b.Rows[0]
			if m := r.Sample.Analytes["Ba"]; m.DetectionLimit != 2 || m.Value != 1 || r.Status != StatusOK {
				t.Errorf("Ba %+v, %s %v", m, r.Status, r.Issues)
			}
		})
	}
}

// A qualifier column beside a value column ("Ba, Q") qualifies it.
func TestQualifierColumnBeside(t *testing.T) {
	b := mustRead(t, "Sample,Ca (mg/L),Ba (ug/L),Q,Cl (mg/L),Q\nA,40,2,<,10,\n", Options{})
	r := b.Rows[0]
	if m := r.Sample.Analytes["Ba"]; !m.NonDetect || m.DetectionLimit != 2 || m.Value != 1 {
		t.Errorf("Ba %+v", m)
	}
	if m := r.Sample.Analytes["Cl"]; m.NonDetect || m.Value != 10 {
		t.Errorf("Cl %+v", m)
	}
	if len(r.Sample.ExtraColumns) != 0 || strings.Contains(fmt.Sprint(b.Mapping), "kept in Extra") {
		t.Errorf("qualifier columns left unmapped: %+v", b.Mapping)
	}
}

// A column map file's third column gives a detection limit for censored
// values written without a number.
func TestColumnMapDetectionLimit(t *testing.T) {
	p := filepath.Join(t.TempDir(), "map.csv")
	if err := os.WriteFile(p, []byte("header,parameter,detection_limit\nBarium,Ba (ug/L),2\nCalc,Ca (mg/L),\n"), 0o600); err != nil {
		t.Fatal(err)
	}
	cm, err := LoadColumnMap(p)
	if err != nil {
		t.Fatal(err)
	}
	var opt Options
	cm.Apply(&opt)
	r := mustRead(t, "Sample,Calc,Barium\nA,40,ND\n", opt).Rows[0]
	if m := r.Sample.Analytes["Ba"]; m.DetectionLimit != 2 || m.Value != 1 || r.Status != StatusOK {
		t.Errorf("Ba %+v %s %v", m, r.Status, r.Issues)
	}
	if err := os.WriteFile(p, []byte("header,parameter,detection_limit\nBarium,Ba,abc\n"), 0o600); err != nil {
		t.Fatal(err)
	}
	var re *ReadError
	if _, err := LoadColumnMap(p); !errors.Is(err, ErrColumnMap) || !errors.As(err, &re) || re.Line != 2 || re.Column != 3 {
		t.Errorf("bad limit: %v", err)
	}
}
