package speciation

import (
	"fmt"
	"math"
)

// Temperature dependence of ion pairing from the Fuoss (1958) equation.
//
// Fuoss, R. M. (1958), J. Am. Chem. Soc. 80, 5059-5061, gives the association constant of
// a pair of ions of charges z1, z2 in contact at distance a as
//
//	K_A = (4 pi N_A a^3 / 3000) exp(b),   b = |z1 z2| e^2 / (4 pi eps0 eps_r a k T)
//
// (K_A in L/mol with a in cm). Only b depends on temperature, through eps_r T, so
//
//	K_A(T) / K_A(25 C) = exp(b25 (eps_r(25 C) 298.15 / (eps_r(T) T) - 1)).
//
// The distance a is solved from the measured association constant at 25 C. For
// CaSO4(aq), log K = 2.30 gives a = 0.40 nm and, by differentiating, an association
// enthalpy of 6.3 kJ/mol at 25 C, against the measured 6.9 kJ/mol (1.65 kcal, thermo.txt):
// the equation carries the temperature change of the 2-2 sulfate pairs (see
// TestFuossCaSO4Enthalpy). The relative permittivity is WaterDielectric (Malmberg &
// Maryott 1956).

// coulombOverK is e^2 / (4 pi eps0 k) in metre kelvin (CODATA 2018 constants:
// e 1.602176634e-19 C, eps0 8.8541878128e-12 F/m, k 1.380649e-23 J/K).
const coulombOverK = 1.602176634e-19 * 1.602176634e-19 / (4 * math.Pi * 8.8541878128e-12 * 1.380649e-23)

// avogadro is N_A in 1/mol (CODATA 2018, exact).
const avogadro = 6.02214076e23

// fuossLogK returns log10 K_A (L/mol) of the Fuoss equation for the charge product z
// and contact distance aM (metres) at tempK.
func fuossLogK(z, aM, tempK float64) float64 {
	b := z * coulombOverK / (WaterDielectric(tempK-273.15) * tempK * aM)
	aCm := aM * 100
	return math.Log10(4*math.Pi*avogadro*aCm*aCm*aCm/3000) + b/math.Ln10
}

// fuossDistance solves the contact distance (metres) at which the Fuoss equation gives
// log10 K = logK at 25 C, by bisection between 0.1 nm and the distance where b = 3: d(log K)/da
// = (3 - b)/(a ln 10), so log K falls with the distance up to there and rises beyond it (the
// rising branch is the unphysical one of a pair held only by the volume term).
func fuossDistance(z, logK float64) (float64, error) {
	lo, hi := 0.1e-9, z*coulombOverK/(WaterDielectric(25)*T25*3)
	flo, fhi := fuossLogK(z, lo, T25)-logK, fuossLogK(z, hi, T25)-logK
	if flo*fhi > 0 {
		return 0, fmt.Errorf("fuoss: no contact distance between 0.1 and %.2f nm gives log K %g for charge product %g (the equation's least log K is %.2f)", hi*1e9, logK, z, fuossLogK(z, hi, T25))
	}
	for range 200 {
		mid := 0.5 * (lo + hi)
		fm := fuossLogK(z, mid, T25) - logK
		if fm*flo > 0 {
			lo, flo = mid, fm
		} else {
			hi = mid
		}
	}
	return 0.5 * (lo + hi), nil
}

// fuossExponent returns b at 25 C for the pair of charge product z whose association
// constant at 25 C is 10^logK.
func fuossExponent(z, logK float64) (float64, error) {
	a, err := fuossDistance(z, logK)
	if err != nil {
		return 0, err
	}
	return z * coulombOverK / (WaterDielectric(25) * T25 * a), nil
}

// fuossRatio returns K_A(T)/K_A(25 C) for the exponent b25 at 25 C.
func fuossRatio(b25, tempK float64) float64 {
	e25T := WaterDielectric(25) * T25
	eT := WaterDielectric(tempK-273.15) * tempK
	return math.Exp(b25 * (e25T/eT - 1))
}

// fuossHeatCapacity returns the part of log10 K(T) of an ion pair (charge
// product z, log K logK25 at 25 C) that the Fuoss equation adds to a van 't
// Hoff line: its log K(T) minus its own value and tangent (in 1/T) at 25 C,
//
//	[b(T) - b25 - (dH_F/R)(1/T25 - 1/T)] / ln 10,   b(T) = b25 eps_r(25) T25 / (eps_r(T) T),
//
// which is zero with zero slope at 25 C. Added to the van 't Hoff line of the
// measured enthalpy, it keeps that enthalpy at 25 C and gives the pair the heat
// capacity of association the equation implies (the pairing constant rising
// faster with temperature as the dielectric constant of water falls).
func fuossHeatCapacity(z, logK25 float64) (LogKFunc, error) {
	b25, err := fuossExponent(z, logK25)
	if err != nil {
		return LogKFunc{}, err
	}
	e25 := WaterDielectric(25)
	g := b25 * e25 * T25 // b(T) = g / (eps_r(T) T)
	// dH_F/R = T^2 d ln K/dT = -T^2 g (eps_r + T d eps_r/dT)/(eps_r T)^2 at 25 C
	const h = 1e-3
	deps := (WaterDielectric(25+h) - WaterDielectric(25-h)) / (2 * h)
	dhOverR := -T25 * T25 * g * (e25 + T25*deps) / (e25 * T25 * e25 * T25)
	return LogKFunc{
		A: (-b25 - dhOverR/T25) / math.Ln10,
		C: dhOverR / math.Ln10,
		F: g / math.Ln10,
	}, nil
}
