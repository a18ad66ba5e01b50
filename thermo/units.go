package thermo

import (
	"fmt"
	"math"
	"strings"
)

// CODATA 2018 constants (see the package comment for the citation).
const (
	// ElementaryCharge is e in coulomb (exact).
	ElementaryCharge = 1.602176634e-19
	// Avogadro is N_A in mol⁻¹ (exact).
	Avogadro = 6.02214076e23
	// Boltzmann is k_B in J/K (exact).
	Boltzmann = 1.380649e-23
	// GasConstant is R = N_A·k_B in J/(mol·K) (exact by derivation).
	GasConstant = Avogadro * Boltzmann
	// VacuumPermittivity is ε₀ in F/m; relative standard uncertainty 1.5e-10.
	VacuumPermittivity = 8.8541878128e-12
	// StandardTemperature is 298.15 K, the temperature of the tabulated enthalpies.
	StandardTemperature = 298.15
	// JoulePerCalorie is the thermochemical calorie (exact by definition).
	JoulePerCalorie = 4.184
	// MetrePerAngstrom converts ångström to metre (exact).
	MetrePerAngstrom = 1e-10
)

// Derived conversion factors, computed once from the constants above.
var (
	// KJPerMolPerEV is the molar energy of 1 eV per particle, in kJ/mol:
	// e·N_A/1000 = 96.485332123… kJ/mol.
	KJPerMolPerEV = ElementaryCharge * Avogadro / 1000
	// CoulombEVAngstrom is e²/(4πε₀) in eV·Å = 14.39964547… eV·Å: the energy in
	// eV of two unit charges 1 Å apart.
	CoulombEVAngstrom = ElementaryCharge / (4 * math.Pi * VacuumPermittivity * MetrePerAngstrom)
	// CoulombKJPerMolAngstrom is N_A·e²/(4πε₀) in kJ·Å/mol = 1389.35457… kJ·Å/mol.
	CoulombKJPerMolAngstrom = CoulombEVAngstrom * KJPerMolPerEV
)

// RT returns R·T in kJ/mol at temperature t in kelvin.
func RT(t float64) float64 { return GasConstant * t / 1000 }

// EVToKJPerMol converts an energy per particle in eV to kJ/mol.
func EVToKJPerMol(ev float64) float64 { return ev * KJPerMolPerEV }

// KJPerMolToEV converts kJ/mol to eV per particle (per formula unit).
func KJPerMolToEV(kj float64) float64 { return kj / KJPerMolPerEV }

// Unit is an energy unit used when printing.
type Unit int

const (
	// KJPerMol is kilojoule per mole, the internal unit.
	KJPerMol Unit = iota
	// KcalPerMol is thermochemical kilocalorie per mole.
	KcalPerMol
	// EVPerFormulaUnit is electronvolt per formula unit (per particle).
	EVPerFormulaUnit
)

// String returns the unit's printed symbol.
func (u Unit) String() string {
	switch u {
	case KJPerMol:
		return "kJ/mol"
	case KcalPerMol:
		return "kcal/mol"
	case EVPerFormulaUnit:
		return "eV"
	}
	return fmt.Sprintf("Unit(%d)", int(u))
}

// Key returns the short name used on the command line and in files: kj, kcal, ev.
func (u Unit) Key() string {
	switch u {
	case KcalPerMol:
		return "kcal"
	case EVPerFormulaUnit:
		return "ev"
	}
	return "kj"
}

// Units lists every unit in display order.
func Units() []Unit { return []Unit{KJPerMol, KcalPerMol, EVPerFormulaUnit} }

// ParseUnit reads a unit key: kj, kcal or ev (case-insensitive; kJ/mol,
// kcal/mol and eV are accepted too).
func ParseUnit(s string) (Unit, error) {
	switch strings.ToLower(strings.TrimSpace(s)) {
	case "kj", "kj/mol", "kjmol":
		return KJPerMol, nil
	case "kcal", "kcal/mol", "kcalmol":
		return KcalPerMol, nil
	case "ev", "ev/fu":
		return EVPerFormulaUnit, nil
	}
	return 0, fmt.Errorf("unknown energy unit %q: use kj, kcal or ev", s)
}

// FromKJPerMol converts a value in kJ/mol into unit u.
func FromKJPerMol(kj float64, u Unit) float64 {
	switch u {
	case KcalPerMol:
		return kj / JoulePerCalorie
	case EVPerFormulaUnit:
		return KJPerMolToEV(kj)
	}
	return kj
}

// ToKJPerMol converts a value in unit u into kJ/mol.
func ToKJPerMol(v float64, u Unit) float64 {
	switch u {
	case KcalPerMol:
		return v * JoulePerCalorie
	case EVPerFormulaUnit:
		return EVToKJPerMol(v)
	}
	return v
}
