package data

import "embed"

// Demo holds the invented demo site: samples.csv, site.geojson and README.md.
//
//go:embed demo
var Demo embed.FS
