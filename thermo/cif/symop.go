package cif

import (
	"math"
	"strconv"
	"strings"

	"enthalpath/thermo/crystal"
)

// Symop is a crystallographic symmetry operation acting on fractional
// coordinates: x' = Rot·x + Trans.
type Symop struct {
	Rot   [3][3]float64
	Trans [3]float64
}

// Apply returns the image of the fractional position f.
func (op Symop) Apply(f crystal.Vec3) crystal.Vec3 {
	var r crystal.Vec3
	for i := 0; i < 3; i++ {
		r[i] = op.Rot[i][0]*f[0] + op.Rot[i][1]*f[1] + op.Rot[i][2]*f[2] + op.Trans[i]
	}
	return r
}

// det returns the determinant of the rotation part.
func (op Symop) det() float64 {
	m := op.Rot
	return m[0][0]*(m[1][1]*m[2][2]-m[1][2]*m[2][1]) -
		m[0][1]*(m[1][0]*m[2][2]-m[1][2]*m[2][0]) +
		m[0][2]*(m[1][0]*m[2][1]-m[1][1]*m[2][0])
}

// ParseSymop reads a symmetry operation written as three comma-separated
// coordinate expressions, the form of the CIF core data names
// _symmetry_equiv_pos_as_xyz and _space_group_symop_operation_xyz:
// "x, y, z", "-x+1/2, y, -z+1/2", "x-y,x,z+1/3", "1/2+x", "0.5-Y".
//
// Each expression is a sum of terms; a term is a signed variable (x, y or z,
// either case), a signed number (integer, decimal or fraction p/q), or a
// whole number times a variable ("2x", "2*x", "x*2"): the rotation part of
// a crystallographic operation is an integer matrix. Spaces are ignored.
// The rotation part must have determinant ±1, as every crystallographic
// operation does. Errors are *SymopError with the 1-based column at fault.
func ParseSymop(s string) (Symop, error) {
	var op Symop
	p := symopParser{src: s}
	for row := 0; row < 3; row++ {
		if err := p.expression(&op, row); err != nil {
			return Symop{}, err
		}
		p.skipSpace()
		if row < 2 {
			if p.pos >= len(s) {
				return Symop{}, p.fail("expected ',' and a coordinate expression for "+axisName(row+1)+", found the end", p.pos)
			}
			if s[p.pos] != ',' {
				return Symop{}, p.fail("expected ',' after the "+axisName(row)+" expression, found "+strconv.QuoteRune(rune(s[p.pos])), p.pos)
			}
			p.pos++
		}
	}
	p.skipSpace()
	if p.pos < len(s) {
		return Symop{}, p.fail("unexpected "+strconv.QuoteRune(rune(s[p.pos]))+" after the third expression", p.pos)
	}
	if d := op.det(); math.Abs(math.Abs(d)-1) > 1e-9 {
		return Symop{}, &SymopError{Input: s, Column: 1, Msg: "rotation part has determinant " + strconv.FormatFloat(d, 'g', 6, 64) + ", not ±1, so it is no crystallographic operation"}
	}
	return op, nil
}

// axisName names the i-th expression.
func axisName(i int) string { return [...]string{"first (x')", "second (y')", "third (z')"}[i] }

type symopParser struct {
	src string
	pos int
}

func (p *symopParser) fail(msg string, at int) error {
	return &SymopError{Input: p.src, Column: at + 1, Msg: msg}
}

func (p *symopParser) skipSpace() {
	for p.pos < len(p.src) && (p.src[p.pos] == ' ' || p.src[p.pos] == '\t') {
		p.pos++
	}
}

// expression reads one coordinate expression into row of op.
func (p *symopParser) expression(op *Symop, row int) error {
	terms := 0
	for {
		p.skipSpace()
		start := p.pos
		sign := 1.0
		hasSign := false
		if p.pos < len(p.src) && (p.src[p.pos] == '+' || p.src[p.pos] == '-') {
			if p.src[p.pos] == '-' {
				sign = -1
			}
			hasSign = true
			p.pos++
			p.skipSpace()
		}
		if p.pos >= len(p.src) || p.src[p.pos] == ',' {
			if terms == 0 && !hasSign {
				return p.fail("empty "+axisName(row)+" expression", p.pos)
			}
			if hasSign {
				return p.fail("sign with nothing after it", start)
			}
			return nil
		}
		if terms > 0 && !hasSign {
			return p.fail("expected '+', '-' or ',' but found "+strconv.QuoteRune(rune(p.src[p.pos])), p.pos)
		}
		if err := p.term(op, row, sign); err != nil {
			return err
		}
		terms++
	}
}

// term reads a number, a variable or their product, times sign.
func (p *symopParser) term(op *Symop, row int, sign float64) error {
	if axis, ok := p.variable(); ok {
		coef := 1.0
		p.skipSpace()
		if p.pos < len(p.src) && p.src[p.pos] == '*' {
			p.pos++
			p.skipSpace()
			at := p.pos
			x, err := p.number()
			if err != nil {
				return err
			}
			if x != math.Trunc(x) {
				return p.fail("coefficient "+strconv.FormatFloat(x, 'g', -1, 64)+" is not a whole number (rotation parts are integer)", at)
			}
			coef = x
		}
		op.Rot[row][axis] += sign * coef
		return nil
	}
	at := p.pos
	x, err := p.number()
	if err != nil {
		return err
	}
	whole := func() error {
		if x != math.Trunc(x) {
			return p.fail("coefficient "+strconv.FormatFloat(x, 'g', -1, 64)+" is not a whole number (rotation parts are integer)", at)
		}
		return nil
	}
	p.skipSpace()
	if p.pos < len(p.src) && p.src[p.pos] == '*' {
		p.pos++
		p.skipSpace()
		axis, ok := p.variable()
		if !ok {
			return p.fail("expected x, y or z after '*'", p.pos)
		}
		if err := whole(); err != nil {
			return err
		}
		op.Rot[row][axis] += sign * x
		return nil
	}
	if axis, ok := p.variable(); ok {
		if err := whole(); err != nil {
			return err
		}
		op.Rot[row][axis] += sign * x
		return nil
	}
	op.Trans[row] += sign * x
	return nil
}

// variable reads x, y or z (either case).
func (p *symopParser) variable() (int, bool) {
	if p.pos >= len(p.src) {
		return 0, false
	}
	switch p.src[p.pos] {
	case 'x', 'X':
		p.pos++
		return 0, true
	case 'y', 'Y':
		p.pos++
		return 1, true
	case 'z', 'Z':
		p.pos++
		return 2, true
	}
	return 0, false
}

// number reads an unsigned decimal or fraction: "1", "0.5", ".5", "1/2".
func (p *symopParser) number() (float64, error) {
	start := p.pos
	x, err := p.decimal()
	if err != nil {
		return 0, err
	}
	save := p.pos
	p.skipSpace()
	if p.pos < len(p.src) && p.src[p.pos] == '/' {
		slash := p.pos
		p.pos++
		p.skipSpace()
		den, err := p.decimal()
		if err != nil {
			return 0, err
		}
		if den == 0 {
			return 0, p.fail("division by zero", slash)
		}
		x /= den
	} else {
		p.pos = save
	}
	if math.IsInf(x, 0) || math.IsNaN(x) || math.Abs(x) > 1e6 {
		return 0, p.fail("number out of range", start)
	}
	return x, nil
}

// decimal reads digits with an optional decimal point.
func (p *symopParser) decimal() (float64, error) {
	start := p.pos
	for p.pos < len(p.src) && (p.src[p.pos] >= '0' && p.src[p.pos] <= '9' || p.src[p.pos] == '.') {
		p.pos++
	}
	if start == p.pos {
		if p.pos >= len(p.src) {
			return 0, p.fail("expected a number or x, y, z, found the end", p.pos)
		}
		return 0, p.fail("expected a number or x, y, z, found "+strconv.QuoteRune(rune(p.src[p.pos])), p.pos)
	}
	x, err := strconv.ParseFloat(p.src[start:p.pos], 64)
	if err != nil {
		return 0, p.fail("cannot read "+strconv.Quote(p.src[start:p.pos])+" as a number", start)
	}
	return x, nil
}

// String writes the operation in the xyz form ParseSymop reads, with
// translations as fractions where they are multiples of 1/12.
func (op Symop) String() string {
	var parts [3]string
	for i := 0; i < 3; i++ {
		var b strings.Builder
		for j, v := range []string{"x", "y", "z"} {
			c := op.Rot[i][j]
			if c == 0 {
				continue
			}
			switch {
			case c == 1:
				if b.Len() > 0 {
					b.WriteByte('+')
				}
			case c == -1:
				b.WriteByte('-')
			default:
				if c > 0 && b.Len() > 0 {
					b.WriteByte('+')
				}
				b.WriteString(strconv.FormatFloat(c, 'f', -1, 64))
				b.WriteByte('*')
			}
			b.WriteString(v)
		}
		if t := op.Trans[i]; t != 0 {
			if t > 0 && b.Len() > 0 {
				b.WriteByte('+')
			}
			b.WriteString(fraction(t))
		}
		if b.Len() == 0 {
			b.WriteByte('0')
		}
		parts[i] = b.String()
	}
	return parts[0] + "," + parts[1] + "," + parts[2]
}

// fraction writes t as p/q when t is a multiple of 1/12, else as a decimal.
func fraction(t float64) string {
	k := t * 12
	if r := math.Round(k); math.Abs(k-r) < 1e-9 && math.Abs(r) < 1e9 {
		num, den := int64(r), int64(12)
		g := gcd64(num, den)
		num, den = num/g, den/g
		if den == 1 {
			return strconv.FormatInt(num, 10)
		}
		return strconv.FormatInt(num, 10) + "/" + strconv.FormatInt(den, 10)
	}
	return strconv.FormatFloat(t, 'f', -1, 64)
}

func gcd64(a, b int64) int64 {
	if a < 0 {
		a = -a
	}
	for b != 0 {
		a, b = b, a%b
	}
	if a == 0 {
		return 1
	}
	return a
}
