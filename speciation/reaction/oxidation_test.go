package reaction

import (
	"errors"
	"math"
	"testing"

	"gwsat.dev/gwsat/speciation"
)

// Standard atomic weights (IUPAC 2013, from memory): Fe 55.845, Mn 54.938, O 15.999,
// H 1.008.
const (
	massFe   = 55.845
	massMn   = 54.938
	massO2   = 31.998
	massFeOH = 55.845 + 3*(15.999+1.008) // Fe(OH)3 = 106.866
)

// Stoichiometry by hand (the textbook ratios, e.g. Hem 1985, USGS WSP 2254, for
// iron and manganese removal by aeration):
//   - 4 Fe2+ + O2 + 10 H2O -> 4 Fe(OH)3 + 8 H+: 31.998 / (4 x 55.845) = 0.143 mg O2 per
//     mg Fe, and 106.866 / 55.845 = 1.91 mg Fe(OH)3 per mg Fe;
//   - 2 Mn2+ + O2 + 2 H2O -> 2 MnO2 + 4 H+: 31.998 / (2 x 54.938) = 0.29 mg O2 per mg Mn.
func TestOxidationStoichiometry(t *testing.T) {
	if r := massO2 / (4 * massFe); math.Abs(r-0.143) > 0.0005 {
		t.Fatalf("O2/Fe %.4f", r)
	}
	if r := massFeOH / massFe; math.Abs(r-1.91) > 0.005 {
		t.Fatalf("Fe(OH)3/Fe %.4f", r)
	}
	if r := massO2 / (2 * massMn); math.Abs(r-0.29) > 0.005 {
		t.Fatalf("O2/Mn %.4f", r)
	}
	// The electron balance: 1 mg Fe (1/55.845 mmol) with plenty of O2 uses 0.143 mg O2
	// and forms 1.91 mg ferrihydrite; 1 mg Mn uses 0.29 mg O2.
	for _, tc := range []struct {
		name          string
		m             RedoxAmounts
		o2mg, solidMg float64
	}{
		{"Fe", RedoxAmounts{O2: 1e-3, FeII: 1e-3 / massFe}, 0.143, 1.91},
		{"Mn", RedoxAmounts{O2: 1e-3, MnII: 1e-3 / massMn}, 0.29, 0},
	} {
		m := tc.m
		o2 := m.O2
		steps := electronBalance(&m, true)
		if got := (o2 - m.O2) * massO2 * 1000; math.Abs(got-tc.o2mg) > 0.005 {
			t.Errorf("%s: %.4f mg O2 per mg, by hand %.3f", tc.name, got, tc.o2mg)
		}
		if tc.solidMg > 0 {
			if got := steps[0].Oxidised * massFeOH * 1000; math.Abs(got-tc.solidMg) > 0.005 {
				t.Errorf("%s: %.4f mg Fe(OH)3 per mg Fe", tc.name, got)
			}
		}
	}
}

// oxicAnoxic returns an oxygenated injectate (a) and a reduced native water (b), both
// with 2 mmol/kgw NaCl and 2 meq/kgw alkalinity at pH 7.5 and 7.0, b with Fe(II) and
// Mn(II).
func oxicAnoxic(t *testing.T, r *Reactor, fe, mn float64) (Solution, Solution) {
	a := speciation.Water{TempC: 15, PH: 7.5}
	a.SetTotal("Na+", 4e-3)
	a.SetTotal("Cl-", 2e-3)
	a.SetTotal("Ca2+", 1e-3)
	a.SetAlkalinity(4e-3)
	b := speciation.Water{TempC: 15, PH: 7.0}
	b.SetTotal("Na+", 4e-3)
	b.SetTotal("Cl-", 2e-3)
	b.SetTotal("Ca2+", 1e-3)
	b.SetTotal("Fe2+", fe)
	b.SetTotal("Mn2+", mn)
	b.SetAlkalinity(4e-3)
	return prepare(t, r, a), prepare(t, r, b)
}

// More O2 than the Fe(II) demand leaves O2 and no Fe(II); less, consumes all of the
// O2 and leaves Fe(II) = Fe - 4 O2 (the 4:1 stoichiometry) to 1e-9 mol/kg. Mixing is
// by mass of water: half and half.
func TestOxidationO2Balance(t *testing.T) {
	r := New(defaultDB(t), speciation.TruesdellJones{})
	a, b := oxicAnoxic(t, r, 100e-6, 0)
	// Mixture (half and half): Fe(II) 50 umol/kg. With 300 umol/kg O2 in a (150 in the
	// mix) the demand 50/4 = 12.5 umol/kg is met: 137.5 left, no Fe(II). With 20 (10 in
	// the mix) all O2 goes and oxidises 40 umol/kg: 10 umol/kg Fe(II) left.
	for _, tc := range []struct {
		o2        float64
		o2Left    float64
		feLeft    float64
		ferrihydr float64 // mol/kgw
		wantPE    bool
	}{
		{300e-6, 150e-6 - 50e-6/4, 0, 50e-6, true},
		{20e-6, 0, 50e-6 - 4*10e-6, 40e-6, false},
	} {
		ox, err := r.Oxidize(a, b, RedoxInput{O2: tc.o2}, RedoxInput{}, 0.5, 15, OxidationOptions{})
		if err != nil {
			t.Fatal(err)
		}
		if math.Abs(ox.Left.O2-tc.o2Left) > 1e-12 || math.Abs(ox.Left.FeII-tc.feLeft) > 1e-9 {
			t.Errorf("O2 %g: left O2 %.6g (want %.6g), Fe(II) %.6g (want %.6g)", tc.o2, ox.Left.O2, tc.o2Left, ox.Left.FeII, tc.feLeft)
		}
		if len(ox.Solids) != 1 || ox.Solids[0].Mineral != "ferrihydrite" || math.Abs(ox.Solids[0].MolKgw-tc.ferrihydr) > 1e-12 {
			t.Errorf("O2 %g: solids %+v", tc.o2, ox.Solids)
		}
		// g/m3 = mol/kgw x 1000 kg/m3 x 106.87 g/mol
		if g := ox.Solids[0].GPerM3; math.Abs(g-tc.ferrihydr*1000*106.867) > 1e-6 {
			t.Errorf("g/m3 %.6g", g)
		}
		if got, _ := ox.Result.Total("Fe2+"); math.Abs(got-tc.feLeft) > 1e-12 {
			t.Errorf("re-solved Fe2+ total %.6g", got)
		}
		// Alkalinity falls by 2 eq per mol of Fe oxidised (8 H+ per 4 Fe).
		mixAlk := 0.5*a.Alkalinity + 0.5*b.Alkalinity
		if d := mixAlk - ox.After.Alkalinity; math.Abs(d-2*tc.ferrihydr) > 1e-12 {
			t.Errorf("alkalinity change %.6g, want %.6g", d, 2*tc.ferrihydr)
		}
		if ox.HasPE != tc.wantPE {
			t.Errorf("O2 %g: HasPE %v", tc.o2, ox.HasPE)
		}
		if ox.HasPE {
			// oxygenated water at about pH 7.2: pe near 20.75 - pH + 1/4 log pO2 (Stumm & Morgan)
			if ox.PE < 12 || ox.PE > 14.5 {
				t.Errorf("pe %.2f", ox.PE)
			}
		}
		cl := ox.CloggingSolids()
		if len(cl) != 1 || cl[0].MolPerM3 != ox.Solids[0].MolPerM3 {
			t.Errorf("clogging solids %+v", cl)
		}
	}
}

// The order: sulfide before Fe(II) before Mn(II). With O2 for sulfide and part of the
// iron, all sulfide goes (8 e- each), then Fe(II); Mn(II) is untouched. Nitrate then
// takes over from O2 (5 e- per N).
func TestOxidationOrder(t *testing.T) {
	m := RedoxAmounts{O2: 30e-6, FeII: 50e-6, MnII: 10e-6, Sulfide: 10e-6}
	steps := electronBalance(&m, false)
	// sulfide: 10 umol x 8 = 80 umol e- = 20 umol O2; Fe: 10 umol O2 left = 40 umol e-.
	if m.Sulfide != 0 || math.Abs(m.FeII-10e-6) > 1e-15 || m.MnII != 10e-6 || m.O2 != 0 {
		t.Errorf("left %+v", m)
	}
	if len(steps) != 2 || steps[0].Reductant != "sulfide" || steps[1].Reductant != "Fe(II)" {
		t.Errorf("steps %+v", steps)
	}
	m = RedoxAmounts{O2: 5e-6, NO3: 100e-6, FeII: 50e-6, MnII: 10e-6}
	steps = electronBalance(&m, true)
	// Fe: 20 umol e- from O2, 30 from NO3 (6 umol); Mn: 20 umol e- from NO3 (4 umol).
	if m.FeII != 0 || m.MnII != 0 || math.Abs(m.NO3-90e-6) > 1e-15 {
		t.Errorf("with nitrate: left %+v, steps %+v", m, steps)
	}
}

func TestOxidationRejects(t *testing.T) {
	r := New(defaultDB(t), speciation.TruesdellJones{})
	a, b := oxicAnoxic(t, r, 10e-6, 1e-6)
	for _, tc := range []struct {
		name string
		err  error
		run  func() error
	}{
		{"negative O2", ErrNegative, func() error {
			_, err := r.Oxidize(a, b, RedoxInput{O2: -1}, RedoxInput{}, 0.5, 15, OxidationOptions{})
			return err
		}},
		{"fraction", ErrFraction, func() error {
			_, err := r.Oxidize(a, b, RedoxInput{}, RedoxInput{}, 1.5, 15, OxidationOptions{})
			return err
		}},
		{"solid", ErrUnknownMineral, func() error {
			_, err := r.Oxidize(a, b, RedoxInput{}, RedoxInput{}, 0.5, 15, OxidationOptions{FeSolid: "unobtainium"})
			return err
		}},
		{"temperature", ErrTemperature, func() error {
			_, err := r.Oxidize(a, b, RedoxInput{}, RedoxInput{}, 0.5, 150, OxidationOptions{})
			return err
		}},
	} {
		if err := tc.run(); !errors.Is(err, tc.err) {
			t.Errorf("%s: %v", tc.name, err)
		}
	}
}

// PrepareRedox splits a sulfidic water: the sulfide it reports plus the sulfate left
// (species sums: within the solver tolerance, 1e-9 relative here)
// in the Solution is the sulfur given; O2 is nil at pe -3; without a pe the redox
// input is empty. Oxidising it with an oxygenated water takes the sulfide first
// (8 electrons, 2 O2 per S).
func TestPrepareRedox(t *testing.T) {
	db := defaultDB(t)
	r := New(db, speciation.TruesdellJones{})
	w := speciation.Water{TempC: 15, PH: 7.0}
	w.SetTotal("Na+", 4e-3)
	w.SetTotal("Cl-", 2e-3)
	w.SetTotal("Ca2+", 1e-3)
	w.SetTotal("SO4 2-", 1e-3)
	w.SetTotal("Fe2+", 5e-6)
	w.SetAlkalinity(4e-3)
	w.SetPE(-3.3)
	sol, in, res, err := r.PrepareRedox(&w)
	if err != nil {
		t.Fatal(err)
	}
	if in.Sulfide <= 0 || math.Abs(in.Sulfide+sol.Total("SO4 2-")-1e-3) > 1e-12 || in.O2 > 1e-30 {
		t.Errorf("sulfide %.4g + sulfate %.4g (total 1e-3), O2 %.3g", in.Sulfide, sol.Total("SO4 2-"), in.O2)
	}
	if !res.HasPE || sol.Total("Fe2+") != 5e-6 {
		t.Errorf("pe %v, Fe %.3g", res.HasPE, sol.Total("Fe2+"))
	}
	inj := speciation.Water{TempC: 15, PH: 7.5}
	inj.SetTotal("Na+", 4e-3)
	inj.SetTotal("Cl-", 2e-3)
	inj.SetTotal("Ca2+", 1e-3)
	inj.SetAlkalinity(4e-3)
	a, ra, _, err := r.PrepareRedox(&inj)
	if err != nil || ra != (RedoxInput{}) {
		t.Fatalf("no pe: %+v %v", ra, err)
	}
	ra.O2 = 300e-6
	ox, err := r.Oxidize(a, sol, ra, in, 0.5, 15, OxidationOptions{})
	if err != nil {
		t.Fatal(err)
	}
	if ox.Steps[0].Reductant != "sulfide" || math.Abs(ox.Steps[0].Consumed-2*ox.Steps[0].Oxidised) > 1e-18 || ox.Left.Sulfide != 0 {
		t.Errorf("steps %+v, left %+v", ox.Steps, ox.Left)
	}
	if got := ox.After.Total("SO4 2-"); math.Abs(got-0.5e-3) > 1e-12 {
		t.Errorf("sulfate after %.6g, want 0.5e-3 (all sulfur of the mixture)", got)
	}
}
