package main

import (
	"fmt"
	"regexp"
	"strings"
)

// reUnitSuffix splits a column name such as "Ca (mg/L)" into its name and
// its unit.
var reUnitSuffix = regexp.MustCompile(`^(.*) \(([^()]*)\)$`)

// splitUnit returns the bare column name and its unit ("" when none).
func splitUnit(col string) (name, unit string) {
	if m := reUnitSuffix.FindStringSubmatch(col); m != nil {
		return m[1], m[2]
	}
	return col, ""
}

// fieldRound is the sampling round whose field sheet is written out.
const fieldRound = 3

// dryWell is a well of the field sheet that was visited but gave no lab
// sample (invented, like everything here): its row matches no lab row.
const dryWell = "MW-DRY"

// fieldBytes renders the field sheet of one round, plus the injectate's
// readings at every round: well id, date, field pH and temperature as in
// samples.csv, and dissolved oxygen and ORP, invented from the injectate
// fraction (oxygenated injectate, reducing native water: DO 0.2-8.0 mg/L, ORP
// -150 to +250 mV, linear in the fraction; common practice for the contrast,
// not a model).
func (g *generated) fieldBytes() []byte {
	var b strings.Builder
	b.WriteString("Well,Date,Time,Field pH,Water temperature (C),DO (mg/L),ORP (mV),Field notes\n")
	for _, s := range g.Samples {
		if !(s.Round == fieldRound && s.Type == "monitoring" || s.Type == "injectate") {
			continue
		}
		do := 0.2 + 7.8*s.InjFrac
		orp := -150 + 400*s.InjFrac
		fmt.Fprintf(&b, "%s,%s,%s,%s,%s,%.1f,%.0f,\n", s.Well, s.At.Format("02.01.2006"), s.At.Format("15:04"),
			s.Cells["pH field"], s.Cells["Temp (C)"], do, orp)
	}
	fmt.Fprintf(&b, "%s,%s,09:00,,,,,dry: no sample taken\n", dryWell, g.Samples[len(g.Samples)-1].At.Format("02.01.2006"))
	return []byte(b.String())
}
