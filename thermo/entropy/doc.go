// Package entropy estimates the standard entropy S°(298.15 K) of an ionic
// solid that has no measured one, from its formula-unit volume V_m
// (volume-based thermodynamics) or from additive single-ion contributions.
//
// The package holds formulas only: no table of compounds or ions. Entropies
// are in J/(mol·K) per mole of formula units; volumes in nm³ per formula
// unit (thermo/lattice.MolarVolumeFromCell and MolarVolumeFromDensity make
// them); radii in ångström.
//
// # Volume-based estimate
//
// H. D. B. Jenkins and L. Glasser, "Standard absolute entropy, S°298,
// values from volume or density. 1. Inorganic materials", Inorg. Chem. 42,
// 8702–8708 (2003), doi:10.1021/ic030219p, fit
//
//	S°298 = k·V_m + c
//
// with k = 1360 J/(K·mol·nm³), c = 15 J/(K·mol) for simple ionic salts,
// k = 1579, c = 6 for ionic hydrates and k = 1262, c = 13 for minerals
// (the constants as stated in the paper's abstract). The paper's scatter
// about the line is of the order of 10 %; the engine measures the scatter
// of the line against the measured entropies it has and uses that as σ.
// The line's domain (InVolumeDomain) is set by θ_D/T: a light, stiff
// lattice has far less entropy at 298 K than its volume suggests.
//
// # Additive estimate
//
// L. Glasser and H. D. B. Jenkins, "Single-ion entropies, S°ion, of solids:
// a route to standard entropy estimation", Inorg. Chem. 48, 7408–7412
// (2009), doi:10.1021/ic900643t, treat S° as a sum of single-ion
// contributions, S° ≈ Σ nᵢ·θᵢ, retrieved by least squares from measured
// entropies. FitIons does that fit over the compounds it is given; the
// contributions are therefore the data's own, never typed in.
package entropy
