package geo

import (
	"bufio"
	"encoding/json"
	"fmt"
	"io"
	"strconv"
	"strings"

	"github.com/paulmach/orb"
)

// Prop is one property of an output feature. A slice of Props keeps the
// order the caller chose, and WriteSamples writes them in that order.
type Prop struct {
	Key   string
	Value any // anything encoding/json accepts; NaN and Inf floats become null
}

// PointFeature is one sample for GeoJSON output.
type PointFeature struct {
	ID    string    // optional feature id; omitted when empty
	Point orb.Point // [lon, lat] WGS84
	Props []Prop
}

// WriteSamples writes a GeoJSON FeatureCollection (RFC 7946) of Point
// features to w: coordinates in [lon, lat] order rounded to 1e-6 degree
// (about 0.1 m), properties in the order given. A feature whose point fails
// ValidLonLat is still written, with a null geometry (allowed by RFC 7946,
// sec. 3.2), so the row stays in the file while a GIS leaves it off the map.
// Float property values that are NaN or infinite are written as null.
// Duplicate property keys are an error.
func WriteSamples(w io.Writer, pts []PointFeature) error {
	sw := NewSampleWriter(w)
	for i := range pts {
		if err := sw.Write(pts[i]); err != nil {
			return err
		}
	}
	return sw.Close()
}

// SampleWriter writes a GeoJSON FeatureCollection of point features one at a
// time, in the form of WriteSamples, so that a file of any length streams
// through bounded memory. Close ends the collection.
type SampleWriter struct {
	bw *bufio.Writer
	n  int
}

// NewSampleWriter starts a FeatureCollection on w.
func NewSampleWriter(w io.Writer) *SampleWriter {
	bw := bufio.NewWriter(w)
	bw.WriteString(`{"type":"FeatureCollection","features":[`)
	return &SampleWriter{bw: bw}
}

// Write adds one feature.
func (sw *SampleWriter) Write(f PointFeature) error {
	bw := sw.bw
	i := sw.n
	if i > 0 {
		bw.WriteByte(',')
	}
	sw.n++
	bw.WriteString("\n{\"type\":\"Feature\"")
	if f.ID != "" {
		id, _ := json.Marshal(f.ID) // a string always marshals
		bw.WriteString(`,"id":`)
		bw.Write(id)
	}
	if ValidLonLat(f.Point) != nil {
		bw.WriteString(`,"geometry":null`)
	} else {
		p := Round(f.Point)
		bw.WriteString(`,"geometry":{"type":"Point","coordinates":[`)
		bw.WriteString(formatCoord(p[0]))
		bw.WriteByte(',')
		bw.WriteString(formatCoord(p[1]))
		bw.WriteString(`]}`)
	}
	bw.WriteString(`,"properties":{`)
	for k, pr := range f.Props {
		for _, q := range f.Props[:k] {
			if q.Key == pr.Key {
				return fmt.Errorf("geo: feature %d: duplicate property %q", i, pr.Key)
			}
		}
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
	return nil
}

// Close ends the collection and flushes it.
func (sw *SampleWriter) Close() error {
	sw.bw.WriteString("\n]}\n")
	return sw.bw.Flush()
}

func cleanValue(v any) any {
	switch x := v.(type) {
	case float64:
		if !finite(x) {
			return nil
		}
	case float32:
		if !finite(float64(x)) {
			return nil
		}
	case *float64:
		if x == nil || !finite(*x) {
			return nil
		}
		return *x
	}
	return v
}

// formatCoord writes a coordinate with at most six decimals and no
// trailing zeros.
func formatCoord(x float64) string {
	s := strconv.FormatFloat(x, 'f', 6, 64)
	s = strings.TrimRight(s, "0")
	s = strings.TrimSuffix(s, ".")
	if s == "-0" {
		s = "0"
	}
	return s
}
