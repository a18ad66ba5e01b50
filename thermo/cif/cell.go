package cif

import (
	"math"
	"strings"

	"enthalpath/thermo/crystal"
)

// This file: the cell and the symmetry operations of a block.

// lattice builds the cell vectors: a along x, b in the xy plane, c making
// a right-handed set (the usual convention, as in International Tables for
// Crystallography Vol. B, §1.1).
func (rd *reader) lattice() ([3]crystal.Vec3, error) {
	tags := [6]string{"_cell_length_a", "_cell_length_b", "_cell_length_c", "_cell_angle_alpha", "_cell_angle_beta", "_cell_angle_gamma"}
	var p [6]float64
	for i, tag := range tags {
		x, _, err := rd.number(tag, ErrMissingCell)
		if err != nil {
			return [3]crystal.Vec3{}, err
		}
		line := rd.b.tagLine[tag]
		if i < 3 && !(x > 0 && x < crystal.MaxCellLength) {
			return [3]crystal.Vec3{}, rd.errf(line, tag, ErrBadValue, "cell length %g Å must be positive and below %g Å", x, crystal.MaxCellLength)
		}
		if i >= 3 && !(x > 0 && x < 180) {
			return [3]crystal.Vec3{}, rd.errf(line, tag, ErrBadValue, "cell angle %g° must lie strictly between 0 and 180", x)
		}
		p[i] = x
	}
	a, b, c := p[0], p[1], p[2]
	ca, cb, cg := cosDeg(p[3]), cosDeg(p[4]), cosDeg(p[5])
	sg := math.Sin(p[5] * math.Pi / 180)
	cx := cb
	cy := (ca - cb*cg) / sg
	cz2 := 1 - cx*cx - cy*cy
	if !(cz2 > 1e-10) {
		return [3]crystal.Vec3{}, rd.errf(rd.b.tagLine["_cell_angle_alpha"], "_cell_angle_alpha", ErrBadValue,
			"angles α=%g°, β=%g°, γ=%g° do not form a cell (the volume would be zero or imaginary)", p[3], p[4], p[5])
	}
	return [3]crystal.Vec3{
		{a, 0, 0},
		{b * cg, b * sg, 0},
		{c * cx, c * cy, c * math.Sqrt(cz2)},
	}, nil
}

// cosDeg is the cosine of an angle in degrees, exact at 90°, 60°, 120°.
func cosDeg(deg float64) float64 {
	switch deg {
	case 90:
		return 0
	case 60:
		return 0.5
	case 120:
		return -0.5
	}
	return math.Cos(deg * math.Pi / 180)
}

// symmetryTags are the data names that hold operations as xyz strings, new
// name first.
var symmetryTags = [...]string{"_space_group_symop_operation_xyz", "_symmetry_equiv_pos_as_xyz"}

// symops reads the symmetry operations; without any it uses the identity,
// unless the file names a space group other than P1.
func (rd *reader) symops() ([]Symop, error) {
	var cols []column
	for _, tag := range symmetryTags {
		c, _, err := rd.table(tag, tag)
		if err != nil {
			return nil, err
		}
		if c != nil {
			if cols != nil {
				return nil, rd.errf(rd.b.tagLine[tag], tag, ErrSyntax, "operations are given under both %s and %s; keep one list", symmetryTags[0], symmetryTags[1])
			}
			cols = c
		}
	}
	if cols == nil {
		for _, tag := range []string{"_space_group_name_h-m_alt", "_symmetry_space_group_name_h-m"} {
			if v, ok := rd.b.items[tag]; ok && !v.unknown() {
				sym := strings.ReplaceAll(v.text, " ", "")
				if sym != "P1" {
					return nil, rd.errf(v.line, tag, ErrBadSymop,
						"names space group %q but the file lists no symmetry operations; add a loop of %s (space groups are not generated from their symbols)", v.text, symmetryTags[0])
				}
			}
		}
		return []Symop{{Rot: [3][3]float64{{1, 0, 0}, {0, 1, 0}, {0, 0, 1}}}}, nil
	}
	var ops []Symop
	for _, v := range cols[0].vals {
		if v.unknown() {
			return nil, rd.errf(v.line, cols[0].tag, ErrBadSymop, "an operation is given as %q; every operation must be written out", v.text)
		}
		op, err := ParseSymop(v.text)
		if err != nil {
			return nil, &Error{File: rd.file, Line: v.line, Tag: cols[0].tag, Msg: err.Error(), Err: err}
		}
		ops = append(ops, op)
	}
	return ops, nil
}
