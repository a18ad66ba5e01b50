package entropy

import (
	"math"

	"enthalpath/thermo"
	"enthalpath/thermo/lattice"
)

// The volume line's domain.
//
// S°298 = k·V_m + c is a correlation over salts whose lattice vibrations
// are nearly all excited at room temperature: there the entropy of a solid
// grows with ln(T/θ_D), and θ_D falls as the formula unit grows, so volume
// stands in for θ_D. A light, stiff lattice (oxides of the light metals,
// hydrides, nitrides) has a Debye temperature well above room temperature,
// its vibrations are partly frozen out, and its entropy is far below what
// its volume suggests: the line cannot know that from V_m alone.
//
// The domain is set a priori from θ_D/T, before any residual was looked at:
// a solid counts as near its classical limit while T ≥ θ_D/2 (there the
// Debye heat capacity is still above 4/5 of Dulong and Petit's 3R per
// atom; the threshold of one half is common practice, no source).
// MaxReducedDebye is that bound on x = θ_D/T.
const MaxReducedDebye = 2.0

// InVolumeDomain reports whether a solid of Debye temperature theta (K) at
// temperature t (K) lies inside the volume line's domain; ok is false when
// theta or t is not positive (the domain cannot be judged).
func InVolumeDomain(theta, t float64) (in, ok bool) {
	if !(theta > 0) || !(t > 0) || math.IsInf(theta, 0) {
		return false, false
	}
	return theta/t <= MaxReducedDebye, true
}

// DebyeEntropy returns the vibrational entropy of a Debye solid of atoms
// vibrating units per formula unit at temperature t (K), J/(mol·K):
//
//	S = 3·ν·R·[(4/3)·D₃(x) − ln(1 − e^(−x))],  x = θ_D/T
//
// (P. Debye, Ann. Phys. 344, 789 (1912); S = ∫C_V/T dT of Debye's
// spectrum). It counts 3ν lattice modes only: a polyatomic ion's internal
// vibrations are not in it. NaN when theta, t or atoms is not positive.
func DebyeEntropy(theta, t float64, atoms int) float64 {
	if !(theta > 0) || !(t > 0) || atoms <= 0 {
		return math.NaN()
	}
	x := theta / t
	return 3 * float64(atoms) * thermo.GasConstant * (4.0/3*lattice.DebyeFunction(x) - math.Log(-math.Expm1(-x)))
}

// DebyeTemperatureFromVolume estimates θ_D (K) of an ionic solid with no
// structure to sum, from what the volume-based estimate already has: its
// lattice energy u (kJ/mol, either sign), formula-unit volume vm (nm³),
// molar mass (g/mol) and ions per formula unit. The static energy is Born
// and Mayer's −A/d + B·e^(−d/ρ) with ρ = 0.345 Å (thermo/lattice.DefaultRho),
// whose curvature at the minimum gives the bulk modulus
//
//	B = |u|·(d/ρ − 2) / (9·V_m·(1 − ρ/d)),  d = (V_m/ν)^⅓
//
// (d the cube root of the volume per ion, exact for the rock-salt cell,
// our own choice for others); θ_D then follows from the bulk sound speed
// as the extended model takes it, θ_D = (ħ/k)·√(B/ϱ)·(6π²·ν/V_m)^⅓ (common
// practice, no source; the bulk sound speed bounds the Debye mean from
// above, so θ_D comes out high). 0 when an input is not positive or the
// curvature is not.
func DebyeTemperatureFromVolume(u, vm, molarMass float64, ions int) float64 {
	u = math.Abs(u)
	if !(u > 0) || !(vm > 0) || !(molarMass > 0) || ions <= 0 || math.IsInf(u+vm+molarMass, 0) {
		return 0
	}
	const m3PerNm3 = 1e-27
	vol := vm * m3PerNm3
	d := math.Cbrt(vm/float64(ions)) * 10 // Å
	rho := lattice.DefaultRho
	if d <= 2*rho {
		return 0
	}
	perFU := u * 1000 / thermo.Avogadro // J per formula unit
	bulk := perFU * (d/rho - 2) / (9 * vol * (1 - rho/d))
	density := molarMass / 1000 / thermo.Avogadro / vol
	return thermo.ReducedPlanck / thermo.Boltzmann * math.Sqrt(bulk/density) * math.Cbrt(6*math.Pi*math.Pi*float64(ions)/vol)
}
