package hydro

import (
	"bufio"
	"fmt"
	"io"
)

// ReadFile reads a lab file from disk; see Read.
func ReadFile(path string, opt Options) (*Batch, error) {
	return collect(scanFile(path, opt, false))
}

// Read reads a lab file of wide or long shape from CSV text (or from an
// .xlsx workbook, recognised by its first bytes, as ReadExcel). file names
// the input in messages. The error is only for problems with the file as a
// whole (see the ErrXxx sentinels, wrapped in a *ReadError); every
// row-level problem is reported in its Row. Read holds every row: for
// large files use a Scanner, which Read is built on.
func Read(r io.Reader, file string, opt Options) (*Batch, error) {
	return readAny(r, file, opt, false)
}

// readAny reads a workbook or CSV text whole.
func readAny(r io.Reader, file string, opt Options, fieldSheet bool) (*Batch, error) {
	return collect(newScanner(r, file, opt, fieldSheet))
}

// collect reads every row of a scanner into its batch. The rows are all
// observed for duplicates before any is warned, so that every row of a
// duplicate is.
func collect(s *Scanner, err error) (*Batch, error) {
	if err != nil {
		return nil, err
	}
	var rows []Row
	for {
		r, ok, err := s.next()
		if err != nil {
			s.Close()
			return nil, err
		}
		if !ok {
			break
		}
		rows = append(rows, r)
	}
	if err := s.Close(); err != nil {
		return nil, err
	}
	d := s.dups
	if s.count < 0 { // read once: observe every row before warning any
		for i := range rows {
			d.observe(&rows[i])
		}
	}
	for i := range rows {
		d.annotate(&rows[i])
		rows[i].settle()
	}
	b := s.Batch()
	b.Rows = rows
	return b, nil
}

// defaultWorkbookBytes limits a workbook, which is read into memory whole,
// when Options.MaxBytes is 0.
const defaultWorkbookBytes = 256 << 20

// sniffZip says whether r starts like a zip archive (an .xlsx workbook),
// and returns a reader of all of r.
func sniffZip(r io.Reader) (io.Reader, bool, error) {
	br := bufio.NewReader(r)
	head, err := br.Peek(4)
	if err != nil && err != io.EOF {
		return nil, false, err
	}
	return br, isZip(head), nil
}

// limitedReader fails once more than n bytes are read.
type limitedReader struct {
	r     io.Reader
	n     int64
	limit int64
}

func (l *limitedReader) Read(p []byte) (int, error) {
	n, err := l.r.Read(p)
	l.n -= int64(n)
	if l.n < 0 {
		return n, fmt.Errorf("larger than %d bytes (Options.MaxBytes)", l.limit)
	}
	return n, err
}

func readLimited(r io.Reader, file string, opt Options) ([]byte, error) {
	limit := opt.MaxBytes
	if limit <= 0 {
		limit = defaultWorkbookBytes
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

// isZip says whether raw starts like a zip archive (an .xlsx workbook).
func isZip(raw []byte) bool {
	return len(raw) >= 4 && raw[0] == 'P' && raw[1] == 'K' && raw[2] == 3 && raw[3] == 4
}
