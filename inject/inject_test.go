package inject

import (
	"bytes"
	"context"
	"errors"
	"math"
	"strings"
	"testing"

	"gwsat.dev/gwsat/assess"
	"gwsat.dev/gwsat/data"
	"gwsat.dev/gwsat/hydro"
	"gwsat.dev/gwsat/speciation"
)

func demoPlanner(t testing.TB) *Planner {
	t.Helper()
	raw, err := data.Demo().ReadFile("demo/samples.csv")
	if err != nil {
		t.Fatal(err)
	}
	b, err := hydro.Read(bytes.NewReader(raw), "demo/samples.csv", hydro.Options{})
	if err != nil {
		t.Fatal(err)
	}
	db, err := speciation.Default()
	if err != nil {
		t.Fatal(err)
	}
	recs, err := assess.Run(context.Background(), db, []*hydro.Batch{b}, assess.Options{})
	if err != nil {
		t.Fatal(err)
	}
	return NewPlanner(db, speciation.TruesdellJones{}, recs)
}

// At share 0 a blend is the native water and at share 1 the injectate, so the
// end points of the sweep carry the SIs of the two waters as assessed (the
// conserved alkalinity and carbon give back the measured pH at the water's own
// temperature).
func TestBlendEndsAreTheWaters(t *testing.T) {
	p := demoPlanner(t)
	r, err := p.Blend(BlendOptions{Native: "NATIVE-R1", Injectate: "INJ-R2", Shares: []float64{0, 0.5, 1}})
	if err != nil {
		t.Fatal(err)
	}
	_, nat, _ := p.Water("native water", "NATIVE-R1")
	_, inj, _ := p.Water("injectate", "INJ-R2")
	pts := r.Sweep.Points
	for i, m := range r.Sweep.Minerals {
		for _, c := range []struct {
			k   int
			rec *assess.Record
		}{{0, nat}, {2, inj}} {
			want, ok := c.rec.Result.SI(m)
			if !ok || !pts[c.k].Defined[i] {
				continue
			}
			if math.Abs(pts[c.k].SI[i]-want) > 1e-6 {
				t.Errorf("%s at share %g: SI %g, the water's own %g", m, pts[c.k].Fraction, pts[c.k].SI[i], want)
			}
		}
	}
	if s := strings.Join(r.Summary(), "\n"); !strings.Contains(s, "licensed professionals") {
		t.Errorf("summary without the caution:\n%s", s)
	}
}

func TestWaterChoiceErrors(t *testing.T) {
	p := demoPlanner(t)
	for _, c := range []struct {
		id, want string
	}{
		{"", "no sample id"},
		{"NATIVE-R9", "did you mean"},
		{"C3-I-R3", "pH 17.08"}, // rejected in the demo: a stray digit
	} {
		_, _, err := p.Water("water", c.id)
		if !errors.Is(err, ErrSample) || !strings.Contains(err.Error(), c.want) {
			t.Errorf("%q: %v, want ErrSample mentioning %q", c.id, err, c.want)
		}
	}
}

func TestWellCheck(t *testing.T) {
	ok := DefaultWell()
	if err := ok.Check(); err != nil {
		t.Fatal(err)
	}
	for name, mod := range map[string]func(*Well){
		"negative rate":  func(w *Well) { w.RateM3PerDay = -1 },
		"infinite rate":  func(w *Well) { w.RateM3PerDay = math.Inf(1) },
		"zero days":      func(w *Well) { w.Days = 0 },
		"porosity 1":     func(w *Well) { w.Porosity = 1 },
		"radius in bore": func(w *Well) { w.RadiusM = 0.1 },
		"fill share 0":   func(w *Well) { w.FillShare = 0 },
		"NaN screen":     func(w *Well) { w.ScreenLengthM = math.NaN() },
	} {
		w := ok
		mod(&w)
		if w.Check() == nil {
			t.Errorf("%s accepted", name)
		}
	}
}

// Without end-members named or typed in the input, a report has no injection
// section (and no error).
func TestSectionNeedsEndMembers(t *testing.T) {
	p := demoPlanner(t)
	p.recs = p.recs[10:20] // monitoring wells only
	sec, figs, err := p.Section(SectionOptions{AquiferTempC: math.NaN(), Well: DefaultWell()})
	if sec != nil || figs != nil || err != nil {
		t.Fatalf("section %v, %d figures, %v", sec, len(figs), err)
	}
}

// A pore-filling screen at an absurd rate fills the pores within the radius:
// it says "fully clogged" with the time, never a share above 100 %.
func TestPoreFillFullyClogged(t *testing.T) {
	p := demoPlanner(t)
	w := DefaultWell()
	w.RateM3PerDay, w.RadiusM = 1e6, 0.5
	r, err := p.PoreFill(PoreFillOptions{Deposit: DepositOptions{Water: WaterChoice{Native: "NATIVE-R1", Injectate: "INJ-R2", Share: 0.6}}, Well: w})
	if err != nil {
		t.Fatal(err)
	}
	s := strings.Join(r.Sentences(), " ")
	if !r.Clogging.FullyClogged || !strings.Contains(s, "fully clogged") || r.Clogging.FilledFraction > 1 {
		t.Errorf("%+v: %s", r.Clogging, s)
	}
}
