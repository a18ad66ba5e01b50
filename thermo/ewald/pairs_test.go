package ewald

import (
	"math/rand"
	"testing"
)

// TestPairPotentialsGiveSumsEnergy: ½·qᵀΦq equals Sum's energy (which is
// checked against pymatgen's EwaldSummation in reference_test.go) for
// random neutral charge assignments on prototype supercells, displaced and
// not, at 1e-9 relative (Sum and the pairs are each good to 1e-10).
func TestPairPotentialsGiveSumsEnergy(t *testing.T) {
	rng := rand.New(rand.NewSource(19))
	for _, tt := range []struct {
		name   string
		cell   [3]int
		jitter float64
	}{
		{"rock-salt", [3]int{2, 2, 1}, 0},
		{"rock-salt", [3]int{1, 1, 2}, 0.05},
		{"fluorite", [3]int{1, 1, 1}, 0.03},
		{"rutile", [3]int{1, 2, 2}, 0},
		{"wurtzite", [3]int{2, 1, 1}, 0.02},
	} {
		c := build(t, tt.name, nil)
		c, err := c.Supercell(tt.cell[0], tt.cell[1], tt.cell[2])
		if err != nil {
			t.Fatal(err)
		}
		for k := range c.Sites {
			for d := 0; d < 3; d++ {
				c.Sites[k].Frac[d] += tt.jitter * (rng.Float64() - 0.5)
			}
		}
		rows := make([]int, len(c.Sites))
		for i := range rows {
			rows[i] = i
		}
		p, err := PairPotentials(c, rows, Options{})
		if err != nil {
			t.Fatal(err)
		}
		for trial := 0; trial < 4; trial++ {
			q := make([]float64, len(c.Sites))
			for i, s := range c.Sites {
				q[i] = s.Charge
			}
			if trial > 0 { // shuffle the charges over the sites: still neutral
				rng.Shuffle(len(q), func(i, j int) { q[i], q[j] = q[j], q[i] })
			}
			d := c.Clone()
			e := 0.0
			for i := range q {
				d.Sites[i].Charge = q[i]
				for j := range q {
					e += 0.5 * q[i] * q[j] * p.At(i, j)
				}
			}
			want := sum(t, d, Options{}).EnergyEV
			if relDiff(e, want) > 1e-9 {
				t.Errorf("%s %v trial %d: ½qᵀΦq = %.12f eV, Sum %.12f eV (rel. diff %.2g)", tt.name, tt.cell, trial, e, want, relDiff(e, want))
			}
		}
		// Φ is symmetric.
		for i := range rows {
			for j := range rows {
				if relDiff(p.At(i, j), p.At(j, i)) > 1e-12 {
					t.Fatalf("%s: Φ[%d,%d] = %g, Φ[%d,%d] = %g", tt.name, i, j, p.At(i, j), j, i, p.At(j, i))
				}
			}
		}
	}
}

// TestPairPotentialsRows: a subset of rows gives the same entries as the
// full matrix.
func TestPairPotentialsRows(t *testing.T) {
	c := build(t, "spinel", nil)
	full, err := PairPotentials(c, []int{0, 1, 2, 3, 4, 5, 6, 7, 8, 9, 10, 11, 12}, Options{})
	if err != nil {
		t.Fatal(err)
	}
	sub, err := PairPotentials(c, []int{12, 3}, Options{})
	if err != nil {
		t.Fatal(err)
	}
	for j := 0; j < len(c.Sites); j++ {
		if sub.At(0, j) != full.At(12, j) || sub.At(1, j) != full.At(3, j) {
			t.Fatalf("column %d: rows differ", j)
		}
	}
}
