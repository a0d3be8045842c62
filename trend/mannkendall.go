package trend

import (
	"fmt"
	"math"
	"sort"
)

// Analyze runs the Mann-Kendall test on values observed at times and
// estimates the Sen slope, with a two-sided significance level alpha (for
// example 0.05) for the Direction and the slope's confidence interval.
//
// times and values must have the same length of at least MinPoints, hold
// only finite numbers and span at least two distinct times; the order of
// the pairs does not matter. Pairs at equal times count as ties (see the
// package documentation). Time and memory grow as n^2 (all pairs are
// kept for the slope), which suits series of up to a few thousand points.
func Analyze(times, values []float64, alpha float64) (Result, error) {
	if len(times) != len(values) {
		return Result{}, fmt.Errorf("%w: %d times but %d values", ErrInput, len(times), len(values))
	}
	if !(alpha > 0 && alpha < 1) {
		return Result{}, fmt.Errorf("%w: significance level %v outside (0, 1)", ErrInput, alpha)
	}
	n := len(times)
	if n < MinPoints {
		return Result{}, fmt.Errorf("%w: %d point(s), need at least %d", ErrTooFew, n, MinPoints)
	}
	for i := range times {
		if !finite(times[i]) || !finite(values[i]) {
			return Result{}, fmt.Errorf("%w: point %d (time %v, value %v) is not finite", ErrInput, i+1, times[i], values[i])
		}
	}
	t, y := sortedByTime(times, values)
	if t[0] == t[n-1] {
		return Result{}, fmt.Errorf("%w: all %d points share the time %v, need two distinct times", ErrTooFew, n, t[0])
	}

	r := Result{N: n, Alpha: alpha}
	r.S = kendallS(t, y)
	r.VarS = varianceS(n, tieGroups(t), tieGroups(y))
	r.Z = normalScore(r.S, r.VarS)
	r.P = math.Erfc(math.Abs(r.Z) / math.Sqrt2)
	if n <= MaxExact && !hasTies(t) && !hasTies(y) {
		r.PExact, r.HasExact = exactP(n, r.S), true
	}
	if r.P < alpha {
		switch {
		case r.S > 0:
			r.Direction = Increasing
		case r.S < 0:
			r.Direction = Decreasing
		}
	}
	r.Slope, r.SlopeLow, r.SlopeHigh = senSlope(t, y, r.VarS, alpha)
	r.Intercept = median(y) - r.Slope*median(t)
	return r, nil
}

func finite(v float64) bool { return !math.IsNaN(v) && !math.IsInf(v, 0) }

// sortedByTime returns copies of times and values ordered by time (stable,
// so points at equal times keep their input order).
func sortedByTime(times, values []float64) (t, y []float64) {
	idx := make([]int, len(times))
	for i := range idx {
		idx[i] = i
	}
	sort.SliceStable(idx, func(a, b int) bool { return times[idx[a]] < times[idx[b]] })
	t = make([]float64, len(idx))
	y = make([]float64, len(idx))
	for k, i := range idx {
		t[k], y[k] = times[i], values[i]
	}
	return t, y
}

func sign(v float64) int {
	switch {
	case v > 0:
		return 1
	case v < 0:
		return -1
	}
	return 0
}

// kendallS is the sum over pairs i < j of sgn(t_j - t_i) sgn(y_j - y_i);
// with t sorted the first factor is 1, or 0 for equal times.
func kendallS(t, y []float64) int {
	s := 0
	for i := range t {
		for j := i + 1; j < len(t); j++ {
			s += sign(t[j]-t[i]) * sign(y[j]-y[i])
		}
	}
	return s
}

// tieGroups returns the sizes of the groups of equal values (size >= 2).
func tieGroups(v []float64) []int {
	s := append([]float64(nil), v...)
	sort.Float64s(s)
	var g []int
	for i := 0; i < len(s); {
		j := i + 1
		for j < len(s) && s[j] == s[i] {
			j++
		}
		if j-i > 1 {
			g = append(g, j-i)
		}
		i = j
	}
	return g
}

func hasTies(v []float64) bool { return len(tieGroups(v)) > 0 }

// varianceS is the null variance of S with ties in both variables (Kendall
// 1975, Rank Correlation Methods, ch. 4, from memory):
//
//	Var(S) = [n(n-1)(2n+5) - sum_t t(t-1)(2t+5) - sum_u u(u-1)(2u+5)]/18
//	       + [sum_t t(t-1)(t-2)][sum_u u(u-1)(u-2)] / [9n(n-1)(n-2)]
//	       + [sum_t t(t-1)][sum_u u(u-1)] / [2n(n-1)]
//
// where t runs over groups of tied times and u over groups of tied values.
// Without tied times the last two terms vanish and it is the usual
// Mann-Kendall variance with the tie correction.
func varianceS(n int, timeTies, valueTies []int) float64 {
	sums := func(g []int) (a, b, c float64) {
		for _, k := range g {
			f := float64(k)
			a += f * (f - 1) * (2*f + 5)
			b += f * (f - 1) * (f - 2)
			c += f * (f - 1)
		}
		return a, b, c
	}
	ta, tb, tc := sums(timeTies)
	ua, ub, uc := sums(valueTies)
	fn := float64(n)
	v := (fn*(fn-1)*(2*fn+5) - ta - ua) / 18
	v += tb * ub / (9 * fn * (fn - 1) * (fn - 2))
	v += tc * uc / (2 * fn * (fn - 1))
	if v < 0 { // only by rounding; S is then 0 as well
		v = 0
	}
	return v
}

// normalScore is the continuity-corrected Z of the Mann-Kendall test.
func normalScore(s int, varS float64) float64 {
	if varS <= 0 {
		return 0
	}
	sd := math.Sqrt(varS)
	switch {
	case s > 0:
		return float64(s-1) / sd
	case s < 0:
		return float64(s+1) / sd
	}
	return 0
}
