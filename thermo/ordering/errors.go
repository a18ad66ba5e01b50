package ordering

import (
	"errors"
	"fmt"
)

// ErrSpec reports a mixed-site specification that cannot be used.
var ErrSpec = errors.New("bad site specification")

// SpecError says which site specification is wrong, and why.
type SpecError struct {
	// Match is the site selector of the specification (empty for the
	// whole problem).
	Match string
	// Reason says what is wrong.
	Reason string
}

func (e *SpecError) Error() string {
	if e.Match == "" {
		return "site orderings: " + e.Reason
	}
	return fmt.Sprintf("sites %q: %s", e.Match, e.Reason)
}

func (e *SpecError) Unwrap() error { return ErrSpec }
