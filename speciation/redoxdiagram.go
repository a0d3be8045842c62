package speciation

import (
	"fmt"
	"math"
	"sort"
)

// This file computes the predominance (stability) fields of a pe-pH diagram for
// iron from the data set's own constants, as plain polygons and line segments.

// DiagramPoint is a point of a pe-pH diagram.
type DiagramPoint struct{ PH, PE float64 }

// DiagramSegment is a straight boundary between two fields.
type DiagramSegment struct {
	A, B         DiagramPoint
	Left, Right  string // the fields on either side
	BetweenSolid bool   // true when either side is a solid
}

// PredominanceField is where one aqueous species predominates or one solid is
// stable; its area is the union of the convex Polygons.
type PredominanceField struct {
	Name     string
	Solid    bool
	Polygons [][]DiagramPoint
}

// IronDiagramOptions sets IronPEPH.
type IronDiagramOptions struct {
	TempC float64
	// FeTotal is the total dissolved iron, mol/kgw (taken as its activity): the
	// boundary between a solid and the aqueous field is where the solid is in
	// equilibrium with this much iron in the predominant species.
	FeTotal float64
	// STotal and CTotal (mol/kgw, optional): total sulfur and carbonate. With sulfur,
	// mackinawite and pyrite compete; with carbonate, siderite. Each ligand is taken as
	// its predominant species (SO4 2-, HSO4-, HS-, H2S(aq); CO2(aq), HCO3-, CO3 2-) at
	// its total.
	STotal, CTotal float64
	// FeIIISolid is the Fe(III) solid (default "ferrihydrite"; "goethite" or "hematite"
	// give the stable end).
	FeIIISolid string
	// The window (defaults pH 0-14, pe -12 to 22).
	PHMin, PHMax, PEMin, PEMax float64
}

// PEPHDiagram is an iron pe-pH predominance diagram.
type PEPHDiagram struct {
	TempC                      float64
	PHMin, PHMax, PEMin, PEMax float64
	Fields                     []PredominanceField
	Boundaries                 []DiagramSegment
	// WaterUpper is O2(g) at 1 atm (from the data's O2(g) constant), WaterLower H2(g)
	// at 1 atm (pe = -pH, the definition of the hydrogen scale): water is stable
	// between them.
	WaterUpper, WaterLower [2]DiagramPoint
	// Notes states the assumptions (ideal activities, species considered).
	Notes []string

	cands   []candidate
	ligands [][]ligandState
}

// lin is c + ph pH + pe pe.
type lin struct{ c, ph, pe float64 }

func (f lin) at(p DiagramPoint) float64 { return f.c + f.ph*p.PH + f.pe*p.PE }
func (f lin) sub(g lin) lin             { return lin{f.c - g.c, f.ph - g.ph, f.pe - g.pe} }

// candidate is an iron species or solid: the log activity of Fe2+ at which it
// predominates (aqueous at the total) or is saturated (solid), linear in pH and pe
// given the log activities of the ligand components.
type candidate struct {
	name   string
	solid  bool
	base   lin             // without ligands
	ligand map[int]float64 // coefficient on log a(ligand component), divided out
}

// ligandState is one predominant ligand species: log a(component) where it
// predominates at the total.
type ligandState struct {
	comp int
	name string
	la   lin
}

// IronPEPH computes the iron pe-pH diagram at opt.TempC from db's constants: the
// aqueous Fe(II) and Fe(III) hydroxo species (Fe2+, FeOH+, Fe3+, FeOH2+, Fe(OH)2+,
// Fe(OH)3(aq), Fe(OH)4-), the Fe(III) solid, and with sulfur or carbonate
// mackinawite, pyrite and siderite. Each field is where its entity needs the lowest
// Fe2+ activity (the most stable solid, or the predominant species at the total), so
// the fields tile the window exactly.
func IronPEPH(db *Database, opt IronDiagramOptions) (*PEPHDiagram, error) {
	if db.electron < 0 {
		return nil, fmt.Errorf("%w: the database has no %s", ErrRedoxInput, NameElectron)
	}
	if !finite(opt.TempC) || opt.TempC < MinTempC || opt.TempC > MaxTempC {
		return nil, fmt.Errorf("%w: temperature %g C", ErrTemperature, opt.TempC)
	}
	for _, v := range []float64{opt.FeTotal, opt.STotal, opt.CTotal} {
		if !finite(v) || v < 0 {
			return nil, fmt.Errorf("%w: totals must be finite and >= 0", ErrRedoxInput)
		}
	}
	if opt.FeTotal <= 0 {
		return nil, fmt.Errorf("%w: total iron must be above zero", ErrRedoxInput)
	}
	if opt.FeIIISolid == "" {
		opt.FeIIISolid = "ferrihydrite"
	}
	if opt.PHMin == 0 && opt.PHMax == 0 {
		opt.PHMin, opt.PHMax = 0, 14
	}
	if opt.PEMin == 0 && opt.PEMax == 0 {
		opt.PEMin, opt.PEMax = -12, 22
	}
	if !(opt.PHMax > opt.PHMin) || !(opt.PEMax > opt.PEMin) || !finite(opt.PHMin+opt.PHMax+opt.PEMin+opt.PEMax) {
		return nil, fmt.Errorf("%w: empty pH or pe window", ErrRedoxInput)
	}
	T := opt.TempC + 273.15
	d := &PEPHDiagram{TempC: opt.TempC, PHMin: opt.PHMin, PHMax: opt.PHMax, PEMin: opt.PEMin, PEMax: opt.PEMax}
	fe := db.ComponentIndex("Fe2+")
	if fe < 0 {
		return nil, fmt.Errorf("%w: no Fe2+ component", ErrRedoxInput)
	}
	// linear part of sum nu log a over H+ and e- (H2O activity 1)
	hpe := func(terms []Term) lin {
		var f lin
		for _, t := range terms {
			switch t.Index {
			case db.hplus:
				f.ph -= t.Nu
			case db.electron:
				f.pe -= t.Nu
			}
		}
		return f
	}
	allowed := func(terms []Term, extra ...int) bool {
		for _, t := range terms {
			ok := t.Index == db.water || t.Index == db.hplus || t.Index == db.electron
			for _, e := range extra {
				ok = ok || t.Index == e
			}
			if !ok {
				return false
			}
		}
		return true
	}
	lfe := math.Log10(opt.FeTotal)
	// Aqueous iron: one Fe, only H+, e-, H2O besides.
	for si := range db.species {
		sp := &db.species[si]
		if nuOf(sp.Terms, fe) != 1 || !allowed(sp.Terms, fe) {
			continue
		}
		// log a(X) = K + la(Fe2+) + hpe = lfe  =>  la(Fe2+) = lfe - K - hpe
		h := hpe(sp.Terms)
		d.cands = append(d.cands, candidate{name: sp.Name, base: lin{lfe - sp.LogK.At(T), -h.ph, -h.pe}})
	}
	// Ligands.
	type lig struct {
		comp  int
		total float64
	}
	var ligs []lig
	if opt.STotal > 0 {
		if c := db.ComponentIndex("SO4 2-"); c >= 0 {
			ligs = append(ligs, lig{c, opt.STotal})
		}
	}
	if opt.CTotal > 0 && db.carbonate >= 0 {
		ligs = append(ligs, lig{db.carbonate, opt.CTotal})
	}
	for _, l := range ligs {
		var states []ligandState
		for si := range db.species {
			sp := &db.species[si]
			if nuOf(sp.Terms, l.comp) != 1 || !allowed(sp.Terms, l.comp) {
				continue
			}
			h := hpe(sp.Terms)
			states = append(states, ligandState{comp: l.comp, name: sp.Name, la: lin{math.Log10(l.total) - sp.LogK.At(T), -h.ph, -h.pe}})
		}
		d.ligands = append(d.ligands, states)
	}
	hasLig := func(c int) bool {
		for _, l := range ligs {
			if l.comp == c {
				return true
			}
		}
		return false
	}
	// Solids with Fe: the Fe(III) solid always; others when their ligands are given.
	for pi := range db.minerals {
		mn := &db.minerals[pi]
		nfe := nuOf(mn.Terms, fe)
		if mn.Gas || nfe <= 0 {
			continue
		}
		ok := mn.Name == opt.FeIIISolid
		lc := map[int]float64{}
		for _, t := range mn.Terms {
			switch t.Index {
			case fe, db.water, db.hplus, db.electron:
			default:
				if !hasLig(t.Index) {
					ok = false
				}
				lc[t.Index] = t.Nu / nfe
			}
		}
		if !ok && (len(lc) == 0 || mn.Name == "amorphous FeS") {
			continue // other Fe(III) solids and Fe(II) solids without ligands; one FeS is enough
		}
		if !ok && len(lc) > 0 {
			ok = true
			for c := range lc {
				ok = ok && hasLig(c)
			}
		}
		if !ok {
			continue
		}
		// nfe la(Fe2+) + hpe + sum nu_L la(L) = K
		h := hpe(mn.Terms)
		base := lin{mn.LogK.At(T) / nfe, -h.ph / nfe, -h.pe / nfe}
		d.cands = append(d.cands, candidate{name: mn.Name, solid: true, base: base, ligand: lc})
	}
	if db.MineralIndex(opt.FeIIISolid) < 0 {
		return nil, fmt.Errorf("%w: unknown Fe(III) solid %q", ErrRedoxInput, opt.FeIIISolid)
	}
	d.Notes = []string{
		"activities taken equal to the totals (no activity coefficients, no complexes with other ligands)",
		fmt.Sprintf("total Fe %.3g, S %.3g, C %.3g mol/kgw; Fe(III) solid %s", opt.FeTotal, opt.STotal, opt.CTotal, opt.FeIIISolid),
		"solid-aqueous boundaries: solid in equilibrium with the total Fe as the predominant species",
	}
	d.build()
	d.waterLines(db, T)
	return d, nil
}

// evalAt returns the log a(Fe2+) function of candidate c given the ligand states
// chosen (one per ligand).
func (c *candidate) evalAt(states []ligandState) lin {
	f := c.base
	for _, st := range states {
		if nu, ok := c.ligand[st.comp]; ok {
			f = f.sub(lin{nu * st.la.c, nu * st.la.ph, nu * st.la.pe})
		}
	}
	return f
}

// build tiles the window: ligand sub-regions, then iron fields in each.
func (d *PEPHDiagram) build() {
	rect := []DiagramPoint{{d.PHMin, d.PEMin}, {d.PHMax, d.PEMin}, {d.PHMax, d.PEMax}, {d.PHMin, d.PEMax}}
	type region struct {
		poly   []DiagramPoint
		states []ligandState
	}
	regions := []region{{poly: rect}}
	for _, states := range d.ligands {
		var next []region
		for _, r := range regions {
			for i, st := range states {
				p := r.poly
				for j, other := range states {
					if j != i {
						// st predominates where it needs the lowest component activity
						p = clipHalf(p, st.la.sub(other.la))
					}
				}
				if area(p) > 1e-12 {
					next = append(next, region{p, append(append([]ligandState(nil), r.states...), st)})
				}
			}
		}
		regions = next
	}
	byName := map[string]int{}
	for _, r := range regions {
		fs := make([]lin, len(d.cands))
		for i := range d.cands {
			fs[i] = d.cands[i].evalAt(r.states)
		}
		for i, c := range d.cands {
			p := r.poly
			for j := range d.cands {
				if j != i {
					p = clipHalf(p, fs[i].sub(fs[j]))
				}
			}
			if area(p) <= 1e-12 {
				continue
			}
			k, ok := byName[c.name]
			if !ok {
				k = len(d.Fields)
				byName[c.name] = k
				d.Fields = append(d.Fields, PredominanceField{Name: c.name, Solid: c.solid})
			}
			d.Fields[k].Polygons = append(d.Fields[k].Polygons, p)
		}
	}
	sort.SliceStable(d.Fields, func(a, b int) bool { return d.Fields[a].Name < d.Fields[b].Name })
	// Boundaries: polygon edges with a different field just across (probed a little
	// outside the edge's midpoint), each kept from one side only.
	eps := 1e-6 * math.Max(d.PHMax-d.PHMin, d.PEMax-d.PEMin)
	solid := map[string]bool{}
	for _, f := range d.Fields {
		solid[f.Name] = f.Solid
	}
	for _, f := range d.Fields {
		for _, p := range f.Polygons {
			for i := range p {
				a, b := p[i], p[(i+1)%len(p)]
				mid := DiagramPoint{(a.PH + b.PH) / 2, (a.PE + b.PE) / 2}
				// outward normal of a counter-clockwise polygon: (dy, -dx)
				dx, dy := b.PH-a.PH, b.PE-a.PE
				n := math.Hypot(dx, dy)
				if n < eps {
					continue
				}
				probe := DiagramPoint{mid.PH + eps*dy/n, mid.PE - eps*dx/n}
				if probe.PH < d.PHMin || probe.PH > d.PHMax || probe.PE < d.PEMin || probe.PE > d.PEMax {
					continue
				}
				other := d.FieldAt(probe.PH, probe.PE)
				if other == "" || other == f.Name || other < f.Name {
					continue
				}
				d.Boundaries = append(d.Boundaries, DiagramSegment{A: a, B: b, Left: f.Name, Right: other,
					BetweenSolid: f.Solid || solid[other]})
			}
		}
	}
}

// FieldAt returns the name of the field at (pH, pe), or "" outside the window.
func (d *PEPHDiagram) FieldAt(pH, pe float64) string {
	if !(pH >= d.PHMin && pH <= d.PHMax && pe >= d.PEMin && pe <= d.PEMax) {
		return ""
	}
	p := DiagramPoint{pH, pe}
	states := make([]ligandState, 0, len(d.ligands))
	for _, sts := range d.ligands {
		best, bv := -1, math.Inf(1)
		for i, st := range sts {
			if v := st.la.at(p); v < bv {
				best, bv = i, v
			}
		}
		states = append(states, sts[best])
	}
	name, bv := "", math.Inf(1)
	for i := range d.cands {
		if v := d.cands[i].evalAt(states).at(p); v < bv {
			name, bv = d.cands[i].name, v
		}
	}
	return name
}

// waterLines draws the stability limits of water across the window.
func (d *PEPHDiagram) waterLines(db *Database, T float64) {
	d.WaterLower = [2]DiagramPoint{{d.PHMin, -d.PHMin}, {d.PHMax, -d.PHMax}}
	if db.o2gas < 0 {
		return
	}
	g := &db.minerals[db.o2gas]
	var nuH, nuE float64
	for _, t := range g.Terms {
		switch t.Index {
		case db.hplus:
			nuH = t.Nu
		case db.electron:
			nuE = t.Nu
		}
	}
	if nuE == 0 {
		return
	}
	// log p = nuH (-pH) + nuE (-pe) - log K = 0
	lk := g.LogK.At(T)
	pe := func(ph float64) float64 { return -(lk + nuH*ph) / nuE }
	d.WaterUpper = [2]DiagramPoint{{d.PHMin, pe(d.PHMin)}, {d.PHMax, pe(d.PHMax)}}
}

// clipHalf keeps the part of convex polygon p where f <= 0 (Sutherland-Hodgman with
// one edge).
func clipHalf(p []DiagramPoint, f lin) []DiagramPoint {
	if len(p) == 0 {
		return nil
	}
	var out []DiagramPoint
	for i := range p {
		a, b := p[i], p[(i+1)%len(p)]
		fa, fb := f.at(a), f.at(b)
		if fa <= 0 {
			out = append(out, a)
		}
		if (fa < 0 && fb > 0) || (fa > 0 && fb < 0) {
			t := fa / (fa - fb)
			out = append(out, DiagramPoint{a.PH + t*(b.PH-a.PH), a.PE + t*(b.PE-a.PE)})
		}
	}
	return out
}

// area is the signed area of polygon p (positive counter-clockwise).
func area(p []DiagramPoint) float64 {
	s := 0.0
	for i := range p {
		a, b := p[i], p[(i+1)%len(p)]
		s += a.PH*b.PE - b.PH*a.PE
	}
	return s / 2
}

// Area returns the area of the field in pH x pe units.
func (f *PredominanceField) Area() float64 {
	s := 0.0
	for _, p := range f.Polygons {
		s += area(p)
	}
	return s
}
