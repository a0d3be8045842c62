package findings

import (
	"slices"

	"gwsat.dev/gwsat/speciation"
)

// scaleMinerals are the common scale minerals of wells and injection
// systems (common practice): carbonate, sulfate and iron carbonate scales.
var scaleMinerals = []string{"calcite", "gypsum", "baryte", "celestine", "siderite"}

// oxideMinerals are the iron and manganese (hydr)oxides that form first, and
// clog wells, where oxygenated water meets reduced groundwater: ferrihydrite
// and birnessite-type MnO2 (Cornell & Schwertmann 2003; from memory). The
// more stable oxides (goethite, hematite, pyrolusite, manganite) form slowly;
// their SIs stay in the tables, and they are mapped only when supersaturated
// with confidence (see DefaultMinerals).
var oxideMinerals = []string{"ferrihydrite", "birnessite"}

// stableOxides are oxides that form too slowly at aquifer temperatures to
// deposit in a well's life (common practice); like the slow silica and
// carbonate phases, they are not mapped by default even when supersaturated.
var stableOxides = []string{"goethite", "hematite", "pyrolusite", "manganite", "lepidocrocite", "hausmannite", "pyrite"}

// DefaultMinerals returns the minerals to map and profile: the scale
// minerals and the first-forming oxides the database has, then every mineral
// supersaturated with confidence in f (f may be nil) that is not slow to form
// (quartz, dolomite, magnesite, the stable oxides), without repeats, as the
// database names them.
func DefaultMinerals(db *speciation.Database, f *Findings) []string {
	var out []string
	add := func(name string) {
		m := db.Mineral(name)
		if m == nil || m.Gas || slices.Contains(out, m.Name) {
			return
		}
		out = append(out, m.Name)
	}
	for _, n := range scaleMinerals {
		add(n)
	}
	for _, n := range oxideMinerals {
		add(n)
	}
	if f != nil {
		for _, n := range f.Supersaturated {
			if slices.Contains(slowMinerals, n) || slices.Contains(stableOxides, n) {
				continue // supersaturated but slow to form: named in the findings, not mapped
			}
			add(n)
		}
	}
	return out
}

// ScaleMinerals returns a copy of scaleMinerals (read-only package data).
func ScaleMinerals() []string { return append([]string(nil), scaleMinerals...) }

// OxideMinerals returns a copy of oxideMinerals (read-only package data).
func OxideMinerals() []string { return append([]string(nil), oxideMinerals...) }
