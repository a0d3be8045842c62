package speciation

import (
	"errors"
	"strings"
	"testing"
)

// The notation follows IUPAC (charge as number then sign, e.g. Ca2+; IUPAC 2005
// Red Book IR-3.4, from memory); these cases check that every spelling a user may type
// maps to it, and that names without a charge are left alone.
func TestCanonicalName(t *testing.T) {
	for _, c := range []struct{ in, want string }{
		{"Ca2+", "Ca2+"},
		{"Ca+2", "Ca2+"},
		{"Ca^2+", "Ca2+"},
		{"Ca²⁺", "Ca2+"},
		{" Ca 2+ ", "Ca2+"},
		{"SO4 2-", "SO4 2-"},
		{"SO4-2", "SO4 2-"},
		{"SO4^2-", "SO4 2-"},
		{"SO₄²⁻", "SO4 2-"},
		{"CO3-2", "CO3 2-"},
		{"Na+", "Na+"},
		{"Na+1", "Na+"},
		{"Cl-", "Cl-"},
		{"HCO3-", "HCO3-"},
		{"Fe+3", "Fe3+"},
		{"H4SiO4", "H4SiO4"},
		{"CaSO4(aq)", "CaSO4(aq)"},
		{"CO2(g)", "CO2(g)"},
		{"H+", "H+"},
		{"", ""},
	} {
		if got := CanonicalName(c.in); got != c.want {
			t.Errorf("CanonicalName(%q) = %q, want %q", c.in, got, c.want)
		}
	}
}

func TestMineralKeyAndAliases(t *testing.T) {
	db, err := Default()
	if err != nil {
		t.Fatal(err)
	}
	for _, c := range []struct{ in, want string }{
		{"calcite", "calcite"},
		{"Calcite", "calcite"},
		{"CALCITE", "calcite"},
		{"Barite", "baryte"},
		{"baryte", "baryte"},
		{"Celestite", "celestine"},
		{"SiO2(am)", "amorphous silica"},
		{"amorphous_silica", "amorphous silica"},
		{"Amorphous-Silica", "amorphous silica"},
	} {
		m := db.Mineral(c.in)
		if m == nil || m.Name != c.want {
			t.Errorf("Mineral(%q) = %v, want %q", c.in, m, c.want)
		}
	}
	if db.Mineral("calcitee") != nil {
		t.Error("a misspelt mineral was found")
	}
}

// A caller that changes what it was given must not change the shared database.
func TestDatabaseReadOnly(t *testing.T) {
	db, err := Default()
	if err != nil {
		t.Fatal(err)
	}
	ms := db.Minerals()
	ms[0].Name = "changed"
	ms[0].Terms[0].Nu = 99
	m := db.Mineral(NameCalcite)
	m.Terms[0].Nu = 42
	again := db.Minerals()
	if again[0].Name == "changed" || again[0].Terms[0].Nu == 99 || db.Mineral(NameCalcite).Terms[0].Nu == 42 {
		t.Fatal("a copy handed out shares memory with the database")
	}
	sp := db.Species()
	sp[0].Terms[0].Nu = 7
	if db.Species()[0].Terms[0].Nu == 7 {
		t.Fatal("Species shares memory with the database")
	}
}

func TestParseMinerals(t *testing.T) {
	db, err := Default()
	if err != nil {
		t.Fatal(err)
	}
	got, err := db.ParseMinerals(" Calcite, barite,calcite,,CALCITE, amorphous_silica ")
	if err != nil {
		t.Fatal(err)
	}
	want := []string{"calcite", "baryte", "amorphous silica"}
	if len(got) != len(want) {
		t.Fatalf("got %q, want %q", got, want)
	}
	for i := range want {
		if got[i] != want[i] {
			t.Fatalf("got %q, want %q", got, want)
		}
	}
	for _, bad := range []string{"calcit", "CO2(g)", "unobtainium"} {
		_, err := db.ParseMinerals(bad)
		if !errors.Is(err, ErrUnknownMineral) {
			t.Errorf("%q: error %v", bad, err)
		}
	}
	if _, err := db.ParseMinerals("calcit"); err == nil || !strings.Contains(err.Error(), "did you mean calcite") {
		t.Errorf("no suggestion: %v", err)
	}
}
