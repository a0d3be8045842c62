package speciation

import (
	"fmt"
	"math"
	"sort"
)

// naclDensity20 is the density of aqueous NaCl at 20 C against its mass percent:
// CRC Handbook of Chemistry and Physics, "Concentrative properties of aqueous
// solutions", sodium chloride (from memory); 0 % is pure water (Kell 1975).
var naclDensity20 = [][2]float64{
	{0, 0.99820}, {0.5, 1.0018}, {1, 1.0053}, {2, 1.0125}, {3, 1.0196}, {4, 1.0268}, {5, 1.0340},
	{6, 1.0413}, {7, 1.0486}, {8, 1.0559}, {9, 1.0633}, {10, 1.0707}, {12, 1.0857}, {14, 1.1008},
	{16, 1.1162}, {18, 1.1319}, {20, 1.1478}, {22, 1.1640}, {24, 1.1804}, {26, 1.1972},
}

// MaxBrineTDSMgL is the largest TDS BrineDensity accepts: a saturated NaCl
// solution at 20 C (26.4 % by mass, 1.197 kg/L) holds about 316 g/L.
const MaxBrineTDSMgL = 316000

// BrineDensity returns the density (kg/L) of a water of total dissolved solids
// tdsMgL (mg per litre of solution) at tempC, taking the solids as
// NaCl-equivalent: the CRC table of NaCl solutions at 20 C interpolated in mass
// fraction (found by fixed point, since the mass fraction itself depends on the
// density), moved to tempC by the change of pure water's density (Kell 1975;
// common practice for a screening estimate: brines expand somewhat more than
// water with temperature). It errs for waters dominated by other salts (CaCl2
// brines are denser at the same TDS).
func BrineDensity(tdsMgL, tempC float64) (float64, error) {
	if !(tdsMgL >= 0) || tdsMgL > MaxBrineTDSMgL || math.IsInf(tdsMgL, 0) {
		return 0, fmt.Errorf("%w: TDS %g mg/L outside 0-%g mg/L (NaCl saturation)", ErrInput, tdsMgL, float64(MaxBrineTDSMgL))
	}
	if !(tempC >= MinTempC && tempC <= MaxTempC) {
		return 0, fmt.Errorf("%w: temperature %g C outside %g-%g C", ErrTemperature, tempC, MinTempC, MaxTempC)
	}
	rho := 1.0
	for i := 0; i < 50; i++ {
		pct := 100 * tdsMgL / (1e6 * rho) // mg/L / (mg of solution per L) in percent
		next := naclAt20(pct)
		if math.Abs(next-rho) < 1e-10 {
			rho = next
			break
		}
		rho = next
	}
	return rho * WaterDensity(tempC) / WaterDensity(20), nil
}

// naclAt20 interpolates the table linearly in mass percent (beyond its end,
// along its last step).
func naclAt20(pct float64) float64 {
	t := naclDensity20
	i := sort.Search(len(t), func(i int) bool { return t[i][0] >= pct })
	switch {
	case i == 0:
		return t[0][1]
	case i >= len(t):
		i = len(t) - 1
	}
	a, b := t[i-1], t[i]
	return a[1] + (pct-a[0])*(b[1]-a[1])/(b[0]-a[0])
}
