package site

import (
	"fmt"
	"sort"

	"gonum.org/v1/plot/vg"

	"gwsat.dev/gwsat/assess"
	"gwsat.dev/gwsat/figure"
	"gwsat.dev/gwsat/hydro"
	"gwsat.dev/gwsat/report"
)

// groupOf names the Piper group of a sample: its sample type (a "Sample
// type", "type" or "role" column), else its cluster, else "".
func groupOf(s *hydro.Sample, clusterColumn string) string {
	if t := s.Type(); t != "" {
		return t
	}
	return clusterOf(s, clusterColumn)
}

// PiperFigure draws every usable row's major ions (meq/L from the analysis
// as reported) on a Piper diagram, grouped by sample type or cluster. Rows
// that were rejected, or lack a cation or anion sum, are left out and
// counted by the figure.
func PiperFigure(recs []assess.Record, clusterColumn string) (report.Fig, bool) {
	var pts []figure.PiperPoint
	for i := range recs {
		r := &recs[i]
		if r.Status == hydro.StatusRejected || r.Water.KgWaterPerL <= 0 {
			continue
		}
		s := r.Sample()
		sol := hydro.Solution{DensityKgL: r.Water.DensityKgL, KgWaterPerL: r.Water.KgWaterPerL}
		meq := func(keys ...string) float64 {
			sum := 0.0
			for _, k := range keys {
				if m, ok := s.Analytes[k]; ok {
					if v, err := m.MeqL(sol); err == nil {
						sum += v
					}
				}
			}
			return sum
		}
		p := figure.PiperPoint{Label: s.ID, Group: groupOf(s, clusterColumn),
			Ca: meq("Ca"), Mg: meq("Mg"), Na: meq("Na"), K: meq("K"), Cl: meq("Cl"), SO4: meq("SO4")}
		if _, ok := s.Analytes["Alk"]; ok {
			p.HCO3 = meq("Alk") // total alkalinity stands for HCO3 + CO3
		} else {
			p.HCO3, p.CO3 = meq("HCO3"), meq("CO3")
		}
		pts = append(pts, p)
	}
	if len(pts) == 0 {
		return report.Fig{}, false
	}
	// Small groups (end-members) are drawn last, on top of the many
	// monitoring samples that would hide them.
	size := map[string]int{}
	for _, p := range pts {
		size[p.Group]++
	}
	sort.SliceStable(pts, func(i, j int) bool { return size[pts[i].Group] > size[pts[j].Group] })
	return report.Fig{
		Stem:  "piper",
		Title: "Piper diagram",
		Caption: fmt.Sprintf("Major-ion composition of %d samples as percent of the cation and anion sums in meq/L (Piper 1944), alkalinity standing for HCO3 + CO3; mixtures of two waters fall on straight lines between them. Rejected rows are left out.",
			len(pts)),
		Figure: figure.Piper{Title: "Piper diagram", Points: pts},
		W:      16 * vg.Centimeter, H: 14 * vg.Centimeter,
	}, true
}
