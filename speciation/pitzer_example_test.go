package speciation_test

import (
	"fmt"

	"gwsat.dev/gwsat/speciation"
)

// Speciate a brine with the Pitzer model: one *Pitzer per Solver. The brine is
// invented (3 mol/kg NaCl-CaCl2 at 60 C).
func ExampleNewPitzer() {
	db, err := speciation.Default()
	if err != nil {
		panic(err)
	}
	w := speciation.Water{TempC: 60, PH: 6.5}
	w.SetTotal("Na+", 2.0)
	w.SetTotal("Ca2+", 0.5)
	w.SetTotal("Cl-", 3.0)
	w.SetTotal("SO4 2-", 0.002)
	w.SetAlkalinity(0.002)
	s := speciation.NewSolver(db, speciation.NewPitzer())
	res, err := s.Solve(&w)
	if err != nil {
		panic(err)
	}
	fmt.Printf("I = %.3f mol/kgw, a(H2O) = %.4f\n", res.IonicStrength, res.WaterActivity)
	for _, name := range []string{"halite", "gypsum", "anhydrite", "calcite"} {
		si, _ := res.SI(name)
		fmt.Printf("SI %s = %.2f\n", name, si)
	}
	// Output:
	// I = 3.505 mol/kgw, a(H2O) = 0.8972
	// SI halite = -1.08
	// SI gypsum = -0.69
	// SI anhydrite = -0.43
	// SI calcite = 1.25
}

// The mean activity coefficient and osmotic coefficient of a single salt.
func ExamplePitzer_MeanActivity() {
	p := speciation.NewPitzer()
	for _, m := range []float64{0.1, 1, 6} {
		g, phi, err := p.MeanActivity("NaCl", m, 25)
		if err != nil {
			panic(err)
		}
		fmt.Printf("NaCl %.1f mol/kg: gamma+- %.3f, phi %.3f\n", m, g, phi)
	}
	// Output:
	// NaCl 0.1 mol/kg: gamma+- 0.777, phi 0.932
	// NaCl 1.0 mol/kg: gamma+- 0.656, phi 0.936
	// NaCl 6.0 mol/kg: gamma+- 0.988, phi 1.273
}

// Activity coefficients of free ions at a given composition (no ion pairs formed):
// here the major ions of seawater.
func ExamplePitzer_Evaluate() {
	p := speciation.NewPitzer()
	ions := []string{"Na+", "Mg2+", "Ca2+", "K+", "Cl-", "SO4 2-"}
	m := []float64{0.486, 0.0547, 0.0107, 0.0106, 0.566, 0.0293}
	logGamma := make([]float64, len(ions))
	phi, err := p.Evaluate(logGamma, 25, ions, m)
	if err != nil {
		panic(err)
	}
	fmt.Printf("phi %.3f\n", phi)
	for i, ion := range ions {
		fmt.Printf("%s %.3f\n", ion, logGamma[i])
	}
	// Output:
	// phi 0.904
	// Na+ -0.195
	// Mg2+ -0.686
	// Ca2+ -0.726
	// K+ -0.230
	// Cl- -0.161
	// SO4 2- -0.972
}
