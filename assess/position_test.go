package assess

import (
	"strings"
	"testing"

	"gwsat.dev/gwsat/hydro"
)

func TestCheckPosition(t *testing.T) {
	mk := func(lat, lon hydro.Value) Record {
		return Record{Row: hydro.Row{Sample: hydro.Sample{ID: "x", Lat: lat, Lon: lon}}, Status: hydro.StatusOK}
	}
	recs := []Record{
		mk(hydro.Some(30.9), hydro.Some(-100.1)), // fine
		mk(hydro.Some(95), hydro.Some(-100.1)),   // latitude out of range
		mk(hydro.Some(0), hydro.Some(0)),         // blank cells read as zeros
		mk(hydro.Value{}, hydro.Value{}),         // no coordinates: not flagged
		{Row: hydro.Row{Sample: hydro.Sample{ID: "u", Easting: hydro.Some(441053), Northing: hydro.Some(9231157)}}, Status: hydro.StatusOK},
	}
	for i := range recs {
		checkPosition(&recs[i])
	}
	want := []hydro.Status{hydro.StatusOK, hydro.StatusWarning, hydro.StatusWarning, hydro.StatusOK, hydro.StatusWarning}
	for i, r := range recs {
		if r.Status != want[i] {
			t.Errorf("record %d: status %s, want %s (%v)", i, r.Status, want[i], r.Reasons())
		}
		if r.Status == hydro.StatusWarning && !strings.Contains(strings.Join(r.Reasons(), ";"), "left off maps") {
			t.Errorf("record %d: reasons %v", i, r.Reasons())
		}
	}
}
