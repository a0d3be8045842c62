package speciation

import (
	"cmp"
	"fmt"
	"math"
	"slices"
)

// Constraint kinds of a component.
const (
	roleAbsent = iota
	roleTotal
	roleAlk
	roleCharge
	rolePhase
	roleFixed // activity fixed (H+ from pH)
)

// Tolerance is the relative tolerance every balance meets at convergence.
const Tolerance = 1e-10

// Solver speciates waters against one database with one activity model. It keeps
// scratch space between solves, so steady-state solves do not allocate. A Solver is
// not safe for concurrent use: use one per goroutine.
type Solver struct {
	db    *Database
	model ActivityModel

	// MaxIterations bounds the Newton iterations (default 200).
	MaxIterations int
	// MaxStep limits a Newton step in log10 units (default 1.5).
	MaxStep float64

	nc, ns   int
	sweeps   int
	gsSweeps int // Gauss-Seidel sweeps for simple waters (0: Jacobi sweeps)
	lgOld    []float64
	gsFac    []float64 // scratch of gaussSeidel

	// per component
	role    []int
	total   []float64
	phaseOf []int
	target  []float64
	la      []float64 // log10 activity of the free component species
	col     []int     // unknown column of the component, -1 if none
	row     []int     // row of the component's constraint, -1 if none
	active  []bool

	alk float64

	// per species (db indexing)
	spActive []bool
	logK     []float64 // at the current temperature (cached)
	phLogK   []float64 // minerals at the current temperature
	lastT    float64
	alkSp    []float64 // alkalinity equivalents per species
	alkComp  []float64

	// active species (compact)
	act     []int
	st      ActivityState
	lg, dlg []float64
	logm, m []float64
	cst     []float64 // constant part of log m (log K + fixed activities)
	nuW     []float64 // stoichiometry of water
	colOff  []int     // offsets into colIdx/colNu for each active species
	colIdx  []int
	colNu   []float64
	rowOff  []int
	rowIdx  []int
	rowW    []float64

	// active species by component (position k among the active species, nu > 0):
	// component ci's in cAct[cActOff[ci]:cActOff[ci+1]]; the active species with an
	// alkalinity (weight: equivalents) and the carbonate species (same weight); the
	// charged species (weight z^2/2)
	cAct    []kNu
	cActOff []int32
	alkAct  []kNu
	carbAct []kNu
	ionAct  []kNu
	// the species terms of the balances by row: row r's in rEnt[rEntOff[r]:rEntOff[r+1]]
	rEnt    []rEntry
	rEntOff []int32
	// the species terms of the Jacobian by position (see jEntry): the distinct
	// positions jPos (row-major), row r's in jPos[jRowOff[r]:jRowOff[r+1]], the terms
	// of position u in jEnt[jPosOff[u]:jPosOff[u+1]]; they multiply
	// jVal[k] = ln10 m_k, jVal[na+k] = ln10 m_k dlog(gamma_k)/dI and jVal[2 na] = 1
	jEnt    []jEntry
	jPos    []int32
	jPosOff []int32
	jRowOff []int32
	jVal    []float64

	nameCache []nameIndex // component name and index by position in Water.totals

	compSp [][]spNu // species containing each component with nu > 0 (db order)
	spPos  []int    // position of a db species among the active ones, -1 if inactive
	hSp    int      // species index of H+
	ohSp   int      // species index of OH-, or -1

	// structure cache and warm start
	structValid, warmValid bool
	prevRole, prevPhaseOf  []int
	prevEq                 []int
	warmU                  []float64
	warmTotal              []float64
	warmAlk                float64
	warmT, warmLaH         float64

	// WarmStart starts a solve from the previous solution when the water has the same
	// kind of constraints and is close to the previous one (temperature within 0.5 C,
	// pH within 0.1, totals within -20/+25 %), as in a titration, a mixing series or a
	// precipitation loop (default true). Results agree with a cold start within the
	// convergence tolerance.
	WarmStart bool

	// equilibrium phases
	eqPhase  []int
	eqTarget []float64

	// linear system
	n      int
	iCol   int
	u, du  []float64
	uTry   []float64
	resid  []float64
	scale  []float64
	ext    []float64
	rconst []float64
	jac    []float64
	lu     luWork
	logAw  float64
	iters  int
	evals  int
	// phase rows: for each row (or -1) the phase index and target
	rowPhase  []int
	rowTarget []float64
}

// NewSolver returns a solver for db with the activity model. It panics if db or model
// is nil (programmer error).
func NewSolver(db *Database, model ActivityModel) *Solver {
	if db == nil || model == nil {
		panic("speciation: NewSolver needs a database and a model")
	}
	nc, ns, nm := len(db.components), len(db.species), len(db.minerals)
	s := &Solver{db: db, model: model, MaxIterations: 200, MaxStep: 1.5, sweeps: 2, gsSweeps: 4, WarmStart: true, nc: nc, ns: ns}
	s.role = make([]int, nc)
	s.total = make([]float64, nc)
	s.phaseOf = make([]int, nc)
	s.target = make([]float64, nc)
	s.la = make([]float64, nc)
	s.col = make([]int, nc)
	s.row = make([]int, nc)
	s.active = make([]bool, nc)
	s.alkComp = make([]float64, nc)
	for i, c := range db.components {
		s.alkComp[i] = c.Alkalinity
	}
	s.spActive = make([]bool, ns)
	s.logK = make([]float64, ns)
	s.phLogK = make([]float64, nm)
	s.lastT = math.NaN()
	s.alkSp = make([]float64, ns)
	for i := range db.species {
		for _, t := range db.species[i].Terms {
			s.alkSp[i] += t.Nu * s.alkComp[t.Index]
		}
	}
	s.act = make([]int, 0, ns)
	s.st = ActivityState{
		Charge: make([]float64, ns), IonSize: make([]float64, ns), TJB: make([]float64, ns),
		Molality: make([]float64, ns), Species: make([]int, ns), DB: db,
	}
	s.lg = make([]float64, ns)
	s.dlg = make([]float64, ns)
	s.lgOld = make([]float64, ns)
	s.logm = make([]float64, ns)
	s.m = make([]float64, ns)
	s.cst = make([]float64, ns)
	s.nuW = make([]float64, ns)
	s.compSp = make([][]spNu, nc)
	for si := range db.species {
		for _, t := range db.species[si].Terms {
			if t.Nu > 0 {
				s.compSp[t.Index] = append(s.compSp[t.Index], spNu{si, t.Nu})
			}
		}
	}
	s.spPos = make([]int, ns)
	s.hSp = db.SpeciesIndex(NameHPlus)
	s.ohSp = db.SpeciesIndex("OH-")
	s.colOff = make([]int, ns+1)
	s.rowOff = make([]int, ns+1)
	s.grow(nc + 1)
	s.warmTotal = make([]float64, nc)
	return s
}

// Database returns the solver's database.
func (s *Solver) Database() *Database { return s.db }

// Model returns the solver's activity model.
func (s *Solver) Model() ActivityModel { return s.model }

func (s *Solver) grow(n int) {
	if cap(s.u) >= n {
		return
	}
	s.u = make([]float64, n)
	s.du = make([]float64, n)
	s.uTry = make([]float64, n)
	s.resid = make([]float64, n)
	s.scale = make([]float64, n)
	s.ext = make([]float64, n)
	s.rconst = make([]float64, n)
	s.jac = make([]float64, n*n)
	s.lu = newLUWork(n)
	s.rowPhase = make([]int, n)
	s.rowTarget = make([]float64, n)
	s.gsFac = make([]float64, n)
}

func inputErr(format string, args ...any) error {
	return &SolveError{Reason: fmt.Sprintf(format, args...), Err: ErrInput}
}

// Solve speciates w and returns a new Result.
func (s *Solver) Solve(w *Water) (*Result, error) {
	res := new(Result)
	if err := s.SolveInto(res, w); err != nil {
		return nil, err
	}
	return res, nil
}

// SolveInto speciates w into res, reusing res's slices (no allocation in steady state).
// On error res is cleared and the error is a *SolveError.
func (s *Solver) SolveInto(res *Result, w *Water) error {
	err := s.setup(w)
	if err == nil {
		err = s.solveWithRetries()
	}
	if err != nil {
		clearResult(res)
		return err
	}
	s.fill(res, w)
	return nil
}

// solveWithRetries runs Newton from the warm start (if any), then from up to three
// cold starting points: a charge-balance-aware guess, a gentle guess, and the gentle
// guess with shorter steps. The first converged solution is kept.
func (s *Solver) solveWithRetries() error {
	var err error
	if s.WarmStart && s.warmValid && s.warmStart() {
		if err = s.newton(s.MaxStep); err == nil {
			return nil
		}
	}
	for attempt := 0; attempt < 3; attempt++ {
		s.initialGuess(min(attempt, 1))
		step := s.MaxStep
		if attempt == 2 {
			step = 0.5
		}
		var e error
		if e = s.newton(step); e == nil {
			return nil
		}
		if err == nil || attempt == 0 {
			err = e
		}
	}
	return err
}

func clearResult(res *Result) {
	*res = Result{
		Species: res.Species[:0], Totals: res.Totals[:0], Distribution: res.Distribution[:0],
		Minerals: res.Minerals[:0], Phases: res.Phases[:0], Warnings: res.Warnings[:0],
	}
}

func finite(x float64) bool { return !math.IsNaN(x) && !math.IsInf(x, 0) }

func (s *Solver) setup(w *Water) error {
	db := s.db
	if !finite(w.TempC) || w.TempC < MinTempC || w.TempC > MaxTempC {
		return &SolveError{Reason: fmt.Sprintf("temperature %g C is outside %g-%g C", w.TempC, MinTempC, MaxTempC), Err: ErrTemperature}
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
		if ci == db.water || ci == db.hplus {
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
	if w.ChargeBalanceIon != "" {
		ci := db.ComponentIndex(w.ChargeBalanceIon)
		if ci < 0 {
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
	if w.TempC != s.lastT {
		T := w.TempC + 273.15
		lt := math.Log10(T)
		for i := range db.species {
			f := &db.species[i].LogK
			s.logK[i] = f.A + f.B*T + f.C/T + f.D*lt + f.E/(T*T)
		}
		for i := range db.minerals {
			f := &db.minerals[i].LogK
			s.phLogK[i] = f.A + f.B*T + f.C/T + f.D*lt + f.E/(T*T)
		}
		s.st.A, s.st.B = DebyeHuckelAB(w.TempC)
		s.lastT = w.TempC
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

// warmStart starts from the previous solution, with each free activity scaled by the
// change of its total. It reports false if the previous solution does not fit.
func (s *Solver) warmStart() bool {
	if len(s.warmU) != s.n || math.Abs(s.lastT-s.warmT) > 0.5 || math.Abs(s.la[s.db.hplus]-s.warmLaH) > 0.1 {
		return false
	}
	for ci := range s.role {
		if s.role[ci] == roleTotal && s.warmTotal[ci] > 0 {
			if r := s.total[ci] / s.warmTotal[ci]; r < 0.8 || r > 1.25 {
				return false
			}
		}
	}
	if s.warmAlk > 0 {
		if r := s.alk / s.warmAlk; r < 0.8 || r > 1.25 {
			return false
		}
	}
	u := s.u[:s.n]
	copy(u, s.warmU)
	for ci := range s.role {
		c := s.col[ci]
		if c < 0 {
			continue
		}
		switch s.role[ci] {
		case roleTotal:
			if s.warmTotal[ci] > 0 {
				u[c] += math.Log10(s.total[ci] / s.warmTotal[ci])
			}
		case roleAlk:
			if s.warmAlk > 0 {
				u[c] += math.Log10(s.alk / s.warmAlk)
			}
		}
	}
	s.logAw = 0
	s.gammas(u[s.iCol])
	s.sweep(u, 1, modeWarm)
	return true
}

// speciesMolalities computes log m and m of every active species from s.u (columns),
// s.lg and s.logAw.
func (s *Solver) speciesMolalities(u []float64) {
	for k := range s.act {
		v := s.cst[k] + s.nuW[k]*s.logAw - s.lg[k]
		for p := s.colOff[k]; p < s.colOff[k+1]; p++ {
			v += s.colNu[p] * u[s.colIdx[p]]
		}
		if v > 4 {
			v = 4
		} else if v < -300 {
			v = -300
		}
		s.logm[k] = v
	}
	na := len(s.act)
	pow10s(s.m[:na], s.logm[:na])
}

func (s *Solver) gammas(I float64) {
	na := len(s.act)
	s.st.I = I
	s.st.Molality = s.m[:na]
	s.logAw = s.model.LogGammas(s.lg[:na], s.dlg[:na], &s.st)
}

// phaseLogIAP returns log IAP of phase pi at columns u.
func (s *Solver) phaseLogIAP(pi int, u []float64) float64 {
	db := s.db
	v := 0.0
	for _, t := range db.minerals[pi].Terms {
		ci := t.Index
		switch {
		case ci == db.water:
			v += t.Nu * s.logAw
		case s.col[ci] >= 0:
			v += t.Nu * u[s.col[ci]]
		default:
			v += t.Nu * s.la[ci]
		}
	}
	return v
}

// initialGuess fills s.u: free ≈ total, then a few continued-fraction sweeps at a fixed
// ionic strength, then the ionic strength from the resulting molalities.
func (s *Solver) initialGuess(mode int) {
	db := s.db
	u := s.u[:s.n]
	I := 0.0
	for ci, c := range db.components {
		if s.role[ci] == roleTotal || s.role[ci] == roleCharge {
			I += 0.5 * c.Charge * c.Charge * s.total[ci]
		}
	}
	if s.role[max(db.carbonate, 0)] == roleAlk && db.carbonate >= 0 {
		I += 0.5 * s.alk
	}
	I = math.Max(I, 1e-7)
	s.logAw = 0
	s.gammas(I)
	for ci := range s.role {
		c := s.col[ci]
		if c < 0 {
			continue
		}
		switch s.role[ci] {
		case roleTotal:
			u[c] = roughLog10(s.total[ci])
		case roleAlk:
			u[c] = roughLog10(s.alk) - 3
		case roleCharge:
			if ci == db.hplus {
				u[c] = -7
			} else {
				u[c] = roughLog10(s.total[ci])
			}
		case rolePhase:
			u[c] = -5
		}
	}
	for k := range s.eqPhase {
		u[s.iCol+1+k] = 0
	}
	sweeps := s.sweeps
	simple := len(s.eqPhase) == 0
	for ci := range s.role {
		if s.role[ci] == roleCharge || s.role[ci] == rolePhase {
			sweeps = 3 * s.sweeps
			simple = false
		}
	}
	if simple && s.gsSweeps > 0 {
		s.gaussSeidel(u, s.gsSweeps)
		return
	}
	s.sweep(u, sweeps, mode)
}

// gaussSeidel improves u for waters whose components all close by mass or alkalinity
// balances (pH fixed): one component at a time, its activity is multiplied by
// total / current sum and the molalities of its species follow at once (so a sweep
// needs no power of ten; the log activities move once at the end, by the logarithm of
// the product of each one's factors); between sweeps the activity coefficients follow
// the ionic strength. The ionic strength is then set from the molalities. Four sweeps
// (a sweep costs about a quarter of a Newton iteration) leave Newton two iterations on
// typical waters, where three sweeps often left three.
func (s *Solver) gaussSeidel(u []float64, sweeps int) {
	db := s.db
	s.speciesMolalities(u)
	m := s.m
	fac := s.gsFac[:s.n] // product of the factors of each column's activity
	for c := range fac {
		fac[c] = 1
	}
	for sweep := 0; sweep < sweeps; sweep++ {
		for ci := range s.role {
			c := s.col[ci]
			if c < 0 {
				continue
			}
			var sum, target float64
			switch s.role[ci] {
			case roleTotal:
				for _, p := range s.cAct[s.cActOff[ci]:s.cActOff[ci+1]] {
					sum += p.nu * m[p.k]
				}
				target = s.total[ci]
			case roleAlk:
				for _, p := range s.alkAct {
					sum += p.nu * m[p.k]
				}
				target = s.alk
			default:
				continue
			}
			if !(sum > 0) {
				continue
			}
			// the balance closes when the activity (and every molality of the component's
			// species) is multiplied by ratio (at most 1e4 in a step); u moves by the
			// logarithm of the product of the steps, once at the end (a starting guess
			// needs only a rough one)
			ratio := target / sum
			if ci == db.carbonate && s.role[ci] == roleAlk {
				// the alkalinity is not proportional to the carbonate activity (OH-,
				// H3SiO4- ...): move by the carbonate part only
				carb := 0.0
				for _, p := range s.carbAct {
					carb += p.nu * m[p.k]
				}
				if carb > 0 && target-(sum-carb) > 0 {
					ratio = (target - (sum - carb)) / carb
				}
			}
			f := ratio
			if f > 1e4 {
				f = 1e4
			} else if f < 1e-4 {
				f = 1e-4
			}
			fac[c] *= f
			for _, p := range s.cAct[s.cActOff[ci]:s.cActOff[ci+1]] {
				switch p.nu {
				case 1:
					m[p.k] *= f
				case 2:
					m[p.k] *= f * f
				default:
					m[p.k] *= math.Pow(f, p.nu)
				}
			}
		}
		if sweep < sweeps-1 {
			// new activity coefficients at the ionic strength of these molalities; the
			// molalities follow by m *= 10^-(change of log gamma), to third order
			// (the changes are small, and this is only a starting guess)
			I := 0.0
			for _, p := range s.ionAct {
				I += p.nu * m[p.k]
			}
			na := len(s.act)
			old := s.lgOld[:na]
			copy(old, s.lg[:na])
			s.gammas(I)
			for k := 0; k < na; k++ {
				x := -math.Ln10 * (s.lg[k] - old[k])
				m[k] *= 1 + x*(1+x*(0.5+x*(1.0/6)))
			}
		}
	}
	I := 0.0
	for _, p := range s.ionAct {
		I += p.nu * m[p.k]
	}
	for c, f := range fac {
		if f != 1 {
			u[c] += roughLog10(f)
		}
	}
	u[s.iCol] = math.Max(I, 1e-9)
}

// sweep improves u by continued-fraction passes over the balances at the ionic
// strength held in s.lg, then sets the ionic strength from the result.
func (s *Solver) sweep(u []float64, sweeps, mode int) {
	db := s.db
	log10 := roughLog10 // a starting guess needs no more
	if mode == modeWarm {
		log10 = math.Log10 // near the solution: exact
	}
	for sweep := 0; sweep < sweeps; sweep++ {
		s.applyPhaseFixes(u)
		s.speciesMolalities(u)
		// accumulate sums per row
		for ci := range s.role {
			if r := s.row[ci]; r >= 0 {
				s.resid[r], s.scale[r] = 0, 0
			}
		}
		for k := range s.act {
			m := s.m[k]
			for p := s.rowOff[k]; p < s.rowOff[k+1]; p++ {
				r := s.rowIdx[p]
				if r == s.iCol {
					continue
				}
				s.resid[r] += s.rowW[p] * m
			}
		}
		for ci := range s.role {
			c := s.col[ci]
			if c < 0 {
				continue
			}
			var d float64
			switch s.role[ci] {
			case roleTotal:
				if s.resid[c] > 0 {
					d = log10(s.total[ci] / s.resid[c])
				}
			case roleAlk:
				if s.resid[c] > 0 {
					d = log10(s.alk / s.resid[c])
				}
			case roleCharge:
				Z := s.resid[c] // sum z m
				if ci == db.hplus && mode != modeGentle {
					// Solve m(H+) - m(OH-) + D = 0 with m(H+) m(OH-) held at its current value.
					mh, moh := 0.0, 0.0
					if k := s.spPos[s.hSp]; k >= 0 {
						mh = s.m[k]
					}
					if s.ohSp >= 0 {
						if k := s.spPos[s.ohSp]; k >= 0 {
							moh = s.m[k]
						}
					}
					D := Z - mh + moh
					kw := mh * moh
					var mNew float64
					if D > 0 {
						mNew = 2 * kw / (D + math.Sqrt(D*D+4*kw))
					} else {
						mNew = (-D + math.Sqrt(D*D+4*kw)) / 2
					}
					if mh > 0 && mNew > 0 {
						d = log10(mNew / mh)
					}
				} else if ci == db.hplus {
					// gentle: move toward balance by half the log ratio of the charges
					pos, neg := 0.0, 0.0
					for k := range s.act {
						if z := s.st.Charge[k]; z > 0 {
							pos += z * s.m[k]
						} else {
							neg -= z * s.m[k]
						}
					}
					if pos > 0 && neg > 0 {
						d = 0.5 * log10(neg/pos)
					}
				} else {
					sum := 0.0
					for _, p := range s.compSp[ci] {
						if k := s.spPos[p.sp]; k >= 0 {
							sum += p.nu * s.m[k]
						}
					}
					newT := math.Max(sum-Z/db.components[ci].Charge, 1e-3*sum)
					if sum > 0 {
						d = log10(newT / sum)
					}
				}
			}
			if d > 4 {
				d = 4
			} else if d < -4 {
				d = -4
			}
			u[c] += d
		}
	}
	s.applyPhaseFixes(u)
	// Ionic strength from the molalities of the last pass (one pass behind u: Newton
	// corrects it, and it saves a pass).
	I := 0.0
	for k := range s.act {
		I += 0.5 * s.st.Charge[k] * s.st.Charge[k] * s.m[k]
	}
	u[s.iCol] = math.Max(I, 1e-9)
}

// applyPhaseFixes solves each phase equation for the component it fixes, given the
// other activities.
func (s *Solver) applyPhaseFixes(u []float64) {
	db := s.db
	for ci := range s.role {
		if s.role[ci] != rolePhase {
			continue
		}
		pi := s.phaseOf[ci]
		nu := nuOf(db.minerals[pi].Terms, ci)
		rest := s.phaseLogIAP(pi, u) - nu*u[s.col[ci]]
		v := (s.phLogK[pi] + s.target[ci] - rest) / nu
		u[s.col[ci]] = math.Max(math.Min(v, 1), -30)
	}
}

// jEntry is one species term of the Jacobian: J[pos] += coef * jVal[src] (before the
// row scaling).
type jEntry struct {
	pos, src int32
	coef     float64
}

// rEntry is one species term of a balance: R[row] += w m[src].
type rEntry struct {
	row, src int32
	w        float64
}

// jacobian builds the Jacobian at the point of the last evaluate (it uses s.m, s.dlg
// and s.scale), each row divided by its scale. Each non-zero position of the species
// terms is summed in a register from its list of terms (built with the structure) and
// scaled once.
func (s *Solver) jacobian(u []float64) {
	n := s.n
	J := s.jac[:n*n]
	clear(J)
	na := len(s.act)
	val := s.jVal[:2*na+1]
	mv, dv := val[:na], val[na:2*na]
	dlg := s.dlg[:na]
	for k, m := range s.m[:na] {
		lm := math.Ln10 * m
		mv[k] = lm
		dv[k] = lm * dlg[k]
	}
	inv := s.du[:n] // scratch: 1/scale of each row (du is overwritten by the caller)
	ent, pos, posOff := s.jEnt, s.jPos, s.jPosOff
	for r := range inv {
		v := 1 / s.scale[r]
		inv[r] = v
		for q := s.jRowOff[r]; q < s.jRowOff[r+1]; q++ {
			acc := 0.0
			for _, e := range ent[posOff[q]:posOff[q+1]] {
				acc += e.coef * val[e.src]
			}
			J[pos[q]] = acc * v
		}
	}
	base := s.iCol + 1
	db := s.db
	for k, pi := range s.eqPhase {
		for _, t := range db.minerals[pi].Terms {
			ci := t.Index
			if s.role[ci] == roleTotal {
				r := s.row[ci]
				J[r*n+base+k] -= t.Nu * inv[r]
			}
			if db.carbonate >= 0 && s.role[db.carbonate] == roleAlk && s.alkComp[ci] != 0 {
				r := s.row[db.carbonate]
				J[r*n+base+k] -= t.Nu * s.alkComp[ci] * inv[r]
			}
		}
	}
	for r := 0; r < n; r++ {
		pi := s.rowPhase[r]
		if pi < 0 {
			continue
		}
		jr := J[r*n : r*n+n]
		for _, t := range db.minerals[pi].Terms {
			if c := s.col[t.Index]; c >= 0 {
				jr[c] += t.Nu * inv[r]
			}
		}
	}
}

// evaluate computes the molalities, residuals and row scales at u, and returns the
// scaled residual norm (sum of squares) and the largest scaled residual.
func (s *Solver) evaluate(u []float64) (norm, worst float64) {
	n := s.n
	s.evals++
	I := u[s.iCol]
	s.gammas(I)
	R, sc := s.resid[:n], s.scale[:n]
	// The scale of a balance (for the Newton norm) is the sum of the magnitudes of all its
	// terms; ext holds the part from the given total and the mineral amounts. The
	// convergence test uses the species terms plus only 1e-5 of ext, so that a component
	// almost entirely precipitated still has its dissolved amount resolved to a relative
	// 1e-10, while the rounding of total minus amount cannot stall the solve.
	ext := s.ext[:n]
	for r := 0; r < n; r++ {
		R[r] = -s.rconst[r]
		ext[r] = math.Abs(s.rconst[r])
		sc[r] = ext[r]
	}
	R[s.iCol] = I
	sc[s.iCol] = I
	ext[s.iCol] = 0
	s.speciesMolalities(u)
	m := s.m[:len(s.act)]
	for r := range R {
		sum, abs := R[r], sc[r]
		for _, e := range s.rEnt[s.rEntOff[r]:s.rEntOff[r+1]] {
			wm := e.w * m[e.src]
			sum += wm
			abs += math.Abs(wm)
		}
		R[r], sc[r] = sum, abs
	}
	// equilibrium phases: amounts dissolved add to totals (and alkalinity)
	base := s.iCol + 1
	db := s.db
	for k, pi := range s.eqPhase {
		xi := u[base+k]
		for _, t := range db.minerals[pi].Terms {
			ci := t.Index
			if s.role[ci] == roleTotal {
				r := s.row[ci]
				R[r] -= t.Nu * xi
				sc[r] += math.Abs(t.Nu * xi)
				ext[r] += math.Abs(t.Nu * xi)
			}
			if db.carbonate >= 0 && s.role[db.carbonate] == roleAlk && s.alkComp[ci] != 0 {
				r := s.row[db.carbonate]
				R[r] -= t.Nu * s.alkComp[ci] * xi
				sc[r] += math.Abs(t.Nu * s.alkComp[ci] * xi)
				ext[r] += math.Abs(t.Nu * s.alkComp[ci] * xi)
			}
		}
	}
	// phase rows (linear in the columns)
	for r := 0; r < n; r++ {
		if pi := s.rowPhase[r]; pi >= 0 {
			R[r] = s.phaseLogIAP(pi, u) - s.phLogK[pi] - s.rowTarget[r]
			sc[r] = 1
		}
	}
	for r := 0; r < n; r++ {
		if pi := s.rowPhase[r]; pi >= 0 {
			ext[r] = 0
		}
		if sc[r] == 0 {
			sc[r] = 1
		}
		e := R[r] / sc[r]
		norm += e * e
		strict := sc[r] - ext[r] + 1e-5*ext[r]
		if strict <= 0 {
			strict = sc[r]
		}
		if a := math.Abs(R[r] / strict); a > worst || a != a {
			worst = a
		}
	}
	return norm, worst
}

func (s *Solver) newton(maxStep float64) error {
	n := s.n
	u := s.u[:n]
	maxIt := s.MaxIterations
	if maxIt <= 0 {
		maxIt = 200
	}
	if maxStep <= 0 {
		maxStep = 1.5
	}
	s.evals = 0
	norm, worst := s.evaluate(u)
	it, stall := 0, 0
	for ; it < maxIt; it++ {
		if !finite(norm) {
			return &SolveError{Reason: "non-finite residual", Iterations: it, Err: ErrNoConvergence}
		}
		if worst <= Tolerance {
			// check the lagged water activity (models that do not model it return 0)
			aw := s.logAw
			if aw != 0 {
				s.gammas(u[s.iCol])
			}
			if math.Abs(s.logAw-aw) <= 1e-12 {
				s.iters = it
				s.warmU = append(s.warmU[:0], u...)
				copy(s.warmTotal, s.total)
				s.warmAlk = s.alk
				s.warmT = s.lastT
				s.warmLaH = s.la[s.db.hplus]
				s.warmValid = true
				return nil
			}
			norm, worst = s.evaluate(u)
			continue
		}
		if err := s.checkBounds(u, it); err != nil {
			return err
		}
		s.jacobian(u)
		// solve J du = -R (rows scaled)
		J := s.jac[:n*n]
		du := s.du[:n]
		for r := 0; r < n; r++ {
			du[r] = -s.resid[r] / s.scale[r]
		}
		if !luSolve(J, du, n, &s.lu) {
			return &SolveError{Reason: fmt.Sprintf("singular Jacobian at iteration %d", it), Iterations: it, Err: ErrSingular}
		}
		// step limiting in log units; keep I positive
		f := 1.0
		for c := 0; c < s.iCol; c++ {
			if a := math.Abs(du[c]); a*f > maxStep {
				f = maxStep / a
			}
		}
		I := u[s.iCol]
		if dI := du[s.iCol]; I+f*dI < 0.2*I {
			f = 0.8 * I / -dI
		}
		if !finite(f) {
			return &SolveError{Reason: "non-finite Newton step", Iterations: it, Err: ErrNoConvergence}
		}
		// backtracking on the scaled residual norm
		try := s.uTry[:n]
		var nTry, wTry float64
		for h := 0; ; h++ {
			for c := range try {
				try[c] = u[c] + f*du[c]
			}
			nTry, wTry = s.evaluate(try)
			if (finite(nTry) && nTry < norm*(1-1e-4*f)) || h >= 10 || nTry <= 1e-30 {
				break
			}
			f *= 0.5
		}
		if !(nTry < norm*(1-1e-6)) {
			stall++
		} else {
			stall = 0
		}
		copy(u, try)
		if stall >= 6 {
			return &SolveError{Reason: s.diagnose(wTry), Iterations: it + 1, Err: ErrNoConvergence}
		}
		norm, worst = nTry, wTry
	}
	return &SolveError{Reason: fmt.Sprintf("no convergence after %d iterations (largest relative balance error %.3g)", it, worst), Iterations: it, Err: ErrNoConvergence}
}

// nonCarbonateAlkalinity is the alkalinity carried by species without carbonate at the
// current state.
func (s *Solver) nonCarbonateAlkalinity() float64 {
	db := s.db
	v := 0.0
	for k, si := range s.act {
		if nuOf(db.species[si].Terms, db.carbonate) == 0 {
			v += s.alkSp[si] * s.m[k]
		}
	}
	return v
}

func (s *Solver) alkalinityReason() string {
	return fmt.Sprintf("the alkalinity %.4g eq/kgw is not above the non-carbonate alkalinity %.4g eq/kgw (OH-, H3SiO4-, HF, HSO4-, hydroxide pairs) at this pH: no carbonate can satisfy it", s.alk, s.nonCarbonateAlkalinity())
}

// diagnose explains a stalled solve: usually constraints that no composition can meet.
func (s *Solver) diagnose(worst float64) string {
	db := s.db
	if c := db.carbonate; c >= 0 && s.role[c] == roleAlk && s.nonCarbonateAlkalinity() >= s.alk {
		return s.alkalinityReason()
	}
	for ci := range s.role {
		if s.role[ci] != roleCharge {
			continue
		}
		z := db.components[ci].Charge
		other := 0.0
		for k, si := range s.act {
			if nuOf(db.species[si].Terms, ci) == 0 {
				other += s.st.Charge[k] * s.m[k]
			}
		}
		if ci == db.hplus {
			return fmt.Sprintf("no pH closes the charge balance (stalled, largest relative balance error %.3g)", worst)
		}
		if other*z > 0 {
			return fmt.Sprintf("the charge balance cannot be closed by adjusting %s: the other ions already carry %.4g eq/kgw of the same sign", db.components[ci].Name, other)
		}
	}
	return fmt.Sprintf("stalled with largest relative balance error %.3g", worst)
}

// checkBounds stops a solve that runs away: a component adjusted for charge balance
// whose total would have to be negative, or a pH outside any water.
func (s *Solver) checkBounds(u []float64, it int) error {
	db := s.db
	if c := db.carbonate; c >= 0 && s.role[c] == roleAlk && u[s.col[c]] < -20 {
		return &SolveError{Reason: s.alkalinityReason(), Iterations: it, Err: ErrNoConvergence}
	}
	for ci := range s.role {
		if s.role[ci] != roleCharge {
			continue
		}
		v := u[s.col[ci]]
		if ci == db.hplus {
			if v > 2 || v < -16 {
				return &SolveError{Reason: "no pH between -2 and 16 closes the charge balance", Iterations: it, Err: ErrNoConvergence}
			}
		} else if v < -30 {
			return &SolveError{Reason: fmt.Sprintf("the charge balance cannot be closed by adjusting %s (its total would be negative)", db.components[ci].Name), Iterations: it, Err: ErrNoConvergence}
		}
	}
	return nil
}

// luSolve solves A x = b in place (b becomes x) by Gaussian elimination with partial
// pivoting on the row-major n x n matrix A (destroyed). It reports false when A is
// singular to working precision. The Jacobians of speciation are sparse (a cation's
// balance involves its own activity, a few anions and the ionic strength), so each
// elimination step records the columns where the pivot row is non-zero and updates only
// those, in the elimination and in the back substitution: the same arithmetic as the
// dense loops without the terms that add l*0 (except that the back substitution
// multiplies by the reciprocal pivot, computed once). ws is the workspace (see luWork).
func luSolve(A []float64, b []float64, n int, ws *luWork) bool {
	A = A[:n*n]
	b = b[:n]
	idx := ws.idx[:n*n]
	off := ws.off[:n+1]
	rdiag := ws.rdiag[:n]
	off[0] = 0
	// With a pattern (ws.pattern) and as long as no rows are exchanged, the rows below
	// the pivot that can be non-zero in column k are known: the pivot search and the
	// elimination visit only those (the others hold exact zeros, which neither win the
	// search nor change a row). The first exchange ends the use of the pattern.
	sym := ws.pattern && ws.patternN == n
	for k := 0; k < n; k++ {
		p := k
		mx := math.Abs(A[k*n+k])
		if sym {
			for _, i := range ws.below[ws.belowOff[k]:ws.belowOff[k+1]] {
				if v := math.Abs(A[int(i)*n+k]); v > mx {
					mx, p = v, int(i)
				}
			}
		} else {
			for i := k + 1; i < n; i++ {
				if v := math.Abs(A[i*n+k]); v > mx {
					mx, p = v, i
				}
			}
		}
		if mx < 1e-250 || mx != mx {
			return false
		}
		if p != k {
			rk, rp := A[k*n:k*n+n], A[p*n:p*n+n]
			for j := range rk {
				rk[j], rp[j] = rp[j], rk[j]
			}
			b[k], b[p] = b[p], b[k]
			sym = false
		}
		d := 1 / A[k*n+k]
		rdiag[k] = d
		// non-zero columns of the pivot row right of the pivot
		rk := A[k*n : k*n+n]
		cnt := off[k]
		for j := k + 1; j < n; j++ {
			if rk[j] != 0 {
				idx[cnt] = j
				cnt++
			}
		}
		off[k+1] = cnt
		cols := idx[off[k]:cnt]
		bk := b[k]
		if sym {
			for _, i := range ws.below[ws.belowOff[k]:ws.belowOff[k+1]] {
				ri := A[int(i)*n : int(i)*n+n]
				l := ri[k] * d
				if l == 0 {
					continue
				}
				for _, j := range cols {
					ri[j] -= l * rk[j]
				}
				b[i] -= l * bk
			}
			continue
		}
		for i := k + 1; i < n; i++ {
			ri := A[i*n : i*n+n]
			l := ri[k] * d
			if l == 0 {
				continue
			}
			for _, j := range cols {
				ri[j] -= l * rk[j]
			}
			b[i] -= l * bk
		}
	}
	for k := n - 1; k >= 0; k-- {
		v := b[k]
		rk := A[k*n : k*n+n]
		for _, j := range idx[off[k]:off[k+1]] {
			v -= rk[j] * b[j]
		}
		b[k] = v * rdiag[k]
	}
	for _, v := range b {
		if !finite(v) {
			return false
		}
	}
	return true
}

// luWork is the scratch of luSolve for systems up to its size: the non-zero columns of
// each pivot row (idx, row k in idx[off[k]:off[k+1]]) and the reciprocal pivots. If
// pattern is set, the matrices of size patternN are known to be zero outside a pattern,
// and below[belowOff[k]:belowOff[k+1]] lists the rows i > k that can be non-zero in
// column k during the elimination without row exchanges (the pattern with its fill-in,
// see setPattern).
type luWork struct {
	idx   []int
	off   []int
	rdiag []float64

	pattern  bool
	patternN int
	below    []int32
	belowOff []int32
	fill     []bool
}

// setPattern records the non-zero pattern of the n x n matrices to come (nz: row-major
// positions; the diagonal is always included) and works out its fill-in under
// elimination in the natural order.
func (ws *luWork) setPattern(n int, nz []int32) {
	if cap(ws.fill) < n*n {
		ws.fill = make([]bool, n*n)
	}
	P := ws.fill[:n*n]
	clear(P)
	for _, pos := range nz {
		P[pos] = true
	}
	for k := 0; k < n; k++ {
		P[k*n+k] = true
	}
	ws.below = ws.below[:0]
	ws.belowOff = append(ws.belowOff[:0], 0)
	for k := 0; k < n; k++ {
		for i := k + 1; i < n; i++ {
			if !P[i*n+k] {
				continue
			}
			ws.below = append(ws.below, int32(i))
			for j := k + 1; j < n; j++ {
				if P[k*n+j] {
					P[i*n+j] = true
				}
			}
		}
		ws.belowOff = append(ws.belowOff, int32(len(ws.below)))
	}
	ws.pattern, ws.patternN = true, n
}

func newLUWork(n int) luWork {
	return luWork{idx: make([]int, n*n), off: make([]int, n+1), rdiag: make([]float64, n)}
}
