package main

import (
	"os"
	"path/filepath"
	"strconv"
	"strings"
	"testing"
)

// The blend table has one row per share and its end rows are the two
// end-members: at share 0 the blend is the native water, so its pH is the
// measured pH of that sample in the demo file (pH is solved from conserved
// alkalinity and carbon, which reproduces the measured pH of an unmixed water).
func TestBlendDemo(t *testing.T) {
	code, out, errs := gwsat(t, "", "inject", "blend", "--demo", "--shares", "0:1:0.25", "--at-temp", "23")
	if code != exitOK {
		t.Fatalf("exit %d: %s", code, errs)
	}
	recs := readCSV(t, out)
	if len(recs) != 6 {
		t.Fatalf("%d lines, want header + 5 fractions", len(recs))
	}
	h := recs[0]
	fr, temp := col(t, h, "injectate_share"), col(t, h, "temp_c")
	for i, r := range recs[1:] {
		if f, _ := strconv.ParseFloat(r[fr], 64); f != 0.25*float64(i) {
			t.Errorf("row %d share %s", i, r[fr])
		}
		if r[temp] != "23.0" {
			t.Errorf("row %d temperature %s, want the fixed 23.0", i, r[temp])
		}
	}
	if !strings.Contains(errs, "peak SI") || !strings.Contains(errs, "licensed professionals") {
		t.Errorf("summary: %s", errs)
	}
}

func TestDepositAndPoreFill(t *testing.T) {
	code, out, errs := gwsat(t, "", "inject", "deposit", "--demo", "--share", "0.6")
	if code != exitOK {
		t.Fatalf("deposit exit %d: %s", code, errs)
	}
	recs := readCSV(t, out)
	if len(recs) < 2 {
		t.Fatalf("no mineral precipitates from the demo mixture: %v\n%s", recs, errs)
	}
	for _, r := range recs[1:] {
		si, _ := strconv.ParseFloat(r[1], 64)
		mg, _ := strconv.ParseFloat(r[3], 64)
		if !(si > 0) || !(mg > 0) {
			t.Errorf("%s: SI %s and amount %s: only supersaturated minerals precipitate", r[0], r[1], r[3])
		}
	}
	code, out, errs = gwsat(t, "", "inject", "porefill", "--demo", "--share", "0.6", "--rate", "1000", "--porosity", "0.25")
	if code != exitOK {
		t.Fatalf("porefill exit %d: %s", code, errs)
	}
	if !strings.Contains(errs, "upper-bound") || !strings.Contains(out, "total") {
		t.Errorf("porefill output lacks the caution or the total:\n%s\n%s", out, errs)
	}
}

// The demo dose adds Na2SO4 to the deep native water: barite saturates
// long before celestite, since Ksp(barite) = 10^-9.97 (Blount 1977) is about
// 2000 times smaller than Ksp(celestite) = 10^-6.63 (Reardon & Armstrong
// 1987) while the water holds far more Sr than Ba.
func TestDoseDemo(t *testing.T) {
	code, out, errs := gwsat(t, "", "inject", "dose", "--demo")
	if code != exitOK {
		t.Fatalf("exit %d: %s", code, errs)
	}
	recs := readCSV(t, out)
	if len(recs) < 3 || recs[1][1] != "baryte" || recs[2][1] != "celestine" {
		t.Fatalf("sequence %v", recs)
	}
	a1, _ := strconv.ParseFloat(recs[1][2], 64)
	a2, _ := strconv.ParseFloat(recs[2][2], 64)
	if !(a1 > 0 && a2 > 10*a1) {
		t.Errorf("onsets %g and %g mol/kgw", a1, a2)
	}
}

// Bad input: a clear message, exit status 2, and nothing written.
func TestInjectBadInput(t *testing.T) {
	dir := t.TempDir()
	out := filepath.Join(dir, "out.csv")
	cases := []struct {
		args []string
		want string
	}{
		{[]string{"inject", "blend", "--demo", "--native", "NOPE"}, "NOPE"},
		{[]string{"inject", "blend", "--demo", "--native", "NATIVE-R2"}, "did you mean NATIVE-R1"},
		{[]string{"inject", "blend", "--demo", "--shares", "0,0.5,1.5"}, "outside"},
		{[]string{"inject", "blend", "--demo", "--at-temp", "120"}, "outside"},
		{[]string{"inject", "warm", "--demo", "--temps", "-5:50:5"}, "outside"},
		{[]string{"inject", "deposit", "--demo", "--share", "2"}, "share"},
		{[]string{"inject", "deposit", "--demo", "--candidates", "Kryptonite"}, "Kryptonite"},
		{[]string{"inject", "porefill", "--demo", "--rate", "-5"}, "rate"},
		{[]string{"inject", "porefill", "--demo", "--porosity", "1.2"}, "porosity"},
		{[]string{"inject", "dose", "--demo", "--add-salt", "2 Na+ + XO4 2-"}, "salt"},
		{[]string{"inject", "blend", "--demo", "--native", "C3-I-R3"}, "cannot be used"},
		{[]string{"inject", "warm", "--demo", "--temps", "0:100:1e-12"}, "more than"},
		{[]string{"inject", "blend", "--demo", "--shares", "0,Inf"}, "finite"},
		{[]string{"inject", "blend", "--demo", "--figure", "x.gif"}, ".png"},
		{[]string{"check", "--demo", "extra.csv", "-q"}, "not both"},
		{[]string{"check", "--demo", "--no-such-flag"}, "no-such-flag"},
	}
	for _, c := range cases {
		args := append(append([]string{}, c.args...), "-o", out) // flags after the others: accepted anywhere
		code, _, errs := gwsat(t, "", args...)
		if code != exitUsage || !strings.Contains(strings.ToLower(errs), strings.ToLower(c.want)) {
			t.Errorf("%v: exit %d, stderr %q; want exit 2 mentioning %q", c.args, code, errs, c.want)
		}
		if _, err := os.Stat(out); !os.IsNotExist(err) {
			t.Errorf("%v: wrote %s despite the error", c.args, out)
			os.Remove(out)
		}
	}
}
