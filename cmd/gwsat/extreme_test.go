package main

import (
	"os"
	"path/filepath"
	"regexp"
	"testing"
)

// nonNumber matches NaN and infinities as Go and JSON write them.
var nonNumber = regexp.MustCompile(`(?i)\bnan\b|[+-]?\binf(inity)?\b`)

// Extreme and absurd inputs: no command ever prints or writes NaN or Inf,
// whatever it does with the row (reject, warn, refuse the argument). (Cells
// that literally read "nan" or "inf" are rejected by the reader, which quotes
// them in its message; they are left out here so that the scan sees computed
// numbers only.)
func TestNoNonNumberOnExtremeInputs(t *testing.T) {
	if testing.Short() {
		t.Skip("runs every command")
	}
	dir := t.TempDir()
	lab := filepath.Join(dir, "extreme.csv")
	body := "Sample ID,Well ID,Latitude,Longitude,Depth (m),pH,Temp (C),Ca (mg/L),Mg (mg/L),Na (mg/L),K (mg/L),Cl (mg/L),SO4 (mg/L),Alkalinity (mg/L as CaCO3),Ba (ug/L)\n" +
		"HUGE,W1,30.1,-100.1,20,7.2,15,1e308,12,20,2,30,40,180,50\n" +
		"TINY,W2,30.11,-100.1,20,7.2,15,1e-300,1e-300,1e-300,1e-300,1e-300,1e-300,1e-300,1e-300\n" +
		"ACID,W3,30.1,-100.11,20,2.0,15,60,12,20,2,30,40,180,50\n" +
		"CAUSTIC,W4,30.12,-100.12,20,13.9,99.9,60,12,20,2,30,40,180,50\n" +
		"ZERO,W5,30.13,-100.13,20,7.0,0,0,0,0,0,0,0,0,0\n" +
		"TEXT,W6,30.14,-100.14,20,1e400,-1e400,1e400,-1e-400,1e999,1e400,30,40,180,50\n" +
		"BRINE,W7,30.15,-100.15,20,6.5,60,40000,5000,90000,3000,230000,500,100,9000\n" +
		"OK,W8,30.16,-100.16,20,7.3,15,60,12,20,2,30,40,180,50\n"
	if err := os.WriteFile(lab, []byte(body), 0o644); err != nil {
		t.Fatal(err)
	}
	runs := [][]string{
		{"check", lab, "--json", filepath.Join(dir, "all.json"), "-o", filepath.Join(dir, "table.csv")},
		{"inject", "blend", lab, "--native", "BRINE", "--injectate", "OK", "--peaks", filepath.Join(dir, "peaks.csv")},
		{"inject", "warm", lab, "--sample", "CAUSTIC"},
		{"inject", "deposit", lab, "--native", "BRINE", "--injectate", "OK", "--share", "0.5"},
		{"inject", "porefill", lab, "--sample", "BRINE", "--rate", "1e308"},
		{"inject", "porefill", lab, "--sample", "OK", "--rate", "1e30", "--days", "1e30"},
		{"inject", "dose", lab, "--sample", "OK", "--add-salt", "Ba2+ + 2 Cl-", "--up-to", "1e300"},
		{"report", lab, "-o", filepath.Join(dir, "rep"), "--formats", "svg"},
	}
	for _, id := range []string{"HUGE", "TINY", "ACID", "CAUSTIC", "ZERO", "TEXT", "BRINE", "OK"} {
		runs = append(runs, []string{"inspect", lab, "--sample", id, "-v"})
	}
	for _, args := range runs {
		code, out, errs := gwsat(t, "", args...)
		if code > exitUsage {
			t.Errorf("%v: exit %d", args, code)
		}
		for _, s := range []string{out, errs} {
			if m := nonNumber.FindString(s); m != "" {
				t.Errorf("%v prints %q:\n%s", args, m, s)
			}
		}
	}
	scanOutputs(t, dir, lab, nonNumber)
}
