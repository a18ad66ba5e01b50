package data_test

import (
	"math"
	"testing"

	"enthalpath/data"
	"enthalpath/thermo/lattice"
)

// The data's Born-exponent classes and thermo/lattice's table of Pauling's
// exponents must agree, so that a cycle gets the same n whichever it reads.
// Pauling (The Nature of the Chemical Bond, 3rd ed., 1960; from memory):
// He 5, Ne 7, Ar and Cu⁺ 9, Kr and Ag⁺ 10, Xe and Au⁺ 12.
func TestBornClassesAgreeWithLattice(t *testing.T) {
	db, err := data.Load()
	if err != nil {
		t.Fatal(err)
	}
	for _, tc := range []struct {
		ion    string
		config string
		n      float64 // Pauling 1960, from memory
	}{
		{"Na+", "Ne", 7},
		{"Cl-", "Ar", 9},
		{"Cu+", "[Ar]3d10", 9},
		{"Zn2+", "[Ar]3d10", 9},
		{"Ag+", "[Kr]4d10", 10},
		{"Cd2+", "[Kr]4d10", 10},
		{"Au+", "[Xe]4f14 5d10", 12},
		{"Hg2+", "[Xe]4f14 5d10", 12},
		{"I-", "Xe", 12},
	} {
		ion, err := db.Ion(tc.ion)
		if err != nil {
			t.Errorf("%s: %v", tc.ion, err)
			continue
		}
		if ion.BornConfig != tc.config || math.Abs(ion.BornExponent.V-tc.n) > 1e-12 {
			t.Errorf("%s: class %q n = %g, want %q n = %g", tc.ion, ion.BornConfig, ion.BornExponent.V, tc.config, tc.n)
		}
	}
	for _, ion := range db.Ions() {
		if ion.BornConfig == "" {
			continue
		}
		n, err := lattice.PaulingExponent(ion.BornConfig)
		if err != nil {
			t.Errorf("%s: class %q unknown to thermo/lattice: %v", ion.Symbol, ion.BornConfig, err)
			continue
		}
		if math.Abs(n-ion.BornExponent.V) > 1e-12 {
			t.Errorf("%s: class %q: n = %g in the data, %g in thermo/lattice", ion.Symbol, ion.BornConfig, ion.BornExponent.V, n)
		}
	}
}
