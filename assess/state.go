package assess

// NearEquilibriumBand is the half-width of the band around SI = 0 within which a
// water is reported as near equilibrium: the uncertainty of analyses and
// thermodynamic data makes an SI of a few tenths indistinguishable from zero (a band
// of +/-0.2 to +/-0.5 is common practice, depending on data quality; gwsat uses 0.5,
// suited to routine field data).
const NearEquilibriumBand = 0.5

// Saturation states in words.
const (
	Supersaturated  = "supersaturated"
	Undersaturated  = "undersaturated"
	NearEquilibrium = "near equilibrium"
)

// State words a saturation index with the near-equilibrium band: supersaturated
// (the water tends to deposit the mineral), undersaturated (it tends to dissolve
// it) or near equilibrium.
func State(si float64) string {
	switch {
	case si > NearEquilibriumBand:
		return Supersaturated
	case si < -NearEquilibriumBand:
		return Undersaturated
	}
	return NearEquilibrium
}
