// Package facies names the water type of a sample from its major ions: the
// share of each cation in the cation sum and of each anion in the anion
// sum, in milliequivalents, and a short name such as "Na-HCO3" or
// "Ca-Mg-HCO3".
//
// [Classify] takes an [Ions] value (meq/L of Ca2+, Mg2+, Na+, K+, HCO3-,
// CO3 2-, SO4 2- and Cl-; the caller converts from mg/L) and returns a
// [Facies]: the sums, the percentages, the largest cation and anion, and
// the type name. Na+ and K+ are counted together as "Na" and HCO3- and
// CO3 2- together as "HCO3", as on the Piper diagram.
//
// # Naming rule
//
// Cations and anions are named separately by the same rule. An ion that
// makes up more than 50 % of its sum (in meq) is dominant and named alone;
// otherwise the two largest are named, the larger first. The name is the
// cation part and the anion part joined by hyphens: "Na-Cl",
// "Ca-Mg-HCO3", "Na-HCO3-Cl", "Ca-Na-HCO3-SO4". The 50 % criterion is
// the dominance criterion of the hydrochemical-facies concept of Back
// (1966, USGS Professional Paper 498-A, from memory); the same 50 % lines
// divide the Piper (1944) triangles into the dominant-ion fields in common
// use. Naming the two largest ions when none dominates is common practice.
// An ion at exactly 50 % is not dominant. When two ions have the same
// share the one earlier in the order Ca, Mg, Na (cations) or HCO3, SO4, Cl
// (anions) is taken as the larger.
//
// The largest cation and anion are also reported on their own
// ([Facies.LargestCation], [Facies.LargestAnion]), for a two-word type
// ("sodium bicarbonate") as used in some published tables.
//
// Input with a negative or non-finite concentration, or a zero cation or
// anion sum, is rejected with [ErrInput]. The classification does not
// check the charge balance; do that before classifying.
package facies
