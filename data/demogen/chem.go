package main

import "math"

// This file holds the generator's own rough water chemistry: just enough to
// give the invented demo waters a pH consistent with their alkalinity and
// carbon, and to steer calcite, gypsum and barite towards plausible
// saturation states. It is deliberately small and separate from package
// speciation (the generator must not depend on the code whose output the demo
// is meant to exercise). Its saturation indices are approximate; gwsat's own
// engine is the authority on the demo's chemistry.

// Component indices of a water's totals (mol per kg of water; alkalinity in
// eq/kgw; total inorganic carbon in mol/kgw).
const (
	cCa = iota
	cMg
	cNa
	cK
	cSr
	cBa
	cFe
	cMn
	cCl
	cSO4
	cF
	cSiO2
	cNO3
	cBr
	cAlk
	cTIC
	nComp
)

// Molar masses in g/mol from the IUPAC standard atomic weights (CIAAW 2021,
// abridged values; from memory): Ca 40.078, Mg 24.305, Na 22.990, K 39.098,
// Sr 87.62, Ba 137.33, Fe 55.845, Mn 54.938, Cl 35.45, S 32.06, O 15.999,
// N 14.007, F 18.998, Br 79.904, Si 28.085.
// SO4 = 32.06 + 4*15.999; SiO2 = 28.085 + 2*15.999; NO3 is reported as N.
// Alkalinity is reported as CaCO3, 50.043 g per equivalent (100.086/2).
var molarMass = [nComp]float64{
	cCa: 40.078, cMg: 24.305, cNa: 22.990, cK: 39.098, cSr: 87.62,
	cBa: 137.33, cFe: 55.845, cMn: 54.938, cCl: 35.45, cSO4: 96.056,
	cF: 18.998, cSiO2: 60.083, cNO3: 14.007, cBr: 79.904,
	cAlk: 50.043, cTIC: 12.011,
}

// charge of each component as it counts in the charge balance (alkalinity is
// already in equivalents, counted as -1 per eq).
var charge = [nComp]float64{
	cCa: 2, cMg: 2, cNa: 1, cK: 1, cSr: 2, cBa: 2, cFe: 2, cMn: 2,
	cCl: -1, cSO4: -2, cF: -1, cNO3: -1, cBr: -1, cAlk: -1,
}

// water is a composition by totals per kg of water at a temperature.
type water struct {
	TempC float64
	Tot   [nComp]float64
}

// mixWaters mixes a and b by mass of water: fraction fb of b. Totals per kg
// of water mix linearly; temperature is set by the caller.
func mixWaters(a, b water, fb float64) water {
	var m water
	for i := range m.Tot {
		m.Tot[i] = (1-fb)*a.Tot[i] + fb*b.Tot[i]
	}
	m.TempC = (1-fb)*a.TempC + fb*b.TempC
	return m
}

// closeChargeBalance adjusts Na so that cations and anions (in eq/kgw) are
// equal. It is how the generator keeps its waters electrically neutral before
// analytical noise is added.
func closeChargeBalance(w *water) {
	sum := 0.0
	for i, z := range charge {
		if i == cNa {
			continue
		}
		sum += z * w.Tot[i]
	}
	w.Tot[cNa] = math.Max(-sum, 0)
}

// Equilibrium constants. All log10, T in kelvin.

// Plummer & Busenberg (1982), GCA 46, 1011-1040 (analytic expressions).
func logKCalcite(T float64) float64 {
	return -171.9065 - 0.077993*T + 2839.319/T + 71.595*math.Log10(T)
}
func logKH(T float64) float64 {
	return 108.3865 + 0.01985076*T - 6919.53/T - 40.45154*math.Log10(T) + 669365/(T*T)
}
func logK1(T float64) float64 {
	return -356.3094 - 0.06091964*T + 21834.37/T + 126.8339*math.Log10(T) - 1684915/(T*T)
}
func logK2(T float64) float64 {
	return -107.8871 - 0.03252849*T + 5151.79/T + 38.92561*math.Log10(T) - 563713.9/(T*T)
}
func logKCaHCO3(T float64) float64 {
	return 1209.120 + 0.31294*T - 34765.05/T - 478.782*math.Log10(T)
}
func logKCaCO3(T float64) float64 {
	return -1228.732 - 0.299444*T + 35512.75/T + 485.818*math.Log10(T)
}

// Water ionisation, compilation analytic form (from memory, cross-checked against the CRC pKw table of Marshall &
// Franck 1981).
func logKw(T float64) float64 {
	return -283.971 - 0.05069842*T + 13323.0/T + 102.24447*math.Log10(T) - 1119669/(T*T)
}

// Barite: compilation analytic form after Blount (1977), from memory,
// cross-checked (-9.97 at 25 C; Felmy et al. 1990 give -10.05 +- 0.05).
func logKBarite(T float64) float64 {
	return 136.035 - 7680.41/T - 48.595*math.Log10(T)
}

// Gypsum: CODATA log K -4.580 and dH -1.13 kJ/mol at 25 C (quoted in Shen et
// al. 2020, J. Chem. Eng. Data 65, Table 3), van 't Hoff in temperature.
func logKGypsum(T float64) float64 {
	const dH = -1130.0 // J/mol
	return -4.580 - dH/(8.314462618*math.Ln10)*(1/T-1/298.15)
}

// Ion-pair association constants at 25 C, used at every temperature (a
// simplification). Sources: CaSO4 2.30, MgSO4
// 2.37, NaSO4 0.70, KSO4 0.85, NaCO3 1.27, NaHCO3 -0.25 (compilation values,
// from memory); MgHCO3 1.07 and MgCO3 2.98 (Siebert & Hostetler 1977);
// SrSO4 1.86 and BaSO4 2.72 (Felmy et al. 1990).
const (
	logKCaSO4  = 2.30
	logKMgSO4  = 2.37
	logKNaSO4  = 0.70
	logKKSO4   = 0.85
	logKSrSO4  = 1.86
	logKBaSO4  = 2.72
	logKMgHCO3 = 1.07
	logKMgCO3  = 2.98
	logKNaCO3  = 1.27
	logKNaHCO3 = -0.25
)

// davisA is the Debye-Hueckel A parameter from the formula used in water
// treatment practice (from memory, cross-checked:
// 0.5108 at 25 C).
func davisA(T float64) float64 {
	eps := 60954/(T+116) - 68.937
	return 1.82e6 * math.Pow(eps*T, -1.5)
}

// davies returns log10 gamma by the Davies (1962) equation.
func davies(A, z, I float64) float64 {
	s := math.Sqrt(I)
	return -A * z * z * (s/(1+s) - 0.3*I)
}

// state is the result of speciating a water at a given pH.
type state struct {
	pH, I, Alk                    float64
	SICalcite, SIGypsum, SIBarite float64
	LogPCO2                       float64
}

// speciateAt solves the free-ion distribution of w at a fixed pH by
// fixed-point iteration, and returns the carbonate alkalinity it implies and
// the saturation indices.
func speciateAt(w water, pH float64) state {
	T := w.TempC + 273.15
	A := davisA(T)
	t := w.Tot
	h := math.Pow(10, -pH)
	K1, K2 := math.Pow(10, logK1(T)), math.Pow(10, logK2(T))
	Kw := math.Pow(10, logKw(T))
	kCaHCO3, kCaCO3 := math.Pow(10, logKCaHCO3(T)), math.Pow(10, logKCaCO3(T))
	p := func(l float64) float64 { return math.Pow(10, l) }
	kCaSO4, kMgSO4, kNaSO4, kKSO4 := p(logKCaSO4), p(logKMgSO4), p(logKNaSO4), p(logKKSO4)
	kSrSO4, kBaSO4 := p(logKSrSO4), p(logKBaSO4)
	kMgHCO3, kMgCO3, kNaCO3, kNaHCO3 := p(logKMgHCO3), p(logKMgCO3), p(logKNaCO3), p(logKNaHCO3)

	// starting guesses: everything free
	ca, mg, na, k, sr, ba, so4 := t[cCa], t[cMg], t[cNa], t[cK], t[cSr], t[cBa], t[cSO4]
	co2 := t[cTIC] * 0.2
	I := 0.0
	for i, z := range charge {
		if i == cAlk {
			continue
		}
		I += 0.5 * z * z * t[i]
	}
	I += 0.5 * t[cAlk]
	var g1, g2, hco3, co3, alk float64
	var pairs1 float64 // molality of charged (z=1) pairs, for I
	for iter := 0; iter < 200; iter++ {
		g1 = math.Pow(10, davies(A, 1, I))
		g2 = math.Pow(10, davies(A, 2, I))
		aSO4 := so4 * g2
		// carbonate per unit free CO2 (activity = molality for neutral species)
		rH := K1 / h            // aHCO3 per aCO2
		rC := K1 * K2 / (h * h) // aCO3 per aCO2
		aCa, aMg, aNa := ca*g2, mg*g2, na*g1
		den := 1 + rH/g1 + rC/g2 +
			kCaHCO3*aCa*rH/g1 + kCaCO3*aCa*rC +
			kMgHCO3*aMg*rH/g1 + kMgCO3*aMg*rC +
			kNaHCO3*aNa*rH + kNaCO3*aNa*rC/g1
		co2n := t[cTIC] / den
		aHCO3, aCO3 := rH*co2n, rC*co2n
		can := t[cCa] / (1 + kCaSO4*g2*aSO4 + kCaHCO3*g2*aHCO3/g1 + kCaCO3*g2*aCO3)
		mgn := t[cMg] / (1 + kMgSO4*g2*aSO4 + kMgHCO3*g2*aHCO3/g1 + kMgCO3*g2*aCO3)
		nan := t[cNa] / (1 + kNaSO4*g1*aSO4/g1 + kNaHCO3*g1*aHCO3 + kNaCO3*g1*aCO3/g1)
		kn := t[cK] / (1 + kKSO4*g1*aSO4/g1)
		srn := t[cSr] / (1 + kSrSO4*g2*aSO4)
		ban := t[cBa] / (1 + kBaSO4*g2*aSO4)
		aCa, aMg, aNa = can*g2, mgn*g2, nan*g1
		so4n := t[cSO4] / (1 + kCaSO4*aCa*g2 + kMgSO4*aMg*g2 + kNaSO4*aNa*g2/g1 +
			kKSO4*kn*g1*g2/g1 + kSrSO4*srn*g2*g2 + kBaSO4*ban*g2*g2)
		const damp = 0.5
		ca += damp * (can - ca)
		mg += damp * (mgn - mg)
		na += damp * (nan - na)
		k += damp * (kn - k)
		sr += damp * (srn - sr)
		ba += damp * (ban - ba)
		so4 += damp * (so4n - so4)
		co2 += damp * (co2n - co2)
		hco3 = rH * co2 / g1
		co3 = rC * co2 / g2
		// charged pairs
		pCaHCO3 := kCaHCO3 * ca * g2 * rH * co2 / g1
		pMgHCO3 := kMgHCO3 * mg * g2 * rH * co2 / g1
		pNaCO3 := kNaCO3 * na * g1 * rC * co2 / g1
		pNaSO4 := kNaSO4 * na * g1 * so4 * g2 / g1
		pKSO4 := kKSO4 * k * g1 * so4 * g2 / g1
		pCaCO3 := kCaCO3 * ca * g2 * rC * co2
		pMgCO3 := kMgCO3 * mg * g2 * rC * co2
		pNaHCO3 := kNaHCO3 * na * g1 * rH * co2
		pairs1 = pCaHCO3 + pMgHCO3 + pNaCO3 + pNaSO4 + pKSO4
		mH, mOH := h/g1, Kw/(h*g1)
		alk = hco3 + 2*co3 + pCaHCO3 + pMgHCO3 + 2*pNaCO3 + 2*pCaCO3 + 2*pMgCO3 + pNaHCO3 + mOH - mH
		In := 0.5 * (4*(ca+mg+sr+ba+t[cFe]+t[cMn]) + na + k + t[cCl] + t[cF] + t[cNO3] + t[cBr] +
			4*so4 + hco3 + 4*co3 + pairs1 + mH + mOH)
		if math.Abs(In-I) < 1e-11*In && iter > 5 {
			I = In
			break
		}
		I += damp * (In - I)
	}
	aCa := ca * g2
	st := state{pH: pH, I: I, Alk: alk}
	st.SICalcite = math.Log10(aCa*co3*g2) - logKCalcite(T)
	st.SIGypsum = math.Log10(aCa*so4*g2) - logKGypsum(T) // water activity taken as 1
	st.SIBarite = math.Log10(ba*g2*so4*g2) - logKBarite(T)
	st.LogPCO2 = math.Log10(co2) - logKH(T)
	return st
}

// bisect finds the root of a continuous monotone f in [lo, hi] by the
// Illinois variant of regula falsi (Dowell & Jarratt 1971, from memory), which keeps the
// bracket of bisection but converges superlinearly. n bounds the iterations;
// it stops when the bracket is narrower than tol.
func bisect(f func(float64) float64, lo, hi float64, n int) float64 {
	const tol = 1e-9
	flo, fhi := f(lo), f(hi)
	if flo == 0 {
		return lo
	}
	if fhi == 0 || (flo < 0) == (fhi < 0) {
		return hi
	}
	side := 0
	x := lo
	for i := 0; i < n && hi-lo > tol*math.Max(1, math.Abs(x)); i++ {
		x = (lo*fhi - hi*flo) / (fhi - flo)
		fx := f(x)
		if fx == 0 {
			return x
		}
		if (fx < 0) == (flo < 0) {
			lo, flo = x, fx
			if side == -1 {
				fhi /= 2
			}
			side = -1
		} else {
			hi, fhi = x, fx
			if side == 1 {
				flo /= 2
			}
			side = 1
		}
	}
	return x
}

// speciate finds the pH at which the carbonate alkalinity of w equals its
// total alkalinity.
func speciate(w water) state {
	pH := bisect(func(pH float64) float64 {
		d := speciateAt(w, pH).Alk - w.Tot[cAlk]
		if math.IsNaN(d) {
			// The fixed point only fails at strongly alkaline pH, where the
			// alkalinity would exceed any of these waters'.
			return 1
		}
		return d
	}, 3.5, 10, 60)
	return speciateAt(w, pH)
}

// setTICFromPH sets the total inorganic carbon of w so that at the given pH
// its carbonate alkalinity equals its total alkalinity (how an analysis with
// a field pH and an alkalinity fixes the carbonate system).
func setTICFromPH(w *water, pH float64) {
	alk := w.Tot[cAlk]
	lt := bisect(func(lt float64) float64 {
		v := *w
		v.Tot[cTIC] = math.Pow(10, lt)
		return speciateAt(v, pH).Alk - alk
	}, math.Log10(alk*0.3), math.Log10(alk*30), 50)
	w.Tot[cTIC] = math.Pow(10, lt)
}

// Mineral reactions: stoichiometry per mol dissolved (positive = dissolution).
type mineral int

const (
	calcite mineral = iota
	gypsum
	barite
)

func (m mineral) dissolve(w *water, x float64) {
	switch m {
	case calcite:
		w.Tot[cCa] += x
		w.Tot[cTIC] += x
		w.Tot[cAlk] += 2 * x
	case gypsum:
		w.Tot[cCa] += x
		w.Tot[cSO4] += x
	case barite:
		w.Tot[cBa] += x
		w.Tot[cSO4] += x
	}
}

func (m mineral) si(s state) float64 {
	switch m {
	case calcite:
		return s.SICalcite
	case gypsum:
		return s.SIGypsum
	}
	return s.SIBarite
}

// react moves the saturation index of mineral m in w to target by dissolving
// (x > 0) or precipitating (x < 0) it, and returns x in mol/kgw. maxDissolve
// bounds dissolution.
func react(w *water, m mineral, target, maxDissolve float64) float64 {
	lim := 0.0 // most that can precipitate
	switch m {
	case calcite:
		lim = math.Min(w.Tot[cCa], math.Min(w.Tot[cTIC], w.Tot[cAlk]/2))
	case gypsum:
		lim = math.Min(w.Tot[cCa], w.Tot[cSO4])
	case barite:
		lim = math.Min(w.Tot[cBa], w.Tot[cSO4])
	}
	f := func(x float64) float64 {
		v := *w
		m.dissolve(&v, x)
		return m.si(speciate(v)) - target
	}
	lo, hi := -0.999*lim, maxDissolve
	if m == calcite {
		// Removing nearly all the carbonate would send the pH out of range.
		lo = -0.5 * lim
	}
	if f(lo) > 0 || f(hi) < 0 {
		return 0 // target out of reach; leave the water as it is
	}
	x := bisect(f, lo, hi, 40)
	m.dissolve(w, x)
	return x
}
