package trend

import (
	"math"
	"testing"
)

// TestCourseWorkedExample reproduces a worked Mann-Kendall example counted
// by hand in course notes of the College of the Holy Cross mathematics
// department, "A Mann-Kendall Example ("By Hand")",
// mathcs.holycross.edu/~little/Montserrat/MannKendallByHand.txt. The notes give, for the 14-value
// series below (one pair of tied values, 12.9): 91 pairs, 72 rises, 18
// falls and 1 tie, so S = 54; Var(S) = 14*13*33/18 - 2*1*9/18 = 332.667;
// Z = (S-1)/sqrt(Var) = 2.9058; one-sided p about 0.0018 from a standard
// normal table. This is a teaching page, not a published text on
// statistics for water resources; it is an outside check of S, the
// tie-corrected variance and Z, nothing more.
func TestCourseWorkedExample(t *testing.T) {
	values := []float64{12.9, 14.8, 13.2, 15.7, 13.8, 15.6, 12.9, 11.0, 17.3, 15.9, 19.0, 18.3, 20.1, 21.7}
	times := make([]float64, len(values))
	for i := range times {
		times[i] = float64(i + 1)
	}
	r, err := Analyze(times, values, 0.05)
	if err != nil {
		t.Fatal(err)
	}
	if r.S != 54 {
		t.Errorf("S = %d; the notes count 54", r.S)
	}
	if want := 14.0*13*33/18 - 2.0*1*9/18; math.Abs(r.VarS-want) > 1e-9 {
		t.Errorf("Var(S) = %.6f; the notes give %.6f", r.VarS, want)
	}
	if math.Abs(r.Z-2.9058) > 5e-5 {
		t.Errorf("Z = %.5f; the notes give 2.9058", r.Z)
	}
	// Analyze reports the two-sided p-value; the notes quote one side.
	if math.Abs(r.P/2-0.0018) > 0.00005 {
		t.Errorf("one-sided p = %.5f; the notes give about 0.0018", r.P/2)
	}
	if r.Direction != Increasing {
		t.Errorf("direction = %v; the notes read an upward trend", r.Direction)
	}
}
