package data

import (
	"io/fs"
	"slices"
	"strings"
)

// This file reads derived_ions.csv: gas-phase enthalpies of ions that no
// measurement gives (O²⁻, S²⁻, SO₄²⁻, CO₃²⁻ …), each fitted by weighted least
// squares over the built-in salts of the ion with a stated lattice model.
// The table is written by a generator outside this package (data computes
// no physics); each row says which model, which salts and what standard
// error, and its values are flagged Derived.

// DerivedIonsFile is the table of family-fitted gas-phase ion enthalpies.
const DerivedIonsFile = "derived_ions.csv"

// FamilyFitSource is the source key of a derived_ions.csv value: the
// project's own family fit, described per row (model, salts, standard
// error) rather than by a citation.
const FamilyFitSource = "family-fit"

const familyFitCitation = "fitted by enthalpath over the built-in salts of the ion (derived_ions.csv names the lattice model, the salts and the fit's standard error)"

// DerivedIon is an ion's gas-phase enthalpy of formation fitted over a
// family of salts.
type DerivedIon struct {
	// Ion is the ion's symbol as in ions.csv ("SO4^2-", "O2-").
	Ion string
	// GasFormation is ΔfH°(ion, g, 298.15 K) in kJ/mol in the thermal-
	// electron convention of the NBS tables (see README: "Gaseous ions");
	// U is the fit's standard error; Derived is true and Source is
	// FamilyFitSource.
	GasFormation Value
	// Model names the lattice model the salts' lattice enthalpies came from
	// ("kapustinskii", "volume", "handbook", or a per-salt mix).
	Model string
	// Salts are the formulas of the salts in the fit; Outside those of them
	// whose own value lies more than two of its standard uncertainties from
	// the fit; Skipped the salts of the ion left out for a missing input.
	Salts, Outside, Skipped []string
}

// InFit reports whether formula is one of the salts the value was fitted to.
func (d DerivedIon) InFit(formula string) bool { return slices.Contains(d.Salts, formula) }

// DerivedIon returns the family-fitted gas-phase enthalpy of the ion
// written as symbol (any spelling Ion accepts), and whether the table has one.
func (db *DB) DerivedIon(symbol string) (DerivedIon, bool) {
	in, ok := db.FindIon(symbol)
	if !ok {
		return DerivedIon{}, false
	}
	d, ok := db.derived[in.Symbol]
	if !ok {
		return DerivedIon{}, false
	}
	return cloneDerived(d), true
}

// DerivedIons returns every family-fitted ion value, sorted by ion symbol.
func (db *DB) DerivedIons() []DerivedIon {
	out := make([]DerivedIon, 0, len(db.derived))
	for _, k := range sortedKeys(db.derived) {
		out = append(out, cloneDerived(db.derived[k]))
	}
	return out
}

func cloneDerived(d DerivedIon) DerivedIon {
	d.Salts, d.Outside, d.Skipped = slices.Clone(d.Salts), slices.Clone(d.Outside), slices.Clone(d.Skipped)
	return d
}

// derivedIon applies one row of derived_ions.csv (or a [[derived_ion]]
// overlay entry, whose given fields replace those of the built-in row).
func (b *builder) derivedIon(r record) error {
	ion, found, err := b.rowIon(r)
	if !found {
		return err
	}
	sym := ion.Symbol
	if b.db.derived == nil {
		b.db.derived = map[string]DerivedIon{}
	}
	d, exists := b.db.derived[sym]
	if exists && !b.overlay {
		return r.errorf("ion", "%s listed twice", sym)
	}
	d.Ion = sym
	if x, ok, err := r.float("gas_formation_kj_per_mol"); err != nil {
		return err
	} else if ok {
		v := Value{V: x, Unit: "kJ/mol", Source: FamilyFitSource, Derived: true, Note: r.str("note")}
		if u, ok, err := r.float("standard_error"); err != nil {
			return err
		} else if ok {
			if u < 0 {
				return r.errorf("standard_error", "standard error %g is negative", u)
			}
			v.U = u
		}
		b.set(&d.GasFormation, v)
	} else if !exists {
		return r.errorf("gas_formation_kj_per_mol", "missing value")
	}
	if r.has("model") {
		d.Model = r.str("model")
	}
	for field, dst := range map[string]*[]string{"salts": &d.Salts, "outside_2sigma": &d.Outside, "skipped": &d.Skipped} {
		if r.has(field) {
			*dst = splitList(r.str(field))
		}
	}
	b.db.derived[sym] = d
	return nil
}

// splitList reads a ";"-separated list of formulas.
func splitList(s string) []string {
	var out []string
	for _, p := range strings.Split(s, ";") {
		if p = strings.TrimSpace(p); p != "" {
			out = append(out, p)
		}
	}
	return out
}

// LoadWithoutDerived reads the embedded tables without derived_ions.csv:
// the measured and tabulated data a family fit starts from, so that a fit
// never feeds on its own earlier output.
func LoadWithoutDerived() (*DB, error) {
	sub, err := fs.Sub(embedded, "tables")
	if err != nil {
		return nil, err
	}
	return LoadFS(withoutFile{sub, DerivedIonsFile})
}

// withoutFile is a file system that hides one file.
type withoutFile struct {
	fs.FS
	hide string
}

func (w withoutFile) Open(name string) (fs.File, error) {
	if name == w.hide {
		return nil, &fs.PathError{Op: "open", Path: name, Err: fs.ErrNotExist}
	}
	return w.FS.Open(name)
}
