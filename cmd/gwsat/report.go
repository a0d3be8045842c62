package main

import (
	"bytes"
	"errors"
	"fmt"
	"math"
	"os"
	"runtime/debug"
	"strconv"
	"strings"

	"github.com/spf13/cobra"
	"github.com/spf13/pflag"

	"gwsat.dev/gwsat/assess"
	"gwsat.dev/gwsat/data"
	"gwsat.dev/gwsat/geo"
	"gwsat.dev/gwsat/hydro"
	"gwsat.dev/gwsat/inject"
	"gwsat.dev/gwsat/internal/progress"
	"gwsat.dev/gwsat/site"
	"gwsat.dev/gwsat/sitereport"
	"gwsat.dev/gwsat/uncertainty"
)

// DemoSite is the embedded site-feature file of the demo.
const DemoSite = "demo/site.geojson"

// Demo end-members: the injectate of round 2, the native water of the
// intermediate zone and the barium-bearing deep water (see data/demo/README.md).
const (
	demoInjectate = "INJ-R2"
	demoNative    = "NATIVE-R1"
	demoDeep      = "NATIVE-D-R1"
)

func reportCmd(e *env) *cobra.Command {
	var in inputFlags
	var oc outcomeFlags
	var out, siteFile, minerals, method, zones, profileRound, cluster, formats string
	var allowOther bool
	var sec sectionFlags
	c := &cobra.Command{
		Use:   "report --out DIR [flags] FILE.csv ... | --demo",
		Short: "write a report folder: tables, GeoJSON, SI maps, depth profiles, index.html",
		RunE: func(c *cobra.Command, args []string) error {
			e.quiet = oc.quiet
			if method != "kriging" && method != "idw" {
				return usagef("--method must be kriging or idw, not %q", method)
			}
			if in.demo {
				sec.injectate = defaultID(true, sec.injectate, demoInjectate)
				sec.native = defaultID(true, sec.native, demoNative)
			}
			so, err := sec.options()
			if err != nil {
				return usageErr(err)
			}
			fmts, err := sitereport.Formats(strings.Split(formats, ","))
			if err != nil {
				return usagef("--formats: %w", err)
			}
			edges, err := parseIncreasing(zones)
			if err != nil {
				return usagef("--zones: %w", err)
			}
			feats, err := siteFeatures(siteFile, in.demo)
			if err != nil {
				return usageErr(err)
			}
			var g guard
			if err := g.inputs(append(append([]string(nil), args...), siteFile)); err != nil {
				return err
			}
			if err := g.set.AddOutputDir(out); err != nil {
				return usageErr(err)
			}
			nd, err := hydro.ParseNonDetectPolicy(in.nondetect)
			if err != nil {
				return usagef("--nondetect: %w", err)
			}
			if os.Getenv("GOMEMLIMIT") == "" {
				// A soft limit keeps the garbage collector from letting dead
				// rows and figure buffers pile up on a large file.
				prev := debug.SetMemoryLimit(reportMemoryLimit)
				defer debug.SetMemoryLimit(prev)
			}
			rows, err := in.collect(e, args, []string{sec.injectate, sec.native}, cluster)
			if err != nil {
				return usageErr(err)
			}
			batches, ch := rows.batches, rows.ch
			sums, err := inputChecksums(batches, in.demo)
			if err != nil {
				return usageErr(err)
			}
			chosen, err := ch.db.ParseMinerals(minerals)
			if err != nil {
				return usagef("--minerals: %w", err)
			}
			bar := progress.New(stderrFile(e), "drawing figures", 0)
			progressFn := func(done, total int) {
				if done == 1 {
					bar = progress.New(stderrFile(e), "drawing figures", total)
				}
				bar.Add(1)
			}
			if oc.quiet {
				progressFn = nil
			}
			oc2, err := sitereport.Write(e.ctx, sitereport.Options{
				Dir: out, Batches: batches, Records: rows.recs, Samples: rows.samples, Reassess: rows.reassess, DB: ch.db, Model: ch.model, Assess: ch.assessOptions(),
				Site:            site.Options{Minerals: chosen, Method: method, Features: feats, BandEdges: edges, ProfileRound: profileRound, ClusterColumn: cluster},
				Inject:          so,
				Formats:         fmts,
				Progress:        progressFn,
				CommandLine:     commandLine(c, args),
				InputSHA256:     sums,
				NonDetect:       nd,
				AllowOtherFiles: allowOther,
			})
			bar.Done()
			if errors.Is(err, sitereport.ErrOtherFiles) {
				return usagef("%w, or add --allow-other-files to write beside them (they are left alone)", err)
			}
			if err != nil {
				return failed(err)
			}
			for _, n := range oc2.Notes {
				fmt.Fprintf(e.stderr, "gwsat report: %s\n", n)
			}
			for _, fe := range oc2.FigureErrors {
				fmt.Fprintf(e.stderr, "gwsat report: %v (figure left out)\n", fe)
			}
			if !oc.quiet {
				if err := e.writeSummary(oc2.Summary); err != nil {
					return failed(err)
				}
				fmt.Fprintf(e.stderr, "  report: %s (%d %s; open index.html)\n", oc2.Index, oc2.Figures, plural(oc2.Figures, "figure", "figures"))
			}
			if len(oc2.FigureErrors) > 0 {
				return failed(fmt.Errorf("%d %s could not be drawn or written (see above)", len(oc2.FigureErrors), plural(len(oc2.FigureErrors), "figure", "figures")))
			}
			return oc.verdict(oc2.Summary)
		},
	}
	f := c.Flags()
	interspersed(f)
	in.register(f)
	oc.register(c)
	f.StringVarP(&out, "out", "o", "gwsat-report", "output folder (created if needed); a later report replaces only the files the earlier one listed in "+sitereport.ManifestName)
	f.BoolVar(&allowOther, "allow-other-files", false, "write into an output folder that holds files gwsat did not write (they are left alone; without this flag such a folder is refused)")
	f.StringVar(&siteFile, "site", "", "GeoJSON file of site features (boundary, river, injection wells) drawn on every map")
	f.StringVar(&minerals, "minerals", "", "comma-separated minerals to map (default: those whose SI crosses zero on site)")
	f.StringVar(&method, "method", "kriging", "interpolation: kriging (ordinary kriging, fitted variogram) or idw")
	f.StringVar(&zones, "zones", "", "depth-zone edges in m below ground, e.g. 0,55,90,200 (default: found from gaps in the depths)")
	f.StringVar(&profileRound, "profile-round", "", "sampling round shown in depth profiles (default: every round)")
	f.StringVar(&cluster, "cluster", "Cluster", "input column grouping wells into clusters, one depth-profile figure each")
	f.StringVar(&formats, "formats", "png", "figure files to write: png (300 dpi), svg, pdf, comma-separated; PNG is always written, and index.html embeds a 96 dpi copy")
	sec.register(c)
	return c
}

// sectionFlags choose the injection-planning section of a report.
type sectionFlags struct {
	injectate, native string
	aquiferTemp       float64
	noCrossFlow       bool
	well              inject.Well
}

func (s *sectionFlags) register(c *cobra.Command) {
	f := c.Flags()
	w := inject.DefaultWell()
	f.StringVar(&s.injectate, "injectate", "", "sample id of the injectate (default: the first row whose sample type is injectate; demo: "+demoInjectate+")")
	f.StringVar(&s.native, "native", "", "sample id of a native groundwater to evaluate besides every row whose sample type is native (one per zone; demo: "+demoNative+", "+demoDeep+" and the shallow zone's)")
	f.Float64Var(&s.aquiferTemp, "aquifer-temp", math.NaN(), "temperature of the blends of the injectate with the native waters, C")
	f.Lookup("aquifer-temp").DefValue = "each native water's own"
	f.BoolVar(&s.noCrossFlow, "no-cross-flow", false, "leave out the blends of native waters of adjacent zones (cross-flow along a screen open to both)")
	f.Float64Var(&s.well.RateM3PerDay, "rate", w.RateM3PerDay, "injection rate for the pore-filling screen, m3/day")
	f.Float64Var(&s.well.ScreenLengthM, "screen", w.ScreenLengthM, "screen length for the pore-filling screen, m")
	f.Float64Var(&s.well.Porosity, "porosity", w.Porosity, "aquifer porosity for the pore-filling screen")
	s.well.Days, s.well.RadiusM, s.well.WellRadiusM, s.well.FillShare = w.Days, w.RadiusM, w.WellRadiusM, w.FillShare
}

func (s *sectionFlags) options() (inject.SectionOptions, error) {
	if err := s.well.Check(); err != nil {
		return inject.SectionOptions{}, err
	}
	if !math.IsNaN(s.aquiferTemp) {
		if _, err := parseTemp(strconv.FormatFloat(s.aquiferTemp, 'g', -1, 64)); err != nil {
			return inject.SectionOptions{}, fmt.Errorf("--aquifer-temp: %w", err)
		}
	}
	return inject.SectionOptions{Injectate: s.injectate, Native: s.native, AquiferTempC: s.aquiferTemp, Well: s.well, NoCrossFlow: s.noCrossFlow}, nil
}

// siteFeatures reads the site-feature file, or the demo's.
func siteFeatures(path string, demo bool) ([]geo.SiteFeature, error) {
	switch {
	case path != "":
		f, err := os.Open(path)
		if err != nil {
			return nil, fmt.Errorf("--site: %w", err)
		}
		defer f.Close()
		feats, err := geo.ReadSiteFeatures(f)
		if err != nil {
			return nil, fmt.Errorf("--site %s: %w", path, err)
		}
		return feats, nil
	case demo:
		raw, err := data.Demo().ReadFile(DemoSite)
		if err != nil {
			return nil, err
		}
		return geo.ReadSiteFeatures(bytes.NewReader(raw))
	}
	return nil, nil
}

// defaultID returns the demo's sample when --demo is set and none was given.
func defaultID(demo bool, id, demoID string) string {
	if id == "" && demo {
		return demoID
	}
	return id
}

func plural(n int, one, many string) string {
	if n == 1 {
		return one
	}
	return many
}

func itoa(n int) string { return strconv.Itoa(n) }

// commandLine is the command as parsed, for the report's methods section: the
// command path, every flag that was set (in --name=value form, quoted for a
// POSIX shell where needed) and the arguments. Flags left at their default
// are omitted; running the line again gives the same report.
func commandLine(c *cobra.Command, args []string) []string {
	out := strings.Fields(c.CommandPath())
	c.Flags().Visit(func(f *pflag.Flag) {
		if f.Value.Type() == "bool" {
			out = append(out, "--"+f.Name+"="+f.Value.String())
			return
		}
		out = append(out, shellQuote("--"+f.Name+"="+f.Value.String()))
	})
	for _, a := range args {
		out = append(out, shellQuote(a))
	}
	return out
}

// shellQuote quotes s for a POSIX shell when it holds anything but letters,
// digits and a few safe characters.
func shellQuote(s string) string {
	if s != "" && strings.Trim(s, "abcdefghijklmnopqrstuvwxyzABCDEFGHIJKLMNOPQRSTUVWXYZ0123456789-_=.,/:+@%") == "" {
		return s
	}
	return "'" + strings.ReplaceAll(s, "'", `'\''`) + "'"
}

// inputChecksums are the SHA-256 checksums of the inputs, keyed by the name
// each batch carries: the files named on the command line, or the embedded
// demo. Standard input has none.
func inputChecksums(batches []*hydro.Batch, demo bool) (map[string]string, error) {
	out := map[string]string{}
	if demo {
		raw, err := data.Demo().ReadFile(DemoFile)
		if err != nil {
			return nil, err
		}
		out[DemoFile] = sitereport.BytesSHA256(raw)
		return out, nil
	}
	for _, b := range batches {
		if b.File == "<stdin>" {
			continue
		}
		sum, err := sitereport.FileSHA256(b.File)
		if err != nil {
			return nil, err
		}
		out[b.File] = sum
	}
	return out, nil
}

// reportMemoryLimit is the soft memory limit of report (GOMEMLIMIT
// overrides it): the project's target is 1 GB of peak resident memory on
// 100,000 rows.
const reportMemoryLimit = 880 << 20

// reportRows are the rows a report is made from.
type reportRows struct {
	batches []*hydro.Batch
	recs    []assess.Record
	samples []uncertainty.Sample
	ch      *chemistry
	// reassess reads the inputs again for the samples files (nil for
	// standard input, which cannot be read twice).
	reassess func(emit func(*assess.Record) error) error
}

// collect reads and assesses the inputs for a report. Files and the demo are
// streamed (sitereport.Collect), keeping each record compact, and read a
// second time as the samples files are written; standard input is read
// whole, as before, and its records are kept whole. keep are sample ids kept
// whole (the end-members named on the command line); cluster is the
// cluster column (--cluster).
func (f *inputFlags) collect(e *env, args []string, keep []string, cluster string) (*reportRows, error) {
	for _, a := range args {
		if a == "-" {
			// Records without their detail: samples.json gets it back row by
			// row as it is written.
			batches, recs, ch, err := f.assessAll(e, args, false)
			if err != nil {
				return nil, err
			}
			return &reportRows{batches: batches, recs: recs, ch: ch}, nil
		}
	}
	ch, err := f.chemistry()
	if err != nil {
		return nil, err
	}
	ins, fieldName, err := f.openInputs(e, args)
	if err != nil {
		return nil, err
	}
	defer func() {
		for _, x := range ins {
			x.sc.Close()
		}
	}()
	total := 0
	for _, x := range ins {
		total += max(x.sc.Len(), 0)
	}
	bar := progress.New(stderrFile(e), "speciating", total)
	coll, err := sitereport.Collect(e.ctx, ch.db, scanItems(ins), sitereport.CollectOptions{
		Assess: ch.options(bar, false), Model: ch.model, Compact: true, Keep: keep, Rows: total, ClusterColumn: cluster})
	bar.Done()
	if err != nil {
		var ie *inputError
		if errors.As(err, &ie) {
			return nil, ie.err
		}
		return nil, err
	}
	printJoin(e, ins, fieldName)
	rows := &reportRows{recs: coll.Records, samples: coll.Samples, ch: ch}
	for _, x := range ins {
		rows.batches = append(rows.batches, x.sc.Batch())
	}
	rows.reassess = func(emit func(*assess.Record) error) error {
		again, _, err := f.openInputs(e, args)
		if err != nil {
			return err
		}
		defer func() {
			for _, x := range again {
				x.sc.Close()
			}
		}()
		opt := ch.options(nil, true)
		opt.Progress = nil
		return assess.Stream(e.ctx, ch.db, scanItems(again), opt, emit)
	}
	return rows, nil
}
