package main

import (
	"bytes"
	"fmt"
	"math"
	"strconv"
	"strings"
	"unicode/utf8"

	"github.com/spf13/pflag"

	"gwsat.dev/gwsat/assess"
	"gwsat.dev/gwsat/data"
	"gwsat.dev/gwsat/hydro"
	"gwsat.dev/gwsat/internal/progress"
	"gwsat.dev/gwsat/speciation"
)

// DemoFile is the name the embedded demo samples carry in outputs, and
// DemoFieldSheet that of its field sheet.
const (
	DemoFile       = "demo/samples.csv"
	DemoFieldSheet = "demo/field.csv"
)

// inputFlags are the flags shared by every command that reads lab files.
type inputFlags struct {
	demo       bool
	nondetect  string
	columnMap  string
	epsg       int
	model      string
	closeWith  string
	unitsOK    bool
	dateOrder  string
	siteTemp   float64
	sheet      string
	limits     []string
	fieldSheet string
	delimiter  string
	decimal    string
	orpRef     string
	pressure   string
}

func (f *inputFlags) register(fs *pflag.FlagSet) {
	fs.BoolVar(&f.demo, "demo", false, "read the embedded demo data set (invented) instead of files")
	fs.StringVar(&f.nondetect, "nondetect", "half", "value used for a non-detect: half (half the detection limit), dl (the limit) or zero")
	fs.StringVar(&f.columnMap, "column-map", "", "CSV file mapping headers to parameters (two columns: header,parameter)")
	fs.IntVar(&f.epsg, "epsg", 0, "EPSG code of easting/northing columns when the file has none (e.g. 32633)")
	fs.StringVar(&f.model, "model", "auto", "activity model: auto (Truesdell-Jones, Pitzer for brines above ionic strength 0.5 mol/kg), "+strings.Join(speciation.ModelNames(), ", "))
	fs.StringVar(&f.closeWith, "close-balance-with", "", "adjust this ion (e.g. Cl or Na) so the speciated water is electrically neutral")
	fs.BoolVar(&f.unitsOK, "units-confirmed", false, "analytes without a unit anywhere are in mg/L, and values outside their usual range are in the unit stated: no warning for either")
	fs.StringVar(&f.dateOrder, "date-order", "auto", "order of day and month in slash dates: auto (decided per column from the values), day-first or month-first")
	fs.Float64Var(&f.siteTemp, "site-temperature", math.NaN(), "temperature in C for samples reported without one (e.g. the site's mean annual air temperature)")
	fs.Lookup("site-temperature").DefValue = "none"
	fs.StringVar(&f.sheet, "sheet", "", "workbook sheet to read, by name or 1-based number (default: the first)")
	fs.StringArrayVar(&f.limits, "detection-limit", nil, "detection limit for non-detects written without a number, as HEADER=VALUE in the column's unit (repeatable)")
	fs.StringVar(&f.delimiter, "delimiter", "", "force the field delimiter: a single character, or 'tab' (default: detected)")
	fs.StringVar(&f.decimal, "decimal", "", "force the decimal separator: '.' or ',' (default: detected)")
	fs.StringVar(&f.orpRef, "orp-electrode", "", "reference electrode of ORP readings, to convert them to Eh: e.g. 'Ag/AgCl sat KCl', 'Ag/AgCl 3M KCl', 'calomel sat' (default: ORP not used)")
	fs.StringVar(&f.pressure, "pressure", "", "absolute pressure for the mineral log K of rows without a Pressure column: a number in bar, or with a unit (25MPa, 3600psi, atm, kPa), or 'hydrostatic' (1 bar + 0.0981 bar per metre of sample depth); default 1 bar")
	fs.StringVar(&f.fieldSheet, "field-sheet", "", "a file of field measurements (pH, temperature, conductance, dissolved oxygen, Eh/ORP) joined to the lab rows on sample id, or on well id and date")
}

// options builds the reader's options from the flags.
func (f *inputFlags) options() (hydro.Options, error) {
	nd, err := hydro.ParseNonDetectPolicy(f.nondetect)
	if err != nil {
		return hydro.Options{}, fmt.Errorf("--nondetect: %w", err)
	}
	order, err := hydro.ParseDateOrder(f.dateOrder)
	if err != nil {
		return hydro.Options{}, fmt.Errorf("--date-order: %w", err)
	}
	opt := hydro.Options{NonDetect: nd, EPSG: f.epsg, ConfirmUnits: f.unitsOK, DateOrder: order, Sheet: f.sheet}
	switch d := f.delimiter; {
	case d == "":
	case strings.EqualFold(d, "tab") || d == "\\t":
		opt.Delimiter = '\t'
	case utf8.RuneCountInString(d) == 1 && d != "\"" && d != "\n" && d != "\r":
		opt.Delimiter, _ = utf8.DecodeRuneInString(d)
	default:
		return hydro.Options{}, fmt.Errorf("--delimiter %q: give one character, or tab", d)
	}
	switch f.decimal {
	case "":
	case ".", ",":
		opt.DecimalSep = rune(f.decimal[0])
	default:
		return hydro.Options{}, fmt.Errorf("--decimal %q: give . or ,", f.decimal)
	}
	if !math.IsNaN(f.siteTemp) {
		if _, err := parseTemp(strconv.FormatFloat(f.siteTemp, 'g', -1, 64)); err != nil {
			return hydro.Options{}, fmt.Errorf("--site-temperature: %w", err)
		}
		opt.SiteTempC = hydro.Some(f.siteTemp)
	}
	if f.columnMap != "" {
		m, err := hydro.LoadColumnMap(f.columnMap)
		if err != nil {
			return hydro.Options{}, fmt.Errorf("--column-map: %w", err)
		}
		m.Apply(&opt)
	}
	for _, l := range f.limits {
		h, v, ok := strings.Cut(l, "=")
		x, err := strconv.ParseFloat(strings.TrimSpace(v), 64)
		if !ok || err != nil || !(x > 0) || math.IsInf(x, 0) {
			return hydro.Options{}, fmt.Errorf("--detection-limit %q: want HEADER=VALUE with a positive number", l)
		}
		if opt.DetectionLimits == nil {
			opt.DetectionLimits = map[string]float64{}
		}
		opt.DetectionLimits[strings.TrimSpace(h)] = x
	}
	return opt, nil
}

// readInputs reads the files named in args ("-" for standard input), or the
// demo. A file-level error (not CSV, no sample id column...) is fatal.
func (f *inputFlags) readInputs(e *env, args []string) ([]*hydro.Batch, error) {
	opt, err := f.options()
	if err != nil {
		return nil, err
	}
	if f.demo {
		if len(args) > 0 {
			return nil, fmt.Errorf("give either --demo or files, not both")
		}
		raw, err := data.Demo().ReadFile(DemoFile)
		if err != nil {
			return nil, err
		}
		b, err := hydro.Read(bytes.NewReader(raw), DemoFile, opt)
		if err != nil {
			return nil, err
		}
		return []*hydro.Batch{b}, f.joinField(e, []*hydro.Batch{b}, opt)
	}
	if len(args) == 0 {
		return nil, fmt.Errorf("no input: name one or more CSV files, '-' for standard input, or --demo")
	}
	var out []*hydro.Batch
	for _, a := range args {
		var b *hydro.Batch
		if a == "-" {
			b, err = hydro.Read(e.stdin, "<stdin>", opt)
		} else {
			b, err = hydro.ReadFile(a, opt)
		}
		if err != nil {
			return nil, err
		}
		if len(b.Rows) == 0 {
			return nil, fmt.Errorf("%s: no data rows below the header line", b.File)
		}
		out = append(out, b)
	}
	return out, f.joinField(e, out, opt)
}

// joinField joins the field sheet to the lab rows and lists what matched
// nothing, on either side.
func (f *inputFlags) joinField(e *env, batches []*hydro.Batch, opt hydro.Options) error {
	field, name, err := f.readFieldSheet(opt)
	if err != nil || field == nil {
		return err
	}
	for _, b := range batches {
		j := hydro.JoinFieldSheet(b, field)
		lines := make([]string, 0, len(j.UnmatchedLab))
		for _, i := range j.UnmatchedLab {
			lines = append(lines, fmt.Sprintf("%s line %d (%s)", b.File, b.Rows[i].Line, b.Rows[i].Sample.ID))
		}
		e.notes([]string{fmt.Sprintf("gwsat: field sheet %s: %d lab rows took field values", name, j.Joined)})
		if len(lines) > 0 {
			e.notes([]string{fmt.Sprintf("  %d lab rows without field values: %s", len(lines), strings.Join(limitList(lines, 5), "; "))})
		}
		if len(j.UnmatchedField) > 0 {
			var fl []string
			for _, r := range j.UnmatchedField {
				fl = append(fl, fmt.Sprintf("line %d (%s)", r.Line, r.Sample.ID))
			}
			e.notes([]string{fmt.Sprintf("  %d field rows matching no lab row: %s", len(fl), strings.Join(limitList(fl, 10), "; "))})
		}
	}
	return nil
}

// limitList keeps the first n entries and says how many more there are.
func limitList(l []string, n int) []string {
	if len(l) <= n {
		return l
	}
	return append(l[:n:n], fmt.Sprintf("and %d more", len(l)-n))
}

// activityModel returns the model named by --model.
func (f *inputFlags) activityModel() (speciation.ActivityModel, error) {
	if strings.EqualFold(strings.TrimSpace(f.model), "auto") {
		return nil, nil // assess chooses per row
	}
	m, ok := speciation.ModelByName(f.model)
	if !ok {
		return nil, fmt.Errorf("--model: unknown activity model %q (choose from auto, %s)", f.model, strings.Join(speciation.ModelNames(), ", "))
	}
	return m, nil
}

// chemistry is the data set, model and balance ion chosen by the flags.
type chemistry struct {
	db    *speciation.Database
	model speciation.ActivityModel
	bal   string
	orp   string
	// pressureBar (0 for 1 bar) or hydrostatic: the --pressure flag
	pressureBar float64
	hydrostatic bool
}

func (f *inputFlags) chemistry() (*chemistry, error) {
	model, err := f.activityModel()
	if err != nil {
		return nil, err
	}
	db, err := speciation.Default()
	if err != nil {
		return nil, err
	}
	bal, err := assess.BalanceComponent(db, f.closeWith)
	if err != nil {
		return nil, fmt.Errorf("--close-balance-with: %w", err)
	}
	if f.orpRef != "" {
		if _, err := speciation.ParseReferenceElectrode(f.orpRef); err != nil {
			return nil, fmt.Errorf("--orp-electrode: %w", err)
		}
	}
	ch := &chemistry{db: db, model: model, bal: bal, orp: f.orpRef}
	switch p := strings.TrimSpace(f.pressure); {
	case p == "":
	case strings.EqualFold(p, "hydrostatic"):
		ch.hydrostatic = true
	default:
		if ch.pressureBar, err = hydro.ParsePressureBar(p); err != nil {
			return nil, fmt.Errorf("--pressure: %w", err)
		}
	}
	return ch, nil
}

func (c *chemistry) options(bar *progress.Bar, detail bool) assess.Options {
	o := c.assessOptions()
	o.Progress, o.Detail = func() { bar.Add(1) }, detail
	return o
}

// assessOptions are the options of assess.Run that the flags choose.
func (c *chemistry) assessOptions() assess.Options {
	return assess.Options{Model: c.model, BalanceOn: c.bal, ORPReference: c.orp, PressureBar: c.pressureBar, Hydrostatic: c.hydrostatic}
}

// assessAll reads and assesses every row, showing progress on a terminal;
// detail keeps every species of every result (for JSON and the detailed
// view; costly on large files).
func (f *inputFlags) assessAll(e *env, args []string, detail bool) ([]*hydro.Batch, []assess.Record, *chemistry, error) {
	batches, err := f.readInputs(e, args)
	if err != nil {
		return nil, nil, nil, err
	}
	ch, err := f.chemistry()
	if err != nil {
		return nil, nil, nil, err
	}
	n := 0
	for _, b := range batches {
		n += len(b.Rows)
	}
	bar := progress.New(stderrFile(e), "speciating", n)
	recs, err := assess.Run(e.ctx, ch.db, batches, ch.options(bar, detail))
	bar.Done()
	return batches, recs, ch, err
}

// files lists the inputs' names.
func files(batches []*hydro.Batch) []string {
	out := make([]string, len(batches))
	for i, b := range batches {
		out[i] = b.File
	}
	return out
}

// labInput is one lab file read row by row, with the field sheet's index
// for it (nil without a field sheet) and what its join left unmatched.
type labInput struct {
	sc         *hydro.Scanner
	meta       *hydro.Batch
	field      *hydro.FieldIndex
	unmatched  []string
	nUnmatched int
}

// openInputs starts reading the files named in args ("-" for standard
// input, read once), or the demo, row by row: the streaming counterpart of
// readInputs. A file-level error is fatal. Close the scanners when done.
func (f *inputFlags) openInputs(e *env, args []string) ([]*labInput, string, error) {
	opt, err := f.options()
	if err != nil {
		return nil, "", err
	}
	var ins []*labInput
	fail := func(err error) ([]*labInput, string, error) {
		for _, in := range ins {
			in.sc.Close()
		}
		return nil, "", err
	}
	add := func(sc *hydro.Scanner) error {
		in := &labInput{sc: sc, meta: sc.Batch()}
		ins = append(ins, in)
		if !sc.HasRows() {
			return fmt.Errorf("%s: no data rows below the header line", in.meta.File)
		}
		return nil
	}
	if f.demo {
		if len(args) > 0 {
			return nil, "", fmt.Errorf("give either --demo or files, not both")
		}
		raw, err := data.Demo().ReadFile(DemoFile)
		if err != nil {
			return nil, "", err
		}
		sc, err := hydro.ScanBytes(raw, DemoFile, opt)
		if err != nil {
			return nil, "", err
		}
		if err := add(sc); err != nil {
			return fail(err)
		}
	} else {
		if len(args) == 0 {
			return nil, "", fmt.Errorf("no input: name one or more CSV files, '-' for standard input, or --demo")
		}
		for _, a := range args {
			var sc *hydro.Scanner
			if a == "-" {
				sc, err = hydro.NewScanner(e.stdin, "<stdin>", opt)
			} else {
				sc, err = hydro.ScanFile(a, opt)
			}
			if err != nil {
				return fail(err)
			}
			if err := add(sc); err != nil {
				return fail(err)
			}
		}
	}
	field, name, err := f.readFieldSheet(opt)
	if err != nil {
		return fail(err)
	}
	if field != nil {
		for _, in := range ins {
			in.field = hydro.NewFieldIndex(field)
		}
	}
	return ins, name, nil
}

// readFieldSheet reads the field sheet named by the flags (or the demo's),
// nil when there is none.
func (f *inputFlags) readFieldSheet(opt hydro.Options) (*hydro.Batch, string, error) {
	var field *hydro.Batch
	var err error
	name := f.fieldSheet
	switch {
	case name != "":
		field, err = hydro.ReadFieldSheetFile(name, opt)
	case f.demo:
		// The demo comes with its field sheet (round 3, invented).
		name = DemoFieldSheet
		var raw []byte
		if raw, err = data.Demo().ReadFile(name); err == nil {
			field, err = hydro.ReadFieldSheet(bytes.NewReader(raw), name, opt)
		}
	default:
		return nil, "", nil
	}
	if err != nil {
		return nil, "", fmt.Errorf("field sheet: %w", err)
	}
	return field, name, nil
}

// scanItems returns a next function for assess.Stream over the rows of the
// inputs, joining each to the field sheet as it passes.
func scanItems(ins []*labInput) func() (assess.Item, bool, error) {
	k := 0
	return func() (assess.Item, bool, error) {
		for k < len(ins) {
			in := ins[k]
			r, ok, err := in.sc.Next()
			if err != nil {
				return assess.Item{}, false, &inputError{fmt.Errorf("reading %s: %w", in.meta.File, err)}
			}
			if !ok {
				k++
				continue
			}
			if in.field != nil && !in.field.Join(&r) {
				in.nUnmatched++
				if len(in.unmatched) < 5 {
					in.unmatched = append(in.unmatched, fmt.Sprintf("%s line %d (%s)", in.meta.File, r.Line, r.Sample.ID))
				}
			}
			return assess.Item{File: in.meta.File, Row: r}, true, nil
		}
		return assess.Item{}, false, nil
	}
}

// inputError is a lab file that could not be read to its end (binary data
// or an overlong line after the start): the rows before it were assessed,
// and the outputs are not written.
type inputError struct{ err error }

func (e *inputError) Error() string { return e.err.Error() }
func (e *inputError) Unwrap() error { return e.err }

// printJoin lists, after the rows are read, how the field sheet joined.
func printJoin(e *env, ins []*labInput, name string) {
	for _, in := range ins {
		if in.field == nil {
			continue
		}
		e.notes([]string{fmt.Sprintf("gwsat: field sheet %s: %d lab rows took field values", name, in.field.Joined)})
		if in.nUnmatched > 0 {
			l := in.unmatched
			if in.nUnmatched > len(l) {
				l = append(l, fmt.Sprintf("and %d more", in.nUnmatched-len(l)))
			}
			e.notes([]string{fmt.Sprintf("  %d lab rows without field values: %s", in.nUnmatched, strings.Join(l, "; "))})
		}
		if um := in.field.Unmatched(); len(um) > 0 {
			var fl []string
			for _, r := range um {
				fl = append(fl, fmt.Sprintf("line %d (%s)", r.Line, r.Sample.ID))
			}
			e.notes([]string{fmt.Sprintf("  %d field rows matching no lab row: %s", len(fl), strings.Join(limitList(fl, 10), "; "))})
		}
	}
}
