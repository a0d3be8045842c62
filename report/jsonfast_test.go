package report

import (
	"bytes"
	"context"
	"encoding/json"
	"math"
	"testing"

	"gwsat.dev/gwsat/assess"
	"gwsat.dev/gwsat/data"
	"gwsat.dev/gwsat/hydro"
	"gwsat.dev/gwsat/speciation"
)

// encoderJSON is a record as encoding/json writes it with the indentation of
// the samples JSON: the reference appendRecord must match byte for byte.
func encoderJSON(t *testing.T, r *assess.Record) []byte {
	t.Helper()
	var buf bytes.Buffer
	enc := json.NewEncoder(&buf)
	enc.SetIndent("  ", "  ")
	if err := enc.Encode(jsonRecordOf(r)); err != nil {
		t.Fatal(err)
	}
	return buf.Bytes()
}

// appendRecord writes what encoding/json writes, for every row of the demo
// (invented data) assessed with its full speciation, and for records made
// to hit the corners: text needing escapes (quotes, HTML characters,
// control characters, invalid UTF-8, U+2028), NaN and infinite numbers,
// missing and empty parts.
func TestAppendRecordMatchesEncoder(t *testing.T) {
	raw, err := data.Demo().ReadFile("demo/samples.csv")
	if err != nil {
		t.Fatal(err)
	}
	b, err := hydro.Read(bytes.NewReader(raw), "demo/samples.csv", hydro.Options{})
	if err != nil {
		t.Fatal(err)
	}
	db, err := speciation.Default()
	if err != nil {
		t.Fatal(err)
	}
	recs, err := assess.Run(context.Background(), db, []*hydro.Batch{b}, assess.Options{Detail: true})
	if err != nil {
		t.Fatal(err)
	}
	odd := "a\"b\\c<d>e&f\x00\x01\b\f\n\r\t\x1f\u2028\u2029\xff\xfeé😀 end"
	nan := math.NaN()
	res := &speciation.Result{Model: odd, TempC: nan, PH: math.Inf(1), IonicStrength: math.Copysign(0, -1), ChargeBalance: 1e-300,
		Minerals: []speciation.MineralSI{{Name: "Calcite", SI: 0.5}, {Name: odd, SI: math.Inf(-1)}},
		Warnings: []string{odd, ""}, HasLogPCO2: true, LogPCO2: -3.5e-7}
	extra := []assess.Record{
		{File: odd, Row: hydro.Row{Line: 7, Sample: hydro.Sample{ID: odd, WellID: odd, Round: "1", Event: odd,
			Analytes:     map[string]hydro.Measurement{"Ca": {Raw: odd, Column: odd, Qualifier: "<", DetectionLimit: 0.1, MgPerL: hydro.Some(nan)}},
			ExtraColumns: []hydro.ExtraColumn{{Header: odd, Value: odd}, {Header: "", Value: ""}}}},
			Issues: []hydro.Issue{{Severity: hydro.Warning, Code: "x", Column: odd, Line: 3, Message: odd}, {Message: ""}},
			Status: hydro.StatusWarning, Result: res, SolveError: odd,
			Water:   hydro.Water{Molal: map[string]float64{"Ca": 1e-3, "Zz": nan, "Aa": 0}, HasAlkalinity: true, AlkalinityEqKgw: 2e-3},
			Balance: hydro.Balance{CationsMeqL: 1, AnionsMeqL: nan, Status: "ok", Complete: true}},
		{},
		{Result: &speciation.Result{}},
	}
	all := append(recs, extra...)
	for i := range all {
		jr := jsonRecordOf(&all[i])
		got, want := appendRecord(nil, &jr, false), encoderJSON(t, &all[i])
		if !bytes.Equal(got, want) {
			t.Fatalf("record %d:\n got %s\nwant %s", i, got, want)
		}
		// The compact form is the indented one with its insignificant
		// whitespace removed, as encoding/json's Compact removes it.
		var c bytes.Buffer
		if err := json.Compact(&c, want); err != nil {
			t.Fatal(err)
		}
		if got := appendRecord(nil, &jr, true); !bytes.Equal(got, c.Bytes()) {
			t.Fatalf("record %d compact:\n got %s\nwant %s", i, got, c.Bytes())
		}
	}
	// Whole files: the compact writer's array holds the same JSON as the
	// indented one, with one record per line.
	var ind, cmp bytes.Buffer
	if err := WriteJSONParallel(&ind, recs, nil, 2, false); err != nil {
		t.Fatal(err)
	}
	if err := WriteJSONParallel(&cmp, recs, nil, 2, true); err != nil {
		t.Fatal(err)
	}
	var a, b2 bytes.Buffer
	if err := json.Compact(&a, ind.Bytes()); err != nil {
		t.Fatal(err)
	}
	if err := json.Compact(&b2, cmp.Bytes()); err != nil {
		t.Fatal(err)
	}
	if !bytes.Equal(a.Bytes(), b2.Bytes()) {
		t.Error("compact samples JSON holds other values than the indented one")
	}
	if lines := bytes.Count(cmp.Bytes(), []byte("\n")); lines != len(recs)+2 {
		t.Errorf("compact samples JSON has %d lines, want one per record plus the brackets (%d)", lines, len(recs)+2)
	}
	if cmp.Len() > ind.Len()*7/10 {
		t.Errorf("compact samples JSON is %d bytes, indented %d: less than 30 %% saved", cmp.Len(), ind.Len())
	}
	if len(recs) < 90 {
		t.Fatalf("%d demo records, want the demo's 96 rows", len(recs))
	}
}
