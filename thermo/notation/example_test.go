package notation_test

import (
	"fmt"

	"enthalpath/thermo/notation"
)

func ExampleParseFormula() {
	f, err := notation.ParseFormula("Ca3(PO4)2")
	if err != nil {
		fmt.Println(err)
		return
	}
	for _, g := range f.Groups {
		fmt.Println(g.Text, g.Count, g.Bracketed)
	}
	fmt.Println(f.Hill(), f.Atoms())

	_, err = notation.ParseFormula("CuSO4·5H2O")
	fmt.Println(err)
	// Output:
	// Ca 3 false
	// PO4 2 true
	// Ca3O8P2 13
	// formula "CuSO4·5H2O": hydrates and adducts are not supported: '·' joins two parts at column 6; enter the salt alone (CuSO4) and treat the water or the other part as a step of its own
}
