package report

import (
	"strings"
	"testing"

	"gwsat.dev/gwsat/assess"
	"gwsat.dev/gwsat/hydro"
)

func TestFlagPositions(t *testing.T) {
	mk := func(lat, lon hydro.Value) assess.Record {
		return assess.Record{Row: hydro.Row{Sample: hydro.Sample{ID: "x", Lat: lat, Lon: lon}}, Status: hydro.StatusOK}
	}
	recs := []assess.Record{
		mk(hydro.Some(30.9), hydro.Some(-100.1)), // fine
		mk(hydro.Some(95), hydro.Some(-100.1)),   // latitude out of range
		mk(hydro.Some(0), hydro.Some(0)),         // blank cells read as zeros
		mk(hydro.Value{}, hydro.Value{}),         // no coordinates: not flagged
		{Row: hydro.Row{Sample: hydro.Sample{ID: "u", Easting: hydro.Some(441053), Northing: hydro.Some(9231157)}}, Status: hydro.StatusOK},
	}
	FlagPositions(recs)
	want := []hydro.Status{hydro.StatusOK, hydro.StatusWarning, hydro.StatusWarning, hydro.StatusOK, hydro.StatusWarning}
	for i, r := range recs {
		if r.Status != want[i] {
			t.Errorf("record %d: status %s, want %s (%v)", i, r.Status, want[i], r.Reasons)
		}
		if r.Status == hydro.StatusWarning && !strings.Contains(strings.Join(r.Reasons, ";"), "left off maps") {
			t.Errorf("record %d: reasons %v", i, r.Reasons)
		}
	}
}

// Nested wells at 40, 70 and 108-128 m split into three zones at the gaps;
// a continuous spread of depths stays one zone.
func TestDepthZones(t *testing.T) {
	mk := func(ds ...float64) []placedRec {
		var out []placedRec
		for _, d := range ds {
			out = append(out, placedRec{depth: d, hasD: true})
		}
		return out
	}
	z := depthZones(mk(40, 40, 70, 70, 108, 108, 128), nil)
	if len(z) != 3 || z[0].Label != "40 m depth" || z[2].Label != "108-128 m depth" {
		t.Fatalf("zones %+v", z)
	}
	for _, p := range mk(40, 70, 108, 128) {
		n := 0
		for _, zz := range z {
			if zz.contains(p) {
				n++
			}
		}
		if n != 1 {
			t.Errorf("depth %g lies in %d zones", p.depth, n)
		}
	}
	if z := depthZones(mk(10, 15, 20, 25, 30, 35), nil); len(z) != 1 {
		t.Errorf("continuous depths gave %d zones", len(z))
	}
	if z := depthZones(mk(10, 60), []float64{0, 50, 100}); len(z) != 2 || z[1].Label != "50-100 m depth" {
		t.Errorf("given edges gave %+v", z)
	}
}

func TestCommonPrefix(t *testing.T) {
	for _, c := range []struct {
		in   []string
		want string
	}{
		{[]string{"A1-S", "A1-I", "A1-D"}, "A1"},
		{[]string{"MW-7"}, "MW-7"},
		{[]string{"X", "Y"}, "X..."},
	} {
		if got := commonPrefix(c.in); got != c.want {
			t.Errorf("commonPrefix(%v) = %q, want %q", c.in, got, c.want)
		}
	}
}

func TestColumnName(t *testing.T) {
	for in, want := range map[string]string{"calcite": "calcite_si", "amorphous silica": "amorphous_silica_si", "CO2(g)": "co2_g_si"} {
		if got := ColumnName(in); got != want {
			t.Errorf("ColumnName(%q) = %q, want %q", in, got, want)
		}
	}
}
