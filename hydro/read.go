package hydro

import (
	"encoding/csv"
	"errors"
	"fmt"
	"io"
	"os"
	"strings"
)

// ReadFile reads a lab file from disk; see Read.
func ReadFile(path string, opt Options) (*Batch, error) {
	f, err := os.Open(path)
	if err != nil {
		return nil, &ReadError{File: path, Err: fmt.Errorf("%w: %w", ErrRead, err)}
	}
	b, err := readAny(f, path, opt, false)
	if cerr := f.Close(); cerr != nil && err == nil {
		return nil, &ReadError{File: path, Err: fmt.Errorf("%w: %w", ErrRead, cerr)}
	}
	return b, err
}

// Read reads a lab file of wide or long shape from CSV text (or from an
// .xlsx workbook, recognised by its first bytes, as ReadExcel). file names
// the input in messages. The error is only for problems with the file as a
// whole (see the ErrXxx sentinels, wrapped in a *ReadError); every
// row-level problem is reported in its Row.
func Read(r io.Reader, file string, opt Options) (*Batch, error) {
	return readAny(r, file, opt, false)
}

// readAny reads a workbook or CSV text.
func readAny(r io.Reader, file string, opt Options, fieldSheet bool) (*Batch, error) {
	raw, err := readLimited(r, file, opt)
	if err != nil {
		return nil, err
	}
	if isZip(raw) {
		return readExcelBytes(raw, file, opt, fieldSheet)
	}
	return readCSVBytes(raw, file, opt, fieldSheet)
}

func readLimited(r io.Reader, file string, opt Options) ([]byte, error) {
	limit := opt.MaxBytes
	if limit <= 0 {
		limit = 256 << 20
	}
	raw, err := io.ReadAll(io.LimitReader(r, limit+1))
	if err != nil {
		return nil, &ReadError{File: file, Err: fmt.Errorf("%w: %w", ErrRead, err)}
	}
	if int64(len(raw)) > limit {
		return nil, &ReadError{File: file, Err: fmt.Errorf("%w: larger than %d bytes", ErrRead, limit)}
	}
	return raw, nil
}

// readCSVBytes splits CSV text into a grid of cells and reads it.
func readCSVBytes(raw []byte, file string, opt Options, fieldSheet bool) (*Batch, error) {
	text, err := normalise(raw)
	if err != nil {
		return nil, &ReadError{File: file, Err: err}
	}
	if strings.TrimSpace(strings.ReplaceAll(text, "\ufeff", "")) == "" {
		return nil, &ReadError{File: file, Err: ErrEmpty}
	}
	delim := opt.Delimiter
	if delim == 0 {
		delim = detectDelimiter(text)
	}
	cr := csv.NewReader(strings.NewReader(text))
	cr.Comma = delim
	cr.FieldsPerRecord = -1
	cr.LazyQuotes = true
	cr.TrimLeadingSpace = delim != '\t'
	g := &grid{file: file, delim: delim, fieldSheet: fieldSheet}
	for {
		rec, err := cr.Read()
		if err == io.EOF {
			break
		}
		if err != nil {
			var pe *csv.ParseError
			if !errors.As(err, &pe) {
				return nil, &ReadError{File: file, Err: fmt.Errorf("%w: %w", ErrRead, err)}
			}
			if len(g.recs) == 0 {
				return nil, &ReadError{File: file, Line: pe.StartLine, Column: pe.Column, Err: fmt.Errorf("%w: %w", ErrNotCSV, pe.Err)}
			}
			// A quoting error after the header: the rows read so far stand;
			// the rest of the file cannot be split into rows, and is
			// reported as one rejected row.
			g.brokenAt = pe.StartLine
			g.broken = fmt.Sprintf("CSV quoting error at line %d, column %d: %v; the rest of the file is unreadable", pe.Line, pe.Column, pe.Err)
			break
		}
		// FieldPos cannot fail for field 0 of a record just read.
		line, _ := cr.FieldPos(0)
		for i := range rec {
			rec[i] = trimCell(rec[i])
		}
		if allEmpty(rec) {
			// A line of bare delimiters (",,,,", common at the end of
			// spreadsheet exports) is a blank line, as encoding/csv treats
			// an empty line: not a row.
			continue
		}
		g.recs = append(g.recs, rec)
		g.lines = append(g.lines, line)
	}
	if len(g.recs) == 0 {
		return nil, &ReadError{File: file, Err: ErrEmpty}
	}
	return readGrid(g, opt)
}

// isZip says whether raw starts like a zip archive (an .xlsx workbook).
func isZip(raw []byte) bool {
	return len(raw) >= 4 && raw[0] == 'P' && raw[1] == 'K' && raw[2] == 3 && raw[3] == 4
}
