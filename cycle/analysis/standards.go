package analysis

import (
	"strings"

	"enthalpath/data"
	"enthalpath/thermo/notation"
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
	state := c.State
	if state == "" {
		state = "cr"
	}
	name := c.Name
	if c.Polymorph != "" && !strings.Contains(name, c.Polymorph) {
		name += ", " + c.Polymorph
	}
	return Standard{Formula: c.Formula, Name: name, State: state, Molecular: c.Molecular,
		Formation: c.Formation, Gibbs: c.GibbsFormation, Entropy: c.Entropy, Source: c.Formation.Source}, true
}

func (s dbStandards) Gas(formula string) (Standard, bool) {
	sp, ok := s.db.Species(formula + "(g)")
	if !ok {
		return Standard{}, false
	}
	return Standard{Formula: formula, Name: sp.Name, State: "g", Formation: sp.Formation, Gibbs: sp.GibbsFormation,
		Entropy: sp.Entropy, Source: sp.Formation.Source}, true
}

// ElementEntropy divides the standard state's S° by its atoms (O2(g): 2).
func (s dbStandards) ElementEntropy(symbol string) (data.Value, bool) {
	el, err := s.db.Element(symbol)
	if err != nil || !el.StandardEntropy.Known() {
		return data.Value{}, false
	}
	v := el.StandardEntropy
	if f, err := notation.ParseFormula(strings.SplitN(el.StandardState, "(", 2)[0]); err == nil {
		if n := f.Composition()[el.Symbol]; n > 1 {
			v.V /= float64(n)
			v.U /= float64(n)
		}
	}
	return v, true
}

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
