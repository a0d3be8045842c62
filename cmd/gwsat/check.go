package main

import (
	"fmt"
	"io"
	"sort"
	"strings"

	"gwsat/assess"
	"gwsat/hydro"
	"gwsat/report"
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
	batches, recs, db, err := in.assess(e, fs.Args(), *jsonOut != "")
	if err != nil {
		return failf(e, exitUsage, "%v", err)
	}
	tbl := report.SampleTable(recs, report.SolidMinerals(db))
	if err := e.writeFile(*out, tbl.WriteCSV); err != nil {
		return failf(e, exitRejected, "writing %s: %v", *out, err)
	}
	if *jsonOut != "" {
		if err := e.writeFile(*jsonOut, func(w io.Writer) error { return report.WriteJSON(w, recs) }); err != nil {
			return failf(e, exitRejected, "writing %s: %v", *jsonOut, err)
		}
	}
	if *showMap {
		printMapping(e.stderr, batches)
	}
	if !*quiet {
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

// printSummary writes the short terminal summary: counts per status, the
// charge-balance verdicts, the rows that need a look, and the minerals most
// often supersaturated.
func printSummary(w io.Writer, batches []*hydro.Batch, recs []assess.Record) {
	counts := map[hydro.Status]int{}
	bal := map[hydro.BalanceStatus]int{}
	solved := 0
	super := map[string]int{}
	for i := range recs {
		r := &recs[i]
		counts[r.Status]++
		if r.Balance.Status != "" && (r.Balance.CationsMeqL > 0 || r.Balance.AnionsMeqL > 0) {
			bal[r.Balance.Status]++
		}
		if r.Result != nil {
			solved++
			for _, m := range r.Result.Minerals {
				if m.SI > NearEquilibriumBand {
					super[m.Name]++
				}
			}
		}
	}
	files := make([]string, len(batches))
	for i, b := range batches {
		files[i] = b.File
	}
	fmt.Fprintf(w, "gwsat check: %d rows from %s\n", len(recs), strings.Join(files, ", "))
	fmt.Fprintf(w, "  status: %d ok, %d warning, %d rejected\n", counts[hydro.StatusOK], counts[hydro.StatusWarning], counts[hydro.StatusRejected])
	fmt.Fprintf(w, "  charge balance (Standard Methods 1030 E): %d pass, %d warn, %d fail\n", bal[hydro.BalancePass], bal[hydro.BalanceWarn], bal[hydro.BalanceFail])
	fmt.Fprintf(w, "  speciated: %d of %d\n", solved, len(recs))
	if len(super) > 0 {
		type kv struct {
			k string
			v int
		}
		var l []kv
		for k, v := range super {
			l = append(l, kv{k, v})
		}
		sort.Slice(l, func(i, j int) bool { return l[i].v > l[j].v || l[i].v == l[j].v && l[i].k < l[j].k })
		var parts []string
		for _, x := range l {
			parts = append(parts, fmt.Sprintf("%s %d", x.k, x.v))
		}
		fmt.Fprintf(w, "  supersaturated (SI > %.1f), samples per mineral: %s\n", NearEquilibriumBand, strings.Join(parts, ", "))
	}
	shown := 0
	for i := range recs {
		r := &recs[i]
		if r.Status == hydro.StatusOK {
			continue
		}
		if shown == 12 {
			fmt.Fprintf(w, "  ... and more: see the status and reasons columns\n")
			break
		}
		shown++
		fmt.Fprintf(w, "  %-8s %s line %d (%s): %s\n", r.Status, r.File, r.Row.Line, r.Sample().ID, firstProblem(r))
	}
	fmt.Fprintln(w, "  Screening results, not a design: defer to local codes and licensed professionals.")
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
