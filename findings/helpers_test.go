package findings

import (
	"bytes"
	"context"
	"strings"
	"testing"

	"gwsat.dev/gwsat/assess"
	"gwsat.dev/gwsat/data"
	"gwsat.dev/gwsat/hydro"
	"gwsat.dev/gwsat/speciation"
	"gwsat.dev/gwsat/uncertainty"
)

// assessText reads and assesses an inline lab file (invented waters).
func assessText(t testing.TB, text string) (*speciation.Database, []assess.Record) {
	t.Helper()
	b, err := hydro.Read(strings.NewReader(text), "t.csv", hydro.Options{})
	if err != nil {
		t.Fatal(err)
	}
	return assessBatch(t, b)
}

func assessBatch(t testing.TB, b *hydro.Batch) (*speciation.Database, []assess.Record) {
	t.Helper()
	db, err := speciation.Default()
	if err != nil {
		t.Fatal(err)
	}
	recs, err := assess.Run(context.Background(), db, []*hydro.Batch{b}, assess.Options{})
	if err != nil {
		t.Fatal(err)
	}
	return db, recs
}

// demoRecords assesses the embedded demo (invented data).
func demoRecords(t testing.TB) (*speciation.Database, []assess.Record) {
	t.Helper()
	raw, err := data.Demo().ReadFile("demo/samples.csv")
	if err != nil {
		t.Fatal(err)
	}
	b, err := hydro.Read(bytes.NewReader(raw), "demo/samples.csv", hydro.Options{})
	if err != nil {
		t.Fatal(err)
	}
	return assessBatch(t, b)
}

// demoFindings runs the whole chain on the demo with the linear estimate
// (fast; the Monte Carlo estimate is tested in package uncertainty).
func demoFindings(t testing.TB) ([]assess.Record, *Findings) {
	t.Helper()
	db, recs := demoRecords(t)
	samples, err := uncertainty.Run(context.Background(), db, recs, uncertainty.Options{Linear: true})
	if err != nil {
		t.Fatal(err)
	}
	f, err := Build(recs, samples, Trends(recs, db.MineralNames(), 0), uncertainty.DefaultBand, Options{})
	if err != nil {
		t.Fatal(err)
	}
	return recs, f
}
