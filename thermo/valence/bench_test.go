package valence

import (
	"testing"

	"enthalpath/thermo/cif"
)

// BenchmarkAssign224: charges for a 224-site cell without any, the 2×2×1
// supercell of magnetite written by pymatgen (testdata/oxidation), which
// takes every step up to mixed valence (the issue asks under 50 ms for a
// 200-site cell).
func BenchmarkAssign224(b *testing.B) {
	c, err := cif.ReadFile("../../testdata/oxidation/real_Fe3O4_magnetite_P1.cif", cif.Options{})
	if err != nil {
		b.Fatal(err)
	}
	if c, err = c.Supercell(2, 2, 1); err != nil {
		b.Fatal(err)
	}
	p := loadParams(b)
	cand := Candidates{"Fe": {2, 3}, "O": {-2}}
	b.ReportAllocs()
	for b.Loop() {
		if _, a, err := Assign(c, cand, p); err != nil || a.Method != MixedValence {
			b.Fatalf("%v %v", a.Method, err)
		}
	}
}
