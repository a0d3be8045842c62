package hydro

import (
	"bytes"
	"errors"
	"io/fs"
	"os"
	"path/filepath"
	"testing"
)

// Sheets are picked by name or number; merged header cells fill every
// column they span; ragged sheet rows (excelize drops trailing blank
// cells) are padded; a bad cell names its row and column.
func TestReadExcelSheetsAndCells(t *testing.T) {
	first := rowsToCells(t, 1, [][]any{{"Notes only"}})
	lab := rowsToCells(t, 1, [][]any{
		{"Invented Laboratory (invented data)"},
		{"Sample ID", "Ca (mg/L)", "Cl (mg/L)", "Remark"},
		{"A", 40.5, 10, "clear"},
		{"B", "abc"},
		{"C", 41, 11},
	})
	raw := workbook(t, []string{"Notes", "Lab"}, map[string]map[string]any{"Notes": first, "Lab": lab}, nil, false)
	for _, sheet := range []string{"Lab", "lab", "2"} {
		b, err := ReadExcel(bytes.NewReader(raw), "lab.xlsx", Options{Sheet: sheet})
		if err != nil {
			t.Fatalf("sheet %q: %v", sheet, err)
		}
		if b.Sheet != "Lab" || b.HeaderLine != 2 || len(b.Rows) != 3 {
			t.Fatalf("sheet %q: %q header %d, %d rows", sheet, b.Sheet, b.HeaderLine, len(b.Rows))
		}
		if m := b.Rows[0].Sample.Analytes["Ca"]; m.Value != 40.5 || b.Rows[0].Status != StatusOK {
			t.Errorf("A: %+v %v", m, b.Rows[0].Issues)
		}
		if r := b.Rows[1]; r.Line != 4 || r.Status != StatusRejected || !hasIssue(r, Error, "Ca (mg/L)", "abc") {
			t.Errorf("B: line %d %s %v", r.Line, r.Status, r.Issues)
		}
		if r := b.Rows[2]; r.Status != StatusOK || len(r.Sample.ExtraColumns) != 1 || r.Sample.ExtraColumns[0] != (ExtraColumn{"Remark", ""}) {
			t.Errorf("C: %s %v %v", r.Status, r.Issues, r.Sample.ExtraColumns)
		}
	}
	for _, sheet := range []string{"Nope", "3"} {
		if _, err := ReadExcel(bytes.NewReader(raw), "lab.xlsx", Options{Sheet: sheet}); !errors.Is(err, ErrSheet) {
			t.Errorf("sheet %q: %v", sheet, err)
		}
	}
	// Two-row headers: names merged down over the units row, or over a
	// blank row.
	for _, second := range [][]any{{nil, "ug/L", "mg/L"}, {nil, nil, nil}} {
		merged := rowsToCells(t, 1, [][]any{
			{"Invented Laboratory"},
			{"Sample ID", "Ba", "Cl"},
			second,
			{"A", 40, 10},
		})
		raw = workbook(t, []string{"S"}, map[string]map[string]any{"S": merged}, []string{"A1:C1", "A2:A3"}, false)
		b, err := ReadExcel(bytes.NewReader(raw), "m.xlsx", Options{ConfirmUnits: true})
		if err != nil {
			t.Fatal(err)
		}
		wantBa := 40.0
		if second[1] != nil {
			wantBa = 0.04
		}
		if len(b.Rows) != 1 || b.Rows[0].Sample.ID != "A" || b.Rows[0].Sample.Analytes["Ba"].MgPerL.V != wantBa {
			t.Errorf("merged header %v: %+v", second, b.Rows)
		}
	}
}

// ReadFile and Read tell a workbook from CSV text by its bytes; a missing
// file is fs.ErrNotExist underneath.
func TestReadFileKinds(t *testing.T) {
	dir := t.TempDir()
	raw := workbook(t, []string{"S"}, map[string]map[string]any{"S": rowsToCells(t, 1, [][]any{{"Sample", "Ca (mg/L)"}, {"A", 1}})}, nil, false)
	xp := filepath.Join(dir, "lab.xlsx")
	if err := os.WriteFile(xp, raw, 0o600); err != nil {
		t.Fatal(err)
	}
	b, err := ReadFile(xp, Options{})
	if err != nil || len(b.Rows) != 1 {
		t.Fatalf("%v %+v", err, b)
	}
	_, err = ReadFile(filepath.Join(dir, "absent.csv"), Options{})
	var re *ReadError
	if !errors.Is(err, fs.ErrNotExist) || !errors.Is(err, ErrRead) || !errors.As(err, &re) {
		t.Errorf("missing file: %v", err)
	}
	if b, err := Read(bytes.NewReader(raw), "-", Options{}); err != nil || len(b.Rows) != 1 {
		t.Errorf("workbook given to Read: %v", err)
	}
	if _, err := Read(bytes.NewReader([]byte("PK\x03\x04 not a workbook")), "x.xlsx", Options{}); !errors.Is(err, ErrNotCSV) {
		t.Errorf("broken zip: %v", err)
	}
}
