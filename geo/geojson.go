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
	var err error
	sw.buf, err = EncodeFeature(sw.buf[:0], &f)
	return sw.WriteEncoded(sw.buf, err)
}

// WriteEncoded adds one feature that EncodeFeature encoded, with the error
// it returned: features can be encoded in parallel and written in order.
func (sw *SampleWriter) WriteEncoded(enc []byte, encErr error) error {
	i := sw.n
	if encErr != nil {
		return fmt.Errorf("geo: feature %d: %w", i, encErr)
	}
	if i > 0 {
		sw.bw.WriteByte(',')
	}
	sw.n++
	_, err := sw.bw.Write(enc)
	return err
}

// EncodeFeature appends one feature of a collection, as SampleWriter writes
// it (without the comma between features), to dst.
func EncodeFeature(dst []byte, f *PointFeature) ([]byte, error) {
	dst = append(dst, "\n{\"type\":\"Feature\""...)
	if f.ID != "" {
		dst = append(dst, `,"id":`...)
		dst = appendJSONString(dst, f.ID)
	}
	if !validLonLat(f.Point) {
		dst = append(dst, `,"geometry":null`...)
	} else {
		p := Round(f.Point)
		dst = append(dst, `,"geometry":{"type":"Point","coordinates":[`...)
		dst = appendCoord(dst, p[0])
		dst = append(dst, ',')
		dst = appendCoord(dst, p[1])
		dst = append(dst, `]}`...)
	}
	dst = append(dst, `,"properties":{`...)
	for k, pr := range f.Props {
		for _, q := range f.Props[:k] {
			if q.Key == pr.Key {
				return dst, fmt.Errorf("duplicate property %q", pr.Key)
			}
		}
		if k > 0 {
			dst = append(dst, ',')
		}
		dst = appendJSONString(dst, pr.Key)
		dst = append(dst, ':')
		var err error
		if dst, err = appendJSONValue(dst, cleanValue(pr.Value)); err != nil {
			return dst, fmt.Errorf("property %q: %w", pr.Key, err)
		}
	}
	return append(dst, "}}"...), nil
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

// appendCoord appends x as formatCoord writes it.
func appendCoord(dst []byte, x float64) []byte {
	n := len(dst)
	dst = strconv.AppendFloat(dst, x, 'f', 6, 64)
	for len(dst) > n && dst[len(dst)-1] == '0' {
		dst = dst[:len(dst)-1]
	}
	if len(dst) > n && dst[len(dst)-1] == '.' {
		dst = dst[:len(dst)-1]
	}
	if string(dst[n:]) == "-0" {
		dst = append(dst[:n], '0')
	}
	return dst
}
