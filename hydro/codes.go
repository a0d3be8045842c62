package hydro

// Code names the kind of a row issue, stably, for programs: downstream code
// switches on Issue.Code and never on the wording of Issue.Message, which
// may change. The values are kebab-case words of our own.
type Code string

// Codes of the issues Read, ReadExcel, JoinFieldSheet and Sample.Water
// attach to rows.
const (
	// The row as a whole.
	CodeRaggedRow     Code = "ragged-row"
	CodeQuoting       Code = "quoting-error"
	CodeEmptySampleID Code = "empty-sample-id"
	CodeDuplicateID   Code = "duplicate-sample-id"
	CodeWellApart     Code = "well-id-places-apart"

	// One cell.
	CodeNotNumber       Code = "not-a-number"
	CodeAmbiguousNumber Code = "ambiguous-number"
	CodeUnknownUnit     Code = "unknown-unit"
	CodeUnitNotUsable   Code = "unit-not-usable"
	CodeUnitAssumed     Code = "unit-assumed"
	CodeNegative        Code = "negative-value"
	CodeOutOfRange      Code = "out-of-range"
	CodeImplausible     Code = "implausible-value"
	CodeMissing         Code = "missing-value"
	CodeNonDetect       Code = "non-detect"
	CodeNonDetectNoDL   Code = "non-detect-without-limit"
	CodeGreaterThan     Code = "greater-than"
	CodeQualifier       Code = "lab-qualifier"
	CodeBadLimit        Code = "bad-detection-limit"
	CodeBadDate         Code = "unreadable-date"
	CodeAmbiguousDate   Code = "ambiguous-date"
	CodeBadEPSG         Code = "bad-epsg"
	CodeScreen          Code = "screen-interval"
	CodeCoordinate      Code = "coordinate-out-of-range"
	CodePerMassUnit     Code = "per-mass-unit"
	CodeNaPlusK         Code = "sodium-plus-potassium"
	CodeSiteTemp        Code = "site-temperature"
	CodeFieldSheet      Code = "field-sheet"

	// The long shape.
	CodeConflict         Code = "conflicting-value"
	CodeRepeated         Code = "repeated-parameter"
	CodeNoParameterName  Code = "no-parameter-name"
	CodeUnknownParameter Code = "unknown-parameter"

	// Conversion to molality (Sample.Water).
	CodeNoWater         Code = "no-water"
	CodeDensityEstimate Code = "density-estimated"
	CodeNotComponent    Code = "not-a-component"
	CodeConversion      Code = "conversion-failed"
)
