package reaction

import (
	"math"
	"testing"

	"gwsat.dev/gwsat/speciation"
)

// Selective precipitation in the ideal limit (activity coefficients 1, no ion pairs;
// tinyDB): Na2SO4 added to a water holding Ba2+ and Sr2+. The classic first-year
// exercise (Petrucci et al., General Chemistry, 10th ed., ch. 18, selective
// precipitation; from memory): each sulfate starts to precipitate when the free
// sulfate reaches Ksp / [cation]; barite (smaller Ksp) comes first; at the onset of
// celestite the free sulfate is Ksp(cel) / [Sr]0 (strontium untouched so far), so the
// barium left is Ksp(bar) / [SO4] and its fraction of the start is
// Ksp(bar) [Sr]0 / (Ksp(cel) [Ba]0). Ksp: barite after Blount (1977) [M+], celestite
// Reardon & Armstrong (1987) [V].
func TestIdealSelectivePrecipitation(t *testing.T) {
	r := idealReactor(t)
	kBa := math.Pow(10, bariteLogK(25))
	kSr := math.Pow(10, -6.631)
	tests := []struct {
		ba, sr    float64
		clean     float64
		wantClean bool
	}{
		// residual Ba fraction = kBa/kSr = 4.6e-4 < 1e-3: clean at 99.9 %
		{1e-3, 1e-3, 0.999, true},
		// ... but not at 99.99 %
		{1e-3, 1e-3, 0.9999, false},
		// residual fraction 4.6e-4 x 20 = 9.2e-3: not clean at 99.9 %
		{1e-4, 2e-3, 0.999, false},
	}
	for _, tc := range tests {
		w := idealWater(25, map[string]float64{"Ba2+": tc.ba, "Sr2+": tc.sr, "Cl-": 2 * (tc.ba + tc.sr)})
		sol := prepare(t, r, w)
		salt, err := ParseSalt(r.Database(), "Na2SO4", "2 Na+ + SO4 2-")
		if err != nil {
			t.Fatal(err)
		}
		seq, err := r.Sequence(sol, salt, SequenceOptions{MaxAmount: 0.01, CleanRemoval: tc.clean,
			Minerals: []string{"baryte", "celestine"}})
		if err != nil {
			t.Fatal(err)
		}
		if len(seq.Onsets) != 2 || seq.Onsets[0].Mineral != "baryte" || seq.Onsets[1].Mineral != "celestine" {
			t.Fatalf("%+v: onsets %+v", tc, seq.Onsets)
		}
		for i, cation := range []float64{tc.ba, tc.sr} {
			k := []float64{kBa, kSr}[i]
			so4 := seq.Onsets[i].Result.Molality("SO4 2-")
			if !relClose(so4, k/cation, 1e-8) {
				t.Errorf("%+v %s: free SO4 at onset %.10g, Ksp/[cation] %.10g", tc, seq.Onsets[i].Mineral, so4, k/cation)
			}
		}
		// the amount of salt added at the first onset is the sulfate needed (nothing
		// precipitated yet); at the second, that plus the barite formed.
		if !relClose(seq.Onsets[0].Amount, kBa/tc.ba, 1e-8) {
			t.Errorf("%+v: first onset at %.10g mol/kgw, want %.10g", tc, seq.Onsets[0].Amount, kBa/tc.ba)
		}
		so4 := kSr / tc.sr
		baLeft := kBa / so4
		if want := so4 + tc.ba - baLeft; !relClose(seq.Onsets[1].Amount, want, 1e-8) {
			t.Errorf("%+v: second onset at %.10g mol/kgw, want %.10g", tc, seq.Onsets[1].Amount, want)
		}
		res := seq.Onsets[1].Residual
		want := kBa * tc.sr / (kSr * tc.ba)
		if len(res) != 1 || res[0].Component != "Ba2+" || !relClose(res[0].Fraction, want, 1e-7) {
			t.Errorf("%+v: residual %+v, hand %.6g", tc, res, want)
		}
		if seq.Clean != tc.wantClean || seq.Onsets[1].Clean != tc.wantClean {
			t.Errorf("%+v: clean %v, want %v (residual %.3g)", tc, seq.Clean, tc.wantClean, want)
		}
	}
}

// A reagent water instead of a salt: the same order, and the residual fraction counts
// moles (dilution by the reagent's water does not count as removal). Ideal limit; the
// onset of barite is where (Ba0/(1+x)) (x S/(1+x)) = Ksp, solved by hand for x.
func TestIdealSequenceWithReagentWater(t *testing.T) {
	r := idealReactor(t)
	sol := prepare(t, r, idealWater(25, map[string]float64{"Ba2+": 1e-3, "Sr2+": 1e-3, "Cl-": 4e-3}))
	reag := prepare(t, r, idealWater(25, map[string]float64{"Na+": 0.2, "SO4 2-": 0.1}))
	seq, err := r.Sequence(sol, Reagent{Name: "sulfate water", Water: &reag},
		SequenceOptions{MaxAmount: 1, Minerals: []string{"baryte", "celestine"}})
	if err != nil {
		t.Fatal(err)
	}
	if len(seq.Onsets) != 2 || seq.Onsets[0].Mineral != "baryte" || seq.Unit != "kg/kgw" {
		t.Fatalf("onsets %+v unit %s", seq.Onsets, seq.Unit)
	}
	// Ba0 S x = Ksp (1+x)^2: x^2 Ksp + x (2 Ksp - Ba0 S) + Ksp = 0, smaller root, written
	// as 2 Ksp / (-b + sqrt(b^2 - 4 Ksp^2)) to avoid cancellation (the roots multiply to 1).
	k := math.Pow(10, bariteLogK(25))
	b := 2*k - 1e-3*0.1
	x := 2 * k / (-b + math.Sqrt(b*b-4*k*k))
	if !relClose(seq.Onsets[0].Amount, x, 1e-8) {
		t.Errorf("barite onset at %.10g kg/kgw, hand %.10g", seq.Onsets[0].Amount, x)
	}
	// residual as moles: free Ba at the celestite onset times (1 + x), over Ba0
	o := seq.Onsets[1]
	ba, _ := o.Result.Total("Ba2+")
	if want := ba * (1 + o.Amount) / 1e-3; !relClose(o.Residual[0].Fraction, want, 1e-12) {
		t.Errorf("residual %.6g, want %.6g", o.Residual[0].Fraction, want)
	}
}

func TestParseSalt(t *testing.T) {
	db := defaultDB(t)
	tests := []struct {
		formula string
		ok      bool
	}{
		{"2 Na+ + SO4 2-", true},
		{"Ca2+ + 2 Cl-", true},
		{"Na+ + Cl- + H4SiO4", true},
		{"Na+ + SO4 2-", false}, // not neutral
		{"2 Na+ + Xy-2", false}, // unknown component
		{"two Na+ + SO4 2-", false},
		{"", false},
	}
	for _, tc := range tests {
		_, err := ParseSalt(db, "salt", tc.formula)
		if (err == nil) != tc.ok {
			t.Errorf("%q: error %v, want ok %v", tc.formula, err, tc.ok)
		}
	}
}

// Adding a salt or an acid to a charge-balanced water: the alkalinity rule (the acid
// lowers the alkalinity by 1 eq/mol, Na2CO3 raises it by 2) and the charge-balance rule
// (the added anion or cation is balanced by H+) give the same pH.
func TestReagentAdditionModesAgree(t *testing.T) {
	db := defaultDB(t)
	for _, tc := range []struct{ name, formula string }{
		{"HCl", "H+ + Cl-"}, {"Na2CO3", "2 Na+ + CO3 2-"}, {"CaCl2", "Ca2+ + 2 Cl-"},
	} {
		g, err := ParseSalt(db, tc.name, tc.formula)
		if err != nil {
			t.Fatal(err)
		}
		var ph [2]float64
		for i, mode := range []PHMode{ConserveAlkalinity, ChargeBalance} {
			r := New(db, speciation.TruesdellJones{})
			r.PH = mode
			sol := calciteSaturated(t, r, 25, -2)
			_, res, err := r.Speciate(r.added(sol, g, 0.4e-3))
			if err != nil {
				t.Fatal(err)
			}
			ph[i] = res.PH
		}
		if math.Abs(ph[0]-ph[1]) > 1e-8 {
			t.Errorf("%s: pH %.10f (alkalinity) vs %.10f (charge balance)", tc.name, ph[0], ph[1])
		}
	}
}
