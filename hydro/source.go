package hydro

import (
	"bufio"
	"bytes"
	"encoding/csv"
	"errors"
	"fmt"
	"io"
)

// recSource yields the non-blank records of a table, trimmed, with their
// line; io.EOF at the end. The slice returned may be reused by the next
// call: keep a copy.
type recSource interface {
	next() ([]string, int, error)
}

// csvSource splits CSV text into records as it is read.
type csvSource struct {
	file string
	cr   *csv.Reader
	n    int
	done bool
	// brokenAt is the line from which the text could not be split into
	// records (0: none), broken the reason.
	brokenAt int
	broken   string
}

// newCSVSource wraps the text of r in a CSV reader, detecting the
// delimiter from the first lines unless opt forces one.
func newCSVSource(r io.Reader, file string, opt Options) (*csvSource, rune, error) {
	tr, err := newTextReader(r)
	if err != nil {
		return nil, 0, &ReadError{File: file, Err: err}
	}
	br := bufio.NewReaderSize(tr, MaxLineBytes)
	delim := opt.Delimiter
	if delim == 0 {
		head, all, err := peekLines(br, 40)
		if err != nil {
			return nil, 0, &ReadError{File: file, Err: err}
		}
		if all && len(bytes.TrimSpace(bytes.ReplaceAll(head, []byte("\ufeff"), nil))) == 0 {
			return nil, 0, &ReadError{File: file, Err: ErrEmpty}
		}
		delim = detectDelimiter(string(head))
	}
	cr := csv.NewReader(br)
	cr.Comma = delim
	cr.FieldsPerRecord = -1
	cr.LazyQuotes = true
	cr.TrimLeadingSpace = delim != '\t'
	// Records are copied wherever they are kept (cells are strings of
	// their own), so the slice can be reused.
	cr.ReuseRecord = true
	return &csvSource{file: file, cr: cr}, delim, nil
}

// peekLines returns the first n lines of br (or fewer, at the end of the
// text or when they fill br's buffer) without consuming them, and whether
// they are the whole text. A line is at most MaxLineBytes (the text reader
// refuses longer ones), so the peek is bounded.
func peekLines(br *bufio.Reader, n int) ([]byte, bool, error) {
	size := 64 << 10
	for {
		b, err := br.Peek(size)
		switch {
		case err == io.EOF:
			return b, true, nil
		case err != nil && !errors.Is(err, bufio.ErrBufferFull):
			return nil, false, err
		case bytes.Count(b, []byte{'\n'}) >= n || size >= br.Size():
			return b, false, nil
		}
		size = min(2*size, br.Size())
	}
}

func (c *csvSource) next() ([]string, int, error) {
	for !c.done {
		rec, err := c.cr.Read()
		if err == io.EOF {
			c.done = true
			break
		}
		if err != nil {
			var pe *csv.ParseError
			if !errors.As(err, &pe) {
				return nil, 0, &ReadError{File: c.file, Err: err}
			}
			if c.n == 0 {
				return nil, 0, &ReadError{File: c.file, Line: pe.StartLine, Column: pe.Column, Err: fmt.Errorf("%w: %w", ErrNotCSV, pe.Err)}
			}
			// A quoting error after the header: the rows read so far
			// stand; the rest of the file cannot be split into rows, and
			// is reported as one rejected row.
			c.done = true
			c.brokenAt = pe.StartLine
			c.broken = fmt.Sprintf("CSV quoting error at line %d, column %d: %v; the rest of the file is unreadable", pe.Line, pe.Column, pe.Err)
			break
		}
		// FieldPos cannot fail for field 0 of a record just read.
		line, _ := c.cr.FieldPos(0)
		for i := range rec {
			rec[i] = trimCell(rec[i])
		}
		if allEmpty(rec) {
			// A line of bare delimiters (",,,,", common at the end of
			// spreadsheet exports) is a blank line, as encoding/csv
			// treats an empty line: not a row.
			continue
		}
		c.n++
		return rec, line, nil
	}
	return nil, 0, io.EOF
}

// gridSource hands out the records of a table held in memory (a
// workbook's sheet).
type gridSource struct {
	g *grid
	k int
}

func (s *gridSource) next() ([]string, int, error) {
	if s.k >= len(s.g.recs) {
		return nil, 0, io.EOF
	}
	s.k++
	return s.g.recs[s.k-1], s.g.lines[s.k-1], nil
}
