package speciation

import (
	"math"
	"math/rand/v2"
	"testing"
)

// Property: luSolve with a known non-zero pattern gives bit for bit the solution of the
// search over every row (the pattern only skips exact zeros), on the solver's own
// Jacobians and on random sparse matrices (some needing row exchanges, which end the
// use of the pattern), and the solution satisfies A x = b.
func TestLUPatternMatchesFullSearch(t *testing.T) {
	db := mustDefault(t)
	type system struct {
		name string
		n    int
		A, b []float64
		nz   []int32
	}
	var systems []system
	for _, tc := range []struct {
		name string
		w    Water
	}{
		{"native water", nativeWater()},
		{"seawater", seaWater()},
	} {
		s := NewSolver(db, TruesdellJones{})
		if err := s.setup(&tc.w); err != nil {
			t.Fatal(err)
		}
		if !s.lu.pattern {
			t.Fatalf("%s: no pattern for a water without minerals", tc.name)
		}
		s.initialGuess(0)
		n := s.n
		s.evaluate(s.u[:n])
		s.jacobian(s.u[:n])
		b := make([]float64, n)
		for r := range b {
			b[r] = -s.resid[r] / s.scale[r]
		}
		systems = append(systems, system{tc.name, n, append([]float64(nil), s.jac[:n*n]...), b, append([]int32(nil), s.jPos...)})
	}
	rng := rand.New(rand.NewPCG(11, 12))
	for trial := 0; trial < 200; trial++ {
		n := 2 + rng.IntN(12)
		A := make([]float64, n*n)
		var nz []int32
		for i := 0; i < n; i++ {
			for j := 0; j < n; j++ {
				if i == j || rng.Float64() < 0.3 {
					A[i*n+j] = rng.NormFloat64()
					if i == j && trial%2 == 0 {
						A[i*n+j] += 4 // diagonally dominant: no exchanges
					}
					nz = append(nz, int32(i*n+j))
				}
			}
		}
		b := make([]float64, n)
		for i := range b {
			b[i] = rng.NormFloat64()
		}
		systems = append(systems, system{"random", n, A, b, nz})
	}
	for _, sy := range systems {
		n := sy.n
		withPattern, full := newLUWork(n), newLUWork(n)
		withPattern.setPattern(n, sy.nz)
		A1, b1 := append([]float64(nil), sy.A...), append([]float64(nil), sy.b...)
		A2, b2 := append([]float64(nil), sy.A...), append([]float64(nil), sy.b...)
		ok1 := luSolve(A1, b1, n, &withPattern)
		ok2 := luSolve(A2, b2, n, &full)
		if ok1 != ok2 {
			t.Fatalf("%s (n=%d): singular with pattern %v, without %v", sy.name, n, !ok1, !ok2)
		}
		if !ok1 {
			continue
		}
		for i := range b1 {
			if math.Float64bits(b1[i]) != math.Float64bits(b2[i]) {
				t.Fatalf("%s (n=%d): x[%d] = %v with the pattern, %v without", sy.name, n, i, b1[i], b2[i])
			}
		}
		for i := 0; i < n; i++ {
			r, scale := -sy.b[i], math.Abs(sy.b[i])
			for j := 0; j < n; j++ {
				r += sy.A[i*n+j] * b1[j]
				scale += math.Abs(sy.A[i*n+j] * b1[j])
			}
			if math.Abs(r) > 1e-10*scale {
				t.Fatalf("%s (n=%d): row %d residual %.3g (scale %.3g)", sy.name, n, i, r, scale)
			}
		}
	}
}
