package trend

import (
	"errors"
	"math"
	"math/rand/v2"
	"testing"

	"gonum.org/v1/gonum/floats/scalar"
)

// No worked example from a published text is reproduced here (one from
// course notes is, in worked_example_test.go): the numbers of the
// Mann-Kendall and Sen examples in Helsel & Hirsch (2002) and Gilbert
// (1987) are not remembered with enough confidence to test against. The
// checks below are counted by hand from the defining formulas (Mann 1945;
// Kendall 1975; Sen 1968; interval as in Gilbert 1987, section 16.5, from
// memory), and the tie-corrected variance and the exact p-value are checked
// against complete enumeration of all orderings, which needs no formula.

// Hand-counted series: t = 1..5, y = 2, 4, 4, 3, 6 (one pair of tied
// values).
//
// S, pair by pair (sign of later minus earlier):
//
//	y=2 against 4, 4, 3, 6:  + + + +  -> +4
//	y=4 against 4, 3, 6:     0 - +    ->  0
//	y=4 against 3, 6:        - +      ->  0
//	y=3 against 6:           +        -> +1
//	S = 5
//
// Var(S) = [5*4*15 - 2*1*9]/18 = (300 - 18)/18 = 15.6667.
// Z = (5 - 1)/sqrt(15.6667) = 4/3.95811 = 1.01058.
// p = 2(1 - Phi(1.01058)) = 0.3122 (standard normal table: Phi(1.01) =
// 0.8438, so p is about 0.312).
//
// The ten pairwise slopes, sorted: -1, -1/2, 0, 1/3, 2/3, 1, 1, 1, 2, 3;
// Sen slope = median = (2/3 + 1)/2 = 0.83333.
// Conover intercept = median(y) - slope median(t) = 4 - 0.83333*3 = 1.5.
// 95 % interval: C = 1.95996 * 3.95811 = 7.75776; ranks (10 - C)/2 =
// 1.12112 and (10 + C)/2 + 1 = 9.87888; interpolated: -1 + 0.12112*0.5 =
// -0.93944 and 2 + 0.87888*1 = 2.87888.
// 80 % interval: C = 1.28155 * 3.95811 = 5.07253; ranks 2.46374 and
// 8.53626: -0.5 + 0.46374*0.5 = -0.26813 and 1 + 0.53626*1 = 1.53626.
func TestHandCounted(t *testing.T) {
	times := []float64{1, 2, 3, 4, 5}
	values := []float64{2, 4, 4, 3, 6}
	cases := []struct {
		alpha     float64
		low, high float64
	}{
		{0.05, -0.93944, 2.87888},
		{0.20, -0.26813, 1.53626},
	}
	for _, tc := range cases {
		r, err := Analyze(times, values, tc.alpha)
		if err != nil {
			t.Fatal(err)
		}
		if r.N != 5 || r.S != 5 {
			t.Errorf("N, S = %d, %d; want 5, 5", r.N, r.S)
		}
		checks := []struct {
			name      string
			got, want float64
			tol       float64
		}{
			{"VarS", r.VarS, 282.0 / 18, 1e-12},
			{"Z", r.Z, 1.01058, 1e-5},
			{"P", r.P, 0.3122, 1e-4},
			{"Slope", r.Slope, 5.0 / 6, 1e-12},
			{"Intercept", r.Intercept, 1.5, 1e-12},
			{"SlopeLow", r.SlopeLow, tc.low, 1e-5},
			{"SlopeHigh", r.SlopeHigh, tc.high, 1e-5},
		}
		for _, c := range checks {
			if !scalar.EqualWithinAbs(c.got, c.want, c.tol) {
				t.Errorf("alpha %v: %s = %.6f, want %.6f", tc.alpha, c.name, c.got, c.want)
			}
		}
		if r.Direction != NoTrend {
			t.Errorf("alpha %v: direction %v, want no trend (p = 0.31)", tc.alpha, r.Direction)
		}
		if r.HasExact {
			t.Errorf("exact p-value given for a series with tied values")
		}
	}
}

// Hand-counted series with two samples at the same time: t = 1, 2, 2, 3,
// y = 1, 3, 2, 4. Pairs: (1,2) +, (1,3) +, (1,4) +, (2,3) equal times 0,
// (2,4) +, (3,4) +, so S = 5. One group of 2 tied times, no tied values:
// Var(S) = [4*3*13 - 2*1*9]/18 = 138/18 = 7.66667 (the cross terms vanish
// without tied values). Z = 4/sqrt(7.66667) = 1.44463. Slopes of the five
// pairs with distinct times: 2, 1, 3/2, 1, 2; median 1.5. Intercept:
// median(y) = 2.5, median(t) = 2, so 2.5 - 1.5*2 = -0.5.
func TestHandCountedTiedTimes(t *testing.T) {
	r, err := Analyze([]float64{1, 2, 2, 3}, []float64{1, 3, 2, 4}, 0.05)
	if err != nil {
		t.Fatal(err)
	}
	if r.S != 5 {
		t.Errorf("S = %d, want 5", r.S)
	}
	for _, c := range []struct {
		name      string
		got, want float64
	}{
		{"VarS", r.VarS, 138.0 / 18}, {"Z", r.Z, 1.44463}, {"Slope", r.Slope, 1.5}, {"Intercept", r.Intercept, -0.5},
	} {
		if !scalar.EqualWithinAbs(c.got, c.want, 1e-5) {
			t.Errorf("%s = %.6f, want %.6f", c.name, c.got, c.want)
		}
	}
}

// The null variance of S is the mean of S^2 over all equally likely
// assignments of the values to the times (the mean of S is 0). Complete
// enumeration therefore checks the tie-corrected formula, including the
// cross terms for tied times, without using it.
func TestVarianceByEnumeration(t *testing.T) {
	cases := []struct {
		name   string
		times  []float64
		values []float64
	}{
		{"no ties", []float64{1, 2, 3, 4, 5, 6}, []float64{3, 1, 4, 1.5, 5, 9}},
		{"tied values", []float64{1, 2, 3, 4, 5, 6}, []float64{1, 1, 2, 2, 2, 3}},
		{"tied times", []float64{1, 1, 2, 3, 3, 3}, []float64{1, 2, 3, 4, 5, 6}},
		{"both tied", []float64{1, 1, 2, 3, 3, 4, 4}, []float64{5, 5, 6, 7, 7, 7, 8}},
	}
	for _, tc := range cases {
		r, err := Analyze(tc.times, tc.values, 0.05)
		if err != nil {
			t.Fatal(err)
		}
		var sum2, n float64
		permute(tc.values, func(p []float64) {
			s := float64(kendallS(tc.times, p))
			sum2 += s * s
			n++
		})
		if want := sum2 / n; !scalar.EqualWithinAbsOrRel(r.VarS, want, 1e-9, 1e-12) {
			t.Errorf("%s: VarS = %v, enumeration gives %v", tc.name, r.VarS, want)
		}
	}
}

// The exact p-value equals the share of all n! orderings with |S| at least
// as large, doubled (capped at 1); and for n = 4 rising steadily it is
// 2/24 (one ordering in 24 gives S = 6; Kendall's table gives 0.042 for
// the one-sided probability, from memory).
func TestExactP(t *testing.T) {
	r, err := Analyze([]float64{1, 2, 3, 4}, []float64{1, 2, 3, 4}, 0.05)
	if err != nil {
		t.Fatal(err)
	}
	if !r.HasExact || !scalar.EqualWithinAbs(r.PExact, 2.0/24, 1e-12) {
		t.Errorf("n=4 rising: HasExact %v, PExact %v, want 2/24", r.HasExact, r.PExact)
	}
	rng := rand.New(rand.NewPCG(3, 1))
	for n := 4; n <= 7; n++ {
		times := make([]float64, n)
		base := make([]float64, n)
		for i := range times {
			times[i] = float64(i)
			base[i] = float64(i)
		}
		var all []int
		permute(base, func(p []float64) { all = append(all, kendallS(times, p)) })
		for trial := 0; trial < 5; trial++ {
			values := append([]float64(nil), base...)
			rng.Shuffle(n, func(i, j int) { values[i], values[j] = values[j], values[i] })
			s := kendallS(times, values)
			count := 0
			for _, q := range all {
				if q >= abs(s) {
					count++
				}
			}
			want := math.Min(1, 2*float64(count)/float64(len(all)))
			if got := exactP(n, s); !scalar.EqualWithinAbs(got, want, 1e-12) {
				t.Errorf("n=%d S=%d: exact p %v, enumeration %v", n, s, got, want)
			}
		}
	}
}

func abs(v int) int {
	if v < 0 {
		return -v
	}
	return v
}

// permute calls f with every ordering of v (Heap's algorithm).
func permute(v []float64, f func([]float64)) {
	a := append([]float64(nil), v...)
	var gen func(k int)
	gen = func(k int) {
		if k == 1 {
			f(a)
			return
		}
		for i := 0; i < k-1; i++ {
			gen(k - 1)
			if k%2 == 0 {
				a[i], a[k-1] = a[k-1], a[i]
			} else {
				a[0], a[k-1] = a[k-1], a[0]
			}
		}
		gen(k - 1)
	}
	gen(len(a))
}

func TestProperties(t *testing.T) {
	rng := rand.New(rand.NewPCG(11, 2))
	for trial := 0; trial < 50; trial++ {
		n := 4 + rng.IntN(30)
		times := make([]float64, n)
		values := make([]float64, n)
		for i := range times {
			times[i] = 2000 + float64(i)*0.5 + 0.2*rng.Float64()
			values[i] = math.Round(10*rng.NormFloat64()) / 10 // rounding makes ties
		}
		r, err := Analyze(times, values, 0.05)
		if err != nil {
			t.Fatal(err)
		}
		// Values in reverse time order: S and Z change sign.
		rev := make([]float64, n)
		for i := range values {
			rev[i] = values[n-1-i]
		}
		rr, err := Analyze(times, rev, 0.05)
		if err != nil {
			t.Fatal(err)
		}
		if rr.S != -r.S || !scalar.EqualWithinAbs(rr.Z, -r.Z, 1e-12) || !scalar.EqualWithinAbs(rr.VarS, r.VarS, 1e-9) {
			t.Errorf("reversed: S %d Z %v, original S %d Z %v", rr.S, rr.Z, r.S, r.Z)
		}
		// A constant added to the values changes neither S nor its variance
		// and moves the intercept only.
		shifted := make([]float64, n)
		for i := range values {
			shifted[i] = values[i] + 0.25 // exact in binary, so ties survive
		}
		rs, err := Analyze(times, shifted, 0.05)
		if err != nil {
			t.Fatal(err)
		}
		if rs.S != r.S || rs.VarS != r.VarS || !scalar.EqualWithinAbs(rs.Slope, r.Slope, 1e-9) ||
			!scalar.EqualWithinAbs(rs.Intercept, r.Intercept+0.25, 1e-9) {
			t.Errorf("shifted: S %d slope %v intercept %v; original S %d slope %v intercept %v", rs.S, rs.Slope, rs.Intercept, r.S, r.Slope, r.Intercept)
		}
		// Input order does not matter.
		perm := rng.Perm(n)
		pt, pv := make([]float64, n), make([]float64, n)
		for i, k := range perm {
			pt[i], pv[i] = times[k], values[k]
		}
		rp, err := Analyze(pt, pv, 0.05)
		if err != nil {
			t.Fatal(err)
		}
		if rp != r {
			t.Errorf("shuffled input gives %+v, want %+v", rp, r)
		}
		// The interval holds the slope, and p is a probability.
		if !(r.SlopeLow <= r.Slope && r.Slope <= r.SlopeHigh) || !(r.P >= 0 && r.P <= 1) {
			t.Errorf("slope %v outside [%v, %v] or p %v", r.Slope, r.SlopeLow, r.SlopeHigh, r.P)
		}
	}
}

// A strictly increasing series has every pair concordant: S = n(n-1)/2,
// and a significant increase; the slope of an exact line is exact and so
// are both interval limits.
func TestStrictlyIncreasingLine(t *testing.T) {
	for _, n := range []int{4, 5, 10, 11, 40} {
		times := make([]float64, n)
		values := make([]float64, n)
		for i := range times {
			times[i] = 1992 + 1.5*float64(i)
			values[i] = -0.8 + 0.04*(times[i]-1992)
		}
		r, err := Analyze(times, values, 0.05)
		if err != nil {
			t.Fatal(err)
		}
		if r.S != n*(n-1)/2 {
			t.Errorf("n=%d: S = %d, want %d", n, r.S, n*(n-1)/2)
		}
		for name, v := range map[string]float64{"slope": r.Slope, "low": r.SlopeLow, "high": r.SlopeHigh} {
			if !scalar.EqualWithinAbs(v, 0.04, 1e-12) {
				t.Errorf("n=%d: %s = %v, want 0.04", n, name, v)
			}
		}
		if !scalar.EqualWithinAbs(r.Intercept, -0.8-0.04*1992, 1e-9) {
			t.Errorf("n=%d: intercept %v", n, r.Intercept)
		}
		if n >= 5 && r.Direction != Increasing {
			// n = 4 cannot reach p < 0.05 (exact 0.083; normal 0.089).
			t.Errorf("n=%d: direction %v, p %v", n, r.Direction, r.P)
		}
	}
}

func TestDecreasing(t *testing.T) {
	r, err := Analyze([]float64{1, 2, 3, 4, 5, 6, 7, 8}, []float64{0.9, 0.7, 0.8, 0.4, 0.3, 0.1, -0.2, -0.1}, 0.05)
	if err != nil {
		t.Fatal(err)
	}
	if r.Direction != Decreasing || r.Direction.String() != "decreasing" || r.Slope >= 0 {
		t.Errorf("direction %v slope %v S %d p %v", r.Direction, r.Slope, r.S, r.P)
	}
}

// All values equal: no information, VarS = 0; Z, P and the slope stay
// finite.
func TestConstantSeries(t *testing.T) {
	r, err := Analyze([]float64{1, 2, 3, 4, 5}, []float64{0.2, 0.2, 0.2, 0.2, 0.2}, 0.05)
	if err != nil {
		t.Fatal(err)
	}
	if r.S != 0 || r.VarS != 0 || r.Z != 0 || r.P != 1 || r.Slope != 0 || r.SlopeLow != 0 || r.SlopeHigh != 0 || r.Direction != NoTrend {
		t.Errorf("constant series: %+v", r)
	}
}

func TestRejects(t *testing.T) {
	nan, inf := math.NaN(), math.Inf(1)
	cases := []struct {
		name          string
		times, values []float64
		alpha         float64
		want          error
	}{
		{"three points", []float64{1, 2, 3}, []float64{1, 2, 3}, 0.05, ErrTooFew},
		{"empty", nil, nil, 0.05, ErrTooFew},
		{"one time", []float64{2, 2, 2, 2}, []float64{1, 2, 3, 4}, 0.05, ErrTooFew},
		{"NaN value", []float64{1, 2, 3, 4}, []float64{1, nan, 3, 4}, 0.05, ErrInput},
		{"NaN time", []float64{1, nan, 3, 4}, []float64{1, 2, 3, 4}, 0.05, ErrInput},
		{"Inf value", []float64{1, 2, 3, 4}, []float64{1, 2, inf, 4}, 0.05, ErrInput},
		{"lengths", []float64{1, 2, 3, 4}, []float64{1, 2, 3}, 0.05, ErrInput},
		{"alpha 0", []float64{1, 2, 3, 4}, []float64{1, 2, 3, 4}, 0, ErrInput},
		{"alpha 1", []float64{1, 2, 3, 4}, []float64{1, 2, 3, 4}, 1, ErrInput},
		{"alpha NaN", []float64{1, 2, 3, 4}, []float64{1, 2, 3, 4}, nan, ErrInput},
	}
	for _, tc := range cases {
		_, err := Analyze(tc.times, tc.values, tc.alpha)
		if !errors.Is(err, tc.want) {
			t.Errorf("%s: error %v, want %v", tc.name, err, tc.want)
		}
	}
}
