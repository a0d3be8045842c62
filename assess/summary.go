package assess

import (
	"fmt"
	"io"
	"sort"
	"strings"

	"gwsat.dev/gwsat/hydro"
)

// Summary gathers, record by record, what a run's short summary shows: counts
// per status, the charge-balance verdicts, how many samples were speciated, the
// minerals most often supersaturated and the first records that need a look. It
// keeps no record, so it serves files of any length.
type Summary struct {
	Files    []string
	Rows     int
	Counts   map[hydro.Status]int
	Balance  map[hydro.BalanceStatus]int
	Solved   int
	Super    map[string]int // records per mineral with SI above NearEquilibriumBand
	Problems []string       // the first MaxProblems records that are not ok, as text
	More     bool           // more records need a look than Problems lists
}

// MaxProblems is how many records needing a look a Summary lists.
const MaxProblems = 12

// NewSummary starts a summary of the named files.
func NewSummary(files ...string) *Summary {
	return &Summary{Files: files, Counts: map[hydro.Status]int{}, Balance: map[hydro.BalanceStatus]int{}, Super: map[string]int{}}
}

// Summarise returns the summary of records.
func Summarise(files []string, recs []Record) *Summary {
	s := NewSummary(files...)
	for i := range recs {
		s.Add(&recs[i])
	}
	return s
}

// Add counts one record.
func (s *Summary) Add(r *Record) {
	s.Rows++
	s.Counts[r.Status]++
	if b := r.Balance; b.Status != "" && (b.CationsMeqL > 0 || b.AnionsMeqL > 0) {
		s.Balance[b.Status]++
	}
	if r.Result != nil {
		s.Solved++
		for _, m := range r.Result.Minerals {
			if m.SI > NearEquilibriumBand {
				s.Super[m.Name]++
			}
		}
	}
	if r.Status != hydro.StatusOK {
		if len(s.Problems) == MaxProblems {
			s.More = true
			return
		}
		s.Problems = append(s.Problems, fmt.Sprintf("%-8s %s line %d (%s): %s", r.Status, r.File, r.Row.Line, r.Sample().ID, r.FirstProblem()))
	}
}

// StatusLine is the counts per status in words.
func (s *Summary) StatusLine() string {
	return fmt.Sprintf("%d %s: %d ok, %d %s, %d rejected", s.Rows, plural(s.Rows, "row", "rows"),
		s.Counts[hydro.StatusOK], s.Counts[hydro.StatusWarning], plural(s.Counts[hydro.StatusWarning], "warning", "warnings"), s.Counts[hydro.StatusRejected])
}

// BalanceLine is the charge-balance verdicts in words.
func (s *Summary) BalanceLine() string {
	return fmt.Sprintf("charge balance (Standard Methods 1030 E): %d pass, %d warn, %d fail",
		s.Balance[hydro.BalancePass], s.Balance[hydro.BalanceWarn], s.Balance[hydro.BalanceFail])
}

// Write prints the summary as a few lines of text, ending with caution.
func (s *Summary) Write(w io.Writer, caution string) error {
	var b strings.Builder
	fmt.Fprintf(&b, "gwsat: %s from %s\n", s.StatusLine(), strings.Join(s.Files, ", "))
	fmt.Fprintf(&b, "  %s\n", s.BalanceLine())
	fmt.Fprintf(&b, "  speciated: %d of %d\n", s.Solved, s.Rows)
	if len(s.Super) > 0 {
		names := make([]string, 0, len(s.Super))
		for k := range s.Super {
			names = append(names, k)
		}
		sort.Slice(names, func(i, j int) bool {
			a, c := s.Super[names[i]], s.Super[names[j]]
			return a > c || a == c && names[i] < names[j]
		})
		parts := make([]string, len(names))
		for i, k := range names {
			parts[i] = fmt.Sprintf("%s %d", k, s.Super[k])
		}
		fmt.Fprintf(&b, "  supersaturated (SI > %.1f), samples per mineral: %s\n", NearEquilibriumBand, strings.Join(parts, ", "))
	}
	for _, p := range s.Problems {
		fmt.Fprintf(&b, "  %s\n", p)
	}
	if s.More {
		fmt.Fprintln(&b, "  ... and more: see the status and reasons columns")
	}
	if caution != "" {
		fmt.Fprintf(&b, "  %s\n", caution)
	}
	_, err := io.WriteString(w, b.String())
	return err
}

func plural(n int, one, many string) string {
	if n == 1 {
		return one
	}
	return many
}
