package trend

import "math"

// MaxExact is the longest series for which Analyze gives the exact
// p-value. Kendall's own tables stop at n = 10 (from memory); the normal
// approximation is adequate beyond.
const MaxExact = 10

// exactP is the exact two-sided p-value of S for n points without ties,
// min(1, 2 P(S' >= |S|)) under the null hypothesis that all n! orders are
// equally likely. S = n(n-1)/2 - 2k for an order with k inversions, and the
// number of permutations of n with k inversions follows the recurrence
// I(n, k) = sum_{j=0}^{min(k, n-1)} I(n-1, k-j) (Mahonian numbers).
func exactP(n, s int) float64 {
	m := n * (n - 1) / 2
	counts := []float64{1} // permutations of 1 element
	for k := 2; k <= n; k++ {
		next := make([]float64, len(counts)+k-1)
		for inv, c := range counts {
			for j := 0; j < k; j++ {
				next[inv+j] += c
			}
		}
		counts = next
	}
	total := 0.0
	for _, c := range counts {
		total += c
	}
	// S' >= |S| means k <= (m - |S|)/2.
	a := s
	if a < 0 {
		a = -a
	}
	upper := 0.0
	for k := 0; k <= (m-a)/2 && k < len(counts); k++ {
		upper += counts[k]
	}
	return math.Min(1, 2*upper/total)
}
