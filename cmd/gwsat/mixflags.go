package main

import (
	"flag"

	"gwsat/assess"
	"gwsat/report"
	"gwsat/speciation"
)

// mixFlags choose the end-members of the injection-planning section of a
// report. (Filled in with the mixing commands.)
type mixFlags struct{}

func (m *mixFlags) registerReport(fs *flag.FlagSet) {}

func (m *mixFlags) section(e *env, recs []assess.Record, db *speciation.Database, model speciation.ActivityModel) (*report.Section, []report.Fig, error) {
	return nil, nil, nil
}
