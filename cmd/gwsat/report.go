package main

import (
	"bytes"
	"fmt"
	"io"
	"os"
	"path/filepath"
	"runtime"
	"strconv"
	"strings"
	"sync"
	"time"

	"gwsat.dev/gwsat/assess"
	"gwsat.dev/gwsat/data"
	"gwsat.dev/gwsat/figure"
	"gwsat.dev/gwsat/geo"
	"gwsat.dev/gwsat/hydro"
	"gwsat.dev/gwsat/internal/atomicfile"
	"gwsat.dev/gwsat/internal/progress"
	"gwsat.dev/gwsat/report"
)

func init() {
	register(command{name: "report", summary: "write a report folder: tables, GeoJSON, SI maps, depth profiles, index.html", run: runReport})
}

// DemoSite is the embedded site-feature file of the demo.
const DemoSite = "demo/site.geojson"

func runReport(e *env, args []string) int {
	fs := newFlags(e, "report", "report -o DIR [flags] FILE.csv ... | -demo")
	var in inputFlags
	in.register(fs)
	out := fs.String("o", "gwsat-report", "output folder (created if needed; files in it are replaced)")
	site := fs.String("site", "", "GeoJSON file of site features (boundary, river, injection wells) drawn on every map")
	minerals := fs.String("minerals", "", "comma-separated minerals to map (default: those whose SI crosses zero on site)")
	method := fs.String("method", "kriging", "interpolation: kriging (ordinary kriging, fitted variogram) or idw")
	zones := fs.String("zones", "", "depth-zone edges in m below ground, e.g. 0,55,90,200 (default: found from gaps in the depths)")
	profileRound := fs.String("profile-round", "", "sampling round shown in depth profiles (default: the last)")
	cluster := fs.String("cluster", "Cluster", "input column grouping wells into clusters, one depth-profile figure each")
	formats := fs.String("formats", "png,svg,pdf", "figure formats to write")
	var mix mixFlags
	mix.registerReport(fs)
	if code, ok := parseFlags(fs, args); !ok {
		return code
	}
	if in.demo {
		mix.inject = defaultID(true, mix.inject, demoInject)
		mix.native = defaultID(true, mix.native, demoNative)
	}
	if *method != "kriging" && *method != "idw" {
		return failf(e, exitUsage, "report: -method must be kriging or idw")
	}
	if err := mix.validate(); err != nil {
		return failf(e, exitUsage, "report: %v", err)
	}
	fmts, err := parseFormats(*formats)
	if err != nil {
		return failf(e, exitUsage, "report: %v", err)
	}
	edges, err := parseFloats(*zones)
	if err != nil {
		return failf(e, exitUsage, "report: -zones: %v", err)
	}
	var feats []geo.SiteFeature
	switch {
	case *site != "":
		f, err := os.Open(*site)
		if err != nil {
			return failf(e, exitUsage, "report: %v", err)
		}
		feats, err = geo.ReadSiteFeatures(f)
		f.Close()
		if err != nil {
			return failf(e, exitUsage, "report: %s: %v", *site, err)
		}
	case in.demo:
		raw, err := data.Demo.ReadFile(DemoSite)
		if err == nil {
			feats, err = geo.ReadSiteFeatures(bytes.NewReader(raw))
		}
		if err != nil {
			return failf(e, exitRejected, "report: demo site: %v", err)
		}
	}
	batches, recs, db, err := in.assessAll(e, fs.Args())
	if err != nil {
		return failf(e, exitUsage, "%v", err)
	}
	all := report.SolidMinerals(db)
	var chosen []string
	if *minerals != "" {
		for _, m := range strings.Split(*minerals, ",") {
			m = strings.TrimSpace(m)
			if mm := db.Mineral(m); mm == nil || mm.Gas {
				return failf(e, exitUsage, "report: unknown mineral %q (known: %s)", m, strings.Join(all, ", "))
			}
			chosen = append(chosen, db.Mineral(m).Name)
		}
	}
	model, _ := in.activityModel()
	st, err := report.BuildSite(recs, all, report.SiteOptions{Minerals: chosen, Method: *method, Features: feats, BandEdges: edges, ProfileRound: *profileRound, Model: model.Name(), ClusterColumn: *cluster})
	if err != nil {
		fmt.Fprintf(e.stderr, "gwsat report: %v\n", err)
	}
	if pf, ok := report.PiperFigure(recs, *cluster); ok {
		st.Figures = append(st.Figures, pf)
	}
	figs := st.Figures
	var sections []report.Section
	if sec, mfigs, err := mix.section(e, recs, db, model); err != nil {
		return failf(e, exitUsage, "report: %v", err)
	} else if sec != nil {
		figs = append(figs, mfigs...)
		sections = append(sections, *sec)
	}

	// Everything is computed: now the folder is written.
	if err := os.MkdirAll(filepath.Join(*out, "figures"), 0o755); err != nil {
		return failf(e, exitRejected, "report: %v", err)
	}
	uniqueStems(figs)

	// Tables and GeoJSON.
	tbl := report.SampleTable(recs, all)
	write := func(name string, fill func(w io.Writer) error) error {
		return atomicfile.WriteWith(filepath.Join(*out, name), fill)
	}
	if err := firstErr(
		write("samples.csv", tbl.WriteCSV),
		write("samples.json", func(w io.Writer) error { return report.WriteJSON(w, recs) }),
		write("columns.csv", mappingTable(batches).WriteCSV),
		write("surfaces.csv", surfacesTable(st).WriteCSV),
		write("samples.geojson", func(w io.Writer) error { return writeGeoJSON(w, recs, all) }),
	); err != nil {
		return failf(e, exitRejected, "report: %v", err)
	}

	// Figures, rendered in parallel.
	rendered, failed := renderFigures(e, *out, figs, fmts)
	removeOldFigures(filepath.Join(*out, "figures"), figs, fmts)
	ix := &report.Index{
		Title:     "gwsat report: saturation screening",
		Generated: fmt.Sprintf("Made by gwsat on %s with the %s activity model.", time.Now().UTC().Format("2006-01-02 15:04 UTC"), model.Name()),
		Table:     summaryTable(tbl),
		Figures:   rendered[:len(st.Figures)],
		Notes:     append(append([]string(nil), st.Notes...), unplacedNote(st)...),
		Sections:  sections,
	}
	for i := range sections {
		n := len(sections[i].Figures)
		sections[i].Figures = rendered[len(st.Figures) : len(st.Figures)+n]
	}
	for _, b := range batches {
		ix.Inputs = append(ix.Inputs, b.File)
	}
	counts := map[hydro.Status]int{}
	bal := map[hydro.BalanceStatus]int{}
	for i := range recs {
		counts[recs[i].Status]++
		if b := recs[i].Balance; b.CationsMeqL > 0 || b.AnionsMeqL > 0 {
			bal[b.Status]++
		}
	}
	ix.Counts = []report.Link{{Label: fmt.Sprintf("%d rows: %d ok, %d warning, %d rejected", len(recs), counts[hydro.StatusOK], counts[hydro.StatusWarning], counts[hydro.StatusRejected])},
		{Label: fmt.Sprintf("Charge balance (Standard Methods 1030 E, 23rd ed.): %d pass, %d warn, %d fail", bal[hydro.BalancePass], bal[hydro.BalanceWarn], bal[hydro.BalanceFail])}}
	for i := range recs {
		r := &recs[i]
		if r.Status != hydro.StatusOK {
			ix.QA = append(ix.QA, fmt.Sprintf("%s line %d, sample %s (%s): %s", r.File, r.Row.Line, r.Sample().ID, r.Status, firstProblem(r)))
		}
	}
	for _, f := range []string{"samples.csv", "samples.json", "samples.geojson", "columns.csv", "surfaces.csv"} {
		ix.Files = append(ix.Files, report.Link{Label: f, Href: f})
	}
	if err := write("index.html", func(w io.Writer) error { return report.WriteIndex(w, ix) }); err != nil {
		return failf(e, exitRejected, "report: %v", err)
	}
	printSummary(e.stderr, batches, recs)
	fmt.Fprintf(e.stderr, "  report: %s (%d figures; open index.html)\n", filepath.Join(*out, "index.html"), len(figs)-failed)
	if failed > 0 {
		return failf(e, exitRejected, "report: %d figure(s) could not be drawn or written (see above)", failed)
	}
	return exitCode(recs)
}

func firstErr(errs ...error) error {
	for _, err := range errs {
		if err != nil {
			return err
		}
	}
	return nil
}

func parseFormats(s string) ([]string, error) {
	var out []string
	hasPNG := false
	for _, f := range strings.Split(s, ",") {
		f = strings.ToLower(strings.TrimSpace(f))
		switch f {
		case "png", "svg", "pdf":
			out = append(out, f)
			hasPNG = hasPNG || f == "png"
		case "":
		default:
			return nil, fmt.Errorf("unknown figure format %q (png, svg, pdf)", f)
		}
	}
	if !hasPNG {
		out = append(out, "png") // index.html embeds the PNG
	}
	return out, nil
}

func parseFloats(s string) ([]float64, error) {
	if strings.TrimSpace(s) == "" {
		return nil, nil
	}
	var out []float64
	for _, f := range strings.Split(s, ",") {
		v, err := strconv.ParseFloat(strings.TrimSpace(f), 64)
		if err != nil {
			return nil, fmt.Errorf("%q is not a number", f)
		}
		if len(out) > 0 && v <= out[len(out)-1] {
			return nil, fmt.Errorf("values must increase")
		}
		out = append(out, v)
	}
	return out, nil
}

// renderFigures draws every figure in every format, in parallel, and
// returns what index.html shows and how many figures failed.
func renderFigures(e *env, dir string, figs []report.Fig, fmts []string) ([]report.IndexFigure, int) {
	out := make([]report.IndexFigure, len(figs))
	errs := make([]error, len(figs))
	bar := progress.New(stderrFile(e), "drawing figures", len(figs))
	var mu sync.Mutex
	jobs := make(chan int)
	var wg sync.WaitGroup
	for w := 0; w < runtime.GOMAXPROCS(0); w++ {
		wg.Add(1)
		go func() {
			defer wg.Done()
			for i := range jobs {
				f := figs[i]
				out[i] = report.IndexFigure{Title: f.Title, Caption: f.Caption}
				for _, format := range fmts {
					b, err := figure.Render(f.Figure, format, f.W, f.H)
					if err != nil {
						errs[i] = fmt.Errorf("figure %s: %w", f.Stem, err)
						break
					}
					name := filepath.Join("figures", f.Stem+"."+format)
					if err := atomicfile.WriteFile(filepath.Join(dir, name), b); err != nil {
						errs[i] = err
						break
					}
					if format == "png" {
						out[i].PNG = b
					}
					out[i].Links = append(out[i].Links, report.Link{Label: strings.ToUpper(format), Href: name})
				}
				mu.Lock()
				bar.Add(1)
				mu.Unlock()
			}
		}()
	}
	for i := range figs {
		jobs <- i
	}
	close(jobs)
	wg.Wait()
	bar.Done()
	failed := 0
	for i := range figs {
		if errs[i] != nil {
			failed++
			fmt.Fprintf(e.stderr, "gwsat report: %v (figure left out)\n", errs[i])
			out[i].Caption += " (This figure could not be drawn: " + errs[i].Error() + ")"
		}
	}
	return out, failed
}

// uniqueStems gives figures whose file names would clash (two clusters
// whose names reduce to the same letters) a numbered suffix.
func uniqueStems(figs []report.Fig) {
	seen := map[string]int{}
	for i := range figs {
		stem := figs[i].Stem
		seen[stem]++
		if n := seen[stem]; n > 1 {
			figs[i].Stem = fmt.Sprintf("%s_%d", stem, n)
		}
	}
}

func mappingTable(batches []*hydro.Batch) *report.Table {
	t := &report.Table{Header: []string{"file", "column", "header", "parameter", "unit", "note"}}
	for _, b := range batches {
		for _, m := range b.Mapping {
			t.Add(report.Text(b.File), strconv.Itoa(m.Column), report.Text(m.Header), m.Param, report.Text(m.Unit), report.Text(m.Note))
		}
	}
	return t
}

func surfacesTable(st *report.Site) *report.Table {
	t := &report.Table{Header: []string{"mineral", "depth_zone", "round", "method", "wells", "loo_cv_rmse_si", "note"}}
	if st == nil {
		return t
	}
	for _, s := range st.Surfaces {
		t.Add(s.Mineral, report.Text(s.Zone), report.Text(s.Round), s.Method, strconv.Itoa(s.Wells), cond(s.HasCV, report.Num(s.CVRMSE, 3)), report.Text(s.Note))
	}
	return t
}

func cond(ok bool, s string) string {
	if ok {
		return s
	}
	return ""
}

func unplacedNote(st *report.Site) []string {
	if st == nil || len(st.Unplaced) == 0 {
		return nil
	}
	n := st.Unplaced
	more := ""
	if len(n) > 10 {
		more = fmt.Sprintf(" and %d more", len(n)-10)
		n = n[:10]
	}
	return []string{fmt.Sprintf("Left off the maps (kept in the tables): %s%s.", strings.Join(n, "; "), more)}
}

// summaryTable is the HTML view of the sample table: identification, status,
// balance and the saturation indices, without the long metadata columns.
func summaryTable(t *report.Table) *report.Table {
	keep := map[string]bool{"line": true, "sample_id": true, "well_id": true, "round": true, "status": true, "depth_m": true,
		"temp_c": true, "ph": true, "charge_balance_pct": true, "balance_status": true, "ionic_strength_mol_kgw": true, "log_pco2_atm": true, "langelier_si": true}
	var idx []int
	out := &report.Table{}
	for i, h := range t.Header {
		if keep[h] || strings.HasSuffix(h, "_si") && h != "langelier_si" && h != "ryznar_si" {
			idx = append(idx, i)
			out.Header = append(out.Header, h)
		}
	}
	for _, r := range t.Rows {
		row := make([]string, len(idx))
		for k, i := range idx {
			row[k] = r[i]
		}
		out.Rows = append(out.Rows, row)
	}
	return out
}

func writeGeoJSON(w io.Writer, recs []assess.Record, minerals []string) error {
	var pts []geo.PointFeature
	for i := range recs {
		r := &recs[i]
		s := r.Sample()
		p, _ := report.Position(s) // an unusable position is written with a null geometry
		props := []geo.Prop{{Key: "sample_id", Value: s.ID}, {Key: "well_id", Value: s.WellID}, {Key: "round", Value: s.Round},
			{Key: "line", Value: r.Row.Line}, {Key: "status", Value: string(r.Status)}, {Key: "reasons", Value: strings.Join(r.Reasons, "; ")}}
		if d, ok := report.DepthM(s); ok {
			props = append(props, geo.Prop{Key: "depth_m", Value: d})
		}
		if s.GroundElevM.OK {
			props = append(props, geo.Prop{Key: "ground_elev_m", Value: s.GroundElevM.V})
		}
		if r.Balance.CationsMeqL > 0 || r.Balance.AnionsMeqL > 0 {
			props = append(props, geo.Prop{Key: "charge_balance_pct", Value: r.Balance.ErrorPct}, geo.Prop{Key: "balance_status", Value: string(r.Balance.Status)})
		}
		if res := r.Result; res != nil {
			props = append(props, geo.Prop{Key: "ionic_strength_mol_kgw", Value: res.IonicStrength})
			for _, m := range minerals {
				if si, ok := res.SI(m); ok {
					props = append(props, geo.Prop{Key: report.ColumnName(m), Value: si})
				}
			}
		}
		pts = append(pts, geo.PointFeature{ID: fmt.Sprintf("%s:%d", r.File, r.Row.Line), Point: p, Props: props})
	}
	return geo.WriteSamples(w, pts)
}

// removeOldFigures deletes the figures an earlier report left in dir, so
// that a figure no longer drawn (another mineral, zone or cluster) does not
// linger beside the new ones. Only gwsat's own file names are touched, and
// never those just written.
func removeOldFigures(dir string, figs []report.Fig, fmts []string) {
	keep := map[string]bool{}
	for _, f := range figs {
		for _, ext := range fmts {
			keep[f.Stem+"."+ext] = true
		}
	}
	for _, prefix := range []string{"map_", "profile_", "mix_", "piper"} {
		for _, ext := range []string{"png", "svg", "pdf"} {
			old, _ := filepath.Glob(filepath.Join(dir, prefix+"*."+ext))
			for _, f := range old {
				if !keep[filepath.Base(f)] {
					os.Remove(f)
				}
			}
		}
	}
}
