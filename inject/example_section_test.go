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

// The native waters of the invented demo site, one per zone, shallowest
// first: the injection section blends each with the injectate and adjacent
// zones with each other.
func ExampleNativeWaters() {
	raw, _ := data.Demo().ReadFile("demo/samples.csv")
	b, _ := hydro.Read(bytes.NewReader(raw), "demo/samples.csv", hydro.Options{})
	db, _ := speciation.Default()
	recs, _ := assess.Run(context.Background(), db, []*hydro.Batch{b}, assess.Options{})
	fmt.Println(inject.NativeWaters(recs))
	// Output: [NATIVE-S-R1 NATIVE-R1 NATIVE-D-R1]
}
