package speciation

import "testing"

func TestScratchPE(t *testing.T) {
	db := mustDefault(t)
	s := NewSolver(db, TruesdellJones{})
	for _, pe := range []float64{-4, 0, 5, 10, 13} {
		w := nativeWater()
		w.SetPE(pe)
		res, err := s.Solve(&w)
		if err != nil {
			t.Fatal(pe, err)
		}
		fe3 := db.StateTotal(res, "Fe2+", -1)
		t.Logf("pe %g: it %d FeIII %.3g HS %.3g O2 %.3g logpO2 %.2f SI ferrihydrite %.2f goethite %.2f pyrolusite %.2f mack %.2f pyrite %.2f warn %v",
			pe, res.Iterations, fe3, res.Molality("HS-"), res.Molality("O2(aq)"), res.LogPO2, si(res, "ferrihydrite"), si(res, "goethite"), si(res, "pyrolusite"), si(res, "mackinawite"), si(res, "pyrite"), res.Warnings)
	}
	w := nativeWater()
	res, _ := s.Solve(&w)
	t.Log(res.RedoxSkipped, len(res.Minerals))
}

func si(r *Result, m string) float64 { v, _ := r.SI(m); return v }
