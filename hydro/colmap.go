package hydro

import (
	"bytes"
	"encoding/csv"
	"fmt"
	"os"
	"strings"

	"github.com/gocarina/gocsv"
)

// columnMapEntry is one line of a column map file. The map file has fixed
// columns, so gocsv fits here (with our own csv.Reader: BOM stripped, any
// line ending: gocsv's own reader settings are process-global).
type columnMapEntry struct {
	Header         string `csv:"header"`
	Parameter      string `csv:"parameter"`
	DetectionLimit string `csv:"detection_limit"`
}

// ColumnMap is the content of a column map file: the parameter of each
// header (Options.ColumnMap) and, where the file gives one, its detection
// limit in the column's unit (Options.DetectionLimits).
type ColumnMap struct {
	Params          map[string]string
	DetectionLimits map[string]float64
}

// Apply puts the map into opt.
func (c ColumnMap) Apply(opt *Options) {
	opt.ColumnMap = c.Params
	if len(c.DetectionLimits) > 0 {
		if opt.DetectionLimits == nil {
			opt.DetectionLimits = map[string]float64{}
		}
		for h, v := range c.DetectionLimits {
			opt.DetectionLimits[h] = v
		}
	}
}

// ReadColumnMap reads a column map file: a CSV file with the header line
// "header,parameter" and one line per column of the lab file, e.g.
//
//	header,parameter
//	Calc. Ca++,Ca
//	Alk. tot.,Alkalinity as CaCO3 (mg/L)
//	Bohrung,WellID
//	Bemerkung,-
//
// The parameter is a key ("Ca", "Alk", "SampleID", "WellID", "pHField",
// "Temp"...), a header-like spelling carrying a unit, or "-" to keep the
// column unmapped. A spelling with a unit states the column's unit, so its
// rows get no unit-assumed warning. See LoadColumnMap for the detection
// limits a third column may give.
func ReadColumnMap(path string) (map[string]string, error) {
	c, err := LoadColumnMap(path)
	if err != nil {
		return nil, err
	}
	return c.Params, nil
}

// LoadColumnMap reads a column map file (see ReadColumnMap) whose optional
// third column, detection_limit, gives the column's detection limit in its
// unit, used for censored values written without a number ("ND", "<LOR"):
//
//	header,parameter,detection_limit
//	Barium,Ba (ug/L),2
//	Calc. Ca++,Ca (mg/L),
func LoadColumnMap(path string) (ColumnMap, error) {
	raw, err := os.ReadFile(path)
	if err != nil {
		return ColumnMap{}, &ReadError{File: path, Err: fmt.Errorf("%w: %w", ErrRead, err)}
	}
	text, err := normalise(raw)
	if err != nil {
		return ColumnMap{}, &ReadError{File: path, Err: fmt.Errorf("%w: %w", ErrColumnMap, err)}
	}
	if strings.TrimSpace(text) == "" {
		return ColumnMap{}, &ReadError{File: path, Err: fmt.Errorf("%w: %w", ErrColumnMap, ErrEmpty)}
	}
	// gocsv matches header names exactly: lower-case the header line.
	if i := strings.IndexByte(text, '\n'); i >= 0 {
		text = strings.ToLower(text[:i]) + text[i:]
	} else {
		text = strings.ToLower(text)
	}
	cr := csv.NewReader(bytes.NewReader([]byte(text)))
	cr.Comma = detectDelimiter(text)
	cr.TrimLeadingSpace = true
	cr.FieldsPerRecord = -1
	var entries []columnMapEntry
	if err := gocsv.UnmarshalCSV(cr, &entries); err != nil {
		return ColumnMap{}, &ReadError{File: path, Err: fmt.Errorf("%w: %w (want the header line \"header,parameter\")", ErrColumnMap, err)}
	}
	first := strings.SplitN(text, "\n", 2)[0]
	if !strings.Contains(strings.ToLower(first), "header") || !strings.Contains(strings.ToLower(first), "parameter") {
		return ColumnMap{}, &ReadError{File: path, Line: 1, Field: first, Err: fmt.Errorf("%w: the first line must be \"header,parameter\"", ErrColumnMap)}
	}
	m := make(map[string]string, len(entries))
	limits := map[string]float64{}
	for i, e := range entries {
		h := strings.TrimSpace(e.Header)
		p := strings.TrimSpace(e.Parameter)
		if h == "" {
			return ColumnMap{}, &ReadError{File: path, Line: i + 2, Column: 1, Err: fmt.Errorf("%w: empty header", ErrColumnMap)}
		}
		if p == "" {
			return ColumnMap{}, &ReadError{File: path, Line: i + 2, Column: 2, Field: h, Err: fmt.Errorf("%w: empty parameter (use - to leave a column unmapped)", ErrColumnMap)}
		}
		if !validMapTarget(p) {
			return ColumnMap{}, &ReadError{File: path, Line: i + 2, Column: 2, Field: p, Err: fmt.Errorf("%w: unknown parameter", ErrColumnMap)}
		}
		if _, dup := m[h]; dup {
			return ColumnMap{}, &ReadError{File: path, Line: i + 2, Column: 1, Field: h, Err: fmt.Errorf("%w: header listed twice", ErrColumnMap)}
		}
		m[h] = p
		if d := strings.TrimSpace(e.DetectionLimit); d != "" {
			v, err := parseNum(d, false)
			if err != nil || !(v > 0) {
				return ColumnMap{}, &ReadError{File: path, Line: i + 2, Column: 3, Field: d, Err: fmt.Errorf("%w: detection limit is not a positive number", ErrColumnMap)}
			}
			limits[h] = v
		}
	}
	return ColumnMap{Params: m, DetectionLimits: limits}, nil
}

// validMapTarget says whether a column-map parameter can be understood.
func validMapTarget(p string) bool {
	switch strings.ToLower(p) {
	case "-", "ignore", "skip", "none":
		return true
	}
	if _, ok := analytes[p]; ok {
		return true
	}
	if _, ok := fieldDefs[p]; ok {
		return true
	}
	return parseHeader(p).Param != ""
}
