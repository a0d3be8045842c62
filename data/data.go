package data

import "embed"

// Thermo is the thermodynamic data file (format described at its top).
//
//go:embed thermo.txt
var Thermo string

// Demo holds the invented demo site: samples.csv, site.geojson and README.md.
//
//go:embed demo
var Demo embed.FS
