// Package report turns results into files a reviewer reads: CSV tables that
// are safe to open in a spreadsheet (Table, Text, Num), and the
// self-contained index.html of a report folder (Index). It formats; it
// computes no chemistry and draws no figures.
package report
