package inject

import (
	"math"
	"slices"
	"strconv"
	"strings"
	"testing"

	"gwsat.dev/gwsat/assess"
	"gwsat.dev/gwsat/figure"
	"gwsat.dev/gwsat/internal/demotest"
	"gwsat.dev/gwsat/speciation"
)

// The demo's native waters (data/demo/README.md: NATIVE-S-R1 at 37-43 m,
// NATIVE-R1 at 67-73 m, NATIVE-D-R1 at 125-131 m) are found by their sample
// type, shallowest first.
func TestNativeWatersByDepth(t *testing.T) {
	got := NativeWaters(demoPlanner(t).recs)
	if want := []string{"NATIVE-S-R1", "NATIVE-R1", "NATIVE-D-R1"}; !slices.Equal(got, want) {
		t.Errorf("NativeWaters = %v, want %v", got, want)
	}
}

// The section evaluates every zone and the cross-flow between adjacent zones.
// The demo's README says cross-flow carries sulfate-rich water down into the
// barium-bearing zone: the deep with the intermediate water must be the worst
// cross-flow blend, with baryte supersaturated beyond the near-equilibrium
// band there. The figures and the text name the same worst blends.
func TestSectionTellsTheDemoStory(t *testing.T) {
	p := demoPlanner(t)
	sec, figs, err := p.Section(SectionOptions{Injectate: "INJ-R2", Native: "NATIVE-R1", AquiferTempC: math.NaN(), Well: DefaultWell(), Minerals: []string{"calcite", "baryte"}})
	if err != nil {
		t.Fatal(err)
	}
	text := strings.Join(sec.Paragraphs, " ")
	for _, id := range []string{"NATIVE-S-R1", "NATIVE-R1", "NATIVE-D-R1"} {
		if !strings.Contains(sec.Title, id) {
			t.Errorf("title %q lacks %s", sec.Title, id)
		}
	}
	if !strings.Contains(text, "the worst is NATIVE-D-R1 with NATIVE-R1") || !strings.Contains(text, "baryte is the most supersaturated") {
		t.Errorf("cross-flow worst case not stated: %s", text)
	}
	rows := sec.Tables[0].Rows
	if len(rows) != 5 {
		t.Fatalf("%d blends, want 3 zones with the injectate and 2 cross-flows", len(rows))
	}
	last := rows[4]
	if !strings.Contains(last[0].Text, "cross-flow: NATIVE-D-R1") || last[2].Text != "baryte" || last[3].Class != "si-sup" {
		t.Errorf("deep with intermediate row = %+v", last)
	}
	var stems []string
	for _, f := range figs {
		stems = append(stems, f.Stem)
	}
	if !slices.Contains(stems, "blend_si_crossflow") || len(sec.Figures) != len(figs) {
		t.Errorf("figures %v", stems)
	}
	for _, f := range figs {
		if f.Stem != "blend_si_crossflow" {
			continue
		}
		if !strings.Contains(f.Title, "NATIVE-R1") {
			t.Errorf("cross-flow figure %q does not name the waters of the text", f.Title)
		}
		cv, ok := f.Figure.(figure.Curves)
		if !ok {
			t.Fatalf("cross-flow figure is a %T", f.Figure)
		}
		var drawn []string
		for _, s := range cv.Series {
			drawn = append(drawn, s.Name)
		}
		if !slices.Contains(drawn, "baryte") {
			t.Errorf("cross-flow figure draws %v, not baryte", drawn)
		}
	}
}

// A file that repeats its native wells (18 native rows in the demo's three
// background wells) gets one blend per well, not per row, and the section
// says how many rows were left out; the id lookups stay unique per row.
func TestSectionManyNativeRows(t *testing.T) {
	db, recs := demotest.Records(t)
	var more []assess.Record
	for _, r := range recs {
		if !strings.EqualFold(r.Sample().Type(), "native") {
			continue
		}
		for k := 1; k <= 5; k++ {
			c := r
			c.Row.Sample.ID = r.Sample().ID + "-copy" + strconv.Itoa(k)
			more = append(more, c)
		}
	}
	all := append(append([]assess.Record(nil), recs...), more...)
	if n := len(NativeWaters(all)); n != 18 {
		t.Fatalf("%d native rows, want 18", n)
	}
	p := NewPlanner(db, speciation.TruesdellJones{}, all)
	kept, dropped := p.fewNatives(NativeWaters(all))
	if want := []string{"NATIVE-S-R1", "NATIVE-R1", "NATIVE-D-R1"}; !slices.Equal(kept, want) || dropped != 15 {
		t.Fatalf("fewNatives = %v, %d left out; want %v, 15", kept, dropped, want)
	}
	sec, _, err := p.Section(SectionOptions{Injectate: "INJ-R2", AquiferTempC: math.NaN(), Well: DefaultWell()})
	if err != nil {
		t.Fatal(err)
	}
	if rows := sec.Tables[0].Rows; len(rows) != 5 {
		t.Errorf("%d blends, want 3 native waters with the injectate and 2 cross-flows", len(rows))
	}
	if text := strings.Join(sec.Paragraphs, " "); !strings.Contains(text, "18 rows of native water") || !strings.Contains(text, "15 rows left out") {
		t.Errorf("the section does not say what was left out: %s", text)
	}
}
