package speciation_test

import (
	"fmt"

	"gwsat.dev/gwsat/speciation"
)

// A field ORP reading against an Ag/AgCl (3 M KCl) probe becomes a pe, which is
// given to the water; the Fe(III) oxide SIs then exist.
func ExamplePEFromORP() {
	pe, src, err := speciation.PEFromORP(150, speciation.ElectrodeAgAgCl3M, 25)
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Printf("Eh %.0f mV, pe %.2f (%s)\n", speciation.EhMVFromPE(pe, 25), pe, src)
	// Output: Eh 357 mV, pe 6.03 (ORP)
}

// Dissolved oxygen at air saturation, and the pe it sets in a water.
func ExampleOxygenSaturationMgL() {
	mgL, _ := speciation.OxygenSaturationMgL(20, 0, 1)
	fmt.Printf("%.2f mg/L at 20 C\n", mgL)
	// Output: 9.09 mg/L at 20 C
}

func ExamplePEFromCouple() {
	db, _ := speciation.Default()
	s := speciation.NewSolver(db, speciation.TruesdellJones{})
	w := speciation.Water{TempC: 25, PH: 7}
	w.SetTotal("Na+", 1e-3)
	w.SetTotal("Cl-", 1e-3)
	o2, _ := speciation.OxygenMolKgw(8.26, 1) // air-saturated at 25 C
	r, err := speciation.PEFromCouple(s, &w, speciation.CoupleMeasurement{Couple: speciation.CoupleO2, Oxidized: o2})
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Printf("pe %.1f from %s, log pO2 %.2f\n", r.PE, r.Source, r.Result.LogPO2)
	// Output: pe 13.6 from O2/H2O, log pO2 -0.69
}

// Without a pe the oxide and sulfide SIs are left out and the result says so; with
// one they are computed.
func ExampleWater_SetPE() {
	db, _ := speciation.Default()
	s := speciation.NewSolver(db, speciation.TruesdellJones{})
	w := speciation.Water{TempC: 15, PH: 7.2}
	w.SetTotal("Na+", 2e-3)
	w.SetTotal("Cl-", 2e-3)
	w.SetTotal("Fe2+", 20e-6)
	res, _ := s.Solve(&w)
	_, ok := res.SI("ferrihydrite")
	fmt.Println(ok, res.RedoxSkipped, speciation.NoteNoRedox)
	w.SetPE(speciation.PEFromEhMV(100, 15))
	res, _ = s.Solve(&w)
	si, ok := res.SI("ferrihydrite")
	fmt.Printf("%v %.1f Fe(III) %.2g mol/kgw\n", ok, si, db.StateTotal(res, "Fe2+", -1))
	// Output:
	// false true no redox information: oxide and sulfide SIs not computed
	// true 1.3 Fe(III) 8.8e-09 mol/kgw
}

// The iron pe-pH diagram as plain polygons, and the field a water falls in.
func ExampleIronPEPH() {
	db, _ := speciation.Default()
	d, _ := speciation.IronPEPH(db, speciation.IronDiagramOptions{TempC: 25, FeTotal: 1e-5})
	for _, f := range d.Fields {
		fmt.Printf("%s %v\n", f.Name, f.Solid)
	}
	fmt.Println(d.FieldAt(7.5, 13.5))
	// Output:
	// Fe(OH)4- false
	// Fe2+ false
	// Fe3+ false
	// FeOH+ false
	// FeOH2+ false
	// ferrihydrite true
	// ferrihydrite
}
