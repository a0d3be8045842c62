package report

import (
	"math"
	"strconv"

	"gwsat.dev/gwsat/assess"
)

// Markers of the saturation state in index.html, so that the state reads
// without colour (printed in black and white, or by a reader who does not
// see the shading).
const (
	MarkSupersaturated  = "▲"
	MarkUndersaturated  = "▼"
	MarkNearEquilibrium = "≈"
)

// SICell formats a saturation index for the page: its state marker (with
// assess.NearEquilibriumBand), the value with a sign and two decimals, and
// the CSS class that shades the cell ("si-sup", "si-und", "si-near"). NaN or
// Inf gives an empty cell.
func SICell(si float64) (text, class string) {
	if math.IsNaN(si) || math.IsInf(si, 0) {
		return "", ""
	}
	v := Signed(si, 2)
	switch assess.State(si) {
	case assess.Supersaturated:
		return MarkSupersaturated + " " + v, "si-sup"
	case assess.Undersaturated:
		return MarkUndersaturated + " " + v, "si-und"
	}
	return MarkNearEquilibrium + " " + v, "si-near"
}

// Signed formats v with an explicit sign and prec decimals ("+0.62",
// "-1.20"); a value that rounds to zero is written without a sign ("0.00"),
// never "-0.00". NaN and Inf give "".
func Signed(v float64, prec int) string {
	if math.IsNaN(v) || math.IsInf(v, 0) {
		return ""
	}
	s := strconv.FormatFloat(v, 'f', prec, 64)
	if isZero(s) {
		return strconv.FormatFloat(0, 'f', prec, 64)
	}
	if v > 0 {
		return "+" + s
	}
	return s
}

// isZero reports whether a formatted number has only zero digits.
func isZero(s string) bool {
	for _, r := range s {
		if r >= '1' && r <= '9' {
			return false
		}
	}
	return true
}
