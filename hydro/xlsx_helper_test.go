package hydro

import (
	"bytes"
	"testing"

	"github.com/xuri/excelize/v2"
)

// workbook builds an .xlsx file in memory: cells by sheet and A1 name;
// merges lists ranges ("A1:D1") of the first sheet to merge; date1904 sets
// the 1904 date system before any value is written.
func workbook(t *testing.T, sheets []string, cells map[string]map[string]any, merges []string, date1904 bool) []byte {
	t.Helper()
	f := excelize.NewFile()
	defer func() {
		if err := f.Close(); err != nil {
			t.Error(err)
		}
	}()
	if date1904 {
		on := true
		if err := f.SetWorkbookProps(&excelize.WorkbookPropsOptions{Date1904: &on}); err != nil {
			t.Fatal(err)
		}
	}
	for i, name := range sheets {
		if i == 0 {
			if err := f.SetSheetName("Sheet1", name); err != nil {
				t.Fatal(err)
			}
		} else if _, err := f.NewSheet(name); err != nil {
			t.Fatal(err)
		}
		for ref, v := range cells[name] {
			if err := f.SetCellValue(name, ref, v); err != nil {
				t.Fatal(err)
			}
		}
	}
	for _, m := range merges {
		var a, b string
		for i := range m {
			if m[i] == ':' {
				a, b = m[:i], m[i+1:]
			}
		}
		if err := f.MergeCell(sheets[0], a, b); err != nil {
			t.Fatal(err)
		}
	}
	var buf bytes.Buffer
	if err := f.Write(&buf); err != nil {
		t.Fatal(err)
	}
	return buf.Bytes()
}

// rowsToCells lays out a table from a top-left row number: each inner
// slice is one sheet row starting in column A.
func rowsToCells(t *testing.T, firstRow int, rows [][]any) map[string]any {
	t.Helper()
	m := map[string]any{}
	for r, row := range rows {
		for c, v := range row {
			if v == nil {
				continue
			}
			ref, err := excelize.CoordinatesToCellName(c+1, firstRow+r)
			if err != nil {
				t.Fatal(err)
			}
			m[ref] = v
		}
	}
	return m
}
