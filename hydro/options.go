package hydro

import (
	"fmt"
	"strings"
)

// NonDetectPolicy says what value stands in for a result below the
// detection limit. The zero value is HalfDL.
type NonDetectPolicy int

const (
	// HalfDL substitutes half the detection limit (the default).
	HalfDL NonDetectPolicy = iota
	// Zero substitutes 0.
	Zero
	// DL substitutes the detection limit itself.
	DL
)

func (p NonDetectPolicy) String() string {
	switch p {
	case Zero:
		return "zero"
	case DL:
		return "dl"
	}
	return "half-dl"
}

// ParseNonDetectPolicy reads "half-dl" (or "half"), "zero" or "dl".
func ParseNonDetectPolicy(s string) (NonDetectPolicy, error) {
	switch strings.ToLower(strings.TrimSpace(s)) {
	case "half-dl", "halfdl", "half", "":
		return HalfDL, nil
	case "zero", "0":
		return Zero, nil
	case "dl", "limit":
		return DL, nil
	}
	return HalfDL, fmt.Errorf("hydro: unknown non-detect policy %q (want half-dl, zero or dl)", s)
}

// Options tune Read. The zero value detects everything and substitutes
// half the detection limit for non-detects.
type Options struct {
	NonDetect NonDetectPolicy
	// ColumnMap maps a header (matched without regard to case and
	// surrounding spaces) to a parameter key ("Ca", "Alk", "SampleID",
	// "WellID", "pHField", ...) or to a header-like spelling with a unit
	// ("Ca (ug/L)", "Alkalinity as CaCO3"); "-" or "ignore" keeps the
	// column unmapped. See ReadColumnMap.
	ColumnMap map[string]string
	// Delimiter forces the field delimiter; 0 detects comma, semicolon,
	// tab or '|'.
	Delimiter rune
	// DecimalSep forces '.' or ','; 0 detects a decimal comma (only in
	// files not delimited by commas).
	DecimalSep rune
	// EPSG is the coordinate reference system of easting/northing columns
	// when the file has no EPSG column.
	EPSG int
	// MaxBytes limits how much is read (0: 256 MiB).
	MaxBytes int64
}
