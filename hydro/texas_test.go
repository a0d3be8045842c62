package hydro

import (
	"math"
	"os"
	"sort"
	"testing"
)

// Real oil- and gas-field brines (testdata/tx_produced_water_subset.csv, a
// line selection from the USGS National Produced Waters Geochemical
// Database v2.3, Texas wells; Blondes et al., authors from memory; see
// testdata/README.md). Units are not in the file: mg/L, confirmed here as
// the database documents them (from memory). The file has no sample-id
// header (an unnamed index column) and gives sodium plus potassium in one
// column (KNa) on some rows.
func TestTexasProducedWater(t *testing.T) {
	f, err := os.Open("../testdata/tx_produced_water_subset.csv")
	if err != nil {
		t.Fatal(err)
	}
	defer f.Close()
	b, err := Read(f, "tx.csv", Options{ConfirmUnits: true, ColumnMap: map[string]string{"": "SampleID", "TDSUSGS": "TDS (mg/L)"}})
	if err != nil {
		t.Fatal(err)
	}
	if len(b.Rows) != 2250 {
		t.Fatalf("%d rows, want 2250", len(b.Rows))
	}
	var nak []float64
	rejected := 0
	for _, r := range b.Rows {
		if r.Status == StatusRejected {
			rejected++
			if rejected < 5 {
				t.Logf("rejected line %d: %v", r.Line, r.Issues)
			}
		}
		for _, is := range r.Issues {
			if is.Code == CodeImplausible {
				t.Errorf("line %d: a brine flagged as implausible: %v", r.Line, is)
			}
		}
		na, ok := r.Sample.Analytes["Na"]
		if !ok || !na.SodiumPlusPotassium {
			continue
		}
		bal := ChargeBalance(&r.Sample)
		if _, hasK := r.Sample.Analytes["K"]; hasK || !bal.Complete {
			continue
		}
		nak = append(nak, math.Abs(bal.ErrorPct))
	}
	sort.Float64s(nak)
	if len(nak) < 1000 {
		t.Fatalf("%d complete Na+K rows", len(nak))
	}
	// Where the lab did not separate Na and K the database gives their sum
	// computed as the cation deficit (from memory), so such analyses
	// balance: a property of the convention that can fail if Na+K were
	// read as anything but sodium.
	med := nak[len(nak)/2]
	t.Logf("%d rows, %d rejected; %d complete Na+K rows, median |balance| %.3f %%, 90th percentile %.3f %%", len(b.Rows), rejected, len(nak), med, nak[len(nak)*9/10])
	if rejected != 0 {
		t.Errorf("%d rows rejected: censored and unknown tokens must not reject a row", rejected)
	}
	if med > 1 {
		t.Errorf("median |balance| of Na+K rows %.3f %%, want below 1 %%", med)
	}
}
