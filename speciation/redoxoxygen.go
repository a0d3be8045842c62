package speciation

import (
	"fmt"
	"math"
)

// MolarMassO2 is the molar mass of O2 in g/mol (IUPAC 2013 standard atomic weight of
// O, 15.999, from memory).
const MolarMassO2 = 31.998

// OxygenSaturationMgL returns the concentration of dissolved oxygen (mg/L) in water
// in equilibrium with water-saturated air at tempC (0-40 C), salinity (g/kg, 0-40;
// 0 for fresh water) and total pressure pressureAtm (atm; 1 at sea level).
//
// The fresh-water, 1 atm value is the equation of Benson & Krause (1984, Limnol.
// Oceanogr. 29, 620-632) in the form of APHA Standard Methods 4500-O:
// ln C = -139.34410 + 1.575701e5/T - 6.642308e7/T^2 + 1.243800e10/T^3 - 8.621949e11/T^4
// (read as reproduced in the SWAT+ theoretical documentation, "Oxygen saturation
// concentration"). The salinity term, - S (1.7674e-2 - 1.0754e1/T + 2.1407e3/T^2), and
// the pressure correction, C P (1 - Pwv/P)(1 - theta P) / ((1 - Pwv)(1 - theta)) with
// ln Pwv = 11.8571 - 3840.70/T - 216961/T^2 (atm) and theta = 0.000975 - 1.426e-5 t +
// 6.436e-8 t^2, are those of the same method (from memory).
func OxygenSaturationMgL(tempC, salinity, pressureAtm float64) (float64, error) {
	if !finite(tempC) || tempC < 0 || tempC > 40 {
		return 0, fmt.Errorf("%w: oxygen solubility at %g C (the equation holds from 0 to 40 C)", ErrRedoxInput, tempC)
	}
	if !finite(salinity) || salinity < 0 || salinity > 40 {
		return 0, fmt.Errorf("%w: salinity %g g/kg (0-40)", ErrRedoxInput, salinity)
	}
	if !finite(pressureAtm) || pressureAtm < 0.5 || pressureAtm > 1.1 {
		return 0, fmt.Errorf("%w: pressure %g atm (0.5-1.1)", ErrRedoxInput, pressureAtm)
	}
	T := tempC + 273.15
	T2 := T * T
	lnC := -139.34410 + 1.575701e5/T - 6.642308e7/T2 + 1.243800e10/(T2*T) - 8.621949e11/(T2*T2)
	lnC -= salinity * (1.7674e-2 - 1.0754e1/T + 2.1407e3/T2)
	c := math.Exp(lnC)
	if pressureAtm != 1 {
		pwv := math.Exp(11.8571 - 3840.70/T - 216961/T2)
		th := 0.000975 - 1.426e-5*tempC + 6.436e-8*tempC*tempC
		c *= pressureAtm * (1 - pwv/pressureAtm) * (1 - th*pressureAtm) / ((1 - pwv) * (1 - th))
	}
	return c, nil
}

// OxygenMgLFromPercent converts a reading in percent of air saturation to mg/L at
// tempC, salinity (g/kg) and pressureAtm (see OxygenSaturationMgL).
func OxygenMgLFromPercent(percent, tempC, salinity, pressureAtm float64) (float64, error) {
	if !finite(percent) || percent < 0 || percent > 500 {
		return 0, fmt.Errorf("%w: oxygen saturation %g %%", ErrRedoxInput, percent)
	}
	sat, err := OxygenSaturationMgL(tempC, salinity, pressureAtm)
	if err != nil {
		return 0, err
	}
	return percent / 100 * sat, nil
}

// OxygenMolKgw converts dissolved oxygen in mg/L to mol O2 per kg of water, given
// the kilograms of water per litre of sample (about 1 for fresh water).
func OxygenMolKgw(mgL, kgwPerL float64) (float64, error) {
	if !finite(mgL) || mgL < 0 || !finite(kgwPerL) || kgwPerL <= 0 {
		return 0, fmt.Errorf("%w: oxygen %g mg/L with %g kg water per litre", ErrRedoxInput, mgL, kgwPerL)
	}
	return mgL / 1000 / MolarMassO2 / kgwPerL, nil
}
