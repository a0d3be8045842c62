package geo

import (
	"errors"
	"fmt"
	"io"
	"strings"

	"github.com/paulmach/orb"
	"github.com/paulmach/orb/geojson"
)

// SiteFeature is one feature of a site file: a boundary, a river, an
// injection well... Kind comes from the "kind" property (lower-cased), or,
// when absent, from the geometry ("area", "line", "point"). Name comes
// from the "name" property.
type SiteFeature struct {
	Index    int // position in the file's feature list, from 0
	Kind     string
	Name     string
	Geometry orb.Geometry // [lon, lat] WGS84
	Props    map[string]any
}

// FeatureError is a problem with one feature of a site file.
type FeatureError struct {
	Index int // feature position, from 0
	Err   error
}

func (e *FeatureError) Error() string { return fmt.Sprintf("geo: site feature %d: %v", e.Index, e.Err) }
func (e *FeatureError) Unwrap() error { return e.Err }

// ErrBadGeometry reports an empty, unsupported or malformed geometry.
var ErrBadGeometry = errors.New("geo: bad geometry")

// ReadSiteFeatures reads a GeoJSON FeatureCollection (RFC 7946) of site
// features: polygons, lines and points with optional "kind" and "name"
// string properties. Every coordinate must pass ValidLonLat; polygon rings
// must be closed with at least four positions. The first invalid feature
// is reported as a *FeatureError naming its index.
func ReadSiteFeatures(r io.Reader) ([]SiteFeature, error) {
	b, err := io.ReadAll(r)
	if err != nil {
		return nil, fmt.Errorf("geo: reading site features: %w", err)
	}
	fc, err := geojson.UnmarshalFeatureCollection(b)
	if err != nil {
		return nil, fmt.Errorf("geo: site features are not a GeoJSON FeatureCollection: %w", err)
	}
	out := make([]SiteFeature, 0, len(fc.Features))
	for i, f := range fc.Features {
		if f == nil || f.Geometry == nil {
			return nil, &FeatureError{i, fmt.Errorf("%w: no geometry", ErrBadGeometry)}
		}
		if err := checkGeometry(f.Geometry); err != nil {
			return nil, &FeatureError{i, err}
		}
		sf := SiteFeature{Index: i, Geometry: f.Geometry, Props: map[string]any(f.Properties)}
		for _, key := range []string{"kind", "name"} {
			v, ok := f.Properties[key]
			if !ok || v == nil {
				continue
			}
			s, ok := v.(string)
			if !ok {
				return nil, &FeatureError{i, fmt.Errorf("property %q must be a string, got %T", key, v)}
			}
			if key == "kind" {
				sf.Kind = strings.ToLower(strings.TrimSpace(s))
			} else {
				sf.Name = strings.TrimSpace(s)
			}
		}
		if sf.Kind == "" {
			sf.Kind = geometryKind(f.Geometry)
		}
		out = append(out, sf)
	}
	return out, nil
}

func geometryKind(g orb.Geometry) string {
	switch g.(type) {
	case orb.Polygon, orb.MultiPolygon:
		return "area"
	case orb.LineString, orb.MultiLineString:
		return "line"
	}
	return "point"
}

func checkPoints(ps []orb.Point) error {
	for k, p := range ps {
		if err := ValidLonLat(p); err != nil {
			return fmt.Errorf("position %d: %w", k, err)
		}
	}
	return nil
}

func checkRing(r orb.Ring) error {
	if len(r) < 4 {
		return fmt.Errorf("%w: ring has %d positions, need at least 4", ErrBadGeometry, len(r))
	}
	if !r.Closed() {
		return fmt.Errorf("%w: ring is not closed", ErrBadGeometry)
	}
	return checkPoints(r)
}

func checkGeometry(g orb.Geometry) error {
	switch g := g.(type) {
	case orb.Point:
		return checkPoints([]orb.Point{g})
	case orb.MultiPoint:
		if len(g) == 0 {
			return fmt.Errorf("%w: empty multipoint", ErrBadGeometry)
		}
		return checkPoints(g)
	case orb.LineString:
		if len(g) < 2 {
			return fmt.Errorf("%w: line has %d positions, need at least 2", ErrBadGeometry, len(g))
		}
		return checkPoints(g)
	case orb.MultiLineString:
		if len(g) == 0 {
			return fmt.Errorf("%w: empty multiline", ErrBadGeometry)
		}
		for _, l := range g {
			if err := checkGeometry(l); err != nil {
				return err
			}
		}
		return nil
	case orb.Polygon:
		if len(g) == 0 {
			return fmt.Errorf("%w: empty polygon", ErrBadGeometry)
		}
		for _, r := range g {
			if err := checkRing(r); err != nil {
				return err
			}
		}
		return nil
	case orb.MultiPolygon:
		if len(g) == 0 {
			return fmt.Errorf("%w: empty multipolygon", ErrBadGeometry)
		}
		for _, p := range g {
			if err := checkGeometry(p); err != nil {
				return err
			}
		}
		return nil
	}
	return fmt.Errorf("%w: unsupported geometry type %s", ErrBadGeometry, g.GeoJSONType())
}
