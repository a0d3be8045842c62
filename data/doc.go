// Package data holds gwsat's embedded files: Thermo, the thermodynamic data
// set read by package speciation (a text format of our own, described at the
// top of thermo.txt, every entry with its published source), and Demo, the
// invented demo site used by the quick start (samples.csv, site.geojson and
// a README explaining the scenario; regenerate with go run ./data/demogen).
package data
