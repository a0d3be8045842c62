package findings_test

import (
	"context"
	"fmt"
	"strings"

	"gwsat.dev/gwsat/assess"
	"gwsat.dev/gwsat/findings"
	"gwsat.dev/gwsat/hydro"
	"gwsat.dev/gwsat/speciation"
	"gwsat.dev/gwsat/uncertainty"
)

// Two invented wells of one cluster: a fresh one, and a deep one where
// sulfate-rich water meets barium.
func Example() {
	lab := "Sample ID,Well ID,Cluster,Round,Screen top (m),Screen bottom (m),Temp,pH field,Ca,Mg,Na,K,Cl,SO4,Alkalinity as CaCO3,Ba (ug/L)\n" +
		"S-1,S,A,1,37,43,18,7.2,60,12,20,2,30,40,180,20\n" +
		"D-1,D,A,1,105,111,22,7.0,250,95,700,30,1500,600,170,300\n"
	b, err := hydro.Read(strings.NewReader(lab), "lab.csv", hydro.Options{})
	if err != nil {
		panic(err)
	}
	db, err := speciation.Default()
	if err != nil {
		panic(err)
	}
	recs, err := assess.Run(context.Background(), db, []*hydro.Batch{b}, assess.Options{})
	if err != nil {
		panic(err)
	}
	samples, err := uncertainty.Run(context.Background(), db, recs, uncertainty.Options{Linear: true})
	if err != nil {
		panic(err)
	}
	trends := findings.Trends(recs, db.MineralNames(), 0)
	f, err := findings.Build(recs, samples, trends, uncertainty.DefaultBand, findings.Options{})
	if err != nil {
		panic(err)
	}
	fmt.Println(f.Supersaturated)
	fmt.Println(f.Lines()[1])
	fmt.Println(len(f.Table().Rows), "rows in findings.csv: one per mineral and group")
	// Output:
	// [baryte]
	// Baryte: supersaturated with confidence since round 1 in cluster A at 108 m depth (1 of 1 sample; median SI 1.12); highest SI 1.12 at D, round 1. SI trend: too few events for a trend test (at most 1 per well; 4 needed).
	// 18 rows in findings.csv: one per mineral and group
}
