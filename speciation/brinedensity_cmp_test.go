package speciation

import (
	"math"
	"testing"
)

// At the 50 g/L where hydro switches from its linear density rule
// (1 + 7e-7 x TDS, common practice) to the brine density, the two agree within
// 0.25 % (1.0350 against 1.0329 kg/L), so a water's conversion steps by at most
// that much at the switch.
func TestBrineDensityMeetsTheLinearRule(t *testing.T) {
	rho, err := BrineDensity(50000, 20)
	if err != nil {
		t.Fatal(err)
	}
	if lin := 1 + 7e-7*50000; math.Abs(rho-lin) > 0.0025*lin {
		t.Errorf("brine %.4f, linear %.4f kg/L at 50 g/L", rho, lin)
	}
}
