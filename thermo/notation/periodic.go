package notation

// periodicSymbols lists the element symbols in order of atomic number
// (IUPAC names, 2016): index i holds Z = i+1. The formula reader accepts
// any of them, whether or not the data have anything on the element.
var periodicSymbols = [...]string{
	"H", "He", "Li", "Be", "B", "C", "N", "O", "F", "Ne",
	"Na", "Mg", "Al", "Si", "P", "S", "Cl", "Ar", "K", "Ca",
	"Sc", "Ti", "V", "Cr", "Mn", "Fe", "Co", "Ni", "Cu", "Zn",
	"Ga", "Ge", "As", "Se", "Br", "Kr", "Rb", "Sr", "Y", "Zr",
	"Nb", "Mo", "Tc", "Ru", "Rh", "Pd", "Ag", "Cd", "In", "Sn",
	"Sb", "Te", "I", "Xe", "Cs", "Ba", "La", "Ce", "Pr", "Nd",
	"Pm", "Sm", "Eu", "Gd", "Tb", "Dy", "Ho", "Er", "Tm", "Yb",
	"Lu", "Hf", "Ta", "W", "Re", "Os", "Ir", "Pt", "Au", "Hg",
	"Tl", "Pb", "Bi", "Po", "At", "Rn", "Fr", "Ra", "Ac", "Th",
	"Pa", "U", "Np", "Pu", "Am", "Cm", "Bk", "Cf", "Es", "Fm",
	"Md", "No", "Lr", "Rf", "Db", "Sg", "Bh", "Hs", "Mt", "Ds",
	"Rg", "Cn", "Nh", "Fl", "Mc", "Lv", "Ts", "Og",
}

// atomicNumbers maps each symbol of periodicSymbols to its Z. Filled once
// when the package starts and only read afterwards.
var atomicNumbers = func() map[string]int {
	m := make(map[string]int, len(periodicSymbols))
	for i, s := range periodicSymbols {
		m[s] = i + 1
	}
	return m
}()

// AtomicNumber returns Z for an element symbol (exact case, "Na"), or 0.
func AtomicNumber(sym string) int { return atomicNumbers[sym] }

// SymbolOfZ returns the symbol of the element with atomic number z, or ""
// outside 1…118.
func SymbolOfZ(z int) string {
	if z < 1 || z > len(periodicSymbols) {
		return ""
	}
	return periodicSymbols[z-1]
}

// IsElementSymbol reports whether sym is a chemical element symbol (exact case).
func IsElementSymbol(sym string) bool { return atomicNumbers[sym] > 0 }
