package assess

import (
	"context"
	"math"
	"testing"

	"gwsat.dev/gwsat/hydro"
	"gwsat.dev/gwsat/speciation"
)

// A row's Pressure column wins over Options.PressureBar; Hydrostatic takes the
// depth; a row without depth stays at 1 bar with a note; above the data's 500 bar
// the row is warned; without any pressure nothing changes.
func TestRunPressure(t *testing.T) {
	db, err := speciation.Default()
	if err != nil {
		t.Fatal(err)
	}
	csv := "Sample,Temp,pH,Ca,Mg,Na,Cl,SO4,Alkalinity,Depth,Pressure (bar)\n" +
		"A,25,7.2,120,20,50,80,300,200,1000,\n" +
		"B,25,7.2,120,20,50,80,300,200,,600\n" +
		"C,25,7.2,120,20,50,80,300,200,,\n"
	run := func(opt Options) []Record {
		recs, err := Run(context.Background(), db, []*hydro.Batch{read(t, csv)}, opt)
		if err != nil {
			t.Fatal(err)
		}
		return recs
	}
	has := func(r *Record, c hydro.Code) bool {
		for _, is := range r.Issues {
			if is.Code == c {
				return true
			}
		}
		return false
	}
	plain := run(Options{})
	for i := range plain {
		r := &plain[i]
		if r.Result == nil {
			t.Fatalf("%s not speciated: %v", r.Sample().ID, r.Reasons())
		}
	}
	if p := plain[1].Result.PressureBar; p != 600 || !has(&plain[1], CodePressureRange) {
		t.Errorf("row B: pressure %g, outside-range warning %v", p, has(&plain[1], CodePressureRange))
	}
	if p := plain[2].Result.PressureBar; p != 1 || has(&plain[2], CodeNoPressureData) {
		t.Errorf("row C: pressure %g without any given", p)
	}
	hyd := run(Options{Hydrostatic: true})
	if p, want := hyd[0].Result.PressureBar, 1+0.0980665*1000; math.Abs(p-want) > 1e-9 || !has(&hyd[0], CodeNoPressureData) {
		t.Errorf("row A hydrostatic: %g bar, want %g", p, want)
	}
	if hyd[1].Result.PressureBar != 600 {
		t.Errorf("row B: its column should win, got %g", hyd[1].Result.PressureBar)
	}
	if hyd[2].Result.PressureBar != 1 || !has(&hyd[2], CodeNoDepth) {
		t.Errorf("row C without depth: %g bar, note %v", hyd[2].Result.PressureBar, has(&hyd[2], CodeNoDepth))
	}
	// calcite at 99 bar: its SI falls by the log K shift
	a0, a1 := plain[0].Result.Mineral("calcite"), hyd[0].Result.Mineral("calcite")
	m := db.Mineral("calcite")
	if shift := speciation.PressureLogKShift(m.VolumeChange, m.CompressibilityChange, 298.15, hyd[0].Result.PressureBar); math.Abs(a0.SI-a1.SI-shift) > 1e-9 {
		t.Errorf("calcite SI %g -> %g, shift %g", a0.SI, a1.SI, shift)
	}
}
