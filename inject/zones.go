package inject

import (
	"fmt"
	"sort"
	"strings"

	"gwsat.dev/gwsat/assess"
	"gwsat.dev/gwsat/report"
	"gwsat.dev/gwsat/speciation/reaction"
)

// NativeWaters returns the ids of every speciated row whose sample type is
// "native" (see ByType), shallowest first (assess.DepthM; rows without a
// depth last, in input order). A site whose native water is stratified has
// one per zone, and each is evaluated against the injectate.
func NativeWaters(recs []assess.Record) []string {
	type nw struct {
		id    string
		depth float64
		has   bool
		order int
	}
	var out []nw
	for i := range recs {
		r := &recs[i]
		if r.Result == nil || !strings.EqualFold(r.Sample().Type(), "native") {
			continue
		}
		d, ok := assess.DepthM(r.Sample())
		out = append(out, nw{r.Sample().ID, d, ok, i})
	}
	sort.SliceStable(out, func(i, j int) bool {
		if out[i].has != out[j].has {
			return out[i].has
		}
		if out[i].has && out[i].depth != out[j].depth {
			return out[i].depth < out[j].depth
		}
		return out[i].order < out[j].order
	})
	ids := make([]string, len(out))
	for i, n := range out {
		ids[i] = n.id
	}
	return ids
}

// MaxNativeWaters is the most native waters the report section evaluates
// against the injectate (each is a blend of 21 shares; more would make the
// section unreadable, and a large file repeats its background wells many
// times; common practice).
const MaxNativeWaters = 12

// fewNatives keeps at most MaxNativeWaters of ids (native waters in the order
// of NativeWaters): all of them when they are that few, else the first row of
// each well (rows without a well id count as their own well), the first
// MaxNativeWaters of those. It returns the ids kept and how many were left
// out.
func (p *Planner) fewNatives(ids []string) ([]string, int) {
	if len(ids) <= MaxNativeWaters {
		return ids, 0
	}
	var kept []string
	seen := map[string]bool{}
	for _, id := range ids {
		if len(kept) == MaxNativeWaters {
			break
		}
		well := id
		if at := p.rowsOf(id); len(at) > 0 && p.recs[at[0]].Sample().WellID != "" {
			well = p.recs[at[0]].Sample().WellID
		}
		if !seen[well] {
			seen[well] = true
			kept = append(kept, id)
		}
	}
	return kept, len(ids) - len(kept)
}

// pairing is one blend evaluated by the section: a native water with the
// injectate, or two native waters of adjacent zones (cross-flow through a
// screen open to both).
type pairing struct {
	First, Second string // share 0 and share 1 of the blend
	CrossFlow     bool
	Blend         *BlendResult
	Worst         worstPoint
}

// worstPoint is where a blend is most prone to scale: the share (strictly
// between the two waters) where the positive SIs of the scale minerals sum
// highest, and the most supersaturated scale mineral there.
type worstPoint struct {
	Share   float64
	Score   float64
	Mineral string
	SI      float64
	Defined bool
}

// worst finds the worst point of a sweep for the scale minerals.
func worst(sw *reaction.Sweep, scale map[string]bool) worstPoint {
	w := worstPoint{Share: 0.5, Score: -1}
	for _, pt := range sw.Points {
		if pt.Fraction <= 0 || pt.Fraction >= 1 {
			continue // an end-member, not a blend
		}
		score, top, topSI, any := 0.0, "", 0.0, false
		for i, mn := range sw.Minerals {
			if !pt.Defined[i] || !scale[mn] {
				continue
			}
			if pt.SI[i] > 0 {
				score += pt.SI[i]
			}
			if !any || pt.SI[i] > topSI {
				top, topSI, any = mn, pt.SI[i], true
			}
		}
		if any && score > w.Score {
			w = worstPoint{Share: pt.Fraction, Score: score, Mineral: top, SI: topSI, Defined: true}
		}
	}
	return w
}

// pairingsTable lists every blend the section evaluated with its worst point
// and the peak SI of the chosen minerals along it.
func pairingsTable(ps []pairing, minerals []string) *report.Table {
	t := &report.Table{Header: []string{"blend", "worst_share", "worst_mineral", "worst_si"}}
	for _, m := range minerals {
		t.Header = append(t.Header, report.ColumnName(m))
	}
	for _, p := range ps {
		name := fmt.Sprintf("%s (0) with injectate %s (1)", p.First, p.Second)
		if p.CrossFlow {
			name = fmt.Sprintf("cross-flow: %s (0) with %s (1)", p.First, p.Second)
		}
		row := []string{report.Text(name), "", "", ""}
		if p.Worst.Defined {
			row[1], row[2], row[3] = report.Num(p.Worst.Share, 2), p.Worst.Mineral, report.Full(p.Worst.SI)
		}
		peak := map[string]float64{}
		for _, mx := range p.Blend.Sweep.Maxima() {
			peak[mx.Mineral] = mx.SI
		}
		for _, m := range minerals {
			v, ok := peak[m]
			row = append(row, report.Cond(ok, report.Full(v)))
		}
		t.Rows = append(t.Rows, row)
	}
	return t
}
