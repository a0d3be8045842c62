package main

import (
	"errors"
	"flag"
	"fmt"
	"io"
	"math"
	"path/filepath"
	"sort"
	"strconv"
	"strings"

	"gwsat.dev/gwsat/assess"
	"gwsat.dev/gwsat/figure"
	"gwsat.dev/gwsat/hydro"
	"gwsat.dev/gwsat/report"
	"gwsat.dev/gwsat/speciation"
	"gwsat.dev/gwsat/speciation/reaction"

	"gonum.org/v1/plot/vg"
)

// caution ends every summary of the injection-planning commands.
const caution = "  Screening results, not a design: defer to local codes and licensed professionals."

// Demo end-members: the injectate of round 2 and the native water of the
// intermediate zone (see data/demo/README.md).
const (
	demoInject = "INJ-R2"
	demoNative = "NATIVE-R1"
	demoDeep   = "NATIVE-D-R1"
)

func init() {
	register(command{name: "mix", summary: "mix two waters over fractions: SI of each mineral per fraction, and each maximum", run: runMix})
	register(command{name: "heat", summary: "heat or cool one water: SI of each mineral against temperature", run: runHeat})
	register(command{name: "precipitate", summary: "how much of each supersaturated mineral precipitates to equilibrium, alone and together", run: runPrecipitate})
	register(command{name: "sequence", summary: "order in which minerals saturate as a salt or a water is added step by step", run: runSequence})
	register(command{name: "clogging", summary: "upper-bound screen of how fast precipitate fills the pores around an injection well", run: runClogging})
}

// waterFlags choose waters from the input by sample id.
type waterFlags struct {
	in     inputFlags
	out    string
	jsonTo string
	plot   string
}

func (w *waterFlags) register(fs *flag.FlagSet) {
	w.in.register(fs)
	fs.StringVar(&w.out, "o", "-", "table output (CSV), '-' for standard output")
	fs.StringVar(&w.plot, "plot", "", "also draw the figure to this file (.png, .svg or .pdf)")
}

// loaded is the input of an injection-planning command.
type loaded struct {
	recs    []assess.Record
	db      *speciation.Database
	reactor *reaction.Reactor
}

func (w *waterFlags) load(e *env, args []string) (*loaded, error) {
	_, recs, db, err := w.in.assessAll(e, args)
	if err != nil {
		return nil, err
	}
	model, _ := w.in.activityModel()
	return &loaded{recs: recs, db: db, reactor: reaction.New(db, model)}, nil
}

// water finds a sample by id and prepares it (speciated as measured).
func (l *loaded) water(flagName, id string) (reaction.Solution, *assess.Record, error) {
	if id == "" {
		return reaction.Solution{}, nil, fmt.Errorf("-%s: give a sample id", flagName)
	}
	var hit *assess.Record
	for i := range l.recs {
		if l.recs[i].Sample().ID == id {
			if hit != nil {
				return reaction.Solution{}, nil, fmt.Errorf("-%s %s: the id occurs on lines %d and %d; make it unique", flagName, id, hit.Row.Line, l.recs[i].Row.Line)
			}
			hit = &l.recs[i]
		}
	}
	if hit == nil {
		return reaction.Solution{}, nil, fmt.Errorf("-%s %s: no sample with that id in the input", flagName, id)
	}
	if hit.Status == hydro.StatusRejected || hit.Result == nil {
		return reaction.Solution{}, nil, fmt.Errorf("-%s %s (line %d): cannot be used: %s", flagName, id, hit.Row.Line, firstProblem(hit))
	}
	var sw speciation.Water
	assess.SpeciationWater(&sw, &hit.Water, hit.TempC())
	sol, _, err := l.reactor.Prepare(&sw)
	if err != nil {
		return reaction.Solution{}, nil, fmt.Errorf("-%s %s: %v", flagName, id, err)
	}
	return sol, hit, nil
}

// minerals checks a comma-separated list against the data.
func mineralList(db *speciation.Database, s string) ([]string, error) {
	if strings.TrimSpace(s) == "" {
		return nil, nil
	}
	var out []string
	for _, m := range strings.Split(s, ",") {
		m = strings.TrimSpace(m)
		mm := db.Mineral(m)
		if mm == nil || mm.Gas {
			return nil, fmt.Errorf("unknown mineral %q (known: %s)", m, strings.Join(report.SolidMinerals(db), ", "))
		}
		out = append(out, mm.Name)
	}
	return out, nil
}

// parseRange reads "FROM:TO:STEP" or a comma-separated list.
func parseRange(s string) ([]float64, error) {
	if strings.Count(s, ":") == 2 {
		p := strings.Split(s, ":")
		var v [3]float64
		for i := range p {
			f, err := strconv.ParseFloat(strings.TrimSpace(p[i]), 64)
			if err != nil {
				return nil, fmt.Errorf("%q is not a number", p[i])
			}
			v[i] = f
		}
		if !(v[2] > 0) || v[1] < v[0] || math.IsInf(v[0], 0) || math.IsInf(v[1], 0) {
			return nil, fmt.Errorf("range %q: want FROM:TO:STEP, finite, with TO >= FROM and STEP > 0", s)
		}
		if (v[1]-v[0])/v[2] > maxRangeValues {
			return nil, fmt.Errorf("range %q gives more than %d values", s, maxRangeValues)
		}
		var out []float64
		n := int((v[1]-v[0])/v[2] + 1e-9)
		for i := 0; i <= n; i++ {
			out = append(out, v[0]+float64(i)*v[2])
		}
		return out, nil
	}
	var out []float64
	for _, f := range strings.Split(s, ",") {
		v, err := strconv.ParseFloat(strings.TrimSpace(f), 64)
		if err != nil || math.IsNaN(v) || math.IsInf(v, 0) {
			return nil, fmt.Errorf("%q is not a finite number", f)
		}
		out = append(out, v)
	}
	if len(out) > maxRangeValues {
		return nil, fmt.Errorf("more than %d values", maxRangeValues)
	}
	return out, nil
}

// maxRangeValues caps the points of a sweep (a typo such as a step of 1e-12
// must not exhaust memory).
const maxRangeValues = 10000

// defaultID returns the demo's end-member when -demo is set.
func defaultID(demo bool, id, demoID string) string {
	if id == "" && demo {
		return demoID
	}
	return id
}

// usageErr maps errors to exit codes: a chemistry failure (a solve that did
// not converge) is 1, anything about the input or arguments is 2.
func usageErr(e *env, cmd string, err error) int {
	var se *reaction.SolveError
	if errors.As(err, &se) && !errors.Is(err, speciation.ErrTemperature) {
		return failf(e, exitRejected, "%s: %v", cmd, err)
	}
	return failf(e, exitUsage, "%s: %v", cmd, err)
}

// plotTo renders a figure to a file whose extension names the format.
func plotTo(e *env, path string, f figure.Figure, w, h vg.Length) error {
	if path == "" {
		return nil
	}
	format := strings.TrimPrefix(strings.ToLower(filepath.Ext(path)), ".")
	b, err := figure.Render(f, format, w, h)
	if err != nil {
		return err
	}
	return e.writeFile(path, func(wr io.Writer) error { _, err := wr.Write(b); return err })
}

func runMix(e *env, args []string) int {
	fs := newFlags(e, "mix", "mix -a ID -b ID [flags] FILE.csv | -demo")
	var wf waterFlags
	wf.register(fs)
	a := fs.String("a", "", "first water (fraction 0), e.g. the native groundwater (demo: "+demoNative+")")
	b := fs.String("b", "", "second water (fraction 1), e.g. the injectate (demo: "+demoInject+")")
	fr := fs.String("fractions", "0:1:0.05", "fractions of the second water by mass of water: FROM:TO:STEP or a list")
	temp := fs.String("temp", "", "temperature of every mixture in C, e.g. the aquifer's (default: heat balance of the two)")
	mins := fs.String("minerals", "", "minerals in the figure (default: up to 8 whose SI rises above -0.5 somewhere)")
	maxTo := fs.String("maxima", "", "also write each mineral's maximum (fraction and SI) as CSV to this file")
	if code, ok := parseFlags(fs, args); !ok {
		return code
	}
	fractions, err := parseRange(*fr)
	if err != nil {
		return failf(e, exitUsage, "mix: -fractions: %v", err)
	}
	opt := reaction.SweepOptions{Fractions: fractions}
	if *temp != "" {
		t, err := strconv.ParseFloat(*temp, 64)
		if err != nil {
			return failf(e, exitUsage, "mix: -temp %q is not a number", *temp)
		}
		opt.TempC, opt.FixedTemp = t, true
	}
	l, err := wf.load(e, fs.Args())
	if err != nil {
		return failf(e, exitUsage, "mix: %v", err)
	}
	figMinerals, err := mineralList(l.db, *mins)
	if err != nil {
		return failf(e, exitUsage, "mix: -minerals: %v", err)
	}
	wa, ra, err := l.water("a", defaultID(wf.in.demo, *a, demoNative))
	if err != nil {
		return failf(e, exitUsage, "mix: %v", err)
	}
	wb, rb, err := l.water("b", defaultID(wf.in.demo, *b, demoInject))
	if err != nil {
		return failf(e, exitUsage, "mix: %v", err)
	}
	sw, err := l.reactor.Sweep(wa, wb, opt)
	if err != nil {
		return usageErr(e, "mix", err)
	}
	if err := e.writeFile(wf.out, report.SweepTable(sw).WriteCSV); err != nil {
		return failf(e, exitRejected, "mix: %v", err)
	}
	if *maxTo != "" {
		if err := e.writeFile(*maxTo, report.MaximaTable(sw).WriteCSV); err != nil {
			return failf(e, exitRejected, "mix: %v", err)
		}
	}
	if figMinerals == nil {
		figMinerals = relevant(sw, -0.5)
	}
	title := fmt.Sprintf("Mixing %s (0) with %s (1)", ra.Sample().ID, rb.Sample().ID)
	if err := plotTo(e, wf.plot, report.SweepFigure(sw, title, mixCaption(opt, l), false, figMinerals), 16*vg.Centimeter, 12*vg.Centimeter); err != nil {
		return failf(e, exitRejected, "mix: -plot: %v", err)
	}
	fmt.Fprintf(e.stderr, "gwsat mix: %s + %s, %d fractions, %s\n", ra.Sample().ID, rb.Sample().ID, len(sw.Points), tempNote(opt))
	for _, m := range sw.Maxima() {
		fmt.Fprintf(e.stderr, "  %-16s max SI %+.2f at fraction %.2f (%s)\n", m.Mineral, m.SI, m.Fraction, state(m.SI))
	}
	fmt.Fprintln(e.stderr, caution)
	return exitOK
}

func tempNote(opt reaction.SweepOptions) string {
	if opt.FixedTemp {
		return fmt.Sprintf("every mixture at %.1f C", opt.TempC)
	}
	return "each mixture at the heat-balance temperature"
}

func mixCaption(opt reaction.SweepOptions, l *loaded) string {
	return fmt.Sprintf("Closed-system mixing by mass of water, alkalinity and total carbon conserved, %s, %s model. Screening result, not a design.",
		tempNote(opt), l.reactor.Model().Name())
}

// maxCurves caps the minerals drawn in one curve figure, so that it stays
// readable.
const maxCurves = 8

// relevant lists the minerals whose SI rises above floor somewhere, the
// highest maxima first, at most maxCurves.
func relevant(sw *reaction.Sweep, floor float64) []string {
	mx := sw.Maxima()
	sort.SliceStable(mx, func(i, j int) bool { return mx[i].SI > mx[j].SI })
	var out []string
	for _, m := range mx {
		if m.SI > floor && len(out) < maxCurves {
			out = append(out, m.Mineral)
		}
	}
	return out
}

func runHeat(e *env, args []string) int {
	fs := newFlags(e, "heat", "heat -water ID [flags] FILE.csv | -demo")
	var wf waterFlags
	wf.register(fs)
	id := fs.String("water", "", "the water to heat or cool (demo: "+demoInject+")")
	temps := fs.String("temps", "10:90:5", "temperatures in C: FROM:TO:STEP or a list (0-100)")
	mins := fs.String("minerals", "", "minerals in the figure (default: up to 8 whose SI rises above -0.5 somewhere)")
	if code, ok := parseFlags(fs, args); !ok {
		return code
	}
	ts, err := parseRange(*temps)
	if err != nil {
		return failf(e, exitUsage, "heat: -temps: %v", err)
	}
	for _, t := range ts {
		if t < speciation.MinTempC || t > speciation.MaxTempC {
			return failf(e, exitUsage, "heat: temperature %g C outside the supported %g-%g C", t, speciation.MinTempC, speciation.MaxTempC)
		}
	}
	l, err := wf.load(e, fs.Args())
	if err != nil {
		return failf(e, exitUsage, "heat: %v", err)
	}
	figMinerals, err := mineralList(l.db, *mins)
	if err != nil {
		return failf(e, exitUsage, "heat: -minerals: %v", err)
	}
	w, rec, err := l.water("water", defaultID(wf.in.demo, *id, demoInject))
	if err != nil {
		return failf(e, exitUsage, "heat: %v", err)
	}
	sw, err := l.reactor.TemperatureSweep(w, ts, nil)
	if err != nil {
		return usageErr(e, "heat", err)
	}
	if err := e.writeFile(wf.out, report.SweepTable(sw).WriteCSV); err != nil {
		return failf(e, exitRejected, "heat: %v", err)
	}
	if figMinerals == nil {
		figMinerals = relevant(sw, -0.5)
	}
	title := fmt.Sprintf("Heating or cooling %s", rec.Sample().ID)
	cap := fmt.Sprintf("Closed system: totals and alkalinity fixed, pH recomputed at each temperature; %s model. Screening result, not a design.", l.reactor.Model().Name())
	if err := plotTo(e, wf.plot, report.SweepFigure(sw, title, cap, true, figMinerals), 16*vg.Centimeter, 12*vg.Centimeter); err != nil {
		return failf(e, exitRejected, "heat: -plot: %v", err)
	}
	fmt.Fprintf(e.stderr, "gwsat heat: %s over %g-%g C\n", rec.Sample().ID, ts[0], ts[len(ts)-1])
	for _, m := range sw.Maxima() {
		fmt.Fprintf(e.stderr, "  %-16s max SI %+.2f at %.0f C\n", m.Mineral, m.SI, m.TempC)
	}
	fmt.Fprintln(e.stderr, caution)
	return exitOK
}

// mixture returns the water of -water, or the mixture of -a and -b at
// -fraction (and -temp), for precipitate and clogging.
type mixtureFlags struct {
	water, a, b string
	fraction    float64
	temp        string
}

func (m *mixtureFlags) register(fs *flag.FlagSet) {
	fs.StringVar(&m.water, "water", "", "a single water to precipitate from (instead of -a/-b)")
	fs.StringVar(&m.a, "a", "", "first water of a mixture (demo: "+demoNative+")")
	fs.StringVar(&m.b, "b", "", "second water of a mixture (demo: "+demoInject+")")
	fs.Float64Var(&m.fraction, "fraction", 0.5, "fraction of the second water in the mixture, by mass of water (0-1)")
	fs.StringVar(&m.temp, "temp", "", "temperature in C (default: the water's own, or the heat balance of a mixture)")
}

func (m *mixtureFlags) solution(l *loaded, demo bool) (reaction.Solution, string, error) {
	var tempC *float64
	if m.temp != "" {
		t, err := strconv.ParseFloat(m.temp, 64)
		if err != nil {
			return reaction.Solution{}, "", fmt.Errorf("-temp %q is not a number", m.temp)
		}
		if t < speciation.MinTempC || t > speciation.MaxTempC {
			return reaction.Solution{}, "", fmt.Errorf("-temp %g C outside the supported %g-%g C", t, speciation.MinTempC, speciation.MaxTempC)
		}
		tempC = &t
	}
	if m.water != "" {
		w, rec, err := l.water("water", m.water)
		if err != nil {
			return w, "", err
		}
		if tempC != nil {
			w.TempC = *tempC
		}
		return w, rec.Sample().ID, nil
	}
	if m.fraction < 0 || m.fraction > 1 || m.fraction != m.fraction {
		return reaction.Solution{}, "", fmt.Errorf("-fraction %g outside 0-1", m.fraction)
	}
	wa, ra, err := l.water("a", defaultID(demo, m.a, demoNative))
	if err != nil {
		return wa, "", err
	}
	wb, rb, err := l.water("b", defaultID(demo, m.b, demoInject))
	if err != nil {
		return wb, "", err
	}
	t := reaction.MixTempC(wa, wb, m.fraction)
	if tempC != nil {
		t = *tempC
	}
	mix, _, err := l.reactor.Mix(wa, wb, m.fraction, t)
	name := fmt.Sprintf("%.0f %% %s + %.0f %% %s at %.1f C", 100*(1-m.fraction), ra.Sample().ID, 100*m.fraction, rb.Sample().ID, t)
	return mix, name, err
}

func runPrecipitate(e *env, args []string) int {
	fs := newFlags(e, "precipitate", "precipitate (-water ID | -a ID -b ID -fraction F) [flags] FILE.csv | -demo")
	var wf waterFlags
	wf.register(fs)
	var mf mixtureFlags
	mf.register(fs)
	mins := fs.String("minerals", "", "candidate minerals (default: common scale minerals: "+strings.Join(reaction.ScaleMinerals(), ", ")+")")
	leftTo := fs.String("left", "", "also write the water before and after (pH, totals) as CSV to this file")
	if code, ok := parseFlags(fs, args); !ok {
		return code
	}
	l, err := wf.load(e, fs.Args())
	if err != nil {
		return failf(e, exitUsage, "precipitate: %v", err)
	}
	cands, err := mineralList(l.db, *mins)
	if err != nil {
		return failf(e, exitUsage, "precipitate: -minerals: %v", err)
	}
	sol, name, err := mf.solution(l, wf.in.demo)
	if err != nil {
		return usageErr(e, "precipitate", err)
	}
	p, err := l.reactor.Precipitate(sol, reaction.PrecipOptions{Minerals: cands})
	if err != nil {
		return usageErr(e, "precipitate", err)
	}
	if err := e.writeFile(wf.out, report.PrecipitationTable(p).WriteCSV); err != nil {
		return failf(e, exitRejected, "precipitate: %v", err)
	}
	if *leftTo != "" {
		if err := e.writeFile(*leftTo, report.WaterLeftTable(p).WriteCSV); err != nil {
			return failf(e, exitRejected, "precipitate: %v", err)
		}
	}
	cap := fmt.Sprintf("%s; closed system to SI = 0, %s model. Screening result: no kinetics.", name, l.reactor.Model().Name())
	if wf.plot != "" && len(p.Together.Amounts) == 0 {
		fmt.Fprintf(e.stderr, "gwsat precipitate: nothing precipitates, so no figure drawn to %s\n", wf.plot)
	} else if err := plotTo(e, wf.plot, report.PrecipitationFigure(p, "Precipitation potential", cap), 16*vg.Centimeter, 11*vg.Centimeter); err != nil {
		return failf(e, exitRejected, "precipitate: -plot: %v", err)
	}
	fmt.Fprintf(e.stderr, "gwsat precipitate: %s, pH %.2f\n", name, p.Before.PH)
	if len(p.Together.Amounts) == 0 {
		fmt.Fprintln(e.stderr, "  no candidate mineral is supersaturated: nothing precipitates")
	}
	for _, a := range p.Together.Amounts {
		fmt.Fprintf(e.stderr, "  %-16s SI %+.2f -> %.4g mmol/kgw (%.4g mg/L) together\n", a.Mineral, a.SIBefore, a.MmolKgw, a.MgL)
	}
	if len(p.Together.Amounts) > 0 {
		fmt.Fprintf(e.stderr, "  water left: pH %.2f\n", p.Together.After.PH)
	}
	if p.HasCCPP {
		fmt.Fprintf(e.stderr, "  calcium carbonate precipitation potential (Standard Methods 2330): %.1f mg/L as CaCO3\n", p.CCPP)
	}
	fmt.Fprintln(e.stderr, caution)
	return exitOK
}

func runSequence(e *env, args []string) int {
	fs := newFlags(e, "sequence", "sequence -water ID (-salt FORMULA | -reagent ID) -max AMOUNT [flags] FILE.csv | -demo")
	var wf waterFlags
	wf.register(fs)
	id := fs.String("water", "", "the water the reagent is added to (demo: "+demoInject+")")
	salt := fs.String("salt", "", `a pure salt as components, e.g. "2 Na+ + SO4 2-" (amount in mol/kgw; demo default: Na2SO4 into `+demoDeep+`)`)
	saltName := fs.String("salt-name", "", "a name for the salt in outputs, e.g. Na2SO4")
	reagent := fs.String("reagent", "", "a water added step by step instead of a salt (amount in kg per kg of water; demo default: the deep native water)")
	max := fs.Float64("max", 0, "largest amount added (default: 0.1 mol/kgw of salt, or 10 kg/kg of a water)")
	mins := fs.String("minerals", "", "candidate minerals (default: common scale minerals)")
	clean := fs.Float64("clean", 0.999, "fraction of the earlier mineral's cation that must be removed before the next begins, for a clean separation")
	if code, ok := parseFlags(fs, args); !ok {
		return code
	}
	if *clean <= 0 || *clean >= 1 {
		return failf(e, exitUsage, "sequence: -clean %g must lie in (0, 1)", *clean)
	}
	if *max < 0 {
		return failf(e, exitUsage, "sequence: -max %g is negative", *max)
	}
	l, err := wf.load(e, fs.Args())
	if err != nil {
		return failf(e, exitUsage, "sequence: %v", err)
	}
	cands, err := mineralList(l.db, *mins)
	if err != nil {
		return failf(e, exitUsage, "sequence: -minerals: %v", err)
	}
	if wf.in.demo && *salt == "" && *reagent == "" {
		// Demo default: sulfate added to the barium- and strontium-bearing deep
		// native water, the classic question of which sulfate comes first.
		*salt, *saltName = "2 Na+ + SO4 2-", "Na2SO4"
		if *id == "" {
			*id = demoDeep
		}
	}
	w, rec, err := l.water("water", defaultID(wf.in.demo, *id, demoInject))
	if err != nil {
		return failf(e, exitUsage, "sequence: %v", err)
	}
	var g reaction.Reagent
	switch {
	case *salt != "" && *reagent != "":
		return failf(e, exitUsage, "sequence: give -salt or -reagent, not both")
	case *salt != "":
		name := *saltName
		if name == "" {
			name = *salt
		}
		if g, err = reaction.ParseSalt(l.db, name, *salt); err != nil {
			return failf(e, exitUsage, "sequence: -salt: %v", err)
		}
		if *max == 0 {
			*max = 0.1
		}
	default:
		rid := defaultID(wf.in.demo, *reagent, demoDeep)
		if rid == "" {
			return failf(e, exitUsage, "sequence: give -salt or -reagent")
		}
		rw, _, err := l.water("reagent", rid)
		if err != nil {
			return failf(e, exitUsage, "sequence: %v", err)
		}
		g = reaction.Reagent{Name: rid, Water: &rw}
		if *max == 0 {
			*max = 10
		}
	}
	res, err := l.reactor.Sequence(w, g, reaction.SequenceOptions{Minerals: cands, MaxAmount: *max, CleanRemoval: *clean})
	if err != nil {
		return usageErr(e, "sequence", err)
	}
	if err := e.writeFile(wf.out, report.SequenceTable(res).WriteCSV); err != nil {
		return failf(e, exitRejected, "sequence: %v", err)
	}
	fmt.Fprintf(e.stderr, "gwsat sequence: %s added to %s (up to %g %s)\n", res.Reagent, rec.Sample().ID, *max, res.Unit)
	if len(res.Onsets) == 0 {
		fmt.Fprintln(e.stderr, "  no candidate mineral reaches saturation in that range")
	}
	for i, o := range res.Onsets {
		fmt.Fprintf(e.stderr, "  %d. %-14s saturates at %.4g %s", i+1, o.Mineral, o.Amount, res.Unit)
		for _, r := range o.Residual {
			fmt.Fprintf(e.stderr, "; %s %s still dissolved: %.3g %%", r.Mineral, r.Component, 100*r.Fraction)
		}
		fmt.Fprintln(e.stderr)
	}
	if len(res.Onsets) > 1 {
		fmt.Fprintf(e.stderr, "  clean separation (>= %.1f %% removed before the next begins): %v\n", 100*res.CleanRemoval, res.Clean)
	}
	fmt.Fprintln(e.stderr, caution)
	return exitOK
}

func runClogging(e *env, args []string) int {
	fs := newFlags(e, "clogging", "clogging (-water ID | -a ID -b ID -fraction F) -rate M3_PER_DAY -screen M -porosity P [flags] FILE.csv | -demo")
	var wf waterFlags
	wf.register(fs)
	var mf mixtureFlags
	mf.register(fs)
	mins := fs.String("minerals", "", "candidate minerals (default: common scale minerals)")
	rate := fs.Float64("rate", 500, "injection rate, m3/day")
	days := fs.Float64("days", 365, "duration of injection, days")
	screen := fs.Float64("screen", 90, "screen length, m")
	porosity := fs.Float64("porosity", 0.2, "effective porosity of the aquifer near the well (0-1)")
	radius := fs.Float64("radius", 2, "near-well radius within which the fill fraction is reported, m")
	wellR := fs.Float64("well-radius", 0.15, "radius of the well bore, m")
	fill := fs.Float64("fill", 0.1, "fraction of the porosity for the fill radius")
	if code, ok := parseFlags(fs, args); !ok {
		return code
	}
	// Check the numbers before any chemistry, so a bad value writes nothing.
	switch {
	case !(*rate >= 0):
		return failf(e, exitUsage, "clogging: -rate %g must not be negative", *rate)
	case !(*days > 0):
		return failf(e, exitUsage, "clogging: -days %g must be positive", *days)
	case !(*screen > 0):
		return failf(e, exitUsage, "clogging: -screen %g must be positive", *screen)
	case !(*porosity > 0 && *porosity < 1):
		return failf(e, exitUsage, "clogging: -porosity %g must lie in (0, 1)", *porosity)
	case !(*radius > *wellR && *wellR >= 0):
		return failf(e, exitUsage, "clogging: -radius %g must exceed -well-radius %g", *radius, *wellR)
	case !(*fill > 0 && *fill <= 1):
		return failf(e, exitUsage, "clogging: -fill %g must lie in (0, 1]", *fill)
	}
	l, err := wf.load(e, fs.Args())
	if err != nil {
		return failf(e, exitUsage, "clogging: %v", err)
	}
	cands, err := mineralList(l.db, *mins)
	if err != nil {
		return failf(e, exitUsage, "clogging: -minerals: %v", err)
	}
	sol, name, err := mf.solution(l, wf.in.demo)
	if err != nil {
		return usageErr(e, "clogging", err)
	}
	p, err := l.reactor.Precipitate(sol, reaction.PrecipOptions{Minerals: cands})
	if err != nil {
		return usageErr(e, "clogging", err)
	}
	c, err := reaction.Clogging(l.db, reaction.CloggingInput{Solids: reaction.SolidsPerM3(p.Together.Amounts, p.KgwPerL),
		RateM3PerDay: *rate, Days: *days, ScreenLengthM: *screen, Porosity: *porosity, RadiusM: *radius, WellRadiusM: *wellR, FillFraction: *fill})
	if err != nil {
		return usageErr(e, "clogging", err)
	}
	if err := e.writeFile(wf.out, report.CloggingTable(c).WriteCSV); err != nil {
		return failf(e, exitRejected, "clogging: %v", err)
	}
	printClogging(e.stderr, name, c, *rate, *days, *screen, *porosity, *radius)
	return exitOK
}

func printClogging(w io.Writer, name string, c *reaction.CloggingResult, rate, days, screen, porosity, radius float64) {
	fmt.Fprintf(w, "gwsat clogging: %s\n", name)
	fmt.Fprintf(w, "  %.0f m3/day for %.0f days into a %.0f m screen, porosity %.2f\n", rate, days, screen, porosity)
	fmt.Fprintf(w, "  solids: %.4g m3 in all (%.4g m3 per year)\n", c.SolidVolumeM3, c.SolidVolumeM3PerYr)
	fmt.Fprintf(w, "  pore space filled within %.1f m of the well: %.3g %% over the period (%.3g %% per year)\n", radius, 100*c.FilledFraction, 100*c.FilledFractionPerYr)
	if c.SolidVolumeM3 > 0 {
		fmt.Fprintf(w, "  radius within which %.0f %% of the porosity would be filled: %.3g m\n", 100*c.FillFraction, c.RadiusForFillM)
	} else {
		fmt.Fprintln(w, "  nothing precipitates: no pore space would be filled")
	}
	fmt.Fprintf(w, "  %s\n", c.Caution)
}
