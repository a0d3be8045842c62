package assess

import (
	"bytes"
	"context"
	"math"
	"strings"
	"testing"

	"gwsat.dev/gwsat/hydro"
	"gwsat.dev/gwsat/speciation"
)

// FuzzPipeline: any bytes read as a lab file either are refused as a whole (an
// error naming the file) or give exactly one record per row, each with a status,
// and no number in any record is NaN or Inf.
func FuzzPipeline(f *testing.F) {
	f.Add([]byte("Sample,pH,Temp,Ca,Mg,Na,K,Cl,SO4,Alkalinity as CaCO3\nS,7.2,15,60,12,20,2,30,40,180\n"))
	f.Add([]byte("Sample;pH;Ca (mg/L);Cl (mg/L)\nA;7,1;1e308;<0,5\nB;2;-1;ND\n"))
	f.Add([]byte("sample,parameter,value,unit\nW1,pH,7.4,\nW1,Ca,50,mg/L\nW1,Cl,1e300,g/L\n"))
	f.Add([]byte("Sample ID,Latitude,Longitude,Depth,pH,Temp (C),Ba (ug/L),SO4 (mg/L),Alkalinity (mg/L as CaCO3)\nX,95,0,-3,14,100,1e9,1e9,1e-9\n"))
	f.Add([]byte("Sample,Depth (m),Temp (C),pH,Ca (mg/L),Na (mg/L),Cl (mg/L),SO4 (mg/L),Ba (mg/L),Sr (mg/L),Pressure (psi)\nD,2500,88,6.5,7000,60000,110000,8,30,600,3600\nE,10,20,7,1e5,1,1,1e5,0,0,20000\nF,,,,,,,,,,abc\n"))
	db, err := speciation.Default()
	if err != nil {
		f.Fatal(err)
	}
	f.Fuzz(func(t *testing.T, raw []byte) {
		if len(raw) > 1<<16 {
			return
		}
		b, err := hydro.Read(bytes.NewReader(raw), "fuzz.csv", hydro.Options{})
		if err != nil {
			if !strings.Contains(err.Error(), "fuzz.csv") {
				t.Fatalf("a refused file must be named: %v", err)
			}
			return
		}
		recs, err := Run(context.Background(), db, []*hydro.Batch{b}, Options{Workers: 1})
		if err != nil {
			t.Fatal(err)
		}
		if len(recs) != len(b.Rows) {
			t.Fatalf("%d records for %d rows", len(recs), len(b.Rows))
		}
		for i := range recs {
			r := &recs[i]
			if r.Status == "" {
				t.Fatalf("record %d without a status", i)
			}
			nums := []float64{r.Balance.ErrorPct, r.Balance.CationsMeqL, r.Balance.AnionsMeqL}
			if res := r.Result; res != nil {
				nums = append(nums, res.IonicStrength, res.PH, res.ChargeBalance, res.LogPCO2)
				for _, m := range res.Minerals {
					nums = append(nums, m.SI)
				}
			}
			for _, v := range nums {
				if math.IsNaN(v) || math.IsInf(v, 0) {
					t.Fatalf("record %d carries %v: %v", i, v, r.Reasons())
				}
			}
		}
	})
}
