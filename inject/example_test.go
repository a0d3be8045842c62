package inject_test

import (
	"bytes"
	"context"
	"fmt"

	"gwsat.dev/gwsat/assess"
	"gwsat.dev/gwsat/data"
	"gwsat.dev/gwsat/hydro"
	"gwsat.dev/gwsat/inject"
	"gwsat.dev/gwsat/speciation"
)

// Blend the demo's injectate with its native water at the aquifer temperature
// and print where baryte peaks (invented demo data).
func ExamplePlanner_Blend() {
	raw, _ := data.Demo().ReadFile("demo/samples.csv")
	b, err := hydro.Read(bytes.NewReader(raw), "demo/samples.csv", hydro.Options{})
	if err != nil {
		fmt.Println(err)
		return
	}
	db, _ := speciation.Default()
	recs, _ := assess.Run(context.Background(), db, []*hydro.Batch{b}, assess.Options{})
	p := inject.NewPlanner(db, speciation.TruesdellJones{}, recs)
	r, err := p.Blend(inject.BlendOptions{Native: "NATIVE-R1", Injectate: "INJ-R2", TempC: 23, FixedTemp: true})
	if err != nil {
		fmt.Println(err)
		return
	}
	for _, m := range r.Sweep.Maxima() {
		if m.Mineral == "baryte" {
			fmt.Printf("baryte peaks at SI %.1f, injectate share %.2f: %s\n", m.SI, m.Fraction, assess.State(m.SI))
		}
	}
	// Output: baryte peaks at SI 0.1, injectate share 0.60: near equilibrium
}
