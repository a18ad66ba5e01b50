package data_test

import (
	"fmt"

	"enthalpath/data"
)

func ExampleParseFormula() {
	f, err := data.ParseFormula("Ca3(PO4)2")
	if err != nil {
		fmt.Println(err)
		return
	}
	for _, g := range f.Groups {
		fmt.Println(g.Text, g.Count, g.Bracketed)
	}
	fmt.Println(f.Hill(), f.Atoms())

	_, err = data.ParseFormula("CuSO4·5H2O")
	fmt.Println(err)
	// Output:
	// Ca 3 false
	// PO4 2 true
	// Ca3O8P2 13
	// formula "CuSO4·5H2O": hydrates and adducts are not supported: '·' joins two parts at column 6; enter the salt alone (CuSO4) and treat the water or the other part as a step of its own
}
