package trend

// Direction is the outcome of the trend test at a chosen significance
// level.
type Direction int

const (
	// NoTrend means the two-sided p-value is not below the significance
	// level (or S is zero).
	NoTrend Direction = iota
	// Increasing means S > 0 with a p-value below the significance level.
	Increasing
	// Decreasing means S < 0 with a p-value below the significance level.
	Decreasing
)

// String returns "increasing", "decreasing" or "no trend".
func (d Direction) String() string {
	switch d {
	case Increasing:
		return "increasing"
	case Decreasing:
		return "decreasing"
	}
	return "no trend"
}

// Result is the outcome of Analyze for one series. Every field is finite.
type Result struct {
	// N is the number of points.
	N int
	// S is the Mann-Kendall statistic: the number of later-and-higher
	// pairs minus the number of later-and-lower pairs.
	S int
	// VarS is the variance of S under the null hypothesis of no trend,
	// corrected for ties in values and in times.
	VarS float64
	// Z is the continuity-corrected normal score, (S-1)/sqrt(VarS) for
	// S > 0, (S+1)/sqrt(VarS) for S < 0, and 0 when S = 0 or VarS = 0.
	Z float64
	// P is the two-sided p-value from the normal approximation.
	P float64
	// PExact is the exact two-sided p-value from the null distribution of
	// S, set when HasExact is true.
	PExact float64
	// HasExact is true for series of at most MaxExact points with no tied
	// values and no tied times.
	HasExact bool
	// Alpha is the two-sided significance level used for Direction and the
	// slope interval.
	//
	// Direction is decided on P (the normal approximation) even when the
	// exact p-value is available, so that it does not change character at
	// MaxExact points; for n <= 10 callers may prefer PExact.
	Alpha float64
	// Direction is Increasing or Decreasing when P < Alpha.
	Direction Direction
	// Slope is the Sen slope, the median of the slopes between all pairs of
	// points at different times, in value units per time unit.
	Slope float64
	// SlopeLow and SlopeHigh bound the 100(1-Alpha) % confidence interval
	// of the slope.
	SlopeLow, SlopeHigh float64
	// Intercept is Conover's intercept, median(value) - Slope*median(time),
	// so that the line passes through the medians.
	Intercept float64
}
