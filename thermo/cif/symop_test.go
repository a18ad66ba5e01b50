package cif

import (
	"errors"
	"math"
	"math/rand"
	"testing"

	"enthalpath/thermo/crystal"
)

// Matrices written out by hand from the xyz strings, which by the
// convention of International Tables for Crystallography Vol. A give each
// new coordinate as a row (common practice, no source needed beyond that).
func TestParseSymop(t *testing.T) {
	I := [3][3]float64{{1, 0, 0}, {0, 1, 0}, {0, 0, 1}}
	tests := []struct {
		in    string
		rot   [3][3]float64
		trans [3]float64
	}{
		{"x,y,z", I, [3]float64{}},
		{"-x+1/2, y, -z+1/2", [3][3]float64{{-1, 0, 0}, {0, 1, 0}, {0, 0, -1}}, [3]float64{0.5, 0, 0.5}},
		{"x-y,x,z+1/3", [3][3]float64{{1, -1, 0}, {1, 0, 0}, {0, 0, 1}}, [3]float64{0, 0, 1.0 / 3}},
		{"1/2+x, 0.5-y, z", [3][3]float64{{1, 0, 0}, {0, -1, 0}, {0, 0, 1}}, [3]float64{0.5, 0.5, 0}},
		{"  -Y , X-Y , Z+2/3 ", [3][3]float64{{0, -1, 0}, {1, -1, 0}, {0, 0, 1}}, [3]float64{0, 0, 2.0 / 3}},
		{"+x, +y, -z", [3][3]float64{{1, 0, 0}, {0, 1, 0}, {0, 0, -1}}, [3]float64{}},
		{"x, y, .25-z", [3][3]float64{{1, 0, 0}, {0, 1, 0}, {0, 0, -1}}, [3]float64{0, 0, 0.25}},
		{"1*x, y*1, 1z", I, [3]float64{}},
		{"-x+y+1/6, -x, z - 1/6", [3][3]float64{{-1, 1, 0}, {-1, 0, 0}, {0, 0, 1}}, [3]float64{1.0 / 6, 0, -1.0 / 6}},
	}
	for _, tc := range tests {
		op, err := ParseSymop(tc.in)
		if err != nil {
			t.Errorf("ParseSymop(%q): %v", tc.in, err)
			continue
		}
		for i := 0; i < 3; i++ {
			for j := 0; j < 3; j++ {
				if op.Rot[i][j] != tc.rot[i][j] {
					t.Errorf("ParseSymop(%q).Rot = %v, want %v", tc.in, op.Rot, tc.rot)
					i, j = 3, 3
				}
			}
			if math.Abs(op.Trans[i]-tc.trans[i]) > 1e-15 {
				t.Errorf("ParseSymop(%q).Trans = %v, want %v", tc.in, op.Trans, tc.trans)
				break
			}
		}
	}
}

func TestParseSymopErrors(t *testing.T) {
	// Columns are 1-based positions of the character at fault, counted by
	// hand in each input.
	tests := []struct {
		in  string
		col int
	}{
		{"x,y", 4},            // end where ',' is needed
		{"x,y,", 5},           // empty third expression
		{"x;y;z", 2},          // ';' instead of ','
		{"x,y,q", 5},          // not a variable or number
		{"x,y,z,", 6},         // trailing ','
		{"x y,y,z", 3},        // missing operator
		{"x,y,z+1/0", 8},      // division by zero at the '/'
		{"x,y,z+", 6},         // sign with nothing after
		{"x,x,z", 1},          // determinant 0
		{"2x,y,z", 1},         // determinant 2
		{"", 1},               // empty
		{"x,y,z+1..2", 7},     // bad number
		{"x,y,z*", 7},         // '*' needs a number
		{"x,y,1/2*", 9},       // '*' needs a variable
		{"x,y,z+99999999", 7}, // out of range
		{"x,,z", 3},           // empty second expression
		{"x,y,z+1/2/3", 10},   // second '/'
		{"-x,-y,-z\x00", 9},   // stray byte
		{"x,y,z+1/2 + *", 13}, // '*' with no operand
		{"x,y,z+ 1 / 2 y", 8}, // fractional coefficient of y (starts at the "1")
		{"x,y,0.5*z", 5},      // fractional coefficient before '*'
		{"x,y,z*0.5", 7},      // fractional coefficient after '*'
		{"x,y,z+z", 1},        // 2z: determinant 2
	}
	for _, tc := range tests {
		_, err := ParseSymop(tc.in)
		var se *SymopError
		if !errors.As(err, &se) {
			t.Errorf("ParseSymop(%q) err = %v, want *SymopError", tc.in, err)
			continue
		}
		if se.Column != tc.col || !errors.Is(err, ErrBadSymop) {
			t.Errorf("ParseSymop(%q): %v; want column %d", tc.in, err, tc.col)
		}
	}
}

// TestSymopStringRoundTrip is a property test: writing an operation and
// reading it back gives the same operation, for random operations built
// from signed permutation matrices and translations in twelfths.
func TestSymopStringRoundTrip(t *testing.T) {
	rng := rand.New(rand.NewSource(7))
	for n := 0; n < 500; n++ {
		var op Symop
		perm := rng.Perm(3)
		for i := 0; i < 3; i++ {
			op.Rot[i][perm[i]] = float64(1 - 2*rng.Intn(2))
			op.Trans[i] = float64(rng.Intn(12)) / 12
		}
		if rng.Intn(3) == 0 { // hexagonal-style entries
			op.Rot[0] = [3]float64{1, -1, 0}
			op.Rot[1] = [3]float64{1, 0, 0}
			op.Rot[2] = [3]float64{0, 0, 1}
		}
		s := op.String()
		back, err := ParseSymop(s)
		if err != nil {
			t.Fatalf("ParseSymop(%q) of %+v: %v", s, op, err)
		}
		f := crystal.Vec3{rng.Float64(), rng.Float64(), rng.Float64()}
		a, b := op.Apply(f), back.Apply(f)
		if a.Sub(b).Norm() > 1e-12 {
			t.Fatalf("round trip of %q: %v then %v", s, a, b)
		}
	}
}
