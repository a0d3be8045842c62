// Package data holds gwsat's embedded demo: Demo, the invented demo site used by
// the quick start (samples.csv, site.geojson and a README explaining the
// scenario; regenerate with go run ./data/demogen). The thermodynamic data set
// lives with the chemistry, in package speciation.
package data
