package data

import (
	"fmt"
	"strings"

	"enthalpath/thermo/notation"
)

// NotFoundError is returned by a lookup that found nothing. Suggestions holds
// near matches (closest first), possibly none.
type NotFoundError struct {
	// Kind is "element", "ion", "compound", "radius", "source", "hydration"
	// or "born exponent".
	Kind        string
	Query       string
	Suggestions []string
	// Detail adds what was missing, e.g. "no CN VIII for Na+ (tabulated: IV, VI)".
	Detail string
}

func (e *NotFoundError) Error() string {
	var b strings.Builder
	fmt.Fprintf(&b, "no %s %s in the data", e.Kind, notation.QuoteInput(e.Query))
	if e.Detail != "" {
		b.WriteString(": ")
		b.WriteString(e.Detail)
	}
	if len(e.Suggestions) > 0 {
		b.WriteString("; did you mean ")
		b.WriteString(strings.Join(e.Suggestions, ", "))
		b.WriteString("?")
	}
	return b.String()
}

// TableError reports a bad row in a data table or overlay file: the file, the
// line, the field and what is wrong with it.
type TableError struct {
	// File is the table ("elements.csv") or overlay file name.
	File string
	// Line counts from 1; 0 when unknown.
	Line int
	// Column counts characters from 1 within the line, 0 when unknown
	// (TOML syntax errors give it).
	Column int
	// Field is the column or key at fault, or "" for the whole row.
	Field string
	Err   error
}

func (e *TableError) Error() string {
	var b strings.Builder
	b.WriteString(e.File)
	if e.Line > 0 {
		fmt.Fprintf(&b, " line %d", e.Line)
		if e.Column > 0 {
			fmt.Fprintf(&b, " column %d", e.Column)
		}
	}
	if e.Field != "" {
		fmt.Fprintf(&b, " field %q", e.Field)
	}
	b.WriteString(": ")
	b.WriteString(e.Err.Error())
	return b.String()
}

func (e *TableError) Unwrap() error { return e.Err }
