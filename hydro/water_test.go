package hydro

import (
	"math"
	"testing"

	"gonum.org/v1/gonum/floats/scalar"
)

// Water: molality = (mmol/L / 1000) / (kg water per L), with kg water per L
// = density - TDS/1e6 (`common practice`); molar masses from the IUPAC 2013
// atomic weights (Cl 35.45, Ca 40.078, HCO3 61.016, CO3 60.008, C 12.011).
func TestWaterMolality(t *testing.T) {
	tests := []struct {
		name       string
		csv        string
		density    float64
		source     string
		kgw        float64
		molCl      float64 // mol/kgw
		alk        float64 // eq/kgw
		hasAlk     bool
		tic        float64
		tempC, ph  float64
		hasT, hasP bool
	}{
		{
			// 1.02 - 30000/1e6 = 0.99 kg water per litre.
			name: "measured density", csv: "Sample,Cl,Density,TDS\nA,35.45,1.02,30000\n",
			density: 1.02, source: DensityMeasured, kgw: 0.99, molCl: 0.001 / 0.99,
		},
		{
			// No TDS, no density, no other constituent beyond 0.3545 mg/L Cl: the
			// density estimate from the constituent sum is 1.0000002.
			name: "dilute", csv: "Sample,Cl,Temp,pH\nA,0.3545,25,7\n",
			density: 1 + 7e-7*0.3545, source: DensityFromTDS, kgw: 1 + 7e-7*0.3545 - 0.3545e-6, molCl: 1e-5 / (1 + 7e-7*0.3545 - 0.3545e-6),
			tempC: 25, ph: 7, hasT: true, hasP: true,
		},
		{
			// Alkalinity from ions: 61.016 mg/L HCO3 + 60.008 mg/L CO3 = 1 + 2 meq/L.
			name: "alkalinity from ions", csv: "Sample,Cl,HCO3,CO3,Density,TDS\nA,35.45,61.016,60.008,1,0\n",
			density: 1, source: DensityMeasured, kgw: 1, molCl: 0.001, alk: 0.003, hasAlk: true,
		},
		{
			// Reported alkalinity wins over the ions: 2 meq/L.
			name: "alkalinity reported", csv: "Sample,Cl,Alkalinity (meq/L),HCO3,Density,TDS\nA,35.45,2,61.016,1,0\n",
			density: 1, source: DensityMeasured, kgw: 1, molCl: 0.001, alk: 0.002, hasAlk: true,
		},
		{
			// TIC 12.011 mg/L as C = 1 mmol/L, reported under "CO3 2-".
			name: "TIC", csv: "Sample,Cl,TIC,Density,TDS\nA,35.45,12.011,1,0\n",
			density: 1, source: DensityMeasured, kgw: 1, molCl: 0.001, tic: 0.001,
		},
	}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			b := mustRead(t, tt.csv, Options{})
			w, _ := b.Rows[0].Sample.Water()
			if w.DensitySource != tt.source || !scalar.EqualWithinRel(w.DensityKgL, tt.density, 1e-12) || !scalar.EqualWithinRel(w.KgWaterPerL, tt.kgw, 1e-12) {
				t.Errorf("density %v (%s), kgw %v; want %v (%s), %v", w.DensityKgL, w.DensitySource, w.KgWaterPerL, tt.density, tt.source, tt.kgw)
			}
			if !scalar.EqualWithinRel(w.Molal["Cl-"], tt.molCl, 1e-12) {
				t.Errorf("Cl- %v mol/kgw, want %v", w.Molal["Cl-"], tt.molCl)
			}
			if w.HasAlkalinity != tt.hasAlk || !scalar.EqualWithinRel(w.AlkalinityEqKgw, tt.alk, 1e-12) {
				t.Errorf("alkalinity %v %v, want %v %v", w.AlkalinityEqKgw, w.HasAlkalinity, tt.alk, tt.hasAlk)
			}
			if !scalar.EqualWithinRel(w.Molal["CO3 2-"], tt.tic, 1e-12) {
				t.Errorf("CO3 2- %v, want %v", w.Molal["CO3 2-"], tt.tic)
			}
			if w.HasTemp != tt.hasT || w.TempC != tt.tempC || w.HasPH != tt.hasP || w.PH != tt.ph {
				t.Errorf("T %v %v pH %v %v", w.TempC, w.HasTemp, w.PH, w.HasPH)
			}
		})
	}
}

// Component names are those of the speciation basis.
func TestWaterComponents(t *testing.T) {
	b := mustRead(t, "Sample,Ca,Mg,Na,K,Sr,Ba,Fe,Mn,Cl,SO4,F,SiO2,NO3,Br,Li,Alk\nA,1,1,1,1,1,1,1,1,1,1,1,1,1,1,1,50\n", Options{})
	w, issues := b.Rows[0].Sample.Water()
	want := []string{"Ca2+", "Mg2+", "Na+", "K+", "Sr2+", "Ba2+", "Fe2+", "Mn2+", "Cl-", "SO4 2-", "F-", "H4SiO4", "NO3-", "Br-"}
	if len(w.Molal) != len(want) {
		t.Errorf("components %v", w.Molal)
	}
	for _, k := range want {
		if v, ok := w.Molal[k]; !ok || !(v > 0) || math.IsInf(v, 0) {
			t.Errorf("%s = %v, %v", k, v, ok)
		}
	}
	// Li is reported as not passed on.
	found := false
	for _, is := range issues {
		found = found || is.Column == "Li" && is.Severity == Info
	}
	if !found || !w.HasAlkalinity {
		t.Errorf("issues %v alk %v", issues, w.HasAlkalinity)
	}
}

// A TDS that leaves no water is an error, not a NaN.
func TestWaterNoWater(t *testing.T) {
	b := mustRead(t, "Sample,Cl,Density,TDS\nA,35.45,1.0,950000\n", Options{})
	w, issues := b.Rows[0].Sample.Water()
	if len(issues) == 0 || issues[0].Severity != Error || len(w.Molal) != 0 || math.IsNaN(w.KgWaterPerL) {
		t.Errorf("water %+v issues %v", w, issues)
	}
}

// Bicarbonate and carbonate reported as ions become alkalinity (HCO3 + 2 CO3
// in equivalents), never a component of their own: 61.016 mg/L HCO3 and
// 60.008 mg/L CO3 are 1 mmol each (IUPAC 2013 conventional weights H 1.008, C 12.011, O 15.999), so 3 meq/L.
func TestWaterBicarbonateIsAlkalinity(t *testing.T) {
	b := mustRead(t, "Sample,Ca,Cl,HCO3,CO3,Density\nA,40.078,35.453,61.016,60.008,1.0\n", Options{})
	w, _ := b.Rows[0].Sample.Water()
	for k := range w.Molal {
		if k == "" || k == "CO3 2-" {
			t.Errorf("unexpected component %q in %v", k, w.Molal)
		}
	}
	want := 3e-3 / w.KgWaterPerL
	if !w.HasAlkalinity || math.Abs(w.AlkalinityEqKgw-want) > 1e-6*want {
		t.Errorf("alkalinity %v eq/kgw, want %v", w.AlkalinityEqKgw, want)
	}
}
