package report

import "testing"

func TestColumnName(t *testing.T) {
	for in, want := range map[string]string{"calcite": "calcite_si", "amorphous silica": "amorphous_silica_si", "CO2(g)": "co2_g_si"} {
		if got := ColumnName(in); got != want {
			t.Errorf("ColumnName(%q) = %q, want %q", in, got, want)
		}
	}
}
