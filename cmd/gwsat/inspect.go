package main

import (
	"io"
	"strings"

	"github.com/spf13/cobra"

	"gwsat.dev/gwsat/assess"
	"gwsat.dev/gwsat/internal/suggest"
	"gwsat.dev/gwsat/report"
)

func inspectCmd(e *env) *cobra.Command {
	var in inputFlags
	var id, jsonOut string
	var line int
	var verbose bool
	c := &cobra.Command{
		Use:   "inspect --sample ID [flags] FILE.csv | --demo",
		Short: "one water in detail: how each constituent is carried and how far from equilibrium",
		RunE: func(c *cobra.Command, args []string) error {
			if id == "" {
				return usagef("--sample is required")
			}
			var g guard
			if err := g.inputs(args); err != nil {
				return err
			}
			if err := g.outputs(jsonOut); err != nil {
				return err
			}
			_, recs, _, err := in.assessAll(e, args, true)
			if err != nil {
				return usageErr(err)
			}
			var hits []*assess.Record
			var ids []string
			for i := range recs {
				ids = append(ids, recs[i].Sample().ID)
				if recs[i].Sample().ID == id && (line == 0 || recs[i].Row.Line == line) {
					hits = append(hits, &recs[i])
				}
			}
			switch {
			case len(hits) == 0:
				return usagef("no sample %q in the input%s", id, suggest.Hint(id, ids))
			case len(hits) > 1:
				var lines []string
				for _, h := range hits {
					lines = append(lines, itoa(h.Row.Line))
				}
				return usagef("sample id %q occurs on lines %s: choose one with --line", id, strings.Join(lines, ", "))
			}
			r := hits[0]
			if jsonOut != "" {
				one := []assess.Record{*r}
				if err := e.writeFile(jsonOut, func(w io.Writer) error { return report.WriteJSON(w, one) }); err != nil {
					return failed(err)
				}
			} else if err := report.WriteWaterView(e.stdout, r, verbose); err != nil {
				return failed(err)
			}
			if r.Result == nil {
				return quietExit(exitFailed)
			}
			return nil
		},
	}
	interspersed(c.Flags())
	in.register(c.Flags())
	c.Flags().StringVar(&id, "sample", "", "sample id to show (required)")
	c.Flags().IntVar(&line, "line", 0, "when the id occurs more than once, the input line of the row to show")
	c.Flags().StringVar(&jsonOut, "json", "", "write the sample's full result as JSON to this file ('-' for standard output) instead of the text view")
	c.Flags().BoolVarP(&verbose, "verbose", "v", false, "also list every species and the solver's iteration count")
	return c
}
