package main

import (
	"bytes"
	"fmt"
	"math"
	"os"
	"strconv"
	"strings"

	"github.com/spf13/cobra"

	"gwsat.dev/gwsat/data"
	"gwsat.dev/gwsat/geo"
	"gwsat.dev/gwsat/inject"
	"gwsat.dev/gwsat/internal/progress"
	"gwsat.dev/gwsat/site"
	"gwsat.dev/gwsat/sitereport"
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
	var sec sectionFlags
	c := &cobra.Command{
		Use:   "report --out DIR [flags] FILE.csv ... | --demo",
		Short: "write a report folder: tables, GeoJSON, SI maps, depth profiles, index.html",
		RunE: func(c *cobra.Command, args []string) error {
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
			batches, recs, ch, err := in.assessAll(e, args, true)
			if err != nil {
				return usageErr(err)
			}
			chosen, err := ch.db.ParseMinerals(minerals)
			if err != nil {
				return usagef("--minerals: %w", err)
			}
			bar := progress.New(stderrFile(e), "drawing figures", 0)
			oc2, err := sitereport.Write(e.ctx, sitereport.Options{
				Dir: out, Batches: batches, Records: recs, DB: ch.db, Model: ch.model,
				Site:    site.Options{Minerals: chosen, Method: method, Features: feats, BandEdges: edges, ProfileRound: profileRound, ClusterColumn: cluster},
				Inject:  so,
				Formats: fmts,
				Progress: func(done, total int) {
					if done == 1 {
						bar = progress.New(stderrFile(e), "drawing figures", total)
					}
					bar.Add(1)
				},
			})
			bar.Done()
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
				return failed(fmt.Errorf("%d figure(s) could not be drawn or written (see above)", len(oc2.FigureErrors)))
			}
			return oc.verdict(oc2.Summary)
		},
	}
	f := c.Flags()
	interspersed(f)
	in.register(f)
	oc.register(c)
	f.StringVarP(&out, "out", "o", "gwsat-report", "output folder (created if needed; its files are replaced)")
	f.StringVar(&siteFile, "site", "", "GeoJSON file of site features (boundary, river, injection wells) drawn on every map")
	f.StringVar(&minerals, "minerals", "", "comma-separated minerals to map (default: those whose SI crosses zero on site)")
	f.StringVar(&method, "method", "kriging", "interpolation: kriging (ordinary kriging, fitted variogram) or idw")
	f.StringVar(&zones, "zones", "", "depth-zone edges in m below ground, e.g. 0,55,90,200 (default: found from gaps in the depths)")
	f.StringVar(&profileRound, "profile-round", "", "sampling round shown in depth profiles (default: the last)")
	f.StringVar(&cluster, "cluster", "Cluster", "input column grouping wells into clusters, one depth-profile figure each")
	f.StringVar(&formats, "formats", "png,svg,pdf", "figure formats to write (PNG is always written: the page embeds it)")
	sec.register(c)
	return c
}

// sectionFlags choose the injection-planning section of a report.
type sectionFlags struct {
	injectate, native string
	aquiferTemp       float64
	well              inject.Well
}

func (s *sectionFlags) register(c *cobra.Command) {
	f := c.Flags()
	w := inject.DefaultWell()
	f.StringVar(&s.injectate, "injectate", "", "sample id of the injectate (default: the first row whose sample type is injectate; demo: "+demoInjectate+")")
	f.StringVar(&s.native, "native", "", "sample id of the native groundwater (default: the first row whose sample type is native; demo: "+demoNative+")")
	f.Float64Var(&s.aquiferTemp, "aquifer-temp", math.NaN(), "aquifer temperature for the blends, C (default: the native water's)")
	f.Lookup("aquifer-temp").DefValue = "the native water's"
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
	return inject.SectionOptions{Injectate: s.injectate, Native: s.native, AquiferTempC: s.aquiferTemp, Well: s.well}, nil
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
