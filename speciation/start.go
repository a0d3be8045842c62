package speciation

import (
	"math"
)

// This file holds the starting point of a solve: the warm start from the previous
// solution, the cold guesses and the continued-fraction (Gauss-Seidel) sweeps.

// warmStart starts from the previous solution, with each free activity scaled by the
// change of its total. It reports false if the previous solution does not fit.
func (s *Solver) warmStart() bool {
	if len(s.warmU) != s.n || math.Abs(s.lastT-s.warmT) > 0.5 || math.Abs(s.la[s.db.hplus]-s.warmLaH) > 0.1 {
		return false
	}
	if e := s.db.electron; e >= 0 && s.role[e] == roleFixed && math.Abs(s.la[e]-s.warmLaE) > 0.1 {
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
