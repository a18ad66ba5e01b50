package cycle_test

import (
	"fmt"

	"enthalpath/cycle"
	"enthalpath/data"
)

// Solve the NaCl cycle for its lattice step; Atkins' worked example gives
// ΔH_L = +787 kJ/mol for the dissociation (from memory).
func ExampleSolve() {
	db, err := data.Load()
	if err != nil {
		fmt.Println(err)
		return
	}
	c, err := cycle.Build(db, "NaCl", cycle.Options{})
	if err != nil {
		fmt.Println(err)
		return
	}
	r, err := cycle.Solve(c)
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Printf("%s: %.0f kJ/mol (%s)\n", r.Solved.Key, r.Solved.Value, r.Conventions.Lattice.Symbol())
	// Output: lattice: -787 kJ/mol (ΔH_L)
}

// Fill the lattice step of MgO from Born–Mayer and solve the O⁻ → O²⁻
// attachment enthalpy instead; textbooks put it at +750 to +850 kJ/mol
// (Housecroft & Sharpe, Inorganic Chemistry, from memory).
func ExampleSettings_latticeFrom() {
	db, _ := data.Load()
	c, _ := cycle.Build(db, "MgO", cycle.Options{})
	c.Settings.LatticeFrom = cycle.ModelBornMayer
	c.SolveFor("attachment-2")
	r, err := cycle.Solve(c)
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Printf("%s from %s within +750…+850 kJ/mol: %v\n", r.Solved.Key, c.Settings.LatticeFrom,
		r.Solved.Value > 750 && r.Solved.Value < 850)
	// Output: attachment-2 from born-mayer within +750…+850 kJ/mol: true
}
