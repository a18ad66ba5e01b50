package data

import (
	"math"
	"testing"

	"enthalpath/thermo"
)

// TestUnitFactorIsThermos: data's copy of the eV → kJ/mol factor is
// thermo's, bit for bit, and both are CODATA 2018's 96.485 332 12… kJ/mol
// (e and N_A exact since the 2019 SI; physics.nist.gov/constants).
func TestUnitFactorIsThermos(t *testing.T) {
	if kJPerMolPerEV != thermo.KJPerMolPerEV {
		t.Errorf("data's factor %.17g, thermo's %.17g", kJPerMolPerEV, thermo.KJPerMolPerEV)
	}
	if math.Abs(kJPerMolPerEV-96.48533212) > 1e-8 {
		t.Errorf("factor %.12g, want 96.48533212 (CODATA 2018)", kJPerMolPerEV)
	}
}
