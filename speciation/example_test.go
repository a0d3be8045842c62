package speciation_test

import (
	"fmt"

	"gwsat.dev/gwsat/speciation"
)

// Build a water from its analysis (mol per kg of water), speciate it with the
// Truesdell-Jones model and read saturation indices. The water is invented.
func Example() {
	db, err := speciation.Default()
	if err != nil {
		panic(err)
	}
	w := speciation.Water{TempC: 22, PH: 7.1}
	w.SetTotal("Ca2+", 4e-3)
	w.SetTotal("Mg2+", 2e-3)
	w.SetTotal("Na+", 20e-3)
	w.SetTotal("Cl-", 20e-3)
	w.SetTotal("SO4 2-", 6e-3)
	w.SetAlkalinity(4e-3) // eq/kgw
	s := speciation.NewSolver(db, speciation.TruesdellJones{})
	res, err := s.Solve(&w)
	if err != nil {
		panic(err)
	}
	fmt.Printf("I = %.4f mol/kgw\n", res.IonicStrength)
	fmt.Printf("log pCO2 = %.2f\n", res.LogPCO2)
	for _, name := range []string{"calcite", "dolomite", "gypsum"} {
		si, _ := res.SI(name)
		fmt.Printf("SI %s = %.2f\n", name, si)
	}
	fmt.Printf("free Ca: %.1f %%\n", res.Percent("Ca2+", "Ca2+"))
	// Output:
	// I = 0.0409 mol/kgw
	// log pCO2 = -1.79
	// SI calcite = -0.08
	// SI dolomite = -0.37
	// SI gypsum = -0.86
	// free Ca: 80.4 %
}

// Calcite in pure water under a CO2 pressure of 10^-3.5 atm: calcium and carbon are
// fixed by equilibrium with calcite and with the gas, H+ by the charge balance.
func ExampleWater_FixByPhase() {
	db, _ := speciation.Default()
	w := speciation.Water{TempC: 25, PHFromChargeBalance: true}
	w.FixByPhase("Ca2+", "calcite", 0)     // SI = 0
	w.FixByPhase("CO3 2-", "CO2(g)", -3.5) // log10 pCO2 in atm
	res, err := speciation.NewSolver(db, speciation.Davies{}).Solve(&w)
	if err != nil {
		panic(err)
	}
	ca, _ := res.Total("Ca2+")
	fmt.Printf("pH %.2f, Ca %.3f mmol/kgw\n", res.PH, ca*1e3)
	// Output:
	// pH 8.28, Ca 0.494 mmol/kgw
}

// Dissolve gypsum into pure water until saturation: the amount is an unknown of the solve.
func ExampleWater_Equilibrate() {
	db, _ := speciation.Default()
	w := speciation.Water{TempC: 25, PHFromChargeBalance: true}
	w.SetTotal("Ca2+", 1e-9)
	w.SetTotal("SO4 2-", 1e-9)
	w.Equilibrate("gypsum", 0)
	res, err := speciation.NewSolver(db, speciation.TruesdellJones{}).Solve(&w)
	if err != nil {
		panic(err)
	}
	d, _ := res.PhaseAmountOf("gypsum")
	fmt.Printf("gypsum dissolved: %.1f mmol/kgw\n", d*1e3)
	// Output:
	// gypsum dissolved: 15.7 mmol/kgw
}

// A tiny data set written in gwsat's own format, for a hand calculation with the
// ideal model (all activity coefficients 1).
func ExampleParseDatabase() {
	db, err := speciation.ParseDatabase(`
[component H2O]
charge = 0
[component H+]
charge = 1
ion_size = 9
[component Ba2+]
charge = 2
ion_size = 5
[component SO4 2-]
charge = -2
ion_size = 4
[mineral baryte]
formula = BaSO4
reaction = Ba2+ + SO4 2-
log10_k_25c = -9.97
enthalpy = 26.6 kJ
source = invented for the example
confidence = M
`)
	if err != nil {
		panic(err)
	}
	w := speciation.Water{TempC: 25, PH: 7}
	w.SetTotal("Ba2+", 1e-5)
	w.SetTotal("SO4 2-", 1e-4)
	res, _ := speciation.NewSolver(db, speciation.Ideal{}).Solve(&w)
	si, _ := res.SI("baryte")
	fmt.Printf("SI barite = %.2f\n", si) // log(1e-5 * 1e-4) + 9.97
	// Output:
	// SI barite = 0.97
}

// Mineral metadata: formula, reaction, molar mass and density (for solid volumes).
func ExampleDatabase_Mineral() {
	db, _ := speciation.Default()
	m := db.Mineral("calcite")
	fmt.Printf("%s %s: %.3f g/mol, %.2f g/cm3, %.1f cm3/mol\n", m.Name, m.Formula, m.MolarMass, m.Density, m.MolarVolume())
	for _, t := range m.Terms {
		fmt.Printf("  %g %s\n", t.Nu, t.Component)
	}
	// Output:
	// calcite CaCO3: 100.087 g/mol, 2.71 g/cm3, 36.9 cm3/mol
	//   1 Ca2+
	//   1 CO3 2-
}
