package data

// The builder's rows of the atomic tables: sources, elements, atomic
// weights, ionization energies, electron affinities, atomization steps and
// Born exponents.

import (
	"strings"

	"enthalpath/thermo/notation"
)

func (b *builder) source(r record) error {
	key, err := r.requiredStr("key")
	if err != nil {
		return err
	}
	cit, err := r.requiredStr("citation")
	if err != nil {
		return err
	}
	if i, ok := b.db.sourceIdx[key]; ok {
		if !b.overlay {
			return r.errorf("key", "source %q listed twice", key)
		}
		b.db.sources[i].Citation = cit
		return nil
	}
	b.db.sourceIdx[key] = len(b.db.sources)
	b.db.sources = append(b.db.sources, Source{Key: key, Citation: cit})
	return nil
}

func (b *builder) element(r record) error {
	sym, err := r.requiredStr("symbol")
	if err != nil {
		return err
	}
	if !notation.IsElementSymbol(sym) {
		return r.errorf("symbol", "%q is not an element symbol", sym)
	}
	i, exists := b.db.elementIdx[sym]
	if exists && !b.overlay {
		return r.errorf("symbol", "element %s listed twice", sym)
	}
	if !exists {
		b.db.elementIdx[sym] = len(b.db.elements)
		b.db.elements = append(b.db.elements, Element{Symbol: sym, Z: notation.AtomicNumber(sym)})
		i = len(b.db.elements) - 1
	}
	e := &b.db.elements[i]
	if z, ok, err := r.integer("z"); err != nil {
		return err
	} else if ok {
		if z != notation.AtomicNumber(sym) {
			return r.errorf("z", "atomic number %d does not match %s (Z = %d)", z, sym, notation.AtomicNumber(sym))
		}
	}
	if r.has("name") {
		e.Name = r.str("name")
	}
	if r.has("standard_state") {
		e.StandardState = r.str("standard_state")
	}
	v, ok, err := b.value(r, "atomization_kj_per_mol", "atomization_uncertainty", "source", "atomization", "kJ/mol")
	if err != nil {
		return err
	}
	if ok {
		if v.V < 0 {
			return r.errorf("atomization_kj_per_mol", "atomization enthalpy %g is negative", v.V)
		}
		b.set(&e.Atomization, v)
	} else if !exists && !b.overlay {
		return r.errorf("atomization_kj_per_mol", "missing value")
	}
	s, ok, err := b.value(r, "standard_entropy_j_per_mol_k", "", "entropy_source", "entropy", "J/(mol·K)")
	if err != nil {
		return err
	}
	if ok {
		s.Locator = r.str("entropy_locator")
		b.set(&e.StandardEntropy, s)
	}
	return nil
}

func (b *builder) elementFor(r record, field string) (*Element, error) {
	sym, err := r.requiredStr(field)
	if err != nil {
		return nil, err
	}
	i, ok := b.db.elementIdx[sym]
	if !ok {
		return nil, r.errorf(field, "element %q is not in the element table (add an element row first)", sym)
	}
	return &b.db.elements[i], nil
}

func (b *builder) atomicWeight(r record) error {
	e, err := b.elementFor(r, "symbol")
	if err != nil {
		return err
	}
	v, ok, err := b.value(r, "atomic_weight", "uncertainty", "source", "atomic_weight", "g/mol")
	if err != nil {
		return err
	}
	if !ok {
		return r.errorf("atomic_weight", "missing value")
	}
	if !(v.V > 0) {
		return r.errorf("atomic_weight", "atomic weight %g g/mol is not positive", v.V)
	}
	if e.AtomicMass.Known() && !b.overlay {
		return r.errorf("symbol", "atomic weight of %s listed twice", e.Symbol)
	}
	b.set(&e.AtomicMass, v)
	return nil
}

func (b *builder) ionization(r record) error {
	e, err := b.elementFor(r, "symbol")
	if err != nil {
		return err
	}
	stage, err := r.requiredInt("stage")
	if err != nil {
		return err
	}
	v, ok, err := b.value(r, "energy_ev", "uncertainty_ev", "source", "energy", "eV")
	if err != nil {
		return err
	}
	if !ok {
		return r.errorf("energy_ev", "missing value")
	}
	if v.V <= 0 {
		return r.errorf("energy_ev", "ionization energy %g eV is not positive", v.V)
	}
	n := len(e.Ionization)
	switch {
	case stage >= 1 && stage <= n && b.overlay:
		b.set(&e.Ionization[stage-1], v)
	case stage == n+1:
		if b.overlay {
			v.Override = true
		}
		e.Ionization = append(e.Ionization, v)
	default:
		return r.errorf("stage", "stage %d for %s but %d stages are known: give stages in order 1, 2, 3 ...", stage, e.Symbol, n)
	}
	if stage > e.Z {
		return r.errorf("stage", "%s has only %d electrons", e.Symbol, e.Z)
	}
	return nil
}

func (b *builder) affinity(r record) error {
	e, err := b.elementFor(r, "symbol")
	if err != nil {
		return err
	}
	order, err := r.requiredInt("order")
	if err != nil {
		return err
	}
	v, ok, err := b.value(r, "affinity_ev", "uncertainty_ev", "source", "affinity", "eV")
	if err != nil {
		return err
	}
	if !ok {
		// Published in kJ/mol: converted once, here.
		v, ok, err = b.value(r, "affinity_kj_per_mol", "", "source", "affinity", "eV")
		if err != nil {
			return err
		}
		if !ok {
			return r.errorf("affinity_ev", "missing value (give affinity_ev or affinity_kj_per_mol)")
		}
		v.V /= kJPerMolPerEV
		if u, has, err := r.float("uncertainty_ev"); err != nil {
			return err
		} else if has {
			v.U = u
		}
	}
	switch order {
	case 1:
		b.set(&e.ElectronAffinity, v)
	case 2:
		b.set(&e.SecondAffinity, v)
	default:
		return r.errorf("order", "affinity order %d: only 1 and 2 are kept", order)
	}
	return nil
}

var stepKinds = []string{"vaporization", "sublimation", "dissociation"}

func (b *builder) step(r record) error {
	e, err := b.elementFor(r, "element")
	if err != nil {
		return err
	}
	order, err := r.requiredInt("order")
	if err != nil {
		return err
	}
	kind, err := r.requiredStr("kind")
	if err != nil {
		return err
	}
	if !contains(stepKinds, kind) {
		return r.errorf("kind", "%q is not one of %s", kind, strings.Join(stepKinds, ", "))
	}
	reaction, err := r.requiredStr("reaction")
	if err != nil {
		return err
	}
	atoms, err := r.requiredInt("atoms_produced")
	if err != nil {
		return err
	}
	if atoms < 1 {
		return r.errorf("atoms_produced", "%d: must be at least 1", atoms)
	}
	v, ok, err := b.value(r, "enthalpy_kj_per_mol", "uncertainty", "source", "enthalpy", "kJ/mol")
	if err != nil {
		return err
	}
	if !ok {
		return r.errorf("enthalpy_kj_per_mol", "missing value")
	}
	steps := b.db.steps[e.Symbol]
	st := AtomizationStep{Kind: kind, Reaction: reaction, AtomsProduced: atoms, Element: e.Symbol, Order: order}
	switch {
	case order >= 1 && order <= len(steps) && b.overlay:
		st.Enthalpy = steps[order-1].Enthalpy
		b.set(&st.Enthalpy, v)
		steps[order-1] = st
	case order == len(steps)+1:
		b.set(&st.Enthalpy, v)
		steps = append(steps, st)
	default:
		return r.errorf("order", "step %d for %s but %d steps are known: give steps in order", order, e.Symbol, len(steps))
	}
	b.db.steps[e.Symbol] = steps
	return nil
}

func (b *builder) bornExponent(r record) error {
	cfg, err := r.requiredStr("config")
	if err != nil {
		return err
	}
	v, ok, err := b.value(r, "exponent", "", "source", "exponent", "1")
	if err != nil {
		return err
	}
	if !ok {
		return r.errorf("exponent", "missing value")
	}
	if v.V <= 1 {
		return r.errorf("exponent", "Born exponent %g must exceed 1", v.V)
	}
	old, exists := b.db.born[cfg]
	if exists && !b.overlay {
		return r.errorf("config", "configuration %s listed twice", cfg)
	}
	b.set(&old, v)
	b.db.born[cfg] = old
	return nil
}
