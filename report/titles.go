package report

import (
	"strings"

	"gwsat.dev/gwsat/speciation"
)

// columnTitles are the headings index.html shows for the columns of gwsat's
// tables: words, with the unit in brackets. The CSV files keep the short
// machine names (stable for programs); the page shows these.
var columnTitles = map[string]string{
	// Sample table (SampleColumns).
	"file":                         "File",
	"line":                         "Line",
	"sample_id":                    "Sample",
	"well_id":                      "Well",
	"round":                        "Round",
	"status":                       "Status",
	"reasons":                      "Reasons",
	"latitude":                     "Latitude (°, WGS84)",
	"longitude":                    "Longitude (°, WGS84)",
	"easting_m":                    "Easting (m)",
	"northing_m":                   "Northing (m)",
	"epsg":                         "EPSG code",
	"depth_m":                      "Depth (m below ground)",
	"screen_top_m":                 "Screen top (m below ground)",
	"screen_bottom_m":              "Screen bottom (m below ground)",
	"ground_elev_m":                "Ground elevation (m)",
	"temp_c":                       "Temperature (°C)",
	"ph":                           "pH",
	"ph_source":                    "pH source",
	"tds_mg_l":                     "TDS (mg/L)",
	"density_kg_l":                 "Density (kg/L)",
	"density_source":               "Density source",
	"nondetects_substituted":       "Non-detects substituted",
	"cations_meq_l":                "Cations (meq/L)",
	"anions_meq_l":                 "Anions (meq/L)",
	"charge_balance_pct":           "Charge balance (%)",
	"balance_status":               "Balance check",
	"model":                        "Activity model",
	"ionic_strength_mol_kgw":       "Ionic strength (mol/kg water)",
	"log_pco2_atm":                 "log pCO₂ (atm)",
	"charge_balance_speciated_pct": "Charge balance after speciation (%)",
	"langelier_si":                 "Langelier index",
	"ryznar_si":                    "Ryznar index",
	"larson_skold":                 "Larson-Skold index",
	"event":                        "Event",
	"sampled_at":                   "Sampled at",
	"temp_source":                  "Temperature source",
	"field_sheet_line":             "Field sheet line",
	"dissolved_oxygen_mg_l":        "Dissolved oxygen (mg/L)",
	"eh_mv":                        "Eh (mV)",
	"orp_mv":                       "ORP (mV)",
	"pe":                           "pe (-log10 electron activity)",
	"pe_source":                    "pe source",
	// Surfaces table.
	"mineral":        "Mineral",
	"depth_zone":     "Depth zone",
	"method":         "Interpolation",
	"wells":          "Wells",
	"loo_cv_rmse_si": "Leave-one-out error (RMSE, SI units)",
	"surface_drawn":  "Surface drawn",
	"note":           "Note",
	// Injection planning.
	"injectate_share":        "Injectate share (by mass of water)",
	"injectate_share_at_max": "Injectate share at the peak",
	"temp_c_at_max":          "Temperature at the peak (°C)",
	"max_si":                 "Peak SI",
	"state_at_max":           "State at the peak",
	"alkalinity_meq_kgw":     "Alkalinity (meq/kg water)",
	"si_before":              "SI before",
	"alone_mmol_kgw":         "Alone (mmol/kg water)",
	"alone_mg_l":             "Alone (mg/L)",
	"together_mmol_kgw":      "Together (mmol/kg water)",
	"together_mg_l":          "Together (mg/L)",
	"blend":                  "Blend",
	"native_water":           "Native water",
	"zone":                   "Zone",
	"worst_share":            "Worst share of water (1)",
	"worst_mineral":          "Most supersaturated mineral",
	"worst_si":               "Its SI",
	"deposit_mg_l":           "Deposit to equilibrium (mg/L)",
	// Column report.
	"column":    "Column",
	"header":    "Header as read",
	"parameter": "Understood as",
	"unit":      "Unit",
}

// ColumnTitle returns the heading index.html shows for a table column: a
// title in words with its unit, "<mineral> SI" for a saturation-index column
// (ColumnName) of a mineral of the embedded data, or the name itself when
// gwsat has no title for it.
func ColumnTitle(col string) string {
	if t, ok := columnTitles[col]; ok {
		return t
	}
	if IsSIColumn(col) {
		return mineralOfColumn(col) + " SI"
	}
	for _, a := range analyteOrder {
		k := strings.ToLower(a)
		switch col {
		case k + "_reported":
			return a + " as reported"
		case k + "_unit":
			return a + " unit as reported"
		case k + "_mg_l":
			return a + " (mg/L)"
		}
	}
	return col
}

// mineralOfColumn names the mineral of a saturation-index column, from the
// embedded data when it holds it, else from the column name.
func mineralOfColumn(col string) string {
	if db, err := speciation.Default(); err == nil {
		for _, m := range db.Minerals() {
			if ColumnName(m.Name) == col {
				return m.Name
			}
		}
	}
	return strings.ReplaceAll(strings.TrimSuffix(col, "_si"), "_", " ")
}

// IsSIValueColumn reports whether the cells of a column are saturation
// indices, shown on the page with their state (SICell): a mineral's SI
// column, or the SI columns of the injection tables.
func IsSIValueColumn(col string) bool {
	return IsSIColumn(col) || col == "max_si" || col == "si_before" || col == "worst_si"
}
