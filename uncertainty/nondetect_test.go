package uncertainty

import (
	"errors"
	"slices"
	"testing"
)

// A non-detect spans zero to its limit: every mineral that contains the ion
// gets an interval open at the bottom and is never called supersaturated
// with confidence, whatever the rest of the water; minerals without the ion
// keep a closed interval. Waters invented; the sulfate-rich ones are far
// above baryte saturation at half the barium limit, so a rule that looked
// only at the SI as measured would call them supersaturated.
func TestNonDetectOpensBottom(t *testing.T) {
	csv := "Sample,pH,Temp,Ca,Mg,Na,K,Cl,SO4,Alkalinity as CaCO3,Ba (ug/L),Sr\n" +
		"fresh,7.4,15,60,12,20,2,30,40,180,<5,0.2\n" +
		"sulfate,7.1,20,400,100,800,20,1200,1500,150,<50,9\n" +
		"brackish,6.9,25,250,95,700,30,1700,25,170,<20,14\n"
	db, recs := assessCSV(t, csv)
	for _, linear := range []bool{false, true} {
		samples, err := Run(t.Context(), db, recs, Options{Draws: 300, Seed: 3, Linear: linear})
		if err != nil {
			t.Fatal(err)
		}
		for i, s := range samples {
			if s.Err != nil {
				t.Fatalf("%s: %v", recs[i].Sample().ID, s.Err)
			}
			e := newEstimator(t, Options{})
			sawBa := false
			for _, iv := range s.Intervals {
				hasBa := slices.Contains(e.componentsOf(iv.Mineral), "Ba2+")
				sawBa = sawBa || hasBa
				if iv.LowOpen != hasBa {
					t.Errorf("%s linear=%v %s: open bottom %v, contains Ba2+ %v", recs[i].Sample().ID, linear, iv.Mineral, iv.LowOpen, hasBa)
				}
				if hasBa && iv.Verdict == Supersaturated {
					t.Errorf("%s linear=%v %s: supersaturated with a non-detect of barium", recs[i].Sample().ID, linear, iv.Mineral)
				}
				if hasBa && iv.FormatLow(2) != "unbounded" {
					t.Errorf("%s %s: low printed %q", recs[i].Sample().ID, iv.Mineral, iv.FormatLow(2))
				}
				if !finiteAll(iv) || iv.Low > iv.Best || iv.High < iv.Best {
					t.Errorf("%s linear=%v %s: interval %v..%v around %v", recs[i].Sample().ID, linear, iv.Mineral, iv.Low, iv.High, iv.Best)
				}
			}
			if !sawBa {
				t.Errorf("%s: no barium mineral reported", recs[i].Sample().ID)
			}
		}
	}
	// The sulfate water's baryte is above the band as measured: only the
	// open bottom keeps it from "supersaturated".
	if si, _ := recs[1].Result.SI("baryte"); si < 2*DefaultBand {
		t.Fatalf("sulfate water: baryte SI %.2f as measured; the test needs it clearly positive", si)
	}
}

// A record that was not speciated has no intervals and says why.
func TestRunNotSpeciated(t *testing.T) {
	db, recs := assessCSV(t, "Sample,pH,Temp,Ca,Cl\nnoph,,15,60,30\nneg,7,15,-1,30\n")
	samples, err := Run(t.Context(), db, recs, Options{Draws: 10})
	if err != nil {
		t.Fatal(err)
	}
	for i, s := range samples {
		if !errors.Is(s.Err, ErrNoResult) || len(s.Intervals) != 0 {
			t.Errorf("%s: err %v, %d intervals; want ErrNoResult and none", recs[i].Sample().ID, s.Err, len(s.Intervals))
		}
	}
}
