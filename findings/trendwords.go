package findings

import (
	"gwsat.dev/gwsat/trend"
)

// trendSummary words the SI trends of a mineral at a group's wells.
func trendSummary(mineral string, wells []string, trends []Trend) string {
	in := map[string]bool{}
	for _, w := range wells {
		in[w] = true
	}
	var rising, falling []string
	tested, tooFew, most := 0, 0, 0
	for _, t := range trends {
		if t.Mineral != mineral || !in[t.Well] {
			continue
		}
		switch t.State {
		case TrendTested:
			tested++
			switch t.Result.Direction {
			case trend.Increasing:
				rising = append(rising, t.Well)
			case trend.Decreasing:
				falling = append(falling, t.Well)
			}
		case TrendTooFew:
			tooFew++
			most = max(most, t.Events)
		}
	}
	switch {
	case tested == 0 && tooFew > 0:
		return "too few events for a trend test (at most " + itoa(most) + " per well; " + itoa(MinEvents) + " needed)"
	case tested == 0:
		return "no dates or sampling rounds to test"
	}
	s := ""
	if len(rising) > 0 {
		s = "rising at " + short(rising)
	}
	if len(falling) > 0 {
		if s != "" {
			s += ", "
		}
		s += "falling at " + short(falling)
	}
	if s == "" {
		s = "no significant trend"
	}
	s += " (" + itoa(tested) + " " + plural(tested, "well", "wells") + " tested"
	if tooFew > 0 {
		s += ", " + itoa(tooFew) + " with too few events"
	}
	return s + ")"
}

// short lists up to six names, then how many more.
func short(names []string) string {
	if len(names) <= 6 {
		return list(names)
	}
	return list(append(append([]string(nil), names[:6]...), itoa(len(names)-6)+" more"))
}
