package uncertainty

import (
	"errors"
	"slices"
	"testing"
)

// The interval columns follow the SI column names of the sample table, and
// every mineral gets its three cells, empty where there is no interval.
func TestColumnsAndCells(t *testing.T) {
	cols := Columns([]string{"calcite", "amorphous silica"})
	want := []string{"calcite_si_low", "calcite_si_high", "calcite_verdict", "amorphous_silica_si_low", "amorphous_silica_si_high", "amorphous_silica_verdict"}
	if !slices.Equal(cols, want) {
		t.Errorf("Columns = %v, want %v", cols, want)
	}
	s := &Sample{Result: Result{Intervals: []Interval{{Mineral: "calcite", Low: -0.1234, High: 0.2, LowOpen: true, Verdict: Indeterminate}}}}
	cells := Cells(s, []string{"calcite", "baryte"})
	if !slices.Equal(cells, []string{"unbounded", "0.200", "indeterminate", "", "", ""}) {
		t.Errorf("Cells = %q", cells)
	}
	failed := &Sample{Err: errors.New("x")}
	if c := Cells(failed, []string{"calcite"}); !slices.Equal(c, []string{"", "", ""}) {
		t.Errorf("failed sample cells %q", c)
	}
}
