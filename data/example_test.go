package data_test

import (
	"fmt"

	"enthalpath/data"
)

func ExampleDB_Radius() {
	db, err := data.Load()
	if err != nil {
		fmt.Println(err)
		return
	}
	// Shannon (1976): Fe2+ in octahedral coordination, high spin.
	r, _ := db.Radius("Fe", 2, "VI", "HS")
	fmt.Println(r.CN, r.Spin, r.Ionic.V, r.Crystal.V, r.Ionic.Source)
	// Caesium has no CN VII row: the nearest lower CN is used, and said so.
	r, _ = db.Radius("Cs", 1, "VII", "")
	fmt.Println(r.CN, r.Ionic.V, r.Substituted)
	// Output:
	// VI HS 0.78 0.92 shannon1976
	// VI 1.67 CN VII not tabulated for Cs+; nearest CN VI used
}

func ExampleDB_Ion() {
	db, _ := data.Load()
	for _, q := range []string{"Ca2+", "Ca+2", "Fe^3+", "O²⁻"} {
		ion, err := db.Ion(q)
		fmt.Println(q, "→", ion.Symbol, ion.Charge, err)
	}
	// Output:
	// Ca2+ → Ca2+ 2 <nil>
	// Ca+2 → Ca2+ 2 <nil>
	// Fe^3+ → Fe3+ 3 <nil>
	// O²⁻ → O2- -2 <nil>
}
