package findings

import (
	"strconv"
	"strings"

	"gwsat.dev/gwsat/report"
)

// TableHeader is the header of findings.csv.
var TableHeader = []string{"mineral", "cluster", "zone", "state", "wells", "samples", "supersaturated", "undecided", "undersaturated",
	"median_si", "max_si", "max_at", "first_supersaturated", "last_supersaturated", "supersaturated_wells", "si_trend", "sentence"}

// Table is findings.csv: one row per mineral and group, cells made safe
// for spreadsheets by report.Text.
func (f *Findings) Table() *report.Table {
	t := &report.Table{Header: append([]string(nil), TableHeader...)}
	for i := range f.Rows {
		r := &f.Rows[i]
		t.Add(report.Text(r.Mineral), report.Text(r.Cluster), report.Text(r.Zone), r.State,
			report.Text(strings.Join(r.Wells, " ")), strconv.Itoa(r.Samples), strconv.Itoa(r.Super), strconv.Itoa(r.Undecided), strconv.Itoa(r.Under),
			report.Num(r.MedianSI, 3), report.Num(r.MaxSI, 3), report.Text(r.MaxAt), report.Text(r.First), report.Text(r.Last),
			report.Text(strings.Join(r.SuperWells, " ")), report.Text(r.Trend), report.Text(r.Sentence()))
	}
	return t
}

// TrendHeader is the header of the trend table.
var TrendHeader = []string{"well", "quantity", "events", "state", "direction", "p_value", "sen_slope", "slope_low", "slope_high", "per", "latest", "toward_saturation"}

// TrendTable is the trend tests as a table, one row per well and quantity.
func TrendTable(trends []Trend) *report.Table {
	t := &report.Table{Header: append([]string(nil), TrendHeader...)}
	for _, tr := range trends {
		dir, p, sl, lo, hi := "", "", "", "", ""
		if tr.State == TrendTested {
			dir = tr.Result.Direction.String()
			p = report.Sig(tr.Result.P, 3)
			sl, lo, hi = report.Sig(tr.Result.Slope, 3), report.Sig(tr.Result.SlopeLow, 3), report.Sig(tr.Result.SlopeHigh, 3)
		}
		toward := ""
		if tr.Mineral != "" {
			toward = strconv.FormatBool(tr.TowardSaturation)
		}
		t.Add(report.Text(tr.Well), report.Text(tr.Quantity), strconv.Itoa(tr.Events), tr.State, dir, p, sl, lo, hi, tr.Unit, report.Sig(tr.Latest, 4), toward)
	}
	return t
}
