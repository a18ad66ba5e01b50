package cycle

import (
	"enthalpath/data"
)

// Options choose how Build makes a cycle.
type Options struct {
	// Cation and Anion, when set, are the ion symbols to use ("Mg+",
	// "Cl-"): needed for a formula whose ions the data cannot decide, or to
	// build a hypothetical compound with unusual charges.
	Cation, Anion string
	// Conventions the step values are built in (zero value: ΔH_L, 0 K).
	Conventions Conventions
	// Settings start from these (the compound's own structure is filled in
	// when Settings.Structure is empty).
	Settings Settings
	// Memo is the Madelung memo to use; nil makes a new one.
	Memo *Memo
}

// Build assembles the cycle of formula from db: the compound's ions (from
// its data row, or for a formula not tabulated from the ions the data know
// for its elements and Options), every step with its value, uncertainty and
// source, and the lattice step marked unknown. Errors: *CompoundError (the
// formula cannot be read or split into one cation and one anion, with
// suggestions), *ChargeError (no charges that balance). A missing datum is
// not an error here: its step has Source.Kind SourceMissing and Solve names it.
func Build(db *data.DB, formula string, opt Options) (*Cycle, error) {
	return build(db, formula, opt)
}
