package assess

import (
	"bytes"
	"context"
	"errors"
	"testing"

	"gwsat.dev/gwsat/data"
	"gwsat.dev/gwsat/hydro"
	"gwsat.dev/gwsat/speciation"
)

func demoBatch(t testing.TB) *hydro.Batch {
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

// Stream hands records over in input order whatever the number of workers, and
// gives the same numbers, to the last bit, with one worker as with many (every
// row is solved from a cold start).
func TestStreamKeepsOrder(t *testing.T) {
	db, err := speciation.Default()
	if err != nil {
		t.Fatal(err)
	}
	b := demoBatch(t)
	// The demo three times over, so that many rows are in flight at once.
	batches := []*hydro.Batch{b, b, b}
	var one []float64
	for _, workers := range []int{1, 2, 7} {
		var lines []int
		var ionic []float64
		err := Stream(context.Background(), db, BatchItems(batches), Options{Workers: workers}, func(r *Record) error {
			lines = append(lines, r.Row.Line)
			if r.Result != nil {
				ionic = append(ionic, r.Result.IonicStrength)
			}
			return nil
		})
		if err != nil {
			t.Fatal(err)
		}
		if len(lines) != 3*len(b.Rows) {
			t.Fatalf("%d workers: %d records, want %d", workers, len(lines), 3*len(b.Rows))
		}
		for i, l := range lines {
			if want := b.Rows[i%len(b.Rows)].Line; l != want {
				t.Fatalf("%d workers: record %d is line %d, want %d", workers, i, l, want)
			}
		}
		if one == nil {
			one = ionic
			continue
		}
		for i := range one {
			if ionic[i] != one[i] {
				t.Fatalf("%d workers: record %d differs from one worker", workers, i)
			}
		}
	}
}

// An error from emit stops the stream and comes back; so does an error of the
// input.
func TestStreamStopsOnError(t *testing.T) {
	db, err := speciation.Default()
	if err != nil {
		t.Fatal(err)
	}
	b := demoBatch(t)
	stop := errors.New("disk full")
	n := 0
	err = Stream(context.Background(), db, BatchItems([]*hydro.Batch{b}), Options{Workers: 2}, func(r *Record) error {
		n++
		if n == 5 {
			return stop
		}
		return nil
	})
	if !errors.Is(err, stop) || n != 5 {
		t.Fatalf("err %v after %d records", err, n)
	}
	bad := errors.New("unreadable line")
	k := 0
	next := func() (Item, bool, error) {
		k++
		if k > 3 {
			return Item{}, false, bad
		}
		return Item{File: "f", Row: b.Rows[k]}, true, nil
	}
	got := 0
	err = Stream(context.Background(), db, next, Options{}, func(*Record) error { got++; return nil })
	if !errors.Is(err, bad) || got != 3 {
		t.Fatalf("err %v after %d records", err, got)
	}
}

// StreamPrepared runs prepare on each record before emit sees it, and emit
// gets, in input order, the value prepare filled for that same record,
// although the slots' values are reused from row to row.
func TestStreamPreparedPairsValueWithRecord(t *testing.T) {
	db, err := speciation.Default()
	if err != nil {
		t.Fatal(err)
	}
	b := demoBatch(t)
	batches := []*hydro.Batch{b, b, b, b}
	type val struct {
		file string
		line int
		n    int // rows this slot prepared
	}
	for _, workers := range []int{1, 3} {
		i, reused := 0, false
		prepare := func(r *Record, v *val) {
			v.file, v.line = r.File, r.Row.Line
			v.n++
		}
		err := StreamPrepared(context.Background(), db, BatchItems(batches), Options{Workers: workers}, prepare, func(r *Record, v *val) error {
			if want := b.Rows[i%len(b.Rows)].Line; r.Row.Line != want || v.line != want || v.file != r.File {
				t.Fatalf("%d workers: record %d is line %d with value of line %d, want %d", workers, i, r.Row.Line, v.line, want)
			}
			reused = reused || v.n > 1
			i++
			return nil
		})
		if err != nil {
			t.Fatal(err)
		}
		if i != len(batches)*len(b.Rows) {
			t.Fatalf("%d workers: %d records, want %d", workers, i, len(batches)*len(b.Rows))
		}
		if !reused {
			t.Errorf("%d workers: no slot value was reused", workers)
		}
	}
}
