package cif

import (
	"errors"
	"math"

	"enthalpath/thermo/crystal"
	"enthalpath/thermo/notation"
)

// This file: the atom-site loop (the asymmetric unit), its type symbols and
// oxidation numbers.

// asymSite is one row of the atom-site loop.
type asymSite struct {
	label   string
	typ     string // type symbol as written, or the label
	element string
	charge  float64
	known   bool // charge known
	frac    crystal.Vec3
	occ     float64 // occupancy, 1 unless the file says otherwise
	line    int
}

// oxidationNumbers reads the _atom_type_ loop: type symbol → charge.
func (rd *reader) oxidationNumbers() (map[string]float64, error) {
	cols, _, err := rd.table("_atom_type_symbol", "_atom_type_symbol", "_atom_type_oxidation_number")
	if err != nil || cols == nil || cols[1].vals == nil {
		return nil, err
	}
	out := map[string]float64{}
	for r, v := range cols[0].vals {
		ov := cols[1].vals[r]
		if ov.unknown() {
			continue
		}
		x, ok := parseNumber(ov.text)
		if !ok {
			return nil, rd.errf(ov.line, "_atom_type_oxidation_number", ErrBadValue, "cannot read %q as a number", clip(ov.text))
		}
		out[v.text] = x
	}
	return out, nil
}

// typeSymbol splits a type symbol such as "Fe3+" or "O2-" into its element
// and charge. A symbol without a charge gives hasCharge false.
func typeSymbol(s string) (el string, charge float64, hasCharge bool, err error) {
	n := 0
	for n < len(s) && isLetter(s[n]) {
		n++
	}
	if n == 0 || n > 2 || notation.AtomicNumber(normalizeSymbol(s[:n])) == 0 {
		return "", 0, false, ErrUnknownElement
	}
	el = normalizeSymbol(s[:n])
	rest := s[n:]
	if rest == "" {
		return el, 0, false, nil
	}
	// "3+", "2-", "+", "-" and the reversed "+3", "-2".
	var digits, sign string
	switch {
	case rest[len(rest)-1] == '+' || rest[len(rest)-1] == '-':
		digits, sign = rest[:len(rest)-1], rest[len(rest)-1:]
	case rest[0] == '+' || rest[0] == '-':
		digits, sign = rest[1:], rest[:1]
	default:
		return el, 0, false, ErrBadValue
	}
	q := 1.0
	if digits != "" {
		x, ok := parseNumber(digits)
		if !ok || digits[0] == '+' || digits[0] == '-' || x > 20 {
			return el, 0, false, ErrBadValue
		}
		q = x
	}
	if sign == "-" {
		q = -q
	}
	return el, q, true, nil
}

// sites reads the atom-site loop.
func (rd *reader) sites(opt Options) ([]asymSite, error) {
	cols, rows, err := rd.table("_atom_site_fract_x",
		"_atom_site_label", "_atom_site_type_symbol",
		"_atom_site_fract_x", "_atom_site_fract_y", "_atom_site_fract_z", "_atom_site_occupancy")
	if err != nil {
		return nil, err
	}
	if cols == nil {
		return nil, rd.errf(rd.b.line, "_atom_site_fract_x", ErrNoSites, "data_%s gives no fractional atom coordinates", rd.b.name)
	}
	for _, c := range cols[3:5] {
		if c.vals == nil {
			return nil, rd.errf(rd.b.tagLine["_atom_site_fract_x"], c.tag, ErrNoSites, "is missing beside _atom_site_fract_x")
		}
	}
	if cols[0].vals == nil && cols[1].vals == nil {
		return nil, rd.errf(rd.b.tagLine["_atom_site_fract_x"], "_atom_site_label", ErrNoSites, "atom sites need _atom_site_label or _atom_site_type_symbol")
	}
	oxi, err := rd.oxidationNumbers()
	if err != nil {
		return nil, err
	}
	var out []asymSite
	for r := 0; r < rows; r++ {
		s := asymSite{line: cols[2].vals[r].line}
		if cols[0].vals != nil {
			s.label = cols[0].vals[r].text
		}
		if cols[1].vals != nil && !cols[1].vals[r].unknown() {
			s.typ = cols[1].vals[r].text
			el, q, hasQ, err := typeSymbol(s.typ)
			switch {
			case errors.Is(err, ErrUnknownElement):
				return nil, rd.errf(cols[1].vals[r].line, "_atom_site_type_symbol", ErrUnknownElement,
					"%q (site %s) does not start with an element symbol", clip(s.typ), s.label)
			case err != nil:
				return nil, rd.errf(cols[1].vals[r].line, "_atom_site_type_symbol", ErrBadValue,
					"cannot read the charge in %q; write it as Fe3+ or O2-", clip(s.typ))
			}
			s.element, s.charge, s.known = el, q, hasQ
		} else {
			if s.label == "" || cols[0].vals[r].unknown() {
				return nil, rd.errf(s.line, "_atom_site_label", ErrUnknownElement, "site on this line has neither a type symbol nor a label")
			}
			el, _ := elementPrefix(s.label)
			if el == "" {
				return nil, rd.errf(cols[0].vals[r].line, "_atom_site_label", ErrUnknownElement,
					"label %q does not start with an element symbol, and there is no _atom_site_type_symbol; add one", clip(s.label))
			}
			s.typ = s.label
			s.element = el
		}
		if s.label == "" {
			s.label = s.typ
		}
		if q, ok := oxi[s.typ]; ok {
			s.charge, s.known = q, true
		} else if q, ok := oxi[s.element]; ok && cols[1].vals == nil {
			s.charge, s.known = q, true
		}
		for _, key := range []string{s.label, s.typ, s.element} {
			if q, ok := opt.Charges[key]; ok {
				s.charge, s.known = q, true
				break
			}
		}
		if math.IsNaN(s.charge) || math.IsInf(s.charge, 0) {
			return nil, rd.errf(s.line, "", ErrBadValue, "charge of site %s is not a finite number", s.label)
		}
		for k := 0; k < 3; k++ {
			v := cols[2+k].vals[r]
			x, ok := parseNumber(v.text)
			if !ok || math.Abs(x) > 1e6 {
				if v.unknown() {
					return nil, rd.errf(v.line, cols[2+k].tag, ErrBadValue, "site %s has coordinate %q (unknown); every coordinate must be given", s.label, v.text)
				}
				return nil, rd.errf(v.line, cols[2+k].tag, ErrBadValue, "cannot read %q as a number", clip(v.text))
			}
			s.frac[k] = x
		}
		s.occ = 1
		if oc := cols[5].vals; oc != nil && !oc[r].unknown() {
			x, ok := parseNumber(oc[r].text)
			if !ok {
				return nil, rd.errf(oc[r].line, "_atom_site_occupancy", ErrBadValue, "cannot read %q as a number", clip(oc[r].text))
			}
			if !(x > 0 && x <= 1+crystal.OccupancyTolerance) {
				return nil, rd.errf(oc[r].line, "_atom_site_occupancy", ErrBadValue,
					"site %s has occupancy %s; an occupancy must be greater than 0 and at most 1", s.label, oc[r].text)
			}
			if x > 1-crystal.OccupancyTolerance {
				x = 1
			}
			s.occ = x
		}
		out = append(out, s)
	}
	return out, nil
}
