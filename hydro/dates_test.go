package hydro

import (
	"bytes"
	"testing"
	"time"
)

// Dates: ISO, d.m.Y, d/m/Y and m/d/Y with or without a time, and Excel
// serial numbers. Serial 45729 is 2025-03-13 in the 1900 date system
// (days since 1899-12-30 once past the phantom 29 February 1900: ECMA-376
// Part 1, 18.17.4.1, `from memory`; 45658 is 2025-01-01, and 2025-03-13 is
// day 72 of 2025, 45658 + 71 = 45729).
func TestDates(t *testing.T) {
	day := func(y, m, d, hh, mm int) time.Time { return time.Date(y, time.Month(m), d, hh, mm, 0, 0, time.UTC) }
	tests := []struct {
		name   string
		column []string
		opt    Options
		want   []time.Time // zero: left empty with a warning
		order  string
	}{
		{"ISO with time", []string{"2025-03-13", "2025-03-13 14:30"}, Options{}, []time.Time{day(2025, 3, 13, 0, 0), day(2025, 3, 13, 14, 30)}, ""},
		{"dotted day first", []string{"13.03.2025", "3.4.2025 08:15"}, Options{}, []time.Time{day(2025, 3, 13, 0, 0), day(2025, 4, 3, 8, 15)}, ""},
		{"a day above 12 decides day first", []string{"13/03/2025", "03/04/2025"}, Options{}, []time.Time{day(2025, 3, 13, 0, 0), day(2025, 4, 3, 0, 0)}, "day first"},
		{"a day above 12 decides month first", []string{"03/13/2025 10:00", "03/04/2025"}, Options{}, []time.Time{day(2025, 3, 13, 10, 0), day(2025, 3, 4, 0, 0)}, "month first"},
		{"ambiguous alone", []string{"03/04/2025"}, Options{}, []time.Time{{}}, ""},
		{"ambiguous, order set", []string{"03/04/2025"}, Options{DateOrder: MonthFirst}, []time.Time{day(2025, 3, 4, 0, 0)}, "month first"},
		{"Excel serial", []string{"45729", "45729.5"}, Options{}, []time.Time{day(2025, 3, 13, 0, 0), day(2025, 3, 13, 12, 0)}, ""},
	}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			in := "Sample,Date,Ca (mg/L)\n"
			for i, d := range tt.column {
				in += string(rune('A'+i)) + "," + d + ",1\n"
			}
			b := mustRead(t, in, tt.opt)
			for i, r := range b.Rows {
				got := r.Sample.SampledAt
				if !got.Equal(tt.want[i]) {
					t.Errorf("%q: %v, want %v", tt.column[i], got, tt.want[i])
				}
				if tt.want[i].IsZero() != (r.Status == StatusWarning) || tt.want[i].IsZero() && !hasCode(r, CodeAmbiguousDate, "03/04/2025") {
					t.Errorf("%q: %s %v", tt.column[i], r.Status, r.Issues)
				}
			}
			if b.DateOrder != tt.order {
				t.Errorf("order %q, want %q", b.DateOrder, tt.order)
			}
		})
	}
}

// Workbook dates are serial numbers in the workbook's date system; the
// same calendar date written in a 1900 and in a 1904 workbook reads the
// same (the 1904 system counts from 1904-01-01: ECMA-376 Part 1,
// 18.17.4.1, `from memory`).
func TestWorkbookDateSystems(t *testing.T) {
	when := time.Date(2025, 3, 13, 9, 30, 0, 0, time.UTC)
	for _, d1904 := range []bool{false, true} {
		cells := rowsToCells(t, 1, [][]any{{"Sample", "Date", "Ca (mg/L)"}, {"A", when, 40}})
		raw := workbook(t, []string{"Lab"}, map[string]map[string]any{"Lab": cells}, nil, d1904)
		b, err := ReadExcel(bytes.NewReader(raw), "lab.xlsx", Options{})
		if err != nil {
			t.Fatal(err)
		}
		if got := b.Rows[0].Sample.SampledAt; !got.Equal(when) {
			t.Errorf("1904 system %v: %v, want %v (raw %q)", d1904, got, when, b.Rows[0].Sample.SampledAtRaw)
		}
	}
}

// One well on two dates is two sampling events of one well, not a
// duplicate; the same well twice on one date is.
func TestEventsFromDates(t *testing.T) {
	in := "Well,Date,Ca (mg/L)\nMW-1,2025-03-13,40\nMW-1,2025-09-02,42\nMW-2,2025-03-13,10\nMW-2,2025-03-13,11\n"
	b := mustRead(t, in, Options{})
	for i, want := range []Status{StatusOK, StatusOK, StatusWarning, StatusWarning} {
		r := b.Rows[i]
		if r.Status != want || r.Sample.ID != r.Sample.WellID {
			t.Errorf("line %d: %s (id %q well %q) %v, want %s", r.Line, r.Status, r.Sample.ID, r.Sample.WellID, r.Issues, want)
		}
	}
	if e := b.Rows[1].Sample.Event; e != "2025-09-02" {
		t.Errorf("event %q", e)
	}
	if !hasCode(b.Rows[2], CodeDuplicateID, "same event") {
		t.Errorf("MW-2: %v", b.Rows[2].Issues)
	}
}
