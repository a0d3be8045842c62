package trend

import "errors"

// MinPoints is the smallest series Analyze accepts. With fewer points the
// smallest two-sided p-value the test can reach exceeds 0.05 (n = 4 gives
// an exact minimum of 2/24 = 0.083, Kendall's null distribution), so the
// answer would always be "no trend".
const MinPoints = 4

var (
	// ErrTooFew reports a series shorter than MinPoints or with fewer than
	// two distinct times.
	ErrTooFew = errors.New("trend: too few points")
	// ErrInput reports malformed input: NaN or infinite values, slices of
	// different lengths, or a significance level outside (0, 1).
	ErrInput = errors.New("trend: invalid input")
)
