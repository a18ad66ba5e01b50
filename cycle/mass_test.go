package cycle

import "testing"

// The molar mass comes from the data's standard atomic weights. Expected
// values are the formula weights printed in the CRC Handbook's table of
// physical constants of inorganic compounds (88th ed., section 4), from
// memory; the tolerance covers the abridging of the atomic weights.
func TestMolarMassFromAtomicWeights(t *testing.T) {
	for _, tc := range []struct {
		formula string
		want    float64 // g/mol
	}{
		{"NaCl", 58.443},   // CRC: 58.443 (from memory)
		{"CaF2", 78.075},   // CRC: 78.075 (from memory)
		{"Al2O3", 101.961}, // CRC: 101.961 (from memory)
		{"K2SO4", 174.259}, // CRC: 174.259 (from memory)
		{"NH4Cl", 53.491},  // CRC: 53.491 (from memory)
	} {
		c := build(t, tc.formula, Options{})
		if !near(c.MolarMass, tc.want, 0.01) {
			t.Errorf("%s: molar mass %.4f g/mol, want %.3f ± 0.01", tc.formula, c.MolarMass, tc.want)
		}
	}
}

func TestMolarMassUnknownElementIsZero(t *testing.T) {
	db := loadDB(t)
	if m := coreMass(db, "Tc"); m != 0 {
		t.Errorf("coreMass(Tc) = %g, want 0: technetium has no standard atomic weight", m)
	}
	if m := coreMass(db, "Q2"); m != 0 {
		t.Errorf("coreMass(Q2) = %g, want 0 for an unknown element", m)
	}
}
