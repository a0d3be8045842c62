package speciation

import (
	"errors"
	"math"
	"strings"
	"testing"
)

// withoutRedox returns the embedded data set without the electron and every entry
// that needs it (directly or through an earlier species): the data as it was before
// redox was added.
func withoutRedox(t *testing.T) *Database {
	t.Helper()
	blocks := strings.Split(Thermo(), "\n[")
	dropped := map[string]bool{"e-": true}
	var keep []string
	for i, b := range blocks {
		if i == 0 {
			keep = append(keep, b)
			continue
		}
		head, body, _ := strings.Cut(b, "]")
		name := strings.Join(strings.Fields(head)[1:], " ")
		drop := dropped[name]
		for _, line := range strings.Split(body, "\n") {
			k, v, ok := strings.Cut(line, "=")
			if !ok || strings.TrimSpace(k) != "reaction" {
				continue
			}
			raw, err := parseReaction(v)
			if err != nil {
				t.Fatal(err)
			}
			for _, term := range raw {
				drop = drop || dropped[term.Component]
			}
		}
		if drop {
			dropped[name] = true
			continue
		}
		keep = append(keep, b)
	}
	db, err := ParseDatabase(strings.Join(keep, "\n["))
	if err != nil {
		t.Fatal(err)
	}
	if db.ElectronIndex() >= 0 || db.MineralIndex("ferrihydrite") >= 0 {
		t.Fatal("redox entries left")
	}
	return db
}

// Without a pe the solver gives exactly what it gave before the redox entries
// existed: every species, SI and total equal to the last bit on the native water and
// its variants, cold and warm.
func TestNoPEUnchanged(t *testing.T) {
	full, old := mustDefault(t), withoutRedox(t)
	for _, warm := range []bool{false, true} {
		a, b := NewSolver(full, TruesdellJones{}), NewSolver(old, TruesdellJones{})
		a.WarmStart, b.WarmStart = warm, warm
		for i, w := range append([]Water{nativeWater()}, nativeVariants(16)...) {
			ra, err := a.Solve(&w)
			if err != nil {
				t.Fatal(err)
			}
			rb, err := b.Solve(&w)
			if err != nil {
				t.Fatal(err)
			}
			if ra.IonicStrength != rb.IonicStrength || ra.PH != rb.PH || len(ra.Species) != len(rb.Species) ||
				len(ra.Minerals) != len(rb.Minerals) || ra.Alkalinity != rb.Alkalinity || ra.Iterations != rb.Iterations {
				t.Fatalf("water %d (warm %v): I %v/%v, %d/%d species, %d/%d minerals", i, warm,
					ra.IonicStrength, rb.IonicStrength, len(ra.Species), len(rb.Species), len(ra.Minerals), len(rb.Minerals))
			}
			for k := range ra.Species {
				if ra.Species[k] != rb.Species[k] {
					t.Errorf("water %d: %+v vs %+v", i, ra.Species[k], rb.Species[k])
				}
			}
			for k := range ra.Minerals {
				if ra.Minerals[k] != rb.Minerals[k] {
					t.Errorf("water %d: %+v vs %+v", i, ra.Minerals[k], rb.Minerals[k])
				}
			}
			if ra.HasPE || !ra.RedoxSkipped || rb.RedoxSkipped {
				t.Errorf("water %d: HasPE %v, RedoxSkipped %v/%v", i, ra.HasPE, ra.RedoxSkipped, rb.RedoxSkipped)
			}
			if _, ok := ra.SI("ferrihydrite"); ok {
				t.Error("ferrihydrite SI without a pe")
			}
		}
	}
}

// Fe(III) hydrolysis constants at 25 C against Stefansson (2007), ES&T 41, 6117
// (abstract): log beta 1-4 = -2.19, -5.76, -14.30, -21.71, dimer -2.92; Fe3+/Fe2+ from
// E0 = 0.771 V (Bard, Parsons & Jordan 1985): -0.771/0.059159 = -13.03 within 0.02.
// Each species is expanded to Fe2+ - e-, so its log K from components is log beta +
// log K(Fe3+).
func TestFeIIIConstants(t *testing.T) {
	db := mustDefault(t)
	k := func(name string) float64 { return db.species[db.SpeciesIndex(name)].LogK.At(T25) }
	if got := k("Fe3+"); math.Abs(got-(-0.771/0.059159)) > 0.02 {
		t.Errorf("Fe3+ %.3f", got)
	}
	fe3 := k("Fe3+")
	for _, tc := range []struct {
		name string
		beta float64
		n    float64 // Fe per species
	}{{"FeOH2+", -2.19, 1}, {"Fe(OH)2+", -5.76, 1}, {"Fe(OH)3(aq)", -14.30, 1}, {"Fe(OH)4-", -21.71, 1}, {"Fe2(OH)2 4+", -2.92, 2}} {
		if got := k(tc.name) - tc.n*fe3; math.Abs(got-tc.beta) > 0.005 {
			t.Errorf("%s: log beta %.3f, Stefansson %.2f", tc.name, got, tc.beta)
		}
		if e, ok := db.Electrons(db.SpeciesIndex(tc.name), db.ComponentIndex("Fe2+")); !ok || e != -1 {
			t.Errorf("%s: %g electrons per Fe", tc.name, e)
		}
	}
	// FeSO4+ is Fe(III) on iron and sulfate on sulfur.
	si := db.SpeciesIndex("FeSO4+")
	if e, _ := db.Electrons(si, db.ComponentIndex("Fe2+")); e != -1 {
		t.Errorf("FeSO4+ on Fe: %g", e)
	}
	if e, _ := db.Electrons(si, db.ComponentIndex("SO4 2-")); e != 0 {
		t.Errorf("FeSO4+ on S: %g", e)
	}
}

// Ferrihydrite in dilute oxidised water: the dissolved Fe(III) is least near pH 8
// (Cornell & Schwertmann 2003, The Iron Oxides, ch. 9: minimum solubility of the Fe(III)
// oxides near pH 7-8; from memory), and its value is that of Stefansson's (2007)
// constants by hand: at pH 8, a(Fe3+) = 10^(3.50 - 24); Fe(OH)2+ 10^(-5.76 + 16),
// Fe(OH)3 10^-14.30 x 10^24, Fe(OH)4- 10^-21.71 x 10^32 times a(Fe3+):
// 10^-10.26 + 10^-10.80 + 10^-10.21 = 1.33e-10 mol/kg (activity coefficients of
// about 0.97 for the monovalent ions at I = 1e-3 raise it by 3 %).
func TestFerrihydriteSolubility(t *testing.T) {
	db := mustDefault(t)
	s := NewSolver(db, TruesdellJones{})
	solub := func(ph float64) float64 {
		w := dilute()
		w.PH = ph
		w.SetPE(20.0 - ph) // oxidising, within the stability of water
		w.SetTotal("Fe2+", 1e-9)
		w.Equilibrate("ferrihydrite", 0)
		res, err := s.Solve(&w)
		if err != nil {
			t.Fatalf("pH %g: %v", ph, err)
		}
		tot, _ := res.Total("Fe2+")
		return tot
	}
	hand := math.Pow(10, -10.26) + math.Pow(10, -10.80) + math.Pow(10, -10.21)
	if got := solub(8); math.Abs(math.Log10(got/hand)) > 0.03 {
		t.Errorf("pH 8: %.3g mol/kg, by hand %.3g", got, hand)
	}
	minPH, minV := 0.0, math.Inf(1)
	for ph := 5.0; ph <= 11; ph += 0.1 {
		if v := solub(ph); v < minV {
			minPH, minV = ph, v
		}
	}
	if minPH < 7 || minPH > 9 {
		t.Errorf("minimum solubility at pH %.1f (%.3g mol/kg)", minPH, minV)
	}
}

// pK1 of H2S at 25 C: 6.99 in the data; Suleimenov & Seward (1997), GCA 61, 5187,
// measured about 7.0 (from memory): within 0.05. HS- and H2S(aq) are sulfide (+8
// electrons on sulfate).
func TestH2SpK1(t *testing.T) {
	db := mustDefault(t)
	k := db.species[db.SpeciesIndex("H2S(aq)")].LogK.At(T25) - db.species[db.SpeciesIndex("HS-")].LogK.At(T25)
	if math.Abs(k-7.0) > 0.05 {
		t.Errorf("pK1 %.3f", k)
	}
	for _, n := range []string{"HS-", "H2S(aq)"} {
		if e, _ := db.Electrons(db.SpeciesIndex(n), db.ComponentIndex("SO4 2-")); e != 8 {
			t.Errorf("%s: %g electrons", n, e)
		}
	}
}

// Mackinawite SI for a water computed by hand with the ideal model (a = m) at 25 C,
// pH 7, pe -4, Fe 1e-5 and S 1e-4 mol/kg, 2e-4 NaCl, with the data's constants:
//   - sulfur: HS-/SO4 2- = 10^(33.65 - 9 pH - 8 pe) = 10^2.65 and H2S/HS- = 10^(6.994 - pH)
//     (NaSO4- and FeSO4(aq) are below 1e-6 of S at that sulfate);
//   - iron: FeOH+/Fe2+ = 10^(-9.5 + 7); Fe(III) at pe -4 is 10^-17 of Fe(II) even with
//     its hydrolysis, and there is no carbonate: m(Fe2+) = 1e-5 / (1 + 10^-2.5);
//   - SI = log m(Fe2+) + log m(H2S) + 2 pH - 3.5 (Rickard 2006, FeS + 2 H+ = Fe2+ + H2S).
func TestMackinawiteSIByHand(t *testing.T) {
	db := mustDefault(t)
	s := NewSolver(db, Ideal{})
	w := Water{TempC: 25, PH: 7}
	w.SetTotal("Fe2+", 1e-5)
	w.SetTotal("SO4 2-", 1e-4)
	w.SetTotal("Na+", 2e-4)
	w.SetTotal("Cl-", 2e-4)
	w.SetPE(-4)
	res, err := s.Solve(&w)
	if err != nil {
		t.Fatal(err)
	}
	hsPerSO4 := math.Pow(10, 33.65-63+32)
	h2sPerHS := math.Pow(10, 6.994-7)
	hs := 1e-4 / (1 + 1/hsPerSO4 + h2sPerHS)
	h2s := hs * h2sPerHS
	fe := 1e-5 / (1 + math.Pow(10, -2.5))
	want := math.Log10(fe) + math.Log10(h2s) + 14 - 3.5
	got, ok := res.SI("mackinawite")
	if !ok || math.Abs(got-want) > 0.005 {
		t.Errorf("SI mackinawite %.4f, by hand %.4f", got, want)
	}
	// The same water without a pe has no sulfide SI and says why.
	w.ClearPE()
	res, err = s.Solve(&w)
	if err != nil {
		t.Fatal(err)
	}
	if _, ok := res.SI("mackinawite"); ok || !res.RedoxSkipped {
		t.Errorf("no pe: mackinawite computed or RedoxSkipped %v", res.RedoxSkipped)
	}
}

// A pe above the upper stability limit of water is flagged; one inside is not;
// one below the lower limit (pe < -pH) is flagged.
func TestWaterStabilityWarnings(t *testing.T) {
	s := NewSolver(mustDefault(t), TruesdellJones{})
	for _, tc := range []struct {
		pe   float64
		warn string
	}{{14.5, WarnAboveWater}, {12, ""}, {-7.5, WarnBelowWater}} {
		w := dilute()
		w.SetPE(tc.pe)
		res, err := s.Solve(&w)
		if err != nil {
			t.Fatal(err)
		}
		got := ""
		for _, m := range res.Warnings {
			if m == WarnAboveWater || m == WarnBelowWater {
				got = m
			}
		}
		if got != tc.warn || !res.HasPE || res.PE != tc.pe {
			t.Errorf("pe %g: warning %q, pe %v", tc.pe, got, res.PE)
		}
	}
}

// Alkalinity reference levels of the redox species: HS- counts 1 (HS- + H+ = H2S),
// H2S(aq) 0, NH4+ 0 and NH3(aq) 1, O2(aq) 0, Fe3+ 0 and Fe(OH)2+ 2 (as FeOH+ counts 1).
func TestRedoxAlkalinity(t *testing.T) {
	db := mustDefault(t)
	for _, tc := range []struct {
		name string
		alk  float64
	}{{"HS-", 1}, {"H2S(aq)", 0}, {"NH4+", 0}, {"NH3(aq)", 1}, {"O2(aq)", 0}, {"Fe3+", 0}, {"Fe(OH)2+", 2}, {"FeOH+", 1}, {"HCO3-", 1}} {
		if got := db.species[db.SpeciesIndex(tc.name)].Alkalinity; got != tc.alk {
			t.Errorf("%s: alkalinity %g, want %g", tc.name, got, tc.alk)
		}
	}
}

// Electrons written beside two components cannot be given to one oxidation state.
func TestRedoxParseRejects(t *testing.T) {
	const base = "[component H2O]\ncharge = 0\n[component H+]\ncharge = 1\nion_size = 9\n[component e-]\ncharge = -1\n" +
		"[component Fe2+]\ncharge = 2\nion_size = 6\n[component Mn2+]\ncharge = 2\nion_size = 6\n"
	_, err := ParseDatabase(base + "[species FeMn5+]\nreaction = Fe2+ + Mn2+ - e-\ncharge = 5\nion_size = 5\nlog10_k_25c = 0\nenthalpy = none\n")
	if !errors.Is(err, ErrInvalidParameter) {
		t.Errorf("ambiguous electrons: %v", err)
	}
	db, err := ParseDatabase(base + "[species Fe3+]\nreaction = Fe2+ - e-\ncharge = 3\nion_size = 9\nlog10_k_25c = -13.02\nenthalpy = none\n")
	if err != nil {
		t.Fatal(err)
	}
	if db.ElectronIndex() < 0 || db.SpeciesIndex("e-") >= 0 {
		t.Errorf("e- component %d, free species %d", db.ElectronIndex(), db.SpeciesIndex("e-"))
	}
}

// With a pe, a warm start gives what a cold start gives (within the tolerance),
// across the native-water variants at several pe values.
func TestPEWarmStart(t *testing.T) {
	db := mustDefault(t)
	warm, cold := NewSolver(db, TruesdellJones{}), NewSolver(db, TruesdellJones{})
	cold.WarmStart = false
	for i, w := range nativeVariants(24) {
		w.SetPE(-3 + 0.5*float64(i%12))
		rw, err := warm.Solve(&w)
		if err != nil {
			t.Fatal(err)
		}
		rc, err := cold.Solve(&w)
		if err != nil {
			t.Fatal(err)
		}
		for k := range rc.Species {
			a, b := rw.Species[k].Molality, rc.Species[k].Molality
			if math.Abs(a-b) > 1e-8*math.Max(math.Abs(b), 1e-30) && math.Abs(a-b) > 1e-25 {
				t.Errorf("water %d %s: warm %.10g cold %.10g", i, rc.Species[k].Name, a, b)
			}
		}
		checkFinite(t, "pe water", rw)
	}
}

// The electron as a master variable, by hand (ideal activities, 25 C, pH 2, Fe 1e-6
// mol/kg with NaCl): at pe = log K(Fe2+ = Fe3+ + e-) = 13.02 the free Fe3+ and Fe2+ are
// equal, so Fe(III)/Fe(II) = (1 + 10^(-2.19 + 2) + 10^(-5.76 + 4) + 10^(-14.30 + 6)
// + 10^(-21.71 + 8) + FeCl2+ 10^1.48 x 1e-3) / (1 + 10^(-9.5 + 2)) with Stefansson's
// (2007) constants (the dimer is below 1e-6 of Fe(III) at this iron); one pe unit
// higher multiplies it by 10.
func TestFeIIIFractionByHand(t *testing.T) {
	s := NewSolver(mustDefault(t), Ideal{})
	ratio := func(pe float64) float64 {
		w := Water{TempC: 25, PH: 2}
		w.SetTotal("Fe2+", 1e-6)
		w.SetTotal("Na+", 1e-3)
		w.SetTotal("Cl-", 1e-3)
		w.SetPE(pe)
		res, err := s.Solve(&w)
		if err != nil {
			t.Fatal(err)
		}
		db := s.Database()
		return db.StateTotal(res, "Fe2+", -1) / db.StateTotal(res, "Fe2+", 0)
	}
	p := math.Pow
	want := (1 + p(10, -0.19) + p(10, -1.76) + p(10, -8.30) + p(10, -13.71) + p(10, 1.48)*1e-3) / (1 + p(10, -7.5))
	if got := ratio(13.02); math.Abs(got/want-1) > 0.002 {
		t.Errorf("Fe(III)/Fe(II) at pe 13.02: %.5f, by hand %.5f", got, want)
	}
	if r := ratio(14.02) / ratio(13.02); math.Abs(r-10) > 0.01 {
		t.Errorf("one pe unit: x%.4f", r)
	}
}
