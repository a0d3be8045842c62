package speciation

import (
	"math/rand/v2"
	"testing"
)

// nativeWater is an invented brackish, sulfate-rich groundwater (a demo scenario of our
// own, not a real sample): Ca 4, Mg 2, Na 20, K 0.3, Sr 0.05 mmol/kgw, Ba 1, Fe 10,
// Mn 2 umol/kgw, Cl 20, SO4 6 mmol/kgw, alkalinity 4 meq/kgw, F 50 umol/kgw,
// Si 0.3 mmol/kgw, pH 7.1, 22 C.
func nativeWater() Water {
	w := Water{TempC: 22, PH: 7.1}
	w.SetTotal("Ca2+", 4e-3)
	w.SetTotal("Mg2+", 2e-3)
	w.SetTotal("Na+", 20e-3)
	w.SetTotal("K+", 0.3e-3)
	w.SetTotal("Sr2+", 0.05e-3)
	w.SetTotal("Ba2+", 1e-6)
	w.SetTotal("Fe2+", 10e-6)
	w.SetTotal("Mn2+", 2e-6)
	w.SetTotal("Cl-", 20e-3)
	w.SetTotal("SO4 2-", 6e-3)
	w.SetAlkalinity(4e-3)
	w.SetTotal("F-", 50e-6)
	w.SetTotal("H4SiO4", 0.3e-3)
	return w
}

// nativeVariants returns n waters around the native water (totals x0.5-2, pH +/-0.4,
// 10-30 C), as the rows of a survey would be.
func nativeVariants(n int) []Water {
	rng := rand.New(rand.NewPCG(3, 4))
	out := make([]Water, n)
	for i := range out {
		w := nativeWater()
		for j := range w.totals {
			w.totals[j].MolKgw *= 0.5 + 1.5*rng.Float64()
		}
		w.alk *= 0.5 + 1.5*rng.Float64()
		w.PH += 0.8 * (rng.Float64() - 0.5)
		w.TempC = 10 + 20*rng.Float64()
		out[i] = w
	}
	return out
}

func benchSolve(b *testing.B, warm bool, waters []Water) {
	db, err := Default()
	if err != nil {
		b.Fatal(err)
	}
	s := NewSolver(db, TruesdellJones{})
	s.WarmStart = warm
	var res Result
	for i := range waters {
		if err := s.SolveInto(&res, &waters[i]); err != nil {
			b.Fatal(err)
		}
	}
	b.ReportAllocs()
	b.ResetTimer()
	for i := 0; i < b.N; i++ {
		if err := s.SolveInto(&res, &waters[i%len(waters)]); err != nil {
			b.Fatal(err)
		}
	}
}

// BenchmarkSolveNativeWater solves the native water with Truesdell-Jones from a cold
// start every time (no warm start): the figure the speed target refers to.
func BenchmarkSolveNativeWater(b *testing.B) {
	benchSolve(b, false, []Water{nativeWater()})
}

// BenchmarkSolveNativeWaterWarm repeats the same water with the warm start on (the
// previous solution is the answer: one evaluation, setup and the result).
func BenchmarkSolveNativeWaterWarm(b *testing.B) {
	benchSolve(b, true, []Water{nativeWater()})
}

// BenchmarkSolveSurveyWarm solves 64 different waters around the native water in turn,
// with the warm start (as a table of samples is processed), including temperature changes.
func BenchmarkSolveSurveyWarm(b *testing.B) {
	benchSolve(b, true, nativeVariants(64))
}

// BenchmarkSolveSurveyCold is the same survey with cold starts.
func BenchmarkSolveSurveyCold(b *testing.B) {
	benchSolve(b, false, nativeVariants(64))
}
