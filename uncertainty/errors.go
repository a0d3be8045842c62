package uncertainty

import "errors"

var (
	// ErrOptions reports options that cannot be used.
	ErrOptions = errors.New("uncertainty: invalid options")
	// ErrNoResult reports a record with no speciation to put intervals on
	// (rejected, no pH, or a failed solve).
	ErrNoResult = errors.New("uncertainty: sample not speciated")
	// ErrDraws reports a Monte Carlo estimate in which too many draws failed
	// to solve, or a linear estimate whose shifted solve failed.
	ErrDraws = errors.New("uncertainty: the water with varied inputs could not be speciated")
)
