package report

import (
	"bytes"
	"encoding/json"
	"testing"

	"gwsat.dev/gwsat/assess"
	"gwsat.dev/gwsat/hydro"
)

// The streamed array decodes as JSON for 0, 1 and several records, in order.
func TestJSONWriterIsValidJSON(t *testing.T) {
	for _, n := range []int{0, 1, 3} {
		var buf bytes.Buffer
		jw := NewJSONWriter(&buf)
		for i := 0; i < n; i++ {
			r := assess.Record{File: "f.csv", Row: hydro.Row{Line: i + 2, Sample: hydro.Sample{ID: string(rune('A' + i))}}, Status: hydro.StatusOK}
			if err := jw.Write(&r); err != nil {
				t.Fatal(err)
			}
		}
		if err := jw.Close(); err != nil {
			t.Fatal(err)
		}
		var out []map[string]any
		if err := json.Unmarshal(buf.Bytes(), &out); err != nil {
			t.Fatalf("%d records: %v\n%s", n, err, buf.String())
		}
		if len(out) != n {
			t.Fatalf("%d records decoded, want %d", len(out), n)
		}
		for i, o := range out {
			if o["line"] != float64(i+2) {
				t.Errorf("record %d: line %v", i, o["line"])
			}
		}
	}
}
