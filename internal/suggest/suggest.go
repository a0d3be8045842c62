// Package suggest finds the nearest of a list of names to a misspelt one, for
// "did you mean" hints in messages.
package suggest

import "strings"

// Closest returns the candidate nearest to name by edit distance (Levenshtein
// 1966, compared without regard to case), or "" when none is within a third of
// the name's length (at least 2 edits; common practice for spelling hints).
func Closest(name string, candidates []string) string {
	n := strings.ToLower(name)
	best, bestD := "", -1
	for _, c := range candidates {
		d := distance(n, strings.ToLower(c))
		if bestD < 0 || d < bestD {
			best, bestD = c, d
		}
	}
	limit := max(2, len([]rune(name))/3)
	if bestD < 0 || bestD > limit {
		return ""
	}
	return best
}

// Hint returns " (did you mean X?)" for the closest candidate, or "".
func Hint(name string, candidates []string) string {
	if c := Closest(name, candidates); c != "" {
		return " (did you mean " + c + "?)"
	}
	return ""
}

// distance is the Levenshtein edit distance between a and b, in runes.
func distance(a, b string) int {
	ra, rb := []rune(a), []rune(b)
	if len(ra) > 256 || len(rb) > 256 {
		// Long text is never a misspelt name; keep the cost bounded.
		return max(len(ra), len(rb))
	}
	prev := make([]int, len(rb)+1)
	cur := make([]int, len(rb)+1)
	for j := range prev {
		prev[j] = j
	}
	for i := 1; i <= len(ra); i++ {
		cur[0] = i
		for j := 1; j <= len(rb); j++ {
			cost := 1
			if ra[i-1] == rb[j-1] {
				cost = 0
			}
			cur[j] = min(prev[j]+1, cur[j-1]+1, prev[j-1]+cost)
		}
		prev, cur = cur, prev
	}
	return prev[len(rb)]
}
