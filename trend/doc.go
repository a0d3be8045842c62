// Package trend tests one series of (time, value) pairs for a monotonic
// trend and estimates its rate, without assuming a distribution: the
// Mann-Kendall test (Mann 1945, Econometrica 13, 245-259; Kendall 1975,
// Rank Correlation Methods, 4th ed.) and the Sen slope (Sen 1968, J. Am.
// Stat. Assoc. 63, 1379-1389), as presented for water-quality records by
// Helsel & Hirsch (2002, Statistical Methods in Water Resources, USGS TWRI
// 4-A3, ch. 8 and 10) and Gilbert (1987, Statistical Methods for
// Environmental Pollution Monitoring, ch. 16). Citations of chapters are
// from memory.
//
// A typical series is a mineral's saturation index at one well against
// decimal years or sampling round. [Analyze] returns a [Result]: the
// Mann-Kendall statistic S, its variance corrected for ties, the
// continuity-corrected normal score Z, the two-sided p-value, for short
// untied series the exact p-value, the Sen slope with its rank-based
// confidence interval and Conover's intercept, and a [Direction] at the
// chosen significance level.
//
// # Ties
//
// Tied values contribute nothing to S and reduce its variance by the usual
// correction, Var(S) = [n(n-1)(2n+5) - sum_u u(u-1)(2u+5)]/18 for groups
// of u tied values. Two samples taken at the same time (duplicates, or a
// coarse time scale such as the sampling round) are kept, not averaged: a
// pair with equal times has no order, so it contributes nothing to S and
// gives no slope, and Var(S) becomes Kendall's variance for ties in both
// variables (Kendall 1975, ch. 4, from memory), which reduces to the
// formula above when no two times are equal. Averaging duplicates first is
// the caller's choice.
//
// # Limits
//
// At least [MinPoints] points and two distinct times are needed
// ([ErrTooFew]); NaN or infinite input is rejected ([ErrInput]). The normal
// approximation of the p-value is coarse below about ten points, which is
// why the exact p-value is also given there when no values or times are
// tied. Serial correlation (seasonality, closely spaced samples) makes the
// p-value too small; this package does not correct for it.
package trend
