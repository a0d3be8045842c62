package speciation

import (
	"fmt"
	"math"
	"slices"
	"sync"
)

// Pitzer is the ion-interaction activity model of Pitzer (Pitzer 1973; Pitzer & Mayorga
// 1973; Pitzer & Kim 1974) in the form of Harvie, Moller & Weare (1984), GCA 48,
// 723-751, with the unsymmetrical-mixing terms E-theta of Pitzer (1975), for brines up
// to an ionic strength of 6 mol/kg (MaxIonicStrength) and 0-100 C. Its parameters
// (PitzerParams, embedded from pitzer.txt) are the Harvie-Moller-Weare set at 25 C for
// Na-K-Ca-Mg-H-Cl-SO4-OH-HCO3-CO3-CO2, temperature functions for the main salts, and
// Sr and Ba chlorides and sulfates; each record names its source. Parameters without a
// temperature function (MgCl2, MgSO4, K2SO4, the carbonate, hydroxide and bisulfate
// pairs, Sr and Ba, the mixing terms) are held at their 25 C values.
//
// Species. The model keeps the species its parameter set treats (PitzerParams.Treats):
// the free ions, HSO4-, HCO3-, CO3 2-, OH-, CO2(aq), CaCO3(aq), MgCO3(aq) and MgOH+.
// An ion pair of the database formed only from ions of the set (NaSO4-, CaSO4(aq),
// CaHCO3+, CaOH+, SrSO4(aq) ...) is represented by the interaction parameters, which
// were fitted to stoichiometric data without it; the model suppresses it by giving it
// log10 gamma = 30, so its molality is 10^-30 of its ion-association value and the mass
// balances put that amount on the free ions. Saturation indices then use the free-ion
// activities of the Pitzer model, as the parameter set intends (the result lists the
// suppressed pairs with a negligible molality and gamma = 1e30). Species with a
// component outside the set (F-, Fe2+, H4SiO4 and their complexes) keep their
// association constants; a charged one gets ln gamma = z^2 F + |z| sum m_c m_a C_ca
// (the Debye-Hueckel and B' part of the Pitzer equations, no specific terms), a
// neutral one gamma = 1. Neutral species of the set have lambda terms (CO2(aq): Harvie,
// Moller & Weare 1984) or none (gamma = 1).
//
// Water. LogGammas returns log10 a_w from ln a_w = -phi M_w sum m_i
// (M_w = 0.018015 kg/mol), with phi the osmotic coefficient of the same equations.
//
// Derivative. dLogG is d(log10 gamma)/dI along the current composition (all ion
// molalities proportional to I, neutral ones held), from the analytic derivatives of
// the terms. The dependence on the
// composition at fixed I is not given to the solver (the ActivityModel interface has
// no place for it); see Composition.
//
// Composition. The model reads the molalities of the ActivityState (those of the
// solver's previous evaluation), with the cations and the anions each scaled so that
// both carry the same charge and the ionic strength equals the I given. At convergence
// the scaling is 1 for an electrically neutral water; for a water whose analysis does
// not balance, the equations (written for a neutral solution) are evaluated at the
// composition so scaled. Without this, the lag of one evaluation between the
// composition and the activity coefficients makes the solve unstable above about
// 4 mol/kg (the charge-separating mode, Na+ against Cl-, has a gain above 1).
//
// Settling. Once the composition per unit ionic strength changes by less than a
// relative 1e-7 between calls (pzFreeze), the model keeps the previous one, so that
// the last Newton iterations see activity coefficients that depend on I alone and
// converge quadratically; the results carry a relative error of that order in gamma.
//
// Concurrency. A *Pitzer is safe for concurrent use: each call takes its scratch (the
// interaction structure of a species set, the parameters at a temperature, the settled
// composition) from a pool and returns it, so solvers in different goroutines may
// share one model, as they share the stateless models. A scratch is rebuilt (which
// allocates) only when the species set it holds differs from the call's; in steady
// state (a worker solving waters of one kind) LogGammas does not allocate.
type Pitzer struct {
	params *PitzerParams
	pool   sync.Pool // of *pzPrep
}

// NewPitzer returns a Pitzer model with the embedded parameter set (DefaultPitzerParams).
// It panics if the embedded set does not parse (a defect of the build, caught by the
// package tests).
func NewPitzer() *Pitzer {
	p, err := DefaultPitzerParams()
	if err != nil {
		panic(fmt.Sprintf("speciation: embedded Pitzer parameters: %v", err))
	}
	return NewPitzerWith(p)
}

// NewPitzerWith returns a Pitzer model with the given parameter set. It panics if
// params is nil (programmer error).
func NewPitzerWith(params *PitzerParams) *Pitzer {
	if params == nil {
		panic("speciation: NewPitzerWith needs a parameter set")
	}
	p := &Pitzer{params: params}
	p.pool.New = func() any { return new(pzPrep) }
	return p
}

// Params returns the model's parameter set.
func (p *Pitzer) Params() *PitzerParams { return p.params }

// Name returns "pitzer".
func (p *Pitzer) Name() string { return "pitzer" }

// MaxIonicStrength is 6 mol/kg: most binary parameters were fitted to single-salt data
// up to about 6 mol/kg (Pitzer & Mayorga 1973, and to saturation where that is lower;
// NaCl to 6 m, the halite saturation).
func (p *Pitzer) MaxIonicStrength() float64 { return 6 }

// pzFreeze is the relative change of the composition below which LogGammas keeps the
// previous composition (see Pitzer, Settling).
const pzFreeze = 1e-7

// LogGammas implements ActivityModel (see the type's documentation).
func (p *Pitzer) LogGammas(logG, dLogG []float64, st *ActivityState) float64 {
	pr := p.pool.Get().(*pzPrep)
	defer p.pool.Put(pr)
	n := len(logG)
	dLogG = dLogG[:n]
	if pr.db != st.DB || !slices.Equal(pr.species, st.Species[:n]) {
		p.prepare(pr, st, n)
	}
	if st.TempC != pr.tempC {
		pr.setTemp(p.params, st.TempC)
	}
	I := st.I
	if !finite(I) || I <= 0 {
		for k := range logG {
			logG[k], dLogG[k] = 0, 0
			if pr.kind[k] == pzSuppressed {
				logG[k] = pzSuppressLogGamma
			}
		}
		return 0
	}
	// composition: the state's molalities, cations and anions scaled so that they
	// carry equal charge and have the ionic strength I (see the type's documentation)
	mol := st.Molality[:n]
	var qc, qa, sc, sa float64
	for k, mk := range mol {
		if pr.kind[k] == pzSuppressed || !finite(mk) || mk <= 0 {
			continue
		}
		z := pr.z[k]
		switch {
		case z > 0:
			qc += z * mk
			sc += z * z * mk
		case z < 0:
			qa -= z * mk
			sa += z * z * mk
		}
	}
	var fc, fa float64
	if qc > 0 && qa > 0 {
		e := 2 * I / (sc/qc + sa/qa)
		fc, fa = e/qc, e/qa
	}
	same := pr.hasDir
	for k, mk := range mol {
		if pr.kind[k] == pzSuppressed || !finite(mk) || mk <= 0 {
			mk = 0
		}
		switch z := pr.z[k]; {
		case z > 0:
			mk *= fc
		case z < 0:
			mk *= fa
		}
		pr.m[k] = mk
		if same {
			if d := mk/I - pr.dir[k]; d > pzFreeze*pr.dir[k]+1e-15 || -d > pzFreeze*pr.dir[k]+1e-15 {
				same = false
			}
		}
	}
	if same {
		// the composition has settled: keep the previous one (scaled to I), so that the
		// activity coefficients depend on I alone and Newton ends quadratically
		for k, c := range pr.dir {
			pr.m[k] = c * I
		}
	} else {
		for k, mk := range pr.m {
			pr.dir[k] = mk / I
		}
		pr.hasDir = true
	}
	phi, sumM := pr.eval(I)
	const inv = 1 / math.Ln10
	for k := range logG {
		switch pr.kind[k] {
		case pzSuppressed:
			logG[k], dLogG[k] = pzSuppressLogGamma, 0
			continue
		case pzOtherNeutral:
			logG[k], dLogG[k] = 0, 0
			continue
		}
		lg, dl := pr.ln[k]*inv, pr.dln[k]*inv
		switch {
		case lg > pzClampLogGamma:
			lg = pzClampLogGamma
		case lg < -pzClampLogGamma:
			lg = -pzClampLogGamma
		case lg != lg || dl != dl || dl-dl != 0: // NaN or Inf
			lg, dl = 0, 0
		}
		logG[k], dLogG[k] = lg, dl
	}
	logAw := -phi * waterMolarMass * sumM * inv
	if !finite(logAw) {
		return 0
	}
	return math.Max(-10, math.Min(1, logAw))
}

// prepare classifies the species of st and builds the interaction structure (it
// allocates; it runs when the species set changes).
func (p *Pitzer) prepare(pr *pzPrep, st *ActivityState, n int) {
	db := st.DB
	pr.db = db
	pr.species = append(pr.species[:0], st.Species[:n]...)
	names := make([]string, n)
	z := make([]float64, n)
	kind := make([]int8, n)
	for k, si := range st.Species[:n] {
		sp := &db.species[si]
		names[k] = CanonicalName(sp.Name)
		z[k] = sp.Charge
		kind[k] = p.classify(db, sp, names[k])
	}
	pr.build(p.params, names, z, kind)
}

// classify decides how the model treats a database species (see Pitzer).
func (p *Pitzer) classify(db *Database, sp *Species, name string) int8 {
	switch {
	case p.params.kept[name] && sp.Charge != 0:
		return pzIon
	case p.params.kept[name]:
		return pzNeutral
	case sp.Master < 0 && p.coveredPair(db, sp):
		return pzSuppressed
	case sp.Charge != 0:
		return pzOtherIon
	}
	return pzOtherNeutral
}

// coveredPair reports whether every component of the species' formation reaction
// (water and H+ aside) has its free ion in the parameter set.
func (p *Pitzer) coveredPair(db *Database, sp *Species) bool {
	for _, t := range sp.Terms {
		if t.Index == db.water || t.Index == db.hplus {
			continue
		}
		if !p.params.kept[CanonicalName(db.components[t.Index].Name)] {
			return false
		}
	}
	return true
}
