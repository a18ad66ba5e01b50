package cif_test

import (
	"errors"
	"math"
	"os"
	"path/filepath"
	"strings"
	"testing"

	"enthalpath/thermo/cif"
)

// FuzzParse feeds arbitrary bytes to Parse. It must never panic, must
// return either a crystal or an *Error, and a crystal it returns must be
// valid: neutral, positive volume, coordinates in [0,1), finite charges.
// The seed corpus is every file in testdata/cif plus the error cases of
// TestParseErrors' building blocks.
func FuzzParse(f *testing.F) {
	files, _ := filepath.Glob(filepath.Join(cifDir, "*.cif"))
	for _, p := range files {
		b, err := os.ReadFile(p)
		if err != nil {
			f.Fatal(err)
		}
		f.Add(b)
	}
	f.Add([]byte(header + sitesCsCl + "Cs1 0 0 0\nCl1 0.5 0.5 0.5\n"))
	f.Add([]byte(header + "loop_\n_space_group_symop_operation_xyz\n'x,y,z'\n'-x,-y,-z'\nloop_\n_atom_site_type_symbol\n_atom_site_fract_x\n_atom_site_fract_y\n_atom_site_fract_z\n_atom_site_occupancy\nNa+ 0.1 0.2 0.3 1\nCl- 0.6 0.7 0.8 1.0(2)\n"))
	f.Add([]byte("data_a\n_x\n;text\n;\ndata_b\n" + header[7:]))
	f.Fuzz(func(t *testing.T, data []byte) {
		c, err := cif.Parse(strings.NewReader(string(data)), "fuzz.cif", cif.Options{})
		if err != nil {
			var e *cif.Error
			if !errors.As(err, &e) {
				t.Fatalf("error %v (%T) is not a *cif.Error", err, err)
			}
			if c != nil {
				t.Fatal("crystal returned beside an error")
			}
			return
		}
		if err := c.Validate(); err != nil {
			t.Fatalf("returned crystal is invalid: %v", err)
		}
		for _, s := range c.Sites {
			for _, x := range s.Frac {
				if !(x >= 0 && x < 1) {
					t.Fatalf("coordinate %v outside [0,1)", s.Frac)
				}
			}
			if math.IsNaN(s.Charge) || math.IsInf(s.Charge, 0) || s.Species == "" {
				t.Fatalf("bad site %+v", s)
			}
		}
	})
}

// FuzzParseSymop feeds arbitrary strings to ParseSymop. It must never
// panic; a failure must be a *SymopError with a column inside the input
// (or one past its end); a success must have an integer rotation part with
// determinant ±1 and survive a String round trip.
func FuzzParseSymop(f *testing.F) {
	for _, s := range []string{
		"x,y,z", "-x+1/2, y, -z+1/2", "x-y,x,z+1/3", "1/2+x, 0.5-y, z", "-Y, X-Y, Z+2/3",
		"x,y,z+1/0", "2*x,y,z", "x*1,y,-z", "x,y", "x,,z", "y+1/2,-x+1/2,-z+1/2", ".5-x,y,z",
	} {
		f.Add(s)
	}
	files, _ := filepath.Glob(filepath.Join(cifDir, "*.cif"))
	for _, p := range files {
		b, _ := os.ReadFile(p)
		for _, ln := range strings.Split(string(b), "\n") {
			if strings.Count(ln, ",") == 2 && !strings.HasPrefix(ln, "#") {
				fields := strings.Fields(strings.ReplaceAll(ln, "'", ""))
				if len(fields) > 0 {
					f.Add(fields[len(fields)-1])
				}
			}
		}
	}
	f.Fuzz(func(t *testing.T, s string) {
		op, err := cif.ParseSymop(s)
		if err != nil {
			var se *cif.SymopError
			if !errors.As(err, &se) {
				t.Fatalf("error %v (%T) is not a *cif.SymopError", err, err)
			}
			if se.Column < 1 || se.Column > len(s)+1 {
				t.Fatalf("column %d outside input of length %d: %v", se.Column, len(s), err)
			}
			return
		}
		m := op.Rot
		det := m[0][0]*(m[1][1]*m[2][2]-m[1][2]*m[2][1]) - m[0][1]*(m[1][0]*m[2][2]-m[1][2]*m[2][0]) + m[0][2]*(m[1][0]*m[2][1]-m[1][1]*m[2][0])
		if math.Abs(math.Abs(det)-1) > 1e-9 {
			t.Fatalf("%q: determinant %g", s, det)
		}
		for i := range m {
			for j := range m[i] {
				if m[i][j] != math.Trunc(m[i][j]) {
					t.Fatalf("%q: rotation entry %g is not whole", s, m[i][j])
				}
			}
		}
		back, err := cif.ParseSymop(op.String())
		if err != nil {
			t.Fatalf("%q → %q does not parse: %v", s, op.String(), err)
		}
		if back.Rot != op.Rot {
			t.Fatalf("%q → %q changes the rotation", s, op.String())
		}
		for i := 0; i < 3; i++ {
			if math.Abs(back.Trans[i]-op.Trans[i]) > 1e-9*math.Max(1, math.Abs(op.Trans[i])) {
				t.Fatalf("%q → %q changes the translation %v → %v", s, op.String(), op.Trans, back.Trans)
			}
		}
	})
}
