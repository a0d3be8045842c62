package hydro

import "strings"

// checkLate warns a row read after the prefix (see PrefixRows) whose cells
// contradict a decision taken from the prefix: a decimal point in a file
// read with decimal commas, or a slash date that can only be read in the
// other day/month order.
func (rd *reader) checkLate(row *Row, line int, rec []string) {
	if !rd.late {
		return
	}
	for i, c := range rec {
		if i >= len(rd.specs) || c == "" {
			continue
		}
		sp := rd.specs[i]
		switch {
		case sp.Class == clDate && rd.opt.DateOrder == DateAuto:
			o := rd.dateOrder[rd.header[i]]
			if got := slashOrder(c); o != 0 && got != 0 && got != o {
				row.add(Warning, CodeLateContradiction, line, rd.header[i], "date %q can only be read %s, but the first %d rows settled %s for this column", c, orderName(got), PrefixRows, orderName(o))
			}
		case rd.decComma && rd.opt.DecimalSep == 0 && sp.Class != clText && sp.Class != clDate && sp.Class != clLongParam:
			if rePointDec.MatchString(c) && !strings.Contains(c, ",") {
				row.add(Warning, CodeLateContradiction, line, rd.header[i], "%q has a decimal point, but the first %d rows use decimal commas: read with a decimal point", c, PrefixRows)
			}
		}
	}
}

func orderName(o byte) string {
	if o == 'm' {
		return MonthFirst.String()
	}
	return DayFirst.String()
}

// checkDupCells warns a row whose two columns of one meaning hold
// different values (the first column's value is used).
func (rd *reader) checkDupCells(row *Row, line int, rec []string) {
	for _, p := range rd.dupCols {
		a, b := p[0], p[1]
		if a >= len(rec) || b >= len(rec) || rec[a] == "" || rec[b] == "" || rec[a] == rec[b] {
			continue
		}
		if x, err := parseNum(rec[a], rd.decComma); err == nil {
			if y, err := parseNum(rec[b], rd.decComma); err == nil && x == y {
				continue // "40" and "40.0"
			}
		}
		row.add(Warning, CodeDuplicateColumn, line, rd.header[b], "columns %d (%q) and %d (%q) mean the same but differ: %q and %q; the first used", a+1, rd.header[a], b+1, rd.header[b], rec[a], rec[b])
	}
}
