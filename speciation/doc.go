// Package speciation computes the equilibrium distribution of dissolved species in a
// natural water, the activities of the species and the saturation state of the water
// with respect to minerals and CO2 gas.
//
// A Database (Default, or ParseDatabase for a data set in gwsat's own text format)
// holds Components (the basis the laboratory reports in, e.g. Ca+2, SO4-2, CO3-2 for
// total inorganic carbon), aqueous Species formed from them and Minerals (and gases)
// written as dissolution reactions, each with log K at 25 C and a temperature function
// (analytic or van 't Hoff). A Water gives temperature, pH and component totals in mol
// per kg of water, with optional alkalinity, charge-balance adjustment, components fixed
// by equilibrium with a mineral or gas, and minerals to equilibrate. A Solver, built for
// one database and one ActivityModel (Davies, TruesdellJones, Ideal, or any other
// implementation of the interface), solves the mass-action and balance equations by
// Newton-Raphson on the log activities of the components and the ionic strength, with an
// analytic Jacobian, and returns a Result: ionic strength, species molalities and
// activities, the distribution of each component, saturation indices (SI = log IAP -
// log K(T)), log pCO2, charge balance and the Langelier, Ryznar and Larson-Skold indices.
//
// # Conventions
//
//   - Concentrations are molal (mol/kgw); alkalinity is in eq/kgw; pH is -log10 a(H+).
//   - Temperatures from 0 to 100 C; outside that range Solve returns ErrTemperature.
//   - Neutral species get log10 gamma = 0.1 I in the Davies and Truesdell-Jones models
//     (NeutralSetschenow, common practice); water activity is taken as 1 by these models.
//   - Converged means every balance within a relative 1e-10 (Tolerance). A water that does
//     not converge gets a *SolveError with a reason; no result field is ever NaN or Inf.
//   - A solve above the model's MaxIonicStrength carries WarnIonicStrength.
//
// # Precipitation and dissolution
//
// Water.Equilibrate adds a mineral amount as an extra unknown (SI held at a target, the
// totals of its components changed by the amount); Result.Phases reports the amounts.
// Choosing which minerals may precipitate (an active set) is left to the caller: add the
// most supersaturated mineral, solve, drop any mineral whose amount would dissolve more
// than is present, repeat.
//
// Results are for screening; they are not a design. Defer to local codes and licensed
// professionals for well design, drinking water or injection decisions.
package speciation
