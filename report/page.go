package report

import (
	"strconv"
	"strings"
)

// PageTable is a table as index.html shows it: headings in words with units
// (ColumnTitle), saturation indices with their state (SICell), status cells
// marked. It is a view of a Table: the CSV keeps every digit, the page shows
// what a reader needs.
type PageTable struct {
	Caption string
	// Wide tables are printed on a landscape page in a small font.
	Wide   bool
	Header []PageHead
	Rows   [][]PageCell
}

// PageHead is a column heading: the title shown and the CSV column name.
type PageHead struct{ Title, Name string }

// PageCell is a cell of a PageTable: its text and a CSS class ("" for none).
type PageCell struct{ Text, Class string }

// NewPageTable builds the page view of t with the named columns in that order
// (all columns when cols is nil; names t lacks are skipped).
func NewPageTable(t *Table, caption string, cols []string) *PageTable {
	pt := &PageTable{Caption: caption}
	if t == nil {
		return pt
	}
	pos := map[string]int{}
	for i, h := range t.Header {
		if _, dup := pos[h]; !dup {
			pos[h] = i
		}
	}
	var idx []int
	if cols == nil {
		cols = t.Header
	}
	for _, c := range cols {
		if i, ok := pos[c]; ok {
			idx = append(idx, i)
			pt.Header = append(pt.Header, PageHead{Title: ColumnTitle(c), Name: c})
		}
	}
	for _, r := range t.Rows {
		row := make([]PageCell, len(idx))
		for k, i := range idx {
			if i < len(r) {
				row[k] = pageCell(t.Header[i], r[i])
			}
		}
		pt.Rows = append(pt.Rows, row)
	}
	return pt
}

// pageCell formats one cell for the page.
func pageCell(col, cell string) PageCell {
	if IsSIValueColumn(col) && cell != "" {
		if v, err := strconv.ParseFloat(cell, 64); err == nil {
			text, class := SICell(v)
			return PageCell{Text: text, Class: class}
		}
	}
	switch cell {
	case "warning", "rejected", "fail", "warn":
		return PageCell{Text: cell, Class: cell}
	}
	if looksNumeric(cell) {
		return PageCell{Text: cell, Class: "n"}
	}
	if len(cell) > 40 {
		return PageCell{Text: cell, Class: "wrap"} // long text (reasons, notes) wraps
	}
	return PageCell{Text: cell}
}

// looksNumeric reports whether a cell is a plain number (right-aligned on
// the page so that decimals line up).
func looksNumeric(s string) bool {
	if s == "" {
		return false
	}
	_, err := strconv.ParseFloat(strings.TrimPrefix(s, "+"), 64)
	return err == nil
}

// SplitColumns returns the page tables of t in groups of columns: each group
// repeats the key columns (e.g. the sample id) so that every printed table
// reads on its own. A column named in no group goes to a last group
// captioned rest, so no column of t is lost.
func SplitColumns(t *Table, key []string, groups []ColumnGroup, rest string) []*PageTable {
	used := map[string]bool{}
	for _, k := range key {
		used[k] = true
	}
	var out []*PageTable
	for _, g := range groups {
		cols := append(append([]string(nil), key...), g.Columns...)
		for _, c := range g.Columns {
			used[c] = true
		}
		pt := NewPageTable(t, g.Caption, cols)
		if len(pt.Header) > len(key) {
			pt.Wide = true
			out = append(out, pt)
		}
	}
	var left []string
	for _, h := range t.Header {
		if !used[h] {
			left = append(left, h)
		}
	}
	if len(left) > 0 {
		pt := NewPageTable(t, rest, append(append([]string(nil), key...), left...))
		pt.Wide = true
		out = append(out, pt)
	}
	return out
}

// ColumnGroup is a caption and the columns shown under it.
type ColumnGroup struct {
	Caption string
	Columns []string
}
