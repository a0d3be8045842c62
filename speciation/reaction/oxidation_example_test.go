package reaction_test

import (
	"fmt"

	"gwsat.dev/gwsat/speciation"
	"gwsat.dev/gwsat/speciation/reaction"
)

// An oxygenated injectate mixed half and half with a ferrous native water (invented
// waters): the electron balance, the ferrihydrite formed per cubic metre and what is
// left. 8 mg/L O2 is 250 umol/kgw, 125 in the mixture; 50 umol/kgw Fe(II) take 12.5.
func ExampleReactor_Oxidize() {
	db, _ := speciation.Default()
	r := reaction.New(db, speciation.TruesdellJones{})
	inj := speciation.Water{TempC: 15, PH: 7.5}
	inj.SetTotal("Na+", 4e-3)
	inj.SetTotal("Cl-", 2e-3)
	inj.SetTotal("Ca2+", 1e-3)
	inj.SetAlkalinity(4e-3)
	nat := inj.Clone()
	nat.PH = 7.0
	nat.SetTotal("Fe2+", 100e-6) // 5.6 mg/L
	a, _, _ := r.Prepare(&inj)
	b, _, _ := r.Prepare(&nat)
	do, _ := speciation.OxygenMolKgw(8.0, 1) // dissolved oxygen of the injectate
	ox, err := r.Oxidize(a, b, reaction.RedoxInput{O2: do}, reaction.RedoxInput{}, 0.5, 15, reaction.OxidationOptions{})
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Printf("O2 left %.1f umol/kgw, Fe(II) left %.1f umol/kgw, pe %.1f\n", 1e6*ox.Left.O2, 1e6*ox.Left.FeII, ox.PE)
	for _, s := range ox.Solids {
		fmt.Printf("%s %.2f g/m3 (density %.2f g/cm3)\n", s.Mineral, s.GPerM3, s.DensityGCm3)
	}
	// Output:
	// O2 left 112.5 umol/kgw, Fe(II) left 0.0 umol/kgw, pe 14.3
	// ferrihydrite 5.34 g/m3 (density 3.96 g/cm3)
}
