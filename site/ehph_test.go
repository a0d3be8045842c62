package site

import (
	"testing"

	"gwsat.dev/gwsat/assess"
	"gwsat.dev/gwsat/figure"
	"gwsat.dev/gwsat/speciation"
)

// Rows with a pe are placed on the diagram at their own pH and pe, inside the
// field the data set's constants give at that point; rows without one are left
// off, and without any the figure is not drawn.
func TestIronPEPHFigure(t *testing.T) {
	db, err := speciation.Default()
	if err != nil {
		t.Fatal(err)
	}
	if _, ok, err := IronPEPHFigure(db, nil); ok || err != nil {
		t.Fatalf("no rows: drawn %v, %v", ok, err)
	}
	solve := func(pe float64, withPE bool) *speciation.Result {
		var w speciation.Water
		w.TempC, w.PH = 20, 7
		for c, v := range map[string]float64{"Ca2+": 1e-3, "Cl-": 2e-3, "Fe2+": 1e-5} {
			w.SetTotal(c, v)
		}
		if withPE {
			w.SetPE(pe)
		}
		res, err := speciation.NewSolver(db, speciation.TruesdellJones{}).Solve(&w)
		if err != nil {
			t.Fatal(err)
		}
		return res
	}
	recs := []assess.Record{{Result: solve(13, true)}, {Result: solve(-2, true)}, {Result: solve(0, false)}}
	fig, ok, err := IronPEPHFigure(db, recs)
	if err != nil || !ok {
		t.Fatalf("drawn %v, %v", ok, err)
	}
	d := fig.Figure.(figure.EhPHDiagram)
	if len(d.Samples) != 2 {
		t.Fatalf("%d samples plotted, want the 2 with a pe", len(d.Samples))
	}
	for _, s := range d.Samples {
		if s.PH < 6.5 || s.PH > 7.5 {
			t.Errorf("sample at pH %g, want its own 7", s.PH)
		}
	}
	if _, err := figure.Render(d, "png", fig.W, fig.H); err != nil {
		t.Fatal(err)
	}
}
