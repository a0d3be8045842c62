package report

import (
	"encoding/json"
	"io"
	"math"
)

// Methods is how a report was made: enough to reproduce it and to judge it.
// It is written as methods.json and shown in the page's methods section.
type Methods struct {
	Tool        Tool     `json:"tool"`
	CommandLine []string `json:"command_line"`
	Generated   string   `json:"generated_utc"`
	Inputs      []Input  `json:"inputs"`
	Thermo      Thermo   `json:"thermodynamic_data"`
	Activity    Activity `json:"activity_model"`
	// NonDetect is the policy for values below the detection limit.
	NonDetect string `json:"non_detect_policy"`
	// Units are the unit conversions and assumptions, one sentence each.
	Units []string `json:"unit_assumptions"`
	// Coordinates says which coordinate systems are read, mapped and written.
	Coordinates []string `json:"coordinate_systems"`
	// Interpolation describes the surfaces of the maps and their
	// leave-one-out cross-validation errors.
	Interpolation Interpolation `json:"interpolation"`
	// Thresholds are the reference values the report applies, each with its
	// source.
	Thresholds []Threshold `json:"thresholds"`
	// Sources are the publications and data behind the numbers.
	Sources []string `json:"sources"`
}

// Tool identifies the program that made the report.
type Tool struct {
	Name      string `json:"name"`
	Module    string `json:"module"`
	Version   string `json:"version"`
	Revision  string `json:"vcs_revision,omitempty"`
	Time      string `json:"vcs_time,omitempty"`
	Modified  bool   `json:"vcs_modified,omitempty"`
	GoVersion string `json:"go_version"`
}

// Input is an input file and its checksum.
type Input struct {
	File   string `json:"file"`
	Rows   int    `json:"rows"`
	SHA256 string `json:"sha256,omitempty"`
}

// Thermo identifies the thermodynamic data set.
type Thermo struct {
	Name     string `json:"name"`
	Format   string `json:"format_version"`
	SHA256   string `json:"sha256"`
	Bytes    int    `json:"bytes"`
	Minerals int    `json:"minerals"`
}

// Activity is the activity model and the ionic strength up to which it holds,
// and how many rows each model solved (the automatic choice picks per row).
type Activity struct {
	Name             string         `json:"name"`
	MaxIonicStrength float64        `json:"max_ionic_strength_mol_kgw"`
	Source           string         `json:"source"`
	RowsPerModel     map[string]int `json:"rows_per_model"`
}

// Interpolation summarises the interpolated surfaces.
type Interpolation struct {
	Requested string    `json:"requested_method"`
	Surfaces  int       `json:"surfaces"`
	WithCV    int       `json:"surfaces_with_cross_validation"`
	CVMinRMSE *float64  `json:"cv_rmse_si_min,omitempty"`
	CVMedian  *float64  `json:"cv_rmse_si_median,omitempty"`
	CVMaxRMSE *float64  `json:"cv_rmse_si_max,omitempty"`
	Methods   []string  `json:"methods_used"`
	Note      string    `json:"note"`
	Rows      []Surface `json:"per_surface"`
}

// Surface is one interpolated surface with its cross-validation error.
type Surface struct {
	Mineral string   `json:"mineral"`
	Zone    string   `json:"depth_zone"`
	Round   string   `json:"round"`
	Method  string   `json:"method"`
	Wells   int      `json:"wells"`
	CVRMSE  *float64 `json:"loo_cv_rmse_si,omitempty"`
}

// Threshold is a reference value with its source.
type Threshold struct {
	What   string  `json:"what"`
	Value  float64 `json:"value"`
	Unit   string  `json:"unit"`
	Source string  `json:"source"`
}

// Finite returns &v, or nil when v is NaN or Inf, for the optional numbers
// of Methods: no non-number reaches methods.json.
func Finite(v float64) *float64 {
	if math.IsNaN(v) || math.IsInf(v, 0) {
		return nil
	}
	return &v
}

// WriteMethodsJSON writes m as indented JSON.
func WriteMethodsJSON(w io.Writer, m *Methods) error {
	enc := json.NewEncoder(w)
	enc.SetIndent("", "  ")
	enc.SetEscapeHTML(false)
	return enc.Encode(m)
}
