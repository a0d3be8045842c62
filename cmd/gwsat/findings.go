package main

import (
	"errors"
	"fmt"
	"io"
	"os"
	"path/filepath"
	"strconv"
	"strings"

	"github.com/spf13/cobra"

	"gwsat.dev/gwsat/assess"
	"gwsat.dev/gwsat/figure"
	"gwsat.dev/gwsat/findings"
	"gwsat.dev/gwsat/internal/progress"
	"gwsat.dev/gwsat/report"
	"gwsat.dev/gwsat/uncertainty"
)

// findingsFlags are the flags of the findings command.
type findingsFlags struct {
	draws                   int
	seed                    uint64
	linear, quiet           bool
	band                    float64
	dist, relSD             string
	out, trendsOut, ivOut   string
	figDir                  string
	cluster, zones          string
	phField, phLab, tempSD  float64
	relDefault, assumedTemp float64
}

func findingsCmd(e *env) *cobra.Command {
	var in inputFlags
	var ff findingsFlags
	c := &cobra.Command{
		Use:   "findings [flags] FILE.csv ... | --demo",
		Short: "which minerals are supersaturated with confidence, where, since when, and how they trend, in plain words",
		Long: "Reads and speciates the lab files as check does, puts an interval on every saturation index from the\n" +
			"uncertainty of pH, temperature, concentrations and non-detects (Monte Carlo with a fixed seed, or\n" +
			"--linear for the fast estimate), tests each well's series for trends, and prints the findings in\n" +
			"plain words on standard output: per mineral supersaturated with confidence, where (cluster and depth\n" +
			"zone), how strongly, since when and the trend; minerals near equilibrium; minerals undersaturated\n" +
			"everywhere; water types. --out writes the same as a table (one row per mineral and group).",
		RunE: func(c *cobra.Command, args []string) error { e.quiet = ff.quiet; return runFindings(e, &in, &ff, args) },
	}
	interspersed(c.Flags())
	in.register(c.Flags())
	f := c.Flags()
	f.IntVar(&ff.draws, "draws", uncertainty.DefaultDraws, "Monte Carlo draws per sample")
	f.Uint64Var(&ff.seed, "seed", 1, "seed of the Monte Carlo draws (reported with the results)")
	f.BoolVar(&ff.linear, "linear", false, "fast linear estimate (sensitivities in quadrature) instead of Monte Carlo")
	f.Float64Var(&ff.band, "band", uncertainty.DefaultBand, "an interval must clear SI = 0 by this much to count as super- or undersaturated")
	f.StringVar(&ff.dist, "distribution", "normal", "distribution of the inputs: normal or uniform (same standard deviation)")
	f.Float64Var(&ff.phField, "ph-field-sd", uncertainty.DefaultPHFieldSD, "standard uncertainty of a field pH")
	f.Float64Var(&ff.phLab, "ph-lab-sd", uncertainty.DefaultPHLabSD, "standard uncertainty of a laboratory pH")
	f.Float64Var(&ff.tempSD, "temp-sd", uncertainty.DefaultTempSD, "standard uncertainty of a reported temperature, C")
	f.Float64Var(&ff.assumedTemp, "assumed-temp-sd", uncertainty.DefaultAssumedTempSD, "standard uncertainty of the 25 C assumed when no temperature was reported")
	f.Float64Var(&ff.relDefault, "rel-sd", uncertainty.DefaultRelSD, "relative standard uncertainty of each concentration and the alkalinity (0.05 = 5 %)")
	f.StringVar(&ff.relSD, "rel-sd-of", "", "per-analyte relative uncertainties, e.g. Ba=0.1,Alk=0.03")
	f.StringVar(&ff.cluster, "cluster", findings.DefaultClusterColumn, "input column grouping wells into clusters")
	f.StringVar(&ff.zones, "zones", "", "depth zone edges in metres, e.g. 0,60,90,150 (default: split at gaps in the depths)")
	f.StringVarP(&ff.out, "out", "o", "", "write the findings table (CSV, one row per mineral and group) to this file")
	f.StringVar(&ff.trendsOut, "trends", "", "write the trend tests (CSV, one row per well and quantity) to this file")
	f.StringVar(&ff.ivOut, "intervals", "", "write every sample's SI intervals (CSV) to this file")
	f.StringVar(&ff.figDir, "figures", "", "write the Stiff diagrams and the SI-against-time pages (PNG) into this folder")
	f.BoolVarP(&ff.quiet, "quiet", "q", false, "no notes on standard error")
	return c
}

// uncertaintyOptions turns the flags into estimate options.
func (ff *findingsFlags) uncertaintyOptions(ch *chemistry) (uncertainty.Options, error) {
	dist, err := uncertainty.ParseDist(ff.dist)
	if err != nil {
		return uncertainty.Options{}, fmt.Errorf("--distribution: %w", err)
	}
	var rel map[string]float64
	if ff.relSD != "" {
		if rel, err = uncertainty.ParseRelSD(ff.relSD); err != nil {
			return uncertainty.Options{}, fmt.Errorf("--rel-sd-of: %w", err)
		}
	}
	// On the command line 0 means none; in the library 0 means the default.
	none := func(v float64) float64 {
		if v == 0 {
			return -1
		}
		return v
	}
	for name, v := range map[string]float64{"--ph-field-sd": ff.phField, "--ph-lab-sd": ff.phLab, "--temp-sd": ff.tempSD, "--assumed-temp-sd": ff.assumedTemp, "--rel-sd": ff.relDefault, "--band": ff.band} {
		if v < 0 {
			return uncertainty.Options{}, fmt.Errorf("%s: %g is negative", name, v)
		}
	}
	return uncertainty.Options{
		Model: ch.model, BalanceOn: ch.bal, Dist: dist, Draws: ff.draws, Seed: ff.seed, Linear: ff.linear,
		PHFieldSD: none(ff.phField), PHLabSD: none(ff.phLab), TempSD: none(ff.tempSD), AssumedTempSD: none(ff.assumedTemp),
		RelSD: none(ff.relDefault), RelSDByAnalyte: rel, Band: none(ff.band),
	}, nil
}

// parseZones reads "0,60,90,150".
func parseZones(s string) ([]float64, error) {
	if strings.TrimSpace(s) == "" {
		return nil, nil
	}
	var out []float64
	for _, p := range strings.Split(s, ",") {
		v, err := strconv.ParseFloat(strings.TrimSpace(p), 64)
		if err != nil || v < 0 {
			return nil, fmt.Errorf("--zones: %q is not a depth in metres", p)
		}
		out = append(out, v)
	}
	if len(out) < 2 {
		return nil, fmt.Errorf("--zones: give at least two edges")
	}
	return out, nil
}

func runFindings(e *env, in *inputFlags, ff *findingsFlags, args []string) error {
	var g guard
	if err := g.inputs(args); err != nil {
		return err
	}
	if err := g.outputs(ff.out, ff.trendsOut, ff.ivOut); err != nil {
		return err
	}
	edges, err := parseZones(ff.zones)
	if err != nil {
		return usageErr(err)
	}
	if ff.draws < 2 {
		return usagef("--draws: %d (want at least 2)", ff.draws)
	}
	ch, err := in.chemistry()
	if err != nil {
		return usageErr(err)
	}
	uopt, err := ff.uncertaintyOptions(ch)
	if err != nil {
		return usageErr(err)
	}
	batches, recs, ch, err := in.assessAll(e, args, false)
	if err != nil {
		return usageErr(err)
	}
	bar := progress.New(stderrFile(e), "saturation intervals", len(recs))
	uopt.Progress = func() { bar.Add(1) }
	samples, err := uncertainty.Run(e.ctx, ch.db, recs, uopt)
	bar.Done()
	if err != nil {
		return failed(err)
	}
	minerals := ch.db.MineralNames()
	trends := findings.Trends(recs, minerals, 0)
	fd, err := findings.Build(recs, samples, trends, ff.band, findings.Options{ClusterColumn: ff.cluster, ZoneEdgesM: edges})
	if err != nil {
		return failed(err)
	}
	if err := e.writeFile("-", fd.WriteText); err != nil {
		return failed(err)
	}
	if ff.out != "" {
		if err := e.writeFile(ff.out, fd.Table().WriteCSV); err != nil {
			return failed(fmt.Errorf("writing %s: %w", ff.out, err))
		}
	}
	if ff.trendsOut != "" {
		if err := e.writeFile(ff.trendsOut, findings.TrendTable(trends).WriteCSV); err != nil {
			return failed(fmt.Errorf("writing %s: %w", ff.trendsOut, err))
		}
	}
	if ff.ivOut != "" {
		if err := e.writeFile(ff.ivOut, intervalTable(recs, samples, minerals).WriteCSV); err != nil {
			return failed(fmt.Errorf("writing %s: %w", ff.ivOut, err))
		}
	}
	if ff.figDir != "" {
		figs := append(findings.StiffFigures(recs), findings.SITimeFigures(recs, samples, trends, findings.DefaultMinerals(ch.db, fd), ff.band)...)
		if err := writeFigures(e, ff.figDir, figs); err != nil {
			return failed(err)
		}
	}
	nFailed := 0
	for i := range samples {
		if errors.Is(samples[i].Err, uncertainty.ErrDraws) {
			nFailed++
			if !ff.quiet {
				msg := strings.TrimPrefix(samples[i].Err.Error(), "uncertainty: ")
				e.printLines([]string{fmt.Sprintf("%s line %d (%s): no SI intervals: %s", recs[i].File, recs[i].Row.Line, recs[i].Sample().ID, msg)})
			}
		}
	}
	if !ff.quiet {
		e.printLines([]string{fmt.Sprintf("gwsat findings: %d rows from %s; intervals for %d", len(recs), strings.Join(files(batches), ", "), fd.WithIntervals)})
	}
	if nFailed > 0 {
		return failed(fmt.Errorf("the interval estimate failed for %d %s", nFailed, plural(nFailed, "sample", "samples")))
	}
	return nil
}

// intervalTable is every sample's intervals, one row per input row.
func intervalTable(recs []assess.Record, samples []uncertainty.Sample, minerals []string) *report.Table {
	t := &report.Table{Header: append([]string{"file", "line", "sample_id", "well_id", "round", "method", "seed", "stream", "draws", "failed_draws", "interval_status"}, uncertainty.Columns(minerals)...)}
	for i := range recs {
		s := recs[i].Sample()
		sm := &samples[i]
		row := []string{report.Text(recs[i].File), strconv.Itoa(recs[i].Row.Line), report.Text(s.ID), report.Text(s.WellID), report.Text(s.Round),
			sm.Method, strconv.FormatUint(sm.Seed, 10), strconv.FormatUint(sm.Stream, 10), strconv.Itoa(sm.Draws), strconv.Itoa(sm.Failed), report.Text(sm.Status())}
		if sm.Method == uncertainty.MethodLinear {
			row[6], row[7], row[8] = "", "", ""
		}
		t.Add(append(row, uncertainty.Cells(sm, minerals)...)...)
	}
	return t
}

// writeFigures renders figures as PNG files into dir (created).
func writeFigures(e *env, dir string, figs []report.Fig) error {
	if err := os.MkdirAll(dir, 0o755); err != nil {
		return fmt.Errorf("--figures: %w", err)
	}
	for _, f := range figs {
		png, err := figure.Render(f.Figure, "png", f.W, f.H)
		if err != nil {
			return fmt.Errorf("drawing %s: %w", f.Stem, err)
		}
		path := filepath.Join(dir, f.Stem+".png")
		if err := e.writeFile(path, func(w io.Writer) error { _, err := w.Write(png); return err }); err != nil {
			return fmt.Errorf("writing %s: %w", path, err)
		}
	}
	return nil
}
