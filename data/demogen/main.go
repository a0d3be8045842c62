package main

import (
	"flag"
	"fmt"
	"io"
	"os"
	"path/filepath"
)

func main() {
	os.Exit(run(os.Args[1:], os.Stdout, os.Stderr))
}

func run(args []string, stdout, stderr io.Writer) int {
	fs := flag.NewFlagSet("demogen", flag.ContinueOnError)
	fs.SetOutput(stderr)
	out := fs.String("out", "data/demo", "output folder")
	seed := fs.Uint64("seed", defaultSeed, "seed of the analytical noise")
	quiet := fs.Bool("q", false, "do not print the sample table")
	if err := fs.Parse(args); err != nil {
		return 2
	}
	g := generate(*seed)
	files := g.files()
	if err := os.MkdirAll(*out, 0o755); err != nil {
		fmt.Fprintln(stderr, "demogen:", err)
		return 1
	}
	for _, name := range []string{"samples.csv", "field.csv", "site.geojson", "README.md"} {
		if err := writeAtomic(filepath.Join(*out, name), files[name]); err != nil {
			fmt.Fprintln(stderr, "demogen:", err)
			return 1
		}
	}
	if !*quiet {
		g.printTable(stdout)
	}
	fmt.Fprintf(stdout, "wrote %d samples to %s (seed %d)\n", len(g.Samples), *out, g.Seed)
	return 0
}

// files renders every output file.
func (g *generated) files() map[string][]byte {
	return map[string][]byte{
		"samples.csv":  g.csvBytes(),
		"field.csv":    g.fieldBytes(),
		"site.geojson": siteGeoJSON(),
		"README.md":    g.readme(),
	}
}

func writeAtomic(path string, b []byte) error {
	tmp, err := os.CreateTemp(filepath.Dir(path), ".demogen-*")
	if err != nil {
		return err
	}
	if _, err := tmp.Write(b); err != nil {
		tmp.Close()
		os.Remove(tmp.Name())
		return err
	}
	if err := tmp.Close(); err != nil {
		os.Remove(tmp.Name())
		return err
	}
	if err := os.Chmod(tmp.Name(), 0o644); err != nil {
		os.Remove(tmp.Name())
		return err
	}
	return os.Rename(tmp.Name(), path)
}

// printTable prints, per sample, the model's injectate fraction, vertical
// mixing weight, approximate saturation indices and the reported charge
// balance.
func (g *generated) printTable(w io.Writer) {
	fmt.Fprintf(w, "%-12s %5s %5s %6s %6s %6s %6s %6s %7s  %s\n",
		"sample", "finj", "vmix", "pH", "SIcal", "SIgyp", "SIbar", "CBE%", "dCal", "mixSIc mixSIb flaw")
	for _, s := range g.Samples {
		fmt.Fprintf(w, "%-12s %5.2f %5.2f %6.2f %6.2f %6.2f %6.2f %6.1f %7.3f  %6.2f %6.2f %s\n",
			s.ID, s.InjFrac, s.VertMix, s.State.pH, s.State.SICalcite, s.State.SIGypsum,
			s.State.SIBarite, s.CBE, s.Reactions[0]*1000, s.MixedState.SICalcite, s.MixedState.SIBarite, s.Flaw)
	}
}
