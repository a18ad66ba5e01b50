package cif

import (
	"errors"
	"fmt"
	"strings"

	"enthalpath/thermo/crystal"
)

// Error is a problem found in a CIF file. It names the file, the line and
// the data name (tag) at fault, and says what is wrong and, where it can,
// what to do about it. Err, when set, is one of the sentinel errors below
// (or crystal.ErrNotNeutral) so that callers can test the kind with
// errors.Is.
type Error struct {
	File string // file name as given to Parse or ParseFile
	Line int    // 1-based line number, 0 when the problem has no single line
	Tag  string // the CIF data name concerned, or empty
	Msg  string // what is wrong and what to do
	Err  error  // the kind of problem (a sentinel error), or nil
}

// Error formats the problem as "file:line: tag: message"; parts that are
// unknown are left out.
func (e *Error) Error() string {
	var b strings.Builder
	b.WriteString(e.File)
	if e.File == "" {
		b.WriteString("<cif>")
	}
	if e.Line > 0 {
		fmt.Fprintf(&b, ":%d", e.Line)
	}
	b.WriteString(": ")
	if e.Tag != "" {
		b.WriteString(e.Tag)
		b.WriteString(": ")
	}
	b.WriteString(e.Msg)
	return b.String()
}

// Unwrap returns the kind of problem.
func (e *Error) Unwrap() error { return e.Err }

// Kinds of problem carried by Error.Err.
var (
	// ErrSyntax is a file that does not follow the CIF 1.1 syntax.
	ErrSyntax = errors.New("CIF syntax error")
	// ErrMalformedLoop is a loop whose value count is not a multiple of its
	// tag count, or a loop without tags or values.
	ErrMalformedLoop = errors.New("malformed loop")
	// ErrMissingCell is a cell length or angle that is absent or unknown.
	ErrMissingCell = errors.New("missing cell data")
	// ErrBadValue is a value that cannot be read as what its tag needs.
	ErrBadValue = errors.New("unreadable value")
	// ErrBadSymop is a symmetry operation that cannot be read.
	ErrBadSymop = errors.New("unreadable symmetry operation")
	// ErrUnknownElement is a type symbol or label that names no element.
	ErrUnknownElement = errors.New("unknown element")
	// ErrMissingCharge is a site whose charge is given nowhere.
	ErrMissingCharge = errors.New("missing charge")
	// ErrNoSites is a block without atom sites.
	ErrNoSites = errors.New("no atom sites")
	// ErrCollision is two different atoms at the same position.
	ErrCollision = errors.New("two atoms at one position")
	// ErrNotNeutral is the crystal package's sentinel for a charged cell.
	ErrNotNeutral = crystal.ErrNotNeutral
)

// SymopError is a symmetry operation (an xyz string such as "-x+1/2, y, z")
// that cannot be read. Column is the 1-based position in Input of the
// character at fault.
type SymopError struct {
	Input  string
	Column int
	Msg    string
}

// Error formats the problem as `symmetry operation "…": message at column n`.
func (e *SymopError) Error() string {
	return fmt.Sprintf("symmetry operation %q: %s at column %d", e.Input, e.Msg, e.Column)
}

// Unwrap returns ErrBadSymop.
func (e *SymopError) Unwrap() error { return ErrBadSymop }
