// Package thermo holds the physics of enthalpath that knows nothing of
// compounds or files: physical constants, energy units and their conversions.
// Its sub-packages hold the crystal model and prototypes (crystal), the CIF
// reader (cif), Ewald summation (ewald) and the lattice-energy models (lattice).
//
// # Units and signs
//
// Every energy inside the program is in kJ/mol of the reaction as written.
// Conversion to kcal/mol or eV per formula unit happens only when printing,
// through Convert and the constants below; nowhere else.
// Lengths are in ångström (1 Å = 1e-10 m) unless a name says otherwise.
//
// A lattice energy here is the energy of the step from gaseous ions to the
// solid: it is negative (exothermic). Models return it with that sign.
//
// # Constants
//
// The constants are the CODATA 2018 recommended values (E. Tiesinga,
// P. J. Mohr, D. B. Newell, B. N. Taylor, "CODATA recommended values of the
// fundamental physical constants: 2018", Rev. Mod. Phys. 93, 025010 (2021)).
// Since the 2019 SI redefinition e, N_A, k_B and h are exact; ε₀ is measured.
package thermo
