package main

import (
	"bytes"
	"fmt"
	"strings"

	"github.com/spf13/pflag"

	"gwsat.dev/gwsat/assess"
	"gwsat.dev/gwsat/data"
	"gwsat.dev/gwsat/hydro"
	"gwsat.dev/gwsat/internal/progress"
	"gwsat.dev/gwsat/speciation"
)

// DemoFile is the name the embedded demo samples carry in outputs.
const DemoFile = "demo/samples.csv"

// inputFlags are the flags shared by every command that reads lab files.
type inputFlags struct {
	demo      bool
	nondetect string
	columnMap string
	epsg      int
	model     string
	closeWith string
}

func (f *inputFlags) register(fs *pflag.FlagSet) {
	fs.BoolVar(&f.demo, "demo", false, "read the embedded demo data set (invented) instead of files")
	fs.StringVar(&f.nondetect, "nondetect", "half", "value used for a non-detect: half (half the detection limit), dl (the limit) or zero")
	fs.StringVar(&f.columnMap, "column-map", "", "CSV file mapping headers to parameters (two columns: header,parameter)")
	fs.IntVar(&f.epsg, "epsg", 0, "EPSG code of easting/northing columns when the file has none (e.g. 32633)")
	fs.StringVar(&f.model, "model", "truesdell-jones", "activity model: "+strings.Join(speciation.ModelNames(), ", "))
	fs.StringVar(&f.closeWith, "close-balance-with", "", "adjust this ion (e.g. Cl or Na) so the speciated water is electrically neutral")
}

// readInputs reads the files named in args ("-" for standard input), or the
// demo. A file-level error (not CSV, no sample id column...) is fatal.
func (f *inputFlags) readInputs(e *env, args []string) ([]*hydro.Batch, error) {
	nd, err := hydro.ParseNonDetectPolicy(f.nondetect)
	if err != nil {
		return nil, fmt.Errorf("--nondetect: %w", err)
	}
	opt := hydro.Options{NonDetect: nd, EPSG: f.epsg}
	if f.columnMap != "" {
		m, err := hydro.ReadColumnMap(f.columnMap)
		if err != nil {
			return nil, fmt.Errorf("--column-map: %w", err)
		}
		opt.ColumnMap = m
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
		return []*hydro.Batch{b}, nil
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
	return out, nil
}

// activityModel returns the model named by --model.
func (f *inputFlags) activityModel() (speciation.ActivityModel, error) {
	m, ok := speciation.ModelByName(f.model)
	if !ok {
		return nil, fmt.Errorf("--model: unknown activity model %q (choose from %s)", f.model, strings.Join(speciation.ModelNames(), ", "))
	}
	return m, nil
}

// chemistry is the data set, model and balance ion chosen by the flags.
type chemistry struct {
	db    *speciation.Database
	model speciation.ActivityModel
	bal   string
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
	return &chemistry{db: db, model: model, bal: bal}, nil
}

func (c *chemistry) options(bar *progress.Bar, detail bool) assess.Options {
	return assess.Options{Model: c.model, BalanceOn: c.bal, Progress: func() { bar.Add(1) }, Detail: detail}
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
