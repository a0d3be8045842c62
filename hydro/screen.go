package hydro

import (
	"fmt"
	"math"
	"regexp"
	"strings"
)

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
