package speciation

import (
	"errors"
	"math"
	"testing"
)

// pressureMinerals are the minerals whose pressure data the embedded set holds.
var pressureMinerals = []string{"calcite", "aragonite", "gypsum", "anhydrite", "celestine", "baryte"}

// The stored volume changes of reaction are the sums shown in thermo.txt: partial
// molar volumes of the ions at infinite dilution, 25 C (conventional scale
// V(H+) = 0; Millero 1972, from memory), liquid water 18.068 cm3/mol (18.015 g/mol
// over 0.99705 g/cm3, from memory) and the molar volumes of the solids at 298.15 K
// (Robie, Hemingway & Fisher 1978, USGS Bull. 1452, from memory).
func TestReactionVolumesFromIonVolumes(t *testing.T) {
	ion := map[string]float64{"Ca2+": -17.85, "Sr2+": -18.16, "Ba2+": -12.47, "SO4 2-": 13.98, "CO3 2-": -6.06, "H2O": 18.068}
	solid := map[string]float64{"calcite": 36.934, "aragonite": 34.150, "baryte": 52.10, "celestine": 46.25, "anhydrite": 45.94, "gypsum": 74.69}
	db, err := Default()
	if err != nil {
		t.Fatal(err)
	}
	for _, name := range pressureMinerals {
		m := db.Mineral(name)
		if m == nil || !m.HasPressureData() {
			t.Fatalf("%s: no pressure data", name)
		}
		want := -solid[name]
		for _, term := range m.Terms {
			v, ok := ion[term.Component]
			if !ok {
				t.Fatalf("%s: no partial molar volume for %s", name, term.Component)
			}
			want += term.Nu * v
		}
		if math.Abs(m.VolumeChange-want) > 0.006 {
			t.Errorf("%s: reaction_volume_cm3 %g, the sum of the volumes gives %.3f", name, m.VolumeChange, want)
		}
		if m.VolumeChange >= 0 {
			t.Errorf("%s: dV %g should be negative (electrostriction around the ions)", name, m.VolumeChange)
		}
		if m.ValidPressureBar != [2]float64{1, 500} {
			t.Errorf("%s: valid_pressure_bar %v, want 1 500", name, m.ValidPressureBar)
		}
		if m.PressureSource == "" {
			t.Errorf("%s: no pressure_source", name)
		}
	}
}

// The molar volumes of the solids used for dV (Robie, Hemingway & Fisher 1978)
// agree with the formula mass over the handbook density stored with each mineral
// (CRC Handbook, from memory): two independent sources within 0.5 %.
func TestSolidVolumesAgreeWithDensities(t *testing.T) {
	solid := map[string]float64{"calcite": 36.934, "aragonite": 34.150, "baryte": 52.10, "celestine": 46.25, "anhydrite": 45.94, "gypsum": 74.69}
	db, err := Default()
	if err != nil {
		t.Fatal(err)
	}
	for name, v := range solid {
		got := db.Mineral(name).MolarVolume()
		if math.Abs(got-v) > 0.005*v {
			t.Errorf("%s: mass/density %.3f cm3/mol, Robie et al. %.3f", name, got, v)
		}
	}
}

// A reaction whose products take less room than the solid (dV < 0) is favoured by
// pressure: log K rises with pressure at every temperature (Le Chatelier).
func TestPressureRaisesLogK(t *testing.T) {
	db, err := Default()
	if err != nil {
		t.Fatal(err)
	}
	for _, name := range pressureMinerals {
		m := db.Mineral(name)
		for _, tc := range []float64{0, 25, 60, 100} {
			prev := m.LogKAt(tc, 1)
			if math.Abs(prev-m.LogK.At(tc+273.15)) > 1e-12 {
				t.Errorf("%s at %g C: log K at 1 bar %g differs from the temperature function", name, tc, prev)
			}
			for _, p := range []float64{50, 100, 250, 500} {
				lk := m.LogKAt(tc, p)
				if !(lk > prev) {
					t.Errorf("%s at %g C: log K %g at %g bar not above %g at the lower pressure", name, tc, lk, p, prev)
				}
				prev = lk
			}
		}
	}
}

// The thermodynamic identity d(ln K)/dP = -dV(P)/(R T), with dV(P) = dV - dkappa (P - 1)
// (dkappa = -d(dV)/dP), checked by a central difference of Mineral.LogKAt. R is
// CODATA 2018, 8.314462618 J/(mol K) = 83.14462618 cm3 bar/(mol K).
func TestPressureSlopeIdentity(t *testing.T) {
	const rCm3Bar = 83.14462618
	db, err := Default()
	if err != nil {
		t.Fatal(err)
	}
	for _, name := range pressureMinerals {
		m := db.Mineral(name)
		for _, tc := range []float64{5, 25, 80} {
			for _, p := range []float64{1, 100, 300, 500} {
				const h = 0.5
				fd := (m.LogKAt(tc, p+h) - m.LogKAt(tc, p-h)) / (2 * h)
				dv := m.VolumeChange - m.CompressibilityChange*(p-1)
				want := -dv / (rCm3Bar * (tc + 273.15) * math.Ln10)
				if math.Abs(fd-want) > 1e-9 {
					t.Errorf("%s %g C %g bar: dlogK/dP %.6g, -dV/(RT ln10) %.6g", name, tc, p, fd, want)
				}
			}
		}
	}
}

// Gypsum = anhydrite + 2 H2O has dV = V(anhydrite) + 2 V(H2O) - V(gypsum) > 0, so
// pressure favours gypsum: in pure water (a(H2O) = 1) the temperature at which the two
// are equally soluble rises with pressure, by the Clapeyron slope dT/dP = dV/dS of
// the dehydration, dS taken from the temperature functions of the two log K.
func TestGypsumAnhydriteTransitionRisesWithPressure(t *testing.T) {
	db, err := Default()
	if err != nil {
		t.Fatal(err)
	}
	gyp, anh := db.Mineral("gypsum"), db.Mineral("anhydrite")
	// log K of the dehydration, gypsum -> anhydrite + 2 H2O
	dehyd := func(tc, p float64) float64 { return gyp.LogKAt(tc, p) - anh.LogKAt(tc, p) }
	transition := func(p float64) float64 {
		lo, hi := 0.0, 100.0
		if dehyd(lo, p) > 0 || dehyd(hi, p) < 0 {
			t.Fatalf("no gypsum-anhydrite transition in 0-100 C at %g bar", p)
		}
		for range 100 {
			mid := (lo + hi) / 2
			if dehyd(mid, p) < 0 {
				lo = mid
			} else {
				hi = mid
			}
		}
		return (lo + hi) / 2
	}
	t1, t500 := transition(1), transition(500)
	if !(t500 > t1) {
		t.Fatalf("transition %g C at 500 bar not above %g C at 1 bar", t500, t1)
	}
	// Clapeyron at 1 bar: dS = R ln10 d(T log K)/dT (J/(mol K)), dV in J/bar.
	const r = 8.314462618
	tk := t1 + 273.15
	const h = 0.01
	ds := r * math.Ln10 * ((tk+h)*dehyd(t1+h, 1) - (tk-h)*dehyd(t1-h, 1)) / (2 * h)
	dv := (gyp.VolumeChange - anh.VolumeChange) / 10 // cm3 bar -> J/bar
	slope := (transition(2) - transition(0.5)) / 1.5
	if want := dv / ds; math.Abs(slope-want) > 0.02*want {
		t.Errorf("transition slope %.5g K/bar, Clapeyron dV/dS %.5g K/bar", slope, want)
	}
	t.Logf("gypsum-anhydrite transition in pure water: %.1f C at 1 bar, %.1f C at 500 bar", t1, t500)
}

// At 1 bar (or with no pressure given) a solve is unchanged bit for bit; at 300 bar
// the SI of a mineral with pressure data falls by exactly its log K shift, a mineral
// without data keeps its SI and is marked; above the data's range the mineral is
// marked; outside MinPressureBar-MaxPressureBar the water is refused.
func TestSolveAtPressure(t *testing.T) {
	db, err := Default()
	if err != nil {
		t.Fatal(err)
	}
	water := func(p float64) Water {
		var w Water
		w.TempC, w.PH, w.PressureBar = 40, 7.2, p
		w.SetTotal("Ca2+", 0.01)
		w.SetTotal("Mg2+", 0.002)
		w.SetTotal("Na+", 0.02)
		w.SetTotal("Ba2+", 1e-6)
		w.SetTotal("Sr2+", 1e-4)
		w.SetTotal("Cl-", 0.02)
		w.SetTotal("SO4 2-", 0.01)
		w.SetTotal("F-", 5e-5)
		w.SetAlkalinity(0.004)
		return w
	}
	s := NewSolver(db, TruesdellJones{})
	solve := func(p float64) *Result {
		w := water(p)
		res, err := NewSolver(db, TruesdellJones{}).Solve(&w) // a solver each: results are not shared
		if err != nil {
			t.Fatalf("%g bar: %v", p, err)
		}
		return res
	}
	r0, r1 := solve(0), solve(1)
	if len(r0.Minerals) != len(r1.Minerals) || r0.PressureBar != 1 || r1.PressureBar != 1 {
		t.Fatalf("pressure 0 and 1 bar differ in shape or reported pressure")
	}
	for i := range r0.Minerals {
		if r0.Minerals[i] != r1.Minerals[i] {
			t.Errorf("%s: %+v at no pressure, %+v at 1 bar", r0.Minerals[i].Name, r0.Minerals[i], r1.Minerals[i])
		}
		if r0.Minerals[i].NoPressureData || r0.Minerals[i].OutsidePressureRange {
			t.Errorf("%s marked at 1 bar", r0.Minerals[i].Name)
		}
	}
	r300, r600 := solve(300), solve(600)
	if r300.PressureBar != 300 {
		t.Errorf("reported pressure %g", r300.PressureBar)
	}
	tk := 40 + 273.15
	for _, name := range []string{"calcite", "gypsum", "anhydrite", "celestine", "baryte"} {
		m := db.Mineral(name)
		a, b := r1.Mineral(name), r300.Mineral(name)
		shift := PressureLogKShift(m.VolumeChange, m.CompressibilityChange, tk, 300)
		// the speciation itself does not change (aqueous constants stay at 1 bar)
		if math.Abs((a.SI-b.SI)-shift) > 1e-9 || b.NoPressureData || b.OutsidePressureRange {
			t.Errorf("%s: SI %g at 1 bar, %g at 300 bar, log K shift %g (marks %v %v)", name, a.SI, b.SI, shift, b.NoPressureData, b.OutsidePressureRange)
		}
		if !r600.Mineral(name).OutsidePressureRange {
			t.Errorf("%s at 600 bar not marked outside its pressure range", name)
		}
	}
	for _, name := range []string{"fluorite", "dolomite"} {
		a, b := r1.Mineral(name), r300.Mineral(name)
		if a.SI != b.SI || !b.NoPressureData {
			t.Errorf("%s: SI %g at 1 bar, %g at 300 bar, NoPressureData %v", name, a.SI, b.SI, b.NoPressureData)
		}
	}
	for _, p := range []float64{-1, 0.1, 1001, math.NaN(), math.Inf(1)} {
		w := water(p)
		if _, err := s.Solve(&w); !errors.Is(err, ErrPressure) {
			t.Errorf("%g bar: err %v, want ErrPressure", p, err)
		}
	}
}

// The parser reads the pressure keys and refuses incomplete or malformed ones.
func TestPressureDataParse(t *testing.T) {
	entry := func(kind, lines string) string {
		return tinyHeader + "\n[" + kind + " Salt]\nreaction = Ca2+ + 2 Cl-\nlog10_k_25c = 1\nenthalpy = none\n" + lines + "\n"
	}
	for _, tc := range []struct {
		kind, lines string
		want        error
	}{
		{"mineral", "reaction_volume_cm3 = -30", ErrMissingField},
		{"mineral", "valid_pressure_bar = 1 500", ErrMissingField},
		{"mineral", "reaction_compressibility_cm3_bar = -0.01\nvalid_pressure_bar = 1 500", ErrMissingField},
		{"mineral", "reaction_volume_cm3 = x\nvalid_pressure_bar = 1 500", ErrSyntax},
		{"mineral", "reaction_volume_cm3 = -30\nvalid_pressure_bar = 500 1", ErrInvalidParameter},
		{"mineral", "reaction_volume_cm3 = -30\nvalid_pressure_bar = 0 500", ErrInvalidParameter},
		{"mineral", "reaction_volume_cm3 = -30\nvalid_pressure_bar = 1", ErrSyntax},
		{"mineral", "reaction_volume_cm3 = -30\nvalid_pressure_bar = 1 Inf", ErrSyntax},
		{"gas", "reaction_volume_cm3 = -30\nvalid_pressure_bar = 1 500", ErrInvalidParameter},
	} {
		_, err := ParseDatabase(entry(tc.kind, tc.lines))
		var de *DataError
		if !errors.As(err, &de) || !errors.Is(err, tc.want) || de.Entry != tc.kind+" Salt" {
			t.Errorf("%q: got %v, want a *DataError wrapping %v", tc.lines, err, tc.want)
		}
	}
	db, err := ParseDatabase(entry("mineral", "reaction_volume_cm3 = -30\nreaction_compressibility_cm3_bar = -0.01\nvalid_pressure_bar = 1 300\npressure_source = invented"))
	if err != nil {
		t.Fatal(err)
	}
	m := db.Mineral("Salt")
	if m.VolumeChange != -30 || m.CompressibilityChange != -0.01 || m.ValidPressureBar != [2]float64{1, 300} || m.PressureSource != "invented" {
		t.Errorf("read as %+v", m)
	}
}

// The hydrostatic pressure of a fresh-water column: 10 m of water weigh about
// 0.98 bar (rho g h with rho = 1000 kg/m3, g = 9.80665 m/s2; 1 bar = 1e5 Pa).
func TestHydrostaticPressure(t *testing.T) {
	for _, tc := range []struct{ depth, want float64 }{{0, 1}, {10, 1 + 1000*9.80665*10/1e5}, {1000, 1 + 1000*9.80665*1000/1e5}} {
		if got := HydrostaticPressureBar(tc.depth); math.Abs(got-tc.want) > 1e-12 {
			t.Errorf("%g m: %g bar, want %g", tc.depth, got, tc.want)
		}
	}
}
