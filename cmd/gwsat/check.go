package main

import (
	"bytes"
	"encoding/csv"
	"errors"
	"fmt"
	"io"
	"os"
	"runtime/debug"
	"sort"
	"strings"

	"github.com/spf13/cobra"

	"gwsat.dev/gwsat/assess"
	"gwsat.dev/gwsat/geo"
	"gwsat.dev/gwsat/hydro"
	"gwsat.dev/gwsat/internal/progress"
	"gwsat.dev/gwsat/report"
	"gwsat.dev/gwsat/uncertainty"
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
	var iv intervalFlags
	c := &cobra.Command{
		Use:   "check [flags] FILE.csv ... | --demo",
		Short: "check lab files and compute saturation indices: one table row per input row",
		Long: "Reads the lab files, checks every row, converts it to molality, speciates it and writes one\n" +
			"table row per input row, in input order, with a status and its reasons. A summary goes to\n" +
			"standard error. Rejected rows are reported, and the command still exits 0 (see --fail-on-rejected).\n" +
			"Rows stream through: memory does not grow with the number of rows.",
		RunE: func(c *cobra.Command, args []string) error {
			e.quiet = oc.quiet
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
			return runCheck(e, &in, &oc, args, checkOutputs{table: out, json: jsonOut, geojson: geoOut}, sh, showColumns, iv)
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
	iv.register(c)
	return c
}

// intervalFlags ask check for an interval on every saturation index.
type intervalFlags struct {
	on     bool
	draws  int
	seed   uint64
	linear bool
}

func (iv *intervalFlags) register(c *cobra.Command) {
	f := c.Flags()
	f.BoolVar(&iv.on, "intervals", false, "add the interval of every SI (<mineral>_si_low, _si_high, _verdict) from the uncertainty of the inputs, as 'gwsat findings' computes it")
	f.IntVar(&iv.draws, "draws", uncertainty.DefaultDraws, "with --intervals: Monte Carlo draws per sample")
	f.Uint64Var(&iv.seed, "seed", 1, "with --intervals: seed of the draws")
	f.BoolVar(&iv.linear, "linear", false, "with --intervals: the fast linear estimate instead of Monte Carlo")
}

// checkMemoryLimit is the soft memory limit of check (GOMEMLIMIT overrides
// it): far above what the stream holds, well below the 300 MB target.
const checkMemoryLimit = 200 << 20

// checkGCPercent is the GOGC of check (the GOGC variable overrides it).
const checkGCPercent = 400

// maxDraws bounds --draws (a typo must not run for days).
const maxDraws = 100000

// intervalChunk is how many rows are held to estimate their intervals together
// (on every core) before they are written.
const intervalChunk = 256

// rowOutput is one row's table line and GeoJSON feature, encoded on the
// worker that speciated the row (assess.StreamPrepared); its buffers are
// reused from row to row.
type rowOutput struct {
	f          *report.RowFormatter
	line       bytes.Buffer
	cw         *csv.Writer
	feature    []byte
	featureErr error
}

// format encodes r's table line and, when withFeature, its GeoJSON feature.
func (o *rowOutput) format(r *assess.Record, cols report.Columns, minerals []string, withFeature bool) {
	if o.f == nil {
		o.f = report.NewRowFormatter(cols, minerals)
		o.cw = csv.NewWriter(&o.line)
	}
	o.line.Reset()
	var row []string
	if withFeature {
		var pf geo.PointFeature
		row, pf = o.f.RowAndFeature(r)
		o.feature, o.featureErr = geo.EncodeFeature(o.feature[:0], &pf)
	} else {
		row = o.f.Row(r)
	}
	o.cw.Write(row) // a bytes.Buffer takes every byte
	o.cw.Flush()
}

// checkOutputs are the files check writes ("" for none, "-" for standard output).
type checkOutputs struct{ table, json, geojson string }

// runCheck streams every row through the assessment and into the outputs, in
// input order: read, speciate on every core, write; only a bounded number of
// rows is in flight.
func runCheck(e *env, in *inputFlags, oc *outcomeFlags, args []string, outs checkOutputs, sh shard, showColumns bool, iv intervalFlags) error {
	if os.Getenv("GOMEMLIMIT") == "" {
		// The stream holds a few megabytes of rows; a soft limit keeps the
		// garbage collector from letting dead rows pile up on a busy machine,
		// so that the resident memory stays flat however long the file.
		prev := debug.SetMemoryLimit(checkMemoryLimit)
		defer debug.SetMemoryLimit(prev)
		if os.Getenv("GOGC") == "" {
			// Under that limit, a collection every few times the live
			// heap rather than every time it doubles: the stream's live
			// heap is small and its garbage large, and collecting less
			// often saves about a sixth of the CPU time (measured on
			// 50,000 rows) for some tens of megabytes.
			prevGC := debug.SetGCPercent(checkGCPercent)
			defer debug.SetGCPercent(prevGC)
		}
	}
	if iv.on && !(iv.draws > 0 && iv.draws <= maxDraws) {
		return usagef("--draws %d: give 1 to %d", iv.draws, maxDraws)
	}
	ins, fieldName, err := in.openInputs(e, args)
	if err != nil {
		return usageErr(err)
	}
	defer func() {
		for _, x := range ins {
			x.sc.Close()
		}
	}()
	metas := make([]*hydro.Batch, len(ins))
	for i, x := range ins {
		metas[i] = x.meta
	}
	ch, err := in.chemistry()
	if err != nil {
		return usageErr(err)
	}
	minerals := ch.db.MineralNames()
	// The table's header is written before the first row: its columns
	// come from the files' header mappings, not from the rows.
	cols := report.ColumnsFromHeaders(metas, minerals)
	sum := assess.NewSummary(files(metas)...)
	off := newOffTable(cols)
	// The total is known when every file was read twice (not from
	// standard input); without it no bar is shown.
	total := 0
	var barOut io.Writer = stderrFile(e)
	for _, x := range ins {
		if n := x.sc.Len(); n >= 0 {
			total += n
		} else {
			barOut = io.Discard
		}
	}
	bar := progress.New(barOut, "speciating", sh.count(total))
	opt := ch.options(bar, outs.json != "")
	opt.Progress = nil
	err = e.writeFile(outs.table, func(tw io.Writer) error {
		return withOptional(e, outs.json, func(jw io.Writer) error {
			return withOptional(e, outs.geojson, func(gw io.Writer) error {
				cw := csv.NewWriter(tw)
				header := cols.Header()
				if iv.on {
					header = append(header, uncertainty.Columns(minerals)...)
				}
				if err := cw.Write(header); err != nil {
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
				write := func(r *assess.Record, extra []string) error {
					if err := cw.Write(append(cols.Row(r), extra...)); err != nil {
						return err
					}
					if js != nil {
						if err := js.Write(r); err != nil {
							return err
						}
					}
					if gs != nil {
						return gs.Write(report.SampleFeature(r, minerals))
					}
					return nil
				}
				// With intervals, rows wait in a small chunk whose intervals are
				// estimated together; each row keeps its own random stream (its
				// index in the run), so chunking never changes a number.
				var chunk []assess.Record
				done := 0
				flush := func() error {
					if len(chunk) == 0 {
						return nil
					}
					uo := uncertainty.Options{Model: ch.model, BalanceOn: ch.bal, Draws: iv.draws, Seed: iv.seed, Linear: iv.linear, FirstStream: uint64(done)}
					var samples []uncertainty.Sample
					if sh.n <= 1 {
						var err error
						if samples, err = uncertainty.Run(e.ctx, ch.db, chunk, uo); err != nil {
							return err
						}
					} else {
						// A shard's rows are every n-th of the run: each takes the
						// stream of its index in the whole run, one at a time, so
						// that the joined shards equal the single run.
						for i := range chunk {
							uo.FirstStream = uint64((done+i)*sh.n + sh.k - 1)
							one, err := uncertainty.Run(e.ctx, ch.db, chunk[i:i+1], uo)
							if err != nil {
								return err
							}
							samples = append(samples, one...)
						}
					}
					for i := range chunk {
						if err := write(&chunk[i], uncertainty.Cells(&samples[i], minerals)); err != nil {
							return err
						}
					}
					done += len(chunk)
					chunk = chunk[:0]
					return nil
				}
				var err error
				if iv.on {
					err = assess.Stream(e.ctx, ch.db, sh.filter(scanItems(ins)), opt, func(r *assess.Record) error {
						bar.Add(1)
						sum.Add(r)
						off.count(r)
						chunk = append(chunk, *r)
						if len(chunk) == intervalChunk {
							return flush()
						}
						return nil
					})
				} else {
					// Without intervals, each row's table line and GeoJSON
					// feature are formatted on the worker that speciated it;
					// only the writing is in input order.
					cw.Flush()
					if err := cw.Error(); err != nil {
						return err
					}
					prepare := func(r *assess.Record, o *rowOutput) { o.format(r, cols, minerals, gs != nil) }
					err = assess.StreamPrepared(e.ctx, ch.db, sh.filter(scanItems(ins)), opt, prepare, func(r *assess.Record, o *rowOutput) error {
						bar.Add(1)
						sum.Add(r)
						off.count(r)
						if _, err := tw.Write(o.line.Bytes()); err != nil {
							return err
						}
						if js != nil {
							if err := js.Write(r); err != nil {
								return err
							}
						}
						if gs != nil {
							return gs.WriteEncoded(o.feature, o.featureErr)
						}
						return nil
					})
				}
				if err == nil {
					err = flush()
				}
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
	var ie *inputError
	if errors.As(err, &ie) {
		return failed(ie.err)
	}
	if err != nil {
		return failed(fmt.Errorf("writing the outputs: %w", err))
	}
	printJoin(e, ins, fieldName)
	if showColumns {
		final := make([]*hydro.Batch, len(ins))
		for i, x := range ins {
			final[i] = x.sc.Batch() // a long file read once: every name met
		}
		printColumns(e.stderr, final)
	}
	if l := off.line(); l != "" {
		e.notes([]string{l})
	}
	for _, x := range ins {
		var l []string
		for _, is := range x.sc.FileIssues() {
			l = append(l, fmt.Sprintf("gwsat: %s: %s", x.meta.File, is))
		}
		e.notes(limitList(l, 10))
	}
	if !oc.quiet {
		if err := e.writeSummary(sum); err != nil {
			return failed(err)
		}
	}
	return oc.verdict(sum)
}

// offTable counts the values of rows that the table has no column for: a
// long file read once from standard input whose parameter is first met
// after the rows the header was built from (hydro.PrefixRows). The JSON
// output still carries them.
type offTable struct {
	analytes, extra map[string]bool
	n               int
	names           map[string]bool
}

func newOffTable(c report.Columns) *offTable {
	o := &offTable{analytes: map[string]bool{}, extra: map[string]bool{}, names: map[string]bool{}}
	for _, a := range c.Analytes {
		o.analytes[a] = true
	}
	for _, x := range c.Extra {
		o.extra[x] = true
	}
	return o
}

func (o *offTable) count(r *assess.Record) {
	for k := range r.Row.Sample.Analytes {
		if !o.analytes[k] {
			o.n++
			o.names[k] = true
		}
	}
	for _, x := range r.Row.Sample.ExtraColumns {
		if !o.extra[x.Header] {
			o.n++
			o.names[x.Header] = true
		}
	}
}

// line says what was left out of the table, "" when nothing was.
func (o *offTable) line() string {
	if o.n == 0 {
		return ""
	}
	names := make([]string, 0, len(o.names))
	for k := range o.names {
		names = append(names, k)
	}
	sort.Strings(names)
	return fmt.Sprintf("gwsat: %d values of %s have no table column (first met after the first %d rows of a file read once; read it from a file, or see --json)", o.n, strings.Join(limitList(names, 10), ", "), hydro.PrefixRows)
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
