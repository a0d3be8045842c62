// Package assess runs gwsat's per-sample workflow: each row read by package
// hydro is converted to molalities, checked for charge balance, and
// speciated by package speciation, on a pool of workers that keeps input
// order. Every input row comes out as exactly one Record with a final
// status (ok, warning, rejected) and the reasons for it.
//
// Results are screening results, not a design: defer to local codes and
// licensed professionals.
package assess
