package reaction

import (
	"errors"
	"fmt"

	"gwsat.dev/gwsat/speciation"
)

// Sentinel errors. Every error returned for bad input is an *InputError wrapping one of
// these, so a caller can map them to exit codes with errors.Is.
var (
	// ErrFraction: a mixing fraction outside [0, 1] or not finite.
	ErrFraction = errors.New("reaction: mixing fraction outside 0-1")
	// ErrNegative: a rate, duration, length, radius or amount that is negative or not finite.
	ErrNegative = errors.New("reaction: value must be finite and not negative")
	// ErrPorosity: a porosity outside the open interval (0, 1).
	ErrPorosity = errors.New("reaction: porosity outside (0, 1)")
	// ErrUnknownMineral: a mineral that is not in the database (or is a gas).
	ErrUnknownMineral = errors.New("reaction: mineral not in the thermodynamic data")
	// ErrMissingData: a mineral without the molar mass or density the calculation needs.
	ErrMissingData = errors.New("reaction: mineral lacks molar mass or density in the data")
	// ErrReagent: a reagent that is empty, malformed or names an unknown component.
	ErrReagent = errors.New("reaction: invalid reagent")
	// ErrInput: any other invalid argument (empty list, no end-member, bad option).
	ErrInput = errors.New("reaction: invalid input")
	// ErrNoSolution: the closed-system pH or the precipitation could not be solved.
	ErrNoSolution = errors.New("reaction: no solution found")
)

// ErrTemperature is the speciation package's sentinel, re-exported: a temperature
// outside the supported range (speciation.MinTempC to speciation.MaxTempC).
var ErrTemperature = speciation.ErrTemperature

// InputError is a bad argument: which one (Field), its value as text, and why.
type InputError struct {
	Field string // e.g. "fractions[3]", "porosity", "minerals[1]"
	Value string
	Err   error // one of the sentinels above
}

func (e *InputError) Error() string {
	return fmt.Sprintf("%v: %s = %s", e.Err, e.Field, e.Value)
}

func (e *InputError) Unwrap() error { return e.Err }

func inputErr(sentinel error, field string, value any) error {
	return &InputError{Field: field, Value: fmt.Sprint(value), Err: sentinel}
}

// SolveError reports a chemistry step that failed (for example a mixture that the
// speciation solver could not converge): which step, and the underlying error
// (often a *speciation.SolveError).
type SolveError struct {
	Step string
	Err  error
}

func (e *SolveError) Error() string { return "reaction: " + e.Step + ": " + e.Err.Error() }

func (e *SolveError) Unwrap() error { return e.Err }
