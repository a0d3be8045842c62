package report

import (
	"io"
	"math"
	"sort"
	"strconv"
	"strings"
	"unicode"

	"gwsat.dev/gwsat/assess"
	"gwsat.dev/gwsat/hydro"
	"gwsat.dev/gwsat/speciation"
)

// IsSIColumn reports whether a sample-table header is a mineral's saturation
// index (ColumnName), not one of the water-engineering indices.
func IsSIColumn(h string) bool {
	return strings.HasSuffix(h, "_si") && h != "langelier_si" && h != "ryznar_si" && h != "loo_cv_rmse_si"
}

// ColumnName returns the table column of a mineral's saturation index:
// the lower-case name with non-alphanumerics as underscores, then "_si"
// ("amorphous silica" becomes "amorphous_silica_si").
func ColumnName(mineral string) string {
	var b strings.Builder
	under := false
	for _, r := range strings.ToLower(mineral) {
		if unicode.IsLetter(r) || unicode.IsDigit(r) {
			b.WriteRune(r)
			under = false
		} else if !under {
			b.WriteByte('_')
			under = true
		}
	}
	return strings.TrimRight(b.String(), "_") + "_si"
}

// SolidMinerals lists the minerals (not gases) of a database, in file order.
func SolidMinerals(db *speciation.Database) []string {
	var out []string
	for _, m := range db.Minerals() {
		if !m.Gas {
			out = append(out, m.Name)
		}
	}
	return out
}

// SubstitutedAnalytes lists the analytes whose value came from the
// non-detect policy, sorted.
func SubstitutedAnalytes(s *hydro.Sample) []string {
	var out []string
	for k, m := range s.Analytes {
		if m.Substituted {
			out = append(out, k)
		}
	}
	sort.Strings(out)
	return out
}

// SampleColumns returns the fixed columns of the sample table, before the
// saturation-index columns. The README documents each.
func SampleColumns() []string { return append([]string(nil), sampleColumns...) }

var sampleColumns = []string{
	"file", "line", "sample_id", "well_id", "round", "event", "sampled_at", "status", "reasons",
	"latitude", "longitude", "easting_m", "northing_m", "epsg",
	"depth_m", "screen_top_m", "screen_bottom_m", "ground_elev_m",
	"temp_c", "temp_source", "ph", "ph_source", "field_sheet_line", "dissolved_oxygen_mg_l", "eh_mv", "orp_mv", "pe", "pe_source",
	"tds_mg_l", "density_kg_l", "density_source", "nondetects_substituted",
	"cations_meq_l", "anions_meq_l", "charge_balance_pct", "balance_status",
	"model", "ionic_strength_mol_kgw", "log_pco2_atm", "charge_balance_speciated_pct",
	"langelier_si", "ryznar_si", "larson_skold",
}

func opt(v hydro.Value, prec int) string {
	if !v.OK {
		return ""
	}
	return Num(v.V, prec)
}

// SampleTable builds the main table: one row per record, in order, with the
// columns of cols (see Columns).
func SampleTable(recs []assess.Record, cols Columns) *Table {
	t := &Table{Header: cols.Header()}
	for i := range recs {
		t.Rows = append(t.Rows, cols.Row(&recs[i]))
	}
	return t
}

// Row is the table row of one record.
func (c Columns) Row(r *assess.Record) []string {
	var sis []siValue
	if r.Result != nil {
		sis = lookupSIs(nil, r.Result, c.Minerals)
	}
	return c.appendRow(nil, r, strings.Join(r.Reasons(), "; "), sis)
}

// appendRow appends the table row of one record to row: reasons is the
// record's reasons joined, sis the saturation indices of c.Minerals
// (lookupSIs; nil without a result).
func (c Columns) appendRow(row []string, r *assess.Record, reasons string, sis []siValue) []string {
	s := r.Sample()
	row = append(row,
		Text(r.File), strconv.Itoa(r.Row.Line), Text(s.ID), Text(s.WellID), Text(s.Round), Text(s.Event), sampledAt(s),
		string(r.Status), Text(reasons),
		opt(s.Lat, 6), opt(s.Lon, 6), opt(s.Easting, 2), opt(s.Northing, 2), epsg(s.EPSG),
	)
	d, ok := assess.DepthM(s)
	row = append(row, Cond(ok, Num(d, 2)), opt(s.ScreenTopM, 2), opt(s.ScreenBottomM, 2), opt(s.GroundElevM, 2),
		opt(s.TempC, 1), s.TempSource, opt(s.PH, 2), s.PHSource, Cond(s.FieldLine > 0, strconv.Itoa(s.FieldLine)),
		opt(s.DissolvedOxygenMgL, 2), opt(s.EhMV, 0), opt(s.ORPMV, 0))
	if res := r.Result; res != nil && res.HasPE {
		row = append(row, Num(res.PE, 3), r.PESource)
	} else {
		row = append(row, "", "")
	}
	if r.Water.KgWaterPerL > 0 {
		row = append(row, Num(r.Water.TDSMgL, 0), Num(r.Water.DensityKgL, 4), r.Water.DensitySource)
	} else {
		row = append(row, "", "", "")
	}
	row = append(row, substituted(s))
	b := r.Balance
	if b.CationsMeqL > 0 || b.AnionsMeqL > 0 {
		row = append(row, Num(b.CationsMeqL, 3), Num(b.AnionsMeqL, 3), Num(b.ErrorPct, 2), string(b.Status))
	} else {
		row = append(row, "", "", "", "")
	}
	if res := r.Result; res == nil {
		row = append(row, "", "", "", "", "", "", "")
		for range c.Minerals {
			row = append(row, "")
		}
	} else {
		row = append(row, res.Model, Sig(res.IonicStrength, 6), Cond(res.HasLogPCO2, Num(res.LogPCO2, 4)), Num(res.ChargeBalance, 2),
			Cond(res.Indices.HasLangelier, Num(res.Indices.Langelier, 3)), Cond(res.Indices.HasLangelier, Num(res.Indices.Ryznar, 3)),
			Cond(res.Indices.HasLarsonSkold, Num(res.Indices.LarsonSkold, 3)))
		for _, si := range sis {
			row = append(row, Cond(si.ok, Full(si.v)))
		}
	}
	for _, a := range c.Analytes {
		m, ok := s.Analytes[a]
		if !ok {
			row = append(row, "", "", "")
			continue
		}
		unit := m.ReportedUnit
		if unit == "" {
			unit = m.Unit.String()
		}
		row = append(row, Text(m.Raw), Text(unit), Cond(m.MgPerL.OK, Full(m.MgPerL.V)))
	}
	for _, h := range c.Extra {
		row = append(row, Text(extraValue(s, h)))
	}
	return row
}

// substituted is the nondetects_substituted cell: the analytes whose value
// came from the non-detect policy, sorted, separated by spaces.
func substituted(s *hydro.Sample) string {
	for _, m := range s.Analytes {
		if m.Substituted {
			return strings.Join(SubstitutedAnalytes(s), " ")
		}
	}
	return ""
}

// siValue is a mineral's saturation index in a result, ok false when the
// result has none.
type siValue struct {
	v  float64
	ok bool
}

// lookupSIs appends to dst the saturation index in res of each of minerals,
// as res.SI gives it. A result lists its minerals once each, in data-set
// order, as the table's columns usually are: a cursor finds each in one
// comparison, and a mineral not at the cursor is looked up by res.SI.
func lookupSIs(dst []siValue, res *speciation.Result, minerals []string) []siValue {
	k := 0
	for _, m := range minerals {
		if k < len(res.Minerals) && res.Minerals[k].Name == m {
			dst = append(dst, siValue{res.Minerals[k].SI, true})
			k++
			continue
		}
		si, ok := res.SI(m)
		dst = append(dst, siValue{si, ok})
	}
	return dst
}

// sortedAnalytes lists a sample's analyte keys in the table's order.
func sortedAnalytes(s *hydro.Sample) []string {
	out := make([]string, 0, len(s.Analytes))
	for k := range s.Analytes {
		out = append(out, k)
	}
	sortAnalytes(out)
	return out
}

func sampledAt(s *hydro.Sample) string {
	if s.SampledAt.IsZero() {
		return ""
	}
	if s.SampledAt.Hour() == 0 && s.SampledAt.Minute() == 0 && s.SampledAt.Second() == 0 {
		return s.SampledAt.Format("2006-01-02")
	}
	return s.SampledAt.Format("2006-01-02T15:04:05")
}

func extraValue(s *hydro.Sample, header string) string {
	for _, x := range s.ExtraColumns {
		if x.Header == header {
			return x.Value
		}
	}
	return ""
}

func epsg(c int) string {
	if c == 0 {
		return ""
	}
	return strconv.Itoa(c)
}

// Cond returns s when ok, else the empty cell.
func Cond(ok bool, s string) string {
	if !ok {
		return ""
	}
	return s
}

// jsonNum is a float that marshals NaN and Inf as null, so that no
// non-number reaches a JSON output.
type jsonNum float64

func (f jsonNum) MarshalJSON() ([]byte, error) {
	v := float64(f)
	if math.IsNaN(v) || math.IsInf(v, 0) {
		return []byte("null"), nil
	}
	if v == 0 {
		return []byte("0"), nil // never -0
	}
	return strconv.AppendFloat(nil, v, 'g', -1, 64), nil // every digit
}

type jsonSpecies struct {
	Name     string  `json:"name"`
	Molality jsonNum `json:"molality_mol_kgw"`
	Gamma    jsonNum `json:"gamma"`
	Activity jsonNum `json:"activity"`
}

type jsonShare struct {
	Component string  `json:"component"`
	Species   string  `json:"species"`
	Percent   jsonNum `json:"percent"`
}

type jsonRecord struct {
	File     string             `json:"file"`
	Line     int                `json:"line"`
	Sample   string             `json:"sample_id"`
	Well     string             `json:"well_id,omitempty"`
	Round    string             `json:"round,omitempty"`
	Status   string             `json:"status"`
	Event    string             `json:"event,omitempty"`
	Sampled  string             `json:"sampled_at,omitempty"`
	Issues   []jsonIssue        `json:"issues"`
	Reported []jsonReported     `json:"reported,omitempty"`
	Extra    []jsonExtra        `json:"extra_columns,omitempty"`
	Balance  *jsonBalance       `json:"charge_balance,omitempty"`
	Water    map[string]jsonNum `json:"totals_mol_kgw,omitempty"`
	Alk      *jsonNum           `json:"alkalinity_eq_kgw,omitempty"`
	Result   *jsonResult        `json:"speciation,omitempty"`
	Error    string             `json:"speciation_error,omitempty"`
}

// jsonReported is an analyte as the lab reported it, and in mg/L.
type jsonReported struct {
	Analyte        string   `json:"analyte"`
	Column         string   `json:"column"`
	Value          string   `json:"value"`
	Unit           string   `json:"unit"`
	Qualifier      string   `json:"qualifier,omitempty"`
	DetectionLimit *jsonNum `json:"detection_limit,omitempty"`
	MgL            *jsonNum `json:"mg_l,omitempty"`
}

// jsonExtra is an input column gwsat did not recognise.
type jsonExtra struct {
	Header string `json:"header"`
	Value  string `json:"value"`
}

// jsonIssue is a typed finding about a row (hydro.Issue).
type jsonIssue struct {
	Severity string `json:"severity"`
	Code     string `json:"code,omitempty"`
	Column   string `json:"column,omitempty"`
	Line     int    `json:"line,omitempty"`
	Message  string `json:"message"`
}

type jsonBalance struct {
	Cations   jsonNum `json:"cations_meq_l"`
	Anions    jsonNum `json:"anions_meq_l"`
	ErrorPct  jsonNum `json:"error_pct"`
	Status    string  `json:"status"`
	Criterion string  `json:"criterion"`
	Complete  bool    `json:"complete"`
}

type jsonResult struct {
	Model         string             `json:"model"`
	TempC         jsonNum            `json:"temp_c"`
	PH            jsonNum            `json:"ph"`
	IonicStrength jsonNum            `json:"ionic_strength_mol_kgw"`
	LogPCO2       *jsonNum           `json:"log_pco2_atm,omitempty"`
	ChargeBalance jsonNum            `json:"charge_balance_pct"`
	SI            map[string]jsonNum `json:"saturation_index"`
	Langelier     *jsonNum           `json:"langelier_si,omitempty"`
	Ryznar        *jsonNum           `json:"ryznar_si,omitempty"`
	LarsonSkold   *jsonNum           `json:"larson_skold,omitempty"`
	Species       []jsonSpecies      `json:"species"`
	Distribution  []jsonShare        `json:"distribution"`
	Warnings      []string           `json:"warnings,omitempty"`
	Iterations    int                `json:"iterations"`
}

func ptr(ok bool, v float64) *jsonNum {
	if !ok {
		return nil
	}
	j := jsonNum(v)
	return &j
}

// WriteJSON writes every record with its full speciation as a JSON array.
func WriteJSON(w io.Writer, recs []assess.Record) error {
	return WriteJSONWith(w, recs, nil)
}

// WriteJSONWith is WriteJSON for records kept without their detail: detail,
// when not nil, gives each record with its full speciation as it is written
// (assess.Detailer.Record).
func WriteJSONWith(w io.Writer, recs []assess.Record, detail func(*assess.Record) *assess.Record) error {
	jw := NewJSONWriter(w)
	for i := range recs {
		r := &recs[i]
		if detail != nil {
			r = detail(r)
		}
		if err := jw.Write(r); err != nil {
			return err
		}
	}
	return jw.Close()
}

// jsonRecordOf is the JSON form of one record.
func jsonRecordOf(r *assess.Record) jsonRecord {
	s := r.Sample()
	issues := make([]jsonIssue, len(r.Issues))
	for k, is := range r.Issues {
		issues[k] = jsonIssue{Severity: is.Severity.String(), Code: string(is.Code), Column: is.Column, Line: is.Line, Message: is.Message}
	}
	jr := jsonRecord{File: r.File, Line: r.Row.Line, Sample: s.ID, Well: s.WellID, Round: s.Round, Event: s.Event, Sampled: sampledAt(s),
		Status: string(r.Status), Issues: issues, Error: r.SolveError}
	for _, k := range sortedAnalytes(s) {
		m := s.Analytes[k]
		unit := m.ReportedUnit
		if unit == "" {
			unit = m.Unit.String()
		}
		jr.Reported = append(jr.Reported, jsonReported{Analyte: k, Column: m.Column, Value: m.Raw, Unit: unit, Qualifier: m.Qualifier,
			DetectionLimit: ptr(m.DetectionLimit > 0, m.DetectionLimit), MgL: ptr(m.MgPerL.OK, m.MgPerL.V)})
	}
	for _, x := range s.ExtraColumns {
		jr.Extra = append(jr.Extra, jsonExtra{x.Header, x.Value})
	}
	if b := r.Balance; b.CationsMeqL > 0 || b.AnionsMeqL > 0 {
		jr.Balance = &jsonBalance{jsonNum(b.CationsMeqL), jsonNum(b.AnionsMeqL), jsonNum(b.ErrorPct), string(b.Status), b.Criterion, b.Complete}
	}
	if len(r.Water.Molal) > 0 {
		jr.Water = map[string]jsonNum{}
		for k, v := range r.Water.Molal {
			jr.Water[k] = jsonNum(v)
		}
		jr.Alk = ptr(r.Water.HasAlkalinity, r.Water.AlkalinityEqKgw)
	}
	if res := r.Result; res != nil {
		x := &jsonResult{Model: res.Model, TempC: jsonNum(res.TempC), PH: jsonNum(res.PH), IonicStrength: jsonNum(res.IonicStrength),
			LogPCO2: ptr(res.HasLogPCO2, res.LogPCO2), ChargeBalance: jsonNum(res.ChargeBalance), SI: map[string]jsonNum{},
			Langelier: ptr(res.Indices.HasLangelier, res.Indices.Langelier), Ryznar: ptr(res.Indices.HasLangelier, res.Indices.Ryznar),
			LarsonSkold: ptr(res.Indices.HasLarsonSkold, res.Indices.LarsonSkold), Warnings: res.Warnings, Iterations: res.Iterations}
		for _, m := range res.Minerals {
			x.SI[m.Name] = jsonNum(m.SI)
		}
		for _, sp := range res.Species {
			x.Species = append(x.Species, jsonSpecies{sp.Name, jsonNum(sp.Molality), jsonNum(sp.Gamma), jsonNum(sp.Activity)})
		}
		for _, sh := range res.Distribution {
			x.Distribution = append(x.Distribution, jsonShare{sh.Component, sh.Species, jsonNum(sh.Percent)})
		}
		jr.Result = x
	}
	return jr
}
