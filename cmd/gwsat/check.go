package main

import (
	"encoding/csv"
	"fmt"
	"io"
	"sort"
	"strings"

	"gwsat.dev/gwsat/assess"
	"gwsat.dev/gwsat/hydro"
	"gwsat.dev/gwsat/internal/progress"
	"gwsat.dev/gwsat/report"
)

func init() {
	register(command{name: "check", summary: "check lab files and compute saturation indices: one table row per input row", run: runCheck})
}

func runCheck(e *env, args []string) int {
	fs := newFlags(e, "check", "check [flags] FILE.csv ... | -demo")
	var in inputFlags
	in.register(fs)
	out := fs.String("o", "-", "table output file (CSV), '-' for standard output")
	jsonOut := fs.String("json", "", "also write every result in full (species, activities, distribution) as JSON to this file")
	quiet := fs.Bool("q", false, "no summary on standard error")
	showMap := fs.Bool("columns", false, "print how each input header was understood")
	if code, ok := parseFlags(fs, args); !ok {
		return code
	}
	if *jsonOut != "" {
		return checkInMemory(e, &in, fs.Args(), *out, *jsonOut, *showMap, *quiet)
	}
	return checkStreaming(e, &in, fs.Args(), *out, *showMap, *quiet)
}

// checkChunk is how many rows are speciated and written at a time: the
// results of a chunk are dropped once its rows are written, so memory does
// not grow with the results of a large file.
const checkChunk = 2048

// checkStreaming speciates and writes the table chunk by chunk.
func checkStreaming(e *env, in *inputFlags, args []string, out string, showMap, quiet bool) int {
	batches, err := in.readInputs(e, args)
	if err != nil {
		return failf(e, exitUsage, "%v", err)
	}
	sp, err := in.speciator()
	if err != nil {
		return failf(e, exitUsage, "%v", err)
	}
	minerals := report.SolidMinerals(sp.db)
	sum := newSummary(batches)
	total := 0
	for _, b := range batches {
		total += len(b.Rows)
	}
	bar := progress.New(stderrFile(e), "speciating", total)
	err = e.writeFile(out, func(w io.Writer) error {
		cw := csv.NewWriter(w)
		if err := cw.Write(report.SampleTable(nil, minerals).Header); err != nil {
			return err
		}
		for _, b := range batches {
			for lo := 0; lo < len(b.Rows); lo += checkChunk {
				hi := min(lo+checkChunk, len(b.Rows))
				part := *b
				part.Rows = b.Rows[lo:hi]
				recs, err := assess.Run(e.ctx, sp.db, []*hydro.Batch{&part}, sp.options(func() { bar.Add(1) }, false))
				if err != nil {
					return err
				}
				report.FlagPositions(recs)
				if err := cw.WriteAll(report.SampleTable(recs, minerals).Rows); err != nil {
					return err
				}
				for i := range recs {
					sum.add(&recs[i])
				}
			}
		}
		cw.Flush()
		return cw.Error()
	})
	bar.Done()
	if err != nil {
		return failf(e, exitRejected, "writing %s: %v", out, err)
	}
	if showMap {
		printMapping(e.stderr, batches)
	}
	if !quiet {
		sum.print(e.stderr)
	}
	if sum.counts[hydro.StatusRejected] > 0 {
		return exitRejected
	}
	return exitOK
}

// checkInMemory keeps every result for the full JSON output.
func checkInMemory(e *env, in *inputFlags, args []string, out, jsonOut string, showMap, quiet bool) int {
	batches, recs, db, err := in.assess(e, args, true)
	if err != nil {
		return failf(e, exitUsage, "%v", err)
	}
	tbl := report.SampleTable(recs, report.SolidMinerals(db))
	if err := e.writeFile(out, tbl.WriteCSV); err != nil {
		return failf(e, exitRejected, "writing %s: %v", out, err)
	}
	if err := e.writeFile(jsonOut, func(w io.Writer) error { return report.WriteJSON(w, recs) }); err != nil {
		return failf(e, exitRejected, "writing %s: %v", jsonOut, err)
	}
	if showMap {
		printMapping(e.stderr, batches)
	}
	if !quiet {
		printSummary(e.stderr, batches, recs)
	}
	return exitCode(recs)
}

func exitCode(recs []assess.Record) int {
	for i := range recs {
		if recs[i].Status == hydro.StatusRejected {
			return exitRejected
		}
	}
	return exitOK
}

func printMapping(w io.Writer, batches []*hydro.Batch) {
	for _, b := range batches {
		fmt.Fprintf(w, "%s: %s shape, delimiter %q, decimal comma %v\n", b.File, b.Shape, b.Delimiter, b.DecimalComma)
		for _, m := range b.Mapping {
			p := m.Param
			if p == "" {
				p = "(kept as extra column)"
			}
			unit := ""
			if m.Unit != "" {
				unit = " [" + m.Unit + "]"
			}
			note := ""
			if m.Note != "" {
				note = "  (" + m.Note + ")"
			}
			fmt.Fprintf(w, "  %-32q -> %s%s%s\n", m.Header, p, unit, note)
		}
	}
}

// summary gathers, row by row, what the short terminal summary shows:
// counts per status, the charge-balance verdicts, how many samples were
// speciated, the minerals most often supersaturated and the first rows
// that need a look.
type summary struct {
	files    []string
	rows     int
	counts   map[hydro.Status]int
	bal      map[hydro.BalanceStatus]int
	solved   int
	super    map[string]int
	problems []string
	more     bool
}

func newSummary(batches []*hydro.Batch) *summary {
	s := &summary{counts: map[hydro.Status]int{}, bal: map[hydro.BalanceStatus]int{}, super: map[string]int{}}
	for _, b := range batches {
		s.files = append(s.files, b.File)
	}
	return s
}

// maxProblems is how many rows needing a look the summary lists.
const maxProblems = 12

func (s *summary) add(r *assess.Record) {
	s.rows++
	s.counts[r.Status]++
	if r.Balance.Status != "" && (r.Balance.CationsMeqL > 0 || r.Balance.AnionsMeqL > 0) {
		s.bal[r.Balance.Status]++
	}
	if r.Result != nil {
		s.solved++
		for _, m := range r.Result.Minerals {
			if m.SI > NearEquilibriumBand {
				s.super[m.Name]++
			}
		}
	}
	if r.Status != hydro.StatusOK {
		if len(s.problems) == maxProblems {
			s.more = true
			return
		}
		s.problems = append(s.problems, fmt.Sprintf("  %-8s %s line %d (%s): %s", r.Status, r.File, r.Row.Line, r.Sample().ID, firstProblem(r)))
	}
}

func (s *summary) print(w io.Writer) {
	fmt.Fprintf(w, "gwsat: %d rows from %s\n", s.rows, strings.Join(s.files, ", "))
	fmt.Fprintf(w, "  status: %d ok, %d warning, %d rejected\n", s.counts[hydro.StatusOK], s.counts[hydro.StatusWarning], s.counts[hydro.StatusRejected])
	fmt.Fprintf(w, "  charge balance (Standard Methods 1030 E): %d pass, %d warn, %d fail\n", s.bal[hydro.BalancePass], s.bal[hydro.BalanceWarn], s.bal[hydro.BalanceFail])
	fmt.Fprintf(w, "  speciated: %d of %d\n", s.solved, s.rows)
	if len(s.super) > 0 {
		type kv struct {
			k string
			v int
		}
		var l []kv
		for k, v := range s.super {
			l = append(l, kv{k, v})
		}
		sort.Slice(l, func(i, j int) bool { return l[i].v > l[j].v || l[i].v == l[j].v && l[i].k < l[j].k })
		var parts []string
		for _, x := range l {
			parts = append(parts, fmt.Sprintf("%s %d", x.k, x.v))
		}
		fmt.Fprintf(w, "  supersaturated (SI > %.1f), samples per mineral: %s\n", NearEquilibriumBand, strings.Join(parts, ", "))
	}
	for _, p := range s.problems {
		fmt.Fprintln(w, p)
	}
	if s.more {
		fmt.Fprintln(w, "  ... and more: see the status and reasons columns")
	}
	fmt.Fprintln(w, "  Screening results, not a design: defer to local codes and licensed professionals.")
}

// printSummary writes the summary of a run held in memory.
func printSummary(w io.Writer, batches []*hydro.Batch, recs []assess.Record) {
	s := newSummary(batches)
	for i := range recs {
		s.add(&recs[i])
	}
	s.print(w)
}

// NearEquilibriumBand is the half-width of the band around SI = 0 within
// which a water is reported as near equilibrium (common practice: +/-0.2 to
// +/-0.5 depending on data quality; we use 0.5 for field data).
const NearEquilibriumBand = 0.5

func firstProblem(r *assess.Record) string {
	for _, s := range r.Reasons {
		if strings.HasPrefix(s, "error") || strings.HasPrefix(s, "warning") {
			return s
		}
	}
	if len(r.Reasons) > 0 {
		return r.Reasons[0]
	}
	return ""
}
