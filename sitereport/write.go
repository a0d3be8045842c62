package sitereport

import (
	"context"
	"errors"
	"fmt"
	"io"
	"io/fs"
	"os"
	"path/filepath"
	"runtime"
	"strings"
	"time"

	"gwsat.dev/gwsat/assess"
	"gwsat.dev/gwsat/findings"
	"gwsat.dev/gwsat/hydro"
	"gwsat.dev/gwsat/inject"
	"gwsat.dev/gwsat/internal/atomicfile"
	"gwsat.dev/gwsat/internal/lockfile"
	"gwsat.dev/gwsat/report"
	"gwsat.dev/gwsat/site"
	"gwsat.dev/gwsat/speciation"
	"gwsat.dev/gwsat/uncertainty"
)

// Options describe a report folder.
type Options struct {
	Dir     string          // the folder (created)
	Batches []*hydro.Batch  // the files read, for the column report
	Records []assess.Record // the assessed rows, in input order
	DB      *speciation.Database
	// Model is the activity model the rows were solved with; nil means assess
	// chose per row (assess.Options.Model nil), and the injection section's
	// blends then use Truesdell-Jones.
	Model speciation.ActivityModel
	// Assess are the options the records were assessed with; records without
	// their detail (assess.Options.Detail false, which keeps a large file's
	// records small) get it back from them as samples.json is written.
	Assess assess.Options
	Site   site.Options
	// Inject chooses the injection-planning section (end-members by sample id or
	// sample type); the section is left out when no end-members are found.
	Inject inject.SectionOptions
	// Formats of the figures ("png", "svg", "pdf"); PNG is always written (at
	// figure.PNGDPI, with a ScreenDPI copy embedded in the page).
	Formats []string
	// Progress, when not nil, is called after each figure is drawn with the count
	// done and the total.
	Progress func(done, total int)

	// CommandLine is the command that made the report, recorded in the methods
	// section and methods.json so that a reader can run it again.
	CommandLine []string
	// InputSHA256 maps an input's name (Batch.File) to its SHA-256 checksum
	// (FileSHA256); inputs without one are listed without.
	InputSHA256 map[string]string
	// NonDetect is the policy the inputs were read with (hydro.Options), for
	// the methods section.
	NonDetect hydro.NonDetectPolicy
	// Findings are the conclusions shown first on the page (none: the page
	// says so).
	Findings []string
	// AllowOtherFiles lets the report go into a folder that holds files gwsat
	// did not write (they are left alone). Without it such a folder is refused
	// with ErrOtherFiles.
	AllowOtherFiles bool
	// Now, when not nil, gives the time written into the report (tests fix it).
	Now func() time.Time

	// Samples, when it has one result per record, are the SI intervals of
	// the records (Collect); otherwise Write estimates them.
	Samples []uncertainty.Sample
	// Reassess, when not nil, reads and assesses the inputs a second time,
	// with their detail (assess.Options.Detail), handing emit each record in
	// input order (valid only during the call): samples.csv, samples.json and
	// samples.geojson are then written from those records, so that Records
	// may be compact (CollectOptions.Compact). An error from emit must be
	// returned.
	Reassess func(emit func(*assess.Record) error) error
}

// Outcome is what Write did.
type Outcome struct {
	Index   string // path of index.html
	Figures int    // figures written
	// FigureErrors are the figures that could not be drawn or written; the rest of
	// the folder is complete.
	FigureErrors []error
	// Notes are non-fatal remarks to show the user (e.g. why no surface was drawn).
	Notes   []string
	Summary *assess.Summary
	// Written lists the files written, relative to the folder (slash-separated),
	// as the manifest records them.
	Written []string
}

// staleAfter is the age beyond which a temporary file of ours in the report
// folder is taken as left behind by a run that was killed (common practice: no
// report takes an hour).
const staleAfter = time.Hour

// Files written by Write besides index.html and the figures.
var tableFiles = []string{"samples.csv", "samples.json", "samples.geojson", "columns.csv", "surfaces.csv", "methods.json", "findings.csv", "trends.csv"}

// Write computes the site figures and the injection-planning section, then
// writes the folder. Nothing is written when an argument is wrong or when the
// folder holds files gwsat did not write (ErrOtherFiles, unless
// AllowOtherFiles). A figure that cannot be drawn is reported in
// Outcome.FigureErrors and left out of the page. The folder's manifest
// (ManifestName) lists what was written; files an earlier run listed and this
// one did not write are removed, and no other file is touched.
func Write(ctx context.Context, opt Options) (_ *Outcome, err error) {
	auto := opt.Model == nil // rows solved with the automatic choice (assess.Options.Model)
	if opt.Model == nil {
		opt.Model = speciation.TruesdellJones{}
	}
	if opt.Now == nil {
		opt.Now = time.Now
	}
	fmts, err := Formats(opt.Formats)
	if err != nil {
		return nil, err
	}
	// Refuse a folder of someone else's files before any work.
	if _, err := checkFolder(opt.Dir, opt.AllowOtherFiles); err != nil {
		return nil, err
	}
	recs := opt.Records
	all := opt.DB.MineralNames()
	out := &Outcome{}
	so := opt.Site
	so.Model = opt.Model.Name()
	// The findings come first: SI intervals (the linear estimate, fast), the
	// trends per well and the plain-words conclusions; their minerals are the
	// default ones to map.
	fnd, err := buildFindings(ctx, opt, recs, all)
	if err != nil {
		return nil, fmt.Errorf("findings: %w", err)
	}
	if so.Minerals == nil {
		so.Minerals = findings.DefaultMinerals(opt.DB, fnd.f)
	}
	if len(opt.Findings) == 0 {
		opt.Findings = fnd.f.Lines()
	}
	st, err := site.Build(recs, all, so)
	if err != nil {
		out.Notes = append(out.Notes, err.Error())
	}
	if pf, ok := site.PiperFigure(recs, so.ClusterColumn); ok {
		st.Figures = append(st.Figures, pf)
	}
	if ef, ok, err := site.IronPEPHFigure(opt.DB, recs); err != nil {
		out.Notes = append(out.Notes, fmt.Sprintf("iron pe-pH diagram: %v", err))
	} else if ok {
		st.Figures = append(st.Figures, ef)
	}
	st.Figures = append(st.Figures, findings.StiffFigures(recs)...)
	st.Figures = append(st.Figures, findings.SITimeFigures(recs, fnd.samples, fnd.trends, st.Minerals, uncertainty.DefaultBand)...)
	figs := append([]report.Fig(nil), st.Figures...)
	var sections []report.Section
	inj := opt.Inject
	if inj.Minerals == nil && st != nil {
		inj.Minerals = st.Minerals // the blend figures show what the maps show
	}
	sec, mfigs, err := inject.NewPlanner(opt.DB, opt.Model, recs).Section(inj)
	if err != nil {
		return nil, fmt.Errorf("injection planning: %w", err)
	}
	if sec != nil {
		figs = append(figs, mfigs...)
		sections = append(sections, *sec)
	}
	if err := ctx.Err(); err != nil {
		return nil, err
	}

	// Everything is computed: now the folder is written.
	if err := os.MkdirAll(filepath.Join(opt.Dir, "figures"), 0o755); err != nil {
		return nil, err
	}
	release, err := lockfile.Acquire(opt.Dir)
	if err != nil {
		return nil, err
	}
	defer func() {
		if rerr := release(); rerr != nil && err == nil {
			err = rerr
		}
	}()
	// Under the lock, the authoritative check: another run may have written in
	// the meantime.
	listed, err := checkFolder(opt.Dir, opt.AllowOtherFiles)
	if err != nil {
		return nil, err
	}
	for _, d := range []string{opt.Dir, filepath.Join(opt.Dir, "figures")} {
		// Temporary files a killed run left behind (our own names only).
		if _, err := atomicfile.CleanStale(d, staleAfter); err != nil {
			out.Notes = append(out.Notes, err.Error())
		}
	}
	uniqueStems(figs)
	// samples.csv gets every row, written as it goes; the page's tables show
	// the first MaxPageRows.
	sampleCols := sampleColumns(opt.Batches, all)
	tbl := report.SampleTable(recs[:min(len(recs), MaxPageRows)], sampleCols)
	surf := surfacesTable(st)
	cols := MappingTable(opt.Batches)
	now := opt.Now()
	methods := buildMethods(opt, st, now, auto)
	// What the page takes from every record, taken now: with Reassess the
	// records are then let go, so that the garbage collector does not walk
	// them again and again while the samples files and figures are written.
	out.Summary = assess.Summarise(batchFiles(opt.Batches), recs)
	qa, nRecs := qaLines(recs), len(recs)
	var firstRows []rowKey
	if opt.Reassess != nil {
		firstRows = rowKeys(recs)
		recs, opt.Records, opt.Samples, fnd.samples = nil, nil, nil, nil
	}
	write := func(name string, fill func(w io.Writer) error) error {
		out.Written = append(out.Written, name)
		return atomicfile.WriteWith(filepath.Join(opt.Dir, name), fill)
	}
	// The figures are drawn while the tables are written: the samples files
	// of a large file wait on the disk and on one goroutine at times, and
	// the figures fill the cores meanwhile.
	type drawn struct {
		figs []report.IndexFigure
		errs []error
	}
	drawing := make(chan drawn, 1)
	go func() {
		f, e := renderFigures(ctx, opt.Dir, figs, fmts, opt.Progress)
		drawing <- drawn{f, e}
	}()
	var done *drawn
	waitFigures := func() *drawn {
		if done == nil {
			d := <-drawing
			done = &d
		}
		return done
	}
	defer func() {
		waitFigures() // no figure is written after Write returns
		if err != nil {
			// The run stopped before its manifest: figures that no manifest
			// lists would make the folder look like someone else's.
			for _, f := range figs {
				for _, format := range fmts {
					if rel := "figures/" + f.Stem + "." + format; !listed[rel] {
						os.Remove(filepath.Join(opt.Dir, filepath.FromSlash(rel)))
					}
				}
			}
		}
	}()
	var samplesErr error
	if opt.Reassess != nil {
		samplesErr = write("samples.csv", func(cw io.Writer) error {
			return write("samples.json", func(jw io.Writer) error {
				return write("samples.geojson", func(gw io.Writer) error {
					return writeSamples(cw, jw, gw, opt.Reassess, sampleCols, all, compactJSON(nRecs), firstRows)
				})
			})
		})
	} else {
		samplesErr = errors.Join(
			write("samples.csv", func(w io.Writer) error { return writeSamplesCSV(w, recs, sampleCols) }),
			write("samples.json", func(w io.Writer) error {
				ao := opt.Assess
				if ao.Model == nil && !auto {
					ao.Model = opt.Model
				}
				return report.WriteJSONParallel(w, recs, func() func(*assess.Record) *assess.Record {
					return assess.NewDetailer(opt.DB, ao).Record
				}, runtime.GOMAXPROCS(0), compactJSON(nRecs))
			}),
			write("samples.geojson", func(w io.Writer) error { return report.WriteGeoJSON(w, recs, all) }))
	}
	if err := errors.Join(
		samplesErr,
		write("columns.csv", cols.WriteCSV),
		write("surfaces.csv", surf.WriteCSV),
		write("methods.json", func(w io.Writer) error { return report.WriteMethodsJSON(w, methods) }),
		write("findings.csv", fnd.f.Table().WriteCSV),
		write("trends.csv", findings.TrendTable(fnd.trends).WriteCSV),
	); err != nil {
		return nil, err
	}
	// GIS layers of the surfaces: GeoTIFF rasters and GeoJSON lines and bands.
	if _, err := atomicfile.CleanStale(filepath.Join(opt.Dir, "gis"), staleAfter); err != nil && !errors.Is(err, fs.ErrNotExist) {
		out.Notes = append(out.Notes, err.Error())
	}
	gis, err := site.WriteLayers(filepath.Join(opt.Dir, "gis"), st)
	if err != nil {
		return nil, fmt.Errorf("GIS layers: %w", err)
	}
	for _, g := range gis {
		rel, rerr := filepath.Rel(opt.Dir, g)
		if rerr != nil {
			rel = filepath.Join("gis", filepath.Base(g))
		}
		out.Written = append(out.Written, filepath.ToSlash(rel))
	}

	rendered, ferrs := waitFigures().figs, waitFigures().errs
	out.FigureErrors = ferrs
	out.Figures = len(figs) - len(ferrs)
	for _, f := range figs {
		// Listed even when drawing failed: a partly written figure is ours.
		for _, format := range fmts {
			out.Written = append(out.Written, "figures/"+f.Stem+"."+format)
		}
	}
	for i := range sections {
		n := len(sections[i].Figures)
		sections[i].Figures = rendered[len(st.Figures) : len(st.Figures)+n]
	}
	key := keyMinerals(st, all)
	ix := &report.Index{
		Title:       "gwsat report: saturation screening",
		Generated:   fmt.Sprintf("Made by gwsat on %s; activity model: %s.", now.UTC().Format("2006-01-02 15:04 UTC"), modelWords(methods)),
		Findings:    opt.Findings,
		KeyMinerals: key,
		KeyTable:    keyTable(tbl, key),
		Figures:     rendered[:len(st.Figures)],
		Notes:       append(append([]string(nil), st.Notes...), unplacedNote(st)...),
		Sections:    sections,
		Inputs:      batchFiles(opt.Batches),
		Methods:     methods,
		Tables:      fullTables(tbl, surf, cols, all),
	}
	ix.Counts = []report.Link{{Label: out.Summary.StatusLine()}, {Label: out.Summary.BalanceLine()}}
	ix.QA = qa
	if nRecs > MaxPageRows {
		ix.Notes = append(ix.Notes, fmt.Sprintf("The input has %d rows: the sample tables on this page show the first %d, in input order. samples.csv, samples.json and samples.geojson hold every row (samples.json one sample per line, without indentation).", nRecs, MaxPageRows))
	}
	if nRecs > ForwardAbove {
		ix.Notes = append(ix.Notes, fmt.Sprintf("With more than %d rows, the SI intervals take one-sided differences (half the solves of the central ones; on the demo their standard deviations agree within 0.001).", ForwardAbove))
	}
	for _, f := range tableFiles {
		ix.Files = append(ix.Files, report.Link{Label: f, Href: f})
	}
	for _, w := range out.Written {
		if strings.HasPrefix(w, "gis/") {
			ix.Files = append(ix.Files, report.Link{Label: w, Href: w})
		}
	}
	if err := write("index.html", func(w io.Writer) error { return report.WriteIndex(w, ix) }); err != nil {
		return nil, err
	}
	out.Index = filepath.Join(opt.Dir, "index.html")
	if err := removeStale(opt.Dir, listed, out.Written); err != nil {
		out.Notes = append(out.Notes, err.Error())
	}
	if err := writeManifest(opt.Dir, out.Written); err != nil {
		return nil, err
	}
	return out, nil
}

// modelWords names the activity model for the page's first lines.
func modelWords(m *report.Methods) string {
	if strings.HasPrefix(m.Activity.Name, "automatic") {
		return "chosen per row (see methods)"
	}
	return m.Activity.Name
}

// qaLine words a row that is not ok: where it is, its status, and its first
// problem (without the severity word, which the status already gives).

func batchFiles(bs []*hydro.Batch) []string {
	out := make([]string, len(bs))
	for i, b := range bs {
		out[i] = b.File
	}
	return out
}

// Formats checks a list of figure formats and adds PNG (the page embeds it).
func Formats(list []string) ([]string, error) {
	var out []string
	seen := map[string]bool{}
	for _, f := range list {
		f = strings.ToLower(strings.TrimSpace(f))
		switch f {
		case "png", "svg", "pdf":
			if !seen[f] {
				seen[f] = true
				out = append(out, f)
			}
		case "":
		default:
			return nil, fmt.Errorf("unknown figure format %q (png, svg, pdf)", f)
		}
	}
	if !seen["png"] {
		out = append(out, "png")
	}
	return out, nil
}
