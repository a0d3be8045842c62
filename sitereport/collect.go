package sitereport

import (
	"context"
	"slices"
	"strings"

	"gwsat.dev/gwsat/assess"
	"gwsat.dev/gwsat/findings"
	"gwsat.dev/gwsat/hydro"
	"gwsat.dev/gwsat/speciation"
	"gwsat.dev/gwsat/uncertainty"
)

// intervalChunk is how many rows Collect gathers before estimating their
// intervals together (on every core).
const intervalChunk = 2048

// CollectOptions control Collect.
type CollectOptions struct {
	// Assess are the options the rows are assessed with (Detail false keeps
	// the records small).
	Assess assess.Options
	// Model is the report's activity model (Options.Model; nil as there) for
	// the SI intervals.
	Model speciation.ActivityModel
	// Compact keeps every record after the first MaxPageRows small (see
	// Collect). Set it only when the samples files will be written from a
	// second reading of the inputs (Options.Reassess): a compact record
	// lacks what they need.
	Compact bool
	// Keep are sample ids whose records are always kept whole (the
	// end-members named for the injection section).
	Keep []string
	// ClusterColumn is the column grouping wells into clusters
	// (site.Options.ClusterColumn; "" for the default, "Cluster"): a
	// compact record keeps it and the sample type of its unrecognised
	// columns, and no other.
	ClusterColumn string
	// CompactFrom is the index of the first record compacted (0:
	// MaxPageRows, the rows the page's tables show in full).
	CompactFrom int
	// Rows is the number of rows expected (0 when unknown), so that the
	// records are held in one allocation rather than grown by copying; above
	// ForwardAbove the intervals take one-sided differences.
	Rows int
}

// Collected are the rows a report is made from: the records, in input
// order, and the SI interval of each (Options.Samples).
type Collected struct {
	Records []assess.Record
	Samples []uncertainty.Sample
}

// Collect assesses the rows next yields (assess.Stream) and estimates their
// SI intervals a chunk at a time, as Write would (the linear estimate). With
// Compact, a record is then cut down to what the findings, maps, figures and
// injection section read, so that memory grows by a few kilobytes per row
// rather than by everything read and solved for it: the analytes other than
// the major ions and the trend analytes, the unrecognised columns other
// than the sample type and the cluster, the water's molalities and the speciation's component totals
// are dropped. The first MaxPageRows records (the page's tables), rows whose
// sample type is injectate or native, and the ids of Keep stay whole.
func Collect(ctx context.Context, db *speciation.Database, next func() (assess.Item, bool, error), opt CollectOptions) (*Collected, error) {
	model := opt.Model
	if model == nil {
		model = speciation.TruesdellJones{}
	}
	keep := map[string]bool{}
	for _, id := range opt.Keep {
		if id != "" {
			keep[id] = true
		}
	}
	from := opt.CompactFrom
	if from <= 0 {
		from = MaxPageRows
	}
	out := &Collected{Records: make([]assess.Record, 0, opt.Rows), Samples: make([]uncertainty.Sample, 0, opt.Rows)}
	var chunk []assess.Record
	flush := func() error {
		if len(chunk) == 0 {
			return nil
		}
		samples, err := uncertainty.Run(ctx, db, chunk, intervalOptions(model, len(out.Records), opt.Rows))
		if err != nil {
			return err
		}
		for i := range chunk {
			r := &chunk[i]
			if opt.Compact && len(out.Records) >= from && !keep[r.Sample().ID] && !endMember(r) {
				compact(r, opt.ClusterColumn)
			}
			out.Records = append(out.Records, *r)
		}
		out.Samples = append(out.Samples, samples...)
		chunk = chunk[:0]
		return nil
	}
	err := assess.Stream(ctx, db, next, opt.Assess, func(r *assess.Record) error {
		chunk = append(chunk, *r)
		if len(chunk) == intervalChunk {
			return flush()
		}
		return nil
	})
	if err == nil {
		err = flush()
	}
	if err != nil {
		return nil, err
	}
	return out, nil
}

// ForwardAbove is the number of rows above which the report's SI intervals
// take one-sided differences (uncertainty.Options.Forward: half the solves,
// SDs within 0.001 of the central ones on the demo), so that the intervals
// of a large file do not dominate its report.
const ForwardAbove = 20000

// intervalOptions are the options of the report's SI intervals for a file
// of rows rows: the fast linear estimate (a report is read by people, and
// the Monte Carlo estimate of 'gwsat findings' gives the same verdicts
// within its noise), one-sided above ForwardAbove rows, without the
// sensitivities, which the report does not show. first is the index of the
// first record (its random stream, unused by the linear estimate).
func intervalOptions(model speciation.ActivityModel, first, rows int) uncertainty.Options {
	return uncertainty.Options{Linear: true, Forward: rows > ForwardAbove, Brief: true, Model: model, FirstStream: uint64(first)}
}

// endMember says whether a row may be an end-member of the injection
// section (inject.ByType, inject.NativeWaters): its sample type is
// injectate or native.
func endMember(r *assess.Record) bool {
	t := r.Sample().Type()
	return strings.EqualFold(t, "injectate") || strings.EqualFold(t, "native")
}

// compactAnalytes are the analytes a compact record keeps: the major ions
// of the water types, Stiff and Piper diagrams (findings.Ions,
// site.PiperFigure) and the analytes whose trends are tested
// (findings.TrendAnalytes).
var compactAnalytes = func() []string {
	out := []string{"Ca", "Mg", "Na", "K", "Cl", "SO4", "Alk", "HCO3", "CO3"}
	for _, k := range findings.TrendAnalytes() {
		if !slices.Contains(out, k) {
			out = append(out, k)
		}
	}
	return out
}()

// compact cuts a record down (see Collect); cluster names the cluster
// column.
func compact(r *assess.Record, cluster string) {
	s := &r.Row.Sample
	if cluster == "" {
		cluster = findings.DefaultClusterColumn
	}
	if len(s.Extra) > 0 {
		small := map[string]string{}
		for k, v := range s.Extra {
			if hydro.IsSampleTypeHeader(k) || strings.EqualFold(strings.TrimSpace(k), cluster) {
				small[k] = v
			}
		}
		s.Extra = small
	}
	if len(s.Analytes) > 0 {
		n := 0
		for _, k := range compactAnalytes {
			if _, ok := s.Analytes[k]; ok {
				n++
			}
		}
		small := make(map[string]hydro.Measurement, n)
		for _, k := range compactAnalytes {
			if m, ok := s.Analytes[k]; ok {
				small[k] = m
			}
		}
		s.Analytes = small
	}
	s.ExtraColumns = nil
	r.Water.Molal = nil
	if r.Result != nil {
		res := *r.Result
		res.Totals, res.Species, res.Distribution, res.Phases = nil, nil, nil, nil
		r.Result = &res
	}
}
