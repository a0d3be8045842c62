package findings

import (
	"bytes"
	"math"
	"slices"
	"strings"
	"testing"

	"gwsat.dev/gwsat/figure"
	"gwsat.dev/gwsat/hydro"
	"gwsat.dev/gwsat/uncertainty"
)

// The demo's end-members have the water types its design states
// (data/demo/README.md, "The scenario"): the injectate is "Ca-HCO3 water",
// the native water above 80-90 m "Na-Cl-SO4 water", below it "Na-Cl water".
// NATIVE-R1 (67-73 m) is the exception by the 50 % rule: from its reported
// values in the README's end-member table, Cl 1240 mg/L = 34.98 meq/L, SO4
// 1390 mg/L = 28.94 meq/L and alkalinity 145 mg/L as CaCO3 = 2.90 meq/L, so
// Cl is 52 % of the anions and is named alone: "Na-Cl". NATIVE-S-R1 (Cl
// 1210, SO4 1520 mg/L: Cl 49.7 %) stays "Na-Cl-SO4".
func TestDemoWaterTypes(t *testing.T) {
	_, recs := demoRecords(t)
	want := map[string]string{"INJ-R1": "Ca-HCO3", "INJ-R3": "Ca-HCO3", "NATIVE-R1": "Na-Cl", "NATIVE-S-R1": "Na-Cl-SO4", "NATIVE-D-R1": "Na-Cl"}
	seen := 0
	for i := range recs {
		w, ok := want[recs[i].Sample().ID]
		if !ok {
			continue
		}
		seen++
		f, err := WaterType(&recs[i])
		if err != nil || f.Type != w {
			t.Errorf("%s: type %q (%v), want %q", recs[i].Sample().ID, f.Type, err, w)
		}
	}
	if seen != len(want) {
		t.Fatalf("found %d of %d end-members", seen, len(want))
	}
}

// Ions converts as reported: 40.078 mg/L of Ca2+ is 2 meq/L, 61.016 mg/L of
// HCO3- 1 meq/L, 100.087 mg/L alkalinity as CaCO3 2 meq/L (IUPAC 2013 atomic
// weights); a water without anions cannot be classified.
func TestIons(t *testing.T) {
	_, recs := assessText(t, "Sample,pH,Ca,Cl,HCO3\nhco3,7,40.078,35.453,61.016\nnoanion,7,40.078,,\n")
	_, alk := assessText(t, "Sample,pH,Ca,Cl,Alkalinity as CaCO3\nalk,7,40.078,35.453,100.087\n")
	tests := []struct {
		name         string
		got          func() (float64, float64, float64, bool)
		ca, hco3, cl float64
	}{
		{"hco3", func() (float64, float64, float64, bool) { in, ok := Ions(&recs[0]); return in.Ca, in.HCO3, in.Cl, ok }, 2, 1, 1},
		{"alkalinity", func() (float64, float64, float64, bool) { in, ok := Ions(&alk[0]); return in.Ca, in.HCO3, in.Cl, ok }, 2, 2, 1},
	}
	for _, tc := range tests {
		ca, hco3, cl, ok := tc.got()
		if !ok || math.Abs(ca-tc.ca) > 1e-3 || math.Abs(hco3-tc.hco3) > 1e-3 || math.Abs(cl-tc.cl) > 1e-3 {
			t.Errorf("%s: Ca %g HCO3 %g Cl %g (%v); want %g %g %g", tc.name, ca, hco3, cl, ok, tc.ca, tc.hco3, tc.cl)
		}
	}
	if _, err := WaterType(&recs[1]); err == nil {
		t.Error("a water without anions was classified")
	}
}

// One Stiff panel per well with a classifiable water, from its latest
// event; the page draws.
func TestStiffFigures(t *testing.T) {
	_, recs := demoRecords(t)
	figs := StiffFigures(recs)
	if len(figs) == 0 {
		t.Fatal("no Stiff figure")
	}
	var wells []string
	for i := range recs {
		if _, ok := Ions(&recs[i]); ok && recs[i].Status != hydro.StatusRejected && !slices.Contains(wells, WellOf(recs[i].Sample())) {
			wells = append(wells, WellOf(recs[i].Sample()))
		}
	}
	var panels []figure.StiffWater
	for _, f := range figs {
		panels = append(panels, f.Figure.(figure.StiffGrid).Waters...)
	}
	if len(panels) != len(wells) {
		t.Fatalf("%d panels for %d wells", len(panels), len(wells))
	}
	for _, p := range panels {
		if p.Well != "A1-S" {
			continue
		}
		for i := range recs {
			if recs[i].Sample().ID == "A1-S-R3" { // the latest event of A1-S
				in, _ := Ions(&recs[i])
				if p.Ca != in.Ca || p.SO4 != in.SO4 {
					t.Errorf("A1-S panel Ca %g SO4 %g, latest sample %g %g", p.Ca, p.SO4, in.Ca, in.SO4)
				}
			}
		}
	}
	png, err := figure.Render(figs[0].Figure, "png", figs[0].W, figs[0].H)
	if err != nil || !bytes.HasPrefix(png, []byte("\x89PNG")) {
		t.Errorf("render: %v", err)
	}
}

// One SI-against-time page per mineral, one panel per well with at least
// two events (the demo's wells have three rounds each; the end-member
// wells BG-S, BG-I and BG-D have one), the time axis in years (every demo
// sample is dated), and the page draws.
func TestSITimeFigures(t *testing.T) {
	db, recs := demoRecords(t)
	samples, err := uncertainty.Run(t.Context(), db, recs, uncertainty.Options{Linear: true})
	if err != nil {
		t.Fatal(err)
	}
	figs := SITimeFigures(recs, samples, Trends(recs, db.MineralNames(), 0), []string{"baryte"}, uncertainty.DefaultBand)
	// 30 monitoring wells and IW-1 (the injectate, sampled every round):
	// 31 panels, over two pages of at most SITimePerPage.
	if len(figs) != 2 {
		t.Fatalf("%d pages for one mineral and 31 wells", len(figs))
	}
	var panels []figure.SITimeSeries
	for _, f := range figs {
		panels = append(panels, f.Figure.(figure.SITime).Series...)
	}
	for _, s := range panels {
		if strings.HasPrefix(s.Well, "BG-") {
			t.Errorf("panel for %s, sampled once", s.Well)
		}
		if s.Time[0] < 2025 || s.Time[0] > 2027 {
			t.Errorf("%s: time %v, want decimal years", s.Well, s.Time[0])
		}
	}
	if len(panels) != 31 {
		t.Errorf("%d panels, want 31", len(panels))
	}
	g := figs[0].Figure.(figure.SITime)
	if _, err := figure.Render(g, "png", figs[0].W, figs[0].H); err != nil {
		t.Errorf("render: %v", err)
	}
}
