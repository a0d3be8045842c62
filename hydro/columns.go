package hydro

import "strings"

// TableColumns returns, from the header mapping alone, the analyte keys
// (in mapping order) and the headers of the columns kept in
// Sample.ExtraColumns that rows of this batch can carry: what a table
// needs for its header before the first row is written. Every key of a
// row's Sample.Analytes and every ExtraColumn.Header of its rows is among
// them (for a long file read by NewScanner, once its rows are read; see
// Scanner.Batch); a column may stay blank in every row.
func (b *Batch) TableColumns() (analyteKeys, extraHeaders []string) {
	seenA, seenX := map[string]bool{}, map[string]bool{}
	for _, m := range b.Mapping {
		switch {
		case m.Param == "":
			if !seenX[m.Header] {
				seenX[m.Header] = true
				extraHeaders = append(extraHeaders, m.Header)
			}
		case !strings.Contains(m.Param, "."):
			if _, ok := analytes[m.Param]; ok && !seenA[m.Param] {
				seenA[m.Param] = true
				analyteKeys = append(analyteKeys, m.Param)
			}
		}
	}
	return analyteKeys, extraHeaders
}
