package report

import (
	"encoding/csv"
	"io"
	"math"
	"strconv"
	"strings"
)

// Table is a CSV table: a header and rows of cells already formatted.
// Cells that carry text from an input file must go through Text so that a
// spreadsheet never runs them as formulas; numbers go through Num.
type Table struct {
	Header []string
	Rows   [][]string
}

// Add appends a row.
func (t *Table) Add(cells ...string) { t.Rows = append(t.Rows, cells) }

// WriteCSV writes the table as comma-separated values with a header line.
func (t *Table) WriteCSV(w io.Writer) error {
	cw := csv.NewWriter(w)
	if err := cw.Write(t.Header); err != nil {
		return err
	}
	if err := cw.WriteAll(t.Rows); err != nil {
		return err
	}
	cw.Flush()
	return cw.Error()
}

// Text neutralises a cell of user text against spreadsheet-formula
// injection: a cell that begins with =, +, -, @, a tab or a carriage return
// is prefixed with a single quote, the usual guard recommended by OWASP's
// "CSV Injection" page (common practice).
func Text(s string) string {
	if s == "" {
		return s
	}
	switch s[0] {
	case '=', '+', '-', '@', '\t', '\r':
		return "'" + s
	}
	return s
}

// Num formats v with prec digits after the point; NaN and Inf become an
// empty cell so that they never reach an output.
func Num(v float64, prec int) string {
	if math.IsNaN(v) || math.IsInf(v, 0) {
		return ""
	}
	s := strconv.FormatFloat(v, 'f', prec, 64)
	if strings.Trim(s, "-0.") == "" {
		// Avoid "-0.000".
		s = strings.TrimPrefix(s, "-")
	}
	return s
}

// Sig formats v with sig significant digits (plain notation for ordinary
// magnitudes, exponent notation for very small or large ones); NaN and Inf
// become an empty cell.
func Sig(v float64, sig int) string {
	if math.IsNaN(v) || math.IsInf(v, 0) {
		return ""
	}
	if v == 0 {
		return "0"
	}
	a := math.Abs(v)
	if a >= 1e-3 && a < 1e7 {
		d := sig - 1 - int(math.Floor(math.Log10(a)))
		if d < 0 {
			d = 0
		}
		return strconv.FormatFloat(v, 'f', d, 64)
	}
	return strconv.FormatFloat(v, 'e', sig-1, 64)
}

// Full formats v at full precision (the shortest text that reads back to the
// same float64), for machine-readable tables; "" for NaN and Inf.
func Full(v float64) string {
	if math.IsNaN(v) || math.IsInf(v, 0) {
		return ""
	}
	if v == 0 {
		return "0"
	}
	return strconv.FormatFloat(v, 'g', -1, 64)
}
