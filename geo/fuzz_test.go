package geo

import (
	"bytes"
	"strings"
	"testing"

	"github.com/paulmach/orb/geojson"
)

// Any input either fails with an error or yields features that all pass the
// package's own checks; nothing panics. Output of WriteSamples from the
// accepted point features decodes again.
func FuzzReadSiteFeatures(f *testing.F) {
	f.Add(siteOK)
	f.Add(`{"type":"FeatureCollection","features":[]}`)
	f.Add(`{"type":"FeatureCollection","features":[{"type":"Feature","geometry":{"type":"GeometryCollection","geometries":[]},"properties":null}]}`)
	f.Add(`{"type":"FeatureCollection","features":[{"type":"Feature","geometry":{"type":"Polygon","coordinates":[]},"properties":{"kind":null}}]}`)
	f.Fuzz(func(t *testing.T, in string) {
		fs, err := ReadSiteFeatures(strings.NewReader(in))
		if err != nil {
			return
		}
		var pts []PointFeature
		for i, sf := range fs {
			if sf.Index != i || sf.Kind == "" || checkGeometry(sf.Geometry) != nil {
				t.Fatalf("accepted bad feature %d: %+v", i, sf)
			}
			if p, ok := sf.Geometry.(interface{ GeoJSONType() string }); ok && p.GeoJSONType() == "Point" {
				pts = append(pts, PointFeature{Point: sf.Geometry.Bound().Min, Props: []Prop{{"kind", sf.Kind}, {"name", sf.Name}}})
			}
		}
		var buf bytes.Buffer
		if err := WriteSamples(&buf, pts); err != nil {
			t.Fatal(err)
		}
		if _, err := geojson.UnmarshalFeatureCollection(buf.Bytes()); err != nil {
			t.Fatalf("our output does not decode: %v", err)
		}
	})
}
