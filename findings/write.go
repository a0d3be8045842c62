package findings

import (
	"fmt"
	"io"
	"slices"
	"strings"

	"gwsat.dev/gwsat/report"
	"gwsat.dev/gwsat/uncertainty"
)

// SlowMinerals are minerals that groundwater is often supersaturated with
// but that do not form at aquifer temperatures on the time scales of a
// monitoring programme (quartz, and the ordered Mg carbonates dolomite and
// magnesite; from memory, e.g. Appelo & Postma 2005, Geochemistry,
// Groundwater and Pollution, 2nd ed., ch. 5 and 9). Their supersaturation
// is reported in one line apart.
var SlowMinerals = []string{"quartz", "dolomite", "magnesite"}

// where words a row's place: "cluster A at 108-128 m depth"; without a
// cluster, the depth zone, or else the wells (with their sample type when
// they share one: "injectate well IW-1").
func (r *Row) where() string {
	switch {
	case r.Cluster != "" && r.Zone == NoDepthZone:
		return "cluster " + r.Cluster
	case r.Cluster != "":
		return "cluster " + r.Cluster + " at " + r.Zone
	case r.Zone != NoDepthZone:
		return "the " + r.Zone + " zone"
	}
	w := plural(len(r.Wells), "well ", "wells ") + short(r.Wells)
	if len(r.Types) == 1 {
		w = r.Types[0] + " " + w
	}
	return w
}

// counts words how many of a row's samples are supersaturated with
// confidence, and at which wells when the place does not already say so.
func (r *Row) counts() string {
	s := fmt.Sprintf("%d of %d %s", r.Super, r.Samples, plural(r.Samples, "sample", "samples"))
	if len(r.Wells) > 1 {
		s += " at " + short(r.SuperWells)
	}
	return s
}

// Sentence words a row whose mineral is supersaturated with confidence
// there, or "" for other rows.
func (r *Row) Sentence() string {
	if r.State != StateSupersaturated {
		return ""
	}
	s := fmt.Sprintf("%s: supersaturated with confidence in %s, %s", capital(r.Mineral), r.where(), r.counts())
	if r.First != "" {
		s += ", first in " + r.First
	}
	return s + fmt.Sprintf("; median SI %s, highest %s (%s). SI trend: %s.", num(r.MedianSI, 2), num(r.MaxSI, 2), r.MaxAt, r.Trend)
}

// mineralSentence words every group where a mineral is supersaturated with
// confidence in one sentence: since when, where (with the count and the
// median SI of each group), the highest SI and the trend.
func mineralSentence(rows []*Row) string {
	var first string
	var firstRank float64
	var parts []string
	top := rows[0]
	trends := map[string]bool{}
	var trendList []string
	for _, r := range rows {
		if r.MaxSI > top.MaxSI {
			top = r
		}
		parts = append(parts, fmt.Sprintf("%s (%s; median SI %s)", r.where(), r.counts(), num(r.MedianSI, 2)))
		if !trends[r.Trend] {
			trends[r.Trend] = true
			trendList = append(trendList, r.Trend)
		}
		if rk := r.firstRank; first == "" || rk < firstRank {
			first, firstRank = r.First, rk
		}
	}
	s := capital(rows[0].Mineral) + ": supersaturated with confidence"
	if first != "" {
		s += " since " + first
	}
	s += " in " + list(parts)
	s += fmt.Sprintf("; highest SI %s at %s. SI trend: %s.", num(top.MaxSI, 2), top.MaxAt, strings.Join(trendList, "; "))
	return s
}

func capital(s string) string {
	if s == "" {
		return s
	}
	return strings.ToUpper(s[:1]) + s[1:]
}

// Lines are the findings in plain words, one paragraph a line, ending with
// the caution.
func (f *Findings) Lines() []string {
	var out []string
	how := "no estimate"
	switch f.Method {
	case uncertainty.MethodMonteCarlo:
		how = fmt.Sprintf("Monte Carlo, %d draws, seed %d", f.Draws, f.Seed)
	case uncertainty.MethodLinear:
		how = "linear estimate"
	}
	out = append(out, fmt.Sprintf("Findings for %d %s (%d with saturation intervals; %s). A mineral counts as supersaturated (or undersaturated) with confidence where the whole interval of its SI lies above %s (or below %s).",
		f.Samples, plural(f.Samples, "sample", "samples"), f.WithIntervals, how, num(f.Band, 2), num(-f.Band, 2)))
	var slow []string
	for _, m := range f.Supersaturated {
		var rows []*Row
		for i := range f.Rows {
			if f.Rows[i].Mineral == m && f.Rows[i].State == StateSupersaturated {
				rows = append(rows, &f.Rows[i])
			}
		}
		if slices.Contains(SlowMinerals, m) {
			r := f.SIRange[m]
			n := 0
			for _, row := range rows {
				n += row.Super
			}
			slow = append(slow, fmt.Sprintf("%s (%d %s, SI up to %s)", m, n, plural(n, "sample", "samples"), num(r[1], 2)))
			continue
		}
		out = append(out, mineralSentence(rows))
	}
	if len(f.Supersaturated) == len(slow) {
		out = append(out, "No mineral that forms readily in an aquifer is supersaturated with confidence in any sample.")
	}
	if len(slow) > 0 {
		out = append(out, "Supersaturated with confidence but slow to form at aquifer temperatures (no deposit expected from this alone): "+list(slow)+".")
	}
	if len(f.Undecided) > 0 {
		parts := make([]string, len(f.Undecided))
		for i, m := range f.Undecided {
			r := f.SIRange[m]
			parts[i] = fmt.Sprintf("%s (SI %s to %s)", m, num(r[0], 2), num(r[1], 2))
		}
		out = append(out, "Near equilibrium in some samples, within the uncertainty, and supersaturated with confidence in none: "+list(parts)+".")
	}
	if len(f.Undersaturated) > 0 {
		out = append(out, "Undersaturated with confidence in every sample: "+list(f.Undersaturated)+".")
	}
	if len(f.Rising) > 0 {
		var parts []string
		for i, t := range f.Rising {
			if i == 8 {
				parts = append(parts, fmt.Sprintf("%d more (see the trend table)", len(f.Rising)-8))
				break
			}
			what := "approaching saturation"
			if t.Latest >= 0 {
				what = "increasingly supersaturated"
			}
			parts = append(parts, fmt.Sprintf("%s at %s (latest SI %s, %s, %s)", t.Mineral, t.Well, num(t.Latest, 2), what, t.Words()))
		}
		out = append(out, "Saturation indices rising significantly: "+list(parts)+".")
	}
	if len(f.Types) > 0 {
		var parts []string
		for i, t := range f.Types {
			if i == 5 {
				parts = append(parts, fmt.Sprintf("%d other %s", len(f.Types)-5, plural(len(f.Types)-5, "type", "types")))
				break
			}
			parts = append(parts, fmt.Sprintf("%s (%d)", t.Type, t.Samples))
		}
		out = append(out, "Water types (samples): "+list(parts)+".")
	}
	return append(out, report.CautionLine)
}

// WriteText writes the findings as plain lines.
func (f *Findings) WriteText(w io.Writer) error {
	_, err := io.WriteString(w, strings.Join(f.Lines(), "\n")+"\n")
	return err
}
