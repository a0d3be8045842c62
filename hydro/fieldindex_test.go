package hydro

import (
	"reflect"
	"strings"
	"testing"
)

// Joined row by row, the lab rows get what JoinFieldSheet gives them where
// its whole-batch rule and the row-by-row rule agree (ids used once per
// day, wells matched by day), including the warning for a second field row.
func TestFieldIndexMatchesJoin(t *testing.T) {
	lab := "Sample ID,Well,Date,pH,Ca (mg/L),Cl (mg/L)\n" +
		"L-1,MW-1,2025-03-13,7.6,80,71\n" +
		"L-2,MW-2,2025-03-13,7.4,41.5,30.5\n" +
		"L-3,MW-3,2025-03-14,7.5,41.5,30.5\n" +
		"L-4,MW-4,2025-03-14,7.5,41.5,30.5\n"
	field := "Well,Sample ID,Date,pH,Temp (°C),EC (µS/cm)\n" +
		"MW-1,F-1,13/03/2025,7.05,14.2,650\n" +
		"MW-2,L-2,13/03/2025,6.95,13.1,410\n" +
		"MW-9,F-9,13/03/2025,7.00,13.0,300\n" +
		"MW-3,F-3,15/03/2025,7.10,13.5,350\n" +
		"MW-4,,14/03/2025,7.20,13.6,360\n" +
		"MW-4,F-4b,14/03/2025,7.30,13.7,370\n"
	cases := []struct {
		name string
		opt  Options
	}{
		{"plain", Options{}},
		{"site temperature", Options{SiteTempC: Some(12)}},
	}
	for _, c := range cases {
		fb, err := ReadFieldSheet(strings.NewReader(field), "field.csv", c.opt)
		if err != nil {
			t.Fatal(err)
		}
		whole := mustRead(t, lab, c.opt)
		j := JoinFieldSheet(whole, fb)
		x := NewFieldIndex(fb)
		s, err := ScanBytes([]byte(lab), "test.csv", c.opt)
		if err != nil {
			t.Fatal(err)
		}
		for i, r := range scanAll(t, s) {
			x.Join(&r)
			if !reflect.DeepEqual(r, whole.Rows[i]) {
				t.Errorf("%s: line %d:\n got %+v\nwant %+v", c.name, r.Line, r, whole.Rows[i])
			}
		}
		if x.Joined != j.Joined {
			t.Errorf("%s: joined %d, want %d", c.name, x.Joined, j.Joined)
		}
		if got, want := x.Unmatched(), j.UnmatchedField; !reflect.DeepEqual(got, want) {
			t.Errorf("%s: unmatched field rows %v, want %v", c.name, got, want)
		}
	}
}
