package findings

import (
	"slices"

	"gwsat.dev/gwsat/speciation"
)

// ScaleMinerals are the common scale minerals of wells and injection
// systems (common practice): carbonate, sulfate and iron carbonate scales.
var ScaleMinerals = []string{"calcite", "gypsum", "baryte", "celestine", "siderite"}

// OxideMinerals are iron and manganese (hydr)oxides that clog wells where
// oxygenated water meets reduced groundwater (common practice); they are
// mapped when the database has them.
var OxideMinerals = []string{"ferrihydrite", "goethite", "lepidocrocite", "hematite", "birnessite", "pyrolusite", "manganite", "hausmannite"}

// DefaultMinerals returns the minerals to map and profile: the scale
// minerals and the oxides the database has, then every mineral
// supersaturated with confidence in f (f may be nil), without repeats, as
// the database names them.
func DefaultMinerals(db *speciation.Database, f *Findings) []string {
	var out []string
	add := func(name string) {
		m := db.Mineral(name)
		if m == nil || m.Gas || slices.Contains(out, m.Name) {
			return
		}
		out = append(out, m.Name)
	}
	for _, n := range ScaleMinerals {
		add(n)
	}
	for _, n := range OxideMinerals {
		add(n)
	}
	if f != nil {
		for _, n := range f.Supersaturated {
			add(n)
		}
	}
	return out
}
