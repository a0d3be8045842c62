package hydro

import (
	"fmt"
	"strconv"
	"strings"
	"time"
)

// Severity ranks a row issue.
type Severity int

const (
	// Info notes something the reader did on purpose (a substituted
	// non-detect, a default unit); the row stays ok.
	Info Severity = iota
	// Warning marks a value that was used but deserves a look (a duplicate
	// sample id, a multi-interval screen); the row status becomes warning.
	Warning
	// Error marks a value that could not be used (non-numeric or negative
	// concentration, pH outside 0-14, unknown unit, ragged row); the row
	// status becomes rejected.
	Error
)

func (s Severity) String() string {
	switch s {
	case Info:
		return "info"
	case Warning:
		return "warning"
	case Error:
		return "error"
	}
	return fmt.Sprintf("Severity(%d)", int(s))
}

// Status is the verdict on one row.
type Status string

const (
	StatusOK       Status = "ok"
	StatusWarning  Status = "warning"
	StatusRejected Status = "rejected"
)

// Issue is one finding about a row. Column is the header of the column it
// concerns, empty for the row as a whole.
//
// Line is the file line the issue was found on when that differs from the
// row's own line (a later line of a long-shape sample), else 0.
type Issue struct {
	Severity Severity
	// Code says what kind of issue it is, for programs (see the CodeXxx
	// constants); Message says it for people.
	Code    Code
	Column  string
	Message string
	Line    int
}

func (i Issue) String() string {
	var b strings.Builder
	b.WriteString(i.Severity.String())
	b.WriteString(": ")
	if i.Line > 0 {
		b.WriteString("line ")
		b.WriteString(strconv.Itoa(i.Line))
		b.WriteString(": ")
	}
	if i.Column != "" {
		b.WriteString("column ")
		b.WriteString(strconv.Quote(i.Column)) // as fmt's %q
		b.WriteString(": ")
	}
	b.WriteString(i.Message)
	return b.String()
}

// Shape is the layout of a lab file.
type Shape int

const (
	// Wide: one row per sample, one column per parameter.
	Wide Shape = iota
	// Long: one row per sample and parameter (sample id, parameter, value,
	// unit, qualifier...).
	Long
)

func (s Shape) String() string {
	if s == Long {
		return "long"
	}
	return "wide"
}

// HeaderMapping reports how one column header was understood. Param is the
// parameter key ("Ca", "pH", "SampleID", ...) or "" when the column was kept
// unmapped in Sample.Extra. Unit is the unit taken from the header (or the
// default, see Note). For a long file the mapping covers the parameter names
// found in its parameter column too. Column is 1-based (for a long-shape
// parameter name, the parameter column).
//
// UnitSource says where the unit came from: UnitFromHeader, UnitFromUnitsRow,
// UnitFromColumnMap, UnitPerRow (a unit column gives it row by row),
// UnitAssumed (nothing gave one; rows using it get a warning unless
// Options.ConfirmUnits) or "" for columns without a unit.
type HeaderMapping struct {
	Column     int
	Header     string
	Param      string
	Unit       string
	UnitSource string
	Note       string
}

// Unit sources reported in HeaderMapping.UnitSource and
// Measurement.UnitSource.
const (
	UnitFromHeader    = "header"
	UnitFromUnitsRow  = "units row"
	UnitFromColumnMap = "column map"
	UnitFromCell      = "unit column"
	UnitPerRow        = "unit column, per row"
	UnitAssumed       = "assumed"
	UnitConfirmed     = "assumed, confirmed by the user"
)

// SkipKind says why a line above or under the header is not a sample.
type SkipKind string

const (
	// SkipPreamble: a line above the header (title, client, lab number).
	SkipPreamble SkipKind = "preamble"
	// SkipHeaderRow: a row under the header that only repeats it (cells
	// merged down over two rows).
	SkipHeaderRow SkipKind = "header continued"
	// SkipUnitsRow: the row under the header that gives the units.
	SkipUnitsRow SkipKind = "units row"
	// SkipLimitsRow: a row of detection or reporting limits under the
	// header (or under the units row).
	SkipLimitsRow SkipKind = "detection-limit row"
)

// SkippedLine is a non-empty line of the file that is not a sample: a
// preamble line, the units row or a detection-limit row.
type SkippedLine struct {
	Line  int
	Kind  SkipKind
	Cells []string
}

// Batch is the content of one lab file.
//
// HeaderLine is the line (CSV) or sheet row (workbook) of the header;
// Skipped lists the lines above it and the units and detection-limit rows
// under it, none of which is a sample; UnitsLine is the units row's line,
// 0 when there is none. DateOrder is the order the date column was read
// in ("day first", "month first", "" when no slash dates needed one).
type Batch struct {
	File         string
	Sheet        string
	Shape        Shape
	Delimiter    rune
	DecimalComma bool
	HeaderLine   int
	UnitsLine    int
	DateOrder    string
	Skipped      []SkippedLine
	Mapping      []HeaderMapping
	// Warnings are issues about the file as a whole (two columns with the
	// same meaning, CodeDuplicateColumn); Issue.Line is 0 and
	// Issue.Column names the column concerned.
	Warnings []Issue
	Rows     []Row
}

// Counts returns the number of rows per status.
func (b *Batch) Counts() map[Status]int {
	c := map[Status]int{StatusOK: 0, StatusWarning: 0, StatusRejected: 0}
	for _, r := range b.Rows {
		c[r.Status]++
	}
	return c
}

// Row is one sample as read, with its verdict. Line is the 1-based line of
// the row in the file (for the long shape, the first line of the sample).
type Row struct {
	Line   int
	Sample Sample
	Status Status
	Issues []Issue
}

func (r *Row) add(sev Severity, code Code, line int, col, format string, args ...any) {
	if line == r.Line {
		line = 0
	}
	r.Issues = append(r.Issues, Issue{Severity: sev, Code: code, Column: col, Line: line, Message: fmt.Sprintf(format, args...)})
}

// settle sets Status from the worst issue.
func (r *Row) settle() {
	worst := Info
	for _, is := range r.Issues {
		if is.Severity > worst {
			worst = is.Severity
		}
	}
	switch {
	case worst >= Error:
		r.Status = StatusRejected
	case worst == Warning:
		r.Status = StatusWarning
	default:
		r.Status = StatusOK
	}
}

// Value is an optional number: OK is false when the value was not reported
// (an empty cell or no such column), which is different from a reported zero.
type Value struct {
	V  float64
	OK bool
}

// Some returns a present Value.
func Some(v float64) Value { return Value{V: v, OK: true} }

// Get returns the value and whether it is present.
func (v Value) Get() (float64, bool) { return v.V, v.OK }

func (v Value) String() string {
	if !v.OK {
		return ""
	}
	return fmt.Sprint(v.V)
}

// Sample is one water sample as reported by the lab, with every number in
// the unit the lab used except where a field name carries its unit (DepthM,
// TempC...), which the reader converts to.
type Sample struct {
	ID     string
	WellID string
	// Round is the sampling round, event or campaign.
	Round string
	// Event is the sampling event: Round when the file gives one, else
	// the sampling date (YYYY-MM-DD), else "". One well id on two events
	// is one well sampled twice, not a duplicate.
	Event string
	// SampledAt is the sampling date-time (zero when absent or unparsed);
	// SampledAtRaw keeps the cell as written.
	SampledAt    time.Time
	SampledAtRaw string

	Lat, Lon          Value // decimal degrees, WGS84 assumed
	Easting, Northing Value // projected metres
	EPSG              int   // from a column or Options.EPSG, 0 when unknown
	GroundElevM       Value
	DepthM            Value
	ScreenTopM        Value
	ScreenBottomM     Value
	ScreenRaw         string
	TempC             Value
	PH                Value
	PHSource          string // "field" or "lab"; "" when no pH
	PHField, PHLab    Value
	SpecCondUScm      Value // specific conductance, uS/cm
	TDSMgL            Value
	Density           Value // kg/L
	// DissolvedOxygenMgL, EhMV (against the standard hydrogen electrode)
	// and ORPMV (as read on the meter's own reference electrode) come
	// from field measurements.
	DissolvedOxygenMgL Value
	EhMV               Value
	ORPMV              Value
	// PE is a pe reported directly (dimensionless), as from a redox model.
	PE Value
	// PressureBar is the absolute pressure of the water in bar (a Pressure
	// column in bar, MPa, kPa, psi or atm), for the pressure correction of
	// mineral log K.
	PressureBar Value
	// TempSource says where TempC came from: TempFromLab, TempFromField
	// (a field sheet), TempFromSite (Options.SiteTempC) or "".
	TempSource string
	// FieldLine is the line of the field sheet joined to this sample, 0
	// when none.
	FieldLine int
	Analytes  map[string]Measurement
	// Extra holds the columns gwsat did not recognise, by header, with a
	// value; ExtraColumns holds all of them, blank ones too, in file
	// order, so that tables can print them as the user gave them.
	Extra        map[string]string
	ExtraColumns []ExtraColumn
}

// ExtraColumn is one cell of a column gwsat did not recognise.
type ExtraColumn struct {
	Header string
	Value  string
}

// Sources of Sample.TempSource and Sample.PHSource.
const (
	TempFromLab   = "lab file"
	TempFromField = "field sheet"
	TempFromSite  = "site temperature"
	PHFromField   = "field"
	PHFromLab     = "lab"
	PHFromSheet   = "field sheet"
)

// Measurement is one analyte result as reported.
type Measurement struct {
	// Value is in Unit. For a non-detect it is the value set by the
	// non-detect policy and Substituted is true.
	Value     float64
	Unit      Unit
	Raw       string
	Qualifier string
	NonDetect bool
	// DetectionLimit is the detection or reporting limit in Unit, 0 when
	// not given.
	DetectionLimit float64
	Substituted    bool
	// Param is the analyte key ("Ca", "Alk", ...); Column is the header
	// (wide) or parameter name (long) it came from.
	Param  string
	Column string
	// ReportedUnit is the unit text as the lab wrote it ("" when none);
	// UnitSource says where Unit came from (see HeaderMapping).
	ReportedUnit string
	UnitSource   string
	// MgPerL is the value in mg/L of the analyte's own formula (for
	// alkalinity, as CaCO3), converted with the sample's density; not OK
	// when it cannot be converted.
	MgPerL Value
	// SodiumPlusPotassium marks a sodium value that is Na and K reported
	// together (see the package documentation for the convention).
	SodiumPlusPotassium bool
}
