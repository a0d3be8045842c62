package hydro

import "fmt"

// grid is a table of trimmed cells with the file line (CSV) or sheet row
// (workbook) of each record; blank records are already left out.
type grid struct {
	file  string
	sheet string
	delim rune
	recs  [][]string
	lines []int
	// workbook: numbers are written with a decimal point, and dates are
	// serial numbers in the 1900 or 1904 date system.
	workbook bool
	date1904 bool
	// brokenAt is the line from which a CSV file could not be split into
	// records (0: none), broken the reason.
	brokenAt int
	broken   string
	// fieldSheet: a file of field measurements, which needs no analyte.
	fieldSheet bool
}

// readGrid finds the header (skipping a preamble), a units row and a
// detection-limit row under it, and reads the rows below.
func readGrid(g *grid, opt Options) (*Batch, error) {
	if err := opt.check(); err != nil {
		return nil, &ReadError{File: g.file, Err: err}
	}
	h := findHeader(g.recs, opt.ColumnMap)
	rd := &reader{file: g.file, opt: opt, delim: g.delim, header: g.recs[h], headerLine: g.lines[h], workbook: g.workbook, date1904: g.date1904, fieldSheet: g.fieldSheet}
	b := &Batch{File: g.file, Sheet: g.sheet, Delimiter: g.delim, HeaderLine: g.lines[h]}
	for k := 0; k < h; k++ {
		b.Skipped = append(b.Skipped, SkippedLine{Line: g.lines[k], Kind: SkipPreamble, Cells: g.recs[k]})
	}
	if err := rd.mapHeader(); err != nil {
		return nil, err
	}
	recs, lines := g.recs[h+1:], g.lines[h+1:]
	if len(recs) > 0 && rd.isHeaderRepeat(recs[0]) {
		b.Skipped = append(b.Skipped, SkippedLine{Line: lines[0], Kind: SkipHeaderRow, Cells: recs[0]})
		recs, lines = recs[1:], lines[1:]
	}
	if len(recs) > 0 && rd.shape == Wide && rd.applyUnitsRow(recs[0], lines[0]) {
		b.Skipped = append(b.Skipped, SkippedLine{Line: lines[0], Kind: SkipUnitsRow, Cells: recs[0]})
		b.UnitsLine = lines[0]
		recs, lines = recs[1:], lines[1:]
	}
	rd.decComma = !g.workbook && decideDecimal(opt.DecimalSep, g.delim, recs, rd)
	if len(recs) > 0 && rd.shape == Wide && rd.applyLimitsRow(recs[0], lines[0]) {
		b.Skipped = append(b.Skipped, SkippedLine{Line: lines[0], Kind: SkipLimitsRow, Cells: recs[0]})
		recs, lines = recs[1:], lines[1:]
	}
	rd.decideDateOrder(recs)
	rd.scanPH(recs)
	if rd.shape == Long {
		b.Rows = rd.readLong(recs, lines)
	} else {
		b.Rows = rd.readWide(recs, lines)
	}
	rd.finishMapping()
	b.Shape, b.DecimalComma, b.Mapping = rd.shape, rd.decComma, rd.mapping
	b.DateOrder = rd.dateOrderUsed()
	if g.brokenAt > 0 {
		r := Row{Line: g.brokenAt, Sample: newSample()}
		r.add(Error, CodeQuoting, r.Line, "", "%s", g.broken)
		b.Rows = append(b.Rows, r)
	}
	markDuplicates(b.Rows)
	for i := range b.Rows {
		b.Rows[i].settle()
	}
	return b, nil
}

// check refuses options that cannot be meant.
func (o Options) check() error {
	if o.SiteTempC.OK && !(o.SiteTempC.V >= 0 && o.SiteTempC.V <= 100) {
		return fmt.Errorf("%w: site temperature %g C outside 0-100 C", ErrOption, o.SiteTempC.V)
	}
	switch o.DateOrder {
	case DateAuto, DayFirst, MonthFirst:
	default:
		return fmt.Errorf("%w: unknown date order %d", ErrOption, o.DateOrder)
	}
	return nil
}

// scanPH marks pH columns whose numeric values are mostly outside 0-14:
// such a column most likely holds a redox potential in mV.
func (rd *reader) scanPH(recs [][]string) {
	rd.mvLike = map[string]bool{}
	for i, sp := range rd.specs {
		if sp.Class != clPH {
			continue
		}
		in, out := 0, 0
		for _, rec := range recs {
			if i >= len(rec) {
				continue
			}
			v, err := parseNum(rec[i], rd.decComma)
			switch {
			case err != nil:
			case v >= 0 && v <= 14:
				in++
			default:
				out++
			}
		}
		rd.mvLike[rd.header[i]] = out > in
	}
}
