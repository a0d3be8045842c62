package report

import (
	"gonum.org/v1/plot/vg"

	"gwsat.dev/gwsat/figure"
)

// Fig is one figure of the report.
type Fig struct {
	Stem    string // file name without extension
	Title   string
	Caption string
	Figure  figure.Figure
	W, H    vg.Length
}
