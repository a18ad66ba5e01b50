package lattice

import (
	"fmt"

	"enthalpath/thermo"
)

// Convention says how a lattice energy U is turned into a lattice enthalpy
// ΔH_L at temperature T.
type Convention int

const (
	// Jenkins2005 is the published heat-capacity correction (H. D. B.
	// Jenkins, J. Chem. Educ. 82, 950 (2005); also the CRC Handbook
	// "Lattice Energies" table by Jenkins and Roobottom): for the
	// dissociation M_pX_q(s) → p M(g) + q X(g),
	//
	//	ΔH_L = U_POT + [p(n_M/2 − 2) + q(n_X/2 − 2)]·RT
	//
	// with n = 3 for monatomic, 5 for linear and 6 for non-linear
	// polyatomic ions. U_POT is the lattice potential energy (the models'
	// output); the ions' gaseous heat capacities (n/2 + 1)R are set against
	// a classical 3R per ion in the solid. For NaCl this gives −RT.
	Jenkins2005 Convention = iota
	// GasWork keeps only the expansion work of the gas formed,
	// ΔH = ΔU + Δn_gas·RT: +ν·RT for the dissociation of a formula unit of
	// ν ions (NaCl: +2RT ≈ +4.96 kJ/mol at 298.15 K). This is the textbook
	// shortcut that treats U as the internal-energy change at T.
	GasWork
)

// String names the convention.
func (c Convention) String() string {
	switch c {
	case Jenkins2005:
		return "Jenkins 2005: ΔH_L = U + Σ n_i(n/2 − 2)RT"
	case GasWork:
		return "gas work: ΔH_L = U + Δn·RT"
	}
	return fmt.Sprintf("Convention(%d)", int(c))
}

// Correction returns ΔH − U for the formation direction, gaseous ions →
// solid, in kJ/mol at temperature t (K) for the ions of one formula unit.
// It is the negative of the dissociation-direction term: Jenkins2005 gives
// +RT for NaCl, +1.5RT for CaF₂ and −0.5RT for KNO₃; GasWork gives −ν·RT.
func (c Convention) Correction(t float64, ions []IonKind) (float64, error) {
	const fn = "Correction"
	if err := checkPositive(fn, "t", t, "K (use thermo.StandardTemperature for 298.15 K)"); err != nil {
		return 0, err
	}
	if err := checkIons(fn, ions, true); err != nil {
		return 0, err
	}
	rt := thermo.RT(t)
	dissociation := 0.0
	switch c {
	case Jenkins2005:
		for _, ion := range ions {
			dissociation += float64(ion.Count) * (float64(ion.Shape.DegreesOfFreedom())/2 - 2)
		}
	case GasWork:
		dissociation = float64(IonCount(ions))
	default:
		return 0, &ParamError{Func: fn, Param: "convention", Value: c.String(), Err: ErrUnknownName,
			Hint: "use Jenkins2005 or GasWork"}
	}
	return finiteResult(fn, -dissociation*rt)
}

// EnthalpyFromEnergy returns the lattice enthalpy ΔH_L (gaseous ions →
// solid, kJ/mol) from the lattice energy u in this convention.
func (c Convention) EnthalpyFromEnergy(u, t float64, ions []IonKind) (float64, error) {
	if err := checkLattice("EnthalpyFromEnergy", u); err != nil {
		return 0, err
	}
	d, err := c.Correction(t, ions)
	if err != nil {
		return 0, err
	}
	return finiteResult("EnthalpyFromEnergy", u+d)
}

// EnergyFromEnthalpy is the inverse of EnthalpyFromEnergy.
func (c Convention) EnergyFromEnthalpy(h, t float64, ions []IonKind) (float64, error) {
	if err := checkLatticeParam("EnergyFromEnthalpy", "h", h); err != nil {
		return 0, err
	}
	d, err := c.Correction(t, ions)
	if err != nil {
		return 0, err
	}
	return finiteResult("EnergyFromEnthalpy", h-d)
}

// EnthalpyCorrection is Jenkins2005.Correction: ΔH_L − U in the formation
// direction (gaseous ions → solid) at t kelvin.
func EnthalpyCorrection(t float64, ions []IonKind) (float64, error) {
	return Jenkins2005.Correction(t, ions)
}

// EnthalpyFromEnergy returns ΔH_L = U − Σ count·(n/2 − 2)·RT for the
// formation direction (both negative), the Jenkins (2005) relation with
// the sign turned for gaseous ions → solid.
func EnthalpyFromEnergy(u, t float64, ions []IonKind) (float64, error) {
	return Jenkins2005.EnthalpyFromEnergy(u, t, ions)
}

// EnergyFromEnthalpy returns U from ΔH_L (formation direction, Jenkins 2005).
func EnergyFromEnthalpy(h, t float64, ions []IonKind) (float64, error) {
	return Jenkins2005.EnergyFromEnthalpy(h, t, ions)
}
