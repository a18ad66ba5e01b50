package data

// Lookups of elements: the element, its atomization steps, Born exponents.

import (
	"slices"
	"strings"
)

// Element returns the element with symbol sym (exact case; "na" or
// "sodium" finds Na too). Its Ionization slice is shared with the DB
// (capped, so appending copies): do not write to its elements. Elements
// returns deep copies.
func (db *DB) Element(sym string) (Element, error) {
	if i, ok := db.elementIdx[sym]; ok {
		return sharedElement(db.elements[i]), nil
	}
	s := strings.TrimSpace(sym)
	if i, ok := db.elementIdx[s]; ok {
		return sharedElement(db.elements[i]), nil
	}
	if i, ok := db.folds().elements[strings.ToLower(s)]; ok {
		return sharedElement(db.elements[i]), nil
	}
	return Element{}, &NotFoundError{Kind: "element", Query: sym, Suggestions: db.suggestElements(s)}
}

// Elements returns every element in order of atomic number.
func (db *DB) Elements() []Element {
	out := make([]Element, len(db.elements))
	for i, e := range db.elements {
		out[i] = copyElement(e)
	}
	slices.SortStableFunc(out, func(a, b Element) int { return a.Z - b.Z })
	return out
}

// AtomizationSteps returns the sub-steps that take element sym from its
// standard state to gaseous atoms, in order. For an element without
// tabulated sub-steps (a metal) it returns the one step "X(s) → X(g)" built
// from the element's atomization enthalpy (kind "sublimation", or
// "vaporization" for a liquid); for a monatomic gas, or an unknown symbol,
// it returns nil. The enthalpies of the steps sum to AtomsProduced of the
// last step times the element's atomization enthalpy.
func (db *DB) AtomizationSteps(sym string) []AtomizationStep {
	if s, ok := db.steps[sym]; ok {
		return slices.Clone(s)
	}
	i, ok := db.elementIdx[sym]
	if !ok {
		return nil
	}
	e := db.elements[i]
	if !e.Atomization.Known() || strings.HasSuffix(e.StandardState, "(g)") {
		return nil
	}
	kind, phase := "sublimation", "s"
	if strings.HasSuffix(e.StandardState, "(l)") {
		kind, phase = "vaporization", "l"
	}
	return []AtomizationStep{{
		Kind:          kind,
		Reaction:      sym + "(" + phase + ") → " + sym + "(g)",
		AtomsProduced: 1,
		Enthalpy:      e.Atomization,
		Element:       sym,
		Order:         1,
	}}
}

// BornExponent returns Pauling's Born exponent for a noble-gas configuration
// class ("He", "Ne", "Ar", "Kr", "Xe", and for d¹⁰ ions "[Ar]3d10",
// "[Kr]4d10", "[Xe]4f14 5d10"), spelled as in born_exponents.csv.
func (db *DB) BornExponent(config string) (Value, error) {
	if v, ok := db.born[config]; ok {
		return v, nil
	}
	return Value{}, &NotFoundError{Kind: "born exponent", Query: config, Suggestions: sortedKeys(db.born)}
}
