package speciation

import (
	"errors"
	"math"
	"strings"
	"testing"
)

func mustDefault(t testing.TB) *Database {
	t.Helper()
	db, err := Default()
	if err != nil {
		t.Fatal(err)
	}
	return db
}

// Calcite in pure water at 25 C in equilibrium with pCO2 = 10^-3.5 atm.
// Textbook result (e.g. Stumm & Morgan) [M], from memory: Ca about
// 0.5 mmol/kg and pH about 8.3. Also derived values [D] (constants
// of Plummer & Busenberg 1982, not a published number, a regression value): pH 8.279 and
// Ca 0.493 mmol/kg (Truesdell-Jones), pH 8.279 and Ca 0.494 (Davies).
func TestCalciteOpenSystem(t *testing.T) {
	db := mustDefault(t)
	tests := []struct {
		model    ActivityModel
		pHD, caD float64
	}{
		{TruesdellJones{}, 8.279, 0.493e-3},
		{Davies{}, 8.279, 0.494e-3},
	}
	for _, tc := range tests {
		w := Water{TempC: 25, PHFromChargeBalance: true}
		w.FixByPhase("Ca2+", "calcite", 0)
		w.FixByPhase("CO3 2-", "CO2(g)", -3.5)
		res, err := NewSolver(db, tc.model).Solve(&w)
		if err != nil {
			t.Fatal(err)
		}
		ca, _ := res.Total("Ca2+")
		// [M] textbook: tolerance 0.1 pH and 0.05 mmol/kg.
		if math.Abs(res.PH-8.3) > 0.1 || math.Abs(ca-0.5e-3) > 0.05e-3 {
			t.Errorf("%s: pH %.3f Ca %.4g mol/kg, textbook 8.3 and 0.5e-3", tc.model.Name(), res.PH, ca)
		}
		// [D] derived regression values: same constants, so 0.003 pH and 0.003 mmol/kg.
		if math.Abs(res.PH-tc.pHD) > 0.003 || math.Abs(ca-tc.caD) > 0.003e-3 {
			t.Errorf("%s: pH %.4f Ca %.5g, derived %.3f %.4g", tc.model.Name(), res.PH, ca, tc.pHD, tc.caD)
		}
		if !res.HasLogPCO2 || math.Abs(res.LogPCO2+3.5) > 1e-9 {
			t.Errorf("log pCO2 %v", res.LogPCO2)
		}
		if si, _ := res.SI("calcite"); math.Abs(si) > 1e-9 {
			t.Errorf("SI calcite %g", si)
		}
		if math.Abs(res.ChargeBalance) > 1e-8 {
			t.Errorf("charge balance %g %%", res.ChargeBalance)
		}
	}
}

// Gypsum dissolved into pure water at 25 C to SI = 0 (closed system, pH by charge
// balance). Published solubility: 15.2-15.4 mmol/kg [M], and estimates spanning
// 0.0147-0.0182 M (Lebedev & Kosorukov 2017, Geochem. Int. 55, 205-210) [V].
// An ion-association model with extended Debye-Hueckel coefficients at I ~ 0.04
// overestimates the solubility by a few percent.
func TestGypsumSolubility(t *testing.T) {
	db := mustDefault(t)
	for _, model := range []ActivityModel{TruesdellJones{}, Davies{}} {
		w := Water{TempC: 25, PHFromChargeBalance: true}
		w.SetTotal("Ca2+", 1e-9)
		w.SetTotal("SO4 2-", 1e-9)
		w.Equilibrate("gypsum", 0)
		res, err := NewSolver(db, model).Solve(&w)
		if err != nil {
			t.Fatal(err)
		}
		d, _ := res.PhaseAmountOf("gypsum")
		t.Logf("%s: gypsum dissolved %.4g mol/kgw, I %.4f", model.Name(), d, res.IonicStrength)
		if d < 0.0147 || d > 0.0182 {
			t.Errorf("%s: gypsum solubility %.4g mol/kgw, published 0.0147-0.0182", model.Name(), d)
		}
		// [M] 15.2-15.4 mmol/kg: the model gives 15.7 (TJ) and 16.1 (Davies); +/-0.8 mmol/kg.
		if math.Abs(d-0.0153) > 0.0008 {
			t.Errorf("%s: gypsum solubility %.4g mol/kgw, published (from memory) 0.0152-0.0154", model.Name(), d)
		}
		if si, _ := res.SI("gypsum"); math.Abs(si) > 1e-9 {
			t.Errorf("SI gypsum %g", si)
		}
	}
}

// garrelsThompsonGammas is a test-only activity model: the fixed activity coefficients
// Garrels & Thompson (1962) assumed for sea water [M], from memory:
// Na+ 0.76, K+ 0.64, Mg2+ 0.36, Ca2+ 0.28, Cl- 0.64, SO4 2- 0.12, HCO3- 0.68, CO3 2- 0.20,
// other monovalent ions (pairs) 0.68, neutral pairs 1.13. It shows that a model can be
// plugged in through the ActivityModel interface without touching the solver.
type garrelsThompsonGammas struct{}

func (garrelsThompsonGammas) Name() string              { return "garrels-thompson-1962" }
func (garrelsThompsonGammas) MaxIonicStrength() float64 { return 1 }
func (garrelsThompsonGammas) LogGammas(logG, dLogG []float64, st *ActivityState) float64 {
	for i := range logG {
		sp := &st.DB.species[st.Species[i]]
		g := 1.13
		switch sp.Name {
		case "Na+":
			g = 0.76
		case "K+", "Cl-":
			g = 0.64
		case "Mg2+":
			g = 0.36
		case "Ca2+":
			g = 0.28
		case "SO4 2-":
			g = 0.12
		case "CO3 2-":
			g = 0.20
		default:
			if sp.Charge != 0 {
				g = 0.68
			}
		}
		logG[i] = math.Log10(g)
		dLogG[i] = 0
	}
	return 0
}

// seaWater is the Garrels & Thompson (1962) input [M]: molal Na 0.48, K 0.010, Mg 0.054,
// Ca 0.010, Cl 0.56, SO4 0.028, total carbonate 0.0024 + 0.00027, pH 8.1-8.2 (8.15 here).
func seaWater() Water {
	w := Water{TempC: 25, PH: 8.15}
	w.SetTotal("Na+", 0.48)
	w.SetTotal("K+", 0.010)
	w.SetTotal("Mg2+", 0.054)
	w.SetTotal("Ca2+", 0.010)
	w.SetTotal("Cl-", 0.56)
	w.SetTotal("SO4 2-", 0.028)
	w.SetTotal("CO3 2-", 0.0024+0.00027)
	return w
}

// Seawater speciation against Garrels & Thompson (1962), Am. J. Sci. 260, 57-66
// [M], from memory. With their fixed activity coefficients and our ion-pair
// constants: +/-3 % absolute for the free fractions of SO4, Mg and Ca and for the sulfate
// pairs of Mg and Ca (+/-4 % for NaSO4-: our log K 0.70 is from memory and theirs is not
// recorded here); Na and K free above 97 %; the carbonate-ion ordering of their table,
// MgCO3 67 > NaCO3- 17 > free 9 > CaCO3 7 % (a remembered summary "Mg > Na > Ca > free"
// contradicts the table's own numbers; we follow the numbers).
// With Truesdell-Jones (a different activity model: gamma(SO4 2-) = 0.18 at I = 0.67
// instead of their 0.12, so more sulfate is paired) the SO4 free fraction is allowed
// +/-7 % and Mg, Ca +/-3 %.
func TestSeawaterGarrelsThompson(t *testing.T) {
	db := mustDefault(t)
	w := seaWater()
	tests := []struct {
		model  ActivityModel
		tolSO4 float64
	}{
		{garrelsThompsonGammas{}, 3},
		{TruesdellJones{}, 7},
	}
	for _, tc := range tests {
		res, err := NewSolver(db, tc.model).Solve(&w)
		if err != nil {
			t.Fatal(err)
		}
		name := tc.model.Name()
		free := []struct {
			comp      string
			want, tol float64
		}{
			{"SO4 2-", 54, tc.tolSO4}, {"Mg2+", 87, 3}, {"Ca2+", 91, 3},
		}
		for _, f := range free {
			if got := res.Percent(f.comp, f.comp); math.Abs(got-f.want) > f.tol {
				t.Errorf("%s: free %s %.1f %%, Garrels & Thompson %g %%", name, f.comp, got, f.want)
			}
		}
		for _, c := range []string{"Na+", "K+"} {
			if got := res.Percent(c, c); got < 97 {
				t.Errorf("%s: free %s %.1f %%, Garrels & Thompson 99 %%", name, c, got)
			}
		}
		if tc.tolSO4 == 3 {
			for _, p := range []struct {
				sp   string
				want float64
				tol  float64
			}{{"NaSO4-", 21, 4}, {"MgSO4(aq)", 22, 3}, {"CaSO4(aq)", 3, 3}} {
				if got := res.Percent("SO4 2-", p.sp); math.Abs(got-p.want) > p.tol {
					t.Errorf("%s: %s %.1f %% of sulfate, Garrels & Thompson %g %%", name, p.sp, got, p.want)
				}
			}
		}
		m := res.Molality
		if !(m("MgCO3(aq)") > m("NaCO3-") && m("NaCO3-") > m("CO3 2-") && m("CO3 2-") > m("CaCO3(aq)")) {
			t.Errorf("%s: carbonate ordering: Mg %.3g Na %.3g Ca %.3g free %.3g; Garrels & Thompson Mg 67 > Na 17 > free 9 > Ca 7 %%",
				name, m("MgCO3(aq)"), m("NaCO3-"), m("CaCO3(aq)"), m("CO3 2-"))
		}
		if !(m("HCO3-") > m("MgHCO3+") && m("MgHCO3+") > m("CaHCO3+")) {
			t.Errorf("%s: bicarbonate ordering: free %.3g Mg %.3g Ca %.3g", name, m("HCO3-"), m("MgHCO3+"), m("CaHCO3+"))
		}
		if len(res.Warnings) != 0 {
			t.Errorf("%s: unexpected warnings %v", name, res.Warnings)
		}
		t.Logf("%s: I %.3f; free SO4 %.1f Mg %.1f Ca %.1f CO3 %.1f HCO3 %.1f; CO3 pairs Mg %.1f Na %.1f Ca %.1f", name, res.IonicStrength,
			res.Percent("SO4 2-", "SO4 2-"), res.Percent("Mg2+", "Mg2+"), res.Percent("Ca2+", "Ca2+"),
			res.Percent("CO3 2-", "CO3 2-"), res.Percent("CO3 2-", "HCO3-"), res.Percent("CO3 2-", "MgCO3(aq)"),
			res.Percent("CO3 2-", "NaCO3-"), res.Percent("CO3 2-", "CaCO3(aq)"))
	}
	// Davies beyond its stated limit (0.5) must warn.
	resD, err := NewSolver(db, Davies{}).Solve(&w)
	if err != nil {
		t.Fatal(err)
	}
	if len(resD.Warnings) == 0 || resD.Warnings[0] != WarnIonicStrength {
		t.Errorf("Davies at I = %.2f: warnings %v", resD.IonicStrength, resD.Warnings)
	}
}

// fluoriteDB is a tiny data set without ion pairs for hand calculations.
const fluoriteDB = `
[component H2O]
charge = 0
[component H+]
charge = 1
ion_size = 9
[component Ca2+]
charge = 2
ion_size = 6
[component F-]
charge = -1
ion_size = 3.5
[mineral fluorite]
formula = CaF2
reaction = Ca2+ + 2 F-
log10_k_25c = -10.6
enthalpy = none
source = log Ksp used by the worked example
confidence = V
`

// GW-Project, Fluoride in Groundwater (2022), solution to exercise 6
// [V]: Ca 14.1 mg/L, F 2.62 mg/L, log Ksp = -10.6, concentrations only:
// SI(fluorite) = -0.57. With activities and CaF+ the SI must be lower.
func TestFluoriteWorkedExample(t *testing.T) {
	db, err := ParseDatabase(fluoriteDB)
	if err != nil {
		t.Fatal(err)
	}
	w := Water{TempC: 25, PH: 7}
	w.SetTotal("Ca2+", 14.1e-3/40.078) // mg/L taken as mg/kgw in dilute water
	w.SetTotal("F-", 2.62e-3/18.998)
	res, err := NewSolver(db, Ideal{}).Solve(&w)
	if err != nil {
		t.Fatal(err)
	}
	si, ok := res.SI("fluorite")
	if !ok || math.Abs(si+0.57) > 0.01 {
		t.Errorf("ideal SI %.4f, published -0.57", si)
	}
	full, err := NewSolver(mustDefault(t), TruesdellJones{}).Solve(&w)
	if err != nil {
		t.Fatal(err)
	}
	siFull, _ := full.SI("fluorite")
	if !(siFull < si-0.02) {
		t.Errorf("SI with activities and CaF+ %.3f, should be below %.3f", siFull, si)
	}
}

// Langelier index against the New York State Sanitary Code worked example,
// 10 NYCRR §6-1.30 [V]: 68 F, calcium hardness 140 mg/L and total
// alkalinity 20 mg/L as CaCO3, total hardness 200 mg/L, pH 7.8: SI = -0.8 ("corrosive"),
// band +/-0.5 (the nomograph method is approximate). Chloride added to balance charge
// (our assumption; the example gives no anions).
func TestLangelierNewYorkExample(t *testing.T) {
	db := mustDefault(t)
	w := Water{TempC: 20, PH: 7.8}
	w.SetTotal("Ca2+", 140e-3/100.087)
	w.SetTotal("Mg2+", 60e-3/100.087)
	w.SetAlkalinity(20e-3 / 50.04)
	w.SetTotal("Cl-", 2*200e-3/100.087-20e-3/50.04)
	res, err := NewSolver(db, TruesdellJones{}).Solve(&w)
	if err != nil {
		t.Fatal(err)
	}
	ix := res.Indices
	if !ix.HasLangelier || math.Abs(ix.Langelier+0.8) > 0.5 {
		t.Errorf("LSI %.2f (pHs %.2f), published -0.8 +/- 0.5", ix.Langelier, ix.PHs)
	}
	// Ryznar (1944): RSI = 2 pHs - pH; above 8 corrosion of mild steel is an increasing
	// problem (NACE interpretation) [V], consistent with "corrosive".
	if math.Abs(ix.Ryznar-(2*ix.PHs-res.PH)) > 1e-12 || ix.Ryznar < 8 {
		t.Errorf("RSI %.2f", ix.Ryznar)
	}
}

// Larson & Skold (1958) index by its definition, (Cl + 2 SO4)/(HCO3 + 2 CO3) in
// equivalents [M], on a hand-calculable water without ion pairs.
func TestLarsonSkoldDefinition(t *testing.T) {
	db, err := ParseDatabase(`
[component H2O]
charge = 0
[component H+]
charge = 1
alkalinity = -1
ion_size = 9
[component Na+]
charge = 1
ion_size = 4
[component Cl-]
charge = -1
ion_size = 3
[component SO4 2-]
charge = -2
ion_size = 4
[component CO3 2-]
charge = -2
alkalinity = 2
ion_size = 4.5
[species HCO3-]
reaction = CO3 2- + H+
charge = -1
log10_k_25c = 10.329
enthalpy = none
ion_size = 4
`)
	if err != nil {
		t.Fatal(err)
	}
	w := Water{TempC: 25, PH: 8}
	w.SetTotal("Na+", 0.01)
	w.SetTotal("Cl-", 2e-3)
	w.SetTotal("SO4 2-", 1e-3)
	w.SetTotal("CO3 2-", 3e-3)
	res, err := NewSolver(db, Ideal{}).Solve(&w)
	if err != nil {
		t.Fatal(err)
	}
	// by hand: HCO3/CO3 = 10^(10.329-8); carbonate equivalents = C (r + 2)/(r + 1)
	r := math.Pow(10, 10.329-8)
	want := (2e-3 + 2e-3) / (3e-3 * (r + 2) / (r + 1))
	if !res.Indices.HasLarsonSkold || math.Abs(res.Indices.LarsonSkold-want) > 1e-9*want {
		t.Errorf("Larson-Skold %.6f, by hand %.6f", res.Indices.LarsonSkold, want)
	}
}

// Property: a water built from the totals of a solution equilibrated with a mineral has
// SI = 0 for that mineral within 1e-6.
func TestSIZeroAtEquilibrium(t *testing.T) {
	db := mustDefault(t)
	s := NewSolver(db, TruesdellJones{})
	cases := []struct {
		mineral string
		build   func(w *Water)
	}{
		{"calcite", func(w *Water) {
			w.PHFromChargeBalance = true
			w.FixByPhase("Ca2+", "calcite", 0)
			w.FixByPhase("CO3 2-", "CO2(g)", -2)
		}},
		{"gypsum", func(w *Water) {
			w.PHFromChargeBalance = true
			w.SetTotal("Ca2+", 1e-9)
			w.SetTotal("SO4 2-", 1e-9)
			w.SetTotal("Na+", 0.05)
			w.SetTotal("Cl-", 0.05)
			w.Equilibrate("gypsum", 0)
		}},
		{"baryte", func(w *Water) {
			w.PH = 7.3
			w.SetTotal("Na+", 0.02)
			w.SetTotal("Cl-", 0.02)
			w.SetTotal("SO4 2-", 2e-3)
			w.SetTotal("Ba2+", 1e-7)
			w.FixByPhase("Ba2+", "baryte", 0)
		}},
	}
	for _, tc := range cases {
		w := Water{TempC: 15}
		tc.build(&w)
		res, err := s.Solve(&w)
		if err != nil {
			t.Fatalf("%s: %v", tc.mineral, err)
		}
		w2 := Water{TempC: 15, PH: res.PH}
		for _, tt := range res.Totals {
			w2.SetTotal(tt.Component, tt.MolKgw)
		}
		res2, err := s.Solve(&w2)
		if err != nil {
			t.Fatal(err)
		}
		if si, ok := res2.SI(tc.mineral); !ok || math.Abs(si) > 1e-6 {
			t.Errorf("%s: SI %.3g from rebuilt water", tc.mineral, si)
		}
	}
}

// Property: mass balances close and the alkalinity balance holds.
func TestMassBalancesClose(t *testing.T) {
	db := mustDefault(t)
	w := nativeWater()
	res, err := NewSolver(db, TruesdellJones{}).Solve(&w)
	if err != nil {
		t.Fatal(err)
	}
	for _, tt := range w.Totals() {
		ci := db.ComponentIndex(tt.Component)
		got := 0.0 // sum over species of nu m, from the species list and the data
		for _, sp := range res.Species {
			got += nuOf(db.species[db.SpeciesIndex(sp.Name)].Terms, ci) * sp.Molality
		}
		pct := 0.0
		for _, sh := range res.DistributionOf(tt.Component) {
			pct += sh.Percent
		}
		if math.Abs(got-tt.MolKgw) > 1e-9*tt.MolKgw || math.Abs(pct-100) > 1e-7 {
			t.Errorf("%s: species sum %.12g, given %.12g; shares sum %.10f %%", tt.Component, got, tt.MolKgw, pct)
		}
	}
	if math.Abs(res.Alkalinity-4e-3) > 1e-9*4e-3 {
		t.Errorf("alkalinity %.12g, given 4e-3", res.Alkalinity)
	}
	// ionic strength = 1/2 sum z^2 m
	I := 0.0
	for _, sp := range res.Species {
		I += 0.5 * sp.Charge * sp.Charge * sp.Molality
		if math.Abs(sp.Activity-sp.Gamma*sp.Molality) > 1e-12*sp.Activity {
			t.Errorf("%s activity", sp.Name)
		}
	}
	if math.Abs(I-res.IonicStrength) > 1e-9*I {
		t.Errorf("I %.12g, from species %.12g", res.IonicStrength, I)
	}
}

// Property: one named ion adjusted closes the charge balance, and the adjusted total
// is reported; an impossible adjustment (a cation when cations are already in excess)
// is an error, not a NaN.
func TestChargeBalanceAdjustment(t *testing.T) {
	db := mustDefault(t)
	s := NewSolver(db, TruesdellJones{})
	w := nativeWater()
	w.ChargeBalanceIon = "Cl-"
	res, err := s.Solve(&w)
	if err != nil {
		t.Fatal(err)
	}
	if res.Adjusted != "Cl-" || math.Abs(res.ChargeBalance) > 1e-8 || res.AdjustedTotal <= 0 {
		t.Errorf("adjusted %s to %.4g, charge balance %.3g %%", res.Adjusted, res.AdjustedTotal, res.ChargeBalance)
	}
	w.ChargeBalanceIon = "K+" // with Na at 80 mM, K would have to be negative
	w.SetTotal("Na+", 0.08)
	_, err = s.Solve(&w)
	var se *SolveError
	if !errors.As(err, &se) {
		t.Errorf("expected a SolveError, got %v", err)
	}
}

// Property: results do not depend on the order of components, neither in the water
// nor in the data file.
func TestOrderIndependence(t *testing.T) {
	db := mustDefault(t)
	base := nativeWater()
	ref, err := NewSolver(db, TruesdellJones{}).Solve(&base)
	if err != nil {
		t.Fatal(err)
	}
	// reversed water
	var rev Water
	rev.TempC, rev.PH = base.TempC, base.PH
	tot := base.Totals()
	for i := len(tot) - 1; i >= 0; i-- {
		rev.SetTotal(tot[i].Component, tot[i].MolKgw)
	}
	rev.SetAlkalinity(4e-3)
	// data file with the component entries in reverse order
	db2, err := ParseDatabase(reverseComponents(t))
	if err != nil {
		t.Fatal(err)
	}
	for _, c := range []struct {
		db *Database
		w  *Water
	}{{db, &rev}, {db2, &base}, {db2, &rev}} {
		res, err := NewSolver(c.db, TruesdellJones{}).Solve(c.w)
		if err != nil {
			t.Fatal(err)
		}
		if math.Abs(res.IonicStrength-ref.IonicStrength) > 1e-9*ref.IonicStrength {
			t.Errorf("I %.12g vs %.12g", res.IonicStrength, ref.IonicStrength)
		}
		for _, m := range ref.Minerals {
			if si, _ := res.SI(m.Name); math.Abs(si-m.SI) > 1e-8 {
				t.Errorf("%s SI %.10f vs %.10f", m.Name, si, m.SI)
			}
		}
		for _, sp := range ref.Species {
			if got := res.Molality(sp.Name); math.Abs(got-sp.Molality) > 1e-8*sp.Molality {
				t.Errorf("%s %.10g vs %.10g", sp.Name, got, sp.Molality)
			}
		}
	}
}

// Errors: temperature outside 0-100 C, unknown component, bad pH, negative total.
func TestSolveInputErrors(t *testing.T) {
	db := mustDefault(t)
	s := NewSolver(db, Davies{})
	tests := []struct {
		name  string
		build func(w *Water)
		want  error
	}{
		{"hot", func(w *Water) { w.TempC = 120 }, ErrTemperature},
		{"frozen", func(w *Water) { w.TempC = -5 }, ErrTemperature},
		{"NaN temperature", func(w *Water) { w.TempC = math.NaN() }, ErrTemperature},
		{"unknown component", func(w *Water) { w.SetTotal("Li+", 1e-3) }, ErrInput},
		{"no pH", func(w *Water) { w.PH = 0 }, ErrInput},
		{"negative total", func(w *Water) { w.SetTotal("Na+", -1) }, ErrInput},
		{"alkalinity and carbon", func(w *Water) { w.SetTotal("CO3 2-", 1e-3); w.SetAlkalinity(1e-3) }, ErrInput},
		{"unknown mineral", func(w *Water) { w.Equilibrate("Unobtainium", 0) }, ErrInput},
		{"absent component for phase", func(w *Water) { w.Equilibrate("baryte", 0) }, ErrInput},
	}
	for _, tc := range tests {
		w := Water{TempC: 25, PH: 7}
		w.SetTotal("Na+", 1e-3)
		w.SetTotal("Cl-", 1e-3)
		tc.build(&w)
		var res Result
		err := s.SolveInto(&res, &w)
		if !errors.Is(err, tc.want) {
			t.Errorf("%s: got %v, want %v", tc.name, err, tc.want)
		}
		if len(res.Species) != 0 || res.IonicStrength != 0 {
			t.Errorf("%s: result not cleared", tc.name)
		}
	}
}

// Equilibrate: a supersaturated water precipitates calcite until SI = 0; Ca and total
// carbon fall by the same amount (stoichiometry of CaCO3).
func TestEquilibratePrecipitation(t *testing.T) {
	db := mustDefault(t)
	w := Water{TempC: 25, PHFromChargeBalance: true}
	w.SetTotal("Ca2+", 5e-3)
	w.SetTotal("CO3 2-", 10e-3)
	w.SetTotal("Na+", 0)
	w.SetTotal("Cl-", 10e-3)
	w.SetTotal("Na+", 10e-3)
	s := NewSolver(db, TruesdellJones{})
	before, err := s.Solve(&w)
	if err != nil {
		t.Fatal(err)
	}
	if si, _ := before.SI("calcite"); si <= 0 {
		t.Fatalf("test water should be supersaturated, SI %.2f", si)
	}
	w.Equilibrate("calcite", 0)
	after, err := s.Solve(&w)
	if err != nil {
		t.Fatal(err)
	}
	d, _ := after.PhaseAmountOf("calcite")
	ca, _ := after.Total("Ca2+")
	c, _ := after.Total("CO3 2-")
	if d >= 0 || math.Abs(ca-(5e-3+d)) > 1e-12 || math.Abs(c-(10e-3+d)) > 1e-12 {
		t.Errorf("dissolved %.4g, Ca %.6g, C %.6g", d, ca, c)
	}
	if si, _ := after.SI("calcite"); math.Abs(si) > 1e-9 {
		t.Errorf("SI after %.3g", si)
	}
}

// reverseComponents returns the embedded data file with its component entries in
// reverse order (each entry runs from its header to the next header).
func reverseComponents(t *testing.T) string {
	t.Helper()
	lines := strings.Split(Thermo(), "\n")
	var blocks []string
	var cur []string
	for _, l := range lines {
		if strings.HasPrefix(l, "[") && len(cur) > 0 {
			blocks = append(blocks, strings.Join(cur, "\n"))
			cur = nil
		}
		cur = append(cur, l)
	}
	blocks = append(blocks, strings.Join(cur, "\n"))
	var comps, rest []string
	for _, b := range blocks {
		if strings.HasPrefix(b, "[component ") {
			comps = append(comps, b)
		} else {
			rest = append(rest, b)
		}
	}
	if len(comps) < 15 {
		t.Fatalf("found %d component entries", len(comps))
	}
	for i, j := 0, len(comps)-1; i < j; i, j = i+1, j-1 {
		comps[i], comps[j] = comps[j], comps[i]
	}
	return strings.Join(append(comps, rest...), "\n")
}

// The native water speciates across the whole supported range 0-100 C; away from 25 C
// the result says that some log K (e.g. SrSO4(aq), no enthalpy in the data) are held
// constant.
func TestTemperatureRangeAndWarnings(t *testing.T) {
	db := mustDefault(t)
	s := NewSolver(db, TruesdellJones{})
	for _, tc := range []float64{0, 25, 60, 100} {
		w := nativeWater()
		w.TempC = tc
		res, err := s.Solve(&w)
		if err != nil {
			t.Fatalf("%g C: %v", tc, err)
		}
		hasWarn := false
		for _, wn := range res.Warnings {
			hasWarn = hasWarn || wn == WarnNoEnthalpy
		}
		if hasWarn != (tc != 25) {
			t.Errorf("%g C: warnings %v", tc, res.Warnings)
		}
		checkFinite(t, "native water", res)
	}
}

// Water.Reset empties a water for reuse; Clone is a deep copy.
func TestWaterResetClone(t *testing.T) {
	w := nativeWater()
	c := w.Clone()
	w.SetTotal("Ca2+", 1)
	if v, _ := c.Total("Ca2+"); v != 4e-3 {
		t.Errorf("clone shares totals: Ca %g", v)
	}
	w.Reset()
	if len(w.Totals()) != 0 || w.PH != 0 || w.TempC != 0 {
		t.Errorf("reset left %+v", w)
	}
	if _, ok := w.Alkalinity(); ok {
		t.Error("reset left the alkalinity")
	}
}

// Contradictory inputs get an explained error: at pH 9.5 with 1 mmol/kgw silica, about
// a third of the silica is H3SiO4- (pK1 9.83, tag M+), far more than an alkalinity of
// 10 ueq/kgw can hold.
func TestAlkalinityBelowNonCarbonate(t *testing.T) {
	db := mustDefault(t)
	w := Water{TempC: 25, PH: 9.5}
	w.SetTotal("Na+", 2e-3)
	w.SetTotal("Cl-", 1e-3)
	w.SetTotal("H4SiO4", 1e-3)
	w.SetAlkalinity(10e-6)
	_, err := NewSolver(db, TruesdellJones{}).Solve(&w)
	var se *SolveError
	if !errors.As(err, &se) || !errors.Is(err, ErrNoConvergence) || !strings.Contains(se.Reason, "non-carbonate alkalinity") {
		t.Errorf("got %v", err)
	}
}
