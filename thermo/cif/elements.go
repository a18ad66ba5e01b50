package cif

import "strings"

// elementSymbols lists the chemical elements by atomic number (index 0 is
// unused), hydrogen to oganesson, as named by IUPAC (the 2016
// recommendations complete the seventh period). Never written.
var elementSymbols = [...]string{"",
	"H", "He",
	"Li", "Be", "B", "C", "N", "O", "F", "Ne",
	"Na", "Mg", "Al", "Si", "P", "S", "Cl", "Ar",
	"K", "Ca", "Sc", "Ti", "V", "Cr", "Mn", "Fe", "Co", "Ni", "Cu", "Zn",
	"Ga", "Ge", "As", "Se", "Br", "Kr",
	"Rb", "Sr", "Y", "Zr", "Nb", "Mo", "Tc", "Ru", "Rh", "Pd", "Ag", "Cd",
	"In", "Sn", "Sb", "Te", "I", "Xe",
	"Cs", "Ba",
	"La", "Ce", "Pr", "Nd", "Pm", "Sm", "Eu", "Gd", "Tb", "Dy", "Ho", "Er", "Tm", "Yb", "Lu",
	"Hf", "Ta", "W", "Re", "Os", "Ir", "Pt", "Au", "Hg",
	"Tl", "Pb", "Bi", "Po", "At", "Rn",
	"Fr", "Ra",
	"Ac", "Th", "Pa", "U", "Np", "Pu", "Am", "Cm", "Bk", "Cf", "Es", "Fm", "Md", "No", "Lr",
	"Rf", "Db", "Sg", "Bh", "Hs", "Mt", "Ds", "Rg", "Cn",
	"Nh", "Fl", "Mc", "Lv", "Ts", "Og",
}

// AtomicNumber returns the atomic number of the element with symbol sym
// (exact case, as "Na"), or 0 if there is none.
func AtomicNumber(sym string) int {
	for z := 1; z < len(elementSymbols); z++ {
		if elementSymbols[z] == sym {
			return z
		}
	}
	return 0
}

// normalizeSymbol writes a one- or two-letter symbol in the usual case:
// "NA" and "na" become "Na".
func normalizeSymbol(s string) string {
	if s == "" {
		return s
	}
	return strings.ToUpper(s[:1]) + strings.ToLower(s[1:])
}

// isLetter reports an ASCII letter.
func isLetter(c byte) bool { return c >= 'A' && c <= 'Z' || c >= 'a' && c <= 'z' }

// elementPrefix finds the element that a type symbol or label starts with:
// the leading letters if they form a symbol ("Cl2" → "Cl"), else the first
// letter alone ("Ob" → "O"). It returns the symbol and the number of bytes it
// used, or "", 0.
func elementPrefix(s string) (string, int) {
	n := 0
	for n < len(s) && n < 2 && isLetter(s[n]) {
		n++
	}
	if n == 2 {
		if two := normalizeSymbol(s[:2]); AtomicNumber(two) > 0 {
			return two, 2
		}
	}
	if n >= 1 {
		if one := normalizeSymbol(s[:1]); AtomicNumber(one) > 0 {
			return one, 1
		}
	}
	return "", 0
}
