package main

import (
	"encoding/csv"
	"fmt"
	"io"

	"github.com/spf13/cobra"

	"gwsat.dev/gwsat/assess"
	"gwsat.dev/gwsat/geo"
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
	var out, jsonOut, geoOut, shardSpec string
	var showColumns bool
	c := &cobra.Command{
		Use:   "check [flags] FILE.csv ... | --demo",
		Short: "check lab files and compute saturation indices: one table row per input row",
		Long: "Reads the lab files, checks every row, converts it to molality, speciates it and writes one\n" +
			"table row per input row, in input order, with a status and its reasons. A summary goes to\n" +
			"standard error. Rejected rows are reported, and the command still exits 0 (see --fail-on-rejected).\n" +
			"Rows stream through: memory does not grow with the number of rows.",
		RunE: func(c *cobra.Command, args []string) error {
			var g guard
			if err := g.inputs(args); err != nil {
				return err
			}
			if err := g.outputs(out, jsonOut, geoOut); err != nil {
				return err
			}
			sh, err := parseShard(shardSpec)
			if err != nil {
				return usagef("--shard: %w", err)
			}
			return runCheck(e, &in, &oc, args, checkOutputs{table: out, json: jsonOut, geojson: geoOut}, sh, showColumns)
		},
	}
	interspersed(c.Flags())
	in.register(c.Flags())
	oc.register(c)
	c.Flags().StringVarP(&out, "out", "o", "-", "table output file (CSV), '-' for standard output")
	c.Flags().StringVar(&jsonOut, "json", "", "also write every result in full (issues, species, activities, distribution) as a JSON array to this file")
	c.Flags().StringVar(&geoOut, "geojson", "", "also write every row as a GeoJSON point (RFC 7946) to this file")
	c.Flags().StringVar(&shardSpec, "shard", "", "process only shard K of N (K/N): rows K, K+N, K+2N, ... in input order, for batch systems; join the tables with 'gwsat join'")
	c.Flags().BoolVar(&showColumns, "columns", false, "print how each input header was understood")
	return c
}

// checkOutputs are the files check writes ("" for none, "-" for standard output).
type checkOutputs struct{ table, json, geojson string }

// runCheck streams every row through the assessment and into the outputs, in
// input order: read, speciate on every core, write; only a bounded number of
// rows is in flight.
func runCheck(e *env, in *inputFlags, oc *outcomeFlags, args []string, outs checkOutputs, sh shard, showColumns bool) error {
	batches, err := in.readInputs(e, args)
	if err != nil {
		return usageErr(err)
	}
	ch, err := in.chemistry()
	if err != nil {
		return usageErr(err)
	}
	minerals := ch.db.MineralNames()
	cols := report.ColumnsFor(batches, minerals)
	sum := assess.NewSummary(files(batches)...)
	total := 0
	for _, b := range batches {
		total += len(b.Rows)
	}
	bar := progress.New(stderrFile(e), "speciating", sh.count(total))
	opt := ch.options(bar, outs.json != "")
	opt.Progress = nil
	err = e.writeFile(outs.table, func(tw io.Writer) error {
		return withOptional(e, outs.json, func(jw io.Writer) error {
			return withOptional(e, outs.geojson, func(gw io.Writer) error {
				cw := csv.NewWriter(tw)
				if err := cw.Write(cols.Header()); err != nil {
					return err
				}
				var js *report.JSONWriter
				if jw != nil {
					js = report.NewJSONWriter(jw)
				}
				var gs *geo.SampleWriter
				if gw != nil {
					gs = geo.NewSampleWriter(gw)
				}
				err := assess.Stream(e.ctx, ch.db, sh.filter(assess.BatchItems(batches)), opt, func(r *assess.Record) error {
					bar.Add(1)
					sum.Add(r)
					if err := cw.Write(cols.Row(r)); err != nil {
						return err
					}
					if js != nil {
						if err := js.Write(r); err != nil {
							return err
						}
					}
					if gs != nil {
						if err := gs.Write(report.SampleFeature(r, minerals)); err != nil {
							return err
						}
					}
					return nil
				})
				if err != nil {
					return err
				}
				cw.Flush()
				if err := cw.Error(); err != nil {
					return err
				}
				if js != nil {
					if err := js.Close(); err != nil {
						return err
					}
				}
				if gs != nil {
					return gs.Close()
				}
				return nil
			})
		})
	})
	bar.Done()
	if err != nil {
		return failed(fmt.Errorf("writing the outputs: %w", err))
	}
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

// withOptional runs fill with a writer for path, or with nil when path is "".
func withOptional(e *env, path string, fill func(w io.Writer) error) error {
	if path == "" {
		return fill(nil)
	}
	return e.writeFile(path, fill)
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
