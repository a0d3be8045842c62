package sitereport

import (
	"fmt"
	"sort"
	"strings"

	"gwsat.dev/gwsat/assess"
	"gwsat.dev/gwsat/hydro"
)

// MaxQALines is the most rows that are not ok which the page lists one by one;
// beyond it the list groups them by status and problem (common practice: a
// reviewer reads fifty lines, not two thousand).
const MaxQALines = 50

// qaExamples is how many rows each group of the grouped list names.
const qaExamples = 3

// qaLines lists the rows of recs that are not ok: one line each when there
// are at most MaxQALines of them, else one line per status and problem (the
// row's first warning or error: its code and column), largest group first,
// each with its count and the first rows it holds.
func qaLines(recs []assess.Record) []string {
	var bad []*assess.Record
	for i := range recs {
		if recs[i].Status != hydro.StatusOK {
			bad = append(bad, &recs[i])
		}
	}
	if len(bad) <= MaxQALines {
		out := make([]string, len(bad))
		for i, r := range bad {
			out[i] = qaLine(r)
		}
		return out
	}
	type group struct {
		first *assess.Record
		rows  []*assess.Record
	}
	var order []string
	groups := map[string]*group{}
	for _, r := range bad {
		k := string(r.Status) + "\x00" + problemKey(r)
		g := groups[k]
		if g == nil {
			g = &group{first: r}
			groups[k] = g
			order = append(order, k)
		}
		g.rows = append(g.rows, r)
	}
	sort.SliceStable(order, func(i, j int) bool { return len(groups[order[i]].rows) > len(groups[order[j]].rows) })
	out := []string{fmt.Sprintf("%d rows are not ok; grouped by status and problem (every row's status and reasons are in samples.csv):", len(bad))}
	for _, k := range order {
		g := groups[k]
		f := g.first
		line := fmt.Sprintf("%d %s, like %s line %d (%s): %s", len(g.rows), rowsWord(len(g.rows), string(f.Status)), f.File, f.Row.Line, f.Sample().ID, problemText(f))
		if len(g.rows) > 1 {
			var ex []string
			for _, r := range g.rows[1:min(len(g.rows), qaExamples+1)] {
				where := fmt.Sprintf("line %d (%s)", r.Row.Line, r.Sample().ID)
				if r.File != f.File {
					where = r.File + " " + where
				}
				ex = append(ex, where)
			}
			line += "; others: " + strings.Join(ex, ", ")
			if n := len(g.rows) - 1 - len(ex); n > 0 {
				line += fmt.Sprintf(" and %d more", n)
			}
		}
		out = append(out, line)
	}
	return out
}

// problemKey names a row's first problem by its code and column (the message
// itself carries the row's own numbers).
func problemKey(r *assess.Record) string {
	for _, is := range r.Issues {
		if is.Severity >= hydro.Warning {
			return string(is.Code) + "\x00" + is.Column
		}
	}
	return r.FirstProblem()
}

// problemText is a row's first problem without its severity word.
func problemText(r *assess.Record) string {
	p := r.FirstProblem()
	for _, sev := range []string{"error: ", "warning: ", "info: "} {
		p = strings.TrimPrefix(p, sev)
	}
	return p
}

func rowsWord(n int, status string) string {
	if n == 1 {
		return "row " + status
	}
	return "rows " + status
}

func qaLine(r *assess.Record) string {
	return fmt.Sprintf("%s line %d, sample %s, %s: %s", r.File, r.Row.Line, r.Sample().ID, r.Status, problemText(r))
}
