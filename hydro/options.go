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
	return HalfDL, fmt.Errorf("%w: unknown non-detect policy %q (want half-dl, zero or dl)", ErrOption, s)
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
	// ConfirmUnits says that analytes with no unit anywhere (header, units
	// row, unit column, column map) are indeed in mg/L, and that values the
	// plausibility guard finds far outside their usual range are in the
	// unit stated: such rows then get no warning for it (an info note for
	// the plausibility guard).
	ConfirmUnits bool
	// DateOrder reads slash dates (03/04/2025) day first or month first;
	// DateAuto decides from the column's values (a day above 12 settles
	// it) and leaves undecidable dates empty with a warning.
	DateOrder DateOrder
	// SiteTempC is the temperature given to samples reported without one
	// (groundwater is close to the mean annual air temperature of the
	// site: common practice); each such row gets an info note.
	SiteTempC Value
	// Sheet picks a workbook's sheet by name or by 1-based number; "" is
	// the first sheet. CSV input ignores it.
	Sheet string
	// DetectionLimits gives detection limits by column header (matched
	// without regard to case), in the column's unit, for non-detects
	// written without a number ("ND", "<LOR").
	DetectionLimits map[string]float64
}

// DateOrder is the order of day and month in slash dates.
type DateOrder int

const (
	// DateAuto decides per column from the values.
	DateAuto DateOrder = iota
	// DayFirst reads 03/04/2025 as 3 April 2025.
	DayFirst
	// MonthFirst reads 03/04/2025 as 4 March 2025.
	MonthFirst
)

func (d DateOrder) String() string {
	switch d {
	case DayFirst:
		return "day first"
	case MonthFirst:
		return "month first"
	}
	return "auto"
}

// ParseDateOrder reads "auto", "day-first" (or "dmy") and "month-first"
// (or "mdy").
func ParseDateOrder(s string) (DateOrder, error) {
	switch strings.ToLower(strings.TrimSpace(s)) {
	case "", "auto":
		return DateAuto, nil
	case "day-first", "dayfirst", "dmy", "day":
		return DayFirst, nil
	case "month-first", "monthfirst", "mdy", "month":
		return MonthFirst, nil
	}
	return DateAuto, fmt.Errorf("%w: unknown date order %q (want auto, day-first or month-first)", ErrOption, s)
}
