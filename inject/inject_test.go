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

// An oxygenated injectate (8 mg/L O2) blended half and half with an iron-bearing
// anoxic water (2 mg/L Fe(II), no O2): the blend holds 4 mg/L O2 and 1 mg/L
// Fe(II), far more O2 than the 0.143 mg per mg Fe that 4 Fe2+ + O2 + 10 H2O =
// 4 Fe(OH)3 + 8 H+ needs, so all the iron is oxidised: 1 mg/L Fe gives
// 1.91 mg/L Fe(OH)3 (106.87/55.845, IUPAC 2013 atomic weights), about 1.9 g per
// m3, which the pore-filling screen counts as ferrihydrite.
func TestOxidationFeedsThePoreFill(t *testing.T) {
	csv := "Sample ID,Sample type,pH,Temp (C),Ca (mg/L),Mg (mg/L),Na (mg/L),K (mg/L),Cl (mg/L),SO4 (mg/L),Alkalinity (mg/L as CaCO3),Fe (mg/L),DO (mg/L)\n" +
		"INJ,injectate,7.8,15,40,8,15,2,20,30,120,0.001,8\n" +
		"NAT,native,7.0,15,80,15,40,3,50,60,250,2,\n"
	b, err := hydro.Read(strings.NewReader(csv), "ox.csv", hydro.Options{ConfirmUnits: true})
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
	p := NewPlanner(db, nil, recs)
	r, err := p.PoreFill(PoreFillOptions{Deposit: DepositOptions{Water: WaterChoice{Native: "NAT", Injectate: "INJ", Share: 0.5}}, Well: DefaultWell()})
	if err != nil {
		t.Fatal(err)
	}
	if r.Oxidation == nil {
		t.Fatal("no oxidation step")
	}
	var fh float64
	for _, s := range r.Oxidation.Result.Solids {
		if s.Mineral == "ferrihydrite" {
			fh = s.GPerM3
		}
	}
	// Fe(II) of the blend: (2 + 0.001)/2 mg/L; each mg of Fe gives 106.87/55.845 mg Fe(OH)3.
	want := (2.0 + 0.001) / 2 * 106.87 / 55.845
	if math.Abs(fh-want) > 0.03*want {
		t.Errorf("ferrihydrite %.4g g/m3, want %.4g", fh, want)
	}
	found := false
	for _, s := range r.Clogging.Solids {
		found = found || s.Mineral == "ferrihydrite"
	}
	if !found {
		t.Error("the pore-filling screen does not count the ferrihydrite")
	}
}
