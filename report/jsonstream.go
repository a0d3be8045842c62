package report

import (
	"bufio"
	"encoding/json"
	"io"

	"gwsat.dev/gwsat/assess"
)

// JSONWriter writes records as one JSON array, a record at a time, so that a file
// of any length streams through bounded memory. Close ends the array; an empty
// run gives [].
type JSONWriter struct {
	bw  *bufio.Writer
	enc *json.Encoder
	n   int
}

// NewJSONWriter starts an array on w.
func NewJSONWriter(w io.Writer) *JSONWriter {
	bw := bufio.NewWriter(w)
	enc := json.NewEncoder(bw)
	enc.SetIndent("  ", "  ")
	return &JSONWriter{bw: bw, enc: enc}
}

// Write adds one record.
func (jw *JSONWriter) Write(r *assess.Record) error {
	if jw.n == 0 {
		jw.bw.WriteString("[\n  ")
	} else {
		jw.bw.WriteString(",\n  ")
	}
	jw.n++
	// Encode ends with a newline; the separator or the closing bracket follows.
	return jw.enc.Encode(jsonRecordOf(r))
}

// Close ends the array and flushes it.
func (jw *JSONWriter) Close() error {
	if jw.n == 0 {
		jw.bw.WriteString("[")
	}
	jw.bw.WriteString("]\n")
	return jw.bw.Flush()
}
