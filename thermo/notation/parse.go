package notation

import (
	"errors"
	"strconv"
	"strings"
)

var errTooManyAtoms = errors.New("too many atoms")

// MaxCount is the largest count a formula may write after a part.
const MaxCount = 999999

const (
	maxDepth = 16
	maxAtoms = MaxCount // per element, so that Hill counts read back
)

// ParseFormula reads a chemical formula: element symbols with counts,
// nested (), [] and {} groups with counts (Mg(OH)2, Ca3(PO4)2), Unicode
// subscript digits, spaces between parts, and a trailing charge: "NH4+",
// "SO4^2-", "SO4 2-", "Fe3+", "Fe+3", "O2-", "SO₄²⁻".
//
// Without a caret or space, digits right before a trailing sign are the
// charge when the formula is a single element ("Fe3+", "O2-" is oxide) and a
// count otherwise ("NH4+", "NO3-"); write "SO4^2-" or "SO4 2-" for a
// multi-atom ion with a charge beyond ±1, and "O2^-" for superoxide.
// Hydrates ("CuSO4·5H2O", "CuSO4.5H2O") are rejected. Errors are
// *FormulaError with the column of the offending character.
func ParseFormula(s string) (Formula, error) {
	p := &formulaParser{input: s, in: []rune(s)}
	return p.parse()
}

type formulaParser struct {
	input string
	in    []rune
	pos   int
}

// fail reports an error at the 1-based character position col (0: the
// whole input).
func (p *formulaParser) fail(col int, msg string) error {
	return &FormulaError{Input: p.input, Column: col, Msg: msg}
}

// failHint is fail with advice on what to type instead.
func (p *formulaParser) failHint(col int, msg, hint string) error {
	return &FormulaError{Input: p.input, Column: col, Msg: msg, Hint: hint}
}

func (p *formulaParser) peek() rune {
	if p.pos < len(p.in) {
		return normalizeRune(p.in[p.pos])
	}
	return 0
}

// normalizeRune maps subscript digits to ASCII and the minus sign to '-'.
func normalizeRune(r rune) rune {
	switch {
	case r >= '₀' && r <= '₉':
		return '0' + (r - '₀')
	case r == '−' || r == '–':
		return '-'
	}
	return r
}

func isSuperscript(r rune) bool {
	return strings.ContainsRune("⁰¹²³⁴⁵⁶⁷⁸⁹⁺⁻", r)
}

func superscriptToASCII(r rune) rune {
	if i := strings.IndexRune("⁰¹²³⁴⁵⁶⁷⁸⁹", r); i >= 0 {
		return '0' + rune(len([]rune("⁰¹²³⁴⁵⁶⁷⁸⁹"[:i])))
	}
	switch r {
	case '⁺':
		return '+'
	case '⁻':
		return '-'
	}
	return r
}

// isJoiner reports a character written between the parts of a hydrate or
// an adduct: "CuSO4·5H2O", "CuSO4.5H2O", "NaCl*NH3" (middle dots, bullets,
// full stops, the asterisk, their full-width forms).
func isJoiner(r rune) bool { return strings.ContainsRune("·.*•∙⋅．・＊", r) }

// adduct reports the joiner at the 1-based column col. It names the salt
// before the joiner only when that part is itself a formula, so that the
// advice leads somewhere.
func (p *formulaParser) adduct(col int) error {
	hint := "enter the salt alone"
	if head := string(p.in[:col-1]); strings.TrimSpace(head) != "" {
		if f, err := ParseFormula(head); err == nil {
			hint += " (" + f.String() + ")"
		}
	}
	return p.failHint(col, "hydrates and adducts are not supported: "+strconv.QuoteRune(p.in[col-1])+" joins two parts",
		hint+" and treat the water or the other part as a step of its own")
}

// Full-width forms U+FF01…U+FF5E of the printable ASCII characters (an East
// Asian keyboard's "Ｃ", "２") lie at a fixed offset from them.
const (
	fullWidthFirst  = 0xFF01
	fullWidthLast   = 0xFF5E
	fullWidthOffset = 0xFF01 - '!'
)

func isFullWidth(r rune) bool { return r >= fullWidthFirst && r <= fullWidthLast }

// unexpected reports the character at the 1-based column col, whole (a
// rune, not a byte), with its code point when it is not ASCII; where says
// where it was met (" in the charge"). A full-width letter or digit is
// answered with its ASCII form, and with the whole formula typed in ASCII
// when that reads.
func (p *formulaParser) unexpected(col int, where string) error {
	r := p.in[col-1]
	if isFullWidth(r) {
		hint := "type the ASCII " + strconv.QuoteRune(r-fullWidthOffset)
		ascii := make([]rune, len(p.in))
		for i, c := range p.in {
			if isFullWidth(c) {
				c -= fullWidthOffset
			}
			ascii[i] = c
		}
		if f, err := ParseFormula(string(ascii)); err == nil {
			hint += ": " + f.String()
		}
		return p.failHint(col, "full-width character "+strconv.QuoteRune(r)+where, hint)
	}
	msg := "unexpected character " + strconv.QuoteRune(r)
	if r > 0x7F {
		hex := strings.ToUpper(strconv.FormatInt(int64(r), 16))
		msg += " (U+" + strings.Repeat("0", max(0, 4-len(hex))) + hex + ")"
	}
	return p.fail(col, msg+where)
}

func isUpper(r rune) bool { return r >= 'A' && r <= 'Z' }
func isLower(r rune) bool { return r >= 'a' && r <= 'z' }
func isDigit(r rune) bool { return r >= '0' && r <= '9' }

func (p *formulaParser) parse() (Formula, error) {
	var f Formula
	if strings.TrimSpace(p.input) == "" {
		return f, p.fail(0, "empty formula")
	}
	lastCountDigits := false // the previous token ended with a written count
	for {
		p.skipSpaces()
		if p.pos >= len(p.in) {
			break
		}
		c := p.peek()
		col := p.pos + 1
		switch {
		case isUpper(c):
			sym, err := p.symbol()
			if err != nil {
				return f, err
			}
			n, written, err := p.count()
			if err != nil {
				return f, err
			}
			f.Groups = append(f.Groups, Group{Text: sym, Count: n})
			lastCountDigits = written
		case c == '(' || c == '[' || c == '{':
			text, atoms, err := p.bracket(1)
			if err != nil {
				return f, err
			}
			n, written, err := p.count()
			if err != nil {
				return f, err
			}
			f.Groups = append(f.Groups, Group{Text: text, Count: n, Bracketed: true, atoms: atoms})
			lastCountDigits = written
		case c == '^' || c == '+' || c == '-' || isSuperscript(p.in[p.pos]):
			if len(f.Groups) == 0 {
				return f, p.fail(col, "a charge must follow the formula")
			}
			q, err := p.charge(&f, lastCountDigits)
			if err != nil {
				return f, err
			}
			f.Charge = q
		case isDigit(c):
			// "SO4 2-": a space-separated charge; anything else is a misplaced count.
			if len(f.Groups) > 0 && p.in[p.pos-1] == ' ' && p.restIsCharge() {
				q, err := p.charge(&f, false)
				if err != nil {
					return f, err
				}
				f.Charge = q
				break
			}
			if len(f.Groups) == 0 {
				return f, p.fail(col, "a formula cannot start with a number (write \"NaCl\", not \"2NaCl\")")
			}
			return f, p.fail(col, "a count must follow an element or a closing bracket")
		case isJoiner(c):
			return f, p.adduct(col)
		case c == ')' || c == ']' || c == '}':
			return f, p.fail(col, "unmatched "+strconv.QuoteRune(c))
		case isLower(c):
			return f, p.fail(col, "element symbols start with a capital letter, found "+strconv.QuoteRune(c))
		default:
			return f, p.unexpected(col, "")
		}
	}
	if len(f.Groups) == 0 {
		return f, p.fail(0, "no elements in the formula")
	}
	total := map[string]int{}
	for _, g := range f.Groups {
		for el, n := range g.Composition() {
			if n > maxAtoms/g.Count {
				return f, p.fail(0, "too many atoms of "+el)
			}
			total[el] += n * g.Count
			if total[el] > maxAtoms {
				return f, p.fail(0, "too many atoms of "+el+" (at most 999999)")
			}
		}
	}
	return f, nil
}

func (p *formulaParser) skipSpaces() {
	for p.pos < len(p.in) && (p.in[p.pos] == ' ' || p.in[p.pos] == '\t') {
		p.pos++
	}
}

// restIsCharge reports whether the rest of the input is digits then a sign.
func (p *formulaParser) restIsCharge() bool {
	i := p.pos
	for i < len(p.in) && isDigit(normalizeRune(p.in[i])) {
		i++
	}
	if i >= len(p.in) || (normalizeRune(p.in[i]) != '+' && normalizeRune(p.in[i]) != '-') {
		return false
	}
	i++
	for i < len(p.in) && p.in[i] == ' ' {
		i++
	}
	return i == len(p.in)
}

func (p *formulaParser) symbol() (string, error) {
	col := p.pos + 1
	sym := string(p.peek())
	p.pos++
	if isLower(p.peek()) {
		two := sym + string(p.peek())
		if IsElementSymbol(two) {
			p.pos++
			return two, nil
		}
		if !IsElementSymbol(sym) {
			return "", p.fail(col, "unknown element "+strconv.Quote(two))
		}
		// "Cx": C followed by a stray lower-case letter.
		return "", p.fail(col, "unknown element "+strconv.Quote(two))
	}
	if !IsElementSymbol(sym) {
		return "", p.fail(col, "unknown element "+strconv.Quote(sym))
	}
	return sym, nil
}

// count reads an optional count; written reports whether digits were present.
func (p *formulaParser) count() (n int, written bool, err error) {
	start := p.pos
	for p.pos < len(p.in) && isDigit(p.peek()) {
		p.pos++
		if p.pos-start > 6 {
			return 0, true, p.fail(start+1, "count too large (at most 999999)")
		}
	}
	if p.pos == start {
		return 1, false, nil
	}
	var digits strings.Builder
	for _, r := range p.in[start:p.pos] {
		digits.WriteRune(normalizeRune(r))
	}
	n, _ = strconv.Atoi(digits.String())
	if n == 0 {
		return 0, true, p.fail(start+1, "zero count")
	}
	if p.in[start] == '0' || normalizeRune(p.in[start]) == '0' {
		return 0, true, p.fail(start+1, "count with a leading zero")
	}
	return n, true, nil
}

var closerOf = map[rune]rune{'(': ')', '[': ']', '{': '}'}

// bracket reads a bracketed group starting at p.pos and returns its
// normalized text and the atoms of one unit.
func (p *formulaParser) bracket(depth int) (string, map[string]int, error) {
	openCol := p.pos + 1
	open := p.peek()
	if depth > maxDepth {
		return "", nil, p.fail(openCol, "brackets nested too deeply")
	}
	closer := closerOf[open]
	p.pos++
	atoms := map[string]int{}
	var text strings.Builder
	for {
		if p.pos >= len(p.in) {
			return "", nil, p.fail(openCol, "unclosed "+strconv.QuoteRune(open))
		}
		c := p.peek()
		col := p.pos + 1
		switch {
		case c == closer:
			p.pos++
			if len(atoms) == 0 {
				return "", nil, p.fail(openCol, "empty brackets")
			}
			return text.String(), atoms, nil
		case c == ')' || c == ']' || c == '}':
			return "", nil, p.fail(col, strconv.QuoteRune(c)+" does not close "+strconv.QuoteRune(open)+" opened at column "+strconv.Itoa(openCol))
		case isUpper(c):
			sym, err := p.symbol()
			if err != nil {
				return "", nil, err
			}
			n, _, err := p.count()
			if err != nil {
				return "", nil, err
			}
			if err := addAtoms(atoms, map[string]int{sym: 1}, n); err != nil {
				return "", nil, p.fail(col, err.Error())
			}
			text.WriteString(sym)
			if n != 1 {
				text.WriteString(strconv.Itoa(n))
			}
		case c == '(' || c == '[' || c == '{':
			inner, in, err := p.bracket(depth + 1)
			if err != nil {
				return "", nil, err
			}
			n, _, err := p.count()
			if err != nil {
				return "", nil, err
			}
			if err := addAtoms(atoms, in, n); err != nil {
				return "", nil, p.fail(col, err.Error())
			}
			text.WriteString("(" + inner + ")")
			if n != 1 {
				text.WriteString(strconv.Itoa(n))
			}
		case isJoiner(c):
			return "", nil, p.adduct(col)
		case c == '+' || c == '-' || c == '^':
			return "", nil, p.fail(col, "a charge goes at the end of the formula, outside brackets")
		case isDigit(c):
			return "", nil, p.fail(col, "a count must follow an element or a closing bracket")
		case isLower(c):
			return "", nil, p.fail(col, "element symbols start with a capital letter, found "+strconv.QuoteRune(c))
		default:
			return "", nil, p.unexpected(col, "")
		}
	}
}

func addAtoms(dst, src map[string]int, n int) error {
	for el, k := range src {
		if k > maxAtoms/n {
			return errTooManyAtoms
		}
		dst[el] += k * n
		if dst[el] > maxAtoms {
			return errTooManyAtoms
		}
	}
	return nil
}

// charge reads the trailing charge. When countIsCharge may apply (digits
// were written right before a bare sign on a single-element formula), the
// count is taken back as the charge's magnitude.
func (p *formulaParser) charge(f *Formula, lastCountDigits bool) (int, error) {
	col := p.pos + 1
	var mag strings.Builder
	sign := rune(0)
	signs := 0
	caret := false
	if p.peek() == '^' {
		caret = true
		p.pos++
	}
	for p.pos < len(p.in) {
		r := normalizeRune(p.in[p.pos])
		if isSuperscript(r) {
			r = superscriptToASCII(r)
		}
		switch {
		case isDigit(r) && signs == 0:
			mag.WriteRune(r)
		case r == '+' || r == '-':
			if sign != 0 && r != sign {
				return 0, p.fail(p.pos+1, "charge has both signs")
			}
			sign = r
			signs++
		case isDigit(r) && signs == 1 && mag.Len() == 0:
			// "Fe+3": sign first, then magnitude.
			mag.WriteRune(r)
			signs = 2 // no further signs
		case isDigit(r) && signs == 2:
			mag.WriteRune(r)
		case r == ' ':
			p.pos++
			p.skipSpaces()
			if p.pos < len(p.in) {
				return 0, p.fail(p.pos+1, "nothing may follow the charge")
			}
			continue
		case isJoiner(r):
			return 0, p.adduct(p.pos + 1)
		default:
			return 0, p.unexpected(p.pos+1, " in the charge")
		}
		p.pos++
	}
	if sign == 0 {
		return 0, p.fail(col, "charge without a sign (write 2+ or 2-)")
	}
	q := 1
	if mag.Len() > 0 {
		if mag.Len() > 3 {
			return 0, p.fail(col, "charge too large")
		}
		q, _ = strconv.Atoi(mag.String())
		if q == 0 {
			return 0, p.fail(col, "charge 0")
		}
		if signs > 2 {
			return 0, p.fail(col, "write the charge once")
		}
	} else if signs > 1 {
		q = signs // "Fe++"
	}
	if !caret && lastCountDigits && mag.Len() == 0 && signs == 1 && len(f.Groups) == 1 && !f.Groups[0].Bracketed {
		// "Fe3+", "O2-": the digits were the charge.
		q = f.Groups[0].Count
		f.Groups[0].Count = 1
	}
	if sign == '-' {
		q = -q
	}
	return q, nil
}
