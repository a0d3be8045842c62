package speciation

import (
	"math"
	"testing"
)

// The NaCl-equivalent density reproduces the handbook table it is built on when
// given the table's own TDS (mass % x density x 10^4 mg/L), pure water at 0 TDS
// (Kell 1975), and seawater-like TDS gives about 1.025 kg/L at 20 C (35 g/kg
// seawater is 1.0248 kg/L at 20 C, UNESCO 1981 equation of state, from memory;
// NaCl-equivalent within 0.002).
func TestBrineDensity(t *testing.T) {
	for _, c := range []struct{ pct, rho float64 }{{5, 1.0340}, {10, 1.0707}, {20, 1.1478}, {26, 1.1972}} {
		tds := c.pct / 100 * c.rho * 1e6
		got, err := BrineDensity(tds, 20)
		if err != nil || math.Abs(got-c.rho) > 1e-6 {
			t.Errorf("%g %%: %v %v, want %v", c.pct, got, err, c.rho)
		}
	}
	if got, _ := BrineDensity(0, 20); math.Abs(got-WaterDensity(20)) > 1e-5 {
		t.Errorf("pure water %v", got)
	}
	if got, _ := BrineDensity(35.0*1.0248*1000, 20); math.Abs(got-1.0248) > 0.002 {
		t.Errorf("seawater %v", got)
	}
	// Denser with more salt, lighter when warmer.
	a, _ := BrineDensity(50000, 20)
	b, _ := BrineDensity(100000, 20)
	c, _ := BrineDensity(100000, 80)
	if !(b > a && c < b) {
		t.Errorf("%v %v %v", a, b, c)
	}
	for _, bad := range [][2]float64{{-1, 20}, {400000, 20}, {1000, 120}, {math.NaN(), 20}} {
		if _, err := BrineDensity(bad[0], bad[1]); err == nil {
			t.Errorf("%v accepted", bad)
		}
	}
}
