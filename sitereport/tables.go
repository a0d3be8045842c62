package sitereport

import (
	"fmt"
	"strconv"
	"strings"

	"gwsat.dev/gwsat/hydro"
	"gwsat.dev/gwsat/report"
	"gwsat.dev/gwsat/site"
)

// MappingTable is the column report: how each input header was understood.
func MappingTable(batches []*hydro.Batch) *report.Table {
	t := &report.Table{Header: []string{"file", "column", "header", "parameter", "unit", "note"}}
	for _, b := range batches {
		for _, m := range b.Mapping {
			t.Add(report.Text(b.File), strconv.Itoa(m.Column), report.Text(m.Header), m.Param, report.Text(m.Unit), report.Text(m.Note))
		}
	}
	return t
}

func surfacesTable(st *site.Site) *report.Table {
	t := &report.Table{Header: []string{"mineral", "depth_zone", "round", "method", "wells", "loo_cv_rmse_si", "note"}}
	if st == nil {
		return t
	}
	for _, s := range st.Surfaces {
		t.Add(s.Mineral, report.Text(s.Zone), report.Text(s.Round), s.Method, strconv.Itoa(s.Wells), report.Cond(s.HasCV, report.Num(s.CVRMSE, 3)), report.Text(s.Note))
	}
	return t
}

func unplacedNote(st *site.Site) []string {
	if st == nil || len(st.Unplaced) == 0 {
		return nil
	}
	n := st.Unplaced
	more := ""
	if len(n) > 10 {
		more = fmt.Sprintf(" and %d more", len(n)-10)
		n = n[:10]
	}
	return []string{fmt.Sprintf("Left off the maps (kept in the tables): %s%s.", strings.Join(n, "; "), more)}
}

// summaryColumns are the columns of the sample table shown in index.html
// besides the saturation indices.
var summaryColumns = map[string]bool{"line": true, "sample_id": true, "well_id": true, "round": true, "status": true, "depth_m": true,
	"temp_c": true, "ph": true, "charge_balance_pct": true, "balance_status": true, "ionic_strength_mol_kgw": true, "log_pco2_atm": true, "langelier_si": true}

// summaryTable is the HTML view of the sample table: identification, status,
// balance and the saturation indices, without the long metadata columns.
func summaryTable(t *report.Table) *report.Table {
	var idx []int
	out := &report.Table{}
	for i, h := range t.Header {
		if summaryColumns[h] || report.IsSIColumn(h) {
			idx = append(idx, i)
			out.Header = append(out.Header, h)
		}
	}
	for _, r := range t.Rows {
		row := make([]string, len(idx))
		for k, i := range idx {
			row[k] = r[i]
		}
		out.Rows = append(out.Rows, row)
	}
	return out
}
