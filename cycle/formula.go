package cycle

import (
	"errors"

	"enthalpath/thermo/notation"
)

// Reading a formula into element counts and top-level parts, and matching
// the counts to a cation and an anion.

// composition is a formula's element counts in order of first appearance.
type composition []notation.ElementCount

// of returns the count of sym, 0 when the formula has none.
func (c composition) of(sym string) int {
	for _, t := range c {
		if t.Symbol == sym {
			return t.Count
		}
	}
	return 0
}

// add returns c with n more atoms of sym.
func (c composition) add(sym string, n int) composition {
	for i := range c {
		if c[i].Symbol == sym {
			c[i].Count += n
			return c
		}
	}
	return append(c, notation.ElementCount{Symbol: sym, Count: n})
}

// parseBinary reads a neutral formula ("Al2O3", "MgCl", "Ba(N3)2",
// "Sr[N3]2") into its element counts in order of first appearance.
func parseBinary(f string) (composition, error) {
	comp, _, err := parseParts(f)
	return comp, err
}

// formulaPart is one top-level part of a formula: an element or a
// bracketed group (core "N3" of "Ba(N3)2"), with its count.
type formulaPart struct {
	core      string
	count     int
	bracketed bool
}

// errChargedFormula refuses an ion where a compound was asked for.
var errChargedFormula = errors.New("the formula carries a charge; a compound is neutral")

// parseParts reads formula f with the one formula reader
// (notation.ParseFormula: counts, nested (), [] and {}, subscript digits)
// into its element counts and its top-level parts. Its errors are
// *notation.FormulaError, or errChargedFormula.
func parseParts(f string) (composition, []formulaPart, error) {
	fm, err := notation.ParseFormula(f)
	if err != nil {
		return nil, nil, err
	}
	if fm.Charge != 0 {
		return nil, nil, errChargedFormula
	}
	parts := make([]formulaPart, len(fm.Groups))
	for i, g := range fm.Groups {
		parts[i] = formulaPart{core: g.Text, count: g.Count, bracketed: g.Bracketed}
	}
	return fm.Counts(), parts, nil
}

// coreComposition returns the atoms of one ion core ("N3" → N 3); a core
// that is no formula counts as one atom of itself.
func coreComposition(core string) composition {
	cc, err := parseBinary(core)
	if err != nil {
		return composition{{Symbol: core, Count: 1}}
	}
	return cc
}

// ionCounts finds how many cations a and anions b of the given cores make
// the formula's element counts comp, a polyatomic ion counting as the
// atoms of its core (BaO₂ of Ba²⁺ and O₂²⁻ is 1 and 1; Ba(N₃)₂ of Ba²⁺ and
// N₃⁻ is 1 and 2). It reports false when no whole a, b ≥ 1 do.
func ionCounts(comp composition, cation, anion string) (a, b int, ok bool) {
	cc, ac := coreComposition(cation), coreComposition(anion)
	first := cc[0]
	for a = 1; a*first.Count <= comp.of(first.Symbol); a++ {
		b = 0
		fits := true
		for _, t := range comp {
			rest := t.Count - a*cc.of(t.Symbol)
			per := ac.of(t.Symbol)
			switch {
			case rest < 0, per == 0 && rest != 0, per != 0 && rest%per != 0:
				fits = false
			case per != 0:
				if b == 0 {
					b = rest / per
				} else if rest/per != b {
					fits = false
				}
			}
			if !fits {
				break
			}
		}
		// Every element of both cores must be in the formula.
		for _, t := range ac {
			if comp.of(t.Symbol) == 0 {
				fits = false
			}
		}
		for _, t := range cc {
			if comp.of(t.Symbol) == 0 {
				fits = false
			}
		}
		if fits && b >= 1 {
			return a, b, true
		}
	}
	return 0, 0, false
}

// partText writes count n of an ion core in a formula: "Ba", "Cl2",
// "(N3)2", "O2" for one peroxide.
func partText(core string, n int) string {
	if n != 1 && len(coreComposition(core)) == 1 && coreComposition(core)[0].Count == 1 {
		return core + countText(n)
	}
	if n != 1 {
		return "(" + core + ")" + countText(n)
	}
	return core
}
