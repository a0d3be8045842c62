package speciation

import "math"

// The functions of Pitzer's ion-interaction equations, as written by Harvie, Moller &
// Weare (1984), GCA 48, 723-751, appendix (eq. A1-A9), after Pitzer (1973) and Pitzer &
// Mayorga (1973).

// pitzerB is the constant b = 1.2 kg^0.5 mol^-0.5 of the Debye-Hueckel term (Pitzer 1973).
const pitzerB = 1.2

// waterMolarMass is M_w in kg/mol for ln a_w = -phi M_w sum m_i.
const waterMolarMass = 0.018015

// pitzerG is g(x) = 2 (1 - (1 + x) e^-x) / x^2, with its series below x = 0.01.
func pitzerG(x float64) float64 {
	if x < 0.01 {
		return 1 - x*(2.0/3-x*(0.25-x/15))
	}
	return 2 * (1 - (1+x)*math.Exp(-x)) / (x * x)
}

// pitzerGp is g'(x) = -2 (1 - (1 + x + x^2/2) e^-x) / x^2 (so that B' = beta g'(alpha
// sqrt I) / I), with its series below x = 0.01.
func pitzerGp(x float64) float64 {
	if x < 0.01 {
		return -x * (1.0/3 - x*(0.25-x/10))
	}
	return -2 * (1 - (1+x+0.5*x*x)*math.Exp(-x)) / (x * x)
}

// pitzerGpp returns d g'(x)/dx = -e^-x + 4 (1 - (1 + x + x^2/2) e^-x) / x^3, used for
// dB'/dI = beta (x h'(x)/2 - h(x)) / I^2 with h = g' (series below x = 0.01).
func pitzerGpp(x float64) float64 {
	if x < 0.01 {
		return -1.0/3 + x*(0.5-0.3*x)
	}
	return -math.Exp(-x) + 4*(1-(1+x+0.5*x*x)*math.Exp(-x))/(x*x*x)
}

// Constants of Pitzer's (1975) approximation of the unsymmetrical-mixing integral,
// J(x) = x / (4 + C1 x^-C2 exp(-C3 x^C4)) (Pitzer, K.S., 1975, J. Solution Chem. 4,
// 249-265, eq. 47; from memory).
const (
	pzJC1 = 4.581
	pzJC2 = 0.7237
	pzJC3 = 0.0120
	pzJC4 = 0.528
)

// pitzerJ returns J(x) and its derivative J'(x) (Pitzer 1975 approximation).
func pitzerJ(x float64) (j, jp float64) {
	if x <= 0 {
		return 0, 0
	}
	xc4 := math.Pow(x, pzJC4)
	u := pzJC1 * math.Pow(x, -pzJC2) * math.Exp(-pzJC3*xc4)
	d := 4 + u
	j = x / d
	// du/dx = -u (C2 + C3 C4 x^C4) / x, so J' = (4 + u (1 + C2 + C3 C4 x^C4)) / (4 + u)^2
	jp = (4 + u*(1+pzJC2+pzJC3*pzJC4*xc4)) / (d * d)
	return j, jp
}

// pitzerETheta returns the unsymmetrical-mixing terms E-theta and E-theta' for two ions
// of charge magnitudes zi and zj (same sign) at ionic strength I with osmotic slope
// aphi (Pitzer 1975; HMW84 eq. A14-A15):
//
//	x_ij = 6 zi zj A_phi sqrt(I)
//	Etheta  = zi zj / (4 I) [J(x_ij) - J(x_ii)/2 - J(x_jj)/2]
//	Etheta' = -Etheta / I + zi zj / (8 I^2) [x_ij J'(x_ij) - x_ii J'(x_ii)/2 - x_jj J'(x_jj)/2]
func pitzerETheta(zi, zj, I, aphi float64) (et, etp float64) {
	if zi == zj || I <= 0 {
		return 0, 0
	}
	s := 6 * aphi * math.Sqrt(I)
	xij, xii, xjj := s*zi*zj, s*zi*zi, s*zj*zj
	jij, jpij := pitzerJ(xij)
	jii, jpii := pitzerJ(xii)
	jjj, jpjj := pitzerJ(xjj)
	zz := zi * zj
	et = zz / (4 * I) * (jij - 0.5*jii - 0.5*jjj)
	etp = -et/I + zz/(8*I*I)*(xij*jpij-0.5*xii*jpii-0.5*xjj*jpjj)
	return et, etp
}

// pitzerFDH returns the Debye-Hueckel part of F, -A_phi [sqrt I/(1 + b sqrt I) +
// (2/b) ln(1 + b sqrt I)], its derivative with respect to I, and the Debye-Hueckel part
// of the osmotic sum, -A_phi I^1.5 / (1 + b sqrt I).
func pitzerFDH(I, aphi float64) (f, df, phiDH float64) {
	s := math.Sqrt(I)
	q := 1 + pitzerB*s
	f = -aphi * (s/q + 2/pitzerB*math.Log(q))
	if s > 0 {
		// dF/ds = -A (1/q^2 + 2/q), dF/dI = dF/ds / (2 s)
		df = -aphi * (1/(q*q) + 2/q) / (2 * s)
	}
	phiDH = -aphi * I * s / q
	return f, df, phiDH
}
