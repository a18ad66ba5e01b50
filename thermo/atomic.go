package thermo

// Constants of the extended ionic model's dispersion and zero-point terms
// (CODATA 2018, as the constants of units.go).
const (
	// ReducedPlanck is ħ = h/2π in J·s (exact by derivation from h).
	ReducedPlanck = 6.62607015e-34 / (2 * 3.14159265358979323846264338327950288)
	// HartreeJoule is the Hartree energy E_h in J; relative standard
	// uncertainty 1.9e-12.
	HartreeJoule = 4.3597447222071e-18
	// BohrAngstrom is the Bohr radius a₀ in Å; relative standard
	// uncertainty 1.5e-10.
	BohrAngstrom = 0.529177210903
	// Erg is the CGS unit of energy in J (exact).
	Erg = 1e-7
)

// ErgCentimetrePowerToKJPerMol converts a pair coefficient published in
// erg·cm^p (dispersion C in 10⁻⁶⁰ erg·cm⁶ and D in 10⁻⁷⁶ erg·cm⁸ are quoted
// this way, scale 1e-60 or 1e-76) to kJ/mol·Å^p per pair.
func ErgCentimetrePowerToKJPerMol(v, scale float64, p int) float64 {
	cmPerAngstrom := 1e-8
	f := 1.0
	for range p {
		f /= cmPerAngstrom
	}
	return v * scale * Erg * f * Avogadro / 1000
}

// HartreeBohrPowerToKJPerMol converts a coefficient in atomic units
// E_h·a₀^p to kJ/mol·Å^p per pair.
func HartreeBohrPowerToKJPerMol(v float64, p int) float64 {
	f := 1.0
	for range p {
		f *= BohrAngstrom
	}
	return v * HartreeJoule * Avogadro / 1000 * f
}
