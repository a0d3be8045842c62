package speciation

import "testing"

func TestTmpIters(t *testing.T) {
	db := mustDefault(t)
	s := NewSolver(db, TruesdellJones{})
	s.WarmStart = false
	for sw := 0; sw <= 6; sw++ {
		s.sweeps = sw
		w := nativeWater()
		res, err := s.Solve(&w)
		if err != nil {
			t.Fatal(err)
		}
		t.Logf("sweeps %d: iterations %d evals %d", sw, res.Iterations, s.evals)
	}
}
