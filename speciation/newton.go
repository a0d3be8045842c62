package speciation

import (
	"fmt"
	"math"
)

// This file holds the Newton-Raphson iteration: Jacobian, residuals, the damped
// step with its line search, and the diagnosis of a solve that fails.

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
				if e := s.db.electron; e >= 0 {
					s.warmLaE = s.la[e]
				}
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
