// Package demotest reads and assesses the embedded demo (invented data) for the
// tests of several packages, so that each does not repeat the same steps.
package demotest

import (
	"bytes"
	"context"
	"testing"

	"gwsat.dev/gwsat/assess"
	"gwsat.dev/gwsat/data"
	"gwsat.dev/gwsat/hydro"
	"gwsat.dev/gwsat/speciation"
)

// Batch reads demo/samples.csv (without its field sheet).
func Batch(t testing.TB) *hydro.Batch {
	t.Helper()
	raw, err := data.Demo().ReadFile("demo/samples.csv")
	if err != nil {
		t.Fatal(err)
	}
	b, err := hydro.Read(bytes.NewReader(raw), "demo/samples.csv", hydro.Options{})
	if err != nil {
		t.Fatal(err)
	}
	return b
}

// Records assesses the demo with the default options.
func Records(t testing.TB) (*speciation.Database, []assess.Record) {
	t.Helper()
	db, err := speciation.Default()
	if err != nil {
		t.Fatal(err)
	}
	recs, err := assess.Run(context.Background(), db, []*hydro.Batch{Batch(t)}, assess.Options{})
	if err != nil {
		t.Fatal(err)
	}
	return db, recs
}
