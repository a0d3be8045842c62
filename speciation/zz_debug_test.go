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

func zzSetup(b testing.TB) *Solver {
	db, _ := Default()
	s := NewSolver(db, TruesdellJones{})
	s.WarmStart = false
	ws := demoWaters(b)
	var w Water
	for _, x := range ws {
		if x.TempC == 23.1 && x.PH == 7.06 {
			w = x
		}
	}
	var res Result
	if err := s.SolveInto(&res, &w); err != nil {
		b.Fatal(err)
	}
	return s
}

func BenchmarkZZGS1(b *testing.B) {
	s := zzSetup(b)
	u := s.u[:s.n]
	for i := 0; i < b.N; i++ {
		s.gaussSeidel(u, 1)
	}
}
func BenchmarkZZGS4(b *testing.B) {
	s := zzSetup(b)
	u := s.u[:s.n]
	for i := 0; i < b.N; i++ {
		s.gaussSeidel(u, 4)
	}
}
func BenchmarkZZEval(b *testing.B) {
	s := zzSetup(b)
	u := s.u[:s.n]
	for i := 0; i < b.N; i++ {
		s.evaluate(u)
	}
}
func BenchmarkZZJac(b *testing.B) {
	s := zzSetup(b)
	u := s.u[:s.n]
	for i := 0; i < b.N; i++ {
		s.jacobian(u)
	}
}
func BenchmarkZZLU(b *testing.B) {
	s := zzSetup(b)
	u := s.u[:s.n]
	s.evaluate(u)
	s.jacobian(u)
	J0 := append([]float64(nil), s.jac[:s.n*s.n]...)
	b0 := append([]float64(nil), s.resid[:s.n]...)
	for i := 0; i < b.N; i++ {
		copy(s.jac, J0)
		copy(s.du, b0)
		luSolve(s.jac, s.piv, s.du, s.n)
	}
}
func BenchmarkZZFill(b *testing.B) {
	s := zzSetup(b)
	var res Result
	w := Water{TempC: 23.1}
	for i := 0; i < b.N; i++ {
		s.fill(&res, &w)
	}
}
func BenchmarkZZSetup(b *testing.B) {
	s := zzSetup(b)
	ws := demoWaters(b)
	var w Water
	for _, x := range ws {
		if x.TempC == 23.1 && x.PH == 7.06 {
			w = x
		}
	}
	for i := 0; i < b.N; i++ {
		s.setup(&w)
	}
}

func TestZZStruct(t *testing.T) {
	s := zzSetup(t)
	u := s.u[:s.n]
	s.evaluate(u)
	s.jacobian(u)
	n := s.n
	for ci := range s.role {
		if s.col[ci] >= 0 {
			t.Log(s.col[ci], s.db.Components[ci].Name, s.role[ci])
		}
	}
	for r := 0; r < n; r++ {
		line := ""
		for c := 0; c < n; c++ {
			v := s.jac[r*n+c]
			if v == 0 {
				line += " ."
			} else {
				line += " X"
			}
		}
		t.Log(line)
	}
	na := len(s.act)
	for k := 0; k < na; k++ {
		t.Log(s.db.Species[s.act[k]].Name, s.colOff[k+1]-s.colOff[k], s.rowOff[k+1]-s.rowOff[k], s.jOff[k+1]-s.jOff[k])
	}
}
