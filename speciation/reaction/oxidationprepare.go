package reaction

import (
	"gwsat.dev/gwsat/speciation"
)

// PrepareRedox speciates a water that carries a pe (Water.SetPE, or FixByPhase on
// e-) and splits it the way Oxidize needs it: a Solution as Prepare would give for
// the water without redox information (the SO4 2- total is sulfate only, the Fe2+
// total all iron, the alkalinity without the part carried by species that exist only
// with a pe, so sulfide counts at the H2S level) and a RedoxInput with the water's
// dissolved O2, total sulfide and dissolved Fe(III). A water without a pe gives an
// empty RedoxInput and the Solution of Prepare.
func (r *Reactor) PrepareRedox(w *speciation.Water) (Solution, RedoxInput, *speciation.Result, error) {
	sol, res, err := r.Prepare(w)
	if err != nil || !res.HasPE {
		return sol, RedoxInput{}, res, err
	}
	db := r.db
	in := RedoxInput{
		O2:      res.Molality("O2(aq)"),
		Sulfide: db.StateTotal(res, "SO4 2-", 8),
		FeIII:   db.StateTotal(res, "Fe2+", -1),
	}
	if in.Sulfide > 0 {
		sol.setTotal("SO4 2-", db.StateTotal(res, "SO4 2-", 0))
	}
	e := db.ElectronIndex()
	all := db.Species()
	for _, sp := range res.Species {
		si := db.SpeciesIndex(sp.Name)
		if si < 0 {
			continue
		}
		s := &all[si]
		if hasTerm(s.Terms, e) {
			sol.Alkalinity -= s.Alkalinity * sp.Molality
		}
	}
	return sol, in, res, nil
}

func hasTerm(terms []speciation.Term, ci int) bool {
	for _, t := range terms {
		if t.Index == ci {
			return true
		}
	}
	return false
}
