package sitereport

import (
	"crypto/sha256"
	"encoding/hex"
	"fmt"
	"io"
	"os"
	"regexp"
	"runtime/debug"
	"sort"
	"strings"
	"time"

	"gwsat.dev/gwsat/assess"
	"gwsat.dev/gwsat/hydro"
	"gwsat.dev/gwsat/report"
	"gwsat.dev/gwsat/site"
	"gwsat.dev/gwsat/speciation"
)

// FileSHA256 returns the SHA-256 checksum of a file in hexadecimal, for
// Options.InputSHA256.
func FileSHA256(path string) (string, error) {
	f, err := os.Open(path)
	if err != nil {
		return "", err
	}
	defer f.Close()
	h := sha256.New()
	if _, err := io.Copy(h, f); err != nil {
		return "", fmt.Errorf("checksum of %s: %w", path, err)
	}
	return hex.EncodeToString(h.Sum(nil)), nil
}

// BytesSHA256 returns the SHA-256 checksum of b in hexadecimal.
func BytesSHA256(b []byte) string {
	s := sha256.Sum256(b)
	return hex.EncodeToString(s[:])
}

// toolInfo reads the program's build information (module version, VCS
// revision) from the binary.
func toolInfo() report.Tool {
	t := report.Tool{Name: "gwsat", Module: "gwsat.dev/gwsat", Version: "unknown (no build information)"}
	bi, ok := debug.ReadBuildInfo()
	if !ok {
		return t
	}
	t.GoVersion = bi.GoVersion
	if bi.Main.Path != "" {
		t.Module = bi.Main.Path
	}
	if bi.Main.Version != "" {
		t.Version = bi.Main.Version
	}
	for _, s := range bi.Settings {
		switch s.Key {
		case "vcs.revision":
			t.Revision = s.Value
		case "vcs.time":
			t.Time = s.Value
		case "vcs.modified":
			t.Modified = s.Value == "true"
		}
	}
	return t
}

var formatVersion = regexp.MustCompile(`format version (\S+?)\)?\s*$`)

// thermoInfo identifies the embedded thermodynamic data set by its format
// version (first line) and checksum.
func thermoInfo(db *speciation.Database) report.Thermo {
	text := speciation.Thermo()
	t := report.Thermo{Name: "gwsat thermodynamic data set (speciation/thermo.txt, embedded)", Format: "not stated",
		SHA256: BytesSHA256([]byte(text)), Bytes: len(text)}
	first := text
	for i, r := range text {
		if r == '\n' {
			first = text[:i]
			break
		}
	}
	if m := formatVersion.FindStringSubmatch(first); m != nil {
		t.Format = m[1]
	}
	if db != nil {
		t.Minerals = len(report.SolidMinerals(db))
	}
	return t
}

// modelSources names the publication of each activity model of package
// speciation (the package documents each).
var modelSources = map[string]string{
	"davies":          "Davies (1962), Ion Association",
	"truesdell-jones": "Truesdell & Jones (1974), J. Res. U.S. Geol. Survey 2(2), 233-248",
	"ideal":           "activity coefficients of one",
	"pitzer":          "Harvie, Moller & Weare (1984), GCA 48, 723-751, after Pitzer (1973)",
}

// nonDetectWords says what each non-detect policy substitutes.
func nonDetectWords(p hydro.NonDetectPolicy) string {
	switch p {
	case hydro.Zero:
		return "zero: a value reported below the detection limit counts as 0"
	case hydro.DL:
		return "dl: a value reported below the detection limit counts as the limit itself"
	}
	return "half-dl: a value reported below the detection limit counts as half the limit (common practice); " +
		"a non-detect without a stated limit counts as 0, with a warning on its row"
}

// unitAssumptions are the conversions every report relies on (package hydro
// does them; its documentation gives the details).
var unitAssumptions = []string{
	"Concentrations are read in the unit of each column header (mg/L, ug/L, mmol/L, meq/L) and converted to mol per kg of water.",
	"Litres become kilograms of water with the sample's density: measured when reported, else 1.000 + 7.0e-7 x TDS (mg/L) kg/L (common practice), else 1.000 kg/L; samples.csv names the source per row.",
	"Alkalinity reported as CaCO3 is converted with 100.086 g/mol and 2 equivalents per mole (IUPAC atomic weights, from memory); it is the total alkalinity to the carbonate end point.",
	"Nitrogen species reported as N are converted to the ion (NO3-N x 62.004/14.007, from memory).",
	"Temperature in °C; a sample without one is speciated at 25 °C with a warning (common practice).",
	"Depth in m below ground: the reported depth, else the screen midpoint, else the screen top.",
	"Saturation index SI = log10(IAP/K), no unit; log pCO2 in atm; charge balance in % of the sum of cations and anions (meq/L).",
}

var coordinateNotes = []string{
	"Input positions: latitude and longitude in WGS84 decimal degrees, or easting and northing with an EPSG code.",
	"Maps: a local transverse Mercator frame on WGS84 centred on the wells, metres east and north of the centre (scale error below 1e-5 over a well field).",
	"samples.geojson: RFC 7946, WGS84 longitude and latitude.",
}

// thresholds are the reference values the report applies, with their sources.
func thresholds(model speciation.ActivityModel) []report.Threshold {
	return []report.Threshold{
		{What: "Near-equilibrium band of the saturation index", Value: assess.NearEquilibriumBand, Unit: "SI units (±)", Source: "common practice: ±0.2 to ±0.5; gwsat uses 0.5 for routine field data"},
		{What: "Charge balance, anion sum 0-3.0 meq/L", Value: 0.2, Unit: "meq/L (absolute difference)", Source: "Standard Methods 1030 E, 23rd ed."},
		{What: "Charge balance, anion sum 3.0-10.0 meq/L", Value: 2, Unit: "%", Source: "Standard Methods 1030 E, 23rd ed."},
		{What: "Charge balance, anion sum 10-800 meq/L", Value: 5, Unit: "%", Source: "Standard Methods 1030 E, 23rd ed."},
		{What: "Measured/calculated TDS ratio, lower limit", Value: 1.0, Unit: "(no unit)", Source: "Standard Methods 1030 E"},
		{What: "Measured/calculated TDS ratio, upper limit", Value: 1.2, Unit: "(no unit)", Source: "Standard Methods 1030 E"},
		{What: "Charge balance after speciation, or with ions missing", Value: assess.SpeciatedBalanceLimitPct, Unit: "%", Source: "common practice"},
		{What: "Ionic strength up to which the " + model.Name() + " model is used", Value: model.MaxIonicStrength(), Unit: "mol/kg water", Source: modelSource(model)},
	}
}

func modelSource(m speciation.ActivityModel) string {
	if s, ok := modelSources[m.Name()]; ok {
		return s
	}
	return "see the documentation of package speciation"
}

// interpolationInfo summarises the surfaces of the maps with their
// leave-one-out cross-validation errors.
func interpolationInfo(requested string, st *site.Site) report.Interpolation {
	if requested == "" {
		requested = "kriging"
	}
	in := report.Interpolation{Requested: requested,
		Note: "Each map cell is interpolated from the wells of one mineral, depth zone and round; cells far from every well stay empty (no extrapolation). " +
			"The cross-validation error is the root mean square of the differences between each well's SI and the value interpolated without it."}
	if st == nil {
		return in
	}
	var cvs []float64
	methods := map[string]bool{}
	for _, s := range st.Surfaces {
		row := report.Surface{Mineral: s.Mineral, Zone: s.Zone, Round: s.Round, Method: s.Method, Wells: s.Wells}
		if s.HasCV {
			row.CVRMSE = report.Finite(s.CVRMSE)
			if row.CVRMSE != nil {
				cvs = append(cvs, s.CVRMSE)
			}
		}
		in.Rows = append(in.Rows, row)
		methods[methodFamily(s.Method)] = true
	}
	in.Surfaces = len(st.Surfaces)
	in.WithCV = len(cvs)
	for m := range methods {
		in.Methods = append(in.Methods, m)
	}
	sort.Strings(in.Methods)
	if len(cvs) > 0 {
		sort.Float64s(cvs)
		in.CVMinRMSE = report.Finite(cvs[0])
		in.CVMaxRMSE = report.Finite(cvs[len(cvs)-1])
		mid := cvs[len(cvs)/2]
		if len(cvs)%2 == 0 {
			mid = (cvs[len(cvs)/2-1] + mid) / 2
		}
		in.CVMedian = report.Finite(mid)
	}
	return in
}

// methodFamily shortens a surface's method ("ordinary kriging, spherical
// (nugget ...)") to its family ("ordinary kriging").
func methodFamily(m string) string {
	for i, r := range m {
		if r == ',' || r == '(' {
			return strings.TrimSpace(m[:i])
		}
	}
	return m
}

// buildMethods gathers the methods and provenance of a report.
// auto says the rows were solved with the automatic choice of model (see
// assess.AutoModelSwitch); opt.Model is then the model of the blends.
func buildMethods(opt Options, st *site.Site, when time.Time, auto bool) *report.Methods {
	m := &report.Methods{
		Tool:          toolInfo(),
		CommandLine:   opt.CommandLine,
		Generated:     when.UTC().Format(time.RFC3339),
		Thermo:        thermoInfo(opt.DB),
		Activity:      report.Activity{Name: opt.Model.Name(), MaxIonicStrength: opt.Model.MaxIonicStrength(), Source: modelSource(opt.Model)},
		NonDetect:     nonDetectWords(opt.NonDetect),
		Units:         unitAssumptions,
		Coordinates:   coordinateNotes,
		Interpolation: interpolationInfo(opt.Site.Method, st),
		Thresholds:    thresholds(opt.Model),
	}
	m.Activity.RowsPerModel = map[string]int{}
	for i := range opt.Records {
		if r := opt.Records[i].Result; r != nil {
			m.Activity.RowsPerModel[r.Model]++
		}
	}
	if auto {
		p := speciation.NewPitzer()
		m.Activity = report.Activity{
			Name: fmt.Sprintf("automatic per row: %s, %s above an ionic strength of %g mol/kg water (each row's model is in samples.csv); blends in the injection section: %s",
				opt.Model.Name(), p.Name(), assess.AutoModelSwitch, opt.Model.Name()),
			MaxIonicStrength: p.MaxIonicStrength(), Source: modelSource(opt.Model) + "; " + modelSource(p), RowsPerModel: m.Activity.RowsPerModel}
		m.Thresholds = append(m.Thresholds, report.Threshold{What: "Ionic strength above which a row is solved with " + p.Name(), Value: assess.AutoModelSwitch,
			Unit: "mol/kg water", Source: "departure of the extended Debye-Hueckel forms from measured mean activity coefficients, Robinson & Stokes (1959) tables"},
			report.Threshold{What: "Ionic strength up to which the " + p.Name() + " model is used", Value: p.MaxIonicStrength(), Unit: "mol/kg water", Source: modelSource(p)})
	}
	if len(m.CommandLine) == 0 {
		m.CommandLine = []string{"(not recorded: the report was made by a Go program calling sitereport.Write)"}
	}
	rows := map[string]int{}
	for i := range opt.Records {
		rows[opt.Records[i].File]++
	}
	for _, b := range opt.Batches {
		m.Inputs = append(m.Inputs, report.Input{File: b.File, Rows: rows[b.File], SHA256: opt.InputSHA256[b.File]})
	}
	m.Sources = []string{
		"Standard Methods for the Examination of Water and Wastewater, 1030 E (checking analyses' correctness), 23rd ed.",
		modelSource(opt.Model) + " (activity model)",
	}
	if opt.DB != nil {
		for _, mn := range opt.DB.Minerals() {
			if !mn.Gas && mn.Source != "" {
				m.Sources = append(m.Sources, fmt.Sprintf("%s log K: %s", mn.Name, mn.Source))
			}
		}
	}
	return m
}
