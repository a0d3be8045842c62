package uncertainty

import (
	"strings"

	"gwsat.dev/gwsat/report"
)

// Columns returns the table columns of the intervals of minerals, three per
// mineral after report.ColumnName's stem: "<mineral>_si_low",
// "<mineral>_si_high" and "<mineral>_verdict" ("calcite_si_low", ...).
func Columns(minerals []string) []string {
	out := make([]string, 0, 3*len(minerals))
	for _, m := range minerals {
		stem := strings.TrimSuffix(report.ColumnName(m), "_si")
		out = append(out, stem+"_si_low", stem+"_si_high", stem+"_verdict")
	}
	return out
}

// Cells returns the cells of Columns for one sample: the low end
// ("unbounded" when open at the bottom), the high end and the verdict, 3
// decimals; empty cells for a mineral without an interval or a sample
// without a result.
func Cells(s *Sample, minerals []string) []string {
	out := make([]string, 0, 3*len(minerals))
	for _, m := range minerals {
		var iv *Interval
		if s != nil && s.Err == nil {
			iv = s.Interval(m)
		}
		if iv == nil {
			out = append(out, "", "", "")
			continue
		}
		out = append(out, iv.FormatLow(3), report.Num(iv.High, 3), string(iv.Verdict))
	}
	return out
}

// Status is a sample's estimate in words for a table: "" when it has
// intervals, else the reason there are none.
func (s *Sample) Status() string {
	if s.Err != nil {
		return s.Err.Error()
	}
	return ""
}
