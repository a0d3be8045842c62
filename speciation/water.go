package speciation

// Water is the input of a speciation: temperature, pH, and the analytical totals of
// the components in mol per kg of water, with the constraint that closes each
// component. The zero value is a water at 0 C with nothing dissolved; set TempC, PH
// and the totals. A Water is only read by the solver and can be reused.
type Water struct {
	TempC float64 // temperature, C (0-100)
	PH    float64 // pH (activity scale); ignored when PHFromChargeBalance is set

	// PressureBar is the total pressure in bar (absolute), from MinPressureBar to
	// MaxPressureBar; 0 means 1 bar. At a pressure other than 1 bar the log K of
	// the minerals with pressure data (Mineral.HasPressureData) is corrected
	// (Mineral.LogKAt); the other minerals and all aqueous species keep their
	// 1 bar constants.
	PressureBar float64

	// PHFromChargeBalance computes H+ from the charge balance instead of fixing it
	// from PH (e.g. pure water with calcite and a CO2 pressure).
	PHFromChargeBalance bool

	// ChargeBalanceIon names one component whose total is adjusted so that the
	// speciated solution is electrically neutral (reported in Result.Adjusted).
	// Its total, if set, is only the starting guess.
	ChargeBalanceIon string

	pe    float64
	hasPE bool

	totals     []ComponentTotal
	alk        float64
	hasAlk     bool
	fixes      []PhaseFix
	equilibria []PhaseTarget
}

// ComponentTotal is the analytical total of one component, mol/kgw.
type ComponentTotal struct {
	Component string
	MolKgw    float64
}

// PhaseFix fixes the free activity of Component by equilibrium with a mineral or gas:
// the saturation index of a mineral (Target = SI, usually 0) or log10 of the partial
// pressure of a gas in atm (Target = log p). The component's total becomes a result.
type PhaseFix struct {
	Component string
	Phase     string
	Target    float64
}

// PhaseTarget brings the water to a saturation index SI with a mineral by dissolving
// (amount > 0) or precipitating (amount < 0) it; the amount is an unknown of the solve
// and the totals of the mineral's components change accordingly.
type PhaseTarget struct {
	Phase string
	SI    float64
}

// SetTotal sets (or replaces) the total of a component in mol/kgw. A total of zero
// removes the component from the solve. For the carbonate component (CO3 2-) this is
// total inorganic carbon.
func (w *Water) SetTotal(component string, molKgw float64) {
	for i := range w.totals {
		if w.totals[i].Component == component {
			w.totals[i].MolKgw = molKgw
			return
		}
	}
	w.totals = append(w.totals, ComponentTotal{component, molKgw})
}

// Total returns the total set for a component.
func (w *Water) Total(component string) (float64, bool) {
	for _, t := range w.totals {
		if t.Component == component {
			return t.MolKgw, true
		}
	}
	return 0, false
}

// Totals returns the totals set so far (shared; do not modify).
func (w *Water) Totals() []ComponentTotal { return w.totals }

// SetAlkalinity sets the total alkalinity in equivalents per kg of water; the carbonate
// balance is then replaced by an alkalinity balance (OH-, H+, HCO3-, CO3 2-, carbonate
// ion pairs, H3SiO4-, HSO4-, HF(aq) ... each counted by its equivalents relative to
// CO2(aq), H4SiO4, SO4 2- and F-). Do not also set a carbonate total.
func (w *Water) SetAlkalinity(eqKgw float64) {
	w.alk, w.hasAlk = eqKgw, true
}

// Alkalinity returns the alkalinity set by SetAlkalinity.
func (w *Water) Alkalinity() (float64, bool) { return w.alk, w.hasAlk }

// FixByPhase fixes a component by equilibrium with a mineral (target SI) or a gas
// (target log10 partial pressure, atm), replacing its mass balance: a total set for the
// component is ignored, and the resulting total is reported in Result.Totals.
func (w *Water) FixByPhase(component, phase string, target float64) {
	for i := range w.fixes {
		if w.fixes[i].Component == component {
			w.fixes[i] = PhaseFix{component, phase, target}
			return
		}
	}
	w.fixes = append(w.fixes, PhaseFix{component, phase, target})
}

// Equilibrate adds a mineral whose amount dissolved or precipitated is solved for so
// that its saturation index equals si. Combine with PHFromChargeBalance for a closed
// system; with a fixed pH the pH is held (an implicit acid or base is added).
func (w *Water) Equilibrate(mineral string, si float64) {
	for i := range w.equilibria {
		if w.equilibria[i].Phase == mineral {
			w.equilibria[i].SI = si
			return
		}
	}
	w.equilibria = append(w.equilibria, PhaseTarget{mineral, si})
}

// Reset clears everything, keeping allocated capacity.
func (w *Water) Reset() {
	*w = Water{totals: w.totals[:0], fixes: w.fixes[:0], equilibria: w.equilibria[:0]}
}

// Clone returns a deep copy.
func (w *Water) Clone() Water {
	c := *w
	c.totals = append([]ComponentTotal(nil), w.totals...)
	c.fixes = append([]PhaseFix(nil), w.fixes...)
	c.equilibria = append([]PhaseTarget(nil), w.equilibria...)
	return c
}

// SetPE sets the pe of the water, -log10 of the electron activity (pe = F Eh /
// (ln10 R T); see PEFromEh and the couples of PEFromCouple). Species and minerals
// whose reactions contain the electron (Fe(III) species, O2(aq), HS-, NH4+, the
// Fe(III) and Mn(III/IV) oxides, the sulfides) exist only in a water with a pe; the
// total of Fe2+ is then total iron, of SO4 2- total sulfur, of NO3- total nitrogen.
// Instead of a pe, the electron may be fixed by a phase: FixByPhase("e-", "O2(g)",
// log10 pO2) or FixByPhase("e-", "ferrihydrite", 0).
func (w *Water) SetPE(pe float64) { w.pe, w.hasPE = pe, true }

// PE returns the pe set by SetPE.
func (w *Water) PE() (float64, bool) { return w.pe, w.hasPE }

// ClearPE removes the pe: the water is speciated without redox information.
func (w *Water) ClearPE() { w.pe, w.hasPE = 0, false }
