package uncertainty

import (
	"math"
	"testing"
)

// CaseOf takes the pH uncertainty from where the pH was measured, widens the
// temperature's when none was reported, applies per-analyte overrides and
// turns a non-detect into a draw up to its limit (converted like the value:
// 5 ug/L of Ba, 137.327 g/mol, is 3.64e-8 mol/kgw in dilute water; IUPAC
// 2013 atomic weight).
func TestCaseOf(t *testing.T) {
	_, recs := assessCSV(t, "Sample,pH field,Temp,Ca,Na,Cl,Alkalinity as CaCO3,Ba (ug/L)\n"+
		"field,7.2,15,60,20,30,150,<5\n")
	_, labRecs := assessCSV(t, "Sample,pH,Ca,Na,Cl,Alkalinity as CaCO3,Ba (ug/L)\n"+
		"lab,7.2,60,20,30,150,40\n")
	tests := []struct {
		name  string
		c     func() (Case, error)
		input string
		sd    float64 // absolute, or relative for concentrations (rel true)
		rel   bool
		nd    bool
	}{
		{"field pH", func() (Case, error) { return CaseOf(&recs[0], Options{}) }, "pH", DefaultPHFieldSD, false, false},
		{"lab pH", func() (Case, error) { return CaseOf(&labRecs[0], Options{}) }, "pH", DefaultPHLabSD, false, false},
		{"temperature", func() (Case, error) { return CaseOf(&recs[0], Options{}) }, "temperature", DefaultTempSD, false, false},
		{"assumed temperature", func() (Case, error) { return CaseOf(&labRecs[0], Options{}) }, "temperature", DefaultAssumedTempSD, false, false},
		{"calcium", func() (Case, error) { return CaseOf(&recs[0], Options{}) }, "Ca", DefaultRelSD, true, false},
		{"alkalinity override", func() (Case, error) {
			return CaseOf(&recs[0], Options{RelSDByAnalyte: map[string]float64{"Alk": 0.02}})
		}, "Alk", 0.02, true, false},
		{"barium override", func() (Case, error) {
			return CaseOf(&labRecs[0], Options{RelSDByAnalyte: map[string]float64{"Ba": 0.15}})
		}, "Ba", 0.15, true, false},
		{"barium non-detect", func() (Case, error) { return CaseOf(&recs[0], Options{}) }, "Ba", 0, false, true},
	}
	for _, tc := range tests {
		c, err := tc.c()
		if err != nil {
			t.Fatalf("%s: %v", tc.name, err)
		}
		var in *Input
		for i := range c.Inputs {
			if c.Inputs[i].Name == tc.input {
				in = &c.Inputs[i]
			}
		}
		if in == nil {
			t.Fatalf("%s: no input %s in %+v", tc.name, tc.input, c.Inputs)
		}
		sd := in.SD
		if tc.rel {
			sd /= in.Value
		}
		if math.Abs(sd-tc.sd) > 1e-12 || in.NonDetect != tc.nd {
			t.Errorf("%s: SD %g, non-detect %v; want %g, %v", tc.name, sd, in.NonDetect, tc.sd, tc.nd)
		}
		if tc.nd && math.Abs(in.LimitMolKgw-3.641e-8)/3.641e-8 > 0.01 {
			t.Errorf("%s: limit %g mol/kgw, want 3.64e-8", tc.name, in.LimitMolKgw)
		}
	}
}
