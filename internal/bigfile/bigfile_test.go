package bigfile

import (
	"bytes"
	"encoding/csv"
	"testing"
)

// The file has the asked number of rows, unique ids, and is the same for the same
// seed.
func TestWrite(t *testing.T) {
	var a, b bytes.Buffer
	if err := Write(&a, 500, 7); err != nil {
		t.Fatal(err)
	}
	if err := Write(&b, 500, 7); err != nil {
		t.Fatal(err)
	}
	if !bytes.Equal(a.Bytes(), b.Bytes()) {
		t.Fatal("same seed, different bytes")
	}
	recs, err := csv.NewReader(&a).ReadAll()
	if err != nil {
		t.Fatal(err)
	}
	if len(recs) != 501 {
		t.Fatalf("%d lines, want 501", len(recs))
	}
	ids := map[string]bool{}
	for _, r := range recs[1:] {
		if ids[r[0]] {
			t.Fatalf("id %s twice", r[0])
		}
		ids[r[0]] = true
	}
}
