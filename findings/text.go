package findings

import (
	"strconv"
	"strings"

	"gwsat.dev/gwsat/report"
)

func itoa(i int) string { return strconv.Itoa(i) }

// num formats v with prec decimals ("" never: non-finite values are not
// passed here).
func num(v float64, prec int) string { return report.Num(v, prec) }

// signed formats v with an explicit sign ("+0.05", "-0.10").
func signed(v float64, prec int) string {
	s := report.Num(v, prec)
	if !strings.HasPrefix(s, "-") {
		s = "+" + s
	}
	return s
}

// list joins words as a reader writes them: "a", "a and b", "a, b and c".
func list(words []string) string {
	switch len(words) {
	case 0:
		return ""
	case 1:
		return words[0]
	}
	return strings.Join(words[:len(words)-1], ", ") + " and " + words[len(words)-1]
}

// plural picks the word for a count.
func plural(n int, one, many string) string {
	if n == 1 {
		return one
	}
	return many
}
