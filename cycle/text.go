package cycle

import (
	"fmt"
	"math"
	"strconv"
	"strings"

	"enthalpath/data"
)

var subscripts = strings.NewReplacer("0", "₀", "1", "₁", "2", "₂", "3", "₃", "4", "₄", "5", "₅", "6", "₆", "7", "₇", "8", "₈", "9", "₉")
var superscripts = map[rune]string{'0': "⁰", '1': "¹", '2': "²", '3': "³", '4': "⁴", '5': "⁵", '6': "⁶", '7': "⁷", '8': "⁸", '9': "⁹", '+': "⁺", '-': "⁻"}

// subscriptDigits writes the digits of a formula as subscripts: "MgF2" → "MgF₂".
func subscriptDigits(f string) string { return subscripts.Replace(f) }

func superscript(s string) string {
	var b strings.Builder
	for _, r := range s {
		if t, ok := superscripts[r]; ok {
			b.WriteString(t)
		} else {
			b.WriteRune(r)
		}
	}
	return b.String()
}

// The charges a cycle meets, written out so that chargeText allocates nothing.
var (
	cationCharges = [...]string{"", "⁺", "²⁺", "³⁺", "⁴⁺", "⁵⁺", "⁶⁺", "⁷⁺", "⁸⁺", "⁹⁺"}
	anionCharges  = [...]string{"", "⁻", "²⁻", "³⁻", "⁴⁻", "⁵⁻", "⁶⁻", "⁷⁻", "⁸⁻", "⁹⁻"}
)

// chargeText is the charge as a superscript: 2 → "²⁺", −1 → "⁻", 0 → "".
func chargeText(z int) string {
	switch {
	case z >= 0 && z < len(cationCharges):
		return cationCharges[z]
	case z < 0 && -z < len(anionCharges):
		return anionCharges[-z]
	case z > 0:
		return superscript(strconv.Itoa(z) + "+")
	}
	return superscript(strconv.Itoa(-z) + "-")
}

// ionText writes element el with charge z: "Mg²⁺", "O⁻", "Na".
func ionText(el string, z int) string { return el + chargeText(z) }

// ionSymbolText writes a data ion with sub- and superscripts: "SO₄²⁻".
func ionSymbolText(in data.Ion) string { return subscriptDigits(in.Core) + chargeText(in.Charge) }

// IonText writes an ion symbol for display ("SO4^2-" → "SO₄²⁻").
func IonText(in data.Ion) string { return ionSymbolText(in) }

func countPrefix(n int) string {
	if n == 1 {
		return ""
	}
	return strconv.Itoa(n) + " "
}

// coefficient writes a stoichiometric coefficient: 1 → "", 0.5 → "½",
// 1.5 → "3/2 ", 2 → "2 ".
func coefficient(x float64) string {
	switch {
	case math.Abs(x-1) < 1e-9:
		return ""
	case math.Abs(x-0.5) < 1e-9:
		return "½"
	case math.Abs(x-math.Round(x)) < 1e-9:
		return strconv.Itoa(int(math.Round(x))) + " "
	case math.Abs(2*x-math.Round(2*x)) < 1e-9:
		return strconv.Itoa(int(math.Round(2*x))) + "/2 "
	}
	return fmt.Sprintf("%g ", x)
}

// splitState reads a standard state "Cl2(g)", "S(s,rhombic)", "Na(s)" into
// the formula, its atoms per molecule and the phase "(g)".
func splitState(state, symbol string) (formula string, atoms int, phase string) {
	if state == "" {
		return symbol, 1, "(s)"
	}
	i := strings.IndexByte(state, '(')
	if i < 0 {
		i = len(state)
	}
	formula, phase = state[:i], state[i:]
	atoms = 1
	if rest := strings.TrimPrefix(formula, symbol); rest != formula && rest != "" {
		if n, ok := readCount(rest); ok {
			atoms = n
		}
	}
	return formula, atoms, phase
}

// prettyReaction writes the digits of a data reaction as subscripts and
// drops the space after a coefficient: "Cl2(g) → 2 Cl(g)" → "Cl₂(g) → 2Cl(g)".
func prettyReaction(r string) string {
	parts := strings.Fields(r)
	var b strings.Builder
	b.Grow(len(r) + 8)
	for i := 0; i < len(parts); i++ {
		if i > 0 {
			b.WriteByte(' ')
		}
		p := parts[i]
		if isInteger(p) && i+1 < len(parts) && parts[i+1] != "→" && parts[i+1] != "+" {
			b.WriteString(p)
			subscripts.WriteString(&b, parts[i+1])
			i++
			continue
		}
		subscripts.WriteString(&b, p)
	}
	return b.String()
}

func isInteger(s string) bool {
	if s == "" {
		return false
	}
	for _, r := range s {
		if r < '0' || r > '9' {
			return false
		}
	}
	return true
}

// readCount reads a count or charge written in decimal digits: no sign,
// no leading zero (fmt.Sscan would read "010" as octal 8), at most 9
// digits. It reports false for anything else.
func readCount(s string) (int, bool) {
	if s == "" || s[0] == '0' || len(s) > 9 || !isInteger(s) {
		return 0, false
	}
	n, err := strconv.Atoi(s)
	return n, err == nil
}

// elementTerms writes the elements of comp in their standard states with
// coefficients: Na 1, Cl 1 → "Na(s) + ½Cl₂(g)".
func elementTerms(db *data.DB, comp composition) string {
	var b strings.Builder
	for i, t := range comp {
		state := t.Symbol + "(s)"
		if el, err := db.Element(t.Symbol); err == nil && el.StandardState != "" {
			state = el.StandardState
		}
		formula, atoms, phase := splitState(state, t.Symbol)
		if i > 0 {
			b.WriteString(" + ")
		}
		b.WriteString(coefficient(float64(t.Count) / float64(atoms)))
		subscripts.WriteString(&b, formula)
		b.WriteString(phase)
	}
	return b.String()
}

// formationReaction is the left side of the formation reaction.
func formationReaction(db *data.DB, c *Cycle) string {
	var comp composition
	addCore := func(core string, mult int) {
		cc, err := parseBinary(core)
		if err != nil {
			cc = composition{{Symbol: core, Count: 1}}
		}
		for _, t := range cc {
			comp = comp.add(t.Symbol, t.Count*mult)
		}
	}
	addCore(c.Cation.Ion.Core, c.Cation.Count)
	addCore(c.Anion.Ion.Core, c.Anion.Count)
	return elementTerms(db, comp)
}

// ionFormationReaction writes the formation of a gaseous polyatomic ion
// from its elements: "½N₂(g) + 2H₂(g) → NH₄⁺(g) + e⁻".
func ionFormationReaction(db *data.DB, in data.Ion) string {
	comp, err := parseBinary(in.Core)
	left := subscriptDigits(in.Core)
	if err == nil {
		left = elementTerms(db, comp)
	}
	ion := ionSymbolText(in) + "(g)"
	switch {
	case in.Charge > 0:
		return left + " → " + ion + " + " + countPrefix(in.Charge) + "e⁻"
	case in.Charge < 0:
		return left + " + " + countPrefix(-in.Charge) + "e⁻ → " + ion
	}
	return left + " → " + ion
}
