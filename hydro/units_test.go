package hydro

import (
	"testing"

	"gonum.org/v1/gonum/floats/scalar"
)

// Hand calculations from the IUPAC standard atomic weights (Meija et al.
// 2016, "Atomic weights of the elements 2013", Pure Appl. Chem. 88:265;
// conventional values for H, C, N, O, Mg, Si, S, Cl): Ca 40.078, C 12.011,
// O 15.999, N 14.007, Si 28.085, S 32.06, H 1.008, Ba 137.327.
func TestConversions(t *testing.T) {
	mgL := Unit{Conc: MgL}
	tests := []struct {
		name      string
		m         Measurement
		sol       Solution
		wantMmol  float64
		wantMeq   float64 // 0: not checked
		tolerance float64 // relative
	}{
		// 40.078 mg/L Ca = 1 mmol/L = 2 meq/L.
		{"Ca mg/L", Measurement{Param: "Ca", Value: 40.078, Unit: mgL}, Dilute(), 1, 2, 1e-12},
		// 2 meq/L Ca = 1 mmol/L.
		{"Ca meq/L", Measurement{Param: "Ca", Value: 2, Unit: Unit{Conc: MeqL}}, Dilute(), 1, 2, 1e-12},
		// CaCO3 = 40.078 + 12.011 + 3 x 15.999 = 100.086 g/mol; 1 mol = 2 eq.
		{"Alk as CaCO3", Measurement{Param: "Alk", Value: 100.086, Unit: Unit{Conc: MgL, As: "CaCO3"}}, Dilute(), 2, 2, 1e-12},
		// The brief's 100.0869 uses the older O 15.9994 and C 12.0107:
		// agreement within 1e-5 relative.
		{"Alk as CaCO3, older masses", Measurement{Param: "Alk", Value: 100.0869, Unit: Unit{Conc: MgL, As: "CaCO3"}}, Dilute(), 2, 2, 1e-5},
		// Alkalinity in a mass unit with no basis is taken as CaCO3.
		{"Alk default basis", Measurement{Param: "Alk", Value: 50.043, Unit: mgL}, Dilute(), 1, 1, 1e-12},
		// Alkalinity (acid capacity) in mmol/L is mmol H+ per litre = meq/L.
		{"Alk mmol/L", Measurement{Param: "Alk", Value: 2.5, Unit: Unit{Conc: MmolL}}, Dilute(), 2.5, 2.5, 1e-12},
		// HCO3 = 1.008 + 12.011 + 47.997 = 61.016 g/mol.
		{"Alk as HCO3", Measurement{Param: "Alk", Value: 61.016, Unit: Unit{Conc: MgL, As: "HCO3"}}, Dilute(), 1, 1, 1e-12},
		{"HCO3 ion", Measurement{Param: "HCO3", Value: 61.016, Unit: mgL}, Dilute(), 1, 1, 1e-12},
		// CO3 = 12.011 + 47.997 = 60.008 g/mol, 2 eq/mol.
		{"CO3 ion", Measurement{Param: "CO3", Value: 60.008, Unit: mgL}, Dilute(), 1, 2, 1e-12},
		// 14.007 mg/L NO3-N = 1 mmol/L (brief's 14.0067: older N).
		{"NO3 as N", Measurement{Param: "NO3", Value: 14.007, Unit: Unit{Conc: MgL, As: "N"}}, Dilute(), 1, 1, 1e-12},
		{"NO3 as N, older mass", Measurement{Param: "NO3", Value: 14.0067, Unit: Unit{Conc: MgL, As: "N"}}, Dilute(), 1, 1, 3e-5},
		// NO3 = 14.007 + 47.997 = 62.004 g/mol.
		{"NO3 as NO3", Measurement{Param: "NO3", Value: 62.004, Unit: mgL}, Dilute(), 1, 1, 1e-12},
		// SiO2 = 28.085 + 31.998 = 60.083 g/mol (brief's 60.084: older Si).
		{"SiO2", Measurement{Param: "SiO2", Value: 60.083, Unit: mgL}, Dilute(), 1, 0, 1e-12},
		{"SiO2, older mass", Measurement{Param: "SiO2", Value: 60.084, Unit: mgL}, Dilute(), 1, 0, 3e-5},
		{"SiO2 as Si", Measurement{Param: "SiO2", Value: 28.085, Unit: Unit{Conc: MgL, As: "Si"}}, Dilute(), 1, 0, 1e-12},
		// SO4 = 32.06 + 63.996 = 96.056 g/mol; as S: 32.06.
		{"SO4", Measurement{Param: "SO4", Value: 96.056, Unit: mgL}, Dilute(), 1, 2, 1e-12},
		{"SO4 as S", Measurement{Param: "SO4", Value: 32.06, Unit: Unit{Conc: MgL, As: "S"}}, Dilute(), 1, 2, 1e-12},
		// 137327 ug/L Ba = 137.327 mg/L = 1 mmol/L; micro sign handled by the header parser.
		{"Ba ug/L", Measurement{Param: "Ba", Value: 137327, Unit: Unit{Conc: UgL}}, Dilute(), 1, 2, 1e-12},
		{"Ba ppb", Measurement{Param: "Ba", Value: 137327, Unit: Unit{Conc: PPB}}, Dilute(), 1, 2, 1e-12},
		// mmol/L, mol/L and umol/L.
		{"Cl mmol/L", Measurement{Param: "Cl", Value: 3, Unit: Unit{Conc: MmolL}}, Dilute(), 3, 3, 1e-12},
		{"Cl mol/L", Measurement{Param: "Cl", Value: 0.003, Unit: Unit{Conc: MolL}}, Dilute(), 3, 3, 1e-12},
		// Per kg of solution: mg/L = mg/kg x density.
		{"Cl mg/kg", Measurement{Param: "Cl", Value: 35.45, Unit: Unit{Conc: MgKg}}, Solution{DensityKgL: 1.02, KgWaterPerL: 0.99}, 1.02, 1.02, 1e-12},
		// Per kg of water: mmol/L = mmol/kgw x kg water per L.
		{"Cl mol/kgw", Measurement{Param: "Cl", Value: 0.5, Unit: Unit{Conc: MolKgw}}, Solution{DensityKgL: 1.02, KgWaterPerL: 0.99}, 495, 495, 1e-12},
		// Hardness-style Ca as CaCO3: 100.086 mg/L as CaCO3 = 1 mmol/L Ca.
		{"Ca as CaCO3", Measurement{Param: "Ca", Value: 100.086, Unit: Unit{Conc: MgL, As: "CaCO3"}}, Dilute(), 1, 2, 1e-12},
		// TIC as C: 12.011 mg/L = 1 mmol/L.
		{"TIC as C", Measurement{Param: "TIC", Value: 12.011, Unit: mgL}, Dilute(), 1, 0, 1e-12},
	}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			got, err := tt.m.MmolL(tt.sol)
			if err != nil {
				t.Fatal(err)
			}
			if !scalar.EqualWithinRel(got, tt.wantMmol, tt.tolerance) {
				t.Errorf("MmolL = %.10g, want %.10g", got, tt.wantMmol)
			}
			if tt.wantMeq == 0 {
				if _, err := tt.m.MeqL(tt.sol); err == nil {
					t.Errorf("MeqL of uncharged %s gave no error", tt.m.Param)
				}
				return
			}
			meq, err := tt.m.MeqL(tt.sol)
			if err != nil {
				t.Fatal(err)
			}
			if !scalar.EqualWithinRel(meq, tt.wantMeq, tt.tolerance) {
				t.Errorf("MeqL = %.10g, want %.10g", meq, tt.wantMeq)
			}
		})
	}
}

// Hem (1985), USGS Water-Supply Paper 2254, p. 57, as cited by USGS WRI
// 02-4045: bicarbonate (mg/L) = alkalinity (mg/L as CaCO3) / 0.8202.
func TestAlkalinityToBicarbonateHem(t *testing.T) {
	alk := Measurement{Param: "Alk", Value: 100, Unit: Unit{Conc: MgL, As: "CaCO3"}}
	meq, err := alk.MeqL(Dilute())
	if err != nil {
		t.Fatal(err)
	}
	hco3 := Measurement{Param: "HCO3", Value: 1, Unit: Unit{Conc: MeqL}}
	perMeq, _ := hco3.MgL(Dilute())
	got := meq * perMeq
	if want := 100 / 0.8202; !scalar.EqualWithinRel(got, want, 2e-4) { // 4-digit factor
		t.Errorf("HCO3 = %.3f mg/L, want %.3f", got, want)
	}
}

func TestUnitErrors(t *testing.T) {
	tests := []Measurement{
		{Param: "SiO2", Value: 1, Unit: Unit{Conc: MeqL}},           // no charge
		{Param: "Ca", Value: 1, Unit: Unit{Conc: MgL, As: "N"}},     // nonsense basis
		{Param: "Cl", Value: 1, Unit: Unit{Conc: "furlongs"}},       // unknown
		{Param: "Unobtainium", Value: 1, Unit: Unit{Conc: MgL}},     // unknown analyte
		{Param: "Cl", Value: 1, Unit: Unit{Conc: MolKgw}, Raw: "x"}, // bad solution below
	}
	for i, m := range tests {
		sol := Dilute()
		if i == len(tests)-1 {
			sol = Solution{}
		}
		if v, err := m.MmolL(sol); err == nil {
			t.Errorf("%+v: got %g, want an error", m, v)
		}
	}
}

func TestParseConcUnit(t *testing.T) {
	tests := []struct {
		in   string
		want Unit
		ok   bool
	}{
		{"mg/L", Unit{Conc: MgL}, true},
		{"mg/l", Unit{Conc: MgL}, true},
		{"MG/L", Unit{Conc: MgL}, true},
		{"ug/L", Unit{Conc: UgL}, true},
		{"µg/L", Unit{Conc: UgL}, true},
		{"μg/L", Unit{Conc: UgL}, true},
		{"mmol/L", Unit{Conc: MmolL}, true},
		{"meq/L", Unit{Conc: MeqL}, true},
		{"mol/kgw", Unit{Conc: MolKgw}, true},
		{"mol/kg", Unit{Conc: MolKgw}, true},
		{"mg/kg", Unit{Conc: MgKg}, true},
		{"ppm", Unit{Conc: PPM}, true},
		{"ppb", Unit{Conc: PPB}, true},
		{"mg/L as CaCO3", Unit{Conc: MgL, As: "CaCO3"}, true},
		{"mg/L CaCO3", Unit{Conc: MgL, As: "CaCO3"}, true},
		{"mg N/L", Unit{Conc: MgL, As: "N"}, true},
		{"mg/L as N", Unit{Conc: MgL, As: "N"}, true},
		{"as Si", Unit{As: "Si"}, true},
		{"mg/dL", Unit{}, false},
		{"lab", Unit{}, false},
		{"", Unit{}, false},
	}
	for _, tt := range tests {
		got, ok := parseConcUnit(tt.in)
		if ok != tt.ok || got != tt.want {
			t.Errorf("parseConcUnit(%q) = %v, %v; want %v, %v", tt.in, got, ok, tt.want, tt.ok)
		}
	}
}
