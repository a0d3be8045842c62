package main

import (
	"bytes"
	"flag"
	"fmt"
	"io"
	"os"
	"strings"

	"gwsat.dev/gwsat/assess"
	"gwsat.dev/gwsat/data"
	"gwsat.dev/gwsat/hydro"
	"gwsat.dev/gwsat/internal/progress"
	"gwsat.dev/gwsat/report"
	"gwsat.dev/gwsat/speciation"
)

// DemoFile is the name the embedded demo samples carry in outputs.
const DemoFile = "demo/samples.csv"

// inputFlags are the flags shared by every command that reads lab files.
type inputFlags struct {
	demo      bool
	nondetect string
	colmap    string
	epsg      int
	model     string
	balanceOn string
}

func (f *inputFlags) register(fs *flag.FlagSet) {
	fs.BoolVar(&f.demo, "demo", false, "read the embedded demo data set (invented) instead of files")
	fs.StringVar(&f.nondetect, "nondetect", "half", "value used for a non-detect: half (half the detection limit), dl (the limit) or zero")
	fs.StringVar(&f.colmap, "colmap", "", "CSV file mapping headers to parameters (two columns: header,parameter)")
	fs.IntVar(&f.epsg, "epsg", 0, "EPSG code of easting/northing columns when the file has none (e.g. 32633)")
	fs.StringVar(&f.model, "model", "truesdell-jones", "activity model: "+strings.Join(speciation.ModelNames(), ", "))
	fs.StringVar(&f.balanceOn, "balance-on", "", "adjust this ion (e.g. Cl or Na) so the speciated water is electrically neutral")
}

// readInputs reads the files named in args ("-" for standard input), or the
// demo. A file-level error (not CSV, no sample id column...) is fatal.
func (f *inputFlags) readInputs(e *env, args []string) ([]*hydro.Batch, error) {
	nd, err := hydro.ParseNonDetectPolicy(f.nondetect)
	if err != nil {
		return nil, err
	}
	opt := hydro.Options{NonDetect: nd, EPSG: f.epsg}
	if f.colmap != "" {
		m, err := hydro.ReadColumnMap(f.colmap)
		if err != nil {
			return nil, err
		}
		opt.ColumnMap = m
	}
	if f.demo {
		if len(args) > 0 {
			return nil, fmt.Errorf("give either -demo or files, not both")
		}
		raw, err := data.Demo.ReadFile(DemoFile)
		if err != nil {
			return nil, err
		}
		b, err := hydro.Read(bytes.NewReader(raw), DemoFile, opt)
		if err != nil {
			return nil, err
		}
		return []*hydro.Batch{b}, nil
	}
	if len(args) == 0 {
		return nil, fmt.Errorf("no input: name one or more CSV files, '-' for standard input, or -demo")
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
	return out, nil
}

// activityModel returns the model named by -model.
func (f *inputFlags) activityModel() (speciation.ActivityModel, error) {
	m, ok := speciation.ModelByName(f.model)
	if !ok {
		return nil, fmt.Errorf("unknown activity model %q (choose from %s)", f.model, strings.Join(speciation.ModelNames(), ", "))
	}
	return m, nil
}

// balanceComponent maps a user's ion name ("Cl", "Cl-", "chloride") to a
// component of the database.
func balanceComponent(db *speciation.Database, name string) (string, error) {
	if name == "" {
		return "", nil
	}
	if db.ComponentIndex(name) >= 0 {
		return name, nil
	}
	short := strings.ToLower(strings.TrimRight(name, "+-0123456789"))
	for _, c := range db.Components() {
		if strings.ToLower(strings.TrimRight(c.Name, "+-0123456789")) == short && c.Charge != 0 {
			return c.Name, nil
		}
	}
	return "", fmt.Errorf("-balance-on %q: not an ion of the data (try Cl, Na, SO4, Ca)", name)
}

// assessAll reads, converts and speciates; it shows progress on a terminal.
func (f *inputFlags) assessAll(e *env, args []string) ([]*hydro.Batch, []assess.Record, *speciation.Database, error) {
	return f.assess(e, args, true)
}

// speciator is what assess.Run needs, set from the flags.
type speciator struct {
	db    *speciation.Database
	model speciation.ActivityModel
	bal   string
}

func (f *inputFlags) speciator() (*speciator, error) {
	model, err := f.activityModel()
	if err != nil {
		return nil, err
	}
	db, err := speciation.Default()
	if err != nil {
		return nil, err
	}
	bal, err := balanceComponent(db, f.balanceOn)
	if err != nil {
		return nil, err
	}
	return &speciator{db: db, model: model, bal: bal}, nil
}

func (sp *speciator) options(progress func(), detail bool) assess.Options {
	return assess.Options{Model: sp.model, BalanceOn: sp.bal, Progress: progress, Detail: detail}
}

// assess reads and speciates; detail keeps every species of every result
// (needed for JSON and the species view, costly on large files).
func (f *inputFlags) assess(e *env, args []string, detail bool) ([]*hydro.Batch, []assess.Record, *speciation.Database, error) {
	batches, err := f.readInputs(e, args)
	if err != nil {
		return nil, nil, nil, err
	}
	sp, err := f.speciator()
	if err != nil {
		return nil, nil, nil, err
	}
	n := 0
	for _, b := range batches {
		n += len(b.Rows)
	}
	bar := progress.New(stderrFile(e), "speciating", n)
	recs, err := assess.Run(e.ctx, sp.db, batches, sp.options(func() { bar.Add(1) }, detail))
	bar.Done()
	report.FlagPositions(recs)
	return batches, recs, sp.db, err
}

// stderrFile returns the process's stderr when the command writes there, so
// the progress bar can ask whether it is a terminal.
func stderrFile(e *env) io.Writer {
	if e.stderr == io.Writer(os.Stderr) {
		return os.Stderr
	}
	return e.stderr
}
