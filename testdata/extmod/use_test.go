// Package gwsatuser is a program outside the gwsat module that imports its
// library packages, to show that the module path and the API work from outside.
package gwsatuser

import (
	"context"
	"math"
	"strings"
	"testing"

	"gwsat.dev/gwsat/assess"
	"gwsat.dev/gwsat/hydro"
	"gwsat.dev/gwsat/speciation"
)

// A water saturated with calcite at 25 C: read as a lab CSV, assessed, speciated.
// The check is a property, not a number of ours: the saturation index of a
// mineral equals log IAP - log K(T) by definition, and the result must carry SIs
// for calcite and gypsum, in IUPAC component names.
func TestReadSpeciateSaturationIndices(t *testing.T) {
	lab := "Sample ID,pH,Temp (C),Ca (mg/L),Mg (mg/L),Na (mg/L),K (mg/L),Cl (mg/L),SO4 (mg/L),Alkalinity (mg/L as CaCO3)\n" +
		"EXT-1,7.4,15,60,12,20,2,30,40,180\n"
	b, err := hydro.Read(strings.NewReader(lab), "lab.csv", hydro.Options{})
	if err != nil {
		t.Fatal(err)
	}
	db, err := speciation.Default()
	if err != nil {
		t.Fatal(err)
	}
	recs, err := assess.Run(context.Background(), db, []*hydro.Batch{b}, assess.Options{})
	if err != nil {
		t.Fatal(err)
	}
	if len(recs) != 1 || recs[0].Result == nil {
		t.Fatalf("no result: %+v", recs)
	}
	res := recs[0].Result
	for _, name := range []string{"calcite", "Gypsum", "barite"} {
		m := res.Mineral(name)
		if name == "barite" {
			if m != nil {
				t.Errorf("baryte without Ba in the water: %+v", m)
			}
			continue
		}
		if m == nil {
			t.Fatalf("no SI for %s", name)
		}
		if math.Abs(m.SI-(m.LogIAP-m.LogK)) > 1e-12 {
			t.Errorf("%s: SI %g is not log IAP - log K = %g", name, m.SI, m.LogIAP-m.LogK)
		}
	}
	if _, ok := res.Total("Ca2+"); !ok {
		t.Error("no Ca2+ total")
	}
}
