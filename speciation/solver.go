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
	roleFixed // activity fixed (H+ from pH, e- from pe)
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
	lastP    float64   // pressure of phLogK, bar
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
	warmLaE                float64

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
	s.lastP = math.NaN()
	s.alkSp = make([]float64, ns)
	for i := range db.species {
		s.alkSp[i] = db.species[i].Alkalinity
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
	if !res.finite() {
		// A water far beyond any activity model (hundreds of mol/kg) can
		// converge with coefficients that overflow: refuse it rather than
		// hand on an infinity.
		clearResult(res)
		return &SolveError{Err: ErrNoConvergence, Reason: "activity coefficients overflow: the water is far beyond the activity model's range"}
	}
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
