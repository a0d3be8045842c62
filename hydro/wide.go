package hydro

import "strings"

// ragged says whether a record's length differs from the header's in a way
// that matters: missing cells under empty headers and extra empty cells (a
// trailing delimiter on some lines only) are tolerated.
func (rd *reader) ragged(rec []string) bool {
	switch {
	case len(rec) < len(rd.header):
		for _, h := range rd.header[len(rec):] {
			if h != "" {
				return true
			}
		}
	case len(rec) > len(rd.header):
		for _, c := range rec[len(rd.header):] {
			if c != "" {
				return true
			}
		}
	}
	return false
}

// wideRow reads one record as one Row.
func (rd *reader) wideRow(rec []string, line int) Row {
	nConc, nExtra := 0, 0
	for i := range rd.specs {
		switch {
		case rd.specs[i].Param == "":
			nExtra++
		case rd.specs[i].Class == clConc:
			nConc++
		}
	}
	// Maps sized for the row's columns at once, not grown cell by cell.
	row := Row{Line: line, Sample: Sample{Analytes: make(map[string]Measurement, nConc), Extra: make(map[string]string, nExtra)}}
	s := &row.Sample
	if rd.ragged(rec) {
		if len(rec) < len(rd.header) {
			row.add(Error, CodeRaggedRow, row.Line, rd.header[len(rec)], "ragged row: %d fields, the header has %d (missing from column %d, %q, on)", len(rec), len(rd.header), len(rec)+1, rd.header[len(rec)])
		} else {
			row.add(Error, CodeRaggedRow, row.Line, "", "ragged row: %d fields, the header has %d (extra fields from column %d on)", len(rec), len(rd.header), len(rd.header)+1)
		}
	}
	for i, c := range rec {
		if n := strings.Count(c, "\n"); n > 0 && i < len(rd.header) && len(rec) != len(rd.header) {
			row.add(Error, CodeQuoting, row.Line, rd.header[i], "a quote opened here is not closed: lines %d-%d read as one row", row.Line, row.Line+n)
			break
		}
	}
	rd.checkLate(&row, line, rec)
	rd.checkDupCells(&row, line, rec)
	rowUnit := ""
	if rd.rowUnitCol >= 0 && rd.rowUnitCol < len(rec) {
		rowUnit = rec[rd.rowUnitCol]
	}
	var assumed []string
	for i := range rd.specs {
		c := ""
		if i < len(rec) {
			c = rec[i]
		}
		sp := rd.specs[i]
		if sp.Param == "" {
			if rd.header[i] != "" || c != "" {
				s.ExtraColumns = append(s.ExtraColumns, ExtraColumn{Header: rd.header[i], Value: c})
			}
			if c != "" {
				s.Extra[rd.header[i]] = c
			}
			continue
		}
		if sp.Sub != "" || i == rd.rowUnitCol || i >= len(rec) {
			continue
		}
		if sp.Class == clConc {
			in := concIn{col: rd.header[i], name: rd.header[i], sp: sp, raw: c, unitSrc: rd.unitSrc[i], colDL: rd.colDL[i]}
			if j := rd.qualCol[i]; j >= 0 && j < len(rec) {
				in.qual = rec[j]
			}
			if j := rd.dlCol[i]; j >= 0 && j < len(rec) {
				in.dl = rec[j]
			}
			if in.unitSrc == UnitPerRow {
				in.sp, in.unitSrc = rd.rowUnitSpec(sp, rowUnit)
			}
			if rd.setConc(&row, row.Line, in) {
				assumed = append(assumed, rd.header[i])
			}
			continue
		}
		rd.setField(&row, row.Line, rd.header[i], rd.header[i], sp, c)
	}
	rd.warnAssumed(&row, row.Line, assumed)
	rd.finishSample(&row)
	return row
}

// keyRow reads only what duplicate checks compare (sample and well ids,
// round, date, place) from a record: the first pass of a file read twice.
// The values are those wideRow gives (the same setField and event rule).
func (rd *reader) keyRow(rec []string, line int) Row {
	row := Row{Line: line, Sample: newSample()}
	for i, sp := range rd.specs {
		if i >= len(rec) || sp.Param == "" || sp.Sub != "" || sp.Class == clConc || i == rd.rowUnitCol {
			continue
		}
		switch sp.Class {
		case clText, clDate, clInt, clDegrees, clCoord:
			rd.setField(&row, line, rd.header[i], rd.header[i], sp, rec[i])
		}
	}
	rd.defaultEPSG(&row.Sample)
	setEvent(&row.Sample)
	return row
}

// rowUnitSpec gives an analyte column without a unit of its own the unit
// of the row's unit cell; a blank unit cell leaves mg/L assumed.
func (rd *reader) rowUnitSpec(sp colSpec, unit string) (colSpec, string) {
	if unit == "" {
		if rd.opt.ConfirmUnits {
			return sp, UnitConfirmed
		}
		return sp, UnitAssumed
	}
	return withUnit(sp, unit), UnitPerRow
}

// warnAssumed adds one warning naming the analyte columns of a row whose
// mg/L was assumed.
func (rd *reader) warnAssumed(row *Row, line int, cols []string) {
	if len(cols) == 0 {
		return
	}
	row.add(Warning, CodeUnitAssumed, line, cols[0], "no unit given for %s: mg/L assumed; state the unit (header, units row, unit column or column map) or confirm it", strings.Join(cols, ", "))
}
