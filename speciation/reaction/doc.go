// Package reaction plans the chemistry of injecting one water into another: mixing,
// heating and cooling, precipitation to equilibrium, the order in which minerals
// saturate as a reagent is added, and a screen of how fast the precipitate could fill
// the pore space around a well. It builds on package speciation and does no I/O.
//
// # Conserved content
//
// A Reactor (New) holds a speciation solver for one database and activity model. A
// water is first speciated as it was given (Reactor.Prepare: measured pH with
// alkalinity or total inorganic carbon) and reduced to a Solution: the component totals
// per kg of water (CO3 2- is total inorganic carbon, computed from the alkalinity when
// that was measured) and the total alkalinity. Both are conserved quantities: mixing by
// mass of water averages them exactly (MixSolutions), heating changes neither, and a
// precipitate removes its own stoichiometry (alkalinity included: 2 eq per mol of
// CaCO3). Every changed water is re-solved as a closed system at its temperature; its
// pH is set by Reactor.PH: by default (ConserveAlkalinity) the pH at which the water
// has its conserved alkalinity and carbon, which keeps the measured pH of an unmixed
// end-member even when its laboratory charge balance is off; ChargeBalance puts H+ on
// electroneutrality with carbon conserved (the same answer for a balanced water);
// HoldPH keeps the pH (a pH-controlled vessel, or databases without proton-bearing
// species).
//
// # Mixing
//
// Reactor.Mix mixes two prepared waters at a fraction f of the second (by mass of
// water) and a target temperature (MixTempC gives the heat-balance temperature, the
// mass-weighted mean). Reactor.Sweep runs a list of fractions (DefaultFractions: 0 to
// 1 by 0.05), each at its heat-balance temperature or at one fixed temperature such as
// the aquifer's, and returns a Sweep: saturation indices per mineral per point, with
// Sweep.Maxima giving each mineral's peak. Reactor.TemperatureSweep heats or cools one
// water (DefaultTemperatures: 10 to 90 C).
//
// # Precipitation
//
// Reactor.Equilibrate precipitates a set of candidate minerals to equilibrium with an
// active set: it adds the most supersaturated candidate, solves the amounts of all the
// minerals in the set simultaneously (SI = 0 each, through speciation's
// Water.Equilibrate), drops a mineral whose amount would turn negative, and repeats
// until no candidate is supersaturated. Reactor.Precipitate reports each supersaturated
// candidate alone and all together (Equilibrium: amounts in mmol/kgw and mg/L, and the
// water left), and the calcium carbonate precipitation potential CCPP of Standard
// Methods 2330 (Reactor.CCPP). ScaleMinerals is a default candidate list.
//
// # Sequence
//
// Reactor.Sequence adds a Reagent (a salt, ParseSalt("2 Na+ + SO4 2-"), or another
// water) step by step and returns a SequenceResult: the Onsets in order (amount added
// when each mineral reaches SI = 0, located by bisection), the fraction of each earlier
// mineral's cation still dissolved at each later onset (the earlier minerals having
// precipitated to equilibrium meanwhile), and whether the separation is clean.
//
// # Clogging
//
// Clogging turns precipitated amounts per cubic metre of injectate (SolidsPerM3) into a
// volume of solids (densities from the data file, each citing its handbook) and the
// fraction of the pore space it would fill within a radius of the screen, per year, and
// the radius within which a given fraction would be filled. It is an upper-bound
// screen: CloggingResult.Caution says so and must be shown with the numbers.
//
// # Errors
//
// Bad arguments return an *InputError (field, value) wrapping ErrFraction, ErrNegative,
// ErrPorosity, ErrTemperature (speciation's sentinel), ErrUnknownMineral,
// ErrMissingData, ErrReagent or ErrInput; failed chemistry returns a *SolveError
// wrapping the speciation error or ErrNoSolution. Nothing returned is NaN or Inf.
//
// All results are for screening, not a design: defer to local codes and licensed
// professionals for injection, well design or drinking-water decisions.
package reaction
