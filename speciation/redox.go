package speciation

import (
	"errors"
	"math"
)

// This file holds the redox scale: pe and Eh, where a pe comes from, and the checks
// of a solved pe against the stability of water.

// MaxAbsPE bounds the pe a Water may carry (natural waters lie within about -10 to
// +20; common practice).
const MaxAbsPE = 25.0

// Faraday is the Faraday constant in C/mol (CODATA 2018, exact: e N_A).
const Faraday = 96485.33212

// ErrRedoxInput is wrapped by the errors of the redox input functions.
var ErrRedoxInput = errors.New("speciation: invalid redox input")

// PESource says where the pe of a water came from, so a table row can record it.
type PESource int

// Sources of a pe.
const (
	PESourceNone  PESource = iota // no redox information
	PESourceGiven                 // pe given as such
	PESourceEh                    // Eh on the hydrogen scale
	PESourceORP                   // ORP against a named reference electrode, converted to Eh
	PESourceO2                    // dissolved oxygen, the O2(aq)/H2O couple
	PESourceFe                    // Fe(II)/Fe(III) couple
	PESourceN                     // NO3-/NH4+ couple
	PESourceS                     // SO4 2-/HS- couple
	PESourcePhase                 // equilibrium with a phase (Water.FixByPhase on e-)
)

var peSourceNames = [...]string{"none", "pe", "Eh", "ORP", "O2/H2O", "Fe(III)/Fe(II)", "NO3-/NH4+", "SO4 2-/HS-", "phase"}

// String returns a short name for a table column: "none", "pe", "Eh", "ORP",
// "O2/H2O", "Fe(III)/Fe(II)", "NO3-/NH4+", "SO4 2-/HS-", "phase".
func (s PESource) String() string {
	if s < 0 || int(s) >= len(peSourceNames) {
		return "unknown"
	}
	return peSourceNames[s]
}

// NernstSlopeV returns ln10 R T / F in volts at tempC: the change of Eh per pe unit
// (0.05916 V at 25 C), with R and F from CODATA 2018.
func NernstSlopeV(tempC float64) float64 {
	return math.Ln10 * gasConstant * (tempC + 273.15) / Faraday
}

// PEFromEhMV returns pe = F Eh / (ln10 R T) for an Eh in mV on the standard
// hydrogen scale (Stumm & Morgan 1996, Aquatic Chemistry, eq. 8.3; 59.16 mV per pe
// unit at 25 C).
func PEFromEhMV(ehMV, tempC float64) float64 {
	return ehMV / (1000 * NernstSlopeV(tempC))
}

// EhMVFromPE is the inverse of PEFromEhMV.
func EhMVFromPE(pe, tempC float64) float64 {
	return pe * 1000 * NernstSlopeV(tempC)
}

// redoxWarnings flags a pe outside the stability field of water: above it O2 would
// exceed 1 atm; below it H2 would (2 H+ + 2 e- = H2(g), log K = 0 by definition of
// the hydrogen scale, so log pH2 = -2 pH - 2 pe).
func (s *Solver) redoxWarnings(res *Result) {
	if res.HasLogPO2 && res.LogPO2 > 0 {
		res.Warnings = append(res.Warnings, WarnAboveWater)
	}
	if -2*res.PH-2*res.PE > 0 {
		res.Warnings = append(res.Warnings, WarnBelowWater)
	}
}
