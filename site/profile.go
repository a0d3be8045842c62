package site

import (
	"fmt"
	"math"
	"sort"
	"strings"

	"github.com/paulmach/orb"
	"gonum.org/v1/plot/vg"

	"gwsat.dev/gwsat/figure"
	"gwsat.dev/gwsat/hydro"
	"gwsat.dev/gwsat/report"
)

// clusterOf returns the well cluster of a sample: the value of the named
// column (default "Cluster") when the file has one, else "" (one cluster
// for the whole site).
func clusterOf(s *hydro.Sample, column string) string {
	if column == "" {
		column = "cluster"
	}
	for k, v := range s.Extra {
		if strings.EqualFold(strings.TrimSpace(k), column) {
			return strings.TrimSpace(v)
		}
	}
	return ""
}

// profiles draws SI against depth per well cluster: one row of panels per
// nest (wells within 10 m of each other), one column per mineral, every
// sampling round in each panel (rounds told apart by dash and marker fill).
// Options.ProfileRound, when set, keeps one round only.
func profiles(placed []placedRec, minerals, rounds []string, opt Options) []report.Fig {
	if opt.ProfileRound != "" {
		rounds = []string{opt.ProfileRound}
	}
	inRounds := map[string]bool{}
	for _, r := range rounds {
		inRounds[r] = true
	}
	byCluster := map[string][]placedRec{}
	var order []string
	for _, p := range placed {
		if !p.hasD || !inRounds[p.rec.Sample().Round] {
			continue
		}
		c := clusterOf(p.rec.Sample(), opt.ClusterColumn)
		if _, ok := byCluster[c]; !ok {
			order = append(order, c)
		}
		byCluster[c] = append(byCluster[c], p)
	}
	sort.Strings(order)
	var figs []report.Fig
	for _, c := range order {
		nests := nestsOf(byCluster[c])
		var panels []figure.ProfilePanel
		nRows := 0
		// Wells standing alone (not in a nest) share one row of unconnected
		// markers: a line between different wells would suggest a profile
		// that was never sampled.
		var singles []placedRec
		for _, n := range nests {
			if len(distinctWells(n.members)) == 1 {
				singles = append(singles, n.members...)
				continue
			}
			nRows++
			for _, m := range minerals {
				panels = append(panels, figure.ProfilePanel{Mineral: m, Row: "nest " + n.label, Lines: roundLines(n.members, m, rounds, false)})
			}
		}
		if len(singles) > 0 {
			nRows++
			for _, m := range minerals {
				panels = append(panels, figure.ProfilePanel{Mineral: m, Row: "single wells", Lines: roundLines(singles, m, rounds, true)})
			}
		}
		name := c
		if name == "" {
			name = "site"
		}
		title := "Cluster " + name
		if c == "" {
			title = "All wells"
		}
		if len(rounds) == 1 && rounds[0] != "" {
			title += ", round " + rounds[0]
		}
		// 16.5 cm wide: a full A4 text width at 100 % (21 cm less margins).
		figs = append(figs, report.Fig{
			Stem:  "profile_" + slug(name),
			Title: title,
			Caption: fmt.Sprintf("Saturation index against depth below ground (screen middle): one row per well nest (wells within 10 m of each other), single wells as unconnected markers; each mineral in its own colour and marker; sampling rounds by dash pattern and marker fill (latest solid and filled). Shaded: near-equilibrium band SI within ±%.1f (common practice); %s model.",
				figure.DefaultBand, opt.Model),
			Figure: figure.DepthProfile{Title: title, Panels: panels, Rounds: rounds},
			W:      16.5 * vg.Centimeter, H: max(vg.Length(nRows)*4.5+3.5, 9) * vg.Centimeter,
		})
	}
	return figs
}

// distinctWells returns the well labels of ps, each once.
func distinctWells(ps []placedRec) []string {
	seen := map[string]bool{}
	var out []string
	for _, p := range ps {
		l := wellLabel(p.rec.Sample())
		if !seen[l] {
			seen[l] = true
			out = append(out, l)
		}
	}
	return out
}

// roundLines returns one profile line per round of mineral m's SI with depth.
func roundLines(ps []placedRec, m string, rounds []string, points bool) []figure.ProfileLine {
	var out []figure.ProfileLine
	for _, rd := range rounds {
		line := figure.ProfileLine{Round: rd, Points: points}
		var sel []placedRec
		for _, p := range ps {
			if p.rec.Sample().Round == rd {
				sel = append(sel, p)
			}
		}
		sort.SliceStable(sel, func(i, j int) bool { return sel[i].depth < sel[j].depth })
		for _, p := range sel {
			if si, ok := p.rec.Result.SI(m); ok {
				line.Depth = append(line.Depth, p.depth)
				line.SI = append(line.SI, si)
			}
		}
		if len(line.Depth) > 0 {
			out = append(out, line)
		}
	}
	return out
}

type nest struct {
	label   string
	at      orb.Point
	members []placedRec
}

// nestsOf groups wells standing within 10 m of each other (a nest of wells
// screened at different depths); the label is the well ids' common prefix.
func nestsOf(ps []placedRec) []*nest {
	var out []*nest
	for _, p := range ps {
		var hit *nest
		for _, n := range out {
			if math.Hypot(n.at[0]-p.xy[0], n.at[1]-p.xy[1]) < 10 {
				hit = n
				break
			}
		}
		if hit == nil {
			hit = &nest{at: p.xy}
			out = append(out, hit)
		}
		hit.members = append(hit.members, p)
	}
	for _, n := range out {
		ids := make([]string, len(n.members))
		for i, p := range n.members {
			ids[i] = wellLabel(p.rec.Sample())
		}
		n.label = commonPrefix(ids)
	}
	sort.Slice(out, func(i, j int) bool { return out[i].label < out[j].label })
	return out
}

func commonPrefix(ids []string) string {
	if len(ids) == 1 {
		return ids[0]
	}
	p := ids[0]
	for _, s := range ids[1:] {
		for !strings.HasPrefix(s, p) {
			p = p[:len(p)-1]
		}
	}
	p = strings.TrimRight(p, "-_ ./")
	if p == "" {
		return ids[0] + "..."
	}
	return p
}
