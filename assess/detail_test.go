package assess

import (
	"context"
	"reflect"
	"testing"

	"gwsat.dev/gwsat/hydro"
	"gwsat.dev/gwsat/speciation"
)

// A record assessed without its detail and detailed afterwards has the same
// species and distribution, to the last bit, as one assessed with it (both are
// solved from a cold start with the same options).
func TestDetailerMatchesDetail(t *testing.T) {
	db, err := speciation.Default()
	if err != nil {
		t.Fatal(err)
	}
	b := demoBatch(t)
	full, err := Run(context.Background(), db, []*hydro.Batch{b}, Options{Detail: true})
	if err != nil {
		t.Fatal(err)
	}
	lean, err := Run(context.Background(), db, []*hydro.Batch{b}, Options{})
	if err != nil {
		t.Fatal(err)
	}
	d := NewDetailer(db, Options{})
	n := 0
	for i := range lean {
		if full[i].Result == nil {
			continue
		}
		if len(lean[i].Result.Species) != 0 {
			t.Fatal("a lean record kept its species")
		}
		got := d.Record(&lean[i])
		if !reflect.DeepEqual(got.Result.Species, full[i].Result.Species) || !reflect.DeepEqual(got.Result.Distribution, full[i].Result.Distribution) {
			t.Fatalf("%s: detail differs from the first assessment", full[i].Sample().ID)
		}
		n++
	}
	if n < 90 {
		t.Fatalf("only %d records compared", n)
	}
}
