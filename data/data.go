package data

import "embed"

//go:embed demo
var demo embed.FS

// Demo returns the invented demo site: demo/samples.csv, demo/site.geojson and
// demo/README.md (read-only).
func Demo() embed.FS { return demo }
