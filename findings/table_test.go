package findings

import (
	"bytes"
	"encoding/csv"
	"slices"
	"strings"
	"testing"

	"gwsat.dev/gwsat/speciation"
)

// findings.csv has one row per mineral and group, with every cell of the
// header, no NaN or Inf, and the sentence on the rows that have one; the
// text ends with the caution and names no mineral in two of its lists.
func TestFindingsTable(t *testing.T) {
	_, f := demoFindings(t)
	var buf bytes.Buffer
	if err := f.Table().WriteCSV(&buf); err != nil {
		t.Fatal(err)
	}
	rows, err := csv.NewReader(&buf).ReadAll()
	if err != nil {
		t.Fatal(err)
	}
	if !slices.Equal(rows[0], tableHeader) || len(rows) != len(f.Rows)+1 {
		t.Fatalf("header %v, %d rows for %d", rows[0], len(rows)-1, len(f.Rows))
	}
	seen := map[string]bool{}
	for _, r := range rows[1:] {
		k := r[0] + "|" + r[1] + "|" + r[2]
		if seen[k] {
			t.Errorf("two rows for %s", k)
		}
		seen[k] = true
		for _, c := range r {
			if strings.Contains(c, "NaN") || strings.Contains(c, "Inf") {
				t.Errorf("row %v has a non-finite cell", r)
			}
		}
		if (r[3] == StateSupersaturated) != (r[len(r)-1] != "") {
			t.Errorf("row %v: state and sentence disagree", r[:4])
		}
	}
	lines := f.Lines()
	if !strings.Contains(lines[len(lines)-1], "licensed professionals") {
		t.Errorf("last line %q is not the caution", lines[len(lines)-1])
	}
	for _, m := range f.Supersaturated {
		if slices.Contains(f.Undecided, m) || slices.Contains(f.Undersaturated, m) {
			t.Errorf("%s in two lists", m)
		}
	}
}

// The default minerals are the scale minerals the database has, the
// first-forming oxides, then the minerals supersaturated with confidence, each
// once, except those slow to form.
func TestDefaultMinerals(t *testing.T) {
	db, err := speciation.Default()
	if err != nil {
		t.Fatal(err)
	}
	got := DefaultMinerals(db, &Findings{Supersaturated: []string{"baryte", "quartz", "fluorite", "goethite"}})
	want := []string{"calcite", "gypsum", "baryte", "celestine", "siderite", "ferrihydrite", "birnessite", "fluorite"}
	if !slices.Equal(got, want) {
		t.Errorf("DefaultMinerals = %v, want %v", got, want)
	}
	if plain := DefaultMinerals(db, nil); len(plain) < len(scaleMinerals) {
		t.Errorf("without findings: %v", plain)
	}
}
