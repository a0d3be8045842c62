package uncertainty

import (
	"math"

	"gwsat.dev/gwsat/assess"
	"gwsat.dev/gwsat/report"
)

// Verdict is the saturation state an interval supports.
type Verdict string

// Verdicts (see the package documentation for the rule).
const (
	Supersaturated Verdict = assess.Supersaturated
	Undersaturated Verdict = assess.Undersaturated
	Indeterminate  Verdict = "indeterminate"
)

// Interval is the SI of one mineral with its uncertainty.
type Interval struct {
	Mineral string
	// Best is the SI of the water as measured; Low and High bound the
	// interval (percentiles, or best -/+ z SD for the linear estimate).
	Best, Low, High float64
	// LowOpen is set when a non-detect of one of the mineral's ions spans
	// down to zero: the interval has no lower bound and Low is not one.
	LowOpen bool
	// SD is the standard deviation of the SI: of the draws (Monte Carlo) or
	// from the sensitivities (linear, non-detects left out).
	SD      float64
	Verdict Verdict
	// Sensitivity holds, for the linear estimate, dSI/dx for each input of
	// the case, in its order (0 for a non-detect); nil for Monte Carlo.
	Sensitivity []float64
}

// verdict applies the rule of the package documentation.
func verdict(low, high float64, lowOpen bool, band float64) Verdict {
	switch {
	case !lowOpen && low > band:
		return Supersaturated
	case high < -band:
		return Undersaturated
	}
	return Indeterminate
}

// FormatLow prints the lower end for a table: "unbounded" when the interval
// is open at the bottom, else the value with prec decimals.
func (iv Interval) FormatLow(prec int) string {
	if iv.LowOpen {
		return "unbounded"
	}
	return report.Num(iv.Low, prec)
}

// quantile returns the p-quantile of sorted x by linear interpolation
// between order statistics (Hyndman & Fan 1996, type 7, from memory).
func quantile(x []float64, p float64) float64 {
	n := len(x)
	if n == 1 {
		return x[0]
	}
	h := float64(n-1) * p
	lo := int(math.Floor(h))
	if lo >= n-1 {
		return x[n-1]
	}
	return x[lo] + (h-float64(lo))*(x[lo+1]-x[lo])
}

// meanSD returns the mean and sample standard deviation of x.
func meanSD(x []float64) (mean, sd float64) {
	for _, v := range x {
		mean += v
	}
	mean /= float64(len(x))
	var ss float64
	for _, v := range x {
		ss += (v - mean) * (v - mean)
	}
	if len(x) > 1 {
		sd = math.Sqrt(ss / float64(len(x)-1))
	}
	return mean, sd
}
