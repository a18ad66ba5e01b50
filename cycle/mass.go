package cycle

import "enthalpath/data"

// coreMass returns the molar mass of an ion core ("Na", "SO4") in g/mol
// from the data's standard atomic weights (atomic_weights.csv, CIAAW
// values, conventional where the weight is an interval), or 0 when an
// element has none. The mass serves
// only the molar volume V_m = M/(ρ·N_A) of the volume-based model, whose
// own uncertainty is percent-level.
func coreMass(db *data.DB, core string) float64 {
	comp, err := parseBinary(core)
	if err != nil {
		return 0
	}
	m := 0.0
	for _, t := range comp {
		e, err := db.Element(t.Symbol)
		if err != nil || !e.AtomicMass.Known() {
			return 0
		}
		m += e.AtomicMass.V * float64(t.Count)
	}
	return m
}

// molarMass returns the molar mass of one formula unit (g/mol), or 0.
func molarMass(db *data.DB, cation, anion Part) float64 {
	mc, ma := coreMass(db, cation.Ion.Core), coreMass(db, anion.Ion.Core)
	if mc == 0 || ma == 0 {
		return 0
	}
	return float64(cation.Count)*mc + float64(anion.Count)*ma
}
