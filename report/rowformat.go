package report

import (
	"strings"

	"gwsat.dev/gwsat/assess"
	"gwsat.dev/gwsat/geo"
	"gwsat.dev/gwsat/hydro"
)

// RowFormatter gives the table row (Columns.Row) and the GeoJSON point
// (SampleFeature) of one record after another, with what stays the same
// from row to row worked out once: the property names of the minerals and
// analytes, the order of a sample's analytes, the buffers. The rows and
// features it returns are the same as Columns.Row and SampleFeature give,
// but valid only until its next call. A RowFormatter is for one goroutine
// at a time.
type RowFormatter struct {
	cols     Columns
	minerals []string // of the GeoJSON properties
	siKeys   []string // ColumnName of each of minerals
	// colSIs says the table's minerals are those of the points, so that the
	// indices looked up for one serve the other.
	colSIs bool

	mgKeys  map[string]string // analyte key -> its "<key>_mg_l" property
	order   []string          // the analyte keys of the last sample, in table order
	row     []string
	props   []geo.Prop
	sis     []siValue
	colSI   []siValue
	reasons []string
}

// NewRowFormatter returns a formatter for the table columns cols and the
// GeoJSON properties of minerals.
func NewRowFormatter(cols Columns, minerals []string) *RowFormatter {
	f := &RowFormatter{cols: cols, minerals: minerals, mgKeys: map[string]string{}}
	f.siKeys = make([]string, len(minerals))
	for i, m := range minerals {
		f.siKeys[i] = ColumnName(m)
	}
	f.colSIs = len(cols.Minerals) == len(minerals)
	for i := range minerals {
		f.colSIs = f.colSIs && cols.Minerals[i] == minerals[i]
	}
	return f
}

// prepare takes what the row and the point share from r.
func (f *RowFormatter) prepare(r *assess.Record) string {
	f.reasons = f.reasons[:0]
	for _, is := range r.Issues {
		f.reasons = append(f.reasons, is.String())
	}
	f.sis, f.colSI = f.sis[:0], f.colSI[:0]
	if r.Result != nil {
		f.sis = lookupSIs(f.sis, r.Result, f.minerals)
		if f.colSIs {
			f.colSI = f.sis
		} else {
			f.colSI = lookupSIs(f.colSI, r.Result, f.cols.Minerals)
		}
	}
	return strings.Join(f.reasons, "; ")
}

// Row returns the table row of r, as Columns.Row.
func (f *RowFormatter) Row(r *assess.Record) []string {
	reasons := f.prepare(r)
	var sis []siValue
	if r.Result != nil {
		sis = f.colSI
	}
	f.row = f.cols.appendRow(f.row[:0], r, reasons, sis)
	return f.row
}

// RowAndFeature returns the table row and the GeoJSON point of r, as
// Columns.Row and SampleFeature.
func (f *RowFormatter) RowAndFeature(r *assess.Record) ([]string, geo.PointFeature) {
	reasons := f.prepare(r)
	var colSI, sis []siValue
	if r.Result != nil {
		colSI, sis = f.colSI, f.sis
	}
	f.row = f.cols.appendRow(f.row[:0], r, reasons, colSI)
	clear(f.props) // no value of an earlier row is kept alive
	f.props = sampleProps(f.props[:0], r, reasons, f.siKeys, sis, f.analytes(r.Sample()), f.mgKey)
	return f.row, geo.PointFeature{ID: featureID(r), Point: samplePoint(r), Props: f.props}
}

// analytes returns the sample's analyte keys in table order (as
// sortedAnalytes), sorting only when they are not the last sample's keys.
func (f *RowFormatter) analytes(s *hydro.Sample) []string {
	if len(f.order) == len(s.Analytes) {
		same := true
		for _, k := range f.order {
			if _, ok := s.Analytes[k]; !ok {
				same = false
				break
			}
		}
		if same {
			// The same set of distinct keys: the same order.
			return f.order
		}
	}
	f.order = sortedAnalytes(s)
	return f.order
}

// mgKey is the property of an analyte's value in mg/L.
func (f *RowFormatter) mgKey(k string) string {
	if v, ok := f.mgKeys[k]; ok {
		return v
	}
	v := strings.ToLower(k) + "_mg_l"
	f.mgKeys[k] = v
	return v
}
