package trend

import "errors"

// MinPoints is the smallest series Analyze accepts. The smallest
// two-sided p-value n untied points can reach is 2/n! (all n! orderings
// equally likely under no trend): 0.33 for n = 3, so no test is possible,
// and 0.083 for n = 4, so four points can show a trend only at a
// significance level above 0.083. Longer records (eight to ten values or
// more) are common practice for trend statements.
const MinPoints = 4

var (
	// ErrTooFew reports a series shorter than MinPoints or with fewer than
	// two distinct times.
	ErrTooFew = errors.New("trend: too few points")
	// ErrInput reports malformed input: NaN or infinite values, slices of
	// different lengths, or a significance level outside (0, 1).
	ErrInput = errors.New("trend: invalid input")
)
