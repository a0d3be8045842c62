package uncertainty

import (
	"math"
	"testing"
)

// The one-sided differences of Options.Forward give, over every SI of the
// demo's samples (invented data), the same SD as the central differences
// within 0.001 and the same verdict, since the SI is close to linear over
// the steps (stepPH, stepTempC, stepRel); a row's best SI is the same.
func TestForwardDifferences(t *testing.T) {
	db, recs := demoRecords(t)
	central, err := Run(t.Context(), db, recs, Options{Linear: true})
	if err != nil {
		t.Fatal(err)
	}
	forward, err := Run(t.Context(), db, recs, Options{Linear: true, Forward: true, Brief: true})
	if err != nil {
		t.Fatal(err)
	}
	n, worst := 0, 0.0
	for i := range recs {
		c, f := central[i], forward[i]
		if (c.Err == nil) != (f.Err == nil) || len(c.Intervals) != len(f.Intervals) {
			t.Fatalf("row %d: central %v (%d intervals), forward %v (%d intervals)", i, c.Err, len(c.Intervals), f.Err, len(f.Intervals))
		}
		if f.Inputs != nil {
			t.Errorf("row %d: Brief kept the inputs", i)
		}
		for k := range c.Intervals {
			ci, fi := c.Intervals[k], f.Intervals[k]
			n++
			worst = math.Max(worst, math.Abs(ci.SD-fi.SD))
			if ci.Best != fi.Best || ci.Verdict != fi.Verdict || fi.Sensitivity != nil {
				t.Errorf("row %d %s: central best %g %s, forward best %g %s (sensitivity %v)", i, ci.Mineral, ci.Best, ci.Verdict, fi.Best, fi.Verdict, fi.Sensitivity)
			}
		}
	}
	if n == 0 {
		t.Fatal("no intervals compared")
	}
	t.Logf("%d intervals: largest SD difference %.2g", n, worst)
	if worst > 0.001 {
		t.Errorf("largest SD difference %g, want <= 0.001", worst)
	}
}
