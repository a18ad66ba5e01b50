package cif

import (
	"bufio"
	"fmt"
	"io"
	"math"
	"strconv"
	"strings"

	"enthalpath/thermo/crystal"
)

// Write writes c as a CIF 1.1 data block in space group P 1: cell lengths
// and angles, an _atom_type_ loop with each type's oxidation number (so
// that Parse, and other readers, recover the charges), and every site with
// its label, type symbol and fractional coordinates. Each line of comment
// is written as a leading "#" line. Types are named by species and charge
// ("Fe2+", "O0.5−" as "O0.5-"), so one species with two charges gets two
// types.
func Write(w io.Writer, c *crystal.Crystal, comment []string) error {
	bw := bufio.NewWriter(w)
	for _, line := range comment {
		fmt.Fprintf(bw, "# %s\n", line)
	}
	fmt.Fprintf(bw, "data_%s\n", blockName(c.Name))
	fmt.Fprintln(bw, "_symmetry_space_group_name_H-M 'P 1'")
	fmt.Fprintln(bw, "_symmetry_Int_Tables_number 1")
	for k, tag := range []string{"a", "b", "c"} {
		fmt.Fprintf(bw, "_cell_length_%s %.10f\n", tag, c.Lattice[k].Norm())
	}
	for k, tag := range []string{"alpha", "beta", "gamma"} {
		u, v := c.Lattice[(k+1)%3], c.Lattice[(k+2)%3]
		fmt.Fprintf(bw, "_cell_angle_%s %.10f\n", tag, math.Acos(u.Dot(v)/(u.Norm()*v.Norm()))*180/math.Pi)
	}
	fmt.Fprintf(bw, "_cell_volume %.10f\n", c.Volume())
	fmt.Fprintln(bw, "loop_\n_symmetry_equiv_pos_as_xyz\n 'x, y, z'")
	var types []string
	charge := map[string]float64{}
	for _, s := range c.Sites {
		t := siteTypeName(s)
		if _, ok := charge[t]; !ok {
			charge[t] = s.Charge
			types = append(types, t)
		}
	}
	fmt.Fprintln(bw, "loop_\n_atom_type_symbol\n_atom_type_oxidation_number")
	for _, t := range types {
		fmt.Fprintf(bw, " %s %s\n", t, strconv.FormatFloat(charge[t], 'g', -1, 64))
	}
	fmt.Fprintln(bw, "loop_\n_atom_site_label\n_atom_site_type_symbol\n_atom_site_fract_x\n_atom_site_fract_y\n_atom_site_fract_z\n_atom_site_occupancy")
	count := map[string]int{}
	for _, s := range c.Sites {
		count[s.Species]++
		f := s.Frac
		for k := range f {
			f[k] -= math.Floor(f[k])
		}
		fmt.Fprintf(bw, " %s%d %s %.10f %.10f %.10f 1\n", s.Species, count[s.Species], siteTypeName(s), f[0], f[1], f[2])
	}
	return bw.Flush()
}

// siteTypeName names a site's type by species and charge: "Li1+", "O2-",
// "O0.5-"; a species without charge keeps its symbol.
func siteTypeName(s crystal.Site) string {
	if s.Charge == 0 {
		return s.Species
	}
	sign := "+"
	if s.Charge < 0 {
		sign = "-"
	}
	return s.Species + strconv.FormatFloat(math.Abs(s.Charge), 'g', -1, 64) + sign
}

// blockName makes a CIF data block name: no white space, at most 64
// characters.
func blockName(name string) string {
	b := strings.Map(func(r rune) rune {
		if r <= ' ' || r == '\'' || r == '"' || r > '~' {
			return '_'
		}
		return r
	}, name)
	if b == "" {
		b = "structure"
	}
	if len(b) > 64 {
		b = b[:64]
	}
	return b
}
