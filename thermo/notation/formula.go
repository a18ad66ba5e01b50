package notation

import (
	"maps"
	"slices"
	"strconv"
	"strings"
)

// Formula is a parsed chemical formula: its top-level groups in the order
// written, and its charge (0 for a neutral formula).
type Formula struct {
	// Groups are the top-level parts: an element with its count, or a
	// bracketed group with its count ("Ca3(PO4)2" → Ca×3, (PO4)×2).
	Groups []Group
	// Charge in units of e.
	Charge int
}

// Group is one top-level part of a formula.
type Group struct {
	// Text is the part without its count, normalized: "Ca", "PO4", "OH".
	Text string
	// Count is the multiplier written after the part (1 if none).
	Count int
	// Bracketed is true for a part written in (), [] or {}.
	Bracketed bool
	// atoms holds one unit of a bracketed group; nil for a single element
	// (Text).
	atoms map[string]int
}

// Composition returns the atoms of one unit of the group.
func (g Group) Composition() map[string]int {
	if g.atoms == nil {
		return map[string]int{g.Text: 1}
	}
	return maps.Clone(g.atoms)
}

// Composition returns the number of atoms of each element.
func (f Formula) Composition() map[string]int {
	out := make(map[string]int, len(f.Groups))
	for _, g := range f.Groups {
		if g.atoms == nil {
			out[g.Text] += g.Count
			continue
		}
		for el, n := range g.atoms {
			out[el] += n * g.Count
		}
	}
	return out
}

// ElementCount is an element and its number of atoms.
type ElementCount struct {
	Symbol string
	Count  int
}

// Counts returns the atoms of each element in order of first appearance
// ("Ba(N3)2" → Ba 1, N 6; "NaCl" → Na 1, Cl 1), the order a reaction
// written from the formula keeps.
func (f Formula) Counts() []ElementCount {
	var out []ElementCount
	add := func(sym string, n int) {
		for i := range out {
			if out[i].Symbol == sym {
				out[i].Count += n
				return
			}
		}
		out = append(out, ElementCount{sym, n})
	}
	for _, g := range f.Groups {
		if g.atoms == nil {
			add(g.Text, g.Count)
			continue
		}
		for _, el := range symbolsIn(g.Text) {
			add(el, g.atoms[el]*g.Count)
		}
	}
	return out
}

// symbolsIn lists the distinct element symbols of a normalized group text
// ("(SO4)3Cl" → S, O, Cl) in order of first appearance.
func symbolsIn(text string) []string {
	var out []string
	for i := 0; i < len(text); i++ {
		if !isUpper(rune(text[i])) {
			continue
		}
		j := i + 1
		if j < len(text) && isLower(rune(text[j])) {
			j++
		}
		if sym := text[i:j]; !slices.Contains(out, sym) {
			out = append(out, sym)
		}
	}
	return out
}

// Atoms returns the number of atoms in the formula.
func (f Formula) Atoms() int {
	n := 0
	for _, c := range f.Composition() {
		n += c
	}
	return n
}

// Elements returns the element symbols in Hill order.
func (f Formula) Elements() []string { return hillOrder(f.Composition()) }

// String returns the formula as written, normalized: no spaces, brackets as
// parentheses, counts of 1 left out, the charge as in "Fe3+", "NH4+" or
// "SO4^2-".
func (f Formula) String() string {
	var b strings.Builder
	for _, g := range f.Groups {
		if g.Bracketed {
			b.WriteString("(" + g.Text + ")")
		} else {
			b.WriteString(g.Text)
		}
		if g.Count != 1 {
			b.WriteString(strconv.Itoa(g.Count))
		}
	}
	b.WriteString(f.chargeText(len(f.Groups) == 1 && !f.Groups[0].Bracketed, f.Groups[0].Count))
	return b.String()
}

// chargeText writes the charge so that it reads back the same: a single
// element with count 1 takes "3+"; a single element with a count takes a
// caret ("O2^-", "O2^2-") so the count is not read as the charge; anything
// else "+", "-" or "^2-".
func (f Formula) chargeText(singleElement bool, count int) string {
	switch {
	case f.Charge == 0:
		return ""
	case singleElement && count == 1:
		return ChargeSuffix(f.Charge, false)
	case singleElement:
		return CaretIonSymbol("", f.Charge)
	}
	return ChargeSuffix(f.Charge, true)
}

// Hill returns the formula in Hill order: C first, then H, then the other
// elements alphabetically (without C, all alphabetically), with the charge.
func (f Formula) Hill() string {
	comp := f.Composition()
	var b strings.Builder
	els := hillOrder(comp)
	for _, el := range els {
		b.WriteString(el)
		if comp[el] != 1 {
			b.WriteString(strconv.Itoa(comp[el]))
		}
	}
	if len(els) == 1 {
		b.WriteString(f.chargeText(true, comp[els[0]]))
	} else {
		b.WriteString(f.chargeText(false, 0))
	}
	return b.String()
}

func hillOrder(comp map[string]int) []string {
	els := slices.Sorted(maps.Keys(comp))
	if _, hasC := comp["C"]; !hasC {
		return els
	}
	out := []string{"C"}
	if _, hasH := comp["H"]; hasH {
		out = append(out, "H")
	}
	for _, el := range els {
		if el != "C" && el != "H" {
			out = append(out, el)
		}
	}
	return out
}
