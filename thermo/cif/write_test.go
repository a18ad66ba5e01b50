package cif

import (
	"bytes"
	"math"
	"testing"

	"enthalpath/thermo/crystal"
)

// TestWriteReadsBack: what Write writes, Parse reads back with the same
// cell, sites, species and charges, one species with two charges included
// (Fe²⁺ and Fe³⁺ on a rock-salt cation sublattice) and a fractional charge.
func TestWriteReadsBack(t *testing.T) {
	c, err := crystal.Build("rock-salt", nil)
	if err != nil {
		t.Fatal(err)
	}
	ions := []struct {
		sp string
		q  float64
	}{{"Fe", 2}, {"Fe", 3}, {"Li", 1}, {"Mg", 1.5}, {"O", -2}, {"O", -2}, {"O", -1.5}, {"O", -2}}
	for i, ion := range ions {
		c.Sites[i].Species, c.Sites[i].Charge = ion.sp, ion.q
	}
	var buf bytes.Buffer
	if err := Write(&buf, c, []string{"a test cell"}); err != nil {
		t.Fatal(err)
	}
	d, err := Parse(bytes.NewReader(buf.Bytes()), "written.cif", Options{})
	if err != nil {
		t.Fatalf("%v\n%s", err, buf.String())
	}
	if len(d.Sites) != len(c.Sites) || math.Abs(d.Volume()-c.Volume()) > 1e-9*c.Volume() {
		t.Fatalf("read back %d sites, volume %g; wrote %d, %g", len(d.Sites), d.Volume(), len(c.Sites), c.Volume())
	}
	for i, s := range c.Sites {
		r := d.Sites[i]
		if r.Species != s.Species || r.Charge != s.Charge || r.Frac.Sub(s.Frac).Norm() > 1e-9 {
			t.Errorf("site %d: read %s %+g %v, wrote %s %+g %v", i+1, r.Species, r.Charge, r.Frac, s.Species, s.Charge, s.Frac)
		}
	}
}
