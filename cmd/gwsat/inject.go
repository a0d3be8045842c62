package main

import (
	"errors"
	"fmt"
	"io"
	"path/filepath"
	"strings"

	"github.com/spf13/cobra"

	"gwsat.dev/gwsat/figure"
	"gwsat.dev/gwsat/inject"
	"gwsat.dev/gwsat/report"
	"gwsat.dev/gwsat/speciation"
	"gwsat.dev/gwsat/speciation/reaction"
)

func injectCmd(e *env) *cobra.Command {
	c := &cobra.Command{
		Use:   "inject",
		Short: "injection planning: blend, warm, deposit, dose, porefill",
		Long: "Questions of an injection planner, for waters of a lab file chosen by sample id:\n" +
			"  blend     blend the injectate with a native water over a range of shares: SI of each mineral\n" +
			"  warm      warm or cool one water: SI of each mineral against temperature\n" +
			"  deposit   how much of each supersaturated mineral would deposit, alone and together\n" +
			"  dose      add a salt or another water step by step: which mineral saturates first\n" +
			"  porefill  upper-bound screen of how fast a deposit fills the pores around a well\n\n" +
			report.CautionLine,
		Args: cobra.NoArgs,
		RunE: func(c *cobra.Command, args []string) error {
			if err := c.Help(); err != nil {
				return err
			}
			return quietExit(exitUsage)
		},
	}
	c.AddCommand(blendCmd(e), warmCmd(e), depositCmd(e), doseCmd(e), porefillCmd(e))
	return c
}

// planFlags are the flags every injection-planning command has.
type planFlags struct {
	in     inputFlags
	out    string
	quiet  bool
	figure string
}

func (p *planFlags) register(c *cobra.Command, withFigure bool) {
	f := c.Flags()
	interspersed(f)
	p.in.register(f)
	f.StringVarP(&p.out, "out", "o", "-", "table output (CSV), '-' for standard output")
	f.BoolVarP(&p.quiet, "quiet", "q", false, "no summary on standard error")
	if withFigure {
		f.StringVar(&p.figure, "figure", "", "also draw the figure to this file (.png, .svg or .pdf)")
	}
}

// planner checks the outputs against the inputs, reads and assesses the input
// and returns a planner. extra are the command's other output files.
func (p *planFlags) planner(e *env, args []string, extra ...string) (*inject.Planner, error) {
	e.quiet = p.quiet
	var g guard
	if err := g.inputs(args); err != nil {
		return nil, err
	}
	if err := g.outputs(append([]string{p.out, p.figure}, extra...)...); err != nil {
		return nil, err
	}
	if strings.EqualFold(strings.TrimSpace(p.in.pressure), "hydrostatic") {
		return nil, usagef("--pressure hydrostatic: the injection commands solve every step at one pressure; give it in bar (or with a unit)")
	}
	_, recs, ch, err := p.in.assessAll(e, args, false)
	if err != nil {
		return nil, err
	}
	pl := inject.NewPlanner(ch.db, ch.model, recs)
	pl.Reactor().PressureBar = ch.pressureBar
	return pl, nil
}

// finish writes the table, the figure and the summary of a command.
func (p *planFlags) finish(e *env, tbl *report.Table, fig *report.Fig, summary []string) error {
	if err := e.writeFile(p.out, tbl.WriteCSV); err != nil {
		return failed(err)
	}
	if p.figure != "" && fig != nil {
		format := strings.TrimPrefix(strings.ToLower(filepath.Ext(p.figure)), ".")
		b, err := figure.Render(fig.Figure, format, fig.W, fig.H)
		if err != nil {
			return failed(fmt.Errorf("--figure: %w", err))
		}
		if err := e.writeFile(p.figure, func(w io.Writer) error { _, err := w.Write(b); return err }); err != nil {
			return failed(err)
		}
	}
	if !p.quiet {
		e.printLines(summary)
	}
	return nil
}

// chemistryErr maps an error of the planning library to an exit: a solve that
// did not converge is a failure (1), anything about the input is usage (2).
func chemistryErr(err error) error {
	var se *reaction.SolveError
	if errors.As(err, &se) && !errors.Is(err, speciation.ErrTemperature) {
		return failed(err)
	}
	return usageErr(err)
}

// checkFigurePath refuses a figure name whose format is unknown, before any work.
func checkFigurePath(path string) error {
	if path == "" {
		return nil
	}
	switch strings.ToLower(filepath.Ext(path)) {
	case ".png", ".svg", ".pdf":
		return nil
	}
	return usagef("--figure %s: the name must end in .png, .svg or .pdf", path)
}

func blendCmd(e *env) *cobra.Command {
	var p planFlags
	var opt inject.BlendOptions
	var shares, atTemp, minerals, peaks string
	c := &cobra.Command{
		Use:   "blend --native ID --injectate ID [flags] FILE.csv | --demo",
		Short: "blend the injectate with a native water over a range of shares: SI of each mineral",
		RunE: func(c *cobra.Command, args []string) error {
			if err := checkFigurePath(p.figure); err != nil {
				return err
			}
			var err error
			if opt.Shares, err = parseRange(shares, 0, 1); err != nil {
				return usagef("--shares: %w", err)
			}
			if atTemp != "" {
				if opt.TempC, err = parseTemp(atTemp); err != nil {
					return usagef("--at-temp: %w", err)
				}
				opt.FixedTemp = true
			}
			pl, err := p.planner(e, args, peaks)
			if err != nil {
				return usageErr(err)
			}
			if opt.Minerals, err = pl.Database().ParseMinerals(minerals); err != nil {
				return usagef("--minerals: %w", err)
			}
			opt.Native = defaultID(p.in.demo, opt.Native, demoNative)
			opt.Injectate = defaultID(p.in.demo, opt.Injectate, demoInjectate)
			r, err := pl.Blend(opt)
			if err != nil {
				return chemistryErr(err)
			}
			if peaks != "" {
				if err := e.writeFile(peaks, r.PeaksTable().WriteCSV); err != nil {
					return failed(err)
				}
			}
			fig := r.Figure()
			return p.finish(e, r.Table(), &fig, r.Summary())
		},
	}
	p.register(c, true)
	f := c.Flags()
	f.StringVar(&opt.Native, "native", "", "the native water (share 0; demo: "+demoNative+")")
	f.StringVar(&opt.Injectate, "injectate", "", "the injectate (share 1; demo: "+demoInjectate+")")
	f.StringVar(&shares, "shares", "0:1:0.05", "shares of the injectate by mass of water: FROM:TO:STEP or a list, 0-1")
	f.StringVar(&atTemp, "at-temp", "", "temperature of every blend in C, e.g. the aquifer's (default: heat balance of the two)")
	f.StringVar(&minerals, "minerals", "", "minerals in the figure (default: up to 8 whose SI rises above -0.5 somewhere)")
	f.StringVar(&peaks, "peaks", "", "also write where each mineral's SI peaks as CSV to this file")
	return c
}

func warmCmd(e *env) *cobra.Command {
	var p planFlags
	var opt inject.WarmOptions
	var temps, minerals string
	c := &cobra.Command{
		Use:   "warm --sample ID [flags] FILE.csv | --demo",
		Short: "warm or cool one water: SI of each mineral against temperature",
		RunE: func(c *cobra.Command, args []string) error {
			if err := checkFigurePath(p.figure); err != nil {
				return err
			}
			var err error
			if opt.TempsC, err = parseRange(temps, speciation.MinTempC, speciation.MaxTempC); err != nil {
				return usagef("--temps: %w", err)
			}
			pl, err := p.planner(e, args)
			if err != nil {
				return usageErr(err)
			}
			if opt.Minerals, err = pl.Database().ParseMinerals(minerals); err != nil {
				return usagef("--minerals: %w", err)
			}
			opt.Sample = defaultID(p.in.demo, opt.Sample, demoInjectate)
			r, err := pl.Warm(opt)
			if err != nil {
				return chemistryErr(err)
			}
			fig := r.Figure()
			return p.finish(e, r.Table(), &fig, r.Summary())
		},
	}
	p.register(c, true)
	f := c.Flags()
	f.StringVar(&opt.Sample, "sample", "", "the water to warm or cool (demo: "+demoInjectate+")")
	f.StringVar(&temps, "temps", "10:90:5", "temperatures in C: FROM:TO:STEP or a list (0-100)")
	f.StringVar(&minerals, "minerals", "", "minerals in the figure (default: up to 8 whose SI rises above -0.5 somewhere)")
	return c
}

// waterFlags choose one water or a blend (deposit, porefill).
type waterFlags struct {
	choice inject.WaterChoice
	atTemp string
	cands  string
}

func (w *waterFlags) register(c *cobra.Command) {
	f := c.Flags()
	f.StringVar(&w.choice.Sample, "sample", "", "a single water (instead of a blend of --native and --injectate)")
	f.StringVar(&w.choice.Native, "native", "", "the native water of a blend (demo: "+demoNative+")")
	f.StringVar(&w.choice.Injectate, "injectate", "", "the injectate of a blend (demo: "+demoInjectate+")")
	f.Float64Var(&w.choice.Share, "share", 0.5, "share of the injectate in the blend, by mass of water (0-1)")
	f.StringVar(&w.atTemp, "at-temp", "", "temperature in C (default: the water's own, or the heat balance of a blend)")
	f.StringVar(&w.cands, "candidates", "", "minerals that may deposit (default: the common scale minerals: "+strings.Join(reaction.ScaleMinerals(), ", ")+")")
}

func (w *waterFlags) options(demo bool, db *speciation.Database) (inject.DepositOptions, error) {
	ch := w.choice
	if ch.Sample == "" {
		ch.Native = defaultID(demo, ch.Native, demoNative)
		ch.Injectate = defaultID(demo, ch.Injectate, demoInjectate)
	}
	if w.atTemp != "" {
		t, err := parseTemp(w.atTemp)
		if err != nil {
			return inject.DepositOptions{}, fmt.Errorf("--at-temp: %w", err)
		}
		ch.TempC = &t
	}
	cands, err := db.ParseMinerals(w.cands)
	if err != nil {
		return inject.DepositOptions{}, fmt.Errorf("--candidates: %w", err)
	}
	return inject.DepositOptions{Water: ch, Candidates: cands}, nil
}

func depositCmd(e *env) *cobra.Command {
	var p planFlags
	var w waterFlags
	var residual string
	c := &cobra.Command{
		Use:   "deposit (--sample ID | --native ID --injectate ID --share F) [flags] FILE.csv | --demo",
		Short: "how much of each supersaturated mineral would deposit to reach equilibrium, alone and together",
		RunE: func(c *cobra.Command, args []string) error {
			if err := checkFigurePath(p.figure); err != nil {
				return err
			}
			pl, err := p.planner(e, args, residual)
			if err != nil {
				return usageErr(err)
			}
			opt, err := w.options(p.in.demo, pl.Database())
			if err != nil {
				return usageErr(err)
			}
			r, err := pl.Deposit(opt)
			if err != nil {
				return chemistryErr(err)
			}
			if residual != "" {
				if err := e.writeFile(residual, r.ResidualTable().WriteCSV); err != nil {
					return failed(err)
				}
			}
			var fig *report.Fig
			if r.HasFigure() {
				f := r.Figure()
				fig = &f
			} else if p.figure != "" {
				fmt.Fprintf(e.stderr, "gwsat inject deposit: nothing deposits, so no figure drawn to %s\n", p.figure)
			}
			return p.finish(e, r.Table(), fig, r.Summary())
		},
	}
	p.register(c, true)
	w.register(c)
	c.Flags().StringVar(&residual, "residual", "", "also write the water before and after (pH, totals) as CSV to this file")
	return c
}

func doseCmd(e *env) *cobra.Command {
	var p planFlags
	var opt inject.DoseOptions
	var cands string
	c := &cobra.Command{
		Use:   "dose --sample ID (--add-salt FORMULA | --add-water ID) [flags] FILE.csv | --demo",
		Short: "add a salt or another water step by step: the order in which minerals saturate",
		RunE: func(c *cobra.Command, args []string) error {
			pl, err := p.planner(e, args)
			if err != nil {
				return usageErr(err)
			}
			if opt.Candidates, err = pl.Database().ParseMinerals(cands); err != nil {
				return usagef("--candidates: %w", err)
			}
			if p.in.demo && opt.Salt == "" && opt.AddWater == "" {
				// Demo default: sulfate dosed into the barium- and strontium-bearing
				// deep native water, which sulfate deposits first.
				opt.Salt, opt.SaltLabel = "2 Na+ + SO4 2-", "Na2SO4"
			}
			opt.Sample = defaultID(p.in.demo, opt.Sample, demoDeep)
			r, err := pl.Dose(opt)
			if err != nil {
				return chemistryErr(err)
			}
			return p.finish(e, r.Table(), nil, r.Summary())
		},
	}
	p.register(c, false)
	f := c.Flags()
	f.StringVar(&opt.Sample, "sample", "", "the water dosed (demo: "+demoDeep+" with Na2SO4)")
	f.StringVar(&opt.Salt, "add-salt", "", `a pure salt as components, e.g. "2 Na+ + SO4 2-" (amounts in mol/kgw)`)
	f.StringVar(&opt.SaltLabel, "salt-label", "", "a name for the salt in outputs, e.g. Na2SO4")
	f.StringVar(&opt.AddWater, "add-water", "", "sample id of a water added instead of a salt (amounts in kg per kg of water)")
	f.Float64Var(&opt.UpTo, "up-to", 0, "largest amount added (default: 0.1 mol/kgw of salt, or 10 kg/kg of a water)")
	f.Float64Var(&opt.CleanRemoval, "clean-removal", 0.999, "share of an earlier mineral's cation removed before the next begins, for a clean separation")
	f.StringVar(&cands, "candidates", "", "minerals that may deposit (default: the common scale minerals)")
	return c
}

func porefillCmd(e *env) *cobra.Command {
	var p planFlags
	var w waterFlags
	well := inject.DefaultWell()
	c := &cobra.Command{
		Use:   "porefill (--sample ID | --native ID --injectate ID --share F) [flags] FILE.csv | --demo",
		Short: "upper-bound screen of how fast a deposit fills the pores around an injection well",
		RunE: func(c *cobra.Command, args []string) error {
			if err := well.Check(); err != nil {
				return usageErr(err) // before any chemistry: a bad number writes nothing
			}
			pl, err := p.planner(e, args)
			if err != nil {
				return usageErr(err)
			}
			dep, err := w.options(p.in.demo, pl.Database())
			if err != nil {
				return usageErr(err)
			}
			r, err := pl.PoreFill(inject.PoreFillOptions{Deposit: dep, Well: well})
			if err != nil {
				return chemistryErr(err)
			}
			return p.finish(e, r.Table(), nil, r.Summary())
		},
	}
	p.register(c, false)
	w.register(c)
	f := c.Flags()
	f.Float64Var(&well.RateM3PerDay, "rate", well.RateM3PerDay, "injection rate, m3/day")
	f.Float64Var(&well.Days, "days", well.Days, "duration of injection, days")
	f.Float64Var(&well.ScreenLengthM, "screen", well.ScreenLengthM, "screen length, m")
	f.Float64Var(&well.Porosity, "porosity", well.Porosity, "effective porosity near the well (0-1)")
	f.Float64Var(&well.RadiusM, "radius", well.RadiusM, "near-well radius within which the filled share is reported, m")
	f.Float64Var(&well.WellRadiusM, "bore-radius", well.WellRadiusM, "radius of the well bore, m")
	f.Float64Var(&well.FillShare, "fill-share", well.FillShare, "share of the porosity for the fill radius")
	return c
}
