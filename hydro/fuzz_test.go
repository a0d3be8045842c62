package hydro

import (
	"math"
	"os"
	"strings"
	"testing"
)

// FuzzRead feeds arbitrary bytes to Read: it must never panic, and what it
// returns must be consistent (a row per status, no NaN or Inf anywhere).
// Run longer with: go test -fuzz=FuzzRead ./hydro/
func FuzzRead(f *testing.F) {
	seeds := []string{
		"Sample ID,Ca (mg/L),Cl (mg/L),pH\nA,40.1,35.5,7.2\n",
		"Sample;Ca;Cl\nA;1,5;2,5\n",
		"\ufeffSample\tCa\tHCO3\tTemp\nA\t<0.5\tND\t25\r\n",
		"Sample ID;Parameter;Value;Unit;Qualifier\nS1;Calcium;40;mg/L;\nS1;Barium;5;ug/L;<\n",
		"Sample,Ca,Ca_qualifier,Ca_DL\nA,0.5,U,0.5\nB,\"3,4\n",
		"no,id,ca,screen\n1,SB 1,3,\"30-35 & 48-53\"\r2,SB 1,-1,x\r",
		"Sample,Alkalinity as CaCO3,TDS,Density\nA,100,1e6,1\nB,1e308,1e308,1.4\n",
		"",
		"\x00\x01",
		"{\"a\":1}",
		",,,\n,,,\n",
		"Sample,Date,Ca\nA,31/02/2024,1\nB,02/13/2024,1\n",
	}
	if raw, err := os.ReadFile("../testdata/semarang_data_smg.csv"); err == nil {
		seeds = append(seeds, string(raw[:min(len(raw), 600)]))
	}
	for _, s := range seeds {
		f.Add(s)
	}
	f.Fuzz(func(t *testing.T, in string) {
		b, err := Read(strings.NewReader(in), "fuzz.csv", Options{})
		if err != nil {
			if b != nil {
				t.Fatal("batch and error both returned")
			}
			return
		}
		n := 0
		for _, c := range b.Counts() {
			n += c
		}
		if n != len(b.Rows) {
			t.Fatalf("counts %v for %d rows", b.Counts(), len(b.Rows))
		}
		for _, r := range b.Rows {
			if r.Status != StatusOK && r.Status != StatusWarning && r.Status != StatusRejected {
				t.Fatalf("status %q", r.Status)
			}
			s := r.Sample
			for _, v := range []Value{s.Lat, s.Lon, s.Easting, s.Northing, s.GroundElevM, s.DepthM, s.ScreenTopM, s.ScreenBottomM, s.TempC, s.PH, s.SpecCondUScm, s.TDSMgL, s.Density} {
				if v.OK && (math.IsNaN(v.V) || math.IsInf(v.V, 0)) {
					t.Fatalf("line %d: non-finite field %v", r.Line, v)
				}
			}
			for k, m := range s.Analytes {
				if math.IsNaN(m.Value) || math.IsInf(m.Value, 0) || m.Value < 0 {
					t.Fatalf("line %d: %s = %v", r.Line, k, m.Value)
				}
			}
			bal := ChargeBalance(&s)
			for _, v := range []float64{bal.CationsMeqL, bal.AnionsMeqL, bal.ErrorPct} {
				if math.IsNaN(v) {
					t.Fatalf("line %d: NaN in balance %+v", r.Line, bal)
				}
			}
			w, _ := s.Water()
			for k, v := range w.Molal {
				if math.IsNaN(v) {
					t.Fatalf("line %d: NaN molality %s", r.Line, k)
				}
			}
		}
	})
}
