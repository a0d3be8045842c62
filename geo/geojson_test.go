package geo

import (
	"bytes"
	"encoding/json"
	"errors"
	"math"
	"strings"
	"testing"

	"github.com/paulmach/orb"
	"github.com/paulmach/orb/geojson"
)

// RFC 7946: a FeatureCollection of Point features with [lon, lat]
// coordinates; decoding our output with orb/geojson gives the points back
// to 1e-6 degree and the properties unchanged.
func TestWriteSamplesRoundTrip(t *testing.T) {
	si := -0.4321
	in := []PointFeature{
		{ID: "MW-1", Point: orb.Point{-101.123456789, 31.987654321}, Props: []Prop{
			{"well", "MW-1"}, {"qa", "ok"}, {"calcite_si", 0.52}, {"depth_m", 12.5}, {"gypsum_si", &si},
		}},
		{ID: "MW-2", Point: orb.Point{-101.2, 31.9}, Props: []Prop{
			{"well", "MW-2"}, {"qa", "warning"}, {"calcite_si", math.NaN()}, {"note", `quote " and <tag>`},
		}},
		{Point: orb.Point{0, 0}, Props: []Prop{{"well", "MW-3"}, {"qa", "rejected"}}},
	}
	var buf bytes.Buffer
	if err := WriteSamples(&buf, in); err != nil {
		t.Fatal(err)
	}
	fc, err := geojson.UnmarshalFeatureCollection(buf.Bytes())
	if err != nil {
		t.Fatalf("orb/geojson cannot decode our output: %v\n%s", err, buf.String())
	}
	if fc.Type != "FeatureCollection" || len(fc.Features) != 3 {
		t.Fatalf("decoded %q with %d features", fc.Type, len(fc.Features))
	}
	p, ok := fc.Features[0].Geometry.(orb.Point)
	if !ok {
		t.Fatalf("feature 0 geometry %T", fc.Features[0].Geometry)
	}
	if math.Abs(p[0]+101.123457) > 1e-12 || math.Abs(p[1]-31.987654) > 1e-12 {
		t.Errorf("coordinates %v, want [-101.123457, 31.987654] (lon, lat, 1e-6 deg)", p)
	}
	if fc.Features[0].ID != "MW-1" {
		t.Errorf("id %v", fc.Features[0].ID)
	}
	pr := fc.Features[0].Properties
	if pr["qa"] != "ok" || pr["calcite_si"] != 0.52 || pr["depth_m"] != 12.5 || pr["gypsum_si"] != -0.4321 {
		t.Errorf("properties %v", pr)
	}
	if v, ok := fc.Features[1].Properties["calcite_si"]; !ok || v != nil {
		t.Errorf("NaN property decoded as %v (present %v), want null", v, ok)
	}
	if fc.Features[1].Properties["note"] != `quote " and <tag>` {
		t.Errorf("string property %q", fc.Features[1].Properties["note"])
	}
	if fc.Features[2].Geometry != nil {
		t.Errorf("null-island sample has geometry %v, want null", fc.Features[2].Geometry)
	}
	// Property order is the caller's order.
	s := buf.String()
	if !(strings.Index(s, `"well"`) < strings.Index(s, `"qa"`) && strings.Index(s, `"qa"`) < strings.Index(s, `"calcite_si"`) && strings.Index(s, `"calcite_si"`) < strings.Index(s, `"depth_m"`)) {
		t.Errorf("properties not in given order:\n%s", s)
	}
	if !json.Valid(buf.Bytes()) || strings.Contains(s, "NaN") {
		t.Errorf("output is not valid JSON or contains NaN:\n%s", s)
	}
}

func TestWriteSamplesErrors(t *testing.T) {
	var buf bytes.Buffer
	err := WriteSamples(&buf, []PointFeature{{Point: orb.Point{1, 2}, Props: []Prop{{"a", 1}, {"a", 2}}}})
	if err == nil || !strings.Contains(err.Error(), "duplicate") {
		t.Errorf("duplicate key: %v", err)
	}
	err = WriteSamples(&buf, []PointFeature{{Point: orb.Point{1, 2}, Props: []Prop{{"c", make(chan int)}}}})
	if err == nil {
		t.Error("unencodable value accepted")
	}
	buf.Reset()
	if err := WriteSamples(&buf, nil); err != nil {
		t.Fatal(err)
	}
	fc, err := geojson.UnmarshalFeatureCollection(buf.Bytes())
	if err != nil || len(fc.Features) != 0 {
		t.Errorf("empty collection: %v, %v", fc, err)
	}
}

const siteOK = `{"type":"FeatureCollection","features":[
 {"type":"Feature","properties":{"kind":"Boundary","name":"Site"},"geometry":{"type":"Polygon","coordinates":[[[-101.3,31.8],[-101.0,31.8],[-101.0,32.0],[-101.3,32.0],[-101.3,31.8]]]}},
 {"type":"Feature","properties":{"kind":"river","name":"Example Creek"},"geometry":{"type":"LineString","coordinates":[[-101.3,31.9],[-101.0,31.95]]}},
 {"type":"Feature","properties":{"kind":"injection_well","name":"IW-1"},"geometry":{"type":"Point","coordinates":[-101.15,31.9]}},
 {"type":"Feature","properties":{},"geometry":{"type":"MultiPoint","coordinates":[[-101.1,31.85],[-101.12,31.86]]}}
]}`

func TestReadSiteFeatures(t *testing.T) {
	fs, err := ReadSiteFeatures(strings.NewReader(siteOK))
	if err != nil {
		t.Fatal(err)
	}
	want := []struct{ kind, name string }{{"boundary", "Site"}, {"river", "Example Creek"}, {"injection_well", "IW-1"}, {"point", ""}}
	if len(fs) != len(want) {
		t.Fatalf("%d features", len(fs))
	}
	for i, w := range want {
		if fs[i].Kind != w.kind || fs[i].Name != w.name || fs[i].Index != i {
			t.Errorf("feature %d: %+v, want %v", i, fs[i], w)
		}
	}
	if _, ok := fs[0].Geometry.(orb.Polygon); !ok {
		t.Errorf("boundary geometry %T", fs[0].Geometry)
	}
}

func TestReadSiteFeaturesErrors(t *testing.T) {
	feat := func(geom, props string) string {
		return `{"type":"FeatureCollection","features":[
 {"type":"Feature","properties":{},"geometry":{"type":"Point","coordinates":[-101.15,31.9]}},
 {"type":"Feature","properties":` + props + `,"geometry":` + geom + `}]}`
	}
	tests := []struct {
		name, in string
		index    int // -1: not a feature error
		want     error
	}{
		{"not json", `{"type":`, -1, nil},
		{"open ring", feat(`{"type":"Polygon","coordinates":[[[0,1],[1,1],[1,2],[0,2]]]}`, `{}`), 1, ErrBadGeometry},
		{"short ring", feat(`{"type":"Polygon","coordinates":[[[0,1],[1,1],[0,1]]]}`, `{}`), 1, ErrBadGeometry},
		{"latitude 95", feat(`{"type":"Point","coordinates":[10,95]}`, `{}`), 1, ErrLatRange},
		{"null island", feat(`{"type":"LineString","coordinates":[[0,0],[1,1]]}`, `{}`), 1, ErrNullIsland},
		{"one-point line", feat(`{"type":"LineString","coordinates":[[3,4]]}`, `{}`), 1, ErrBadGeometry},
		{"null geometry", feat(`null`, `{}`), 1, ErrBadGeometry},
		{"numeric kind", feat(`{"type":"Point","coordinates":[3,4]}`, `{"kind":5}`), 1, nil},
	}
	for _, tc := range tests {
		_, err := ReadSiteFeatures(strings.NewReader(tc.in))
		if err == nil {
			t.Errorf("%s: no error", tc.name)
			continue
		}
		var fe *FeatureError
		if tc.index >= 0 {
			if !errors.As(err, &fe) || fe.Index != tc.index {
				t.Errorf("%s: %v, want a FeatureError at index %d", tc.name, err, tc.index)
			}
			if !strings.Contains(err.Error(), "feature 1") {
				t.Errorf("%s: message %q does not name the feature", tc.name, err)
			}
		}
		if tc.want != nil && !errors.Is(err, tc.want) {
			t.Errorf("%s: %v, want %v", tc.name, err, tc.want)
		}
	}
}

// appendCoord writes what formatCoord writes.
func TestAppendCoordMatchesFormatCoord(t *testing.T) {
	for _, x := range []float64{0, math.Copysign(0, -1), -0.0000001, 0.0000004, 1, -1, 10, 100.5, -100.137837, 30.9120001, 179.9999996, -179.9999995, 1e-7, 123456.000001} {
		if got, want := string(appendCoord([]byte("x"), x)), "x"+formatCoord(x); got != want {
			t.Errorf("appendCoord(%v) = %q, want %q", x, got, want)
		}
	}
}
