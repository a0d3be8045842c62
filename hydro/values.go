package hydro

import (
	"errors"
	"fmt"
	"math"
	"regexp"
	"strconv"
	"strings"
	"time"
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

// cell is a parsed concentration cell.
type cell struct {
	missing   bool
	value     float64
	nonDetect bool
	hasDL     bool // value is the detection limit of a non-detect
	greater   bool
	qualifier string
}

var (
	reNDWords   = regexp.MustCompile(`^(nd|n\.d\.?|n\.d|n/d|bdl|bql|blq|<dl|<lod|<mdl|<rl|<loq|<pql|<ql|notdetected|belowdetection|belowdetectionlimit|<detectionlimit|<)$`)
	reNDWithNum = regexp.MustCompile(`^(?:nd|n\.d\.?|bdl|<)\s*[(<]?\s*([0-9.,eE+-]+)\s*\)?$`)
	reNumQual   = regexp.MustCompile(`^([0-9.,eE+-]+)\s*([a-zA-Z]{1,2}\*?)$`)
	missingWord = map[string]bool{"-": true, "--": true, "---": true, "—": true, "n/a": true, "na": true, "nan": true, "nm": true, "ns": true, "notmeasured": true, "notanalysed": true, "notanalyzed": true, "null": true, "none": true, "?": true}
)

// ndQualifiers are qualifier codes meaning "not detected".
var ndQualifiers = map[string]bool{"<": true, "u": true, "nd": true, "bdl": true, "uj": true, "<dl": true, "lt": true, "ul": true}

// parseConcCell reads a concentration cell: a number, a non-detect in one of
// the usual spellings, a ">x", or a number with a qualifier letter.
func parseConcCell(raw string, decComma bool) (cell, error) {
	s := strings.TrimSpace(raw)
	if s == "" {
		return cell{missing: true}, nil
	}
	if plainNumber(s) && strings.ContainsAny(s, "0123456789") {
		v, err := parseNum(s, decComma)
		return cell{value: v}, err
	}
	low := strings.ToLower(s)
	if missingWord[strings.ReplaceAll(low, " ", "")] {
		return cell{missing: true}, nil
	}
	if reNDWords.MatchString(strings.ReplaceAll(low, " ", "")) {
		return cell{nonDetect: true}, nil
	}
	if m := reNDWithNum.FindStringSubmatch(low); m != nil {
		v, err := parseNum(m[1], decComma)
		if err != nil {
			return cell{}, err
		}
		return cell{nonDetect: true, hasDL: true, value: v}, nil
	}
	if strings.HasPrefix(low, ">") {
		v, err := parseNum(low[1:], decComma)
		if err != nil {
			return cell{}, err
		}
		return cell{greater: true, value: v, qualifier: ">"}, nil
	}
	if v, err := parseNum(s, decComma); err == nil {
		return cell{value: v}, nil
	} else if err == errAmbiguous {
		return cell{}, err
	}
	if m := reNumQual.FindStringSubmatch(s); m != nil {
		v, err := parseNum(m[1], decComma)
		if err != nil {
			return cell{}, err
		}
		q := m[2]
		if ndQualifiers[strings.ToLower(q)] {
			return cell{nonDetect: true, hasDL: true, value: v, qualifier: q}, nil
		}
		return cell{value: v, qualifier: q}, nil
	}
	return cell{}, strconv.ErrSyntax
}

var (
	reScreenOK       = regexp.MustCompile(`^[0-9.,\s&;/+\-–—mtoandTOAND()]*$`)
	reScreenNum      = regexp.MustCompile(`\d+(?:\.\d+)?`)
	reScreenNumComma = regexp.MustCompile(`\d+(?:,\d+)?`)
)

// parseScreen reads a free-text screen interval such as "103 - 109",
// "30-35 & 48-53" or "52-58, 60-66 & 90-93". It returns the overall top and
// bottom and how many numbers it saw (more than two: several intervals).
func parseScreen(s string, decComma bool) (top, bottom float64, n int, err error) {
	s = strings.TrimSpace(s)
	if !reScreenOK.MatchString(s) {
		return 0, 0, 0, fmt.Errorf("cannot read screen interval %q", s)
	}
	re := reScreenNum
	if decComma {
		re = reScreenNumComma
	}
	nums := re.FindAllString(s, -1)
	if len(nums) == 0 {
		return 0, 0, 0, fmt.Errorf("no depths in screen interval %q", s)
	}
	top, bottom = math.Inf(1), math.Inf(-1)
	for _, t := range nums {
		v, err := parseNum(t, decComma)
		if err != nil {
			return 0, 0, 0, fmt.Errorf("cannot read screen interval %q", s)
		}
		top = math.Min(top, v)
		bottom = math.Max(bottom, v)
	}
	return top, bottom, len(nums), nil
}

var dateLayouts = []string{
	time.RFC3339, "2006-01-02T15:04:05", "2006-01-02T15:04", "2006-01-02 15:04:05", "2006-01-02 15:04",
	"2006-01-02", "2006/01/02", "2006/01/02 15:04", "02.01.2006", "02.01.2006 15:04", "2.1.2006",
	"2006-1-2", "02-Jan-2006", "2-Jan-2006", "02 Jan 2006", "2 Jan 2006", "Jan 2, 2006", "January 2, 2006",
	"02-Jan-06", "2006",
}

var reSlashDate = regexp.MustCompile(`^(\d{1,2})/(\d{1,2})/(\d{4}|\d{2})(?:\s+(\d{1,2}):(\d{2})(?::(\d{2}))?)?$`)

// dateOrder is the order of slash dates in a file: 'd' (day/month), 'm'
// (month/day) or 0 (undecided).
func slashOrder(s string) byte {
	m := reSlashDate.FindStringSubmatch(strings.TrimSpace(s))
	if m == nil {
		return 0
	}
	a, _ := strconv.Atoi(m[1])
	b, _ := strconv.Atoi(m[2])
	switch {
	case a > 12 && b <= 12:
		return 'd'
	case b > 12 && a <= 12:
		return 'm'
	}
	return 0
}

// parseDate reads a sampling date or date-time. Slash dates follow order
// ('d' day first, 'm' month first); when order is 0 they are ambiguous.
func parseDate(s string, order byte) (time.Time, error) {
	s = strings.TrimSpace(s)
	for _, l := range dateLayouts {
		if t, err := time.Parse(l, s); err == nil {
			return t, nil
		}
	}
	if m := reSlashDate.FindStringSubmatch(s); m != nil {
		if order == 0 {
			return time.Time{}, fmt.Errorf("ambiguous date %q (day/month or month/day?): write it as YYYY-MM-DD", s)
		}
		a, _ := strconv.Atoi(m[1])
		b, _ := strconv.Atoi(m[2])
		y, _ := strconv.Atoi(m[3])
		if len(m[3]) == 2 {
			y += 2000
			if y > time.Now().Year()+1 {
				y -= 100
			}
		}
		d, mo := a, b
		if order == 'm' {
			d, mo = b, a
		}
		hh, _ := strconv.Atoi(m[4])
		mm, _ := strconv.Atoi(m[5])
		ss, _ := strconv.Atoi(m[6])
		t := time.Date(y, time.Month(mo), d, hh, mm, ss, 0, time.UTC)
		if t.Day() != d || int(t.Month()) != mo || hh > 23 || mm > 59 || ss > 59 {
			return time.Time{}, fmt.Errorf("invalid date %q", s)
		}
		return t, nil
	}
	return time.Time{}, fmt.Errorf("cannot read date %q", s)
}
