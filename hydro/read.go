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
		return nil, &ReadError{File: path, Err: fmt.Errorf("%w: %v", ErrRead, err)}
	}
	defer f.Close()
	return Read(f, path, opt)
}

// Read reads a lab file of wide or long shape. file names the input in
// messages. The error is only for problems with the file as a whole (see
// the ErrXxx sentinels, wrapped in a *ReadError); every row-level problem
// is reported in its Row.
func Read(r io.Reader, file string, opt Options) (*Batch, error) {
	limit := opt.MaxBytes
	if limit <= 0 {
		limit = 256 << 20
	}
	raw, err := io.ReadAll(io.LimitReader(r, limit+1))
	if err != nil {
		return nil, &ReadError{File: file, Err: fmt.Errorf("%w: %v", ErrRead, err)}
	}
	if int64(len(raw)) > limit {
		return nil, &ReadError{File: file, Err: fmt.Errorf("%w: larger than %d bytes", ErrRead, limit)}
	}
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
	var recs [][]string
	var lines []int
	brokenAt := -1
	var brokenErr *csv.ParseError
	for {
		rec, err := cr.Read()
		if err == io.EOF {
			break
		}
		if err != nil {
			var pe *csv.ParseError
			if !errors.As(err, &pe) {
				return nil, &ReadError{File: file, Err: fmt.Errorf("%w: %v", ErrRead, err)}
			}
			if len(recs) == 0 {
				return nil, &ReadError{File: file, Line: pe.StartLine, Column: pe.Column, Err: fmt.Errorf("%w: %v", ErrNotCSV, pe.Err)}
			}
			// A quoting error after the header: the rows read so far stand;
			// the rest of the file cannot be split into rows, and is
			// reported as one rejected row.
			brokenAt, brokenErr = pe.StartLine, pe
			break
		}
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
		recs = append(recs, rec)
		lines = append(lines, line)
	}
	if len(recs) == 0 {
		return nil, &ReadError{File: file, Err: ErrEmpty}
	}
	rd := &reader{file: file, opt: opt, delim: delim, header: recs[0], headerLine: lines[0]}
	if err := rd.mapHeader(); err != nil {
		return nil, err
	}
	rd.decComma = decideDecimal(opt.DecimalSep, delim, recs[1:], rd)
	rd.dateOrder = rd.decideDateOrder(recs[1:])
	b := &Batch{File: file, Shape: rd.shape, Delimiter: delim, DecimalComma: rd.decComma, Mapping: rd.mapping}
	if rd.shape == Long {
		b.Rows = rd.readLong(recs[1:], lines[1:])
		b.Mapping = rd.mapping
	} else {
		b.Rows = rd.readWide(recs[1:], lines[1:])
	}
	if brokenAt > 0 {
		r := Row{Line: brokenAt, Sample: newSample()}
		r.add(Error, CodeQuoting, r.Line, "", "CSV quoting error at line %d, column %d: %v; the rest of the file is unreadable", brokenErr.Line, brokenErr.Column, brokenErr.Err)
		b.Rows = append(b.Rows, r)
	}
	markDuplicates(b.Rows)
	for i := range b.Rows {
		b.Rows[i].settle()
	}
	return b, nil
}
