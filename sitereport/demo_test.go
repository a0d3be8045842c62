package sitereport

import (
	"bytes"
	"context"
	"testing"

	"gwsat.dev/gwsat/assess"
	"gwsat.dev/gwsat/data"
	"gwsat.dev/gwsat/geo"
	"gwsat.dev/gwsat/hydro"
	"gwsat.dev/gwsat/speciation"
)

// demoOptions reads and assesses the embedded demo site the way the report
// command does with --demo, and returns the options of its report folder.
func demoOptions(tb testing.TB, dir string) Options {
	tb.Helper()
	raw, err := data.Demo().ReadFile("demo/samples.csv")
	if err != nil {
		tb.Fatal(err)
	}
	b, err := hydro.Read(bytes.NewReader(raw), "demo/samples.csv", hydro.Options{})
	if err != nil {
		tb.Fatal(err)
	}
	db, err := speciation.Default()
	if err != nil {
		tb.Fatal(err)
	}
	model := speciation.TruesdellJones{}
	batches := []*hydro.Batch{b}
	recs, err := assess.Run(context.Background(), db, batches, assess.Options{Model: model, Detail: true})
	if err != nil {
		tb.Fatal(err)
	}
	site, err := data.Demo().ReadFile("demo/site.geojson")
	if err != nil {
		tb.Fatal(err)
	}
	feats, err := geo.ReadSiteFeatures(bytes.NewReader(site))
	if err != nil {
		tb.Fatal(err)
	}
	opt := Options{Dir: dir, Batches: batches, Records: recs, DB: db, Model: model, Formats: []string{"png", "svg", "pdf"}}
	opt.Site.Features = feats
	opt.Site.Method = "kriging"
	opt.Inject.Injectate = "INJ-R2"
	opt.Inject.Native = "NATIVE-R1"
	return opt
}
