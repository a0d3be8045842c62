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
	// fieldSheet: a file of field measurements, which needs no analyte.
	fieldSheet bool
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
