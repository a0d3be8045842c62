package reaction

import (
	"fmt"
	"math"

	"gwsat.dev/gwsat/speciation"
)

// Tolerances of the active-set loop.
const (
	// AddSI: a mineral joins the precipitating set only above this saturation index.
	AddSI = 1e-9
	// DropAmount (mol/kgw): a mineral whose solved amount would dissolve more than
	// this (a negative precipitate) leaves the set.
	DropAmount = 1e-15
)

// Amount is a mineral precipitated to equilibrium.
type Amount struct {
	Mineral  string
	SIBefore float64 // saturation index of the water before precipitation
	MolKgw   float64 // precipitated, mol per kg of water (>= 0)
	MmolKgw  float64 // the same in mmol/kgw
	MgL      float64 // mg per litre of water: MolKgw x molar mass x kg water per litre
}

// Equilibrium is a water after precipitating minerals to equilibrium (SI = 0 for each
// mineral with a positive amount, SI <= 0 for the others considered).
type Equilibrium struct {
	Amounts []Amount // minerals with a positive amount, in the order they joined
	After   Solution // the water left: totals, alkalinity, pH
	Result  *speciation.Result
}

// Precipitation is the outcome of Precipitate.
type Precipitation struct {
	Before       Solution
	BeforeResult *speciation.Result
	KgwPerL      float64
	// Alone: each supersaturated candidate precipitated on its own, in the order of
	// the candidates; Alone[i].Amounts has one entry.
	Alone []Equilibrium
	// Together: the candidates solved simultaneously with the active set.
	Together Equilibrium
	// CCPP is the calcium carbonate precipitation potential in mg/L as CaCO3 (Standard
	// Methods 2330): 50 045 (Alk_initial - Alk_equilibrium), alkalinities in eq/L, at
	// calcite equilibrium reached in a closed system. Positive: the water would
	// deposit calcite; negative: it would dissolve it. HasCCPP is false when the water
	// lacks calcium or carbonate, or the database has no Calcite.
	CCPP    float64
	HasCCPP bool
}

// PrecipOptions sets Precipitate.
type PrecipOptions struct {
	// Minerals that may precipitate; nil: ScaleMinerals (those of the database).
	Minerals []string
	// KgwPerL is the kg of water per litre of solution, for mg/L (default 1).
	KgwPerL float64
}

// Precipitate computes, for a water (see Prepare or Mix), the amount of each
// supersaturated candidate mineral that precipitates to bring it to SI = 0 on its own
// and all candidates together, and the calcite precipitation potential. The system is
// closed: the pH follows r.PH (by default alkalinity and carbon are conserved between
// solution and solid).
func (r *Reactor) Precipitate(sol Solution, opt PrecipOptions) (*Precipitation, error) {
	kgwL := opt.KgwPerL
	if kgwL == 0 {
		kgwL = 1
	}
	if math.IsNaN(kgwL) || kgwL <= 0 || kgwL > 1.5 {
		return nil, inputErr(ErrInput, "kg water per litre", kgwL)
	}
	if err := r.checkMinerals(opt.Minerals); err != nil {
		return nil, err
	}
	before, res, err := r.Speciate(sol)
	if err != nil {
		return nil, err
	}
	cands := opt.Minerals
	if cands == nil {
		cands = r.KnownMinerals(ScaleMinerals())
	}
	p := &Precipitation{Before: before, BeforeResult: res, KgwPerL: kgwL}
	for _, m := range cands {
		si, ok := res.SI(m)
		if !ok || si <= AddSI {
			continue
		}
		eq, err := r.Equilibrate(before, []string{m}, kgwL)
		if err != nil {
			return nil, fmt.Errorf("%s alone: %w", m, err)
		}
		p.Alone = append(p.Alone, *eq)
	}
	together, err := r.Equilibrate(before, cands, kgwL)
	if err != nil {
		return nil, fmt.Errorf("minerals together: %w", err)
	}
	p.Together = *together
	p.CCPP, p.HasCCPP, err = r.CCPP(before, kgwL)
	if err != nil {
		return nil, err
	}
	return p, nil
}

// Equilibrate precipitates the candidate minerals from sol until none is
// supersaturated, by an active set: start with none; add the most supersaturated
// candidate (SI > AddSI) and solve the amounts of the set simultaneously (SI = 0 for
// each, closed system); drop a mineral whose amount would be negative (it would
// dissolve); repeat until no candidate is supersaturated. Undersaturated candidates are
// never precipitated. kgwPerL converts to mg/L.
func (r *Reactor) Equilibrate(sol Solution, candidates []string, kgwPerL float64) (*Equilibrium, error) {
	if err := r.checkMinerals(candidates); err != nil {
		return nil, err
	}
	if err := checkTemp("temperature", sol.TempC); err != nil {
		return nil, err
	}
	start, res0, err := r.Speciate(sol)
	if err != nil {
		return nil, err
	}
	var active []string
	res := res0
	cur := start
	excluded := map[string]bool{}
	for iter := 0; iter < 4*len(candidates)+10; iter++ {
		// drop the mineral that would dissolve most
		drop, worst := -1, DropAmount
		for k, ph := range res.Phases {
			if ph.Dissolved > worst {
				drop, worst = k, ph.Dissolved
			}
		}
		if drop >= 0 {
			excluded[active[drop]] = true
			active = append(active[:drop:drop], active[drop+1:]...)
			if res, err = r.solve(&cur, active); err != nil {
				return nil, err
			}
			cur.PH = res.PH
			continue
		}
		// add the most supersaturated candidate
		add, best := "", AddSI
		for _, m := range candidates {
			if contains(active, m) {
				continue
			}
			if si, ok := res.SI(m); ok && si > best {
				add, best = m, si
			}
		}
		if add == "" {
			break
		}
		if excluded[add] && iter > 2*len(candidates) {
			return nil, &SolveError{Step: "active set", Err: fmt.Errorf("%w: %s keeps entering and leaving the set", ErrNoSolution, add)}
		}
		trial := append(append([]string(nil), active...), add)
		rt, err := r.solve(&cur, trial)
		if err != nil {
			return nil, err
		}
		active, res = trial, rt
		cur.PH = res.PH
	}
	eq := &Equilibrium{Result: res}
	for k, ph := range res.Phases {
		m := r.db.Mineral(active[k])
		x := math.Max(-ph.Dissolved, 0)
		si0, _ := res0.SI(active[k])
		eq.Amounts = append(eq.Amounts, Amount{
			Mineral: active[k], SIBefore: si0, MolKgw: x, MmolKgw: 1000 * x,
			MgL: 1000 * x * m.MolarMass * kgwPerL,
		})
	}
	eq.After = Solution{TempC: sol.TempC, PH: res.PH, Alkalinity: start.Alkalinity,
		Totals: append([]speciation.ComponentTotal(nil), res.Totals...)}
	if r.PH == ConserveAlkalinity {
		// conserved exactly: what the solids carried away
		for k, ph := range res.Phases {
			eq.After.Alkalinity += ph.Dissolved * r.mineralAlk(active[k])
		}
	} else {
		eq.After.Alkalinity = res.Alkalinity
	}
	return eq, nil
}

func contains(list []string, s string) bool {
	for _, v := range list {
		if v == s {
			return true
		}
	}
	return false
}

// CaCO3AlkFactor is 50 045 mg CaCO3 per equivalent (half the molar mass of CaCO3,
// 100.09 g/mol), the factor of the CCPP definition (Standard Methods 2330).
const CaCO3AlkFactor = 50045

// CCPP is the calcium carbonate precipitation potential of Standard Methods 2330,
// CCPP = 50 045 (Alk_initial - Alk_equilibrium) mg/L as CaCO3 with the alkalinities in
// eq/L, the equilibrium being calcite saturation reached in a closed system (calcite
// precipitating, or dissolving when the water is undersaturated: then CCPP < 0).
// kgwPerL converts eq/kgw to eq/L. ok is false when the water lacks calcium or
// carbonate, the database has no mineral named Calcite, or r.PH is HoldPH (a held pH
// is not a closed system).
func (r *Reactor) CCPP(sol Solution, kgwPerL float64) (ccpp float64, ok bool, err error) {
	if r.PH == HoldPH || r.db.Mineral("calcite") == nil || sol.Total("Ca2+") <= 0 || sol.Total(speciation.NameCarbonate) <= 0 {
		return 0, false, nil
	}
	start, _, err := r.Speciate(sol)
	if err != nil {
		return 0, false, err
	}
	res, err := r.solve(&start, []string{"calcite"})
	if err != nil {
		return 0, false, err
	}
	// res.Alkalinity is the speciated alkalinity at calcite equilibrium (in
	// ConserveAlkalinity mode it equals Alk_initial + 2 x dissolved by construction).
	alk0, err := r.alkalinityOf(start)
	if err != nil {
		return 0, false, err
	}
	return CaCO3AlkFactor * (alk0 - res.Alkalinity) * kgwPerL, true, nil
}

// alkalinityOf returns the speciated alkalinity of sol.
func (r *Reactor) alkalinityOf(sol Solution) (float64, error) {
	if r.PH == ConserveAlkalinity {
		return sol.Alkalinity, nil
	}
	res, err := r.solve(&sol, nil)
	if err != nil {
		return 0, err
	}
	return res.Alkalinity, nil
}

// ScaleMinerals returns a default list of candidate minerals for precipitation in
// injection planning: those that commonly form scale at near-surface to geothermal
// temperatures on the time scale of an injection (common practice). Left out on purpose:
// dolomite and magnesite (kinetically inhibited at low temperature), quartz and
// chalcedony (too slow below roughly 100 C; amorphous silica stands for silica scale),
// aragonite (calcite stands for CaCO3). Names absent from a database are skipped by
// the caller (see Reactor.KnownMinerals).
func ScaleMinerals() []string {
	return []string{"calcite", "siderite", "rhodochrosite", "strontianite", "witherite",
		"gypsum", "anhydrite", "celestine", "baryte", "fluorite", "amorphous silica", "halite"}
}

// KnownMinerals returns the names of list that are minerals (not gases) of the
// reactor's database, in order.
func (r *Reactor) KnownMinerals(list []string) []string {
	var out []string
	for _, n := range list {
		if m := r.db.Mineral(n); m != nil && !m.Gas {
			out = append(out, n)
		}
	}
	return out
}
