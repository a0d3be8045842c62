package report

import (
	"bytes"
	"context"
	"slices"
	"strings"
	"testing"

	"gwsat.dev/gwsat/assess"
	"gwsat.dev/gwsat/data"
	"gwsat.dev/gwsat/geo"
	"gwsat.dev/gwsat/hydro"
	"gwsat.dev/gwsat/speciation"
)

// ragged is an invented lab file whose rows carry different sets of
// analytes (blank cells), a redox row, a row without a position and an
// unrecognised column named like a property, so that a formatter's cached
// analyte order and its looked-up indices are exercised on changes.
const ragged = `Sample ID,Well ID,Latitude,Longitude,Temp,pH,Ca,Mg,Na,K,Cl,SO4,Alkalinity,Fe,DO,status
A,W1,30.9,-100.1,20,7.2,60,10,20,3,30,40,150,,,x
B,W1,30.9,-100.1,20,7.1,,10,20,3,30,,150,0.5,0.1,y
C,W2,,,21,7.0,55,9,,2,25,35,140,,,
D,W2,30.8,-100.2,22,7.3,60,10,20,3,30,40,150,,,
E,W3,30.8,-100.2,22,,60,10,20,3,30,40,150,,,
`

func formatterRecords(t *testing.T) []assess.Record {
	t.Helper()
	db, err := speciation.Default()
	if err != nil {
		t.Fatal(err)
	}
	demo, err := data.Demo().ReadFile("demo/samples.csv")
	if err != nil {
		t.Fatal(err)
	}
	var batches []*hydro.Batch
	for name, text := range map[string]string{"demo.csv": string(demo), "ragged.csv": ragged} {
		b, err := hydro.Read(strings.NewReader(text), name, hydro.Options{})
		if err != nil {
			t.Fatal(err)
		}
		batches = append(batches, b)
	}
	recs, err := assess.Run(context.Background(), db, batches, assess.Options{})
	if err != nil {
		t.Fatal(err)
	}
	return recs
}

// A RowFormatter gives, record after record, the same table rows as
// Columns.Row and the same GeoJSON bytes as SampleFeature: with the table's
// minerals those of the points, with a subset, and in another order (where
// the cursor over a result's minerals misses).
func TestRowFormatterMatchesRowAndSampleFeature(t *testing.T) {
	recs := formatterRecords(t)
	db, err := speciation.Default()
	if err != nil {
		t.Fatal(err)
	}
	all := db.MineralNames()
	reversed := slices.Clone(all)
	slices.Reverse(reversed)
	for _, tc := range []struct {
		name            string
		table, features []string
	}{
		{"same", all, all},
		{"subset", all[:3], all},
		{"reversed", reversed, all[2:]},
		{"aliases", []string{"barite", "Calcite", "amorphous_FeS"}, []string{"celestite", "SiO2(am)"}},
	} {
		t.Run(tc.name, func(t *testing.T) {
			cols := ColumnsFor([]*hydro.Batch{{Rows: rowsOf(recs)}}, tc.table)
			f := NewRowFormatter(cols, tc.features)
			for i := range recs {
				r := &recs[i]
				wantRow := cols.Row(r)
				if got := f.Row(r); !slices.Equal(got, wantRow) {
					t.Fatalf("record %d: Row\n got %q\nwant %q", i, got, wantRow)
				}
				gotRow, gotF := f.RowAndFeature(r)
				if !slices.Equal(gotRow, wantRow) {
					t.Fatalf("record %d: RowAndFeature row\n got %q\nwant %q", i, gotRow, wantRow)
				}
				wantF := SampleFeature(r, tc.features)
				if got, want := encode(t, gotF), encode(t, wantF); !bytes.Equal(got, want) {
					t.Fatalf("record %d: feature\n got %s\nwant %s", i, got, want)
				}
			}
		})
	}
}

func rowsOf(recs []assess.Record) []hydro.Row {
	out := make([]hydro.Row, len(recs))
	for i := range recs {
		out[i] = recs[i].Row
	}
	return out
}

func encode(t *testing.T, f geo.PointFeature) []byte {
	t.Helper()
	b, err := geo.EncodeFeature(nil, &f)
	if err != nil {
		t.Fatal(err)
	}
	return b
}

// lookupSIs gives what Result.SI gives for each mineral, for names in the
// result's order, in another order, absent from it and spelt otherwise.
func TestLookupSIsMatchesResultSI(t *testing.T) {
	recs := formatterRecords(t)
	db, err := speciation.Default()
	if err != nil {
		t.Fatal(err)
	}
	all := db.MineralNames()
	reversed := slices.Clone(all)
	slices.Reverse(reversed)
	lists := [][]string{all, reversed, all[5:], {"barite", "Calcite", "amorphous_FeS", "calcite", "calcite", "no such mineral"}}
	n := 0
	for i := range recs {
		res := recs[i].Result
		if res == nil {
			continue
		}
		n++
		for _, ms := range lists {
			got := lookupSIs(nil, res, ms)
			for j, m := range ms {
				v, ok := res.SI(m)
				if got[j] != (siValue{v, ok}) {
					t.Fatalf("record %d, %q: lookupSIs %v, Result.SI %v %v", i, m, got[j], v, ok)
				}
			}
		}
	}
	if n == 0 {
		t.Fatal("no record with a result")
	}
}
