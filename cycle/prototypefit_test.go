package cycle

import (
	"errors"
	"testing"
)

// TestPrototypeFits: a prototype fits a binary compound when its sites are
// one cation kind and one anion kind in the compound's ratio: rock salt
// holds NaCl (1:1), fluorite CaF2 (1:2) and corundum Al2O3 (2:3); spinel
// (AB2X4, three species) holds none of them, rock salt not CaF2 (the
// structures' compositions as tabulated in Wyckoff, Crystal Structures,
// vol. 1, 1963, from memory).
func TestPrototypeFits(t *testing.T) {
	for _, tc := range []struct {
		formula, prototype string
		fits               bool
	}{
		{"NaCl", "rock-salt", true},
		{"CaF2", "fluorite", true},
		{"Al2O3", "corundum", true},
		{"NaCl", "spinel", false},
		{"CaF2", "rock-salt", false},
		{"NaCl", "fluorite", false},
	} {
		c := build(t, tc.formula, Options{})
		err := PrototypeFits(c, tc.prototype)
		var fe *PrototypeFitError
		if tc.fits && err != nil {
			t.Errorf("%s in %s: %v, want it to fit", tc.formula, tc.prototype, err)
		}
		if !tc.fits && !errors.As(err, &fe) {
			t.Errorf("%s in %s: %v, want a PrototypeFitError", tc.formula, tc.prototype, err)
		}
	}
}

// TestModelErrorsNameTheirOwnModel: with a structure whose Madelung sum
// fails (spinel for NaCl), every model that needs it reports the failure
// under its own name; the Born–Landé row once said "model ewald".
func TestModelErrorsNameTheirOwnModel(t *testing.T) {
	c := build(t, "NaCl", Options{})
	c.Settings.Structure = Structure{Prototype: "spinel"}
	for _, m := range EvaluateModels(c) {
		var me *ModelError
		if m.Err != nil && (!errors.As(m.Err, &me) || me.Model != m.Model) {
			t.Errorf("%s: error %v names another model", m.Model, m.Err)
		}
	}
}
