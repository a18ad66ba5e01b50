package data

import (
	"fmt"
	"math"
	"slices"
	"sort"
	"strconv"
	"strings"

	"enthalpath/thermo/notation"
)

// builder applies table rows to a DB under construction. With overlay set,
// a row whose key exists replaces the fields it gives (marking each replaced
// value Override with the old value in Replaced); other rows are added.
type builder struct {
	db      *DB
	overlay bool
}

// userSource is the source key of an overlay value that names none.
const userSource = "user"

func (b *builder) apply(table string, r record) error {
	switch table {
	case "sources.csv":
		return b.source(r)
	case "elements.csv":
		return b.element(r)
	case "atomic_weights.csv":
		return b.atomicWeight(r)
	case "ionization.csv":
		return b.ionization(r)
	case "affinity.csv":
		return b.affinity(r)
	case "atomization_steps.csv":
		return b.step(r)
	case "born_exponents.csv":
		return b.bornExponent(r)
	case "ions.csv":
		return b.ion(r)
	case "shannon.csv":
		return b.shannon(r)
	case "ion_values.csv":
		return b.ionValue(r)
	case "compounds.csv":
		return b.compound(r)
	case "solution_enthalpies.csv":
		return b.solutionEnthalpy(r)
	case "species.csv":
		return b.species(r)
	case "alternatives.csv":
		return b.alternative(r)
	case AnionRadiiFile:
		return b.anionRadius(r)
	case DerivedIonsFile:
		return b.derivedIon(r)
	}
	return fmt.Errorf("unknown table %q", table)
}

// reserve sizes the DB's slices and maps for n rows of table: the
// compound records are large, and growing their slice row by row copies
// them again and again.
func (b *builder) reserve(table string, n int) {
	switch table {
	case "compounds.csv":
		b.db.compounds = slices.Grow(b.db.compounds, n)
		if len(b.db.compoundIdx) == 0 {
			b.db.compoundIdx = make(map[string]int, n)
		}
	}
}

// problem records an inconsistency of the built-in tables that does not stop
// loading (an unknown source key, a compound naming a missing ion); tests
// require DB.Problems to be empty. In an overlay the same is an error.
func (b *builder) problem(e *TableError) error {
	if b.overlay {
		return e
	}
	b.db.problems = append(b.db.problems, e.Error())
	return nil
}

// value reads one sourced value from r. present is false when the value
// cell is empty.
func (b *builder) value(r record, field, uncField, srcField, memName, unit string) (v Value, present bool, err error) {
	x, ok, err := r.float(field)
	if err != nil || !ok {
		return Value{}, false, err
	}
	v = Value{V: x, Unit: unit, Note: r.str("note"), Locator: r.str("locator")}
	if uncField != "" {
		u, ok, err := r.float(uncField)
		if err != nil {
			return Value{}, false, err
		}
		if ok {
			if u < 0 {
				return Value{}, false, r.errorf(uncField, "uncertainty %g is negative", u)
			}
			v.U = u
		}
	}
	v.Source = r.str(srcField)
	switch {
	case v.Source == "" && b.overlay:
		v.Source = userSource
	case v.Source == "":
		if err := b.problem(r.errorf(srcField, "value without a source")); err != nil {
			return Value{}, false, err
		}
	case v.Source != userSource || !b.overlay:
		if _, known := b.db.sourceIdx[v.Source]; !known {
			e := r.errorf(srcField, "unknown source key %q (add it to sources.csv or a [[source]] table)", v.Source)
			if err := b.problem(e); err != nil {
				return Value{}, false, err
			}
		}
	}
	if v.Memory, err = r.memoryOf(memName); err != nil {
		return Value{}, false, err
	}
	if _, has := r.get("derived"); has {
		if v.Derived, err = r.flag("derived"); err != nil {
			return Value{}, false, err
		}
	}
	return v, true, nil
}

// set stores nv in *dst; in an overlay it marks nv as the user's and keeps
// the built-in value it replaces.
func (b *builder) set(dst *Value, nv Value) {
	if b.overlay {
		nv.Override = true
		if dst.Known() {
			old := *dst
			nv.Replaced = &old
		}
	}
	*dst = nv
}

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

var ionShapes = []string{"monatomic", "linear", "nonlinear"}

func (b *builder) ion(r record) error {
	sym, err := r.requiredStr("symbol")
	if err != nil {
		return err
	}
	i, exists := b.db.ionIdx[sym]
	if exists && !b.overlay {
		return r.errorf("symbol", "ion %s listed twice", sym)
	}
	if !exists {
		b.db.ionIdx[sym] = len(b.db.ions)
		b.db.ions = append(b.db.ions, Ion{Symbol: sym})
		i = len(b.db.ions) - 1
	}
	ion := &b.db.ions[i]
	if r.has("core") || !exists {
		if ion.Core, err = r.requiredStr("core"); err != nil {
			return err
		}
		if _, ferr := notation.ParseFormula(ion.Core); ferr != nil {
			return r.errorf("core", "%v", ferr)
		}
	}
	if r.has("charge") || !exists {
		if ion.Charge, err = r.requiredInt("charge"); err != nil {
			return err
		}
		if ion.Charge == 0 {
			return r.errorf("charge", "an ion needs a non-zero charge")
		}
	}
	if r.has("polyatomic") {
		if ion.Polyatomic, err = r.flag("polyatomic"); err != nil {
			return err
		}
	}
	if r.has("shape") || !exists {
		shape := r.str("shape")
		if shape == "" {
			shape = "monatomic"
			if ion.Polyatomic {
				return r.errorf("shape", "missing value (linear or nonlinear for a polyatomic ion)")
			}
		}
		if !contains(ionShapes, shape) {
			return r.errorf("shape", "%q is not one of %s", shape, strings.Join(ionShapes, ", "))
		}
		ion.Shape = shape
	}
	if r.has("born_config") {
		cfg := r.str("born_config")
		if _, ok := b.db.born[cfg]; !ok {
			return r.errorf("born_config", "%q is not a Born exponent class (%s)", cfg, strings.Join(sortedKeys(b.db.born), ", "))
		}
		ion.BornConfig = cfg
	}
	if r.has("note") {
		ion.Note = r.str("note")
	}
	return nil
}

func (b *builder) shannon(r record) error {
	core, err := r.requiredStr("core")
	if err != nil {
		return err
	}
	charge, err := r.requiredInt("charge")
	if err != nil {
		return err
	}
	cn, err := r.requiredStr("cn")
	if err != nil {
		return err
	}
	n, ok := romanCN(cn)
	if !ok {
		return r.errorf("cn", "%q is not a coordination number as Shannon writes it (II … XIV, IVSQ, IVPY)", cn)
	}
	spin := r.str("spin")
	if spin != "" && spin != "HS" && spin != "LS" {
		return r.errorf("spin", "%q is not HS, LS or empty", spin)
	}
	cr, okC, err := b.value(r, "crystal_radius", "", "source", "crystal_radius", "Å")
	if err != nil {
		return err
	}
	ir, okI, err := b.value(r, "ionic_radius", "", "source", "ionic_radius", "Å")
	if err != nil {
		return err
	}
	k := ionKey{core, charge}
	list := b.db.radii[k]
	for j := range list {
		if list[j].CN == cn && list[j].Spin == spin {
			if !b.overlay {
				return r.errorf("cn", "%s%s CN %s %s listed twice", core, notation.ChargeSuffix(charge, false), cn, spin)
			}
			if okC {
				b.set(&list[j].Crystal, cr)
			}
			if okI {
				b.set(&list[j].Ionic, ir)
			}
			return nil
		}
	}
	if !okI {
		return r.errorf("ionic_radius", "missing value")
	}
	sr := ShannonRadius{CN: cn, Coordination: n, Spin: spin, Core: core, Charge: charge}
	b.set(&sr.Ionic, ir)
	if okC {
		b.set(&sr.Crystal, cr)
	}
	b.db.radii[k] = append(list, sr)
	return nil
}

// rowIon returns the ion a row's "ion" column names. An ion missing from
// the ion table is a problem of that row (b.problem decides whether it
// stops the load); found is false then and err what b.problem returned.
func (b *builder) rowIon(r record) (ion *Ion, found bool, err error) {
	sym, err := r.requiredStr("ion")
	if err != nil {
		return nil, false, err
	}
	i, ok := b.db.ionIdx[sym]
	if !ok {
		return nil, false, b.problem(r.errorf("ion", "ion %q is not in the ion table", sym))
	}
	return &b.db.ions[i], true, nil
}

func (b *builder) ionValue(r record) error {
	ion, found, err := b.rowIon(r)
	if !found {
		return err
	}
	prop, err := r.requiredStr("property")
	if err != nil {
		return err
	}
	unit := r.str("unit")
	want := map[string]string{"thermochemical_radius": "Å", "gas_formation": "kJ/mol", "hydration": "kJ/mol"}[prop]
	if want == "" {
		return r.errorf("property", "%q is not thermochemical_radius, gas_formation or hydration", prop)
	}
	if unit == "A" || unit == "angstrom" {
		unit = "Å"
	}
	if unit != "" && unit != want {
		return r.errorf("unit", "%s is stored in %s, not %q", prop, want, unit)
	}
	v, ok, err := b.value(r, "value", "uncertainty", "source", prop, want)
	if err != nil {
		return err
	}
	if !ok {
		return r.errorf("value", "missing value")
	}
	switch prop {
	case "thermochemical_radius":
		b.set(&ion.ThermochemicalRadius, v)
	case "gas_formation":
		b.set(&ion.GasFormation, v)
	case "hydration":
		scale := r.str("scale")
		if scale != "conventional" && scale != "absolute" {
			return r.errorf("scale", "%q: a hydration enthalpy needs scale conventional or absolute", scale)
		}
		for j := range ion.Hydrations {
			if ion.Hydrations[j].Scale == scale {
				if !b.overlay {
					return r.errorf("scale", "%s hydration on the %s scale listed twice", r.str("ion"), scale)
				}
				b.set(&ion.Hydrations[j].Value, v)
				return nil
			}
		}
		sv := ScaledValue{Scale: scale}
		b.set(&sv.Value, v)
		ion.Hydrations = append(ion.Hydrations, sv)
	}
	return nil
}

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

// parseParams reads "a=5.64;c=3.2" into a map.
func parseParams(r record) (map[string]float64, error) {
	out := map[string]float64{}
	for _, part := range strings.Split(r.str("params"), ";") {
		part = strings.TrimSpace(part)
		if part == "" {
			continue
		}
		k, v, ok := strings.Cut(part, "=")
		k = strings.TrimSpace(k)
		if !ok || k == "" {
			return nil, r.errorf("params", "%q is not name=value", part)
		}
		x, err := strconv.ParseFloat(strings.TrimSpace(v), 64)
		if err != nil {
			return nil, r.errorf("params", "%q: %q is not a number", k, strings.TrimSpace(v))
		}
		if _, dup := out[k]; dup {
			return nil, r.errorf("params", "parameter %q given twice", k)
		}
		out[k] = x
	}
	return out, nil
}

// finish sorts the radii, attaches them and the Born exponents to the ions,
// and builds the lookup indexes.
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
	if _, dup := b.db.solutions[formula]; dup && !b.overlay {
		return r.errorf("formula", "enthalpy of solution of %s listed twice", formula)
	}
	old := b.db.solutions[formula]
	b.set(&old, v)
	b.db.solutions[formula] = old
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
		if b.db.species.fsys != nil && !b.overlay && b.db.species.m == nil {
			// species.csv is read on first use: keep the row until then.
			r.cells = slices.Clone(r.cells) // eachCSV reuses the slice
			b.db.species.pendingAlts = append(b.db.species.pendingAlts, r)
			return nil
		}
		sp, ok := b.db.species.m[key]
		if !ok {
			return missing()
		}
		sp.Alternatives = append(sp.Alternatives, v)
		b.db.species.m[key] = sp
	}
	return nil
}

// compoundStates are the phases a compound row may refer to.
var compoundStates = []string{"cr", "l", "g"}

func (b *builder) finish() {
	db := b.db
	for k, list := range db.radii {
		sort.SliceStable(list, func(i, j int) bool {
			if list[i].Coordination != list[j].Coordination {
				return list[i].Coordination < list[j].Coordination
			}
			if list[i].CN != list[j].CN {
				return list[i].CN < list[j].CN
			}
			return list[i].Spin < list[j].Spin
		})
		db.radii[k] = list
	}
	b.absoluteHydrations()
	db.ionKeyIdx = make(map[ionKey]int, len(db.ions))
	db.ionFoldIdx = make(map[string]int, len(db.ions))
	for i := range db.ions {
		ion := &db.ions[i]
		ion.Radii = db.radii[ionKey{ion.Core, ion.Charge}]
		ion.BornExponent = Value{}
		if ion.BornConfig != "" {
			ion.BornExponent = db.born[ion.BornConfig]
		}
		if len(ion.Hydrations) > 0 {
			ion.Hydration, ion.HydrationScale = ion.Hydrations[0].Value, ion.Hydrations[0].Scale
		}
		k := ionKey{ion.Core, ion.Charge}
		if _, dup := db.ionKeyIdx[k]; !dup {
			db.ionKeyIdx[k] = i
		}
		for _, key := range []string{notation.FoldIon(ion.Symbol), notation.CaretIonSymbol(ion.Core, ion.Charge)} {
			if _, dup := db.ionFoldIdx[key]; !dup {
				db.ionFoldIdx[key] = i
			}
		}
		if !ion.Polyatomic {
			db.ionFoldIdx[notation.IonSymbol(ion.Core, ion.Charge, false)] = i
		}
	}
	db.compoundFoldIdx = make(map[string]int, len(db.compounds))
	for i, c := range db.compounds {
		db.compoundFoldIdx[strings.ToLower(c.Formula)] = i
	}
	db.comp = &compositions{}
	db.elementFoldIdx = make(map[string]int, len(db.elements))
	for i, e := range db.elements {
		db.elementFoldIdx[strings.ToLower(e.Symbol)] = i
		if e.Name != "" {
			db.elementFoldIdx[strings.ToLower(e.Name)] = i
		}
	}
}

// absoluteHydrations gives every ion with a conventional hydration
// enthalpy and no absolute one the absolute value
//
//	ΔhydH°abs(ion) = ΔhydH°conv(ion) + z·ΔhydH°abs(H⁺),
//
// from the absolute row of H⁺ (the one number that fixes the scale), with
// that row's source and memory flag, marked derived. Values derived by an
// earlier build (before an overlay) are derived again.
func (b *builder) absoluteHydrations() {
	db := b.db
	var hAbs Value
	for _, ion := range db.ions {
		if ion.Symbol == "H+" {
			for _, h := range ion.Hydrations {
				if h.Scale == "absolute" {
					hAbs = h.Value
				}
			}
		}
	}
	for i := range db.ions {
		ion := &db.ions[i]
		ion.Hydrations = slices.DeleteFunc(ion.Hydrations, func(h ScaledValue) bool { return h.derivedScale })
		if !hAbs.Known() || ion.Symbol == "H+" {
			continue
		}
		var conv Value
		hasAbs := false
		for _, h := range ion.Hydrations {
			switch h.Scale {
			case "conventional":
				conv = h.Value
			case "absolute":
				hasAbs = true
			}
		}
		if hasAbs || !conv.Known() {
			continue
		}
		z := float64(ion.Charge)
		v := Value{V: math.Round((conv.V+z*hAbs.V)*1e6) / 1e6, U: math.Hypot(conv.U, z*hAbs.U), Unit: conv.Unit, Source: hAbs.Source,
			Memory: hAbs.Memory || conv.Memory, Derived: true, Override: conv.Override || hAbs.Override,
			Note: fmt.Sprintf("derived: conventional %g %+g × ΔhydH°(H+, absolute) %g kJ/mol [%s]", conv.V, z, hAbs.V, hAbs.Source)}
		ion.Hydrations = append(ion.Hydrations, ScaledValue{Scale: "absolute", Value: v, derivedScale: true})
	}
}

func sortedKeys[V any](m map[string]V) []string {
	keys := make([]string, 0, len(m))
	for k := range m {
		keys = append(keys, k)
	}
	slices.Sort(keys)
	return keys
}
