package analysis

import (
	"errors"
	"fmt"
)

// Sentinel errors; the typed errors below wrap them so errors.Is works.
var (
	// ErrBadCharges: a --charges text could not be read.
	ErrBadCharges = errors.New("bad charges")
	// ErrBadInput: an analysis was asked something it cannot answer from
	// its inputs (a missing value, an impossible combination).
	ErrBadInput = errors.New("bad analysis input")
	// ErrBadCSV: a batch input file could not be read.
	ErrBadCSV = errors.New("bad batch file")
)

// ChargesError reports a charges text that cannot be read; Column is the
// 1-based byte column of the fault.
type ChargesError struct {
	Text   string
	Column int
	Reason string
}

func (e *ChargesError) Error() string {
	return fmt.Sprintf("charges %q: %s at column %d (write SYMBOL=CHARGE pairs, e.g. Mg=+1,Cl=-1 or M=+2,X=-1)", e.Text, e.Reason, e.Column)
}

func (e *ChargesError) Unwrap() error { return ErrBadCharges }

// InputError reports an analysis input that cannot be used: Subject names
// it (a formula, an ion, a key), Field the part at fault (one of the
// Field… constants where a front end has its own way of giving it) and
// Key the step or ion that field concerns. The engine's words name no
// flag and no screen: each front end names its own (cycle/cli, the
// workshop's analyses screen).
type InputError struct {
	Subject, Field, Reason string
	Key                    string
	Err                    error
}

// The fields of an InputError that a front end gives in a way of its own.
const (
	FieldCharges     = "charges"        // the ions' charges of a hypothetical compound
	FieldStepValue   = "value of step"  // a value given to step Key
	FieldUnknownStep = "unknown step"   // the step Key marked to be solved
	FieldIon         = "ion"            // the ion Key a fit or a radius is for
	FieldMaxCharge   = "highest charge" // the highest metal charge a scan tries
	FieldScale       = "hydration scale"
	FieldLattice     = "lattice energy" // a lattice energy given by the user
)

func (e *InputError) Error() string {
	// An empty subject is said, not printed as nothing before a colon.
	msg := e.Subject
	if msg == "" {
		msg = "(empty)"
	}
	if e.Key != "" {
		msg = e.Key + " " + msg
	}
	if e.Field != "" {
		msg = e.Field + " " + msg
	}
	msg += ": " + e.Reason
	if e.Err != nil {
		msg += ": " + e.Err.Error()
	}
	return msg
}

func (e *InputError) Unwrap() []error {
	if e.Err != nil {
		return []error{ErrBadInput, e.Err}
	}
	return []error{ErrBadInput}
}

// CSVError reports a fault in a batch input file at a line and column
// (1-based; Column names the header of the column at fault).
type CSVError struct {
	Line   int
	Column string
	Reason string
	Err    error
}

func (e *CSVError) Error() string {
	msg := fmt.Sprintf("line %d", e.Line)
	if e.Column != "" {
		msg += fmt.Sprintf(", column %q", e.Column)
	}
	msg += ": " + e.Reason
	if e.Err != nil {
		msg += ": " + e.Err.Error()
	}
	return msg
}

func (e *CSVError) Unwrap() []error {
	if e.Err != nil {
		return []error{ErrBadCSV, e.Err}
	}
	return []error{ErrBadCSV}
}
