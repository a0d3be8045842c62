package trend_test

import (
	"fmt"

	"gwsat.dev/gwsat/trend"
)

// Calcite saturation index at one well over eight sampling years (invented
// data): a falling trend of about 0.06 SI units per year. Checked by hand:
// of the 28 pairs only two rise (0.35 to 0.38, 0.02 to 0.05), so
// S = 2 - 26 = -24; Var(S) = 8*7*21/18 = 65.33 and Z = -23/8.083 = -2.85,
// two-sided p = 0.0044. Exact: |S| >= 24 needs at most 2 inversions of
// the rising order, and of the 8! = 40320 orderings 1 + 7 + 27 = 35 have
// that few (Mahonian numbers), so p = 2*35/40320 = 0.0017.
func ExampleAnalyze() {
	years := []float64{2001, 2002, 2003, 2004, 2005, 2006, 2007, 2008}
	si := []float64{0.42, 0.35, 0.38, 0.21, 0.18, 0.12, 0.02, 0.05}
	r, err := trend.Analyze(years, si, 0.05)
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Printf("S = %d, p = %.4f (exact %.4f): %v\n", r.S, r.P, r.PExact, r.Direction)
	fmt.Printf("Sen slope %.3f per year, 95 %% interval %.3f to %.3f\n", r.Slope, r.SlopeLow, r.SlopeHigh)
	// Output:
	// S = -24, p = 0.0044 (exact 0.0017): decreasing
	// Sen slope -0.060 per year, 95 % interval -0.079 to -0.040
}
