package findings

import (
	"fmt"
	"math"
	"sort"
	"strings"

	"gwsat.dev/gwsat/assess"
	"gwsat.dev/gwsat/hydro"
)

// DefaultClusterColumn is the input column that groups wells into
// clusters when Options.ClusterColumn is empty.
const DefaultClusterColumn = "Cluster"

// NoDepthZone labels samples without a depth.
const NoDepthZone = "depth not reported"

// clusterOf returns the value of the cluster column of a sample, or "".
func clusterOf(s *hydro.Sample, column string) string {
	for k, v := range s.Extra {
		if strings.EqualFold(strings.TrimSpace(k), column) {
			return strings.TrimSpace(v)
		}
	}
	return ""
}

// zone is a depth interval, [top, bottom).
type zone struct {
	top, bottom float64
	label       string
}

// depthZones splits sample depths into zones: at the given edges, or at
// gaps wider than a quarter of the depth range and at least 10 m (common
// practice for nested monitoring wells; the rule the site maps use).
func depthZones(depths []float64, edges []float64) []zone {
	var zs []zone
	if len(edges) >= 2 {
		e := append([]float64(nil), edges...)
		sort.Float64s(e)
		for i := 0; i+1 < len(e); i++ {
			zs = append(zs, zone{e[i], e[i+1], fmt.Sprintf("%g-%g m depth", e[i], e[i+1])})
		}
		return zs
	}
	if len(depths) == 0 {
		return nil
	}
	ds := append([]float64(nil), depths...)
	sort.Float64s(ds)
	gap := math.Max(10, (ds[len(ds)-1]-ds[0])/4)
	start := 0
	for i := 1; i <= len(ds); i++ {
		if i == len(ds) || ds[i]-ds[i-1] > gap {
			top, bot := ds[start], ds[i-1]
			lbl := fmt.Sprintf("%.0f-%.0f m depth", top, bot)
			if math.Round(top) == math.Round(bot) {
				lbl = fmt.Sprintf("%.0f m depth", top)
			}
			zs = append(zs, zone{top, math.Nextafter(bot, math.Inf(1)), lbl})
			start = i
		}
	}
	return zs
}

// zoneOf returns the label of the zone holding a sample's depth, and its
// rank (zones top down; samples without depth or outside every zone last).
func zoneOf(r *assess.Record, zs []zone) (string, int) {
	d, ok := assess.DepthM(r.Sample())
	if !ok {
		return NoDepthZone, len(zs) + 1
	}
	for i, z := range zs {
		if d >= z.top && d < z.bottom {
			return z.label, i
		}
	}
	return fmt.Sprintf("%.0f m depth (outside the zones)", d), len(zs)
}

// group is where a sample belongs: cluster and depth zone.
type group struct {
	cluster, zone string
	zoneRank      int
}

func (g group) less(h group) bool {
	if g.cluster != h.cluster {
		if g.cluster == "" || h.cluster == "" {
			return h.cluster == "" // samples without a cluster last
		}
		return naturalLess(g.cluster, h.cluster)
	}
	if g.zoneRank != h.zoneRank {
		return g.zoneRank < h.zoneRank
	}
	return g.zone < h.zone
}

// groupsOf assigns every record to a group.
func groupsOf(recs []assess.Record, column string, edges []float64) []group {
	if column == "" {
		column = DefaultClusterColumn
	}
	var depths []float64
	for i := range recs {
		if d, ok := assess.DepthM(recs[i].Sample()); ok && recs[i].Status != hydro.StatusRejected {
			depths = append(depths, d)
		}
	}
	zs := depthZones(depths, edges)
	out := make([]group, len(recs))
	for i := range recs {
		z, rank := zoneOf(&recs[i], zs)
		out[i] = group{cluster: clusterOf(recs[i].Sample(), column), zone: z, zoneRank: rank}
	}
	return out
}
