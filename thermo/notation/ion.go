package notation

import (
	"slices"
	"strconv"
	"strings"
)

// Ion is one reading of an ion symbol: its core ("Fe", "SO4") and its
// charge in units of e.
type Ion struct {
	Core   string
	Charge int
}

// ChargeSuffix writes a charge: "+", "2-", or with caret "^2-".
func ChargeSuffix(q int, caret bool) string {
	if q == 0 {
		return ""
	}
	sign := "+"
	if q < 0 {
		sign, q = "-", -q
	}
	if q == 1 {
		return sign
	}
	if caret {
		return "^" + strconv.Itoa(q) + sign
	}
	return strconv.Itoa(q) + sign
}

// IonSymbol writes an ion as the tables do: "Ca2+", "NH4+", "SO4^2-".
func IonSymbol(core string, charge int, polyatomic bool) string {
	return strings.TrimSpace(core) + ChargeSuffix(charge, polyatomic)
}

// FoldIon normalizes an ion symbol for lookup: superscripts become a caret
// form ("O²⁻" → "O^2-"), a space before the charge becomes a caret ("SO4 2-"
// → "SO4^2-"), other spaces go, and a sign-first charge is turned around
// ("Fe+3" → "Fe3+", "Fe^+3" → "Fe^3+").
func FoldIon(s string) string {
	s = strings.TrimSpace(s)
	b := make([]rune, 0, len(s))
	sup := false
	for i, r := range s {
		r = normalizeRune(r)
		switch {
		case isSuperscript(r):
			if !sup {
				b = append(b, '^')
				sup = true
			}
			b = append(b, superscriptToASCII(r))
		case r == ' ' || r == '\t':
			rest := strings.TrimSpace(s[i:])
			if rest != "" && strings.Trim(rest, "0123456789+-−") == "" && !slices.Contains(b, '^') {
				b = append(b, '^')
			}
		default:
			b = append(b, r)
		}
	}
	// Sign then digits at the end: move the sign behind the digits.
	i := len(b)
	for i > 0 && isDigit(b[i-1]) {
		i--
	}
	if i < len(b) && i > 0 && (b[i-1] == '+' || b[i-1] == '-') {
		sign := b[i-1]
		copy(b[i-1:], b[i:])
		b[len(b)-1] = sign
	}
	return string(b)
}

// CaretIonSymbol writes an ion with an explicit caret: "Ca^2+", "O2^-".
func CaretIonSymbol(core string, charge int) string {
	sign := "+"
	if charge < 0 {
		sign, charge = "-", -charge
	}
	if charge == 1 {
		return core + "^" + sign
	}
	return core + "^" + strconv.Itoa(charge) + sign
}

// IonReadings lists the (core, charge) pairs an ion symbol may mean, most
// likely first: "SO42-" → (SO4, -2), (SO42, -1), (SO, -42) …
func IonReadings(s string) []Ion {
	folded := FoldIon(s)
	if core, q, ok := strings.Cut(folded, "^"); ok {
		t := []rune(q)
		if len(t) == 0 || (t[len(t)-1] != '+' && t[len(t)-1] != '-') {
			return nil
		}
		n := 1
		if len(t) > 1 {
			var err error
			if n, err = strconv.Atoi(string(t[:len(t)-1])); err != nil || n == 0 {
				return nil
			}
		}
		if t[len(t)-1] == '-' {
			n = -n
		}
		return []Ion{{core, n}}
	}
	t := []rune(folded)
	if len(t) < 2 {
		return nil
	}
	sign := t[len(t)-1]
	if sign != '+' && sign != '-' {
		return nil
	}
	body := t[:len(t)-1]
	signs := 1
	for len(body) > 0 && body[len(body)-1] == sign {
		body = body[:len(body)-1]
		signs++
	}
	mul := 1
	if sign == '-' {
		mul = -1
	}
	if signs > 1 {
		return []Ion{{string(body), mul * signs}}
	}
	i := len(body)
	for i > 0 && isDigit(body[i-1]) {
		i--
	}
	var out []Ion
	for k := i; k < len(body); k++ {
		if k == 0 || body[k] == '0' {
			continue
		}
		q, err := strconv.Atoi(string(body[k:]))
		if err == nil && q > 0 && q < 10 {
			out = append(out, Ion{string(body[:k]), mul * q})
		}
	}
	out = append(out, Ion{string(body), mul})
	return out
}

// ParseIon reads an ion symbol that has one reading: "Mg+", "Mg2+", "O2-",
// "Fe+3", "Fe^3+", "SO4^2-", "O²⁻", "SO4 2-". Digits right before a bare
// sign are the charge when the core is a single element ("O2-" is oxide)
// and a count otherwise ("NO3-"); a symbol whose reading depends on the
// data ("SO42-") is read as ParseFormula reads it (see IonReadings for
// every reading). ok is false when s is not a charged formula or its
// charge is beyond ±99.
func ParseIon(s string) (Ion, bool) {
	f, err := ParseFormula(s)
	if err != nil || f.Charge == 0 || f.Charge > 99 || f.Charge < -99 {
		return Ion{}, false
	}
	core := strings.TrimSuffix(f.String(), ChargeText(f))
	return Ion{Core: core, Charge: f.Charge}, true
}

// ChargeText is the charge part of f.String(): "3+" of "Fe3+", "^2-" of
// "SO4^2-", "" for a neutral formula.
func ChargeText(f Formula) string {
	if f.Charge == 0 || len(f.Groups) == 0 {
		return ""
	}
	return f.chargeText(len(f.Groups) == 1 && !f.Groups[0].Bracketed, f.Groups[0].Count)
}

// GCD returns the greatest common divisor of a and b, never negative;
// GCD(0, 0) is 0.
func GCD[T ~int | ~int64](a, b T) T {
	for b != 0 {
		a, b = b, a%b
	}
	if a < 0 {
		return -a
	}
	return a
}
