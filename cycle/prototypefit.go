package cycle

import (
	"slices"

	"enthalpath/thermo/crystal"
)

// PrototypeFits reports whether the built-in prototype name can hold c's
// ions: its sites must carry exactly the species M (cation) and X (anion),
// in the compound's cation-to-anion ratio. It returns a *PrototypeFitError
// when they do not (spinel, with sites A, B and X, for NaCl; rock salt,
// 1:1, for CaF2), the error of the prototype table for an unknown name.
func PrototypeFits(c *Cycle, name string) error {
	cell, err := crystal.Build(name, nil)
	if err != nil {
		return err
	}
	count := map[string]int{}
	for _, s := range cell.Sites {
		count[s.Species]++
	}
	var species []string
	for sp := range count {
		species = append(species, sp)
	}
	slices.Sort(species)
	m, x := count["M"], count["X"]
	e := &PrototypeFitError{Prototype: name, Formula: c.Formula, Species: species, Cations: m, Anions: x,
		WantCations: c.Cation.Count, WantAnions: c.Anion.Count}
	if len(count) != 2 || m == 0 || x == 0 {
		return e
	}
	if m*c.Anion.Count != x*c.Cation.Count {
		return e
	}
	return nil
}
