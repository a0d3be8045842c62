package sitereport

import (
	"fmt"
	"io"
	"math"
	"strings"

	"github.com/paulmach/orb"

	"gwsat.dev/gwsat/assess"
	"gwsat.dev/gwsat/geo"
	"gwsat.dev/gwsat/report"
)

// WriteGeoJSON writes every record as an RFC 7946 point feature; a record
// without a usable position has a null geometry, so it stays in the file.
func WriteGeoJSON(w io.Writer, recs []assess.Record, minerals []string) error {
	pts := make([]geo.PointFeature, 0, len(recs))
	for i := range recs {
		r := &recs[i]
		s := r.Sample()
		p, err := assess.Position(s)
		if err != nil {
			p = orb.Point{math.NaN(), math.NaN()} // written with a null geometry
		}
		props := []geo.Prop{{Key: "sample_id", Value: s.ID}, {Key: "well_id", Value: s.WellID}, {Key: "round", Value: s.Round},
			{Key: "line", Value: r.Row.Line}, {Key: "status", Value: string(r.Status)}, {Key: "reasons", Value: strings.Join(r.Reasons(), "; ")}}
		if d, ok := assess.DepthM(s); ok {
			props = append(props, geo.Prop{Key: "depth_m", Value: d})
		}
		if s.GroundElevM.OK {
			props = append(props, geo.Prop{Key: "ground_elev_m", Value: s.GroundElevM.V})
		}
		if r.Balance.CationsMeqL > 0 || r.Balance.AnionsMeqL > 0 {
			props = append(props, geo.Prop{Key: "charge_balance_pct", Value: r.Balance.ErrorPct}, geo.Prop{Key: "balance_status", Value: string(r.Balance.Status)})
		}
		if res := r.Result; res != nil {
			props = append(props, geo.Prop{Key: "ionic_strength_mol_kgw", Value: res.IonicStrength})
			for _, m := range minerals {
				if si, ok := res.SI(m); ok {
					props = append(props, geo.Prop{Key: report.ColumnName(m), Value: si})
				}
			}
		}
		pts = append(pts, geo.PointFeature{ID: fmt.Sprintf("%s:%d", r.File, r.Row.Line), Point: p, Props: props})
	}
	return geo.WriteSamples(w, pts)
}
