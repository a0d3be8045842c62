package sitereport

import (
	"context"

	"gwsat.dev/gwsat/assess"
	"gwsat.dev/gwsat/findings"
	"gwsat.dev/gwsat/uncertainty"
)

// findingsOf is what the report takes from package findings.
type findingsOf struct {
	f       *findings.Findings
	samples []uncertainty.Sample
	trends  []findings.Trend
}

// buildFindings puts intervals on every SI (the fast linear estimate: a report
// is read by people, and the Monte Carlo estimate of 'gwsat findings' gives the
// same verdicts within its noise), tests the trends per well and words the
// findings.
func buildFindings(ctx context.Context, opt Options, recs []assess.Record, minerals []string) (findingsOf, error) {
	samples := opt.Samples
	if len(samples) != len(recs) {
		var err error
		if samples, err = uncertainty.Run(ctx, opt.DB, recs, intervalOptions(opt.Model, 0, len(recs))); err != nil {
			return findingsOf{}, err
		}
	}
	trends := findings.Trends(recs, minerals, 0)
	f, err := findings.Build(recs, samples, trends, uncertainty.DefaultBand,
		findings.Options{ClusterColumn: opt.Site.ClusterColumn, ZoneEdgesM: opt.Site.BandEdges})
	if err != nil {
		return findingsOf{}, err
	}
	return findingsOf{f: f, samples: samples, trends: trends}, nil
}
