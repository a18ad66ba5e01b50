package lattice

import "math"

// Constants of the Kapustinskii equation.
const (
	// KapustinskiiK is K = 1.2025e-4 J·m·mol⁻¹ = 1202.5 kJ·Å/mol, the
	// constant of the 1956 form (A. F. Kapustinskii, Q. Rev. Chem. Soc. 10,
	// 283 (1956)).
	KapustinskiiK = 1202.5
	// KapustinskiiD is d = 0.345 Å, the repulsion length of the 1956 form.
	KapustinskiiD = 0.345
	// KapustinskiiKHandbook is 121.4 kJ·nm/mol = 1214 kJ·Å/mol, the constant
	// with which Jenkins and Roobottom state the equation in the CRC Handbook
	// of Chemistry and Physics ("Lattice Energies", section 12), with
	// thermochemical radii and Goldschmidt radii for metal ions.
	KapustinskiiKHandbook = 1214.0
)

// KapustinskiiConstants are the two constants of the equation; Kapustinskii
// returns the 1956 pair.
type KapustinskiiConstants struct {
	// K in kJ·Å/mol.
	K float64
	// D in Å.
	D float64
}

// Kapustinskii1956 returns {KapustinskiiK, KapustinskiiD}.
func Kapustinskii1956() KapustinskiiConstants {
	return KapustinskiiConstants{K: KapustinskiiK, D: KapustinskiiD}
}

// Kapustinskii returns the lattice energy in kJ/mol (negative) by the 1956
// Kapustinskii equation:
//
//	U = −K·ν·|z₊z₋|/(r₊+r₋)·(1 − d/(r₊+r₋))
//
// with ν the number of ions (not atoms) per formula unit (2 for NaCl and
// for KNO₃, 3 for CaF₂, 5 for Al₂O₃), z₊ and z₋ the ion charges (signs ignored) and r₊, r₋ the radii in
// Å. K and d were fitted with Goldschmidt/Pauling-type radii; with Shannon's
// effective ionic radii use the six-coordinate (CN VI) values, whatever the
// real coordination (common practice, no source).
func Kapustinskii(nu, zCation, zAnion int, rCation, rAnion float64) (float64, error) {
	return Kapustinskii1956().Energy(nu, zCation, zAnion, rCation, rAnion)
}

// Energy evaluates the Kapustinskii equation with these constants.
func (c KapustinskiiConstants) Energy(nu, zCation, zAnion int, rCation, rAnion float64) (float64, error) {
	const fn = "Kapustinskii"
	if err := c.check(fn); err != nil {
		return 0, err
	}
	if err := checkKapustinskiiCharges(fn, nu, zCation, zAnion); err != nil {
		return 0, err
	}
	if err := checkPositive(fn, "rCation", rCation, "Å"); err != nil {
		return 0, err
	}
	if err := checkPositive(fn, "rAnion", rAnion, "Å"); err != nil {
		return 0, err
	}
	s := rCation + rAnion
	return finiteResult(fn, -c.K*float64(nu*abs(zCation)*abs(zAnion))/s*(1-c.D/s))
}

func (c KapustinskiiConstants) check(fn string) error {
	if err := checkPositive(fn, "K", c.K, "kJ·Å/mol"); err != nil {
		return err
	}
	return checkPositive(fn, "D", c.D, "Å")
}

func checkKapustinskiiCharges(fn string, nu, zCation, zAnion int) error {
	if nu < 2 {
		return paramErr(fn, "nu", float64(nu), ErrNotPositive, "give the number of ions per formula unit (at least 2)")
	}
	if zCation == 0 {
		return paramErr(fn, "zCation", 0, ErrZeroCharge, "give the cation charge, e.g. 2 for Mg²⁺")
	}
	if zAnion == 0 {
		return paramErr(fn, "zAnion", 0, ErrZeroCharge, "give the anion charge, e.g. -2 for O²⁻")
	}
	return nil
}

// KapustinskiiRadiusSum returns the radius sum r₊+r₋ (Å) for which the 1956
// Kapustinskii equation gives the lattice energy u (negative, kJ/mol).
// With c = K·ν·|z₊z₋| the equation |u|·s² − c·s + c·d = 0 has two roots;
// the physical one is the larger, on the branch s > 2d where the energy
// falls in magnitude as the ions grow. It fails with ErrNoSolution when
// |u| > c/(4d), the largest magnitude the equation can give.
func KapustinskiiRadiusSum(u float64, nu, zCation, zAnion int) (float64, error) {
	return Kapustinskii1956().RadiusSum(u, nu, zCation, zAnion)
}

// RadiusSum is KapustinskiiRadiusSum with these constants.
func (c KapustinskiiConstants) RadiusSum(u float64, nu, zCation, zAnion int) (float64, error) {
	const fn = "KapustinskiiRadiusSum"
	if err := c.check(fn); err != nil {
		return 0, err
	}
	if err := checkKapustinskiiCharges(fn, nu, zCation, zAnion); err != nil {
		return 0, err
	}
	if err := checkLattice(fn, u); err != nil {
		return 0, err
	}
	m := -u
	cc := c.K * float64(nu*abs(zCation)*abs(zAnion))
	disc := cc*cc - 4*m*cc*c.D
	if !(disc >= 0) {
		return 0, paramErr(fn, "u", u, ErrNoSolution,
			"|u| exceeds %.1f kJ/mol, the largest the equation gives for these charges", cc/(4*c.D))
	}
	// Larger root, written to avoid cancellation: s = (c + √disc)/(2m).
	return finiteResult(fn, (cc+math.Sqrt(disc))/(2*m))
}

// KapustinskiiRadius returns the radius (Å) of one ion given the other's
// radius (known, Å) so that the 1956 equation reproduces u: the way
// thermochemical radii of polyatomic ions are derived. It fails with
// ErrNoSolution when the radius sum is not larger than the known radius.
func KapustinskiiRadius(u float64, nu, zCation, zAnion int, known float64) (float64, error) {
	return Kapustinskii1956().Radius(u, nu, zCation, zAnion, known)
}

// Radius is KapustinskiiRadius with these constants.
func (c KapustinskiiConstants) Radius(u float64, nu, zCation, zAnion int, known float64) (float64, error) {
	const fn = "KapustinskiiRadius"
	if err := checkPositive(fn, "known", known, "Å (the radius of the other ion)"); err != nil {
		return 0, err
	}
	s, err := c.RadiusSum(u, nu, zCation, zAnion)
	if err != nil {
		return 0, err
	}
	if !(s > known) {
		return 0, paramErr(fn, "known", known, ErrNoSolution,
			"the radius sum that reproduces u is %.3f Å, not larger than the known radius", s)
	}
	return s - known, nil
}
