package data

// The builder's rows of the ion tables: ions, Shannon radii and per-ion
// values (thermochemical radii, gaseous-ion enthalpies, hydration).

import (
	"strings"

	"enthalpath/thermo/notation"
)

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
		if b.overlay {
			// Built-in cores are checked by the data tests
			// (TestIonCoresParse): parsing each one costs a tenth of Load.
			if _, ferr := notation.ParseFormula(ion.Core); ferr != nil {
				return r.errorf("core", "%v", ferr)
			}
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
