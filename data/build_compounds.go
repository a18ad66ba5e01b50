package data

// The builder's rows of the substance tables: compounds, enthalpies of
// solution, species and other compilations' values (alternatives).

import (
	"errors"
	"strings"

	"enthalpath/thermo/notation"
)

// compoundStates are the phases a compound row may refer to.
var compoundStates = []string{"cr", "l", "g"}

func (b *builder) compound(r record) error {
	formula, err := r.requiredStr("formula")
	if err != nil {
		return err
	}
	if b.overlay {
		// Built-in formulas are checked by the data tests; their
		// composition keys are built on first use (DB.compositions).
		if _, ferr := notation.ParseFormula(formula); ferr != nil {
			return r.errorf("formula", "%v", ferr)
		}
	}
	i, exists := b.db.compoundIdx[formula]
	if exists && !b.overlay {
		return r.errorf("formula", "compound %s listed twice", formula)
	}
	if !exists {
		b.db.compoundIdx[formula] = len(b.db.compounds)
		b.db.compounds = append(b.db.compounds, Compound{Formula: formula})
		i = len(b.db.compounds) - 1
	}
	c := &b.db.compounds[i]
	for _, f := range [...]struct {
		field string
		dst   *string
	}{{"name", &c.Name}, {"family", &c.Family}, {"structure", &c.Structure}, {"note", &c.Note}, {"state", &c.State}, {"polymorph", &c.Polymorph}} {
		if v := r.str(f.field); v != "" {
			*f.dst = v
		}
	}
	for _, side := range []struct {
		ion, count string
		dstIon     *string
		dstCount   *int
	}{{"cation", "cation_count", &c.Cation, &c.CationCount}, {"anion", "anion_count", &c.Anion, &c.AnionCount}} {
		if r.has(side.ion) || !exists {
			if *side.dstIon, err = r.requiredStr(side.ion); err != nil {
				return err
			}
			if _, ok := b.db.ionIdx[*side.dstIon]; !ok {
				if err := b.problem(r.errorf(side.ion, "ion %q is not in the ion table", *side.dstIon)); err != nil {
					return err
				}
			}
		}
		if r.has(side.count) || !exists {
			if *side.dstCount, err = r.requiredInt(side.count); err != nil {
				return err
			}
			if *side.dstCount < 1 || *side.dstCount > notation.MaxCount {
				return r.errorf(side.count, "count %d must be between 1 and %d, as in a formula", *side.dstCount, notation.MaxCount)
			}
		}
	}
	if v, ok, err := b.value(r, "formation_kj_per_mol", "formation_uncertainty", "formation_source", "formation", "kJ/mol"); err != nil {
		return err
	} else if ok {
		b.set(&c.Formation, v)
	}
	if c.State != "" && !contains(compoundStates, c.State) {
		return r.errorf("state", "%q is not one of %s", c.State, strings.Join(compoundStates, ", "))
	}
	if r.has("molecular") {
		if c.Molecular, err = r.flag("molecular"); err != nil {
			return err
		}
	}
	if v, ok, err := b.value(r, "gibbs_kj_per_mol", "", "formation_source", "gibbs", "kJ/mol"); err != nil {
		return err
	} else if ok {
		b.set(&c.GibbsFormation, v)
	}
	if v, ok, err := b.value(r, "entropy_j_per_mol_k", "", "formation_source", "entropy", "J/(mol·K)"); err != nil {
		return err
	} else if ok {
		if v.V < 0 {
			return r.errorf("entropy_j_per_mol_k", "entropy %g of a pure substance is negative", v.V)
		}
		b.set(&c.Entropy, v)
	}
	if v, ok, err := b.value(r, "density_g_cm3", "", "density_source", "density", "g/cm3"); err != nil {
		return err
	} else if ok {
		if v.V <= 0 {
			return r.errorf("density_g_cm3", "density %g is not positive", v.V)
		}
		v.Locator = r.str("density_locator") // its own source's line, not the formation's
		b.set(&c.Density, v)
	}
	if v, ok, err := b.value(r, "lattice_kj_per_mol", "", "lattice_source", "lattice", "kJ/mol"); err != nil {
		return err
	} else if ok {
		conv := r.str("lattice_convention")
		if conv != "U" && conv != "dH" {
			return r.errorf("lattice_convention", "%q: give U (lattice energy) or dH (lattice enthalpy)", conv)
		}
		c.LatticeConvention = conv
		b.set(&c.HandbookLattice, v)
	}
	if r.has("params") {
		p, err := parseParams(r)
		if err != nil {
			return err
		}
		src := r.str("params_source")
		switch {
		case src == "" && b.overlay:
			src = userSource
		case src == "":
			if err := b.problem(r.errorf("params_source", "parameters without a source")); err != nil {
				return err
			}
		default:
			if _, ok := b.db.sourceIdx[src]; !ok && !(b.overlay && src == userSource) {
				if err := b.problem(r.errorf("params_source", "unknown source key %q", src)); err != nil {
					return err
				}
			}
		}
		c.Params, c.ParamsSource, c.ParamsOverride = p, src, b.overlay
		if c.ParamsMemory, err = r.memoryOf("params"); err != nil {
			return err
		}
	}
	return nil
}

// parseParams reads "a=5.64;c=3.2" into a map (notation.ParseAssignments).
func parseParams(r record) (map[string]float64, error) {
	out := map[string]float64{}
	if err := notation.ParseAssignments(r.str("params"), ";", out); err != nil {
		var ae *notation.AssignmentError
		if errors.As(err, &ae) && ae.Problem == notation.GivenTwice {
			return nil, r.errorf("params", "parameter %q given twice", ae.Name)
		}
		if errors.As(err, &ae) && ae.Problem == notation.NotANumber {
			return nil, r.errorf("params", "%q: %q is not a number", ae.Name, ae.Value)
		}
		return nil, r.errorf("params", "%q is not name=value", ae.Item)
	}
	return out, nil
}

// solutionEnthalpy reads one row of solution_enthalpies.csv: ΔsolH° of a
// tabulated compound at infinite dilution.
func (b *builder) solutionEnthalpy(r record) error {
	formula := r.str("formula")
	if _, ok := b.db.compoundIdx[formula]; !ok {
		return b.problem(r.errorf("formula", "%q is not a compound of the tables (write it as compounds.csv does)", formula))
	}
	v, ok, err := b.value(r, "solution_kj_per_mol", "uncertainty", "source", "solution", "kJ/mol")
	if err != nil {
		return err
	}
	if !ok {
		return r.errorf("solution_kj_per_mol", "missing value")
	}
	if _, dup := b.db.solutions.m[formula]; dup && !b.overlay {
		return r.errorf("formula", "enthalpy of solution of %s listed twice", formula)
	}
	old := b.db.solutions.m[formula]
	b.set(&old, v)
	b.db.solutions.m[formula] = old
	return nil
}

// species reads one row of species.csv: a substance with its state in the
// formula ("CO2(g)").
func (b *builder) species(r record) error {
	formula, err := r.requiredStr("formula")
	if err != nil {
		return err
	}
	if _, _, ok := splitState(formula); !ok {
		return r.errorf("formula", "%q: write the state in parentheses after the formula, as CO2(g), H2O(l) or NaCl(cr)", formula)
	}
	sp, exists := b.db.species.m[formula]
	if exists && !b.overlay {
		return r.errorf("formula", "species %s listed twice", formula)
	}
	sp.Formula = formula
	if r.has("name") {
		sp.Name = r.str("name")
	}
	v, ok, err := b.value(r, "formation_kj_per_mol", "formation_uncertainty", "source", "formation", "kJ/mol")
	if err != nil {
		return err
	}
	if ok {
		b.set(&sp.Formation, v)
	} else if !exists {
		return r.errorf("formation_kj_per_mol", "missing value")
	}
	if v, ok, err := b.value(r, "gibbs_kj_per_mol", "", "source", "gibbs", "kJ/mol"); err != nil {
		return err
	} else if ok {
		b.set(&sp.GibbsFormation, v)
	}
	if v, ok, err := b.value(r, "entropy_j_per_mol_k", "", "source", "entropy", "J/(mol·K)"); err != nil {
		return err
	} else if ok {
		b.set(&sp.Entropy, v)
	}
	b.db.species.m[formula] = sp
	return nil
}

// alternativeKinds are the values alternatives.csv can give other
// compilations' figures for, with the unit each is stored in.
var alternativeKinds = map[string]string{
	"compound_formation": "kJ/mol", // key: a formula of compounds.csv
	"atomization":        "kJ/mol", // key: an element symbol
	"ion_gas_formation":  "kJ/mol", // key: an ion symbol of ions.csv
	"species_formation":  "kJ/mol", // key: a formula of species.csv
}

// alternative reads one row of alternatives.csv: another compilation's
// value of a tabulated quantity, kept beside the preferred one.
func (b *builder) alternative(r record) error {
	kind, err := r.requiredStr("kind")
	if err != nil {
		return err
	}
	unit, ok := alternativeKinds[kind]
	if !ok {
		return r.errorf("kind", "%q is not one of %s", kind, strings.Join(sortedKeys(alternativeKinds), ", "))
	}
	key, err := r.requiredStr("key")
	if err != nil {
		return err
	}
	if kind == "species_formation" && b.db.species.deferred() && !b.overlay {
		// species.csv is read on first use, and this row with it
		// (speciesMap reads alternatives.csv again for its species rows).
		b.db.species.hasAlts = true
		return nil
	}
	v, ok, err := b.value(r, "value", "uncertainty", "source", "value", unit)
	if err != nil {
		return err
	}
	if !ok {
		return r.errorf("value", "missing value")
	}
	if b.overlay {
		v.Override = true
	}
	missing := func() error { return b.problem(r.errorf("key", "%s %q is not in its table", kind, key)) }
	switch kind {
	case "compound_formation":
		i, ok := b.db.compoundIdx[key]
		if !ok {
			return missing()
		}
		b.db.compounds[i].Alternatives = append(b.db.compounds[i].Alternatives, v)
	case "atomization":
		i, ok := b.db.elementIdx[key]
		if !ok {
			return missing()
		}
		b.db.elements[i].AtomizationAlternatives = append(b.db.elements[i].AtomizationAlternatives, v)
	case "ion_gas_formation":
		i, ok := b.db.ionIdx[key]
		if !ok {
			return missing()
		}
		b.db.ions[i].GasFormationAlternatives = append(b.db.ions[i].GasFormationAlternatives, v)
	case "species_formation":
		sp, ok := b.db.species.m[key]
		if !ok {
			return missing()
		}
		sp.Alternatives = append(sp.Alternatives, v)
		b.db.species.m[key] = sp
	}
	return nil
}
