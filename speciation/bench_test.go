package speciation

import "testing"

// nativeWater is an invented brackish, sulfate-rich groundwater (demo scenario, not a
// real sample).
func nativeWater() Water {
	w := Water{TempC: 22, PH: 7.1}
	w.SetTotal("Ca+2", 4e-3)
	w.SetTotal("Mg+2", 2e-3)
	w.SetTotal("Na+", 20e-3)
	w.SetTotal("K+", 0.3e-3)
	w.SetTotal("Sr+2", 0.05e-3)
	w.SetTotal("Ba+2", 1e-6)
	w.SetTotal("Fe+2", 10e-6)
	w.SetTotal("Mn+2", 2e-6)
	w.SetTotal("Cl-", 20e-3)
	w.SetTotal("SO4-2", 6e-3)
	w.SetAlkalinity(4e-3)
	w.SetTotal("F-", 50e-6)
	w.SetTotal("H4SiO4", 0.3e-3)
	return w
}

func BenchmarkSolveNativeWater(b *testing.B) {
	db, err := Default()
	if err != nil {
		b.Fatal(err)
	}
	s := NewSolver(db, TruesdellJones{})
	w := nativeWater()
	var res Result
	if err := s.SolveInto(&res, &w); err != nil {
		b.Fatal(err)
	}
	b.ReportAllocs()
	b.ResetTimer()
	for i := 0; i < b.N; i++ {
		if err := s.SolveInto(&res, &w); err != nil {
			b.Fatal(err)
		}
	}
}
