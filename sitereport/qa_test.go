package sitereport

import (
	"fmt"
	"strings"
	"testing"

	"gwsat.dev/gwsat/assess"
	"gwsat.dev/gwsat/hydro"
)

// The quality-control list of the page names each row that is not ok while
// there are few; beyond MaxQALines it groups them by status and problem,
// largest group first, with their counts adding up to every such row.
func TestQALines(t *testing.T) {
	row := func(line int, status hydro.Status, code hydro.Code, col, msg string) assess.Record {
		r := assess.Record{File: "lab.csv", Status: status}
		r.Row.Line = line
		r.Row.Sample.ID = fmt.Sprintf("S%d", line)
		sev := hydro.Warning
		if status == hydro.StatusRejected {
			sev = hydro.Error
		}
		r.Issues = []hydro.Issue{{Severity: hydro.Info, Code: "note", Message: "an info first"}, {Severity: sev, Code: code, Column: col, Message: msg}}
		return r
	}
	var recs []assess.Record
	for i := 0; i < 10; i++ {
		recs = append(recs, assess.Record{File: "lab.csv", Status: hydro.StatusOK})
		recs = append(recs, row(100+i, hydro.StatusRejected, "negative", "K", fmt.Sprintf("negative concentration -%d", i+1)))
	}
	few := qaLines(recs)
	if len(few) != 10 || !strings.Contains(few[0], "lab.csv line 100, sample S100, rejected: column \"K\": negative concentration -1") {
		t.Fatalf("few problems: %q", few)
	}
	for i := 0; i < 40; i++ {
		recs = append(recs, row(200+i, hydro.StatusWarning, "balance", "", fmt.Sprintf("charge balance -%d %% fails", 10+i)))
	}
	for i := 0; i < 5; i++ {
		recs = append(recs, row(300+i, hydro.StatusRejected, "negative", "Na", "negative concentration -2"))
	}
	got := qaLines(recs)
	want := []string{
		"55 rows are not ok",
		"40 rows warning, like lab.csv line 200 (S200): charge balance -10 % fails; others: line 201 (S201), line 202 (S202), line 203 (S203) and 36 more",
		"10 rows rejected, like lab.csv line 100 (S100): column \"K\": negative concentration -1; others:",
		"5 rows rejected, like lab.csv line 300 (S300): column \"Na\"",
	}
	if len(got) != len(want) {
		t.Fatalf("%d lines, want %d: %q", len(got), len(want), got)
	}
	for i := range want {
		if !strings.HasPrefix(got[i], want[i]) {
			t.Errorf("line %d:\n got %q\nwant prefix %q", i, got[i], want[i])
		}
	}
}
