package speciation

import (
	"errors"
	"math"
	"testing"
)

// The iron pe-pH diagram from the data's constants:
//   - Fe3+/Fe2+ at equal activities (low pH, no solid) is the line pe = log K(Fe2+ =
//     Fe3+ + e-) = 13.02 at 25 C (E0 0.771 V, Bard, Parsons & Jordan 1985: 13.03);
//   - the upper limit of water is pe = 20.75 - pH (Stumm & Morgan 1996, Table 8.1,
//     O2(g) + 4 H+ + 4 e- = 2 H2O, pe0 20.75) within 0.06 (the data give 20.80);
//     the lower is pe = -pH;
//   - the fields tile the window (areas add up to it);
//   - FieldAt agrees with the polygons at their centroids.
func TestIronPEPHGeometry(t *testing.T) {
	db := mustDefault(t)
	d, err := IronPEPH(db, IronDiagramOptions{TempC: 25, FeTotal: 1e-6})
	if err != nil {
		t.Fatal(err)
	}
	found := false
	for _, b := range d.Boundaries {
		if (b.Left == "Fe2+" && b.Right == "Fe3+") || (b.Left == "Fe3+" && b.Right == "Fe2+") {
			found = true
			if math.Abs(b.A.PE-13.02) > 0.01 || math.Abs(b.B.PE-13.02) > 0.01 {
				t.Errorf("Fe3+/Fe2+ boundary from %+v to %+v, want pe 13.02", b.A, b.B)
			}
		}
	}
	if !found {
		t.Error("no Fe3+/Fe2+ boundary")
	}
	for _, ph := range []float64{0, 7, 14} {
		up := d.WaterUpper[0].PE + (ph-d.WaterUpper[0].PH)*(d.WaterUpper[1].PE-d.WaterUpper[0].PE)/(d.WaterUpper[1].PH-d.WaterUpper[0].PH)
		if math.Abs(up-(20.75-ph)) > 0.06 {
			t.Errorf("upper water limit at pH %g: pe %.3f, Stumm & Morgan %.2f", ph, up, 20.75-ph)
		}
	}
	if d.WaterLower[0].PE != -d.WaterLower[0].PH || d.WaterLower[1].PE != -d.WaterLower[1].PH {
		t.Errorf("lower limit %+v", d.WaterLower)
	}
	for _, o := range []IronDiagramOptions{{TempC: 25, FeTotal: 1e-6}, {TempC: 15, FeTotal: 1e-5, STotal: 1e-3, CTotal: 4e-3}} {
		d, err := IronPEPH(db, o)
		if err != nil {
			t.Fatal(err)
		}
		sum := 0.0
		for _, f := range d.Fields {
			sum += f.Area()
			for _, p := range f.Polygons {
				cx, cy := centroid(p)
				if got := d.FieldAt(cx, cy); got != f.Name {
					t.Errorf("centroid (%.2f, %.2f) of %s classified %s", cx, cy, f.Name, got)
				}
			}
		}
		if want := (d.PHMax - d.PHMin) * (d.PEMax - d.PEMin); math.Abs(sum-want) > 1e-6*want {
			t.Errorf("fields cover %.6f of %.6f", sum, want)
		}
	}
	// Oxidising neutral water lies in the ferrihydrite field, reduced acid water in Fe2+.
	if f := d.FieldAt(7, 12); f != "ferrihydrite" {
		t.Errorf("pH 7 pe 12: %s", f)
	}
	if f := d.FieldAt(4, 0); f != "Fe2+" {
		t.Errorf("pH 4 pe 0: %s", f)
	}
	for _, bad := range []IronDiagramOptions{{TempC: 25}, {TempC: 150, FeTotal: 1e-5}, {TempC: 25, FeTotal: 1e-5, FeIIISolid: "unobtainium"},
		{TempC: 25, FeTotal: 1e-5, PHMin: 5, PHMax: 4}} {
		if _, err := IronPEPH(db, bad); err == nil || !(errors.Is(err, ErrRedoxInput) || errors.Is(err, ErrTemperature)) {
			t.Errorf("%+v: %v", bad, err)
		}
	}
}

func centroid(p []DiagramPoint) (float64, float64) {
	a := area(p)
	var cx, cy float64
	for i := range p {
		u, v := p[i], p[(i+1)%len(p)]
		f := u.PH*v.PE - v.PH*u.PE
		cx += (u.PH + v.PH) * f
		cy += (u.PE + v.PE) * f
	}
	return cx / (6 * a), cy / (6 * a)
}
