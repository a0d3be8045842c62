// Package report turns results into files a reviewer reads: CSV tables that
// are safe to open in a spreadsheet (Table, Text, Num, Full), and the
// self-contained index.html of a report folder (Index, WriteIndex). The page
// shows tables through PageTable: headings in words with units (ColumnTitle)
// and saturation indices with their state as a mark and a shade (SICell).
// Methods records how a report was made (methods.json). It formats; it
// computes no chemistry and draws no figures.
package report
