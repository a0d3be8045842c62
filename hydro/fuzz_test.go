package hydro

import (
	"bytes"
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
		"Invented report\nClient:,nobody\n\nSample ID,Ca,Ba,pH,Temp\nUnits,mg/L,µg/L,SU,°C\nLOR,0.1,2,,\nA,40,<LOR,7.1,n.a.\nB,41,0.5 <,ND,12\n",
		"Sample;Unit;SG;Ca;Na+K;Ba;Q\nA;ppm;1,02;40;23;5;U\nB;mg/kg;;1,5;2;<RL;\n",
		"Well,Date,pH,Ca (mg/L)\nMW-1,45729,-120,40\nMW-1,45729.5,85,1e400\nMW-2,03/04/2025,7,0.5U\n",
		"Sample,Ca,Q,Cl,Flag\n,mg/L,,mmol/L,\nA,1,<,2,J\n",
	}
	if raw, err := os.ReadFile("../testdata/semarang_data_smg.csv"); err == nil {
		seeds = append(seeds, string(raw[:min(len(raw), 600)]))
	}
	for _, s := range seeds {
		f.Add(s)
	}
	f.Fuzz(func(t *testing.T, in string) {
		b, err := Read(strings.NewReader(in), "fuzz.csv", Options{SiteTempC: Some(12)})
		if err != nil {
			if b != nil {
				t.Fatal("batch and error both returned")
			}
			return
		}
		// Every line is a row or a skipped line, once.
		seen := map[int]bool{}
		for _, sk := range b.Skipped {
			if seen[sk.Line] {
				t.Fatalf("line %d skipped twice", sk.Line)
			}
			seen[sk.Line] = true
		}
		for _, r := range b.Rows {
			if seen[r.Line] && b.Shape == Wide {
				t.Fatalf("line %d both a row and skipped, or two rows", r.Line)
			}
			seen[r.Line] = true
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
				if m.MgPerL.OK && (math.IsNaN(m.MgPerL.V) || math.IsInf(m.MgPerL.V, 0)) {
					t.Fatalf("line %d: %s = %v mg/L", r.Line, k, m.MgPerL.V)
				}
			}
			for _, is := range r.Issues {
				if is.Code == "" {
					t.Fatalf("line %d: issue without a code: %v", r.Line, is)
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

// FuzzReadWorkbookCells puts arbitrary text in the cells of a small
// workbook (a title line, a header, a units row and two samples): reading
// it must never panic, and its rows must come out finite and coded.
func FuzzReadWorkbookCells(f *testing.F) {
	f.Add("Invented report", "Ca", "mg/L", "40", "<0.5", "45729")
	f.Add("", "Ba (ug/L)", "", "ND", "0.5U", "13/03/2025")
	f.Add("Sample ID", "pH", "SU", "-120", "n.a.", "2025-03-13")
	f.Fuzz(func(t *testing.T, title, header, unit, v1, v2, date string) {
		cells := map[string]any{"A1": title, "A2": "Sample ID", "B2": "Date", "C2": header, "D2": "Cl (mg/L)",
			"C3": unit, "A4": "S1", "B4": date, "C4": v1, "D4": "10", "A5": "S2", "B5": date, "C5": v2, "D5": "11"}
		raw := workbook(t, []string{"Lab"}, map[string]map[string]any{"Lab": cells}, nil, false)
		b, err := ReadExcel(bytes.NewReader(raw), "fuzz.xlsx", Options{})
		if err != nil {
			return
		}
		for _, r := range b.Rows {
			for k, m := range r.Sample.Analytes {
				if math.IsNaN(m.Value) || math.IsInf(m.Value, 0) || m.Value < 0 {
					t.Fatalf("line %d: %s = %v", r.Line, k, m.Value)
				}
			}
			for _, is := range r.Issues {
				if is.Code == "" {
					t.Fatalf("line %d: issue without a code: %v", r.Line, is)
				}
			}
			w, _ := r.Sample.Water()
			for k, v := range w.Molal {
				if math.IsNaN(v) || math.IsInf(v, 0) {
					t.Fatalf("line %d: molality %s = %v", r.Line, k, v)
				}
			}
		}
	})
}
