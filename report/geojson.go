package report

import (
	"fmt"
	"io"
	"math"
	"strings"

	"github.com/paulmach/orb"

	"gwsat.dev/gwsat/assess"
	"gwsat.dev/gwsat/geo"
)

// SampleFeature is the GeoJSON point of one record: id, line, status, reasons,
// depth, charge balance, ionic strength and the <mineral>_si properties. A record
// without a usable position gets a null geometry, so it stays in the file while
// a GIS leaves it off the map.
func SampleFeature(r *assess.Record, minerals []string) geo.PointFeature {
	s := r.Sample()
	p, err := assess.Position(s)
	if err != nil {
		p = orb.Point{math.NaN(), math.NaN()} // written with a null geometry
	}
	props := []geo.Prop{{Key: "sample_id", Value: s.ID}, {Key: "well_id", Value: s.WellID}, {Key: "round", Value: s.Round},
		{Key: "event", Value: s.Event}, {Key: "sampled_at", Value: sampledAt(s)},
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
				props = append(props, geo.Prop{Key: ColumnName(m), Value: si})
			}
		}
	}
	for _, k := range sortedAnalytes(s) {
		if m := s.Analytes[k]; m.MgPerL.OK {
			props = append(props, geo.Prop{Key: strings.ToLower(k) + "_mg_l", Value: m.MgPerL.V})
		}
	}
	for _, x := range s.ExtraColumns {
		key := x.Header
		for _, p := range props {
			if p.Key == key {
				key = "input " + key // never two properties of one name
				break
			}
		}
		props = append(props, geo.Prop{Key: key, Value: x.Value})
	}
	return geo.PointFeature{ID: fmt.Sprintf("%s:%d", r.File, r.Row.Line), Point: p, Props: props}
}

// WriteGeoJSON writes every record as an RFC 7946 point feature (SampleFeature).
func WriteGeoJSON(w io.Writer, recs []assess.Record, minerals []string) error {
	sw := geo.NewSampleWriter(w)
	for i := range recs {
		if err := sw.Write(SampleFeature(&recs[i], minerals)); err != nil {
			return err
		}
	}
	return sw.Close()
}
