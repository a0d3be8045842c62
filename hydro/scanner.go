package hydro

import (
	"bytes"
	"fmt"
	"io"
	"os"
)

// PrefixRows is how many data rows under the header are read ahead, and
// held, to take the decisions that need to see many rows: whether numbers
// use a decimal comma, the order of slash dates per date column, and
// whether a pH column holds potentials in mV. Rows after them are read with
// those decisions; a later row that contradicts one gets a row issue
// (CodeLateContradiction) rather than silently different values. Ten
// thousand rows is more than most lab files have, so most files are decided
// from every row, as when read whole.
const PrefixRows = 10000

// Scanner reads a lab file one Row at a time in bounded memory: CSV text
// streams (only PrefixRows records, the current long-shape sample and
// compact duplicate-id state are held); a workbook is read into memory
// whole, as ReadExcel does, and then handed out row by row.
//
// Rows are the same as Read gives, in the same order, with the same issues,
// except that: a later row contradicting a prefix decision gets an issue
// (see PrefixRows); and a Scanner made by NewScanner reads its input once,
// so of two rows with one sample id only the later one is warned (it names
// the earlier line), and FileIssues says how many earlier rows went
// unwarned. ScanFile reads the file twice (first for the ids only) and
// warns both, as Read does.
type Scanner struct {
	b      *Batch
	rd     *reader
	src    recSource
	csv    *csvSource
	closer io.Closer

	pend      [][]string
	pendLines []int
	long      *longGroup
	queue     []Row
	dups      *dupIndex
	// once: rows are warned as they are read (the input is read once).
	once bool
	// finalMapping is the mapping of the whole file, known after a first
	// pass (long files list parameters as they are met).
	finalMapping []HeaderMapping
	count        int // rows found by a first pass, -1 when none was made
	// keysOnly: a first pass, reading only what duplicate checks compare
	// (wide shape; a long file is read whole for its parameter names).
	keysOnly bool
	// early is how many held records the decisions were taken from.
	early int
	done  bool
	err   error
}

// NewScanner starts reading a lab file (CSV text, or an .xlsx workbook
// recognised by its first bytes) from r. The header, units and
// detection-limit rows and the first PrefixRows data rows are read before
// it returns; file-level problems are returned as for Read.
func NewScanner(r io.Reader, file string, opt Options) (*Scanner, error) {
	s, err := newScanner(r, file, opt, false)
	if err != nil {
		return nil, err
	}
	s.once = true
	return s, nil
}

// ScanFile reads the lab file at path as NewScanner does, but in two
// passes: the first reads the whole file for sample ids, well places and
// (long shape) parameter names, so that both rows of a duplicate are
// warned and Batch().Mapping is complete from the start. A path that is not
// a regular file (a pipe) is read once, as by NewScanner. Close the
// Scanner when done.
func ScanFile(path string, opt Options) (*Scanner, error) {
	return scanFile(path, opt, false)
}

// ScanBytes reads a lab file held in memory as ScanFile reads one from
// disk (two passes).
func ScanBytes(raw []byte, file string, opt Options) (*Scanner, error) {
	return scanTwice(func() (io.ReadCloser, error) { return io.NopCloser(bytes.NewReader(raw)), nil }, file, opt, false)
}

func scanFile(path string, opt Options, fieldSheet bool) (*Scanner, error) {
	open := func() (io.ReadCloser, error) {
		f, err := os.Open(path)
		if err != nil {
			return nil, &ReadError{File: path, Err: fmt.Errorf("%w: %w", ErrRead, err)}
		}
		return f, nil
	}
	// A pipe or device (a shell's process substitution, /dev/stdin)
	// cannot be read twice: read it once.
	if fi, err := os.Stat(path); err == nil && !fi.Mode().IsRegular() {
		f, err := open()
		if err != nil {
			return nil, err
		}
		s, err := newScanner(f, path, opt, fieldSheet)
		if err != nil {
			f.Close()
			return nil, err
		}
		s.closer, s.once = f, true
		return s, nil
	}
	return scanTwice(open, path, opt, fieldSheet)
}

// scanTwice reads a file once for its duplicate ids, well places and
// parameter names, then returns a Scanner over it from the start.
func scanTwice(open func() (io.ReadCloser, error), file string, opt Options, fieldSheet bool) (*Scanner, error) {
	f, err := open()
	if err != nil {
		return nil, err
	}
	first, err := newScanner(f, file, opt, fieldSheet)
	if err != nil {
		f.Close()
		return nil, err
	}
	first.closer, first.keysOnly = f, true
	dups := first.dups
	n := 0
	for {
		r, ok, err := first.next()
		if err != nil {
			first.Close()
			return nil, err
		}
		if !ok {
			break
		}
		dups.observe(&r)
		n++
	}
	mapping := first.Batch().Mapping
	if err := first.Close(); err != nil {
		return nil, err
	}
	f, err = open()
	if err != nil {
		return nil, err
	}
	s, err := newScanner(f, file, opt, fieldSheet)
	if err != nil {
		f.Close()
		return nil, err
	}
	s.closer, s.dups, s.finalMapping, s.count = f, dups, mapping, n
	return s, nil
}

// Len returns the number of rows, known when the file was read twice
// (ScanFile, ScanBytes); -1 otherwise.
func (s *Scanner) Len() int { return s.count }

// HasRows says whether the file has any data row (or an unreadable rest
// that is reported as one).
func (s *Scanner) HasRows() bool {
	return len(s.pend) > 0 || len(s.queue) > 0 || s.csv != nil && s.csv.brokenAt > 0
}

// newScanner reads the header and the prefix.
func newScanner(r io.Reader, file string, opt Options, fieldSheet bool) (*Scanner, error) {
	if err := opt.check(); err != nil {
		return nil, &ReadError{File: file, Err: err}
	}
	br, zip, err := sniffZip(r)
	if err != nil {
		return nil, &ReadError{File: file, Err: fmt.Errorf("%w: %w", ErrRead, err)}
	}
	if zip {
		g, err := readWorkbook(br, file, opt, fieldSheet)
		if err != nil {
			return nil, err
		}
		return gridScanner(g, opt)
	}
	if opt.MaxBytes > 0 {
		br = &limitedReader{r: br, n: opt.MaxBytes, limit: opt.MaxBytes}
	}
	cs, delim, err := newCSVSource(br, file, opt)
	if err != nil {
		return nil, err
	}
	s := &Scanner{src: cs, csv: cs, dups: newDupIndex(), count: -1}
	if err := s.start(&grid{file: file, delim: delim, fieldSheet: fieldSheet}, opt); err != nil {
		return nil, err
	}
	return s, nil
}

// gridScanner hands out the rows of a table held in memory.
func gridScanner(g *grid, opt Options) (*Scanner, error) {
	s := &Scanner{src: &gridSource{g: g}, dups: newDupIndex(), count: -1}
	if err := s.start(g, opt); err != nil {
		return nil, err
	}
	return s, nil
}

// readAhead reads up to n more records into the held prefix.
func (s *Scanner) readAhead(n int) error {
	for k := 0; k < n; k++ {
		rec, line, err := s.src.next()
		if err == io.EOF {
			return nil
		}
		if err != nil {
			return err
		}
		s.pend = append(s.pend, append([]string(nil), rec...))
		s.pendLines = append(s.pendLines, line)
	}
	return nil
}

// start finds the header (skipping a preamble), a units row and a
// detection-limit row under it, and takes the decisions from the prefix.
func (s *Scanner) start(g *grid, opt Options) error {
	if err := s.readAhead(headerSearchLines); err != nil {
		return err
	}
	if len(s.pend) == 0 {
		if g.workbook {
			return &ReadError{File: g.file, Field: g.sheet, Err: ErrEmpty}
		}
		return &ReadError{File: g.file, Err: ErrEmpty}
	}
	h := findHeader(s.pend, opt.ColumnMap)
	rd := &reader{file: g.file, opt: opt, delim: g.delim, header: s.pend[h], headerLine: s.pendLines[h], workbook: g.workbook, date1904: g.date1904, fieldSheet: g.fieldSheet}
	b := &Batch{File: g.file, Sheet: g.sheet, Delimiter: g.delim, HeaderLine: s.pendLines[h]}
	for k := 0; k < h; k++ {
		b.Skipped = append(b.Skipped, SkippedLine{Line: s.pendLines[k], Kind: SkipPreamble, Cells: s.pend[k]})
	}
	if err := rd.mapHeader(); err != nil {
		return err
	}
	s.pend, s.pendLines = s.pend[h+1:], s.pendLines[h+1:]
	// three rows more: a header continued, a units row, a limits row
	if err := s.readAhead(PrefixRows + 3 - len(s.pend)); err != nil {
		return err
	}
	recs, lines := s.pend, s.pendLines
	if len(recs) > 0 && rd.isHeaderRepeat(recs[0]) {
		b.Skipped = append(b.Skipped, SkippedLine{Line: lines[0], Kind: SkipHeaderRow, Cells: recs[0]})
		recs, lines = recs[1:], lines[1:]
	}
	if len(recs) > 0 && rd.shape == Wide && rd.applyUnitsRow(recs[0], lines[0]) {
		b.Skipped = append(b.Skipped, SkippedLine{Line: lines[0], Kind: SkipUnitsRow, Cells: recs[0]})
		b.UnitsLine = lines[0]
		recs, lines = recs[1:], lines[1:]
	}
	rd.decComma = !g.workbook && decideDecimal(opt.DecimalSep, g.delim, recs[:min(len(recs), PrefixRows)], rd)
	if len(recs) > 0 && rd.shape == Wide && rd.applyLimitsRow(recs[0], lines[0]) {
		b.Skipped = append(b.Skipped, SkippedLine{Line: lines[0], Kind: SkipLimitsRow, Cells: recs[0]})
		recs, lines = recs[1:], lines[1:]
	}
	s.early = min(len(recs), PrefixRows)
	rd.decideDateOrder(recs[:s.early])
	rd.scanPH(recs[:s.early])
	s.pend, s.pendLines = recs, lines
	rd.finishMapping()
	b.Shape, b.DecimalComma, b.Mapping = rd.shape, rd.decComma, rd.mapping
	b.DateOrder = rd.dateOrderUsed()
	b.Warnings = rd.fileWarnings
	if rd.shape == Long {
		s.long = newLongGroup(rd)
		s.long.premap(s.pend)
	}
	s.b, s.rd = b, rd
	return nil
}

// Batch returns the file's metadata (everything but Rows). For a long file
// read by NewScanner, Mapping lists the parameter names met so far (all of
// them once Next has returned false); ScanFile knows them all from the
// start.
func (s *Scanner) Batch() *Batch {
	b := *s.b
	if s.finalMapping != nil {
		b.Mapping = s.finalMapping
	} else if s.rd.shape == Long {
		s.rd.finishMapping()
		b.Mapping = s.rd.mapping
	}
	return &b
}

// FileIssues returns the issues about the file as a whole: duplicate
// columns (as Batch().Warnings) and, once the rows are read, how many
// duplicate warnings could not be given to the earlier row because the
// input was read once.
func (s *Scanner) FileIssues() []Issue {
	out := append([]Issue(nil), s.b.Warnings...)
	if s.once && s.dups.late > 0 {
		out = append(out, Issue{Severity: Warning, Code: CodeDuplicateID, Message: fmt.Sprintf("%d duplicate warnings (a sample id used again in one event, or a well id far apart) could not be given to the earlier row: the later rows name the earlier lines (the input was read once; read it from a file to have both rows warned)", s.dups.late)})
	}
	return out
}

// Next returns the next row; false at the end of the file. An error is a
// file-level problem met after the start (an unreadable file, binary data,
// a line longer than MaxLineBytes); the rows before it stand.
func (s *Scanner) Next() (Row, bool, error) {
	r, ok, err := s.next()
	if !ok || err != nil {
		return r, ok, err
	}
	switch {
	case s.once:
		s.dups.observeAnnotate(&r)
	default:
		s.dups.annotate(&r)
	}
	r.settle()
	return r, true, nil
}

// next returns the next row as read, without duplicate warnings and before
// it is settled.
func (s *Scanner) next() (Row, bool, error) {
	for len(s.queue) == 0 {
		if s.err != nil {
			return Row{}, false, s.err
		}
		if s.done {
			return Row{}, false, nil
		}
		rec, line, err := s.record()
		if err == io.EOF {
			s.done = true
			if s.long != nil {
				if r, ok := s.long.flush(); ok {
					s.queue = append(s.queue, r)
				}
			}
			if s.csv != nil && s.csv.brokenAt > 0 {
				r := Row{Line: s.csv.brokenAt, Sample: newSample()}
				r.add(Error, CodeQuoting, r.Line, "", "%s", s.csv.broken)
				s.queue = append(s.queue, r)
			}
			continue
		}
		if err != nil {
			s.err = err
			continue
		}
		if s.long != nil {
			if r, ok := s.long.add(rec, line); ok {
				s.queue = append(s.queue, r)
			}
			continue
		}
		if s.keysOnly {
			s.queue = append(s.queue, s.rd.keyRow(rec, line))
			continue
		}
		s.queue = append(s.queue, s.rd.wideRow(rec, line))
	}
	r := s.queue[0]
	s.queue = s.queue[1:]
	return r, true, nil
}

// record returns the next data record: from the prefix, then the source.
func (s *Scanner) record() ([]string, int, error) {
	if len(s.pend) > 0 {
		rec, line := s.pend[0], s.pendLines[0]
		s.pend[0] = nil
		s.pend, s.pendLines = s.pend[1:], s.pendLines[1:]
		if s.early > 0 {
			s.early--
		} else {
			s.rd.late = true
		}
		return rec, line, nil
	}
	rec, line, err := s.src.next()
	if err == nil {
		s.rd.late = true
	}
	return rec, line, err
}

// Close releases the file ScanFile opened; it is a no-op for NewScanner.
func (s *Scanner) Close() error {
	if s.closer == nil {
		return nil
	}
	c := s.closer
	s.closer = nil
	if err := c.Close(); err != nil {
		return &ReadError{File: s.b.File, Err: fmt.Errorf("%w: %w", ErrRead, err)}
	}
	return nil
}
