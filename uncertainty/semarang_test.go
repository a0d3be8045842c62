package uncertainty

import (
	"context"
	"errors"
	"testing"

	"gwsat.dev/gwsat/assess"
	"gwsat.dev/gwsat/hydro"
	"gwsat.dev/gwsat/speciation"
)

// On real open data (testdata/semarang_data_smg.csv: 58 deep wells of
// Semarang, Irawan & Putranto 2016, doi:10.5281/zenodo.57104, CC0; lab pH,
// no temperatures, one pH of 11.6) every sample either has finite, ordered
// intervals for every mineral or says why it has none (ErrDraws,
// ErrNoResult): no NaN or infinity, no sample dropped. All but a couple of
// samples must get intervals: the file's waters are ordinary except the
// pH 11.6 one, whose alkalinity hardly fits its pH.
func TestSemarangIntervalsFiniteOrExplained(t *testing.T) {
	if testing.Short() {
		t.Skip("real data set, 58 samples x 200 draws")
	}
	b, err := hydro.ReadFile("../testdata/semarang_data_smg.csv", hydro.Options{EPSG: 32749})
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
	for _, linear := range []bool{false, true} {
		samples, err := Run(t.Context(), db, recs, Options{Draws: 200, Seed: 2, Linear: linear})
		if err != nil {
			t.Fatal(err)
		}
		if len(samples) != len(recs) {
			t.Fatalf("%d results for %d rows", len(samples), len(recs))
		}
		with := 0
		for i, s := range samples {
			if s.Err != nil {
				if !errors.Is(s.Err, ErrDraws) && !errors.Is(s.Err, ErrNoResult) || len(s.Intervals) != 0 {
					t.Errorf("%s: error %v with %d intervals", recs[i].Sample().ID, s.Err, len(s.Intervals))
				}
				continue
			}
			with++
			if len(s.Intervals) != len(recs[i].Result.Minerals) {
				t.Errorf("%s: %d intervals for %d minerals", recs[i].Sample().ID, len(s.Intervals), len(recs[i].Result.Minerals))
			}
			for _, iv := range s.Intervals {
				if !finiteAll(iv) || iv.Low > iv.High {
					t.Errorf("%s %s: %v..%v", recs[i].Sample().ID, iv.Mineral, iv.Low, iv.High)
				}
			}
		}
		if with < len(recs)-2 {
			t.Errorf("linear=%v: intervals for only %d of %d samples", linear, with, len(recs))
		}
	}
}
