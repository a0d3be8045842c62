package speciation

import (
	"testing"
)

func TestSmoke(t *testing.T) {
	db, err := Default()
	if err != nil {
		t.Fatal(err)
	}
	t.Logf("%d comps %d species %d minerals", len(db.Components), len(db.Species), len(db.Minerals))
	s := NewSolver(db, TruesdellJones{})
	w := nativeWater()
	res, err := s.Solve(&w)
	if err != nil {
		t.Fatal(err)
	}
	t.Logf("evals=%d I=%g it=%d CB=%g pCO2=%g", s.evals, res.IonicStrength, res.Iterations, res.ChargeBalance, res.LogPCO2)
	for _, m := range res.Minerals {
		t.Logf("%s %.3f", m.Name, m.SI)
	}
	var c Water
	c.TempC = 25
	c.PHFromChargeBalance = true
	c.FixByPhase("Ca+2", "Calcite", 0)
	c.FixByPhase("CO3-2", "CO2(g)", -3.5)
	res, err = s.Solve(&c)
	if err != nil {
		t.Fatal(err)
	}
	ca, _ := res.Total("Ca+2")
	t.Logf("calcite: pH %.4f Ca %.4g I %g", res.PH, ca, res.IonicStrength)
}
