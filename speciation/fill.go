package speciation

import (
	"math"
	"slices"
)

// Warnings attached to results (constant strings: no allocation).
const (
	WarnIonicStrength = "ionic strength above the activity model's stated limit"
	WarnNoEnthalpy    = "temperature away from 25 C and some log K values have no enthalpy in the data: held at their 25 C value"
	// WarnAboveWater: the pe is above the upper stability limit of water at this pH
	// (O2 above 1 atm); WarnBelowWater: below the lower limit (H2 above 1 atm).
	WarnAboveWater = "pe above the stability limit of water (O2 above 1 atm): the pe is not that of a natural water"
	WarnBelowWater = "pe below the stability limit of water (H2 above 1 atm): the pe is not that of a natural water"
)

// NoteNoRedox states what a water without a pe lacks (see Result.RedoxSkipped).
const NoteNoRedox = "no redox information: oxide and sulfide SIs not computed"

// fill writes the converged state into res.
func (s *Solver) fill(res *Result, w *Water) {
	db := s.db
	clearResult(res)
	u := s.u[:s.n]
	I := u[s.iCol]
	// s.m, s.lg and s.logAw hold the converged state (last evaluate).
	for ci := range s.role {
		if c := s.col[ci]; c >= 0 {
			s.la[ci] = u[c]
		}
	}
	res.Model = s.model.Name()
	res.TempC = w.TempC
	p := pressureOf(w)
	res.PressureBar = p
	res.Iterations = s.iters
	res.IonicStrength = I
	res.WaterActivity = exp10(s.logAw)
	res.PH = -s.la[db.hplus]
	var zsum, zabs, alk float64
	na := len(s.act)
	if cap(res.Species) < na {
		res.Species = make([]SpeciesResult, na)
	}
	res.Species = res.Species[:na]
	species := res.Species
	gam := s.lgOld[:na] // scratch: the activity coefficients
	pow10s(gam, s.lg[:na])
	for k, si := range s.act {
		sp := &db.species[si]
		m := s.m[k]
		lg := s.lg[k]
		g := gam[k]
		r := &species[k]
		r.Name, r.Charge, r.Molality = sp.Name, sp.Charge, m
		r.LogGamma, r.Gamma, r.Activity, r.LogActivity = lg, g, m*g, s.logm[k]+lg
		zsum += sp.Charge * m
		zabs += math.Abs(sp.Charge) * m
		alk += s.alkSp[si] * m
	}
	if zabs > 0 {
		res.ChargeBalance = 100 * zsum / zabs
	}
	res.Alkalinity = alk
	// totals and distribution (appended to local slices, stored back once)
	totals, dist := res.Totals, res.Distribution
	for ci := range db.components {
		if ci == db.water || ci == db.hplus || ci == db.electron || !s.active[ci] {
			continue
		}
		tot := 0.0
		ents := s.cAct[s.cActOff[ci]:s.cActOff[ci+1]]
		for _, p := range ents {
			tot += p.nu * s.m[p.k]
		}
		name := db.components[ci].Name
		reported := tot
		if s.role[ci] == roleTotal {
			// the given total, changed by the equilibrated minerals: exact, so that
			// differences of totals give amounts precisely (the species sum agrees
			// within the convergence tolerance)
			reported = s.total[ci]
			for k, pi := range s.eqPhase {
				reported += nuOf(db.minerals[pi].Terms, ci) * u[s.iCol+1+k]
			}
		}
		totals = append(totals, ComponentTotal{name, reported})
		if s.role[ci] == roleCharge {
			res.Adjusted, res.AdjustedTotal = name, tot
		}
		if tot <= 0 {
			continue
		}
		start := len(dist)
		dist = slices.Grow(dist, len(ents))[:start+len(ents)]
		for q, p := range ents {
			m := s.m[p.k]
			sh := &dist[start+q]
			sh.Component, sh.Species = name, db.species[s.act[p.k]].Name
			sh.Molality, sh.Percent = m, 100*p.nu*m/tot
		}
	}
	res.Totals, res.Distribution = totals, dist
	// saturation indices
	minerals := res.Minerals
	for pi := range db.minerals {
		mn := &db.minerals[pi]
		ok, onlyE := true, true
		for _, t := range mn.Terms {
			if t.Index != db.water && t.Index != db.hplus && !s.active[t.Index] {
				ok = false
				onlyE = onlyE && t.Index == db.electron
			}
		}
		if !ok {
			if onlyE && !mn.Gas {
				res.RedoxSkipped = true
			}
			continue
		}
		iap := s.phaseLogIAP(pi, u)
		lk := s.phLogK[pi]
		if mn.Gas {
			switch pi {
			case db.co2gas:
				res.LogPCO2, res.HasLogPCO2 = iap-lk, true
			case db.o2gas:
				res.LogPO2, res.HasLogPO2 = iap-lk, true
			}
			continue
		}
		vr := mn.ValidTempC
		outside := vr != [2]float64{} && (w.TempC < vr[0] || w.TempC > vr[1])
		msi := MineralSI{Name: mn.Name, SI: iap - lk, LogIAP: iap, LogK: lk, OutsideTempRange: outside}
		if p != 1 {
			if pr := mn.ValidPressureBar; mn.HasPressureData() {
				msi.OutsidePressureRange = p < pr[0] || p > pr[1]
			} else {
				msi.NoPressureData = true
			}
		}
		minerals = append(minerals, msi)
	}
	res.Minerals = minerals
	for k, pi := range s.eqPhase {
		res.Phases = append(res.Phases, PhaseAmount{Name: db.minerals[pi].Name, Dissolved: u[s.iCol+1+k], SI: s.eqTarget[k]})
	}
	s.indices(res, w)
	if db.electron >= 0 && s.role[db.electron] != roleAbsent {
		res.PE, res.HasPE = -s.la[db.electron], true
		if c := s.col[db.electron]; c >= 0 {
			res.PE = -u[c]
		}
		s.redoxWarnings(res)
	}
	if I > s.model.MaxIonicStrength() {
		res.Warnings = append(res.Warnings, WarnIonicStrength)
	}
	if math.Abs(w.TempC-25) > 5 {
		constK := false
		for _, si := range s.act {
			if db.species[si].TempNote == tempConstant {
				constK = true
				break
			}
		}
		for i := range res.Minerals {
			if pi := db.MineralIndex(res.Minerals[i].Name); pi >= 0 && db.minerals[pi].TempNote == tempConstant {
				constK = true
				break
			}
		}
		if constK {
			res.Warnings = append(res.Warnings, WarnNoEnthalpy)
		}
	}
}

// indices computes the Langelier, Ryznar and Larson-Skold indices.
func (s *Solver) indices(res *Result, w *Water) {
	db := s.db
	res.Indices = Indices{}
	if db.carbonate < 0 || !s.active[db.carbonate] {
		return
	}
	// Larson-Skold: (Cl + 2 SO4) / carbonate alkalinity, equivalents.
	var carbAlk float64
	for _, p := range s.carbAct {
		carbAlk += p.nu * s.m[p.k]
	}
	num := 0.0
	if t, ok := res.Total("Cl-"); ok {
		num += t
	}
	if t, ok := res.Total("SO4 2-"); ok {
		num += 2 * t
	}
	if carbAlk > 0 {
		res.Indices.LarsonSkold = num / carbAlk
		res.Indices.HasLarsonSkold = true
	}
	// Langelier / Ryznar.
	ca := db.ComponentIndex("Ca2+")
	if ca < 0 || !s.active[ca] || db.hco3 < 0 || db.calcite < 0 || res.Alkalinity <= 0 {
		return
	}
	caT, _ := res.Total("Ca2+")
	if caT <= 0 {
		return
	}
	pK2 := s.logK[db.hco3] // log K of CO3 2- + H+ = HCO3- is pK2
	pKs := -s.phLogK[db.calcite]
	sq := math.Sqrt(res.IonicStrength)
	pfm := s.st.A * (sq/(1+sq) - 0.3*res.IonicStrength) // -log10 fm, Davies
	pHs := pK2 - pKs - math.Log10(caT) - math.Log10(res.Alkalinity) + 5*pfm
	res.Indices.PHs = pHs
	res.Indices.Langelier = res.PH - pHs
	res.Indices.Ryznar = 2*pHs - res.PH
	res.Indices.HasLangelier = true
}

func exp10(x float64) float64 { return math.Exp(x * math.Ln10) }
