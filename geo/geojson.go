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
	bw  *bufio.Writer
	n   int
	buf []byte
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
		sw.buf = appendJSONString(sw.buf[:0], pr.Key)
		sw.buf = append(sw.buf, ':')
		var err error
		if sw.buf, err = appendJSONValue(sw.buf, cleanValue(pr.Value)); err != nil {
			return fmt.Errorf("geo: feature %d: property %q: %w", i, pr.Key, err)
		}
		bw.Write(sw.buf)
	}
	bw.WriteString("}}")
	return nil
}

// Close ends the collection and flushes it.
func (sw *SampleWriter) Close() error {
	sw.bw.WriteString("\n]}\n")
	return sw.bw.Flush()
}

// appendJSONValue appends v as JSON: strings, finite floats, ints and nil
// directly (the common properties, without reflection), anything else through
// encoding/json.
func appendJSONValue(dst []byte, v any) ([]byte, error) {
	switch x := v.(type) {
	case nil:
		return append(dst, "null"...), nil
	case string:
		return appendJSONString(dst, x), nil
	case float64:
		return strconv.AppendFloat(dst, x, 'g', -1, 64), nil
	case int:
		return strconv.AppendInt(dst, int64(x), 10), nil
	case bool:
		return strconv.AppendBool(dst, x), nil
	}
	b, err := json.Marshal(v)
	return append(dst, b...), err
}

// appendJSONString appends s as a JSON string: printable ASCII without quote
// or backslash as it is, anything else through encoding/json (which escapes
// control characters, invalid UTF-8 and the HTML-sensitive <, >, &).
func appendJSONString(dst []byte, s string) []byte {
	for i := 0; i < len(s); i++ {
		if c := s[i]; c < 0x20 || c >= 0x7f || c == '"' || c == '\\' || c == '<' || c == '>' || c == '&' {
			b, _ := json.Marshal(s) // a string always marshals
			return append(dst, b...)
		}
	}
	dst = append(dst, '"')
	dst = append(dst, s...)
	return append(dst, '"')
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
