package main

// Deposited structures as CIF files (Crystallography Open Database entries
// as deposited, with their `_cod_database_code`): the cell, the symmetry
// operations and the atom sites of the asymmetric unit. The sites are
// expanded by the operations into the atoms of the conventional cell, so
// that a CIF gives what an NCMAT file's @ATOMPOSITIONS gives and the same
// parameter reading applies (depositedCell.params).

import (
	"fmt"
	"math"
	"slices"
	"strconv"
	"strings"
)

// cifData is the part of one CIF data block the generator reads: single
// items by tag (with the line they stand on) and loops by their tags.
type cifData struct {
	items map[string]cifItem
	loops []cifLoop
}

type cifItem struct {
	value string
	line  int
}

type cifLoop struct {
	tags []string
	rows [][]string
}

// column returns the values of one tag of the loop, or false.
func (l cifLoop) column(tag string) ([]string, bool) {
	j := slices.Index(l.tags, tag)
	if j < 0 {
		return nil, false
	}
	out := make([]string, len(l.rows))
	for i, r := range l.rows {
		out[i] = r[j]
	}
	return out, true
}

// cifToken is one value or tag of a CIF file and its line.
type cifToken struct {
	text   string
	line   int
	quoted bool // a quoted string or a text field: never a tag or keyword
}

// cifTokens splits CIF text into tokens: comments dropped, quoted strings
// ('…', "…") and text fields (lines between two lines starting with ';')
// kept whole.
func cifTokens(text string) ([]cifToken, error) {
	var out []cifToken
	lines := strings.Split(strings.ReplaceAll(text, "\r\n", "\n"), "\n")
	for i := 0; i < len(lines); i++ {
		line := lines[i]
		if strings.HasPrefix(line, ";") {
			start := i
			var field []string
			field = append(field, line[1:])
			for i++; i < len(lines) && !strings.HasPrefix(lines[i], ";"); i++ {
				field = append(field, lines[i])
			}
			if i == len(lines) {
				return nil, fmt.Errorf("line %d: text field not closed", start+1)
			}
			out = append(out, cifToken{text: strings.TrimSpace(strings.Join(field, "\n")), line: start + 1, quoted: true})
			continue
		}
		for p := 0; p < len(line); {
			c := line[p]
			switch {
			case c == ' ' || c == '\t':
				p++
			case c == '#':
				p = len(line)
			case c == '\'' || c == '"':
				// A quote closes where it is followed by white space or the line's end.
				end := -1
				for q := p + 1; q < len(line); q++ {
					if line[q] == c && (q+1 == len(line) || line[q+1] == ' ' || line[q+1] == '\t') {
						end = q
						break
					}
				}
				if end < 0 {
					return nil, fmt.Errorf("line %d: quoted string not closed", i+1)
				}
				out = append(out, cifToken{text: line[p+1 : end], line: i + 1, quoted: true})
				p = end + 1
			default:
				q := p
				for q < len(line) && line[q] != ' ' && line[q] != '\t' {
					q++
				}
				out = append(out, cifToken{text: line[p:q], line: i + 1})
				p = q
			}
		}
	}
	return out, nil
}

// parseCIF reads the first data block of a CIF file.
func parseCIF(text string) (cifData, error) {
	toks, err := cifTokens(text)
	if err != nil {
		return cifData{}, err
	}
	d := cifData{items: map[string]cifItem{}}
	isTag := func(t cifToken) bool { return !t.quoted && strings.HasPrefix(t.text, "_") }
	isKeyword := func(t cifToken) bool {
		if t.quoted {
			return false
		}
		l := strings.ToLower(t.text)
		return l == "loop_" || strings.HasPrefix(l, "data_") || strings.HasPrefix(l, "save_")
	}
	blocks := 0
	for i := 0; i < len(toks); {
		t := toks[i]
		switch {
		case !t.quoted && strings.HasPrefix(strings.ToLower(t.text), "data_"):
			if blocks++; blocks > 1 {
				return d, nil
			}
			i++
		case !t.quoted && strings.ToLower(t.text) == "loop_":
			var l cifLoop
			for i++; i < len(toks) && isTag(toks[i]); i++ {
				l.tags = append(l.tags, strings.ToLower(toks[i].text))
			}
			var vals []string
			for ; i < len(toks) && !isTag(toks[i]) && !isKeyword(toks[i]); i++ {
				vals = append(vals, toks[i].text)
			}
			if len(l.tags) == 0 || len(vals)%len(l.tags) != 0 {
				return d, fmt.Errorf("line %d: a loop of %d tags holds %d values", t.line, len(l.tags), len(vals))
			}
			for k := 0; k < len(vals); k += len(l.tags) {
				l.rows = append(l.rows, vals[k:k+len(l.tags)])
			}
			d.loops = append(d.loops, l)
		case isTag(t):
			if i+1 >= len(toks) || isTag(toks[i+1]) || isKeyword(toks[i+1]) {
				return d, fmt.Errorf("line %d: %s has no value", t.line, t.text)
			}
			d.items[strings.ToLower(t.text)] = cifItem{value: toks[i+1].text, line: t.line}
			i += 2
		default:
			return d, fmt.Errorf("line %d: %q stands outside an item or a loop", t.line, t.text)
		}
	}
	if blocks == 0 {
		return d, fmt.Errorf("no data block")
	}
	return d, nil
}

// loopWith returns the first loop that has one of the tags, and the tag.
func (d cifData) loopWith(tags ...string) (cifLoop, string, bool) {
	for _, l := range d.loops {
		for _, t := range tags {
			if slices.Contains(l.tags, t) {
				return l, t, true
			}
		}
	}
	return cifLoop{}, "", false
}

// cifNumber reads a CIF number, dropping its standard uncertainty
// ("4.1684(3)" → 4.1684), and returns the digits as printed too.
func cifNumber(s string) (float64, string, error) {
	printed, _, _ := strings.Cut(s, "(")
	x, err := strconv.ParseFloat(printed, 64)
	return x, printed, err
}

// symOp is one symmetry operation x' = R·x + t.
type symOp struct {
	r [3][3]float64
	t [3]float64
}

// parseSymOp reads an operation written as "x,1/2+y,-z" or "-x+y, y, 1/2+z".
func parseSymOp(s string) (symOp, error) {
	var op symOp
	parts := strings.Split(strings.ReplaceAll(s, " ", ""), ",")
	if len(parts) != 3 {
		return op, fmt.Errorf("symmetry operation %q: three parts wanted", s)
	}
	for row, p := range parts {
		p = strings.ToLower(p)
		if p == "" {
			return op, fmt.Errorf("symmetry operation %q: an empty part", s)
		}
		for len(p) > 0 {
			sign := 1.0
			switch p[0] {
			case '+':
				p = p[1:]
			case '-':
				sign, p = -1, p[1:]
			}
			n := strings.IndexAny(p, "+-")
			if n < 0 {
				n = len(p)
			}
			term := p[:n]
			p = p[n:]
			switch {
			case term == "x" || term == "y" || term == "z":
				op.r[row][term[0]-'x'] += sign
			case term == "":
				return op, fmt.Errorf("symmetry operation %q: an empty term", s)
			default:
				v, err := fraction(term)
				if err != nil {
					return op, fmt.Errorf("symmetry operation %q: %w", s, err)
				}
				op.t[row] += sign * v
			}
		}
	}
	return op, nil
}

// apply maps a fractional position, wrapped into [0, 1).
func (op symOp) apply(x [3]float64) [3]float64 {
	var out [3]float64
	for i := range 3 {
		v := op.t[i]
		for j := range 3 {
			v += op.r[i][j] * x[j]
		}
		v -= math.Floor(v)
		if v > 1-positionTolerance {
			v = 0
		}
		out[i] = v
	}
	return out
}

// siteElement is the element of an atom site: its type symbol if the CIF
// gives one, else its label, without charge or numbering ("O2-", "Fe1" → O, Fe).
func siteElement(s string) string {
	if s == "" || s[0] < 'A' || s[0] > 'Z' {
		return ""
	}
	if len(s) > 1 && s[1] >= 'a' && s[1] <= 'z' {
		return s[:2]
	}
	return s[:1]
}

// parseCIFCell reads the COD entry, the cell and the atoms of the
// conventional cell (the atom sites expanded by the symmetry operations).
func parseCIFCell(text string) (depositedCell, string, error) {
	c := depositedCell{printed: map[string]string{}}
	d, err := parseCIF(text)
	if err != nil {
		return c, "", err
	}
	c.entry = d.items["_cod_database_code"].value
	for _, tag := range []string{"_cell_measurement_temperature", "_diffrn_ambient_temperature"} {
		if t, ok := d.items[tag]; ok && c.measured == "" && t.value != "?" {
			c.measured = "T = " + t.value + " K"
		}
	}
	formula := d.items["_chemical_formula_sum"].value
	c.cellLine = d.items["_cell_length_a"].line
	for k, tag := range []string{"a", "b", "c"} {
		it, ok := d.items["_cell_length_"+tag]
		if !ok {
			return c, "", fmt.Errorf("no _cell_length_%s", tag)
		}
		v, printed, err := cifNumber(it.value)
		if err != nil {
			return c, "", fmt.Errorf("line %d: %w", it.line, err)
		}
		c.lengths[k] = v
		if tag != "b" {
			c.printed[tag] = printed
		}
	}
	for k, tag := range []string{"alpha", "beta", "gamma"} {
		it, ok := d.items["_cell_angle_"+tag]
		if !ok {
			return c, "", fmt.Errorf("no _cell_angle_%s", tag)
		}
		v, _, err := cifNumber(it.value)
		if err != nil {
			return c, "", fmt.Errorf("line %d: %w", it.line, err)
		}
		c.angles[k] = v
	}
	ops := []symOp{{r: [3][3]float64{{1, 0, 0}, {0, 1, 0}, {0, 0, 1}}}}
	if l, tag, ok := d.loopWith("_symmetry_equiv_pos_as_xyz", "_space_group_symop_operation_xyz"); ok {
		col, _ := l.column(tag)
		ops = ops[:0]
		for _, s := range col {
			op, err := parseSymOp(s)
			if err != nil {
				return c, "", err
			}
			ops = append(ops, op)
		}
	}
	sites, _, ok := d.loopWith("_atom_site_fract_x")
	if !ok {
		return c, "", fmt.Errorf("no atom sites")
	}
	names, ok := sites.column("_atom_site_type_symbol")
	if !ok {
		names, _ = sites.column("_atom_site_label")
	}
	var xyz [3][]string
	for k, tag := range []string{"_atom_site_fract_x", "_atom_site_fract_y", "_atom_site_fract_z"} {
		xyz[k], _ = sites.column(tag)
	}
	for i := range sites.rows {
		var x [3]float64
		for k := range 3 {
			v, _, err := cifNumber(xyz[k][i])
			if err != nil {
				return c, "", fmt.Errorf("atom site %d: %w", i+1, err)
			}
			x[k] = v
		}
		el := siteElement(names[i])
		for _, op := range ops {
			a := cellAtom{element: el, x: op.apply(x)}
			if !slices.ContainsFunc(c.atoms, func(b cellAtom) bool { return b.element == a.element && samePosition(a.x, b.x) }) {
				c.atoms = append(c.atoms, a)
			}
		}
	}
	switch {
	case c.entry == "":
		return c, "", fmt.Errorf("no _cod_database_code")
	case formula == "":
		return c, "", fmt.Errorf("no _chemical_formula_sum")
	case len(c.atoms) == 0:
		return c, "", fmt.Errorf("no atoms")
	}
	return c, strings.ReplaceAll(formula, " ", ""), nil
}

// samePosition compares two wrapped fractional positions.
func samePosition(a, b [3]float64) bool {
	for k := range 3 {
		d := math.Abs(a[k] - b[k])
		if math.Min(d, 1-d) > positionTolerance {
			return false
		}
	}
	return true
}
