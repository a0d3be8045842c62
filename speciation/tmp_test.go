package speciation

import "testing"

func TestTmpIters(t *testing.T) {
	db := mustDefault(t)
	for _, warm := range []bool{false, true} {
		s := NewSolver(db, TruesdellJones{})
		s.WarmStart = warm
		ws := nativeVariants(64)
		it, ev := 0, 0
		for i := range ws {
			res, err := s.Solve(&ws[i])
			if err != nil {
				t.Fatal(err)
			}
			it += res.Iterations
			ev += s.evals
		}
		t.Logf("warm %v: mean iterations %.2f evals %.2f", warm, float64(it)/64, float64(ev)/64)
	}
}
