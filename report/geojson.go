package report

import (
	"io"
	"math"
	"strconv"
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
	siKeys := make([]string, len(minerals))
	for i, m := range minerals {
		siKeys[i] = ColumnName(m)
	}
	var sis []siValue
	if r.Result != nil {
		sis = lookupSIs(nil, r.Result, minerals)
	}
	mgKey := func(k string) string { return strings.ToLower(k) + "_mg_l" }
	props := sampleProps(nil, r, strings.Join(r.Reasons(), "; "), siKeys, sis, sortedAnalytes(r.Sample()), mgKey)
	return geo.PointFeature{ID: featureID(r), Point: samplePoint(r), Props: props}
}

// featureID is a feature's id: the file and line of its row.
func featureID(r *assess.Record) string { return r.File + ":" + strconv.Itoa(r.Row.Line) }

// samplePoint is a record's position; NaN (a null geometry) when it has none.
func samplePoint(r *assess.Record) orb.Point {
	p, err := assess.Position(r.Sample())
	if err != nil {
		p = orb.Point{math.NaN(), math.NaN()} // written with a null geometry
	}
	return p
}

// sampleProps appends the properties of SampleFeature to props: reasons is
// the record's reasons joined, siKeys the property names of the minerals
// and sis their indices (lookupSIs; nil without a result), analytes the
// sample's analyte keys in table order and mgKey the property of each.
func sampleProps(props []geo.Prop, r *assess.Record, reasons string, siKeys []string, sis []siValue, analytes []string, mgKey func(string) string) []geo.Prop {
	s := r.Sample()
	props = append(props, geo.Prop{Key: "sample_id", Value: s.ID}, geo.Prop{Key: "well_id", Value: s.WellID}, geo.Prop{Key: "round", Value: s.Round},
		geo.Prop{Key: "event", Value: s.Event}, geo.Prop{Key: "sampled_at", Value: sampledAt(s)},
		geo.Prop{Key: "line", Value: r.Row.Line}, geo.Prop{Key: "status", Value: string(r.Status)}, geo.Prop{Key: "reasons", Value: reasons})
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
		for i, si := range sis {
			if si.ok {
				props = append(props, geo.Prop{Key: siKeys[i], Value: si.v})
			}
		}
	}
	for _, k := range analytes {
		if m := s.Analytes[k]; m.MgPerL.OK {
			props = append(props, geo.Prop{Key: mgKey(k), Value: m.MgPerL.V})
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
	return props
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
