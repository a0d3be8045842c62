package main

import (
	"strings"
	"testing"

	"gwsat.dev/gwsat/report"
)

// The findings of the demo name baryte in the deep wells of clusters A and B,
// from the second round (the demo's documented design: data/demo/README.md,
// "What the demo shows": barium-bearing deep water and injectate meet there once
// injection has begun), and end with the caution.
func TestFindingsDemo(t *testing.T) {
	code, out, errs := gwsat(t, "", "findings", "--demo", "--linear", "-q")
	if code != exitOK {
		t.Fatalf("exit %d: %s", code, errs)
	}
	for _, want := range []string{"Baryte: supersaturated with confidence since round 2", "cluster A at 108-128 m depth", "cluster B at 108-128 m depth", report.CautionLine} {
		if !strings.Contains(out, want) {
			t.Errorf("output lacks %q:\n%s", want, out)
		}
	}
}
