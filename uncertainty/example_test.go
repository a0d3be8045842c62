package uncertainty_test

import (
	"fmt"

	"gwsat.dev/gwsat/speciation"
	"gwsat.dev/gwsat/uncertainty"
)

// An invented Ca-HCO3 water whose pH is known to +/-0.05: the interval of
// the calcite SI from the linear estimate and from 2000 seeded draws.
func Example() {
	db, err := speciation.Default()
	if err != nil {
		panic(err)
	}
	w := speciation.Water{TempC: 25, PH: 7.6}
	w.SetTotal("Ca2+", 2e-3)
	w.SetTotal("Na+", 1e-3)
	w.SetTotal("Cl-", 1e-3)
	w.SetAlkalinity(4e-3)
	c := uncertainty.Case{Water: w, Inputs: []uncertainty.Input{
		{Name: "pH", Kind: uncertainty.PH, Value: 7.6, SD: 0.05},
		{Name: "Ca", Kind: uncertainty.Total, Component: "Ca2+", Value: 2e-3, SD: 0.1e-3},
	}}
	e, err := uncertainty.NewEstimator(db, uncertainty.Options{Draws: 2000, Seed: 1})
	if err != nil {
		panic(err)
	}
	lin, err := e.Linear(&c)
	if err != nil {
		panic(err)
	}
	mc, err := e.MonteCarlo(&c, 0)
	if err != nil {
		panic(err)
	}
	for _, r := range []uncertainty.Result{lin, mc} {
		iv := r.Interval("calcite")
		fmt.Printf("%-11s calcite SI %.2f (%.2f to %.2f): %s\n", r.Method, iv.Best, iv.Low, iv.High, iv.Verdict)
	}
	// Output:
	// linear      calcite SI 0.44 (0.34 to 0.54): supersaturated
	// monte-carlo calcite SI 0.44 (0.34 to 0.54): supersaturated
}
