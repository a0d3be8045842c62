package inject

import (
	"fmt"
	"strings"

	"gwsat.dev/gwsat/report"
	"gwsat.dev/gwsat/speciation"
	"gwsat.dev/gwsat/speciation/reaction"
)

// rangeNotes warns, in the words of the row checks, when waters of a result lie
// beyond the activity model's ionic-strength range or minerals are computed
// outside the temperature range of their data.
func rangeNotes(db *speciation.Database, model speciation.ActivityModel, maxI float64, temps []float64, minerals []string) []string {
	var out []string
	if limit := model.MaxIonicStrength(); maxI > limit {
		out = append(out, fmt.Sprintf("  warning: ionic strength %s mol/kgw above the %s model's limit %.2g", report.Sig(maxI, 3), model.Name(), limit))
	}
	var outside []string
	for _, name := range minerals {
		m := db.Mineral(name)
		if m == nil || m.ValidTempC == [2]float64{} {
			continue
		}
		for _, t := range temps {
			if t < m.ValidTempC[0] || t > m.ValidTempC[1] {
				outside = append(outside, fmt.Sprintf("%s (%g-%g C)", name, m.ValidTempC[0], m.ValidTempC[1]))
				break
			}
		}
	}
	if len(outside) > 0 {
		out = append(out, "  info: outside the temperature range of their data (those SIs are extrapolated): "+strings.Join(outside, ", "))
	}
	return out
}

// sweepRange gives the largest ionic strength and the temperatures of a sweep.
func sweepRange(sw *reaction.Sweep) (float64, []float64) {
	maxI := 0.0
	temps := make([]float64, 0, len(sw.Points))
	for _, p := range sw.Points {
		maxI = max(maxI, p.IonicStrength)
		temps = append(temps, p.TempC)
	}
	return maxI, temps
}
