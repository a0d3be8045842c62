// Package inject is the injection planner's workflow: given the assessed rows of
// a lab file, it blends an injectate with a native water over a range of shares
// (Blend), warms or cools one water (Warm), computes how much of each scale
// mineral would deposit from a water or a blend (Deposit), adds a salt or a second
// water step by step to find which mineral saturates first (Dose), turns a deposit
// into an upper-bound pore-filling screen around a well (PoreFill), and composes
// the injection-planning section of a site report (Section).
//
// Each operation returns its numbers (from package speciation/reaction), its
// tables, its figure and the short summary the command prints, so that a Go
// program gets exactly what the command gives. A Planner is built once per set of
// assessed records: NewPlanner(db, model, recs).
//
// The chemistry: a water is speciated as measured; its component totals and total
// alkalinity are then conserved, mixing by mass of water averages them, heating
// changes neither, and a deposit removes its own stoichiometry. Every changed
// water is re-solved as a closed system at its temperature.
//
// These are screening results, not a design: defer to local codes and licensed
// professionals.
package inject
