package sitereport

import (
	"context"
	"errors"
	"fmt"
	"io"
	"os"
	"path/filepath"
	"runtime"
	"strings"
	"sync"
	"time"

	"gwsat.dev/gwsat/assess"
	"gwsat.dev/gwsat/figure"
	"gwsat.dev/gwsat/hydro"
	"gwsat.dev/gwsat/inject"
	"gwsat.dev/gwsat/internal/atomicfile"
	"gwsat.dev/gwsat/internal/lockfile"
	"gwsat.dev/gwsat/report"
	"gwsat.dev/gwsat/site"
	"gwsat.dev/gwsat/speciation"
)

// Options describe a report folder.
type Options struct {
	Dir     string          // the folder (created)
	Batches []*hydro.Batch  // the files read, for the column report
	Records []assess.Record // the assessed rows, in input order
	DB      *speciation.Database
	Model   speciation.ActivityModel
	Site    site.Options
	// Inject chooses the injection-planning section (end-members by sample id or
	// sample type); the section is left out when no end-members are found.
	Inject inject.SectionOptions
	// Formats of the figures ("png", "svg", "pdf"); PNG is always written, the page
	// embeds it.
	Formats []string
	// Progress, when not nil, is called after each figure is drawn with the count
	// done and the total.
	Progress func(done, total int)
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
}

// staleAfter is the age beyond which a temporary file of ours in the report
// folder is taken as left behind by a run that was killed (common practice: no
// report takes an hour).
const staleAfter = time.Hour

// Files written by Write besides index.html and the figures.
var tableFiles = []string{"samples.csv", "samples.json", "samples.geojson", "columns.csv", "surfaces.csv"}

// Write computes the site figures and the injection-planning section, then
// writes the folder. Nothing is written when an argument is wrong. A figure that
// cannot be drawn is reported in Outcome.FigureErrors and left out of the page.
func Write(ctx context.Context, opt Options) (_ *Outcome, err error) {
	if opt.Model == nil {
		opt.Model = speciation.TruesdellJones{}
	}
	fmts, err := Formats(opt.Formats)
	if err != nil {
		return nil, err
	}
	recs := opt.Records
	all := opt.DB.MineralNames()
	out := &Outcome{}
	so := opt.Site
	so.Model = opt.Model.Name()
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
	figs := append([]report.Fig(nil), st.Figures...)
	var sections []report.Section
	sec, mfigs, err := inject.NewPlanner(opt.DB, opt.Model, recs).Section(opt.Inject)
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
	for _, d := range []string{opt.Dir, filepath.Join(opt.Dir, "figures")} {
		// Temporary files a killed run left behind (our own names only).
		if _, err := atomicfile.CleanStale(d, staleAfter); err != nil {
			out.Notes = append(out.Notes, err.Error())
		}
	}
	uniqueStems(figs)
	tbl := report.SampleTable(recs, report.ColumnsFor(opt.Batches, all))
	write := func(name string, fill func(w io.Writer) error) error {
		return atomicfile.WriteWith(filepath.Join(opt.Dir, name), fill)
	}
	if err := errors.Join(
		write("samples.csv", tbl.WriteCSV),
		write("samples.json", func(w io.Writer) error { return report.WriteJSON(w, recs) }),
		write("columns.csv", MappingTable(opt.Batches).WriteCSV),
		write("surfaces.csv", surfacesTable(st).WriteCSV),
		write("samples.geojson", func(w io.Writer) error { return report.WriteGeoJSON(w, recs, all) }),
	); err != nil {
		return nil, err
	}

	rendered, ferrs := renderFigures(ctx, opt.Dir, figs, fmts, opt.Progress)
	out.FigureErrors = ferrs
	out.Figures = len(figs) - len(ferrs)
	if err := removeOldFigures(filepath.Join(opt.Dir, "figures"), figs, fmts); err != nil {
		out.Notes = append(out.Notes, err.Error())
	}
	out.Summary = assess.Summarise(batchFiles(opt.Batches), recs)
	ix := &report.Index{
		Title:     "gwsat report: saturation screening",
		Generated: fmt.Sprintf("Made by gwsat on %s with the %s activity model.", time.Now().UTC().Format("2006-01-02 15:04 UTC"), opt.Model.Name()),
		Table:     summaryTable(tbl),
		Figures:   rendered[:len(st.Figures)],
		Notes:     append(append([]string(nil), st.Notes...), unplacedNote(st)...),
		Sections:  sections,
		Inputs:    batchFiles(opt.Batches),
	}
	for i := range sections {
		n := len(sections[i].Figures)
		sections[i].Figures = rendered[len(st.Figures) : len(st.Figures)+n]
	}
	ix.Counts = []report.Link{{Label: out.Summary.StatusLine()}, {Label: out.Summary.BalanceLine()}}
	for i := range recs {
		r := &recs[i]
		if r.Status != hydro.StatusOK {
			ix.QA = append(ix.QA, fmt.Sprintf("%s line %d, sample %s (%s): %s", r.File, r.Row.Line, r.Sample().ID, r.Status, r.FirstProblem()))
		}
	}
	for _, f := range tableFiles {
		ix.Files = append(ix.Files, report.Link{Label: f, Href: f})
	}
	if err := write("index.html", func(w io.Writer) error { return report.WriteIndex(w, ix) }); err != nil {
		return nil, err
	}
	out.Index = filepath.Join(opt.Dir, "index.html")
	return out, nil
}

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

// renderFigures draws every figure in every format, in parallel, and returns
// what index.html shows and the figures that failed.
func renderFigures(ctx context.Context, dir string, figs []report.Fig, fmts []string, progress func(done, total int)) ([]report.IndexFigure, []error) {
	out := make([]report.IndexFigure, len(figs))
	errs := make([]error, len(figs))
	var mu sync.Mutex
	done := 0
	jobs := make(chan int)
	var wg sync.WaitGroup
	for w := 0; w < runtime.GOMAXPROCS(0); w++ {
		wg.Add(1)
		go func() {
			defer wg.Done()
			for i := range jobs {
				errs[i] = renderOne(dir, figs[i], fmts, &out[i])
				mu.Lock()
				done++
				if progress != nil {
					progress(done, len(figs))
				}
				mu.Unlock()
			}
		}()
	}
feed:
	for i := range figs {
		select {
		case jobs <- i:
		case <-ctx.Done():
			errs[i] = ctx.Err()
			break feed
		}
	}
	close(jobs)
	wg.Wait()
	var failed []error
	for i := range figs {
		if errs[i] != nil {
			failed = append(failed, errs[i])
			out[i].Caption += " (This figure could not be drawn: " + errs[i].Error() + ")"
		}
	}
	return out, failed
}

func renderOne(dir string, f report.Fig, fmts []string, out *report.IndexFigure) error {
	*out = report.IndexFigure{Title: f.Title, Caption: f.Caption}
	for _, format := range fmts {
		b, err := figure.Render(f.Figure, format, f.W, f.H)
		if err != nil {
			return fmt.Errorf("figure %s: %w", f.Stem, err)
		}
		name := filepath.Join("figures", f.Stem+"."+format)
		if err := atomicfile.WriteFile(filepath.Join(dir, name), b); err != nil {
			return err
		}
		if format == "png" {
			out.PNG = b
		}
		out.Links = append(out.Links, report.Link{Label: strings.ToUpper(format), Href: name})
	}
	return nil
}

// uniqueStems gives figures whose file names would clash (two clusters whose
// names reduce to the same letters) a numbered suffix.
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

// figurePrefixes are the file-name prefixes of the figures Write draws.
var figurePrefixes = []string{"map_", "profile_", "blend_", "warm_", "deposit_", "piper", "redox_"}

// removeOldFigures deletes the figures an earlier report left in dir, so that a
// figure no longer drawn (another mineral, zone or cluster) does not linger
// beside the new ones. Only gwsat's own file names are touched, and never those
// just written.
func removeOldFigures(dir string, figs []report.Fig, fmts []string) error {
	keep := map[string]bool{}
	for _, f := range figs {
		for _, ext := range fmts {
			keep[f.Stem+"."+ext] = true
		}
	}
	var errs []error
	for _, prefix := range figurePrefixes {
		for _, ext := range []string{"png", "svg", "pdf"} {
			old, err := filepath.Glob(filepath.Join(dir, prefix+"*."+ext))
			if err != nil {
				return err
			}
			for _, f := range old {
				if !keep[filepath.Base(f)] {
					if err := os.Remove(f); err != nil {
						errs = append(errs, err)
					}
				}
			}
		}
	}
	return errors.Join(errs...)
}
