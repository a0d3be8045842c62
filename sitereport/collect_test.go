package sitereport

import (
	"bytes"
	"context"
	"math"
	"os"
	"path/filepath"
	"testing"
	"time"

	"gwsat.dev/gwsat/assess"
	"gwsat.dev/gwsat/hydro"
	"gwsat.dev/gwsat/inject"
	"gwsat.dev/gwsat/speciation"
)

// A report made from compact records (Collect, every record after the first
// compacted, the samples files from a second reading) is the report made
// from whole records: the same samples files, findings, trends, surfaces
// and figures, byte for byte, for the demo (invented data). Only the page's
// sample tables, which show whole records, may differ.
func TestCollectCompactSameReport(t *testing.T) {
	if testing.Short() {
		t.Skip("two demo reports")
	}
	when := func() time.Time { return time.Date(2025, 1, 2, 3, 4, 5, 0, time.UTC) }
	prep := func(dir string) Options {
		opt := demoOptions(t, dir)
		opt.Formats = []string{"png"}
		opt.Inject.AquiferTempC = math.NaN()
		opt.Inject.Well = inject.DefaultWell()
		opt.Now = when
		return opt
	}
	whole := filepath.Join(t.TempDir(), "whole")
	if _, err := Write(context.Background(), prep(whole)); err != nil {
		t.Fatal(err)
	}

	compact := filepath.Join(t.TempDir(), "compact")
	opt := prep(compact)
	ao := assess.Options{Model: opt.Model}
	coll, err := Collect(context.Background(), opt.DB, assess.BatchItems(opt.Batches), CollectOptions{
		Assess: ao, Model: opt.Model, Compact: true, CompactFrom: 1, Keep: []string{opt.Inject.Injectate, opt.Inject.Native}})
	if err != nil {
		t.Fatal(err)
	}
	if len(coll.Records) != len(opt.Records) || len(coll.Samples) != len(opt.Records) {
		t.Fatalf("collected %d records and %d intervals, want %d", len(coll.Records), len(coll.Samples), len(opt.Records))
	}
	small := 0
	for i := 1; i < len(coll.Records); i++ {
		if coll.Records[i].Water.Molal == nil && coll.Records[i].Result != nil {
			small++
		}
	}
	if small < len(coll.Records)/2 {
		t.Fatalf("only %d of %d records compacted", small, len(coll.Records))
	}
	opt.Records, opt.Samples = coll.Records, coll.Samples
	opt.Reassess = func(emit func(*assess.Record) error) error {
		d := ao
		d.Detail = true
		return assess.Stream(context.Background(), opt.DB, assess.BatchItems(opt.Batches), d, emit)
	}
	if _, err := Write(context.Background(), opt); err != nil {
		t.Fatal(err)
	}

	names := []string{"samples.csv", "samples.json", "samples.geojson", "findings.csv", "trends.csv", "surfaces.csv", "columns.csv"}
	figs, err := filepath.Glob(filepath.Join(whole, "figures", "*.png"))
	if err != nil || len(figs) < 10 {
		t.Fatalf("%d figures (%v)", len(figs), err)
	}
	for _, f := range figs {
		names = append(names, filepath.Join("figures", filepath.Base(f)))
	}
	for _, n := range names {
		a, errA := os.ReadFile(filepath.Join(whole, n))
		b, errB := os.ReadFile(filepath.Join(compact, n))
		if errA != nil || errB != nil {
			t.Fatalf("%s: %v, %v", n, errA, errB)
		}
		if !bytes.Equal(a, b) {
			t.Errorf("%s differs between whole and compact records", n)
		}
	}
}

// compact keeps of a record what the findings, maps and figures read: the
// sample type and cluster columns, the major ions and trend analytes, the
// SIs; it drops the other columns, analytes, molalities and totals.
func TestCompactKeeps(t *testing.T) {
	r := assess.Record{Row: hydro.Row{Sample: hydro.Sample{ID: "S1",
		Extra:        map[string]string{" sample TYPE ": "monitoring", "cluster": "A", "Notes": "long free text"},
		ExtraColumns: []hydro.ExtraColumn{{Header: "Notes", Value: "long free text"}},
		Analytes:     map[string]hydro.Measurement{"Ca": {Value: 60}, "Ba": {Value: 0.1}, "Li": {Value: 0.01}, "Alk": {Value: 180}}}},
		Water:  hydro.Water{Molal: map[string]float64{"Ca": 1e-3}, KgWaterPerL: 0.999},
		Result: &speciation.Result{Minerals: []speciation.MineralSI{{Name: "calcite", SI: 0.4}}, Totals: []speciation.ComponentTotal{{}}}}
	compact(&r, "Cluster")
	s := r.Sample()
	if len(s.Extra) != 2 || s.Type() != "monitoring" || s.Extra["cluster"] != "A" || s.ExtraColumns != nil {
		t.Errorf("columns kept: %v, %v", s.Extra, s.ExtraColumns)
	}
	if _, li := s.Analytes["Li"]; li || len(s.Analytes) != 3 || s.Analytes["Ba"].Value != 0.1 {
		t.Errorf("analytes kept: %v", s.Analytes)
	}
	if r.Water.Molal != nil || r.Water.KgWaterPerL != 0.999 {
		t.Errorf("water: %+v", r.Water)
	}
	if si, ok := r.Result.SI("calcite"); !ok || si != 0.4 || r.Result.Totals != nil {
		t.Errorf("result: SI %g %v, totals %v", si, ok, r.Result.Totals)
	}
}
