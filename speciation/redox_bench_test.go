package speciation

import "testing"

// BenchmarkSolveNativeWaterPE solves the native water with a pe (Fe(III), sulfide,
// O2 and the oxides in play) from a cold start: it must not allocate either.
func BenchmarkSolveNativeWaterPE(b *testing.B) {
	w := nativeWater()
	w.SetPE(4)
	benchSolve(b, false, []Water{w})
}
