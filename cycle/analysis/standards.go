package analysis

import (
	"strings"

	"enthalpath/data"
)

// Standard is a species' measured standard data at 298.15 K and 1 bar.
type Standard struct {
	Formula, Name string
	// State is "cr", "l" or "g".
	State string
	// Molecular marks a compound known not to be ionic (TiCl₄, a molecular
	// liquid): its ionic estimate is never the real compound.
	Molecular bool
	// Formation ΔfH° and Gibbs ΔfG° in kJ/mol, Entropy S° in J/(mol·K);
	// a Value that is not Known is absent.
	Formation, Gibbs, Entropy data.Value
	// Source is the key of the citation of the values.
	Source string
}

// Standards gives measured standard data. New reads them from the data
// set; WithStandards replaces them (tests give their own, with the
// source of every number).
type Standards interface {
	// Compound returns the compound with this formula in the condensed
	// state the data take as its own at 298.15 K.
	Compound(formula string) (Standard, bool)
	// Gas returns a gaseous species ("CO2", "O2").
	Gas(formula string) (Standard, bool)
	// ElementEntropy returns S° of the element in its standard state per
	// mole of atoms (Cl: half of S°(Cl₂, g)).
	ElementEntropy(symbol string) (data.Value, bool)
}

// dbStandards reads the standard data of a *data.DB.
type dbStandards struct{ db *data.DB }

func (s dbStandards) Compound(formula string) (Standard, bool) {
	c, ok := s.db.FindCompound(formula)
	if !ok {
		return Standard{}, false
	}
	return Standard{Formula: c.Formula, Name: c.Name, State: "cr", Formation: c.Formation, Source: c.Formation.Source}, true
}

// Gas: the data hold no gaseous molecules yet.
func (s dbStandards) Gas(string) (Standard, bool) { return Standard{}, false }

// ElementEntropy: the data hold no standard entropies yet.
func (s dbStandards) ElementEntropy(string) (data.Value, bool) { return data.Value{}, false }

// stateWord names a state for a reader.
func stateWord(state string) string {
	switch {
	case state == "l":
		return "liquid"
	case state == "g":
		return "gas"
	case strings.HasPrefix(state, "cr"):
		return "solid"
	}
	return state
}
