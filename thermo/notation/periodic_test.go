package notation

import "testing"

// Atomic numbers of the IUPAC periodic table (from memory); the lookup is
// exact-case and every symbol round-trips through SymbolOfZ.
func TestAtomicNumber(t *testing.T) {
	for sym, z := range map[string]int{"H": 1, "Na": 11, "Fe": 26, "I": 53, "U": 92, "Og": 118, "fe": 0, "Xx": 0, "": 0} {
		if got := AtomicNumber(sym); got != z || IsElementSymbol(sym) != (z > 0) {
			t.Errorf("AtomicNumber(%q) = %d, IsElementSymbol %v; want %d", sym, got, IsElementSymbol(sym), z)
		}
	}
	for z := 1; z <= 118; z++ {
		if got := AtomicNumber(SymbolOfZ(z)); got != z {
			t.Errorf("AtomicNumber(SymbolOfZ(%d)) = %d", z, got)
		}
	}
}
