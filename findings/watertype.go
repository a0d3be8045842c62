package findings

import (
	"fmt"
	"sort"

	"gonum.org/v1/plot/vg"

	"gwsat.dev/gwsat/assess"
	"gwsat.dev/gwsat/facies"
	"gwsat.dev/gwsat/figure"
	"gwsat.dev/gwsat/hydro"
	"gwsat.dev/gwsat/report"
)

// Ions returns the major ions of a record in meq/L from the analyses as
// reported (hydro's conversion): Ca, Mg, Na, K, Cl, SO4, and the alkalinity
// as HCO3 (all carbonate alkalinity counted there) when it was reported,
// else HCO3 and CO3 as reported. ok is false when no cation or no anion
// was reported.
func Ions(r *assess.Record) (in facies.Ions, ok bool) {
	s := r.Sample()
	sol := solutionOf(r)
	meq := func(key string) float64 {
		m, found := s.Analytes[key]
		if !found {
			return 0
		}
		v, err := m.MeqL(sol)
		if err != nil || !(v >= 0) {
			return 0
		}
		return v
	}
	in = facies.Ions{Ca: meq("Ca"), Mg: meq("Mg"), Na: meq("Na"), K: meq("K"), Cl: meq("Cl"), SO4: meq("SO4")}
	if _, hasAlk := s.Analytes["Alk"]; hasAlk {
		in.HCO3 = meq("Alk")
	} else {
		in.HCO3, in.CO3 = meq("HCO3"), meq("CO3")
	}
	cat := in.Ca + in.Mg + in.Na + in.K
	an := in.HCO3 + in.CO3 + in.SO4 + in.Cl
	return in, cat > 0 && an > 0
}

// WaterType classifies a record's water (facies.Classify on Ions); the
// error says why it cannot be classified.
func WaterType(r *assess.Record) (facies.Facies, error) {
	if r.Status == hydro.StatusRejected {
		return facies.Facies{}, fmt.Errorf("%w: row rejected", facies.ErrInput)
	}
	in, ok := Ions(r)
	if !ok {
		return facies.Facies{}, fmt.Errorf("%w: no cation or no anion reported", facies.ErrInput)
	}
	f, err := facies.Classify(in)
	if err != nil {
		return f, fmt.Errorf("classifying %s: %w", r.Sample().ID, err)
	}
	return f, nil
}

// StiffPage size: landscape A4 in points (common page size).
const (
	StiffPageW = 842 * vg.Inch / 72
	StiffPageH = 595 * vg.Inch / 72
)

// StiffFigures builds Stiff diagrams of the latest event of every well (one
// panel per well, rejected rows left out) as report figures, split evenly
// over pages of at most figure.StiffPerPage panels, on one scale. Wells come in order of
// first appearance. It returns nil when no well has a classifiable water.
func StiffFigures(recs []assess.Record) []report.Fig {
	usable := func(r *assess.Record) bool {
		_, ok := Ions(r)
		return ok && r.Status != hydro.StatusRejected
	}
	var waters []figure.StiffWater
	for _, ws := range seriesByWell(recs, usable) {
		latest := ws.events[len(ws.events)-1]
		in, _ := Ions(&recs[latest.rec])
		waters = append(waters, figure.StiffWater{Well: ws.well, Na: in.Na, K: in.K, Ca: in.Ca, Mg: in.Mg, Cl: in.Cl, HCO3: in.HCO3, CO3: in.CO3, SO4: in.SO4})
	}
	if len(waters) == 0 {
		return nil
	}
	g := figure.StiffGrid{
		Title:   "Water types: Stiff diagrams, latest sample of each well",
		Caption: "Major ions as reported; the alkalinity is drawn as HCO3 + CO3.",
		Waters:  waters,
	}
	// balanced pages: 34 wells make two pages of 17, not 30 and 4
	n := (len(waters) + figure.StiffPerPage - 1) / figure.StiffPerPage
	pages := g.Pages((len(waters) + n - 1) / n)
	figs := make([]report.Fig, len(pages))
	for i, p := range pages {
		stem := "stiff"
		if len(pages) > 1 {
			stem = fmt.Sprintf("stiff_%d", i+1)
		}
		figs[i] = report.Fig{Stem: stem, Title: p.Title, Caption: p.Caption, Figure: p, W: StiffPageW, H: StiffPageH}
	}
	return figs
}

// TypeCount is how many samples have one water type.
type TypeCount struct {
	Type    string
	Samples int
}

// WaterTypes counts the water types of the records, most frequent first
// (ties by name); records that cannot be classified are left out.
func WaterTypes(recs []assess.Record) []TypeCount {
	n := map[string]int{}
	for i := range recs {
		if f, err := WaterType(&recs[i]); err == nil {
			n[f.Type]++
		}
	}
	out := make([]TypeCount, 0, len(n))
	for t, c := range n {
		out = append(out, TypeCount{t, c})
	}
	sort.Slice(out, func(i, j int) bool {
		return out[i].Samples > out[j].Samples || out[i].Samples == out[j].Samples && out[i].Type < out[j].Type
	})
	return out
}
