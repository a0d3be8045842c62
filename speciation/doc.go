// Package speciation computes the equilibrium distribution of dissolved species in a
// natural water, the activities of the species, and the saturation state of the water
// with respect to minerals and CO2 gas.
//
// A Database (Default for the embedded data set, Thermo, or ParseDatabase for any
// text in gwsat's own format, described at the top of speciation/thermo.txt) holds
// Components (read-only copies through Components, Species and Minerals), the basis
// the laboratory reports in (Ca2+, SO4 2-, CO3 2- for total inorganic
// carbon, H4SiO4 for silica, ...), aqueous Species formed from them, and Minerals (and
// gases) written as dissolution reactions, each with log K at 25 C, a temperature function
// (LogKFunc: analytic or van 't Hoff) and its published source. A Water gives temperature,
// pH and the component totals in mol per kg of water, with optional alkalinity, a
// charge-balance ion, components fixed by equilibrium with a mineral or gas, and minerals to
// equilibrate. A Solver, built for one database and one ActivityModel (Davies,
// TruesdellJones, Ideal, or any other implementation of the interface), solves the
// mass-action and balance equations and returns a Result: ionic strength, species
// molalities, activity coefficients and activities, the distribution of each component
// among its species, saturation indices (SI = log IAP - log K(T)), log pCO2, the charge
// balance after speciation and the Langelier, Ryznar and Larson-Skold indices (Indices).
//
// # The solver
//
// The unknowns are log10 of the activity of each component's free species, the ionic
// strength, and the amount of each mineral given to Water.Equilibrate. Each component has
// one constraint: its mass balance; an alkalinity balance (carbonate, when alkalinity is
// given); the charge balance (H+ with PHFromChargeBalance, or the ChargeBalanceIon); or
// equilibrium with a phase (FixByPhase). H+ is otherwise fixed by the pH. Newton-Raphson
// uses the analytic Jacobian, d m_s / d log a_j = ln10 nu_sj m_s, with the dependence of
// the activity coefficients on the ionic strength included through the ionic-strength
// unknown, a dense LU on the present components only, steps limited in log units and a
// backtracking line search. Continued-fraction sweeps over the balances (Gauss-Seidel,
// with the activity coefficients following the ionic strength, when pH, totals and
// alkalinity fix the water) give the starting point, or the previous solution when the
// water is close to it; failing starts are retried from other guesses. Converged means every balance within a relative 1e-10 (Tolerance). A water
// that cannot be solved, often because its constraints contradict each other (an
// alkalinity below the non-carbonate alkalinity at the given pH, a charge balance the chosen
// ion cannot close), returns a *SolveError with the reason; no result field is NaN or Inf.
//
// # Conventions
//
//   - Concentrations are molal (mol/kgw); alkalinity is in eq/kgw; pH is -log10 a(H+).
//   - Temperatures from 0 to 100 C; outside that range Solve returns ErrTemperature.
//   - Neutral species get log10 gamma = 0.1 I in the Davies and Truesdell-Jones models
//     (NeutralSetschenow, common practice); the activity of water is taken as 1 by these
//     models (an ActivityModel may return it, e.g. a future Pitzer model).
//   - Debye-Hueckel A and B come from the dielectric constant and density of water
//     (DebyeHuckelAB).
//   - A solve above the model's MaxIonicStrength carries WarnIonicStrength; away from
//     25 C, a log K without enthalpy in the data carries WarnNoEnthalpy.
//   - Results do not depend on the order of the components in the Water or the data file.
//
// # Precipitation and dissolution
//
// Water.Equilibrate adds a mineral amount as an extra unknown (SI held at a target, the
// totals of its components changed by the amount); Result.Phases reports the amounts
// (negative: precipitated). Choosing which minerals may precipitate (an active set) is
// left to the caller: add the most supersaturated mineral, solve, drop any mineral whose
// amount would dissolve more than is present, repeat.
//
// A Solver keeps scratch space, so SolveInto does not allocate in steady state; use one
// Solver per goroutine. Database is read-only and safe to share.
//
// Results are for screening; they are not a design. Defer to local codes and licensed
// professionals for well design, drinking water or injection decisions.
package speciation
