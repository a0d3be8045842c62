package hydro

import (
	"bytes"
	"errors"
	"fmt"
	"io"
	"strconv"
	"strings"

	"github.com/xuri/excelize/v2"
)

// ReadExcel reads a lab table from an Excel workbook (.xlsx): the sheet
// named or numbered by Options.Sheet (the first when empty), with the same
// detection as Read (preamble, units row, wide or long shape). Cells are
// read as stored, not as displayed: numbers with a decimal point, dates as
// serial numbers in the workbook's date system (1900 or 1904). Merged
// cells hold their value in every cell they cover. Row.Line is the sheet's
// row number.
func ReadExcel(r io.Reader, file string, opt Options) (*Batch, error) {
	raw, err := readLimited(r, file, opt)
	if err != nil {
		return nil, err
	}
	return readExcelBytes(raw, file, opt, false)
}

func readExcelBytes(raw []byte, file string, opt Options, fieldSheet bool) (b *Batch, err error) {
	f, err := excelize.OpenReader(bytes.NewReader(raw))
	if err != nil {
		return nil, &ReadError{File: file, Err: fmt.Errorf("%w (nor a readable workbook: %w)", ErrNotCSV, err)}
	}
	defer func() {
		if cerr := f.Close(); cerr != nil && err == nil {
			b, err = nil, &ReadError{File: file, Err: fmt.Errorf("%w: %w", ErrRead, cerr)}
		}
	}()
	sheet, err := pickSheet(f.GetSheetList(), opt.Sheet)
	if err != nil {
		return nil, &ReadError{File: file, Err: err}
	}
	props, err := f.GetWorkbookProps()
	if err != nil {
		return nil, &ReadError{File: file, Field: sheet, Err: fmt.Errorf("%w: %w", ErrRead, err)}
	}
	rows, err := f.GetRows(sheet, excelize.Options{RawCellValue: true})
	if err != nil {
		return nil, &ReadError{File: file, Field: sheet, Err: fmt.Errorf("%w: %w", ErrRead, err)}
	}
	merged, err := f.GetMergeCells(sheet)
	if err != nil {
		return nil, &ReadError{File: file, Field: sheet, Err: fmt.Errorf("%w: %w", ErrRead, err)}
	}
	if err := fillMerged(rows, merged); err != nil {
		return nil, &ReadError{File: file, Field: sheet, Err: fmt.Errorf("%w: %w", ErrRead, err)}
	}
	g := &grid{file: file, sheet: sheet, workbook: true, date1904: props.Date1904 != nil && *props.Date1904, fieldSheet: fieldSheet}
	width := 0
	for _, r := range rows {
		width = max(width, len(r))
	}
	for i, r := range rows {
		rec := make([]string, width)
		for j, c := range r {
			rec[j] = trimCell(strings.ReplaceAll(c, "\r\n", "\n"))
		}
		if allEmpty(rec) {
			continue
		}
		g.recs = append(g.recs, rec)
		g.lines = append(g.lines, i+1)
	}
	if len(g.recs) == 0 {
		return nil, &ReadError{File: file, Field: sheet, Err: ErrEmpty}
	}
	return readGrid(g, opt)
}

// pickSheet finds a sheet by name (ignoring case) or 1-based number.
func pickSheet(list []string, want string) (string, error) {
	if len(list) == 0 {
		return "", fmt.Errorf("%w: the workbook has no sheets", ErrSheet)
	}
	want = strings.TrimSpace(want)
	if want == "" {
		return list[0], nil
	}
	for _, s := range list {
		if strings.EqualFold(s, want) {
			return s, nil
		}
	}
	if n, err := strconv.Atoi(want); err == nil {
		if n >= 1 && n <= len(list) {
			return list[n-1], nil
		}
		return "", fmt.Errorf("%w: sheet %d of %d", ErrSheet, n, len(list))
	}
	return "", fmt.Errorf("%w: %q (the sheets are %s)", ErrSheet, want, strings.Join(list, ", "))
}

// fillMerged writes the value of each merged range into every cell of it,
// growing rows as needed.
func fillMerged(rows [][]string, merged []excelize.MergeCell) error {
	var errs []error
	for _, mc := range merged {
		c0, r0, err0 := excelize.CellNameToCoordinates(mc.GetStartAxis())
		c1, r1, err1 := excelize.CellNameToCoordinates(mc.GetEndAxis())
		if err0 != nil || err1 != nil {
			errs = append(errs, err0, err1)
			continue
		}
		if r0 < 1 || r0 > len(rows) {
			continue
		}
		v := ""
		if top := rows[r0-1]; c0-1 < len(top) {
			v = top[c0-1]
		}
		for r := r0; r <= r1 && r <= len(rows); r++ {
			for len(rows[r-1]) < c1 {
				rows[r-1] = append(rows[r-1], "")
			}
			for c := c0; c <= c1; c++ {
				rows[r-1][c-1] = v
			}
		}
	}
	return errors.Join(errs...)
}
