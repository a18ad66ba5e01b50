package ewald

import (
	"errors"
	"fmt"
)

// ErrBadOptions reports an Options value that cannot be used.
var ErrBadOptions = errors.New("bad Ewald options")

// ErrNoIons reports a cell without both a cation and an anion, for which no
// Madelung constant is defined.
var ErrNoIons = errors.New("cell needs at least one cation and one anion")

// ErrTooLarge reports a cell whose sum would take more terms than Sum is
// willing to evaluate.
var ErrTooLarge = errors.New("cell too large for the Ewald sum")

// AccuracyError is returned beside a usable Result when the sum could not
// reach the requested relative accuracy; Result holds the best value
// computed, good to about Estimated.
type AccuracyError struct {
	// Crystal names the structure.
	Crystal string
	// Requested is the relative accuracy asked for.
	Requested float64
	// Estimated is the relative error the result is believed to have.
	Estimated float64
	// Reason says what limited the sum.
	Reason string
}

func (e *AccuracyError) Error() string {
	return fmt.Sprintf("Ewald sum of %q: requested relative accuracy %.3g not reached (estimated %.3g): %s",
		e.Crystal, e.Requested, e.Estimated, e.Reason)
}
