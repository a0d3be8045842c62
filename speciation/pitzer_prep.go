package speciation

import (
	"cmp"
	"math"
	"slices"
)

// How the Pitzer model treats each species of a solve.
const (
	pzIon          = iota // an ion of the parameter set
	pzNeutral             // a neutral species of the parameter set (lambda terms)
	pzOtherIon            // a charged species outside the set: ln gamma = z^2 F + |z| sum m_c m_a C_ca
	pzOtherNeutral        // a neutral species outside the set: gamma = 1
	pzSuppressed          // an ion pair the set represents by its interaction parameters
)

// pzSuppressLogGamma is log10 gamma given to a suppressed ion pair: its molality becomes
// 10^-30 of what it would be with gamma = 1, so it carries nothing (see Pitzer).
const pzSuppressLogGamma = 30

// pzClampLogGamma bounds the log10 gamma of the other species (reached only far from
// any solution, during a solver's search).
const pzClampLogGamma = 20

type pzPair struct {
	i, j   int32 // cation, anion
	b      *pzBinary
	a1     int8    // index of alpha1 in pzAlphas
	cScale float64 // C = Cphi / (2 sqrt|zc za|)
}

// pzAlphas are the alpha constants: alpha1 = 2 (pzAlpha2), 1.4 for 2-2 pairs
// (pzAlpha14), alpha2 = 12 (pzAlpha12).
var pzAlphas = [3]float64{2, 1.4, 12}

const (
	pzAlpha2 = iota
	pzAlpha14
	pzAlpha12
)

// pzAlphaFuncs are g, g', the derivative of g' and e^-x at x = alpha sqrt(I).
type pzAlphaFuncs struct{ g, gp, gpp, e float64 }

type pzLike struct {
	i, j  int32
	th    *pzTemp // nil: no theta
	combo int32   // index into pzPrep.combos, -1 when the charges are equal
}

type pzTriple struct {
	i, j, k int32 // i, j of one sign, k of the other
	v       *pzTemp
}

type pzLam struct {
	n, i int32
	v    *pzTemp
}

// pzPrep is the interaction structure of one species set, with the parameter values
// at one temperature and the scratch of an evaluation. Built once per species set.
type pzPrep struct {
	db      *Database
	species []int // the key: the species indices of the solve (nil for a named set)

	kind []int8
	z    []float64

	pairs   []pzPair
	likes   []pzLike
	triples []pzTriple
	lams    []pzLam
	combos  [][2]float64 // distinct unequal charge-magnitude pairs of the likes

	// values at tempC
	tempC          float64
	aphi           float64
	b0, b1, b2, cc []float64
	th, ps, lv     []float64
	et, etp, etpp  []float64 // per combo, at the last ionic strength (etpp: d etp/dI)

	m, ln []float64 // scratch: molalities, ln gamma
	dln   []float64 // d(ln gamma)/dI along the composition ray (molalities of ions proportional to I)

	// the composition of the last solver call per unit ionic strength (see
	// Pitzer.LogGammas), and whether it is set
	dir    []float64
	hasDir bool
}

// build fills the structure for species with the given names and charges; kinds
// classify them (pzIon, pzNeutral, ... as decided by the caller).
func (pr *pzPrep) build(p *PitzerParams, names []string, z []float64, kind []int8) {
	n := len(names)
	pr.kind = append(pr.kind[:0], kind...)
	pr.z = append(pr.z[:0], z...)
	pr.pairs, pr.likes, pr.triples, pr.lams, pr.combos = pr.pairs[:0], pr.likes[:0], pr.triples[:0], pr.lams[:0], pr.combos[:0]
	index := make(map[string]int32, n)
	for k, nm := range names {
		if kind[k] == pzIon || kind[k] == pzNeutral {
			index[nm] = int32(k)
		}
	}
	for i := 0; i < n; i++ {
		if kind[i] != pzIon {
			continue
		}
		for j := i + 1; j < n; j++ {
			if kind[j] != pzIon {
				continue
			}
			zi, zj := z[i], z[j]
			if zi*zj < 0 {
				c, a := i, j
				if zi < 0 {
					c, a = j, i
				}
				b := p.binary[[2]string{names[c], names[a]}]
				if b == nil {
					continue
				}
				zc, za := math.Abs(z[c]), math.Abs(z[a])
				a1 := int8(pzAlpha2)
				if zc == 2 && za == 2 {
					a1 = pzAlpha14
				}
				pr.pairs = append(pr.pairs, pzPair{i: int32(c), j: int32(a), b: b, a1: a1, cScale: 1 / (2 * math.Sqrt(zc*za))})
				continue
			}
			th := p.theta[sortedPair(names[i], names[j])]
			combo := int32(-1)
			ai, aj := math.Abs(zi), math.Abs(zj)
			if ai != aj {
				lo, hi := math.Min(ai, aj), math.Max(ai, aj)
				for c, cz := range pr.combos {
					if cz == [2]float64{lo, hi} {
						combo = int32(c)
					}
				}
				if combo < 0 {
					combo = int32(len(pr.combos))
					pr.combos = append(pr.combos, [2]float64{lo, hi})
				}
			}
			if th != nil || combo >= 0 {
				pr.likes = append(pr.likes, pzLike{i: int32(i), j: int32(j), th: th, combo: combo})
			}
		}
	}
	for key, v := range p.psi {
		i, ok1 := index[key[0]]
		j, ok2 := index[key[1]]
		k, ok3 := index[key[2]]
		if ok1 && ok2 && ok3 {
			pr.triples = append(pr.triples, pzTriple{i: i, j: j, k: k, v: v})
		}
	}
	for key, v := range p.lambda {
		nn, ok1 := index[key[0]]
		i, ok2 := index[key[1]]
		if ok1 && ok2 {
			pr.lams = append(pr.lams, pzLam{n: nn, i: i, v: v})
		}
	}
	// map order is random: sort, so that every build sums in the same order
	slices.SortFunc(pr.triples, func(a, b pzTriple) int {
		return cmp.Or(cmp.Compare(a.i, b.i), cmp.Compare(a.j, b.j), cmp.Compare(a.k, b.k))
	})
	slices.SortFunc(pr.lams, func(a, b pzLam) int { return cmp.Or(cmp.Compare(a.n, b.n), cmp.Compare(a.i, b.i)) })
	grow := func(s []float64, n int) []float64 {
		if cap(s) < n {
			return make([]float64, n)
		}
		return s[:n]
	}
	np := len(pr.pairs)
	pr.b0, pr.b1, pr.b2, pr.cc = grow(pr.b0, np), grow(pr.b1, np), grow(pr.b2, np), grow(pr.cc, np)
	pr.th, pr.ps, pr.lv = grow(pr.th, len(pr.likes)), grow(pr.ps, len(pr.triples)), grow(pr.lv, len(pr.lams))
	pr.et, pr.etp, pr.etpp = grow(pr.et, len(pr.combos)), grow(pr.etp, len(pr.combos)), grow(pr.etpp, len(pr.combos))
	pr.m, pr.ln, pr.dln, pr.dir = grow(pr.m, n), grow(pr.ln, n), grow(pr.dln, n), grow(pr.dir, n)
	pr.hasDir = false
	pr.tempC = math.NaN()
}

// setTemp evaluates the parameters at tempC.
func (pr *pzPrep) setTemp(p *PitzerParams, tempC float64) {
	T := tempC + 273.15
	pr.aphi = p.aphi.at(T)
	for k := range pr.pairs {
		b := pr.pairs[k].b
		pr.b0[k], pr.b1[k], pr.cc[k] = b.beta0.at(T), b.beta1.at(T), b.cphi.at(T)*pr.pairs[k].cScale
		pr.b2[k] = 0
		if b.has2 {
			pr.b2[k] = b.beta2.at(T)
		}
	}
	for k := range pr.likes {
		pr.th[k] = 0
		if t := pr.likes[k].th; t != nil {
			pr.th[k] = t.at(T)
		}
	}
	for k := range pr.triples {
		pr.ps[k] = pr.triples[k].v.at(T)
	}
	for k := range pr.lams {
		pr.lv[k] = pr.lams[k].v.at(T)
	}
	pr.tempC = tempC
}

// eval computes ln gamma of every entry into pr.ln from the molalities pr.m at ionic
// strength I (I > 0), with its derivative with respect to I along the composition
// ray (ion molalities proportional to I, neutral ones fixed) into pr.dln, and returns the osmotic coefficient and the sum of the
// molalities. Suppressed entries must have zero molality.
func (pr *pzPrep) eval(I float64) (phi, sumM float64) {
	m, ln, dln, z := pr.m, pr.ln, pr.dln, pr.z
	clear(ln)
	clear(dln)
	Z := 0.0
	for k, mk := range m {
		Z += mk * math.Abs(z[k])
		sumM += mk
	}
	sq := math.Sqrt(I)
	fDH, dfDH, phiDH := pitzerFDH(I, pr.aphi)
	F, dF := fDH, dfDH
	var phiSum, CS, dCS float64
	invI := 1 / I
	var af [len(pzAlphas)]pzAlphaFuncs
	for a, alpha := range pzAlphas {
		af[a] = pitzerAlphaFuncs(alpha * sq)
	}
	for k := range pr.pairs {
		pp := &pr.pairs[k]
		f1 := &af[pp.a1]
		b1 := pr.b1[k]
		B := pr.b0[k] + b1*f1.g
		Bp := b1 * f1.gp
		dBp := b1 * (0.5*pzAlphas[pp.a1]*sq*f1.gpp - f1.gp)
		Bphi := pr.b0[k] + b1*f1.e
		if b2 := pr.b2[k]; b2 != 0 {
			f2 := &af[pzAlpha12]
			B += b2 * f2.g
			Bp += b2 * f2.gp
			dBp += b2 * (0.5*pzAlphas[pzAlpha12]*sq*f2.gpp - f2.gp)
			Bphi += b2 * f2.e
		}
		Bp *= invI
		dBp *= invI * invI
		C := pr.cc[k]
		mc, ma := m[pp.i], m[pp.j]
		mm := mc * ma
		F += mm * Bp
		dF += mm * (2*Bp*invI + dBp)
		t := 2*B + Z*C
		dt := t*invI + 2*Bp + Z*C*invI
		ln[pp.i] += ma * t
		ln[pp.j] += mc * t
		dln[pp.i] += ma * dt
		dln[pp.j] += mc * dt
		CS += mm * C
		dCS += 2 * mm * C * invI
		phiSum += mm * (Bphi + Z*C)
	}
	for c, cz := range pr.combos {
		pr.et[c], pr.etp[c], pr.etpp[c] = pitzerETheta(cz[0], cz[1], I, pr.aphi)
	}
	for k := range pr.likes {
		lk := &pr.likes[k]
		phiV, phiP, phiPP := pr.th[k], 0.0, 0.0
		if lk.combo >= 0 {
			phiV += pr.et[lk.combo]
			phiP = pr.etp[lk.combo]
			phiPP = pr.etpp[lk.combo]
		}
		mi, mj := m[lk.i], m[lk.j]
		F += mi * mj * phiP
		dF += mi * mj * (2*phiP*invI + phiPP)
		ln[lk.i] += 2 * mj * phiV
		ln[lk.j] += 2 * mi * phiV
		dln[lk.i] += 2 * mj * (phiV*invI + phiP)
		dln[lk.j] += 2 * mi * (phiV*invI + phiP)
		phiSum += mi * mj * (phiV + I*phiP)
	}
	for k := range pr.triples {
		tr := &pr.triples[k]
		v := pr.ps[k]
		mi, mj, mk := m[tr.i], m[tr.j], m[tr.k]
		ln[tr.i] += mj * mk * v
		ln[tr.j] += mi * mk * v
		ln[tr.k] += mi * mj * v
		dln[tr.i] += 2 * mj * mk * v * invI
		dln[tr.j] += 2 * mi * mk * v * invI
		dln[tr.k] += 2 * mi * mj * v * invI
		phiSum += mi * mj * mk * v
	}
	for k := range pr.lams {
		l := &pr.lams[k]
		v := pr.lv[k]
		mn, mi := m[l.n], m[l.i]
		ln[l.n] += 2 * mi * v
		ln[l.i] += 2 * mn * v
		dln[l.n] += 2 * mi * v * invI
		phiSum += mn * mi * v
	}
	for k, zk := range z {
		if zk != 0 {
			ln[k] += zk*zk*F + math.Abs(zk)*CS
			dln[k] += zk*zk*dF + math.Abs(zk)*dCS
		}
	}
	phi = 1
	if sumM > 0 {
		phi = 1 + 2/sumM*(phiDH+phiSum)
	}
	return phi, sumM
}
