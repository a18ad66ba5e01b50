package analysis

import (
	"fmt"
	"strings"

	"enthalpath/thermo/gibbs"
	"enthalpath/thermo/notation"
)

// HeatCapacity is a species' NASA Glenn polynomials in a Thermo: the chain
// of the species Key (formula and state at 298.15 K) and the moles of it in
// one formula unit of the Thermo (2 for Cl in Cl₂: ½; 1 for a compound).
type HeatCapacity struct {
	Key   string
	Moles float64
	Chain gibbs.Chain
}

// heatCapacity returns the polynomials of the species key ("CaCO3(cr)",
// "CO2(g)") for moles of it per formula unit; nil when the table has none.
func (a *Analyst) heatCapacity(key string, moles float64) *HeatCapacity {
	t, err := a.db.HeatCapacities()
	if err != nil {
		return nil
	}
	ivs, ok, err := t.Species(key)
	if err != nil || !ok || len(ivs) == 0 {
		return nil
	}
	chain := make(gibbs.Chain, len(ivs))
	for i, iv := range ivs {
		chain[i] = gibbs.Polynomial{TLow: iv.TLow, THigh: iv.THigh, A: iv.A, B1: iv.B1, B2: iv.B2}
	}
	return &HeatCapacity{Key: key, Moles: moles, Chain: chain}
}

// elementHeatCapacity returns the polynomials of the element's standard
// state for atoms atoms of it ("Cl2(g)" for 2 Cl: one mole).
func (a *Analyst) elementHeatCapacity(symbol string, atoms int) *HeatCapacity {
	el, err := a.db.Element(symbol)
	if err != nil || el.StandardState == "" {
		return nil
	}
	formula, rest, _ := strings.Cut(el.StandardState, "(")
	state := map[byte]string{'s': "cr", 'l': "l", 'g': "g"}[rest[0]]
	f, err := notation.ParseFormula(formula)
	if err != nil || state == "" {
		return nil
	}
	n := f.Composition()[symbol]
	if n == 0 {
		return nil
	}
	return a.heatCapacity(formula+"("+state+")", float64(atoms)/float64(n))
}

// attachHeatCapacities gives r's ΔrG(T) the heat capacities when every
// species has polynomials, and says which species lack them otherwise.
func (r *Reaction) attachHeatCapacities() {
	var species []gibbs.Species
	var with, without []string
	for _, side := range []struct {
		terms []Term
		sign  float64
	}{{r.Reactants, -1}, {r.Products, 1}} {
		for _, tm := range side.terms {
			hc := tm.Thermo.HeatCapacity
			if hc == nil {
				name := tm.Thermo.Formula
				if !tm.Thermo.Formation.Measured {
					name += " (an estimate)"
				}
				without = append(without, name)
				continue
			}
			with = append(with, hc.Key)
			species = append(species, gibbs.NewSpecies(side.sign*tm.Coefficient*hc.Moles, hc.Chain))
		}
	}
	if len(without) > 0 {
		r.HeatCapacityMissing = without
		return
	}
	r.Standard.HeatCapacity = species
	r.HeatCapacitySpecies = with
}

// HeatCapacityBasis says how ΔrG(T) of r treats the heat capacities.
func (r Reaction) HeatCapacityBasis() string {
	if len(r.HeatCapacitySpecies) > 0 {
		return "from NASA Glenn polynomials of " + strings.Join(r.HeatCapacitySpecies, ", ")
	}
	if len(r.HeatCapacityMissing) > 0 {
		return "neglected: no NASA Glenn polynomials for " + strings.Join(r.HeatCapacityMissing, ", ")
	}
	return "neglected"
}

// HeatCapacitySummary words how the analysis's reactions treat the heat
// capacities: "heat capacities neglected", "heat capacities from NASA
// Glenn polynomials", or how many of the reactions include them.
func (st *Stability) HeatCapacitySummary() string {
	n := 0
	for _, r := range st.Reactions {
		if len(r.HeatCapacitySpecies) > 0 {
			n++
		}
	}
	switch {
	case n == 0:
		return "heat capacities neglected"
	case n == len(st.Reactions):
		return "heat capacities from NASA Glenn polynomials"
	}
	return fmt.Sprintf("heat capacities from NASA Glenn polynomials in %d of %d reactions", n, len(st.Reactions))
}

// heatCapacityNotes says which reactions include the heat capacities (one
// note each, naming the species) and, in one note, which neglect them and
// the species without polynomials.
func heatCapacityNotes(rs []Reaction) []string {
	var notes, missing []string
	neglected := 0
	seen := map[string]bool{}
	for _, r := range rs {
		if len(r.HeatCapacitySpecies) > 0 {
			notes = append(notes, r.Equation+": heat capacities "+r.HeatCapacityBasis())
			continue
		}
		neglected++
		for _, m := range r.HeatCapacityMissing {
			if !seen[m] {
				seen[m] = true
				missing = append(missing, m)
			}
		}
	}
	if neglected > 0 {
		what := "every reaction"
		if neglected < len(rs) {
			what = fmt.Sprintf("%d of %d reactions", neglected, len(rs))
		}
		notes = append(notes, fmt.Sprintf("heat capacities neglected in %s: no NASA Glenn polynomials for %s", what, strings.Join(missing, ", ")))
	}
	return notes
}
