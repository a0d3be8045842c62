package speciation

import (
	"encoding/json"
	"fmt"
	"os"
	"testing"
	"time"
)

type dumpW struct {
	T, PH  float64
	Totals []ComponentTotal
	Alk    float64
	HasAlk bool
	PHCB   bool
	CBI    string
}

func demoWaters(t testing.TB) []Water {
	b, err := os.ReadFile("/tmp/perf/demo_waters.json")
	if err != nil {
		t.Fatal(err)
	}
	var d []dumpW
	json.Unmarshal(b, &d)
	var out []Water
	for _, x := range d {
		w := Water{TempC: x.T, PH: x.PH, PHFromChargeBalance: x.PHCB, ChargeBalanceIon: x.CBI}
		for _, c := range x.Totals {
			w.SetTotal(c.Component, c.MolKgw)
		}
		if x.HasAlk {
			w.SetAlkalinity(x.Alk)
		}
		out = append(out, w)
	}
	return out
}

func TestZZDebug(t *testing.T) {
	db, _ := Default()
	sets := map[string][]Water{"demo": demoWaters(t), "variants": nativeVariants(64)}
	for name, ws := range sets {
		for _, gs := range []int{2, 3, 4, 5, 6} {
			s := NewSolver(db, TruesdellJones{})
			s.WarmStart = false
			s.gsSweeps = gs
			hist := map[int]int{}
			var res Result
			evals := 0
			st := time.Now()
			for rep := 0; rep < 200; rep++ {
				for i := range ws {
					if err := s.SolveInto(&res, &ws[i]); err != nil {
						t.Fatal(err)
					}
					if rep == 0 {
						hist[res.Iterations]++
						evals += s.evals
					}
				}
			}
			el := time.Since(st) / time.Duration(200*len(ws))
			t.Log(name, gs, fmt.Sprint(hist), "evals", evals, el)
		}
	}
}
