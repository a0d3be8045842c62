package geo

import (
	"bufio"
	"encoding/json"
	"fmt"
	"io"

	"github.com/paulmach/orb"
)

// ShapeFeature is one line or area for GeoJSON output: an orb geometry in
// [lon, lat] WGS84 with properties in the order given.
type ShapeFeature struct {
	Geometry orb.Geometry
	Props    []Prop
}

// WriteShapes writes a GeoJSON FeatureCollection (RFC 7946) of line and
// polygon features: coordinates [lon, lat] with at most six decimals
// (about 0.1 m), polygons' exterior rings counter-clockwise as RFC 7946
// sec. 3.1.6 asks. A geometry holding a non-finite coordinate is an error:
// no NaN or Inf reaches the file.
func WriteShapes(w io.Writer, fs []ShapeFeature) error {
	bw := bufio.NewWriter(w)
	bw.WriteString(`{"type":"FeatureCollection","features":[`)
	for i, f := range fs {
		if i > 0 {
			bw.WriteByte(',')
		}
		bw.WriteString("\n{\"type\":\"Feature\",\"geometry\":")
		if err := writeGeometry(bw, f.Geometry); err != nil {
			return fmt.Errorf("geo: feature %d: %w", i, err)
		}
		bw.WriteString(`,"properties":{`)
		seen := make(map[string]bool, len(f.Props))
		for k, pr := range f.Props {
			if seen[pr.Key] {
				return fmt.Errorf("geo: feature %d: duplicate property %q", i, pr.Key)
			}
			seen[pr.Key] = true
			if k > 0 {
				bw.WriteByte(',')
			}
			key, _ := json.Marshal(pr.Key) // a string always marshals
			val, err := json.Marshal(cleanValue(pr.Value))
			if err != nil {
				return fmt.Errorf("geo: feature %d: property %q: %w", i, pr.Key, err)
			}
			bw.Write(key)
			bw.WriteByte(':')
			bw.Write(val)
		}
		bw.WriteString("}}")
	}
	bw.WriteString("\n]}\n")
	return bw.Flush()
}

func writePositions(bw *bufio.Writer, ps []orb.Point) error {
	bw.WriteByte('[')
	for i, p := range ps {
		if !finite(p[0]) || !finite(p[1]) {
			return fmt.Errorf("%w: coordinate %v", ErrProjection, p)
		}
		if i > 0 {
			bw.WriteByte(',')
		}
		bw.WriteByte('[')
		bw.WriteString(formatCoord(p[0]))
		bw.WriteByte(',')
		bw.WriteString(formatCoord(p[1]))
		bw.WriteByte(']')
	}
	bw.WriteByte(']')
	return nil
}

func writeRings(bw *bufio.Writer, pg orb.Polygon) error {
	bw.WriteByte('[')
	for i, r := range pg {
		if i > 0 {
			bw.WriteByte(',')
		}
		// Exterior counter-clockwise, holes clockwise (RFC 7946 sec. 3.1.6).
		ring := append(orb.Ring(nil), r...)
		if (i == 0) != (ring.Orientation() == orb.CCW) {
			ring.Reverse()
		}
		if err := writePositions(bw, ring); err != nil {
			return err
		}
	}
	bw.WriteByte(']')
	return nil
}

func writeGeometry(bw *bufio.Writer, g orb.Geometry) error {
	var err error
	switch g := g.(type) {
	case nil:
		bw.WriteString("null")
	case orb.Point:
		if !finite(g[0]) || !finite(g[1]) {
			return fmt.Errorf("%w: coordinate %v", ErrProjection, g)
		}
		bw.WriteString(`{"type":"Point","coordinates":[` + formatCoord(g[0]) + "," + formatCoord(g[1]) + "]")
	case orb.LineString:
		bw.WriteString(`{"type":"LineString","coordinates":`)
		err = writePositions(bw, g)
	case orb.MultiLineString:
		bw.WriteString(`{"type":"MultiLineString","coordinates":[`)
		for i, l := range g {
			if i > 0 {
				bw.WriteByte(',')
			}
			if err = writePositions(bw, l); err != nil {
				break
			}
		}
		bw.WriteByte(']')
	case orb.Polygon:
		bw.WriteString(`{"type":"Polygon","coordinates":`)
		err = writeRings(bw, g)
	case orb.MultiPolygon:
		bw.WriteString(`{"type":"MultiPolygon","coordinates":[`)
		for i, pg := range g {
			if i > 0 {
				bw.WriteByte(',')
			}
			if err = writeRings(bw, pg); err != nil {
				break
			}
		}
		bw.WriteByte(']')
	default:
		return fmt.Errorf("geo: geometry type %s not written", g.GeoJSONType())
	}
	if err != nil {
		return err
	}
	if g != nil {
		bw.WriteByte('}')
	}
	return nil
}
