package main

import (
	"encoding/csv"
	"fmt"
	"io"

	"github.com/spf13/cobra"

	"gwsat.dev/gwsat/assess"
	"gwsat.dev/gwsat/hydro"
	"gwsat.dev/gwsat/internal/progress"
	"gwsat.dev/gwsat/report"
)

// outcomeFlags are the flags that choose how a run's verdict maps to the exit status.
type outcomeFlags struct {
	failOnRejected bool
	quiet          bool
}

func (o *outcomeFlags) register(c *cobra.Command) {
	c.Flags().BoolVar(&o.failOnRejected, "fail-on-rejected", false, "exit with status 1 when any row was rejected (for pipelines)")
	c.Flags().BoolVarP(&o.quiet, "quiet", "q", false, "no summary on standard error")
}

// verdict is the exit of a run that did its job.
func (o *outcomeFlags) verdict(s *assess.Summary) error {
	if o.failOnRejected && s.Counts[hydro.StatusRejected] > 0 {
		return quietExit(exitFailed)
	}
	return nil
}

func checkCmd(e *env) *cobra.Command {
	var in inputFlags
	var oc outcomeFlags
	var out, jsonOut string
	var showColumns bool
	c := &cobra.Command{
		Use:   "check [flags] FILE.csv ... | --demo",
		Short: "check lab files and compute saturation indices: one table row per input row",
		Long: "Reads the lab files, checks every row, converts it to molality, speciates it and writes one\n" +
			"table row per input row, in input order, with a status and its reasons. A summary goes to\n" +
			"standard error. Rejected rows are reported, and the command still exits 0 (see --fail-on-rejected).",
		RunE: func(c *cobra.Command, args []string) error {
			var g guard
			if err := g.inputs(args); err != nil {
				return err
			}
			if err := g.outputs(out, jsonOut); err != nil {
				return err
			}
			if jsonOut != "" {
				return checkInMemory(e, &in, &oc, args, out, jsonOut, showColumns)
			}
			return checkStreaming(e, &in, &oc, args, out, showColumns)
		},
	}
	interspersed(c.Flags())
	in.register(c.Flags())
	oc.register(c)
	c.Flags().StringVarP(&out, "out", "o", "-", "table output file (CSV), '-' for standard output")
	c.Flags().StringVar(&jsonOut, "json", "", "also write every result in full (species, activities, distribution) as JSON to this file")
	c.Flags().BoolVar(&showColumns, "columns", false, "print how each input header was understood")
	return c
}

// checkChunk is how many rows are speciated and written at a time: the
// results of a chunk are dropped once its rows are written, so memory does
// not grow with the results of a large file.
const checkChunk = 2048

// checkStreaming speciates and writes the table chunk by chunk.
func checkStreaming(e *env, in *inputFlags, oc *outcomeFlags, args []string, out string, showColumns bool) error {
	batches, err := in.readInputs(e, args)
	if err != nil {
		return usageErr(err)
	}
	ch, err := in.chemistry()
	if err != nil {
		return usageErr(err)
	}
	minerals := ch.db.MineralNames()
	sum := assess.NewSummary(files(batches)...)
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
				part := *b
				part.Rows = b.Rows[lo:min(lo+checkChunk, len(b.Rows))]
				recs, err := assess.Run(e.ctx, ch.db, []*hydro.Batch{&part}, ch.options(bar, false))
				if err != nil {
					return err
				}
				if err := cw.WriteAll(report.SampleTable(recs, minerals).Rows); err != nil {
					return err
				}
				for i := range recs {
					sum.Add(&recs[i])
				}
			}
		}
		cw.Flush()
		return cw.Error()
	})
	bar.Done()
	if err != nil {
		return failed(fmt.Errorf("writing %s: %w", out, err))
	}
	return finishCheck(e, oc, batches, sum, showColumns)
}

// checkInMemory keeps every result for the full JSON output.
func checkInMemory(e *env, in *inputFlags, oc *outcomeFlags, args []string, out, jsonOut string, showColumns bool) error {
	batches, recs, ch, err := in.assessAll(e, args, true)
	if err != nil {
		return usageErr(err)
	}
	tbl := report.SampleTable(recs, ch.db.MineralNames())
	if err := e.writeFile(out, tbl.WriteCSV); err != nil {
		return failed(fmt.Errorf("writing %s: %w", out, err))
	}
	if err := e.writeFile(jsonOut, func(w io.Writer) error { return report.WriteJSON(w, recs) }); err != nil {
		return failed(fmt.Errorf("writing %s: %w", jsonOut, err))
	}
	return finishCheck(e, oc, batches, assess.Summarise(files(batches), recs), showColumns)
}

func finishCheck(e *env, oc *outcomeFlags, batches []*hydro.Batch, sum *assess.Summary, showColumns bool) error {
	if showColumns {
		printColumns(e.stderr, batches)
	}
	if !oc.quiet {
		if err := e.writeSummary(sum); err != nil {
			return failed(err)
		}
	}
	return oc.verdict(sum)
}

func printColumns(w io.Writer, batches []*hydro.Batch) {
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
