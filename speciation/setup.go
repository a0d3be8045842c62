package speciation

import (
	"cmp"
	"fmt"
	"math"
	"slices"
)

// This file holds the solver's setup: checking a Water against the database and
// building the structure of the equations (active components, species, phases, the
// sparsity pattern of the Jacobian) for it.

func (s *Solver) setup(w *Water) error {
	db := s.db
	if !finite(w.TempC) || w.TempC < MinTempC || w.TempC > MaxTempC {
		return &SolveError{Reason: fmt.Sprintf("temperature %g C is outside %g-%g C", w.TempC, MinTempC, MaxTempC), Err: ErrTemperature}
	}
	if p := w.PressureBar; p != 0 && !(p >= MinPressureBar && p <= MaxPressureBar) {
		return &SolveError{Reason: fmt.Sprintf("pressure %g bar is outside %g-%g bar", p, MinPressureBar, MaxPressureBar), Err: ErrPressure}
	}
	s.alk = 0
	for i := range s.role {
		s.role[i], s.total[i], s.phaseOf[i], s.target[i] = roleAbsent, 0, -1, 0
		s.active[i] = false
	}
	if len(s.nameCache) < len(w.totals) {
		s.nameCache = append(s.nameCache, make([]nameIndex, len(w.totals)-len(s.nameCache))...)
	}
	for i, t := range w.totals {
		// positional cache of name -> index (the same kind of water usually comes again)
		var ci int
		if c := &s.nameCache[i]; c.name == t.Component && c.name != "" {
			ci = c.index
		} else {
			ci = db.ComponentIndex(t.Component)
			c.name, c.index = t.Component, ci
		}
		if ci < 0 {
			return inputErr("unknown component %q", t.Component)
		}
		if ci == db.water || ci == db.hplus || ci == db.electron {
			return inputErr("%s cannot be given a total", t.Component)
		}
		if !finite(t.MolKgw) || t.MolKgw < 0 {
			return inputErr("total of %s is %g mol/kgw (must be finite and >= 0)", t.Component, t.MolKgw)
		}
		if t.MolKgw > 0 {
			s.role[ci], s.total[ci] = roleTotal, t.MolKgw
		}
	}
	if w.hasAlk {
		if db.carbonate < 0 {
			return inputErr("alkalinity given but the database has no %s component", NameCarbonate)
		}
		if _, set := w.Total(NameCarbonate); set && s.role[db.carbonate] == roleTotal {
			return inputErr("both a carbonate total and an alkalinity are given")
		}
		if !finite(w.alk) || w.alk <= 0 {
			return inputErr("alkalinity %g eq/kgw: must be positive to define the carbonate (give total carbon instead)", w.alk)
		}
		s.role[db.carbonate] = roleAlk
		s.alk = w.alk
	}
	// H+
	if w.PHFromChargeBalance {
		s.role[db.hplus] = roleCharge
	} else {
		if !finite(w.PH) || w.PH <= 0 || w.PH >= 14.5 {
			return inputErr("pH %g outside 0-14.5 (set PH or PHFromChargeBalance)", w.PH)
		}
		s.role[db.hplus] = roleFixed
		s.la[db.hplus] = -w.PH
	}
	// e-: fixed by the pe, or absent (no redox information: every species and mineral
	// with an electron in its reaction drops out, and the water is speciated as
	// without those entries).
	if w.hasPE {
		if db.electron < 0 {
			return inputErr("pe given but the database has no %s component", NameElectron)
		}
		if !finite(w.pe) || w.pe < -MaxAbsPE || w.pe > MaxAbsPE {
			return inputErr("pe %g outside -%g to %g", w.pe, MaxAbsPE, MaxAbsPE)
		}
		s.role[db.electron] = roleFixed
		s.la[db.electron] = -w.pe
	}
	if w.ChargeBalanceIon != "" {
		ci := db.ComponentIndex(w.ChargeBalanceIon)
		if ci < 0 || ci == db.electron {
			return inputErr("unknown charge-balance ion %q", w.ChargeBalanceIon)
		}
		if ci == db.hplus {
			s.role[ci] = roleCharge
		} else {
			if w.PHFromChargeBalance {
				return inputErr("charge balance used twice (pH and %s)", w.ChargeBalanceIon)
			}
			if db.components[ci].Charge == 0 {
				return inputErr("charge-balance ion %s is neutral", w.ChargeBalanceIon)
			}
			if s.role[ci] == roleAlk {
				return inputErr("charge-balance ion %s is already fixed by alkalinity", w.ChargeBalanceIon)
			}
			if s.total[ci] == 0 {
				s.total[ci] = 1e-4
			}
			s.role[ci] = roleCharge
		}
	}
	for _, f := range w.fixes {
		ci := db.ComponentIndex(f.Component)
		if ci < 0 || ci == db.water {
			return inputErr("unknown component %q fixed by %s", f.Component, f.Phase)
		}
		if ci == db.electron && w.hasPE {
			return inputErr("pe given and %s fixed by %s", NameElectron, f.Phase)
		}
		pi := db.MineralIndex(f.Phase)
		if pi < 0 {
			return inputErr("unknown mineral or gas %q", f.Phase)
		}
		if !finite(f.Target) {
			return inputErr("target of %s is not finite", f.Phase)
		}
		if nuOf(db.minerals[pi].Terms, ci) == 0 {
			return inputErr("%s does not contain %s", f.Phase, f.Component)
		}
		if s.role[ci] == roleCharge || s.role[ci] == roleAlk || s.role[ci] == rolePhase {
			return inputErr("%s has two constraints (charge balance, alkalinity or another phase)", f.Component)
		}
		s.role[ci], s.phaseOf[ci], s.target[ci] = rolePhase, pi, f.Target
	}
	for ci := range s.role {
		s.active[ci] = s.role[ci] != roleAbsent
	}
	s.active[db.water] = true
	// Equilibrium phases.
	s.eqPhase = s.eqPhase[:0]
	s.eqTarget = s.eqTarget[:0]
	for _, e := range w.equilibria {
		pi := db.MineralIndex(e.Phase)
		if pi < 0 || db.minerals[pi].Gas {
			return inputErr("unknown mineral %q to equilibrate", e.Phase)
		}
		if !finite(e.SI) {
			return inputErr("target SI of %s is not finite", e.Phase)
		}
		for _, t := range db.minerals[pi].Terms {
			if !s.active[t.Index] {
				return inputErr("%s needs %s, which is absent", e.Phase, t.Component)
			}
		}
		s.eqPhase = append(s.eqPhase, pi)
		s.eqTarget = append(s.eqTarget, e.SI)
	}
	// Phases used to fix components must have all components present.
	for ci := range s.role {
		if s.role[ci] != rolePhase {
			continue
		}
		for _, t := range db.minerals[s.phaseOf[ci]].Terms {
			if !s.active[t.Index] {
				return inputErr("%s fixed by %s needs %s, which is absent", db.components[ci].Name, db.minerals[s.phaseOf[ci]].Name, t.Component)
			}
		}
	}
	// Temperature-dependent constants (cached).
	if p := pressureOf(w); w.TempC != s.lastT || p != s.lastP {
		T := w.TempC + 273.15
		lt := math.Log10(T)
		epsT := WaterDielectric(w.TempC) * T // for the Fuoss term F of LogKFunc
		for i := range db.species {
			f := &db.species[i].LogK
			s.logK[i] = f.A + f.B*T + f.C/T + f.D*lt + f.E/(T*T) + f.F/epsT
		}
		for i := range db.minerals {
			m := &db.minerals[i]
			f := &m.LogK
			s.phLogK[i] = f.A + f.B*T + f.C/T + f.D*lt + f.E/(T*T) + f.F/epsT
			if p != 1 && m.HasPressureData() {
				s.phLogK[i] += PressureLogKShift(m.VolumeChange, m.CompressibilityChange, T, p)
			}
		}
		s.st.A, s.st.B = DebyeHuckelAB(w.TempC)
		s.lastT, s.lastP = w.TempC, p
	}
	s.st.TempC = w.TempC

	same := s.structValid && equalInts(s.role, s.prevRole) && equalInts(s.phaseOf, s.prevPhaseOf) &&
		equalInts(s.eqPhase, s.prevEq)
	if !same {
		s.buildStructure()
		s.prevRole = append(s.prevRole[:0], s.role...)
		s.prevPhaseOf = append(s.prevPhaseOf[:0], s.phaseOf...)
		s.prevEq = append(s.prevEq[:0], s.eqPhase...)
		s.structValid = true
		s.warmValid = false
	}
	// Constants of the rows and of the species.
	n := s.iCol + 1
	for r := 0; r < s.n; r++ {
		s.rconst[r] = 0
	}
	for ci := range s.role {
		r := s.row[ci]
		switch s.role[ci] {
		case roleTotal:
			s.rconst[r] = s.total[ci]
		case roleAlk:
			s.rconst[r] = s.alk
		case rolePhase:
			s.rowTarget[r] = s.target[ci]
		}
	}
	for k := range s.eqPhase {
		s.rowTarget[n+k] = s.eqTarget[k]
	}
	for k, si := range s.act {
		c := s.logK[si]
		for _, t := range db.species[si].Terms {
			if ci := t.Index; ci != db.water && s.col[ci] < 0 {
				c += t.Nu * s.la[ci]
			}
		}
		s.cst[k] = c
	}
	return nil
}

func equalInts(a, b []int) bool {
	if len(a) != len(b) {
		return false
	}
	for i := range a {
		if a[i] != b[i] {
			return false
		}
	}
	return true
}

// buildStructure assigns unknown columns and constraint rows and builds the sparse
// stoichiometry of the active species. It runs only when the kind of problem changes.
func (s *Solver) buildStructure() {
	db := s.db
	// Unknown columns and rows.
	for i := range s.col {
		s.col[i], s.row[i] = -1, -1
	}
	n := 0
	for ci := range s.role {
		switch s.role[ci] {
		case roleTotal, roleAlk, roleCharge, rolePhase:
			s.col[ci], s.row[ci] = n, n
			n++
		}
	}
	s.iCol = n
	n++
	nTot := n + len(s.eqPhase)
	s.grow(nTot)
	s.n = nTot
	for r := 0; r < nTot; r++ {
		s.rowPhase[r] = -1
		s.rconst[r] = 0
	}
	for ci := range s.role {
		if s.role[ci] == rolePhase {
			s.rowPhase[s.row[ci]] = s.phaseOf[ci]
		}
	}
	for k, pi := range s.eqPhase {
		s.rowPhase[n+k] = pi
	}

	// Active species and their sparse structure.
	s.act = s.act[:0]
	s.st.Charge = s.st.Charge[:cap(s.st.Charge)]
	s.st.IonSize = s.st.IonSize[:cap(s.st.IonSize)]
	s.st.TJB = s.st.TJB[:cap(s.st.TJB)]
	s.st.Species = s.st.Species[:cap(s.st.Species)]
	s.colIdx, s.colNu = s.colIdx[:0], s.colNu[:0]
	s.rowIdx, s.rowW = s.rowIdx[:0], s.rowW[:0]
	for si := range db.species {
		sp := &db.species[si]
		ok := true
		for _, t := range sp.Terms {
			if !s.active[t.Index] {
				ok = false
				break
			}
		}
		s.spActive[si] = ok
		s.spPos[si] = -1
		if !ok {
			continue
		}
		k := len(s.act)
		s.spPos[si] = k
		s.act = append(s.act, si)
		s.st.Charge[k], s.st.IonSize[k], s.st.TJB[k], s.st.Species[k] = sp.Charge, sp.IonSize, sp.TJB, si
		s.colOff[k], s.rowOff[k] = len(s.colIdx), len(s.rowIdx)
		s.nuW[k] = 0
		for _, t := range sp.Terms {
			ci := t.Index
			switch {
			case ci == db.water:
				s.nuW[k] = t.Nu
			case s.col[ci] >= 0:
				s.colIdx = append(s.colIdx, s.col[ci])
				s.colNu = append(s.colNu, t.Nu)
			}
			if r := s.row[ci]; r >= 0 && s.role[ci] == roleTotal {
				s.rowIdx = append(s.rowIdx, r)
				s.rowW = append(s.rowW, t.Nu)
			}
		}
		if db.carbonate >= 0 && s.role[db.carbonate] == roleAlk && s.alkSp[si] != 0 {
			s.rowIdx = append(s.rowIdx, s.row[db.carbonate])
			s.rowW = append(s.rowW, s.alkSp[si])
		}
		if sp.Charge != 0 {
			for ci := range s.role {
				if s.role[ci] == roleCharge {
					s.rowIdx = append(s.rowIdx, s.row[ci])
					s.rowW = append(s.rowW, sp.Charge)
				}
			}
			s.rowIdx = append(s.rowIdx, s.iCol)
			s.rowW = append(s.rowW, -0.5*sp.Charge*sp.Charge)
		}
	}
	na := len(s.act)
	s.colOff[na], s.rowOff[na] = len(s.colIdx), len(s.rowIdx)
	s.st.Charge = s.st.Charge[:na]
	s.st.IonSize = s.st.IonSize[:na]
	s.st.TJB = s.st.TJB[:na]
	s.st.Species = s.st.Species[:na]
	// Active species by component, alkalinity and charge.
	s.cAct, s.alkAct, s.carbAct, s.ionAct = s.cAct[:0], s.alkAct[:0], s.carbAct[:0], s.ionAct[:0]
	s.cActOff = append(s.cActOff[:0], 0)
	for ci := range db.components {
		for _, p := range s.compSp[ci] {
			if k := s.spPos[p.sp]; k >= 0 {
				s.cAct = append(s.cAct, kNu{int32(k), p.nu})
				if ci == db.carbonate && s.alkSp[p.sp] != 0 {
					s.carbAct = append(s.carbAct, kNu{int32(k), s.alkSp[p.sp]})
				}
			}
		}
		s.cActOff = append(s.cActOff, int32(len(s.cAct)))
	}
	for k, si := range s.act {
		if s.alkSp[si] != 0 {
			s.alkAct = append(s.alkAct, kNu{int32(k), s.alkSp[si]})
		}
		if z := s.st.Charge[k]; z != 0 {
			s.ionAct = append(s.ionAct, kNu{int32(k), 0.5 * z * z})
		}
	}
	// The species terms of the balances, grouped by row (species order kept within a
	// row, so each sum is formed in the same order as species by species).
	s.rEnt = s.rEnt[:0]
	for k := 0; k < na; k++ {
		for p := s.rowOff[k]; p < s.rowOff[k+1]; p++ {
			s.rEnt = append(s.rEnt, rEntry{row: int32(s.rowIdx[p]), src: int32(k), w: s.rowW[p]})
		}
	}
	slices.SortStableFunc(s.rEnt, func(a, b rEntry) int { return cmp.Compare(a.row, b.row) })
	s.rEntOff = append(s.rEntOff[:0], 0)
	for r, e := 0, 0; r < nTot; r++ {
		for e < len(s.rEnt) && int(s.rEnt[e].row) == r {
			e++
		}
		s.rEntOff = append(s.rEntOff, int32(e))
	}
	// The species terms of the Jacobian, d(row p)/d(col q) = ln10 w_p nu_q m and
	// d(row p)/dI = -ln10 w_p m dlog(gamma)/dI, grouped by position (row-major; species
	// order within a position). The diagonal of the I row starts with 1 (the term
	// jVal[2 na] = 1).
	s.jEnt = append(s.jEnt[:0], jEntry{pos: int32(s.iCol*nTot + s.iCol), src: int32(2 * na), coef: 1})
	for k := 0; k < na; k++ {
		for p := s.rowOff[k]; p < s.rowOff[k+1]; p++ {
			r := s.rowIdx[p]
			for q := s.colOff[k]; q < s.colOff[k+1]; q++ {
				s.jEnt = append(s.jEnt, jEntry{pos: int32(r*nTot + s.colIdx[q]), src: int32(k), coef: s.rowW[p] * s.colNu[q]})
			}
			s.jEnt = append(s.jEnt, jEntry{pos: int32(r*nTot + s.iCol), src: int32(na + k), coef: -s.rowW[p]})
		}
	}
	slices.SortStableFunc(s.jEnt, func(a, b jEntry) int { return cmp.Compare(a.pos, b.pos) })
	s.jPos, s.jPosOff = s.jPos[:0], s.jPosOff[:0]
	s.jRowOff = append(s.jRowOff[:0], 0)
	for e := 0; e < len(s.jEnt); e++ {
		if e == 0 || s.jEnt[e].pos != s.jEnt[e-1].pos {
			s.jPos = append(s.jPos, s.jEnt[e].pos)
			s.jPosOff = append(s.jPosOff, int32(e))
		}
	}
	s.jPosOff = append(s.jPosOff, int32(len(s.jEnt)))
	for r, u := 0, 0; r < nTot; r++ {
		for u < len(s.jPos) && int(s.jPos[u])/nTot == r {
			u++
		}
		s.jRowOff = append(s.jRowOff, int32(u))
	}
	if cap(s.jVal) < 2*na+1 {
		s.jVal = make([]float64, 2*na+1)
	}
	s.jVal = s.jVal[:2*na+1]
	s.jVal[2*na] = 1
	// The Jacobian's non-zero pattern is that of the species terms unless minerals or
	// gases add columns or rows (then luSolve searches every row).
	s.lu.pattern = false
	if len(s.eqPhase) == 0 && !slices.ContainsFunc(s.rowPhase[:nTot], func(pi int) bool { return pi >= 0 }) {
		s.lu.setPattern(nTot, s.jPos)
	}
}

// Starting-guess modes of initialGuess and sweep.
const (
	modeCharge = 0 // H+ by charge balance moved by the closed-form estimate
	modeGentle = 1 // H+ moved by half the log ratio of the charge sums
	modeWarm   = 2 // from the previous solution (exact logarithms)
)

type nameIndex struct {
	name  string
	index int
}

type spNu struct {
	sp int
	nu float64
}

// kNu is an active species (its position k) with a weight.
type kNu struct {
	k  int32
	nu float64
}

func nuOf(terms []Term, ci int) float64 {
	for _, t := range terms {
		if t.Index == ci {
			return t.Nu
		}
	}
	return 0
}

// pressureOf is the pressure of a water in bar: 1 when none was given.
func pressureOf(w *Water) float64 {
	if w.PressureBar == 0 {
		return 1
	}
	return w.PressureBar
}
