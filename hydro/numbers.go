package hydro

import (
	"errors"
	"math"
	"regexp"
	"strconv"
	"strings"
)

var (
	rePointNum = regexp.MustCompile(`^[+-]?(\d+|\d{1,3}(,\d{3})+)?(\.\d*)?([eE][+-]?\d+)?$`)
	reCommaNum = regexp.MustCompile(`^[+-]?(\d+|\d{1,3}(\.\d{3})+)?(,\d*)?([eE][+-]?\d+)?$`)
	reThousand = regexp.MustCompile(`^[+-]?\d{1,3}(,\d{3})+$`)
)

var errAmbiguous = errors.New("ambiguous number")

// cleanSpaces removes ordinary, non-breaking and thin spaces.
func cleanSpaces(s string) string {
	return strings.Map(func(r rune) rune {
		switch r {
		case ' ', '\t', '\u00a0', '\u2009', '\u202f':
			return -1
		}
		return r
	}, s)
}

// parseNum parses a number written with a decimal point (decComma false)
// or a decimal comma. Thousands separators are accepted only in their
// unambiguous form ("1,234.5"; "1.234,5"). A lone "1,234" in a
// decimal-point file is refused as ambiguous. NaN and Inf are refused.
func parseNum(s string, decComma bool) (float64, error) {
	s = cleanSpaces(s)
	s = strings.Replace(s, "\u2212", "-", 1) // minus sign
	if s == "" || s == "+" || s == "-" || s == "." || s == "," {
		return 0, strconv.ErrSyntax
	}
	if plainNumber(s) {
		v, err := strconv.ParseFloat(s, 64)
		if err != nil || math.IsNaN(v) || math.IsInf(v, 0) {
			return 0, strconv.ErrSyntax
		}
		return v, nil
	}
	var t string
	if !decComma {
		switch {
		case rePointNum.MatchString(s):
			if reThousand.MatchString(s) {
				return 0, errAmbiguous
			}
			t = strings.ReplaceAll(s, ",", "")
		case reCommaNum.MatchString(s) && !strings.Contains(s, "."):
			// "1,5" in a decimal-point file can only be a decimal comma.
			t = strings.Replace(s, ",", ".", 1)
		default:
			return 0, strconv.ErrSyntax
		}
	} else {
		switch {
		case reCommaNum.MatchString(s) && strings.Contains(s, ","):
			t = strings.Replace(strings.ReplaceAll(s, ".", ""), ",", ".", 1)
		case rePointNum.MatchString(s) && !strings.Contains(s, ","):
			// no comma: a dot is a decimal point ("1.5" in a mixed file)
			t = s
		default:
			return 0, strconv.ErrSyntax
		}
	}
	if strings.Trim(t, "+-.eE") == "" {
		return 0, strconv.ErrSyntax
	}
	v, err := strconv.ParseFloat(t, 64)
	if err != nil {
		return 0, strconv.ErrSyntax
	}
	if math.IsNaN(v) || math.IsInf(v, 0) {
		return 0, strconv.ErrRange
	}
	return v, nil
}

// plainNumber says whether s has only digits, '.', signs and exponent
// marks (no separators to decide on).
func plainNumber(s string) bool {
	for i := 0; i < len(s); i++ {
		c := s[i]
		if !(c >= '0' && c <= '9' || c == '.' || c == '-' || c == '+' || c == 'e' || c == 'E') {
			return false
		}
	}
	return true
}
