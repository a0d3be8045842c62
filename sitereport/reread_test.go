package sitereport

import (
	"errors"
	"io"
	"testing"

	"gwsat.dev/gwsat/assess"
)

// The samples files of a large report come from a second reading of the
// inputs; if a file changed in between (a lab file edited, a sheet
// re-exported), the report refuses to pair the page with other rows.
func TestWriteSamplesInputChanged(t *testing.T) {
	opt := demoOptions(t, t.TempDir())
	recs := opt.Records[:5]
	first := rowKeys(recs)
	minerals := opt.DB.MineralNames()
	cols := sampleColumns(opt.Batches, minerals)
	yield := func(rs []assess.Record) func(func(*assess.Record) error) error {
		return func(emit func(*assess.Record) error) error {
			for i := range rs {
				if err := emit(&rs[i]); err != nil {
					return err
				}
			}
			return nil
		}
	}
	renamed := append([]assess.Record(nil), recs...)
	renamed[2].Row.Sample.ID += "-edited"
	moved := append([]assess.Record(nil), recs...)
	moved[4].Row.Line++
	longer := append(append([]assess.Record(nil), recs...), opt.Records[5])
	for _, tc := range []struct {
		name    string
		second  []assess.Record
		changed bool
	}{
		{"same rows", recs, false},
		{"a row fewer", recs[:4], true},
		{"a row more", longer, true},
		{"an id edited", renamed, true},
		{"a line moved", moved, true},
	} {
		err := writeSamples(io.Discard, io.Discard, io.Discard, yield(tc.second), cols, minerals, false, first)
		if got := errors.Is(err, ErrInputChanged); got != tc.changed {
			t.Errorf("%s: error %v, want input changed %v", tc.name, err, tc.changed)
		}
	}
}
