package hydro

import "testing"

// The analyte keys map to the speciation components of the design (Ca2+,
// SO4 2-, CO3 2- for total inorganic carbon, H4SiO4 for silica, charges
// number before sign); alkalinity and ions used only in the charge balance
// are not component totals.
func TestSpeciationComponent(t *testing.T) {
	tests := []struct {
		key, comp string
		ok        bool
	}{
		{"Ca", "Ca2+", true}, {"SO4", "SO4 2-", true}, {"TIC", "CO3 2-", true}, {"SiO2", "H4SiO4", true},
		{"Ba", "Ba2+", true}, {"Alk", "", false}, {"HCO3", "", false}, {"Fe3", "", false}, {"nonsense", "", false},
	}
	for _, tc := range tests {
		c, ok := SpeciationComponent(tc.key)
		if c != tc.comp || ok != tc.ok {
			t.Errorf("%s: %q %v, want %q %v", tc.key, c, ok, tc.comp, tc.ok)
		}
	}
}
