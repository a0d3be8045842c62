package reaction

import (
	"testing"
	"gwsat/speciation"
)

func TestSmoke(t *testing.T) {
	db, _ := speciation.Default()
	r := New(db, speciation.TruesdellJones{})
	sat := func(lp float64) Solution {
		w := speciation.Water{TempC: 25, PHFromChargeBalance: true}
		w.FixByPhase("Ca+2", "Calcite", 0)
		w.FixByPhase("CO3-2", "CO2(g)", lp)
		s, res, err := r.Prepare(&w)
		if err != nil { t.Fatal(err) }
		t.Logf("pH %.3f Ca %.4g", res.PH, s.Total("Ca+2"))
		return s
	}
	a, b := sat(-1.0), sat(-3.5)
	sw, err := r.Sweep(a, b, SweepOptions{Minerals: []string{"Calcite"}})
	if err != nil { t.Fatal(err) }
	for _, p := range sw.Points { t.Logf("%.2f %.4f %.5f", p.Fraction, p.PH, p.SI[0]) }
	ts, err := r.TemperatureSweep(a, nil, []string{"Calcite","Gypsum"})
	if err != nil { t.Fatal(err) }
	for _, p := range ts.Points { t.Logf("%.0f %.4f %.5f", p.TempC, p.PH, p.SI[0]) }
}
