package lattice_test

import (
	"fmt"

	"enthalpath/thermo"
	"enthalpath/thermo/lattice"
)

// Born–Mayer for NaCl: rock-salt Madelung constant, r₀ = 2.814 Å, the
// default ρ = 0.345 Å.
func ExampleBornMayer() {
	nacl := lattice.IonPair{Madelung: 1.74756, ZCation: 1, ZAnion: -1, R0: 2.814}
	u, err := lattice.BornMayer(nacl, lattice.DefaultRho)
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Printf("U(NaCl) = %.1f kJ/mol\n", u)
	_, err = lattice.BornMayer(nacl, 3.0)
	fmt.Println(err)
	// Output:
	// U(NaCl) = -757.0 kJ/mol
	// Born–Mayer range ρ = 3: must be less than r0 = 2.814 Å
}

// Kapustinskii for MgO with Shannon's six-coordinate radii, and the radius
// sum recovered from the energy.
func ExampleKapustinskii() {
	u, err := lattice.Kapustinskii(2, 2, -2, 0.72, 1.40)
	if err != nil {
		fmt.Println(err)
		return
	}
	s, _ := lattice.KapustinskiiRadiusSum(u, 2, 2, -2)
	fmt.Printf("U(MgO) = %.1f kJ/mol, r+ + r- = %.2f Å\n", u, s)
	// Output: U(MgO) = -3799.3 kJ/mol, r+ + r- = 2.12 Å
}

// Volume-based lattice energy of CaF₂ from its cubic cell (a = 5.4626 Å,
// Z = 4), and the lattice enthalpy at 298.15 K.
func ExampleVolumeBased() {
	ions := []lattice.IonKind{{Charge: 2, Count: 1}, {Charge: -1, Count: 2}}
	vm, _ := lattice.MolarVolumeFromCell(5.4626*5.4626*5.4626, 4)
	est, err := lattice.VolumeBased(vm, ions)
	if err != nil {
		fmt.Println(err)
		return
	}
	h, _ := lattice.EnthalpyFromEnergy(est.U, thermo.StandardTemperature, ions)
	fmt.Printf("V_m = %.5f nm³, fit %s: U = %.0f, ΔH_L = %.0f kJ/mol\n", vm, est.Fit.Name, est.U, h)
	// Output: V_m = 0.04075 nm³, fit MX2 (2:1): U = -2693, ΔH_L = -2689 kJ/mol
}

// The verdict on a cycle value against a model.
func ExampleJudge() {
	fmt.Println(lattice.Judge(-915, -718))
	// Output: gap -197.0 kJ/mol (-27.4 %): substantial covalent character
}
