package data

// This file reads anion_radii.csv: radii of the monatomic anions that
// Shannon's 1976 table lacks (P³⁻, As³⁻, Sb³⁻, C⁴⁻, Si⁴⁻, the formal ions
// of phosphides, arsenides, antimonides, carbides and silicides), from
// Pauling's table of crystal radii. They stand in the ion's
// ThermochemicalRadius, the radius the Kapustinskii equation takes for an
// ion without Shannon radii; each row's note says what it is. Shannon's
// rows stay Shannon's alone (shannon.csv, compared with pymatgen).

// AnionRadiiFile is the table of radii of monatomic anions Shannon lacks.
const AnionRadiiFile = "anion_radii.csv"

// anionRadius applies one row of anion_radii.csv.
func (b *builder) anionRadius(r record) error {
	sym, err := r.requiredStr("symbol")
	if err != nil {
		return err
	}
	i, ok := b.db.ionIdx[sym]
	if !ok {
		return b.problem(r.errorf("symbol", "ion %q is not in the ion table", sym))
	}
	ion := &b.db.ions[i]
	if ion.Polyatomic || ion.Charge >= 0 {
		return r.errorf("symbol", "%s is not a monatomic anion", sym)
	}
	v, ok, err := b.value(r, "radius_angstrom", "", "source", "radius_angstrom", "Å")
	if err != nil {
		return err
	}
	if !ok || !(v.V > 0) {
		return r.errorf("radius_angstrom", "missing or not positive")
	}
	b.set(&ion.ThermochemicalRadius, v)
	return nil
}
