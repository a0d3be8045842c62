package uncertainty

import (
	"context"
	"math"
	"strings"
	"testing"

	"gwsat.dev/gwsat/assess"
	"gwsat.dev/gwsat/hydro"
	"gwsat.dev/gwsat/speciation"
)

// assessCSV reads and assesses an inline lab file (invented waters).
func assessCSV(t testing.TB, csv string) (*speciation.Database, []assess.Record) {
	t.Helper()
	b, err := hydro.Read(strings.NewReader(csv), "t.csv", hydro.Options{})
	if err != nil {
		t.Fatal(err)
	}
	db, err := speciation.Default()
	if err != nil {
		t.Fatal(err)
	}
	recs, err := assess.Run(context.Background(), db, []*hydro.Batch{b}, assess.Options{Workers: 1})
	if err != nil {
		t.Fatal(err)
	}
	return db, recs
}

// carbonateWater is an invented Ca-HCO3 water at pH ph and 25 C: Ca 2
// mmol/kgw, Na 1, Cl 1 mmol/kgw, alkalinity 4 meq/kgw.
func carbonateWater(ph float64) speciation.Water {
	w := speciation.Water{TempC: 25, PH: ph}
	w.SetTotal("Ca2+", 2e-3)
	w.SetTotal("Na+", 1e-3)
	w.SetTotal("Cl-", 1e-3)
	w.SetAlkalinity(4e-3)
	return w
}

func finiteAll(iv Interval) bool {
	for _, v := range []float64{iv.Best, iv.Low, iv.High, iv.SD} {
		if math.IsNaN(v) || math.IsInf(v, 0) {
			return false
		}
	}
	return true
}

func newEstimator(t testing.TB, opt Options) *Estimator {
	t.Helper()
	db, err := speciation.Default()
	if err != nil {
		t.Fatal(err)
	}
	e, err := NewEstimator(db, opt)
	if err != nil {
		t.Fatal(err)
	}
	return e
}
