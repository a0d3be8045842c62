// Package uncertainty puts an interval around each saturation index: how far
// the SI of a mineral can move when the inputs of the speciation (pH,
// temperature, each concentration, non-detects) are as uncertain as field
// and laboratory data are.
//
// A Case is one water ready for the solver (a speciation.Water) with its
// uncertain Inputs; CaseOf builds one from an assessed record (package
// assess), with the defaults of Options: pH +/-0.05 when measured in the
// field and +/-0.1 when measured in the laboratory, temperature +/-0.5 C
// (+/-5 C when none was reported and 25 C was assumed), each concentration
// and the alkalinity +/-5 % of its value (per analyte overrides in
// Options.RelSDByAnalyte) (all common practice). Each "+/-" is a standard
// uncertainty, one standard deviation, in the sense of the Guide to the
// expression of uncertainty in measurement (JCGM 100:2008, from memory).
//
// # Non-detects
//
// A result below its detection limit is known only to lie between zero and
// the limit. It is drawn uniformly on that range (a rectangular
// distribution, JCGM 100:2008 section 4.3.7, from memory), with draws below
// NonDetectFloor (1e-3) times the limit raised to that floor, because a
// concentration of zero has no logarithm and would give an SI of minus
// infinity. Every mineral that contains the ion therefore has an interval
// that is open at the bottom: Interval.LowOpen is set, Interval.Low is only
// the value the calculation reached (not a bound; FormatLow prints
// "unbounded"), and such a mineral is never called supersaturated with
// confidence.
//
// # Two estimates
//
// Estimator.MonteCarlo draws every input at once, Options.Draws times
// (default 1000), solves each draw and reports the 2.5 and 97.5 percentiles
// of each SI (Options.Coverage 0.95; percentiles by linear interpolation
// between order statistics, type 7 of Hyndman & Fan 1996, Am. Stat. 50,
// 361-365, from memory). Inputs are drawn from normal distributions
// (Options.Dist Normal) or uniform ones of the same standard deviation
// (Uniform: half-width SD x sqrt 3); concentrations are kept above 1e-3 of
// their value and temperatures within the solver's 0-100 C. Draws use
// math/rand/v2's PCG seeded with (Options.Seed, Options.FirstStream + the
// record's position), so a result depends on the seed and the data only,
// not on the number of workers; seed and stream are reported with every
// result.
//
// Estimator.Linear is the fast estimate: the sensitivity of each SI to each
// input by central finite differences (pH step 0.01, temperature 0.1 C,
// concentrations 0.1 % of their value), combined in quadrature, SD(SI) =
// sqrt(sum (dSI/dx_i SD_i)^2), and the interval best -/+ z SD(SI) with z the
// normal quantile of the coverage (1.96). A non-detect adds, at the top, the
// rise of the SI from the substituted value to the limit itself, and opens
// the bottom. The linear estimate needs two solves per input instead of a
// thousand. It agrees with Monte Carlo when the SI is close to linear in
// its inputs over their spread (an SI is nearly linear in pH and in the
// logarithm of each concentration, and 5 % is a small step in the
// logarithm); tests compare the two.
//
// # Verdict
//
// With the analytical uncertainty inside the interval, the verdict only
// needs a small band for what the interval leaves out, the uncertainty of
// the equilibrium constants: Band, 0.1 by default, twice the +/-0.05 that
// Felmy, Rai & Moore (1990, J. Solution Chem.) give for the log K of
// baryte, the least certain of the common scale minerals (calcite +/-0.02,
// Plummer & Busenberg 1982; celestine +/-0.02, Felmy et al. 1990). Then:
//
//   - supersaturated: the interval lies above +Band (Low > Band) and is
//     closed at the bottom;
//   - undersaturated: the interval lies below -Band (High < -Band);
//   - indeterminate: anything else, the interval reaching into the band
//     [-Band, +Band] (it contains SI = 0 or comes within Band of it) or
//     open at the bottom with its top above -Band.
//
// This Band is not assess.NearEquilibriumBand (0.5), which is for a single
// SI without an interval and so must also hold the analytical uncertainty.
//
// Results are for screening, not a design: defer to local codes and
// licensed professionals.
package uncertainty
