// Package gibbs computes the Gibbs energy of a reaction at a temperature
// from its standard enthalpy and entropy at 298.15 K, and the temperature at
// which it crosses zero, with the heat capacities either neglected
// (ΔrCp = 0, so ΔrH and ΔrS keep their 298.15 K values) or taken from every
// species' NASA Glenn 9-coefficient polynomials (Polynomial, Chain; McBride,
// Zehe & Gordon, NASA/TP-2002-211556), which carry the species' phase
// changes as the source gives them.
//
// Units: ΔrH and ΔrG in kJ/mol of the reaction as written, ΔrS in
// J/(mol·K), temperatures in kelvin, pressures in bar (standard pressure
// p° = 1 bar). Gases are ideal; condensed phases are pure and at unit
// activity.
//
//	ΔrG(T, p) = ΔrH° + Σν·[H(T) − H(298.15 K)] − T·(ΔrS° + Σν·[S(T) − S(298.15 K)]) + Δn_gas·R·T·ln(p/p°)
//
// where the sums over the species (ν signed, negative for reactants) are
// zero with the heat capacities neglected, and Δn_gas is the change in
// moles of the gas held at partial pressure p (the gas given off).
// Uncertainties are standard uncertainties of ΔrH° and ΔrS° combined as
// independent, σ_G² = σ_H² + (T·σ_S)²; the polynomials' own uncertainty is
// not propagated.
package gibbs
