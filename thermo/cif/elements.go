package cif

import (
	"strings"

	"enthalpath/thermo/notation"
)

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
		if two := normalizeSymbol(s[:2]); notation.AtomicNumber(two) > 0 {
			return two, 2
		}
	}
	if n >= 1 {
		if one := normalizeSymbol(s[:1]); notation.AtomicNumber(one) > 0 {
			return one, 1
		}
	}
	return "", 0
}
