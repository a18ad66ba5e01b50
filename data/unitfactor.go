package data

// kJPerMolPerEV is the molar energy of 1 eV per particle in kJ/mol,
// e·N_A/1000 from the exact CODATA 2018 values of e (1.602176634e-19 C)
// and N_A (6.02214076e23 mol⁻¹). data converts an electron affinity
// published in kJ/mol to eV once, when its row is read; it keeps its own
// copy of the factor because it imports nothing of the project's physics,
// and TestUnitFactorIsThermos holds the copy to thermo.KJPerMolPerEV.
const kJPerMolPerEV = 1.602176634e-19 * 6.02214076e23 / 1000
