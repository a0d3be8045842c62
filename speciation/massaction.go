package speciation

// This file holds the mass-action law: species molalities from the component
// activities, the activity coefficients, and the ion activity product of a phase.

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
