package uncertainty

import (
	"testing"
)

const seedCSV = "Sample,pH,Temp,Ca,Mg,Na,K,Cl,SO4,Alkalinity as CaCO3,Ba (ug/L),Sr\n" +
	"a,7.4,15,60,12,20,2,30,40,180,30,0.2\n" +
	"b,7.1,20,400,100,800,20,1200,1500,150,12,9\n" +
	"c,6.9,25,250,95,700,30,1700,25,170,300,14\n"

// The seed makes the draws reproducible: the same seed gives the same
// numbers whatever the number of workers; another seed gives other draws.
func TestSeedReproducible(t *testing.T) {
	db, recs := assessCSV(t, seedCSV)
	run := func(seed uint64, workers int) []Sample {
		s, err := Run(t.Context(), db, recs, Options{Draws: 200, Seed: seed, Workers: workers})
		if err != nil {
			t.Fatal(err)
		}
		return s
	}
	a, b, other := run(42, 1), run(42, 2), run(43, 2)
	for i := range a {
		if a[i].Err != nil || b[i].Err != nil || other[i].Err != nil {
			t.Fatalf("%s: %v %v %v", recs[i].Sample().ID, a[i].Err, b[i].Err, other[i].Err)
		}
		if a[i].Seed != 42 || a[i].Stream != uint64(i) {
			t.Errorf("%s: seed %d stream %d reported, want 42 and %d", recs[i].Sample().ID, a[i].Seed, a[i].Stream, i)
		}
		differ := 0
		for k := range a[i].Intervals {
			x, y, z := a[i].Intervals[k], b[i].Intervals[k], other[i].Intervals[k]
			if x.Low != y.Low || x.High != y.High || x.SD != y.SD {
				t.Errorf("%s %s: seed 42 gave %v..%v on one worker, %v..%v on two", recs[i].Sample().ID, x.Mineral, x.Low, x.High, y.Low, y.High)
			}
			if x.Low != z.Low || x.High != z.High {
				differ++
			}
		}
		if differ == 0 {
			t.Errorf("%s: seeds 42 and 43 gave identical intervals", recs[i].Sample().ID)
		}
	}
}

// Options that cannot be used are refused; zero means the defaults.
func TestOptions(t *testing.T) {
	bad := []Options{{Draws: 1}, {Coverage: 1.5}, {RelSDByAnalyte: map[string]float64{"Ba": -1}}}
	for _, o := range bad {
		if _, err := o.resolved(); err == nil {
			t.Errorf("%+v accepted", o)
		}
	}
	o, err := Options{PHFieldSD: -1}.resolved()
	if err != nil || o.PHFieldSD != 0 || o.PHLabSD != DefaultPHLabSD || o.Draws != DefaultDraws || o.Band != DefaultBand {
		t.Errorf("resolved %+v, %v", o, err)
	}
	m, err := ParseRelSD("Ba=0.1, Alk=0.03")
	if err != nil || m["Ba"] != 0.1 || m["Alk"] != 0.03 {
		t.Errorf("ParseRelSD: %v %v", m, err)
	}
	for _, s := range []string{"Ba", "Ba=x", "Ba=-0.1"} {
		if _, err := ParseRelSD(s); err == nil {
			t.Errorf("ParseRelSD(%q) accepted", s)
		}
	}
}

// A file estimated in chunks gives each row the numbers it gets in one run
// when each chunk passes its first row number as FirstStream.
func TestFirstStreamChunks(t *testing.T) {
	db, recs := assessCSV(t, seedCSV)
	whole, err := Run(t.Context(), db, recs, Options{Draws: 100, Seed: 5})
	if err != nil {
		t.Fatal(err)
	}
	tail, err := Run(t.Context(), db, recs[1:], Options{Draws: 100, Seed: 5, FirstStream: 1})
	if err != nil {
		t.Fatal(err)
	}
	for i := range tail {
		a, b := whole[i+1].Intervals, tail[i].Intervals
		for k := range a {
			if a[k].Low != b[k].Low || a[k].High != b[k].High {
				t.Errorf("%s %s: %v..%v whole, %v..%v in a chunk", recs[i+1].Sample().ID, a[k].Mineral, a[k].Low, a[k].High, b[k].Low, b[k].High)
			}
		}
	}
}
