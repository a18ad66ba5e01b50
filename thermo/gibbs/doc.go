// Package gibbs computes the Gibbs energy of a reaction at a temperature
// from its standard enthalpy and entropy at 298.15 K, with the heat
// capacities neglected (ΔrCp = 0, so ΔrH and ΔrS keep their 298.15 K
// values), and the temperature at which it crosses zero.
//
// Units: ΔrH and ΔrG in kJ/mol of the reaction as written, ΔrS in
// J/(mol·K), temperatures in kelvin, pressures in bar (standard pressure
// p° = 1 bar). Gases are ideal; condensed phases are pure and at unit
// activity. Phase changes of reactants or products between 298.15 K and T
// are not included.
//
//	ΔrG(T, p) = ΔrH° − T·ΔrS° + Δn_gas·R·T·ln(p/p°)
//
// where Δn_gas is the change in moles of the gas held at partial pressure
// p (the gas given off). Uncertainties are standard uncertainties combined
// as independent: σ_G² = σ_H² + (T·σ_S)².
package gibbs
