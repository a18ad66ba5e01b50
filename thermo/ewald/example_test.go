package ewald_test

import (
	"fmt"

	"enthalpath/thermo/crystal"
	"enthalpath/thermo/ewald"
)

// The Madelung constant of rock salt (published value 1.747565, handbook
// tables of Madelung constants, from memory) and its energy per formula unit
// for NaCl's lattice parameter. The expected energy and potential follow
// from the published A alone, worked by hand with the CODATA 2018
// constants: E = −A·N_A·e²/(4πε₀d) = −861.0 kJ/mol and
// φ(Na) = −A·e/(4πε₀d) = −8.9232 V for d = a/2 = 2.8201 Å.
func ExampleSum() {
	nacl, err := crystal.Build("rock-salt", map[string]float64{"a": 5.6402})
	if err != nil {
		fmt.Println(err)
		return
	}
	nacl, err = nacl.WithIons(map[string]crystal.Ion{"M": {Species: "Na", Charge: 1}, "X": {Species: "Cl", Charge: -1}})
	if err != nil {
		fmt.Println(err)
		return
	}
	r, err := ewald.Sum(nacl, ewald.Options{})
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Printf("A = %.6f (d = %.4f Å)\n", r.MadelungConstant, r.NearestDistance)
	fmt.Printf("E = %.1f kJ/mol, φ(Na) = %.4f V\n", r.EnergyKJPerMol, r.SitePotentials[0])
	// Output:
	// A = 1.747565 (d = 2.8201 Å)
	// E = -861.0 kJ/mol, φ(Na) = -8.9232 V
}
