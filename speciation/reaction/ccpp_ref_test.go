package reaction

import (
	"math"
	"testing"

	"gwsat.dev/gwsat/speciation"
)

// CCPP of the four check waters recorded in REFERENCES.md section 8.2: computed
// there by the Standard Methods 2330 definition (CCPP = 50 045 (Alk_initial -
// Alk_equilibrium) mg/L as CaCO3, closed system, pH from the alkalinity) with an
// independent implementation using Truesdell-Jones and the Plummer & Busenberg
// (1982) constants (tag D: it checks the arithmetic and the definition, not the
// constants). Waters in mg/L, alkalinity as CaCO3; totals converted with IUPAC
// 2013 atomic weights at 1 kg of water per litre.
func TestCCPPReferenceWaters(t *testing.T) {
	db := defaultDB(t)
	r := New(db, speciation.TruesdellJones{})
	mw := map[string]float64{"Ca2+": 40.078, "Mg2+": 24.305, "Na+": 22.990, "Cl-": 35.45, "SO4 2-": 96.06}
	for _, c := range []struct {
		mgL           map[string]float64
		alk, t, ph    float64
		si, ccpp, ph2 float64
	}{
		{map[string]float64{"Ca2+": 100, "Mg2+": 10, "Na+": 20, "Cl-": 35, "SO4 2-": 48}, 200, 25, 8.00, 0.88, 35.9, 7.24},
		{map[string]float64{"Ca2+": 100, "Mg2+": 10, "Na+": 20, "Cl-": 35, "SO4 2-": 48}, 200, 10, 8.00, 0.67, 27.1, 7.42},
		{map[string]float64{"Ca2+": 20, "Na+": 40, "Cl-": 50, "SO4 2-": 20}, 40, 20, 7.50, -0.97, -6.4, 8.38},
		{map[string]float64{"Ca2+": 80, "Mg2+": 12, "Na+": 30, "Cl-": 40, "SO4 2-": 60}, 180, 60, 7.60, 0.78, 40.0, 6.99},
	} {
		w := speciation.Water{TempC: c.t, PH: c.ph}
		for k, v := range c.mgL {
			w.SetTotal(k, v/1000/mw[k])
		}
		w.SetAlkalinity(c.alk / 50043)
		sol, res, err := r.Prepare(&w)
		if err != nil {
			t.Fatal(err)
		}
		si, _ := res.SI("calcite")
		ccpp, ok, err := r.CCPP(sol, 1)
		if err != nil || !ok {
			t.Fatalf("%v: %v %v", c, ok, err)
		}
		if math.Abs(si-c.si) > 0.02 {
			t.Errorf("T %g pH %g: SI %.3f, reference %.2f", c.t, c.ph, si, c.si)
		}
		if math.Abs(ccpp-c.ccpp) > 0.5 {
			t.Errorf("T %g pH %g: CCPP %.2f mg/L, reference %.1f", c.t, c.ph, ccpp, c.ccpp)
		}
	}
}
