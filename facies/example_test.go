package facies_test

import (
	"fmt"

	"gwsat.dev/gwsat/facies"
)

// An invented calcium-magnesium bicarbonate water, meq/L. Ca is 3 of 6
// meq/L of cations, exactly 50 %, which is not above the threshold, so the
// second cation is named too.
func ExampleClassify() {
	f, err := facies.Classify(facies.Ions{Ca: 3, Mg: 2, Na: 0.8, K: 0.2, HCO3: 5, SO4: 0.6, Cl: 0.4})
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Printf("%s: Ca %.1f %%, Mg %.1f %%, HCO3 %.1f %%; largest %s %s\n",
		f.Type, f.CaPct, f.MgPct, f.HCO3Pct, f.LargestCation.Word(), f.LargestAnion.Word())
	// Output: Ca-Mg-HCO3: Ca 50.0 %, Mg 33.3 %, HCO3 83.3 %; largest calcium bicarbonate
}
