// Package sitereport writes a site-report folder from assessed lab rows: the
// sample table (CSV and JSON), the column report, the surfaces table, the samples
// as GeoJSON, methods.json, every figure of package site and of the
// injection-planning section (package inject) as a 300 dpi PNG (SVG and PDF on
// request) with a 96 dpi copy embedded in index.html, and index.html tying them
// together with the findings, the QA summary, methods and provenance, and the
// caution. The folder's manifest (ManifestName) lists what was written: a later
// run replaces only those files, and a folder holding other files is refused
// (ErrOtherFiles) unless Options.AllowOtherFiles. Write is what the report
// command runs; a Go program calling it gets the same folder.
package sitereport
