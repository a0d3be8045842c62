// Package sitereport writes a site-report folder from assessed lab rows: the
// sample table (CSV and JSON), the column report, the surfaces table, the samples
// as GeoJSON, every figure of package site and of the injection-planning section
// (package inject) in the chosen formats, and index.html tying them together with
// the QA summary and the caution. Write is what the report command runs; a Go
// program calling it gets the same folder.
package sitereport
