package speciation

import "math"

// The functions of Pitzer's ion-interaction equations, as written by Harvie, Moller &
// Weare (1984), GCA 48, 723-751, appendix, after Pitzer (1973) and Pitzer &
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

// pitzerAlphaFuncs returns g, g', dg'/dx and e^-x at x with one exponential.
func pitzerAlphaFuncs(x float64) pzAlphaFuncs {
	if x < 0.01 {
		return pzAlphaFuncs{g: pitzerG(x), gp: pitzerGp(x), gpp: pitzerGpp(x), e: math.Exp(-x)}
	}
	e := math.Exp(-x)
	x2 := x * x
	p1 := 1 - (1+x)*e
	p2 := 1 - (1+x+0.5*x2)*e
	return pzAlphaFuncs{g: 2 * p1 / x2, gp: -2 * p2 / x2, gpp: -e + 4*p2/(x2*x), e: e}
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

// pitzerJ returns J(x) and its first two derivatives (Pitzer 1975 approximation).
func pitzerJ(x float64) (j, jp, jpp float64) {
	if x <= 0 {
		return 0, 0, 0
	}
	lx := math.Log(x)
	xc4 := math.Exp(pzJC4 * lx)
	u := pzJC1 * math.Exp(-pzJC2*lx-pzJC3*xc4)
	d := 4 + u
	j = x / d
	// with K = C2 + C3 C4 x^C4: du/dx = -u K / x, J' = (4 + u (1 + K)) / d^2,
	// J'' = (N' d - 2 N d') / d^3 with N = 4 + u (1 + K), d' = du/dx,
	// N' = du/dx (1 + K) + u C3 C4^2 x^C4 / x
	k := pzJC2 + pzJC3*pzJC4*xc4
	n := 4 + u*(1+k)
	du := -u * k / x
	dn := du*(1+k) + u*pzJC3*pzJC4*pzJC4*xc4/x
	jp = n / (d * d)
	jpp = (dn*d - 2*n*du) / (d * d * d)
	return j, jp, jpp
}

// pitzerETheta returns the unsymmetrical-mixing terms E-theta and E-theta' for two ions
// of charge magnitudes zi and zj (same sign) at ionic strength I with osmotic slope
// aphi (Pitzer 1975; HMW84 appendix), and d(E-theta')/dI:
//
//	x_ij = 6 zi zj A_phi sqrt(I)
//	Etheta  = zi zj / (4 I) [J(x_ij) - J(x_ii)/2 - J(x_jj)/2]
//	Etheta' = -Etheta / I + zi zj / (8 I^2) [x_ij J'(x_ij) - x_ii J'(x_ii)/2 - x_jj J'(x_jj)/2]
func pitzerETheta(zi, zj, I, aphi float64) (et, etp, etpp float64) {
	if zi == zj || I <= 0 {
		return 0, 0, 0
	}
	s := 6 * aphi * math.Sqrt(I)
	xij, xii, xjj := s*zi*zj, s*zi*zi, s*zj*zj
	jij, jpij, jppij := pitzerJ(xij)
	jii, jpii, jppii := pitzerJ(xii)
	jjj, jpjj, jppjj := pitzerJ(xjj)
	zz := zi * zj
	et = zz / (4 * I) * (jij - 0.5*jii - 0.5*jjj)
	S := xij*jpij - 0.5*xii*jpii - 0.5*xjj*jpjj
	etp = -et/I + zz/(8*I*I)*S
	// dS/dI = sum c (J' + x J'') x / (2 I)
	dS := (xij*(jpij+xij*jppij) - 0.5*xii*(jpii+xii*jppii) - 0.5*xjj*(jpjj+xjj*jppjj)) / (2 * I)
	etpp = -etp/I + et/(I*I) - zz*S/(4*I*I*I) + zz/(8*I*I)*dS
	return et, etp, etpp
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
