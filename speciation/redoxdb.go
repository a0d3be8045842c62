package speciation

import "math"

// This file holds what the data reader records about redox: the alkalinity of a
// species whose reference level is not that of its components, and which component's
// oxidation state the electrons of a reaction change.

// speciesAlkalinityRedox returns the alkalinity of a species entry (its own
// "alkalinity" key, or the sum over the reaction's terms) and the attribution of the
// reaction's electrons: electrons written directly in the reaction belong to its one
// component other than H2O, H+ and e- (to H2O when there is none, as for O2(aq)); an
// earlier species brings its own attribution.
func (db *Database) speciesAlkalinityRedox(e *rawEntry) (float64, []Term, error) {
	raw, err := parseReaction(e.fields["reaction"])
	if err != nil {
		return 0, nil, e.errf("reaction", "%w", err)
	}
	var alk, direct float64
	var redox []Term
	add := func(ci int, nu float64) {
		for i := range redox {
			if redox[i].Index == ci {
				redox[i].Nu += nu
				return
			}
		}
		redox = append(redox, Term{Component: db.components[ci].Name, Index: ci, Nu: nu})
	}
	carrier, carriers := -1, 0
	for _, t := range raw {
		if ci, ok := db.compIndex[t.Component]; ok {
			alk += t.Nu * db.components[ci].Alkalinity
			switch ci {
			case db.electron:
				direct += t.Nu
			case db.water, db.hplus:
			default:
				carrier = ci
				carriers++
			}
			continue
		}
		sp := &db.species[db.speciesIndex[t.Component]] // known: reaction() checked it
		alk += t.Nu * sp.Alkalinity
		for _, r := range sp.redox {
			add(r.Index, t.Nu*r.Nu)
		}
	}
	if direct != 0 {
		switch carriers {
		case 0:
			add(db.water, direct)
		case 1:
			add(carrier, direct)
		default:
			return 0, nil, e.errf("reaction", "%w: electrons written with more than one component cannot be attributed to one oxidation state", ErrInvalidParameter)
		}
	}
	if _, ok := e.fields["alkalinity"]; ok {
		if alk, err = e.number("alkalinity", false); err != nil {
			return 0, nil, err
		}
	}
	return alk, redox, nil
}

// Electrons returns the electrons gained per unit of component by species si relative
// to the component's own oxidation state, and whether the species contains the
// component: 0 for Fe2+, FeOH+ and FeSO4(aq) on Fe2+, -1 for Fe3+ and FeSO4+ on Fe2+,
// +8 for HS- and H2S(aq) on SO4 2-, +8 for NH4+ on NO3-. It panics if si or the
// component is out of range (programmer error).
func (db *Database) Electrons(si int, component int) (float64, bool) {
	sp := &db.species[si]
	nu := nuOf(sp.Terms, component)
	if nu == 0 {
		return 0, false
	}
	return nuOf(sp.redox, component) / nu, true
}

// ElectronIndex returns the index of the electron component e-, or -1 when the data
// set has no redox reactions.
func (db *Database) ElectronIndex() int { return db.electron }

// StateTotal returns the part of a component's total (mol/kgw) in res carried by
// species whose oxidation state differs from the component's by electrons per unit
// (Database.Electrons): StateTotal(res, "Fe2+", -1) is dissolved Fe(III),
// StateTotal(res, "SO4 2-", 8) total dissolved sulfide. Species of res unknown to db
// are ignored.
func (db *Database) StateTotal(res *Result, component string, electrons float64) float64 {
	ci := db.ComponentIndex(component)
	if ci < 0 || res == nil {
		return 0
	}
	tot := 0.0
	for i := range res.Species {
		si := db.SpeciesIndex(res.Species[i].Name)
		if si < 0 {
			continue
		}
		if e, ok := db.Electrons(si, ci); ok && math.Abs(e-electrons) < 1e-9 {
			tot += nuOf(db.species[si].Terms, ci) * res.Species[i].Molality
		}
	}
	return tot
}
