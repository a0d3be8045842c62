package sitereport

import (
	"encoding/csv"
	"errors"
	"fmt"
	"io"
	"runtime"
	"strconv"
	"strings"

	"gwsat.dev/gwsat/assess"
	"gwsat.dev/gwsat/geo"
	"gwsat.dev/gwsat/hydro"
	"gwsat.dev/gwsat/report"
	"gwsat.dev/gwsat/site"
)

// compactJSON reports whether samples.json of a report of n rows is written
// compact, one sample per line: above MaxPageRows rows, where the indented
// form would be mostly spaces (about 40 % of 2 GB on 100,000 rows) and nobody
// reads it by eye.
func compactJSON(n int) bool { return n > MaxPageRows }

// MaxPageRows is the most sample rows shown in the tables (and problem rows
// in the checks list) of index.html: a page of more rows is too heavy to open
// and nobody reads it; the files hold every row.
const MaxPageRows = 2000

// writeSamplesCSV writes the sample table, one record at a time, as
// report.SampleTable and Table.WriteCSV would (the same bytes) without
// holding the whole table.
func writeSamplesCSV(w io.Writer, recs []assess.Record, cols report.Columns) error {
	cw := csv.NewWriter(w)
	if err := cw.Write(cols.Header()); err != nil {
		return err
	}
	for i := range recs {
		if err := cw.Write(cols.Row(&recs[i])); err != nil {
			return err
		}
	}
	cw.Flush()
	return cw.Error()
}

// MappingTable is the column report: how each input header was understood.
func MappingTable(batches []*hydro.Batch) *report.Table {
	t := &report.Table{Header: []string{"file", "column", "header", "parameter", "unit", "note"}}
	for _, b := range batches {
		for _, m := range b.Mapping {
			t.Add(report.Text(b.File), strconv.Itoa(m.Column), report.Text(m.Header), m.Param, report.Text(m.Unit), report.Text(m.Note))
		}
	}
	return t
}

func surfacesTable(st *site.Site) *report.Table {
	t := &report.Table{Header: []string{"mineral", "depth_zone", "round", "method", "wells", "loo_cv_rmse_si", "surface_drawn", "note"}}
	if st == nil {
		return t
	}
	for _, s := range st.Surfaces {
		t.Add(s.Mineral, report.Text(s.Zone), report.Text(s.Round), s.Method, strconv.Itoa(s.Wells), report.Cond(s.HasCV, report.Num(s.CVRMSE, 3)), yesNo(s.Drawn), report.Text(s.Note))
	}
	return t
}

func unplacedNote(st *site.Site) []string {
	if st == nil || len(st.Unplaced) == 0 {
		return nil
	}
	n := st.Unplaced
	more := ""
	if len(n) > 10 {
		more = fmt.Sprintf(" and %d more", len(n)-10)
		n = n[:10]
	}
	return []string{fmt.Sprintf("Left off the maps (kept in the tables): %s%s.", strings.Join(n, "; "), more)}
}

// keyColumns are the columns of the compact key table besides the
// saturation indices of the key minerals.
var keyColumns = []string{"sample_id", "well_id", "round", "status", "depth_m", "ph", "charge_balance_pct"}

// maxKeyMinerals caps the minerals of the key table so that it fits a
// portrait page.
const maxKeyMinerals = 7

// keyMinerals are the minerals of the key table: those the maps show (their
// SI crosses zero on site), else the first of the data.
func keyMinerals(st *site.Site, all []string) []string {
	var key []string
	if st != nil {
		key = st.Minerals
	}
	if len(key) == 0 {
		key = all
	}
	if len(key) > maxKeyMinerals {
		key = key[:maxKeyMinerals]
	}
	return key
}

// keyTable is the compact table of every sample with the SI of the key
// minerals.
func keyTable(t *report.Table, minerals []string) *report.PageTable {
	cols := append([]string(nil), keyColumns...)
	for _, m := range minerals {
		cols = append(cols, report.ColumnName(m))
	}
	return report.NewPageTable(t, "", cols)
}

// analytesPerTable is the number of analytes (three columns each) per printed
// table.
const analytesPerTable = 4

// siGroupSize is the number of SI columns per printed table (with the
// sample id, it fits a landscape page at 6.5 pt).
const siGroupSize = 9

// fullTables splits the sample table into groups of columns, each with the
// sample id, and adds the surfaces table and the column report.
func fullTables(t, surf, cols *report.Table, minerals []string) []*report.PageTable {
	groups := []report.ColumnGroup{
		{Caption: "Samples: where and when", Columns: []string{"file", "line", "well_id", "round", "event", "sampled_at", "latitude", "longitude",
			"easting_m", "northing_m", "epsg", "depth_m", "screen_top_m", "screen_bottom_m", "ground_elev_m"}},
		{Caption: "Samples: checks", Columns: []string{"status", "reasons", "temp_c", "ph", "ph_source", "tds_mg_l", "density_kg_l", "density_source",
			"nondetects_substituted", "cations_meq_l", "anions_meq_l", "charge_balance_pct", "balance_status"}},
		{Caption: "Samples: field readings and redox", Columns: []string{"temp_source", "field_sheet_line", "dissolved_oxygen_mg_l", "eh_mv", "orp_mv", "pe", "pe_source"}},
		{Caption: "Samples: speciation", Columns: []string{"model", "ionic_strength_mol_kgw", "log_pco2_atm", "charge_balance_speciated_pct",
			"langelier_si", "ryznar_si", "larson_skold"}},
	}
	// Analytes as reported, with their unit and in mg/L, a few to a table.
	var analytes [][]string
	for _, h := range t.Header {
		if k, ok := strings.CutSuffix(h, "_reported"); ok {
			analytes = append(analytes, []string{h, k + "_unit", k + "_mg_l"})
		}
	}
	for i := 0; i < len(analytes); i += analytesPerTable {
		j := min(i+analytesPerTable, len(analytes))
		var cols []string
		for _, a := range analytes[i:j] {
			cols = append(cols, a...)
		}
		groups = append(groups, report.ColumnGroup{Caption: fmt.Sprintf("Samples: analytes as reported and in mg/L (%d of %d)", i/analytesPerTable+1, (len(analytes)+analytesPerTable-1)/analytesPerTable), Columns: cols})
	}
	var si []string
	for _, m := range minerals {
		si = append(si, report.ColumnName(m))
	}
	for i := 0; i < len(si); i += siGroupSize {
		j := min(i+siGroupSize, len(si))
		groups = append(groups, report.ColumnGroup{Caption: fmt.Sprintf("Samples: saturation indices (%d of %d)", i/siGroupSize+1, (len(si)+siGroupSize-1)/siGroupSize), Columns: si[i:j]})
	}
	out := report.SplitColumns(t, []string{"sample_id"}, groups, "Samples: other input columns, as read")
	if len(surf.Rows) > 0 {
		pt := report.NewPageTable(surf, "Interpolated surfaces of the maps (surfaces.csv)", nil)
		pt.Wide = true
		out = append(out, pt)
	}
	if len(cols.Rows) > 0 {
		pt := report.NewPageTable(cols, "How each input column was read (columns.csv)", nil)
		pt.Wide = true
		out = append(out, pt)
	}
	return out
}

func yesNo(b bool) string {
	if b {
		return "yes"
	}
	return "no"
}

// sampleColumns are the columns of the sample table: from the rows read
// (report.ColumnsFor), or from the files' header mappings when the inputs
// were streamed and the batches hold no rows.
func sampleColumns(batches []*hydro.Batch, minerals []string) report.Columns {
	for _, b := range batches {
		if len(b.Rows) > 0 {
			return report.ColumnsFor(batches, minerals)
		}
	}
	return report.ColumnsFromHeaders(batches, minerals)
}

// samplesChunk is how many records writeSamples holds (with their detail)
// while their JSON is encoded in parallel.
const samplesChunk = 256

// ErrInputChanged is a report input that changed between its two readings.
var ErrInputChanged = errors.New("the input changed while the report was being made (its second reading differs from the first); make the report again")

// rowKey names a row of the first reading of a report's inputs.
type rowKey struct {
	file, id string
	line     int
}

// rowKeys are the keys of recs, kept when the records themselves are let go.
func rowKeys(recs []assess.Record) []rowKey {
	k := make([]rowKey, len(recs))
	for i := range recs {
		k[i] = rowKey{file: recs[i].File, id: recs[i].Row.Sample.ID, line: recs[i].Row.Line}
	}
	return k
}

// writeSamples writes samples.csv, samples.json and samples.geojson from the
// records reassess yields (Options.Reassess); compact writes samples.json in
// its compact form (report.JSONWriter.Compact). first are the rows of the
// first reading: the second must yield the same rows (file, line and sample id,
// in order), or the input changed in between and ErrInputChanged is returned.
func writeSamples(cw, jw, gw io.Writer, reassess func(emit func(*assess.Record) error) error, cols report.Columns, minerals []string, compact bool, first []rowKey) error {
	c := csv.NewWriter(cw)
	if err := c.Write(cols.Header()); err != nil {
		return err
	}
	js := report.NewJSONWriter(jw)
	js.Compact = compact
	gs := geo.NewSampleWriter(gw)
	var chunk []assess.Record
	flush := func() error {
		if err := js.WriteAll(chunk, runtime.GOMAXPROCS(0)); err != nil {
			return err
		}
		chunk = chunk[:0]
		return nil
	}
	n := 0
	err := reassess(func(r *assess.Record) error {
		if n >= len(first) || first[n] != (rowKey{file: r.File, id: r.Row.Sample.ID, line: r.Row.Line}) {
			return fmt.Errorf("%w: %s line %d", ErrInputChanged, r.File, r.Row.Line)
		}
		n++
		if err := c.Write(cols.Row(r)); err != nil {
			return err
		}
		if err := gs.Write(report.SampleFeature(r, minerals)); err != nil {
			return err
		}
		chunk = append(chunk, *r)
		if len(chunk) == samplesChunk {
			return flush()
		}
		return nil
	})
	if err == nil && n != len(first) {
		err = fmt.Errorf("%w: %d rows the first time, %d the second", ErrInputChanged, len(first), n)
	}
	if err == nil {
		err = flush()
	}
	if err != nil {
		return err
	}
	c.Flush()
	if err := c.Error(); err != nil {
		return err
	}
	if err := js.Close(); err != nil {
		return err
	}
	return gs.Close()
}
