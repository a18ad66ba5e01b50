package cif_test

import (
	"errors"
	"fmt"
	"math"
	"math/rand"
	"os"
	"path/filepath"
	"strconv"
	"strings"
	"testing"

	"enthalpath/thermo/cif"
	"enthalpath/thermo/crystal"
)

const cifDir = "../../testdata/cif"

// header is a small valid cell for the error tests (lines 1–7).
const header = `data_t
_cell_length_a 4.0
_cell_length_b 4.0
_cell_length_c 4.0
_cell_angle_alpha 90
_cell_angle_beta 90
_cell_angle_gamma 90
`

// sitesCsCl is a caesium-chloride-type cell with charges (lines 8–17).
const sitesCsCl = `loop_
_atom_type_symbol
_atom_type_oxidation_number
Cs 1
Cl -1
loop_
_atom_site_label
_atom_site_fract_x
_atom_site_fract_y
_atom_site_fract_z
`

func TestParseErrors(t *testing.T) {
	// Each case names the line and data name the message must carry; lines
	// are counted by hand in the input.
	tests := []struct {
		name string
		src  string
		line int
		tag  string
		kind error
		msg  string
	}{
		{"bad number", header + sitesCsCl + "Cs1 0 0 0\nCl1 0.5x 0.5 0.5\n", 19, "_atom_site_fract_x", cif.ErrBadValue, `cannot read "0.5x" as a number`},
		{"missing cell length", strings.Replace(header, "_cell_length_b 4.0\n", "", 1) + sitesCsCl + "Cs1 0 0 0\n", 1, "_cell_length_b", cif.ErrMissingCell, "missing"},
		{"unknown cell angle", strings.Replace(header, "_cell_angle_beta 90", "_cell_angle_beta ?", 1) + sitesCsCl + "Cs1 0 0 0\n", 6, "_cell_angle_beta", cif.ErrMissingCell, "unknown"},
		{"impossible angles", strings.Replace(strings.Replace(header, "alpha 90", "alpha 150", 1), "beta 90", "beta 20", 1) + sitesCsCl + "Cs1 0 0 0\n", 5, "_cell_angle_alpha", cif.ErrBadValue, "do not form a cell"},
		{"malformed loop", header + sitesCsCl + "Cs1 0 0 0\nCl1 0.5 0.5\n", 13, "_atom_site_label", cif.ErrMalformedLoop, "not a multiple of 4"},
		{"loop without values", header + "loop_\n_atom_site_label\n", 8, "_atom_site_label", cif.ErrMalformedLoop, "no values"},
		{"loop without names", header + "loop_\n1 2\n", 8, "", cif.ErrMalformedLoop, "not followed by any data name"},
		{"unknown element", header + sitesCsCl + "Cs1 0 0 0\nQ1 0.5 0.5 0.5\n", 19, "_atom_site_label", cif.ErrUnknownElement, `"Q1"`},
		{"unknown type symbol", header + "loop_\n_atom_site_label\n_atom_site_type_symbol\n_atom_site_fract_x\n_atom_site_fract_y\n_atom_site_fract_z\nA1 Xx 0 0 0\n", 14, "_atom_site_type_symbol", cif.ErrUnknownElement, `"Xx"`},
		{"partial occupancy summed as its mean charge leaves a charged cell", header + sitesCsCl + "_atom_site_occupancy\nCs1 0 0 0 1\nCl1 0.5 0.5 0.5 0.5\n", 10, "_atom_type_oxidation_number", cif.ErrNotNeutral, "Cl1 -0.5"},
		{"occupancy above 1", header + sitesCsCl + "_atom_site_occupancy\nCs1 0 0 0 1.2\nCl1 0.5 0.5 0.5 1\n", 19, "_atom_site_occupancy", cif.ErrBadValue, "at most 1"},
		{"shared site over-occupied", header + sitesCsCl + "_atom_site_occupancy\nCs1 0 0 0 0.6\nRb1 0 0 0 0.6\nCl1 0.5 0.5 0.5 1\n", 20, "_atom_site_label", cif.ErrCollision, "sum to 1.2"},
		{"not neutral", header + "loop_\n_atom_type_symbol\n_atom_type_oxidation_number\nCs 1\nCl -2\nloop_\n_atom_site_label\n_atom_site_fract_x\n_atom_site_fract_y\n_atom_site_fract_z\nCs1 0 0 0\nCl1 0.5 0.5 0.5\n", 10, "_atom_type_oxidation_number", cif.ErrNotNeutral, "sum to -1"},
		{"missing charge", header + "loop_\n_atom_site_label\n_atom_site_fract_x\n_atom_site_fract_y\n_atom_site_fract_z\nCs1 0 0 0\nCl1 0.5 0.5 0.5\n", 13, "_atom_type_oxidation_number", cif.ErrMissingCharge, "no charge for site Cs1"},
		{"bad symmetry operation", header + "loop_\n_symmetry_equiv_pos_as_xyz\nx,y,z\n'-x,y,q'\n" + sitesCsCl + "Cs1 0 0 0\nCl1 0.5 0.5 0.5\n", 11, "_symmetry_equiv_pos_as_xyz", cif.ErrBadSymop, "column 6"},
		{"space group without operations", header + "_symmetry_space_group_name_H-M 'F m -3 m'\n" + sitesCsCl + "Cs1 0 0 0\nCl1 0.5 0.5 0.5\n", 8, "_symmetry_space_group_name_H-M", cif.ErrBadSymop, "lists no symmetry operations"},
		{"collision", header + sitesCsCl + "Cs1 0 0 0\nCl1 0.0001 0 0\n", 19, "_atom_site_label", cif.ErrCollision, "within 0.001"},
		{"Z does not divide", header + "_cell_formula_units_Z 2\n" + sitesCsCl + "Cs1 0 0 0\nCl1 0.5 0.5 0.5\n", 8, "_cell_formula_units_Z", cif.ErrBadValue, "does not divide"},
		{"duplicate tag", header + "_cell_length_a 5\n", 8, "_cell_length_a", cif.ErrSyntax, "appears twice"},
		{"value without tag", header + "stray\n", 8, "", cif.ErrSyntax, "belongs to no data name"},
		{"tag without value", header + "_cell_formula_units_Z\n_x 1\n", 8, "_cell_formula_units_Z", cif.ErrSyntax, "has no value"},
		{"no block", "_cell_length_a 4\n", 1, "", cif.ErrSyntax, "before the first data_"},
		{"no sites", header, 1, "_atom_site_fract_x", cif.ErrNoSites, "no data block"},
		{"save frame", header + "save_x\n", 8, "", cif.ErrSyntax, "save frames"},
		{"coordinate unknown", header + sitesCsCl + "Cs1 0 0 0\nCl1 0.5 ? 0.5\n", 19, "_atom_site_fract_y", cif.ErrBadValue, "unknown"},
		{"split atom-site columns", header + "_atom_site_fract_z 0\n" + "loop_\n_atom_site_label\n_atom_site_fract_x\n_atom_site_fract_y\nCs1 0 0\n", 8, "_atom_site_fract_z", cif.ErrMalformedLoop, "same loop"},
		{"two symmetry lists", header + "loop_\n_symmetry_equiv_pos_as_xyz\nx,y,z\nloop_\n_space_group_symop_operation_xyz\nx,y,z\n" + sitesCsCl + "Cs1 0 0 0\nCl1 0.5 0.5 0.5\n", 9, "_symmetry_equiv_pos_as_xyz", cif.ErrSyntax, "both"},
		{"bad charge in type symbol", header + "loop_\n_atom_site_type_symbol\n_atom_site_fract_x\n_atom_site_fract_y\n_atom_site_fract_z\nCs1x 0 0 0\n", 13, "_atom_site_type_symbol", cif.ErrBadValue, "cannot read the charge"},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			_, err := cif.Parse(strings.NewReader(tc.src), "t.cif", cif.Options{})
			var e *cif.Error
			if !errors.As(err, &e) {
				t.Fatalf("err = %v, want *cif.Error", err)
			}
			if e.File != "t.cif" || e.Line != tc.line || e.Tag != tc.tag || !strings.Contains(e.Msg, tc.msg) || !errors.Is(err, tc.kind) {
				t.Errorf("got %q\n(line %d, tag %q, kind %v); want line %d, tag %q, kind %v, message containing %q",
					err, e.Line, e.Tag, e.Err, tc.line, tc.tag, tc.kind, tc.msg)
			}
			// The message begins with file:line: and names the tag.
			prefix := "t.cif:"
			if !strings.HasPrefix(err.Error(), prefix) || (tc.tag != "" && !strings.Contains(err.Error(), tc.tag)) {
				t.Errorf("message %q lacks the file or tag", err)
			}
		})
	}
}

// TestErrorFormat checks the message layout file:line: tag: message.
func TestErrorFormat(t *testing.T) {
	e := &cif.Error{File: "NaCl.cif", Line: 12, Tag: "_atom_site_fract_x", Msg: `cannot read "0.5x" as a number`}
	if got, want := e.Error(), `NaCl.cif:12: _atom_site_fract_x: cannot read "0.5x" as a number`; got != want {
		t.Errorf("Error() = %q, want %q", got, want)
	}
}

func near(a, b, tol float64) bool {
	return math.Abs(a-b) <= tol*math.Max(1, math.Max(math.Abs(a), math.Abs(b)))
}

// distances returns the sorted distances from site i to every other site
// image within rmax Å.
func distances(c *crystal.Crystal, i int, rmax float64) []float64 {
	var out []float64
	for j := range c.Sites {
		for a := -2; a <= 2; a++ {
			for b := -2; b <= 2; b++ {
				for d := -2; d <= 2; d++ {
					f := c.Sites[j].Frac.Sub(c.Sites[i].Frac).Add(crystal.Vec3{float64(a), float64(b), float64(d)})
					r := c.Cartesian(f).Norm()
					if r > 1e-9 && r <= rmax {
						out = append(out, r)
					}
				}
			}
		}
	}
	sortFloats(out)
	return out
}

func sortFloats(x []float64) {
	for i := 1; i < len(x); i++ {
		for j := i; j > 0 && x[j] < x[j-1]; j-- {
			x[j], x[j-1] = x[j-1], x[j]
		}
	}
}

func TestRockSaltFm3m(t *testing.T) {
	path := filepath.Join(cifDir, "real_NaCl_rocksalt_Fm-3m.cif")
	// The file gives no charges: the reader must say so ...
	if _, err := cif.ParseFile(path, cif.Options{}); !errors.Is(err, cif.ErrMissingCharge) {
		t.Fatalf("without charges: err = %v, want ErrMissingCharge", err)
	}
	// ... and read it once they are given.
	c, err := cif.ParseFile(path, cif.Options{Charges: map[string]float64{"Na": 1, "Cl": -1}})
	if err != nil {
		t.Fatal(err)
	}
	// a = 5.6402 Å: Wyckoff, Crystal Structures vol. 1, ch. III (from memory).
	const a = 5.6402
	if len(c.Sites) != 8 {
		t.Fatalf("%d sites, want 8 (4 Na on 4a, 4 Cl on 4b, Fm-3m)", len(c.Sites))
	}
	if c.FormulaUnits != 4 {
		t.Errorf("Z = %d, want 4", c.FormulaUnits)
	}
	if q := c.TotalCharge(); math.Abs(q) > 1e-12 {
		t.Errorf("total charge %g, want 0", q)
	}
	for i, v := range c.Lattice {
		if !near(v.Norm(), a, 1e-12) {
			t.Errorf("|lattice[%d]| = %v, want %v", i, v.Norm(), a)
		}
	}
	if !near(c.Volume(), a*a*a, 1e-12) {
		t.Errorf("volume %v, want a³ = %v", c.Volume(), a*a*a)
	}
	// Rock salt: 6 unlike neighbours at a/2, 12 like ones at a/√2 (geometry
	// of the structure type, common practice, no source).
	for i := range c.Sites {
		d := distances(c, i, a/math.Sqrt2+1e-6)
		if len(d) != 18 || !near(d[0], a/2, 1e-12) || !near(d[5], a/2, 1e-12) || !near(d[6], a/math.Sqrt2, 1e-12) {
			t.Errorf("site %d: neighbour distances %v", i, d)
		}
	}
	// The 192 operations form a group modulo lattice translations: the
	// product of any two is again in the list (Fm-3m has order 192 in the
	// conventional cell, International Tables Vol. A, common knowledge).
	ops := readSymops(t, path)
	if len(ops) != 192 {
		t.Fatalf("%d operations, want 192", len(ops))
	}
	assertGroup(t, ops)
}

// readSymops reads the operation strings of a test file (lines after the
// symop tag that look like quoted or bare xyz triples).
func readSymops(t *testing.T, path string) []cif.Symop {
	t.Helper()
	raw, err := os.ReadFile(path)
	if err != nil {
		t.Fatal(err)
	}
	var ops []cif.Symop
	for _, ln := range strings.Split(string(raw), "\n") {
		f := strings.Fields(ln)
		if len(f) == 0 || strings.Count(ln, ",") != 2 || strings.HasPrefix(ln, "#") || strings.HasPrefix(ln, "_") {
			continue
		}
		s := f[len(f)-1]
		if len(f) >= 2 && strings.Trim(f[0], "0123456789") == "" {
			s = strings.Join(f[1:], " ")
		}
		op, err := cif.ParseSymop(strings.Trim(s, "'"))
		if err != nil {
			continue
		}
		ops = append(ops, op)
	}
	return ops
}

func assertGroup(t *testing.T, ops []cif.Symop) {
	t.Helper()
	same := func(p, q cif.Symop) bool {
		for i := 0; i < 3; i++ {
			for j := 0; j < 3; j++ {
				if p.Rot[i][j] != q.Rot[i][j] {
					return false
				}
			}
			d := p.Trans[i] - q.Trans[i]
			if math.Abs(d-math.Round(d)) > 1e-9 {
				return false
			}
		}
		return true
	}
	for _, p := range ops {
		for _, q := range ops {
			var r cif.Symop
			for i := 0; i < 3; i++ {
				for j := 0; j < 3; j++ {
					for k := 0; k < 3; k++ {
						r.Rot[i][j] += p.Rot[i][k] * q.Rot[k][j]
					}
					r.Trans[i] += p.Rot[i][j] * q.Trans[j]
				}
				r.Trans[i] += p.Trans[i]
			}
			found := false
			for _, s := range ops {
				if same(r, s) {
					found = true
					break
				}
			}
			if !found {
				t.Fatalf("product of %v and %v is not in the list", p, q)
			}
		}
	}
}

func TestRutile(t *testing.T) {
	path := filepath.Join(cifDir, "real_TiO2_rutile.cif")
	c, err := cif.ParseFile(path, cif.Options{})
	if err != nil {
		t.Fatal(err)
	}
	if len(c.Sites) != 6 || c.FormulaUnits != 2 {
		t.Fatalf("%d sites, Z = %d; want 6 and 2 (Ti on 2a, O on 4f of P4_2/mnm)", len(c.Sites), c.FormulaUnits)
	}
	// Ti–O bond lengths of rutile from a = 4.5937, c = 2.9587, x = 0.3048
	// (Baur & Khan 1971, from memory): two apical √2·x·a = 1.980 Å and four
	// equatorial √(2((½−x)a)² + (c/2)²) = 1.949 Å; the published
	// values are 1.980 and 1.948/1.949 Å (from memory).
	a, cc, x := 4.5937, 2.9587, 0.3048
	apical := math.Sqrt2 * x * a
	equatorial := math.Sqrt(2*math.Pow((0.5-x)*a, 2) + cc*cc/4)
	for i, s := range c.Sites {
		if s.Species != "Ti" {
			continue
		}
		d := distances(c, i, 2.2)
		if len(d) != 6 || !near(d[0], equatorial, 1e-12) || !near(d[3], equatorial, 1e-12) || !near(d[4], apical, 1e-12) || !near(d[5], apical, 1e-12) {
			t.Errorf("Ti site %d: distances %v, want 4 × %.4f and 2 × %.4f", i, d, equatorial, apical)
		}
		if math.Abs(apical-1.980) > 5e-4 || math.Abs(equatorial-1.9485) > 1e-3 {
			t.Errorf("bond lengths %.4f, %.4f differ from the published 1.980, 1.948 Å", apical, equatorial)
		}
	}
	assertGroup(t, readSymops(t, path))
}

// TestLatticeFromParameters is a property test: the lattice built from
// random cell parameters gives back the lengths and angles, and its volume
// is abc·√(1 − cos²α − cos²β − cos²γ + 2 cosα cosβ cosγ) (International
// Tables for Crystallography Vol. B, §1.1, from memory).
func TestLatticeFromParameters(t *testing.T) {
	rng := rand.New(rand.NewSource(11))
	for n := 0; n < 200; n++ {
		a, b, c := 2+8*rng.Float64(), 2+8*rng.Float64(), 2+8*rng.Float64()
		al, be, ga := 60+60*rng.Float64(), 60+60*rng.Float64(), 60+60*rng.Float64()
		ca, cb, cg := math.Cos(al*math.Pi/180), math.Cos(be*math.Pi/180), math.Cos(ga*math.Pi/180)
		g := 1 - ca*ca - cb*cb - cg*cg + 2*ca*cb*cg
		if g < 0.05 {
			continue
		}
		src := "data_r\n" +
			"_cell_length_a " + ftoa(a) + "\n_cell_length_b " + ftoa(b) + "\n_cell_length_c " + ftoa(c) + "\n" +
			"_cell_angle_alpha " + ftoa(al) + "\n_cell_angle_beta " + ftoa(be) + "\n_cell_angle_gamma " + ftoa(ga) + "\n" +
			"loop_\n_atom_site_type_symbol\n_atom_site_fract_x\n_atom_site_fract_y\n_atom_site_fract_z\nNa+ 0 0 0\nCl- 0.5 0.5 0.5\n"
		cr, err := cif.Parse(strings.NewReader(src), "r.cif", cif.Options{})
		if err != nil {
			t.Fatal(err)
		}
		L := cr.Lattice
		angle := func(u, v crystal.Vec3) float64 { return math.Acos(u.Dot(v)/(u.Norm()*v.Norm())) * 180 / math.Pi }
		if !near(L[0].Norm(), a, 1e-12) || !near(L[1].Norm(), b, 1e-12) || !near(L[2].Norm(), c, 1e-12) ||
			!near(angle(L[1], L[2]), al, 1e-10) || !near(angle(L[0], L[2]), be, 1e-10) || !near(angle(L[0], L[1]), ga, 1e-10) {
			t.Fatalf("cell %v %v %v %v %v %v gave lattice %v", a, b, c, al, be, ga, L)
		}
		if L[0][1] != 0 || L[0][2] != 0 || L[1][2] != 0 {
			t.Fatalf("a not along x or b not in the xy plane: %v", L)
		}
		if !near(cr.Volume(), a*b*c*math.Sqrt(g), 1e-12) {
			t.Fatalf("volume %v, want %v", cr.Volume(), a*b*c*math.Sqrt(g))
		}
		if L[0].Dot(L[1].Cross(L[2])) <= 0 {
			t.Fatalf("left-handed lattice %v", L)
		}
	}
}

func ftoa(x float64) string { return strconv.FormatFloat(x, 'f', 12, 64) }

func readFile(t *testing.T, path string) string {
	t.Helper()
	return mustRead(t, path)
}

func mustRead(t testing.TB, path string) string {
	t.Helper()
	b, err := os.ReadFile(path)
	if err != nil {
		t.Fatal(err)
	}
	return string(b)
}

// TestSiteLimitWhileTokenising: an atom-site loop longer than the reader's
// 50,000-site limit is refused at the row that crosses it, while the file
// is tokenised, not after the whole file is held in tokens.
func TestSiteLimitWhileTokenising(t *testing.T) {
	var b strings.Builder
	b.WriteString(header + sitesCsCl) // 17 lines
	for i := 0; i < 60000; i++ {
		fmt.Fprintf(&b, "Cs%d 0.%05d 0 0\n", i, i)
	}
	_, err := cif.Read(strings.NewReader(b.String()), "big.cif", cif.Options{})
	var ce *cif.Error
	if !errors.As(err, &ce) || !strings.Contains(ce.Msg, "more than 50000 rows") {
		t.Fatalf("err = %v, want the atom-site loop refused", err)
	}
	if want := 17 + 50001; ce.Line != want {
		t.Errorf("refused at line %d, want %d (the first row past the limit)", ce.Line, want)
	}
}
