package main

import (
	"fmt"
	"io"
	"math"
	"sort"
	"strings"
	"text/tabwriter"

	"gwsat.dev/gwsat/assess"
	"gwsat.dev/gwsat/report"
	"gwsat.dev/gwsat/speciation"
)

func init() {
	register(command{name: "species", summary: "detailed speciation of one sample: species, activities, distribution, SIs", run: runSpecies})
}

func runSpecies(e *env, args []string) int {
	fs := newFlags(e, "species", "species -sample ID [flags] FILE.csv | -demo")
	var in inputFlags
	in.register(fs)
	id := fs.String("sample", "", "sample id to show (required)")
	line := fs.Int("line", 0, "when the id occurs more than once, the input line of the row to show")
	jsonOut := fs.String("json", "", "write the sample's full result as JSON to this file ('-' for standard output) instead of the text view")
	if code, ok := parseFlags(fs, args); !ok {
		return code
	}
	if *id == "" {
		fs.Usage()
		return failf(e, exitUsage, "species: -sample is required")
	}
	_, recs, _, err := in.assessAll(e, fs.Args())
	if err != nil {
		return failf(e, exitUsage, "%v", err)
	}
	var hits []*assess.Record
	for i := range recs {
		if recs[i].Sample().ID == *id && (*line == 0 || recs[i].Row.Line == *line) {
			hits = append(hits, &recs[i])
		}
	}
	switch {
	case len(hits) == 0:
		return failf(e, exitUsage, "species: no sample %q in the input", *id)
	case len(hits) > 1:
		var lines []string
		for _, h := range hits {
			lines = append(lines, fmt.Sprint(h.Row.Line))
		}
		return failf(e, exitUsage, "species: sample id %q occurs on lines %s: choose one with -line", *id, strings.Join(lines, ", "))
	}
	r := hits[0]
	if *jsonOut != "" {
		one := []assess.Record{*r}
		if err := e.writeFile(*jsonOut, func(w io.Writer) error { return report.WriteJSON(w, one) }); err != nil {
			return failf(e, exitRejected, "writing %s: %v", *jsonOut, err)
		}
		if r.Result == nil {
			return exitRejected
		}
		return exitOK
	}
	printSpecies(e.stdout, r)
	if r.Result == nil {
		return exitRejected
	}
	return exitOK
}

func printSpecies(w io.Writer, r *assess.Record) {
	s := r.Sample()
	well := ""
	if s.WellID != "" {
		well = "well " + s.WellID + ", "
	}
	fmt.Fprintf(w, "Sample %s (%s%s line %d): %s\n", s.ID, well, r.File, r.Row.Line, r.Status)
	for _, reason := range r.Reasons {
		fmt.Fprintf(w, "  %s\n", reason)
	}
	b := r.Balance
	if b.CationsMeqL > 0 || b.AnionsMeqL > 0 {
		fmt.Fprintf(w, "Charge balance from the analysis: cations %.3f meq/L, anions %.3f meq/L, error %.2f %% (%s; %s)\n",
			b.CationsMeqL, b.AnionsMeqL, b.ErrorPct, b.Status, b.Criterion)
	}
	res := r.Result
	if res == nil {
		fmt.Fprintln(w, "Not speciated.")
		return
	}
	fmt.Fprintf(w, "Model %s at %.1f C, pH %.2f (%s), %d iterations\n", res.Model, res.TempC, res.PH, s.PHSource, res.Iterations)
	fmt.Fprintf(w, "Ionic strength %.4g mol/kgw; charge balance after speciation %.2f %%", res.IonicStrength, res.ChargeBalance)
	if res.HasLogPCO2 {
		fmt.Fprintf(w, "; log pCO2 %.2f atm", res.LogPCO2)
	}
	fmt.Fprintln(w)
	if ix := res.Indices; ix.HasLangelier {
		fmt.Fprintf(w, "Langelier index %.2f (pHs %.2f), Ryznar index %.2f", ix.Langelier, ix.PHs, ix.Ryznar)
		if ix.HasLarsonSkold {
			fmt.Fprintf(w, ", Larson-Skold index %.2f", ix.LarsonSkold)
		}
		fmt.Fprintln(w)
	}

	fmt.Fprintln(w, "\nSpecies")
	tw := tabwriter.NewWriter(w, 0, 0, 2, ' ', tabwriter.AlignRight)
	fmt.Fprintln(tw, "species\tmolality (mol/kgw)\tlog molality\tgamma\tlog activity\t")
	sp := append(res.Species[:0:0], res.Species...)
	sort.SliceStable(sp, func(i, j int) bool { return sp[i].Molality > sp[j].Molality })
	for _, x := range sp {
		if x.Molality <= 0 {
			continue
		}
		fmt.Fprintf(tw, "%s\t%.4e\t%.3f\t%.4f\t%.3f\t\n", x.Name, x.Molality, math.Log10(x.Molality), x.Gamma, x.LogActivity)
	}
	tw.Flush()

	fmt.Fprintln(w, "\nDistribution of each component (percent of its total)")
	tw = tabwriter.NewWriter(w, 0, 0, 2, ' ', 0)
	last := ""
	for _, sh := range res.Distribution {
		if sh.Percent < 0.01 {
			continue
		}
		c := sh.Component
		if c == speciation.NameCarbonate {
			c = "total carbonate"
		}
		if sh.Component == last {
			c = ""
		}
		last = sh.Component
		fmt.Fprintf(tw, "%s\t%s\t%6.2f %%\n", c, sh.Species, sh.Percent)
	}
	tw.Flush()

	fmt.Fprintln(w, "\nSaturation indices (SI = log IAP - log K; > 0 supersaturated: may deposit; < 0 undersaturated: may dissolve)")
	tw = tabwriter.NewWriter(w, 0, 0, 2, ' ', tabwriter.AlignRight)
	fmt.Fprintln(tw, "mineral\tlog IAP\tlog K at T\tSI\tstate\t")
	for _, m := range res.Minerals {
		fmt.Fprintf(tw, "%s\t%.3f\t%.3f\t%+.3f\t%s\t\n", m.Name, m.LogIAP, m.LogK, m.SI, state(m.SI))
	}
	tw.Flush()
	fmt.Fprintln(w, "\nScreening results, not a design: defer to local codes and licensed professionals.")
}

// state words a saturation index with the near-equilibrium band.
func state(si float64) string {
	switch {
	case si > NearEquilibriumBand:
		return "supersaturated"
	case si < -NearEquilibriumBand:
		return "undersaturated"
	default:
		return "near equilibrium"
	}
}
