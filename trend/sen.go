package trend

import (
	"math"
	"sort"

	"gonum.org/v1/gonum/stat/distuv"
)

// senSlope returns the Sen (1968) slope of y against t (t sorted), the
// median of (y_j - y_i)/(t_j - t_i) over all pairs with t_j > t_i, and its
// 100(1-alpha) % confidence interval. The interval is the rank-based one
// given by Gilbert (1987, section 16.5, from memory) and Helsel & Hirsch
// (2002, section 10.1, from memory): with N' ordered slopes and
// C = z_{1-alpha/2} sqrt(Var(S)), the lower limit is the slope of rank
// (N' - C)/2 and the upper limit the slope of rank (N' + C)/2 + 1.
// Fractional ranks are interpolated linearly between neighbouring slopes
// and ranks are clamped to [1, N'] (common practice). At least one pair
// must have distinct times.
func senSlope(t, y []float64, varS, alpha float64) (slope, low, high float64) {
	var d []float64
	for i := range t {
		for j := i + 1; j < len(t); j++ {
			if t[j] > t[i] {
				d = append(d, (y[j]-y[i])/(t[j]-t[i]))
			}
		}
	}
	sort.Float64s(d)
	slope = medianSorted(d)
	nd := float64(len(d))
	c := distuv.UnitNormal.Quantile(1-alpha/2) * math.Sqrt(varS)
	low = rankValue(d, (nd-c)/2)
	high = rankValue(d, (nd+c)/2+1)
	return slope, low, high
}

// rankValue returns the order statistic of rank r (1-based, possibly
// fractional) of sorted s, interpolating linearly between neighbours and
// clamping r to [1, len(s)].
func rankValue(s []float64, r float64) float64 {
	n := float64(len(s))
	r = math.Max(1, math.Min(n, r))
	lo := math.Floor(r)
	i := int(lo) - 1
	if i >= len(s)-1 {
		return s[len(s)-1]
	}
	f := r - lo
	return s[i] + f*(s[i+1]-s[i])
}

func medianSorted(s []float64) float64 {
	n := len(s)
	if n%2 == 1 {
		return s[n/2]
	}
	return (s[n/2-1] + s[n/2]) / 2
}

func median(v []float64) float64 {
	s := append([]float64(nil), v...)
	sort.Float64s(s)
	return medianSorted(s)
}
