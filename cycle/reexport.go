package cycle

import (
	"enthalpath/thermo/crystal"
	"enthalpath/thermo/lattice"
)

// The few names of thermo's physics that the front ends need as types or
// values, given here so that a front end imports the engine and never the
// physics (DEVELOPERS.md § Architecture: front ends may import thermo's
// vocabulary, not its physics packages).

// Character is a model's covalency verdict on the gap to the cycle.
type Character = lattice.Character

// The covalency verdicts (see lattice.Character).
const (
	Undetermined        = lattice.Undetermined
	IonicAdequate       = lattice.IonicAdequate
	SomeCovalent        = lattice.SomeCovalent
	SubstantialCovalent = lattice.SubstantialCovalent
	ModelOverbinds      = lattice.ModelOverbinds
)

// ExtendedTerms are the extended model's terms at one distance (see
// ExtendedBreakdown).
type ExtendedTerms = lattice.ExtendedTerms

// PrototypeNames lists the built-in structure prototypes.
func PrototypeNames() []string { return crystal.PrototypeNames() }

// CheckPrototype returns an error when name is not a built-in prototype.
func CheckPrototype(name string) error {
	_, err := crystal.LookupPrototype(name)
	return err
}

// CheckPrototypeParams returns an error when the prototype name cannot be
// built with the cell parameters params (Å, degrees, fractions).
func CheckPrototypeParams(name string, params map[string]float64) error {
	_, err := crystal.Build(name, params)
	return err
}
