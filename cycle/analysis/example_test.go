package analysis_test

import (
	"fmt"

	"enthalpath/cycle/analysis"
	"enthalpath/data"
)

// The magnesium chlorides: which disproportionations release heat.
func ExampleAnalyst_Scan() {
	db, err := data.Load()
	if err != nil {
		fmt.Println(err)
		return
	}
	sc, err := analysis.New(db).Scan("Mg", "Cl", analysis.ScanOptions{MaxCharge: 3})
	if err != nil {
		fmt.Println(err)
		return
	}
	for _, d := range sc.Disproportionations {
		fmt.Printf("%-24s exothermic: %v\n", d.Reaction, d.Favoured)
	}
	fmt.Println("favoured:", sc.Favoured)
	// Output:
	// 2 MgCl -> Mg + MgCl2     exothermic: true
	// 3 MgCl -> 2 Mg + MgCl3   exothermic: false
	// 3 MgCl2 -> Mg + 2 MgCl3  exothermic: false
	// 2 MgCl2 -> MgCl + MgCl3  exothermic: false
	// favoured: MgCl2
}
