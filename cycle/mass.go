package cycle

// standardAtomicWeights are conventional standard atomic weights in g/mol
// (IUPAC, abridged to 4–5 significant figures; "Standard atomic weights of
// the elements 2021", Pure Appl. Chem. 95, 2023 — from memory). They serve
// only the molar volume V_m = M/(ρ·N_A) of the volume-based model, whose
// own uncertainty is percent-level. The data tables carry no masses; this
// table is private to that one use.
var standardAtomicWeights = map[string]float64{
	"H": 1.008, "He": 4.0026, "Li": 6.94, "Be": 9.0122, "B": 10.81, "C": 12.011, "N": 14.007, "O": 15.999,
	"F": 18.998, "Ne": 20.180, "Na": 22.990, "Mg": 24.305, "Al": 26.982, "Si": 28.085, "P": 30.974,
	"S": 32.06, "Cl": 35.45, "Ar": 39.95, "K": 39.098, "Ca": 40.078, "Sc": 44.956, "Ti": 47.867,
	"V": 50.942, "Cr": 51.996, "Mn": 54.938, "Fe": 55.845, "Co": 58.933, "Ni": 58.693, "Cu": 63.546,
	"Zn": 65.38, "Ga": 69.723, "Ge": 72.630, "As": 74.922, "Se": 78.971, "Br": 79.904, "Kr": 83.798,
	"Rb": 85.468, "Sr": 87.62, "Y": 88.906, "Zr": 91.224, "Nb": 92.906, "Mo": 95.95, "Ru": 101.07,
	"Rh": 102.91, "Pd": 106.42, "Ag": 107.87, "Cd": 112.41, "In": 114.82, "Sn": 118.71, "Sb": 121.76,
	"Te": 127.60, "I": 126.90, "Xe": 131.29, "Cs": 132.91, "Ba": 137.33, "La": 138.91, "Ce": 140.12,
	"Hf": 178.49, "Ta": 180.95, "W": 183.84, "Pt": 195.08, "Au": 196.97, "Hg": 200.59, "Tl": 204.38,
	"Pb": 207.2, "Bi": 208.98,
}

// coreMass returns the molar mass of an ion core ("Na", "SO4"), or 0 when
// an element is not in the table.
func coreMass(core string) float64 {
	counts, order, err := parseBinary(core)
	if err != nil {
		return 0
	}
	m := 0.0
	for _, s := range order {
		w, ok := standardAtomicWeights[s]
		if !ok {
			return 0
		}
		m += w * float64(counts[s])
	}
	return m
}

// molarMass returns the molar mass of one formula unit (g/mol), or 0.
func molarMass(cation, anion Part) float64 {
	mc, ma := coreMass(cation.Ion.Core), coreMass(anion.Ion.Core)
	if mc == 0 || ma == 0 {
		return 0
	}
	return float64(cation.Count)*mc + float64(anion.Count)*ma
}
