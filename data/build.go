package data

import (
	"fmt"
	"math"
	"slices"
	"sort"
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
	case "ions.csv":
		b.db.ions = slices.Grow(b.db.ions, n)
		if len(b.db.ionIdx) == 0 {
			b.db.ionIdx = make(map[string]int, n)
		}
	case "elements.csv":
		b.db.elements = slices.Grow(b.db.elements, n)
		if len(b.db.elementIdx) == 0 {
			b.db.elementIdx = make(map[string]int, n)
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
	v = Value{V: x, Unit: unit}
	v.Note, _ = r.sharedStr(noteColumn, "note")
	v.Locator, _ = r.sharedStr(locatorColumn, "locator")
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
	if _, has := r.sharedStr(derivedColumn, "derived"); has {
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

// finish sorts the radii, attaches them and the Born exponents to the ions,
// and builds the lookup indexes (the folded ones on first use: folds.go).
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
	b.otherHydrationScales()
	db.ionKeyIdx = make(map[ionKey]int, len(db.ions))
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
	}
	db.comp = &compositions{}
	db.fold = &foldIndexes{}
}

// otherHydrationScales gives every ion with a hydration enthalpy on one
// scale only the other one,
//
//	ΔhydH°abs(ion) = ΔhydH°conv(ion) + z·ΔhydH°abs(H⁺),
//
// from the absolute row of H⁺ (the one number that fixes the scale), marked
// derived and memory when either of the two was recalled. An absolute
// value takes the H⁺ row's source, a conventional one derived from an
// absolute value that value's source. Values derived by an earlier build
// (before an overlay) are derived again.
func (b *builder) otherHydrationScales() {
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
		var conv, abs Value
		for _, h := range ion.Hydrations {
			switch h.Scale {
			case "conventional":
				conv = h.Value
			case "absolute":
				abs = h.Value
			}
		}
		if conv.Known() == abs.Known() {
			continue
		}
		z := float64(ion.Charge)
		from, sign, scale, source, name := conv, 1.0, "absolute", hAbs.Source, "conventional"
		if abs.Known() {
			from, sign, scale, source, name = abs, -1.0, "conventional", abs.Source, "absolute"
		}
		// An absolute value is a conventional one shifted by z·ΔhydH°(H⁺): the
		// shift's uncertainty enters the absolute value, and leaves again when
		// the shift is taken back off.
		u := math.Hypot(from.U, z*hAbs.U)
		if abs.Known() {
			u = from.U
		}
		v := Value{V: math.Round((from.V+sign*z*hAbs.V)*1e6) / 1e6, U: u, Unit: from.Unit, Source: source,
			Memory: hAbs.Memory || from.Memory, Derived: true, Override: from.Override || hAbs.Override,
			Note: fmt.Sprintf("derived: %s %g %+g × ΔhydH°(H+, absolute) %g kJ/mol [%s]", name, from.V, sign*z, hAbs.V, hAbs.Source)}
		ion.Hydrations = append(ion.Hydrations, ScaledValue{Scale: scale, Value: v, derivedScale: true})
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
