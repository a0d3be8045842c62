package speciation

import (
	"fmt"
	"math"
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

	jOff  []int     // per active species: range of its Jacobian entries
	jPos  []int     // flat index into J
	jCoef []float64 // w_row * nu_col
	jRow  []int     // row of the entry (for the row scale)

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
	piv    []int
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
	nc, ns, nm := len(db.Components), len(db.Species), len(db.Minerals)
	s := &Solver{db: db, model: model, MaxIterations: 200, MaxStep: 1.5, sweeps: 2, gsSweeps: 3, WarmStart: true, nc: nc, ns: ns}
	s.role = make([]int, nc)
	s.total = make([]float64, nc)
	s.phaseOf = make([]int, nc)
	s.target = make([]float64, nc)
	s.la = make([]float64, nc)
	s.col = make([]int, nc)
	s.row = make([]int, nc)
	s.active = make([]bool, nc)
	s.alkComp = make([]float64, nc)
	for i, c := range db.Components {
		s.alkComp[i] = c.Alkalinity
	}
	s.spActive = make([]bool, ns)
	s.logK = make([]float64, ns)
	s.phLogK = make([]float64, nm)
	s.lastT = math.NaN()
	s.alkSp = make([]float64, ns)
	for i := range db.Species {
		for _, t := range db.Species[i].Terms {
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
	for si := range db.Species {
		for _, t := range db.Species[si].Terms {
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
	s.piv = make([]int, n)
	s.rowPhase = make([]int, n)
	s.rowTarget = make([]float64, n)
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
			if db.Components[ci].Charge == 0 {
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
		pi, ok := db.mineralIndex[f.Phase]
		if !ok {
			return inputErr("unknown mineral or gas %q", f.Phase)
		}
		if !finite(f.Target) {
			return inputErr("target of %s is not finite", f.Phase)
		}
		if nuOf(db.Minerals[pi].Terms, ci) == 0 {
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
		pi, ok := db.mineralIndex[e.Phase]
		if !ok || db.Minerals[pi].Gas {
			return inputErr("unknown mineral %q to equilibrate", e.Phase)
		}
		if !finite(e.SI) {
			return inputErr("target SI of %s is not finite", e.Phase)
		}
		for _, t := range db.Minerals[pi].Terms {
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
		for _, t := range db.Minerals[s.phaseOf[ci]].Terms {
			if !s.active[t.Index] {
				return inputErr("%s fixed by %s needs %s, which is absent", db.Components[ci].Name, db.Minerals[s.phaseOf[ci]].Name, t.Component)
			}
		}
	}
	// Temperature-dependent constants (cached).
	if w.TempC != s.lastT {
		T := w.TempC + 273.15
		lt := math.Log10(T)
		for i := range db.Species {
			f := &db.Species[i].LogK
			s.logK[i] = f.A + f.B*T + f.C/T + f.D*lt + f.E/(T*T)
		}
		for i := range db.Minerals {
			f := &db.Minerals[i].LogK
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
		for _, t := range db.Species[si].Terms {
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
	for si := range db.Species {
		sp := &db.Species[si]
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
	// flattened Jacobian entries: d(row p)/d(col q) = ln10 w_p nu_q m
	if cap(s.jOff) < na+1 {
		s.jOff = make([]int, na+1)
	}
	s.jOff = s.jOff[:na+1]
	s.jPos, s.jCoef, s.jRow = s.jPos[:0], s.jCoef[:0], s.jRow[:0]
	for k := 0; k < na; k++ {
		s.jOff[k] = len(s.jPos)
		for p := s.rowOff[k]; p < s.rowOff[k+1]; p++ {
			r := s.rowIdx[p]
			for q := s.colOff[k]; q < s.colOff[k+1]; q++ {
				s.jPos = append(s.jPos, r*nTot+s.colIdx[q])
				s.jCoef = append(s.jCoef, s.rowW[p]*s.colNu[q])
				s.jRow = append(s.jRow, r)
			}
		}
	}
	s.jOff[na] = len(s.jPos)
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
		s.m[k] = pow10(v)
	}
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
	for _, t := range db.Minerals[pi].Terms {
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
	for ci, c := range db.Components {
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
// balances (pH fixed): one component at a time, its log activity moves by
// log10(total / current sum) and the molalities of its species follow at once
// (multiplicatively, so a sweep costs one power of ten per component); between sweeps
// the activity coefficients follow the ionic strength. The ionic strength is then set
// from the molalities. Three sweeps leave Newton two iterations on typical waters.
func (s *Solver) gaussSeidel(u []float64, sweeps int) {
	db := s.db
	s.speciesMolalities(u)
	m := s.m
	for sweep := 0; sweep < sweeps; sweep++ {
		for ci := range s.role {
			c := s.col[ci]
			if c < 0 {
				continue
			}
			var sum, target float64
			switch s.role[ci] {
			case roleTotal:
				for _, p := range s.compSp[ci] {
					if k := s.spPos[p.sp]; k >= 0 {
						sum += p.nu * m[k]
					}
				}
				target = s.total[ci]
			case roleAlk:
				for k, si := range s.act {
					sum += s.alkSp[si] * m[k]
				}
				target = s.alk
			default:
				continue
			}
			if !(sum > 0) {
				continue
			}
			d := roughLog10(target / sum)
			if d > 4 {
				d = 4
			} else if d < -4 {
				d = -4
			}
			if ci == db.carbonate && s.role[ci] == roleAlk {
				// the alkalinity is not proportional to the carbonate activity (OH-,
				// H3SiO4- ...): move by the carbonate part only
				carb := 0.0
				for _, p := range s.compSp[ci] {
					if k := s.spPos[p.sp]; k >= 0 {
						carb += s.alkSp[p.sp] * m[k]
					}
				}
				if carb > 0 && target-(sum-carb) > 0 {
					d = roughLog10((target - (sum - carb)) / carb)
				}
				if d > 4 {
					d = 4
				} else if d < -4 {
					d = -4
				}
			}
			u[c] += d
			f := pow10(d)
			for _, p := range s.compSp[ci] {
				k := s.spPos[p.sp]
				if k < 0 {
					continue
				}
				switch p.nu {
				case 1:
					m[k] *= f
				case 2:
					m[k] *= f * f
				default:
					m[k] *= pow10(p.nu * d)
				}
				s.logm[k] += p.nu * d
			}
		}
		if sweep < sweeps-1 {
			// new activity coefficients at the ionic strength of these molalities; the
			// molalities follow by m *= 10^-(change of log gamma), to third order
			// (the changes are small, and this is only a starting guess)
			I := 0.0
			for k := range s.act {
				I += 0.5 * s.st.Charge[k] * s.st.Charge[k] * m[k]
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
	for k := range s.act {
		I += 0.5 * s.st.Charge[k] * s.st.Charge[k] * m[k]
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
					newT := math.Max(sum-Z/db.Components[ci].Charge, 1e-3*sum)
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
		nu := nuOf(db.Minerals[pi].Terms, ci)
		rest := s.phaseLogIAP(pi, u) - nu*u[s.col[ci]]
		v := (s.phLogK[pi] + s.target[ci] - rest) / nu
		u[s.col[ci]] = math.Max(math.Min(v, 1), -30)
	}
}

// jacobian builds the Jacobian at the point of the last evaluate (it uses s.m, s.dlg
// and s.scale), each row divided by its scale.
func (s *Solver) jacobian(u []float64) {
	n := s.n
	J := s.jac[:n*n]
	clear(J)
	ln10 := math.Ln10
	inv := s.du[:n] // scratch: 1/scale of each row (du is overwritten by the caller)
	for r := range inv {
		inv[r] = 1 / s.scale[r]
	}
	J[s.iCol*n+s.iCol] = inv[s.iCol]
	iCol := s.iCol
	jPos, jCoef, jRow := s.jPos, s.jCoef, s.jRow
	for k := range s.act {
		m := ln10 * s.m[k]
		for e := s.jOff[k]; e < s.jOff[k+1]; e++ {
			jr := jRow[e]
			J[jPos[e]] += jCoef[e] * m * inv[jr]
		}
		// ionic-strength column: - ln10 w m dlogg/dI
		md := m * s.dlg[k]
		for p := s.rowOff[k]; p < s.rowOff[k+1]; p++ {
			r := s.rowIdx[p]
			J[r*n+iCol] -= s.rowW[p] * md * inv[r]
		}
	}
	base := s.iCol + 1
	db := s.db
	for k, pi := range s.eqPhase {
		for _, t := range db.Minerals[pi].Terms {
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
		for _, t := range db.Minerals[pi].Terms {
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
	for k := range s.act {
		m := s.m[k]
		for p := s.rowOff[k]; p < s.rowOff[k+1]; p++ {
			wm := s.rowW[p] * m
			r := s.rowIdx[p]
			R[r] += wm
			sc[r] += math.Abs(wm)
		}
	}
	// equilibrium phases: amounts dissolved add to totals (and alkalinity)
	base := s.iCol + 1
	db := s.db
	for k, pi := range s.eqPhase {
		xi := u[base+k]
		for _, t := range db.Minerals[pi].Terms {
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
		if !luSolve(J, s.piv[:n], du, n) {
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
		if nuOf(db.Species[si].Terms, db.carbonate) == 0 {
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
		z := db.Components[ci].Charge
		other := 0.0
		for k, si := range s.act {
			if nuOf(db.Species[si].Terms, ci) == 0 {
				other += s.st.Charge[k] * s.m[k]
			}
		}
		if ci == db.hplus {
			return fmt.Sprintf("no pH closes the charge balance (stalled, largest relative balance error %.3g)", worst)
		}
		if other*z > 0 {
			return fmt.Sprintf("the charge balance cannot be closed by adjusting %s: the other ions already carry %.4g eq/kgw of the same sign", db.Components[ci].Name, other)
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
			return &SolveError{Reason: fmt.Sprintf("the charge balance cannot be closed by adjusting %s (its total would be negative)", db.Components[ci].Name), Iterations: it, Err: ErrNoConvergence}
		}
	}
	return nil
}

// luSolve solves A x = b in place (b becomes x) by Gaussian elimination with partial
// pivoting on the row-major n x n matrix A (destroyed). It reports false when A is
// singular to working precision.
func luSolve(A []float64, piv []int, b []float64, n int) bool {
	A = A[:n*n]
	b = b[:n]
	for k := 0; k < n; k++ {
		p := k
		mx := math.Abs(A[k*n+k])
		for i := k + 1; i < n; i++ {
			if v := math.Abs(A[i*n+k]); v > mx {
				mx, p = v, i
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
		}
		piv[k] = p
		d := 1 / A[k*n+k]
		rk := A[k*n+k+1 : k*n+n]
		bk := b[k]
		for i := k + 1; i < n; i++ {
			l := A[i*n+k] * d
			if l == 0 {
				continue
			}
			ri := A[i*n+k+1 : i*n+n]
			ri = ri[:len(rk)]
			for j, v := range rk {
				ri[j] -= l * v
			}
			b[i] -= l * bk
		}
	}
	for k := n - 1; k >= 0; k-- {
		v := b[k]
		row := A[k*n+k+1 : k*n+n]
		xs := b[k+1:]
		xs = xs[:len(row)]
		for j, a := range row {
			v -= a * xs[j]
		}
		b[k] = v / A[k*n+k]
		if !finite(b[k]) {
			return false
		}
	}
	return true
}
