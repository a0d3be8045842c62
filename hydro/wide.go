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

// readWide reads one Row per record.
func (rd *reader) readWide(recs [][]string, lines []int) []Row {
	rows := make([]Row, 0, len(recs))
	for k, rec := range recs {
		row := Row{Line: lines[k], Sample: newSample()}
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
		for i, c := range rec {
			if i >= len(rd.specs) {
				break
			}
			sp := rd.specs[i]
			if sp.Param == "" || sp.Sub != "" {
				if sp.Param == "" && c != "" {
					s.Extra[rd.header[i]] = c
				}
				continue
			}
			if sp.Class == clConc {
				q, dl := "", ""
				if j := rd.qualCol[i]; j >= 0 && j < len(rec) {
					q = rec[j]
				}
				if j := rd.dlCol[i]; j >= 0 && j < len(rec) {
					dl = rec[j]
				}
				rd.setConc(&row, row.Line, rd.header[i], rd.header[i], sp, c, q, dl)
				continue
			}
			rd.setField(&row, row.Line, rd.header[i], rd.header[i], sp, c)
		}
		rd.finishSample(&row)
		rows = append(rows, row)
	}
	return rows
}
