package findings

import (
	"fmt"
	"math"
	"slices"
	"sort"

	"gwsat.dev/gwsat/assess"
	"gwsat.dev/gwsat/uncertainty"
)

// Options control Build.
type Options struct {
	// ClusterColumn names the input column that groups wells into clusters
	// (DefaultClusterColumn when empty; samples without it form one
	// cluster, "").
	ClusterColumn string
	// ZoneEdgesM splits sample depths (assess.DepthM) into zones at these
	// depths; empty: at gaps in the depths (see the package documentation).
	ZoneEdgesM []float64
}

// Group states of a Row.
const (
	StateSupersaturated = "supersaturated" // at least one sample supersaturated with confidence
	StateUndersaturated = "undersaturated" // every sample undersaturated with confidence
	StateUndecided      = "near equilibrium or undecided"
)

// Row is one mineral in one group (cluster and depth zone): a row of
// findings.csv.
type Row struct {
	Mineral, Cluster, Zone string
	// Wells are the group's wells with an interval for the mineral, and
	// Types the sample types (hydro.Sample.Type) met there.
	Wells, Types []string
	// Samples counts the samples with an interval; Super, Undecided and
	// Under count them by verdict.
	Samples, Super, Undecided, Under int
	// SuperWells are the wells with a sample supersaturated with
	// confidence.
	SuperWells []string
	// MedianSI and MaxSI are of the SIs as measured; MaxAt names the well
	// and event of the highest.
	MedianSI, MaxSI float64
	MaxAt           string
	// First and Last name the first and last event with a sample
	// supersaturated with confidence ("" when none).
	First, Last string
	// Trend summarises the trend tests of the mineral's SI at the group's
	// wells.
	Trend string
	State string

	firstRank float64 // time of First, for ordering
}

// Findings is what a set of assessed samples says about minerals.
type Findings struct {
	Rows []Row
	// Supersaturated lists the minerals supersaturated with confidence in at
	// least one sample; Undersaturated those undersaturated with confidence
	// in every sample; Undecided the others. Each in the order of the
	// minerals in the data.
	Supersaturated, Undecided, Undersaturated []string
	// SIRange is the lowest and highest SI as measured of each mineral.
	SIRange map[string][2]float64
	// Rising lists the SI trends flagged TowardSaturation.
	Rising []Trend
	Types  []TypeCount
	// Samples counts the records, WithIntervals those with intervals.
	Samples, WithIntervals int
	Method                 string
	Seed                   uint64
	Draws                  int
	Band                   float64
}

// member is one sample's interval for one mineral.
type member struct {
	rec int
	iv  *uncertainty.Interval // in the caller's samples, not copied: a large file has many
	t   float64               // time for ordering events (NaN when none)
}

// Build gathers the findings of recs from their intervals (samples[i] for
// recs[i], from uncertainty.Run) and their trends (from Trends). band is
// the verdict band the intervals were judged with (reported only).
func Build(recs []assess.Record, samples []uncertainty.Sample, trends []Trend, band float64, opt Options) (*Findings, error) {
	if len(samples) != len(recs) {
		return nil, fmt.Errorf("findings: %d interval results for %d records", len(samples), len(recs))
	}
	f := &Findings{Samples: len(recs), SIRange: map[string][2]float64{}, Band: band}
	groups := groupsOf(recs, opt.ClusterColumn, opt.ZoneEdgesM)
	times := eventTimes(recs)
	type key struct {
		mineral string
		g       group
	}
	byKey := map[key][]member{}
	var minerals []string
	seenMineral := map[string]bool{}
	for i, s := range samples {
		if s.Err != nil || len(s.Intervals) == 0 {
			continue
		}
		f.WithIntervals++
		if f.Method == "" {
			f.Method, f.Seed, f.Draws = s.Method, s.Seed, s.Draws+s.Failed
		}
		for n := range s.Intervals {
			iv := &samples[i].Intervals[n]
			if !seenMineral[iv.Mineral] {
				seenMineral[iv.Mineral] = true
				minerals = append(minerals, iv.Mineral)
			}
			k := key{iv.Mineral, groups[i]}
			byKey[k] = append(byKey[k], member{rec: i, iv: iv, t: times[i]})
		}
	}
	// minerals in database order: the order of the first sample's intervals
	// is the data's; a later sample may add minerals, kept after.
	keys := make([]key, 0, len(byKey))
	for k := range byKey {
		keys = append(keys, k)
	}
	rank := map[string]int{}
	for i, m := range minerals {
		rank[m] = i
	}
	sort.Slice(keys, func(i, j int) bool {
		a, b := keys[i], keys[j]
		if a.mineral != b.mineral {
			return rank[a.mineral] < rank[b.mineral]
		}
		return a.g.less(b.g)
	})
	super, allUnder := map[string]bool{}, map[string]bool{}
	for _, m := range minerals {
		allUnder[m] = true
	}
	for _, k := range keys {
		row := buildRow(recs, k.mineral, k.g, byKey[k], trends)
		f.Rows = append(f.Rows, row)
		if row.Super > 0 {
			super[k.mineral] = true
		}
		if row.Under != row.Samples {
			allUnder[k.mineral] = false
		}
		for _, mb := range byKey[k] {
			r, ok := f.SIRange[k.mineral]
			if !ok {
				r = [2]float64{mb.iv.Best, mb.iv.Best}
			}
			f.SIRange[k.mineral] = [2]float64{math.Min(r[0], mb.iv.Best), math.Max(r[1], mb.iv.Best)}
		}
	}
	for _, m := range minerals {
		switch {
		case super[m]:
			f.Supersaturated = append(f.Supersaturated, m)
		case allUnder[m]:
			f.Undersaturated = append(f.Undersaturated, m)
		default:
			f.Undecided = append(f.Undecided, m)
		}
	}
	for _, t := range trends {
		if t.TowardSaturation {
			f.Rising = append(f.Rising, t)
		}
	}
	f.Types = WaterTypes(recs)
	return f, nil
}

// eventTimes gives each record a time for ordering events: its decimal year
// when dated, else its round number, else NaN.
func eventTimes(recs []assess.Record) []float64 {
	rounds := roundNumbers(recs)
	out := make([]float64, len(recs))
	for i := range recs {
		s := recs[i].Sample()
		out[i] = math.NaN()
		if r, ok := rounds[s.Round]; ok {
			out[i] = r
		}
		if !s.SampledAt.IsZero() {
			out[i] = decimalYear(s.SampledAt)
		}
	}
	return out
}

// buildRow summarises one mineral in one group.
func buildRow(recs []assess.Record, mineral string, g group, ms []member, trends []Trend) Row {
	row := Row{Mineral: mineral, Cluster: g.cluster, Zone: g.zone, Samples: len(ms)}
	wells, superWells := map[string]bool{}, map[string]bool{}
	sis := make([]float64, 0, len(ms))
	first, last := -1, -1
	for j, mb := range ms {
		w := WellOf(recs[mb.rec].Sample())
		if !wells[w] {
			wells[w] = true
			row.Wells = append(row.Wells, w)
		}
		if ty := recs[mb.rec].Sample().Type(); ty != "" && !slices.Contains(row.Types, ty) {
			row.Types = append(row.Types, ty)
		}
		sis = append(sis, mb.iv.Best)
		if j == 0 || mb.iv.Best > row.MaxSI {
			row.MaxSI = mb.iv.Best
			row.MaxAt = w
			if l := eventLabel(recs[mb.rec].Sample()); l != "" {
				row.MaxAt += ", " + l
			}
		}
		switch mb.iv.Verdict {
		case uncertainty.Supersaturated:
			row.Super++
			if !superWells[w] {
				superWells[w] = true
				row.SuperWells = append(row.SuperWells, w)
			}
			if first < 0 || earlier(mb.t, ms[first].t) {
				first = j
			}
			if last < 0 || earlier(ms[last].t, mb.t) {
				last = j
			}
		case uncertainty.Undersaturated:
			row.Under++
		default:
			row.Undecided++
		}
	}
	sort.Float64s(sis)
	row.MedianSI = median(sis)
	if first >= 0 {
		row.First = eventLabel(recs[ms[first].rec].Sample())
		row.firstRank = ms[first].t
		row.Last = eventLabel(recs[ms[last].rec].Sample())
	}
	switch {
	case row.Super > 0:
		row.State = StateSupersaturated
	case row.Under == row.Samples:
		row.State = StateUndersaturated
	default:
		row.State = StateUndecided
	}
	row.Trend = trendSummary(mineral, row.Wells, trends)
	return row
}

// earlier orders times, NaN last.
func earlier(a, b float64) bool {
	if math.IsNaN(b) {
		return !math.IsNaN(a)
	}
	return a < b
}

func median(sorted []float64) float64 {
	n := len(sorted)
	if n == 0 {
		return 0
	}
	if n%2 == 1 {
		return sorted[n/2]
	}
	return (sorted[n/2-1] + sorted[n/2]) / 2
}
