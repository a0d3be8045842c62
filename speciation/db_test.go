package speciation

import (
	"errors"
	"strings"
	"testing"
)

// tinyHeader is a minimal valid set of components for parser tests.
const tinyHeader = `
[component H2O]
charge = 0
[component H+]
charge = 1
ion_size = 9
[component Ca2+]
charge = 2
ion_size = 6
[component Cl-]
charge = -1
ion_size = 3
`

func TestParseRejects(t *testing.T) {
	tests := []struct {
		name      string
		text      string
		want      error
		wantLine  int
		wantEntry string
	}{
		{"unbalanced charge", tinyHeader + `
[species CaCl+]
reaction = Ca2+ + Cl-
charge = 2
log10_k_25c = 0.4
enthalpy = none
ion_size = 4
`, ErrChargeImbalance, 15, "species CaCl+"},
		{"unknown component", tinyHeader + `
[species CaBr+]
reaction = Ca2+ + Br-
charge = 1
log10_k_25c = 0.4
enthalpy = none
ion_size = 4
`, ErrUnknownComponent, 15, "species CaBr+"},
		{"missing logk", tinyHeader + `
[mineral Whatever]
reaction = Ca2+ + 2 Cl-
enthalpy = none
`, ErrMissingLogK, 14, "mineral Whatever"},
		{"duplicate entry", tinyHeader + `
[mineral Salt]
reaction = Ca2+ + 2 Cl-
log10_k_25c = 1
enthalpy = none
[mineral Salt]
reaction = Ca2+ + 2 Cl-
log10_k_25c = 2
enthalpy = none
`, ErrDuplicateEntry, 18, "mineral Salt"},
		{"duplicate component", tinyHeader + `
[component Ca2+]
charge = 2
ion_size = 6
`, ErrDuplicateEntry, 14, "component Ca2+"},
		{"no temperature function", tinyHeader + `
[mineral Salt]
reaction = Ca2+ + 2 Cl-
log10_k_25c = 1
`, ErrMissingTempFunc, 16, "mineral Salt"},
		{"analytic inconsistent with logk", tinyHeader + `
[mineral Salt]
reaction = Ca2+ + 2 Cl-
log10_k_25c = 1
temperature_fit = 2 0 0 0 0
`, ErrInconsistentLogK, 17, "mineral Salt"},
		{"unbalanced mineral", tinyHeader + `
[mineral Salt]
reaction = Ca2+ + Cl-
log10_k_25c = 1
enthalpy = none
`, ErrChargeImbalance, 15, "mineral Salt"},
		{"bad number", tinyHeader + `
[mineral Salt]
reaction = Ca2+ + 2 Cl-
log10_k_25c = one
enthalpy = none
`, ErrSyntax, 16, "mineral Salt"},
		{"heat capacity with a fit", tinyHeader + `
[species CaCl+]
reaction = Ca2+ + Cl-
charge = 1
log10_k_25c = 0.4
temperature_fit = 0.4 0 0 0 0
heat_capacity = fuoss 2
ion_size = 4
`, ErrSyntax, 19, "species CaCl+"},
		{"heat capacity without enthalpy", tinyHeader + `
[species CaCl+]
reaction = Ca2+ + Cl-
charge = 1
log10_k_25c = 0.4
enthalpy = none
heat_capacity = fuoss 2
ion_size = 4
`, ErrSyntax, 19, "species CaCl+"},
		{"heat capacity not fuoss", tinyHeader + `
[species CaCl+]
reaction = Ca2+ + Cl-
charge = 1
log10_k_25c = 0.4
enthalpy = 1 kcal
heat_capacity = 200 J
ion_size = 4
`, ErrSyntax, 19, "species CaCl+"},
		{"bad enthalpy unit", tinyHeader + `
[mineral Salt]
reaction = Ca2+ + 2 Cl-
log10_k_25c = 1
enthalpy = 3 kJoule
`, ErrSyntax, 17, "mineral Salt"},
		{"dangling operator", tinyHeader + `
[mineral Salt]
reaction = Ca2+ + 2 Cl- +
log10_k_25c = 1
enthalpy = none
`, ErrSyntax, 15, "mineral Salt"},
		{"line without =", tinyHeader + `
[mineral Salt]
reaction Ca2+ + 2 Cl-
`, ErrSyntax, 15, "mineral Salt"},
		{"unknown kind", tinyHeader + `
[solid Salt]
reaction = Ca2+ + 2 Cl-
log10_k_25c = 1
enthalpy = none
`, ErrUnknownEntryKind, 14, "solid Salt"},
		{"missing H+", `
[component H2O]
charge = 0
`, ErrMissingComponent, 1, ""},
		{"charged species without ion size", tinyHeader + `
[species CaCl+]
reaction = Ca2+ + Cl-
charge = 1
log10_k_25c = 0.4
enthalpy = none
`, ErrMissingField, 16, "species CaCl+"},
		{"repeated key", tinyHeader + `
[mineral Salt]
reaction = Ca2+ + 2 Cl-
log10_k_25c = 1
log10_k_25c = 2
`, ErrSyntax, 17, "mineral Salt"},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			_, err := ParseDatabase(tc.text)
			if !errors.Is(err, tc.want) {
				t.Fatalf("got %v, want %v", err, tc.want)
			}
			var de *DataError
			if !errors.As(err, &de) {
				t.Fatalf("error %T is not a *DataError", err)
			}
			if de.Line != tc.wantLine || de.Entry != tc.wantEntry {
				t.Errorf("error at line %d entry %q, want line %d entry %q (%v)", de.Line, de.Entry, tc.wantLine, tc.wantEntry, err)
			}
			if tc.wantEntry != "" && !strings.Contains(err.Error(), tc.wantEntry) {
				t.Errorf("message %q does not name the entry", err)
			}
		})
	}
}

// The embedded data set must carry the contract component names, the species and
// minerals the issue lists, a source and a confidence tag on every reaction, and
// molar mass and density on every mineral.
func TestDefaultDatabaseContents(t *testing.T) {
	db, err := Default()
	if err != nil {
		t.Fatal(err)
	}
	for _, c := range []string{"H+", "H2O", "Ca2+", "Mg2+", "Na+", "K+", "Sr2+", "Ba2+", "Fe2+", "Mn2+",
		"Cl-", "SO4 2-", "CO3 2-", "F-", "H4SiO4", "NO3-", "Br-"} {
		if db.ComponentIndex(c) < 0 {
			t.Errorf("component %s missing", c)
		}
	}
	for _, s := range []string{"OH-", "HCO3-", "CO2(aq)", "CO3 2-", "HSO4-", "CaHCO3+", "CaCO3(aq)", "CaSO4(aq)",
		"CaOH+", "CaF+", "MgHCO3+", "MgCO3(aq)", "MgSO4(aq)", "MgOH+", "MgF+", "NaCO3-", "NaHCO3(aq)", "NaSO4-",
		"KSO4-", "SrHCO3+", "SrCO3(aq)", "SrSO4(aq)", "BaHCO3+", "BaCO3(aq)", "BaSO4(aq)", "FeHCO3+", "FeCO3(aq)",
		"FeSO4(aq)", "FeOH+", "MnSO4(aq)", "HF(aq)", "H3SiO4-"} {
		if db.SpeciesIndex(s) < 0 {
			t.Errorf("species %s missing", s)
		}
	}
	tags := map[string]bool{"V": true, "V-calc": true, "M": true, "M+": true, "D": true}
	for _, s := range db.species {
		if s.Master >= 0 {
			continue
		}
		if s.Source == "" || !tags[s.Confidence] {
			t.Errorf("species %s: source %q, confidence %q", s.Name, s.Source, s.Confidence)
		}
		if s.Charge != 0 && s.IonSize <= 0 {
			t.Errorf("species %s has no ion size", s.Name)
		}
	}
	for _, m := range []string{"calcite", "aragonite", "dolomite", "magnesite", "siderite", "rhodochrosite",
		"strontianite", "witherite", "gypsum", "anhydrite", "celestine", "baryte", "fluorite", "halite",
		"amorphous silica", "chalcedony", "quartz", "CO2(g)"} {
		mn := db.Mineral(m)
		if mn == nil {
			t.Errorf("mineral %s missing", m)
			continue
		}
		if mn.Source == "" || !tags[mn.Confidence] {
			t.Errorf("mineral %s: source %q, confidence %q", m, mn.Source, mn.Confidence)
		}
		if !mn.Gas && (mn.MolarMass <= 0 || mn.Density <= 0 || mn.DensitySource == "" || mn.Formula == "") {
			t.Errorf("mineral %s lacks formula, molar mass or density: %+v", m, mn)
		}
	}
	// Calcite molar volume: 100.087 g/mol / 2.71 g/cm3 = 36.93 cm3/mol (CRC density, from memory).
	if v := db.Mineral("calcite").MolarVolume(); v < 36.8 || v > 37.1 {
		t.Errorf("calcite molar volume %.2f cm3/mol", v)
	}
}

// A reaction written with an earlier species expands to components and adds that
// species' log K: CaHCO3+ from Ca2+ + HCO3- equals Ca2+ + CO3 2- + H+ with
// log K = log K(CaHCO3+ pair) + log K(HCO3-) = 1.106 + 10.329 (Plummer & Busenberg 1982).
func TestReactionExpansion(t *testing.T) {
	db, err := Default()
	if err != nil {
		t.Fatal(err)
	}
	sp := &db.species[db.SpeciesIndex("CaHCO3+")]
	want := map[string]float64{"Ca2+": 1, "CO3 2-": 1, "H+": 1}
	if len(sp.Terms) != len(want) {
		t.Fatalf("terms %+v", sp.Terms)
	}
	for _, tm := range sp.Terms {
		if want[tm.Component] != tm.Nu {
			t.Errorf("term %+v", tm)
		}
	}
	if got := sp.LogK.At(T25); abs(got-(1.106+10.329)) > 0.003 {
		t.Errorf("log K %.4f, want 11.435", got)
	}
	// CO2(g) = CO3 2- + 2H+ - H2O: log K_H + log K1 + log K2 = -1.468 - 6.352 - 10.329 = -18.149.
	g := db.Mineral("CO2(g)")
	if got := g.LogK.At(T25); abs(got+18.149) > 0.003 {
		t.Errorf("CO2(g) log K %.4f, want -18.149", got)
	}
}

func abs(x float64) float64 {
	if x < 0 {
		return -x
	}
	return x
}
