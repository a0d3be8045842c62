package hydro

import (
	"errors"
	"fmt"
)

// Sentinel errors for file-level problems. A ReadError wraps one of them.
var (
	ErrEmpty      = errors.New("hydro: empty file")
	ErrNotCSV     = errors.New("hydro: not a CSV file")
	ErrNoSampleID = errors.New("hydro: no sample id column")
	ErrNoAnalyte  = errors.New("hydro: no analyte column")
	ErrRead       = errors.New("hydro: cannot read file")
	ErrColumnMap  = errors.New("hydro: bad column map")
	ErrOption     = errors.New("hydro: bad option")
	ErrSheet      = errors.New("hydro: no such sheet")
)

// ReadError is a file-level error with its position, modelled on
// encoding/csv's ParseError. Line and Column are 1-based, 0 when they do not
// apply; Field is the header or cell concerned, if any.
type ReadError struct {
	File   string
	Line   int
	Column int
	Field  string
	Err    error
}

func (e *ReadError) Error() string {
	s := e.File
	if s == "" {
		s = "<input>"
	}
	if e.Line > 0 {
		s += fmt.Sprintf(":%d", e.Line)
		if e.Column > 0 {
			s += fmt.Sprintf(":%d", e.Column)
		}
	}
	s += ": " + e.Err.Error()
	if e.Field != "" {
		s += fmt.Sprintf(" (%q)", e.Field)
	}
	return s
}

func (e *ReadError) Unwrap() error { return e.Err }
