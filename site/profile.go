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

// profiles draws SI against depth per well cluster, one line per nest
// (wells within 10 m of each other), for one sampling round.
func profiles(placed []placedRec, minerals, rounds []string, opt Options) []report.Fig {
	round := opt.ProfileRound
	if round == "" && len(rounds) > 0 {
		round = rounds[len(rounds)-1]
	}
	byCluster := map[string][]placedRec{}
	var order []string
	for _, p := range placed {
		if !p.hasD || p.rec.Sample().Round != round {
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
		for _, m := range minerals {
			pp := figure.ProfilePanel{Mineral: m}
			// Wells standing alone (not in a nest) share one series of
			// unconnected markers: a line between different wells would
			// suggest a profile that was never sampled.
			singles := figure.ProfileLine{Label: "single wells", Points: true}
			for _, n := range nests {
				line := figure.ProfileLine{Label: n.label}
				sort.Slice(n.members, func(i, j int) bool { return n.members[i].depth < n.members[j].depth })
				for _, p := range n.members {
					if si, ok := p.rec.Result.SI(m); ok {
						line.Depth = append(line.Depth, p.depth)
						line.SI = append(line.SI, si)
					}
				}
				switch {
				case len(n.members) == 1:
					singles.Depth = append(singles.Depth, line.Depth...)
					singles.SI = append(singles.SI, line.SI...)
				case len(line.Depth) > 0:
					pp.Lines = append(pp.Lines, line)
				}
			}
			if len(singles.Depth) > 0 {
				pp.Lines = append(pp.Lines, singles)
			}
			panels = append(panels, pp)
		}
		name := c
		if name == "" {
			name = "site"
		}
		title := "Cluster " + name
		if c == "" {
			title = "All wells"
		}
		if round != "" {
			title += ", round " + round
		}
		figs = append(figs, report.Fig{
			Stem:  "profile_" + slug(name),
			Title: title,
			Caption: fmt.Sprintf("Saturation index against depth below ground (screen middle), one line per well nest (wells within 10 m of each other), single wells as unconnected markers; shaded: near-equilibrium band SI within +/-%.1f (common practice); %s model.",
				figure.DefaultBand, opt.Model),
			Figure: figure.DepthProfile{Title: title, Panels: panels},
			W:      vg.Length(len(panels))*5*vg.Centimeter + 3*vg.Centimeter, H: 11 * vg.Centimeter,
		})
	}
	return figs
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
