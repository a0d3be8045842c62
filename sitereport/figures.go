package sitereport

import (
	"context"
	"fmt"
	"path/filepath"
	"runtime"
	"strings"
	"sync"

	"gwsat.dev/gwsat/figure"
	"gwsat.dev/gwsat/internal/atomicfile"
	"gwsat.dev/gwsat/report"
)

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
		var b []byte
		if format == "png" {
			r, err := rasterise(f.Figure, f.W, f.H)
			if err != nil {
				return fmt.Errorf("figure %s: %w", f.Stem, err)
			}
			b, out.PNG, out.Width, out.Height = r.Full, r.Screen, r.W, r.H
		} else {
			var err error
			if b, err = figure.Render(f.Figure, format, f.W, f.H); err != nil {
				return fmt.Errorf("figure %s: %w", f.Stem, err)
			}
		}
		name := filepath.Join("figures", f.Stem+"."+format)
		if err := atomicfile.WriteFile(filepath.Join(dir, name), b); err != nil {
			return err
		}
		label := strings.ToUpper(format)
		if format == "png" {
			label = fmt.Sprintf("PNG (%d dpi)", figure.PNGDPI)
		}
		out.Links = append(out.Links, report.Link{Label: label, Href: filepath.ToSlash(name)})
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
