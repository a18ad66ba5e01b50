package ordering

import (
	"math"
	"math/rand"
	"testing"

	"enthalpath/thermo/crystal"
	"enthalpath/thermo/ewald"
)

// lithiumVacancy returns the Li/vacancy problem on the octahedral (cation)
// sites of an n1×n2×n3 supercell of the conventional rock-salt cell
// (a = 5.6402 Å, the prototype's default): half the cation sites hold Li⁺,
// half are empty, and every anion carries −½ so that the cell is neutral.
// Every cation site sees the same potential from the uniform anion
// sublattice, so the ranking is that of Li⁺ with a uniform compensating
// background.
func lithiumVacancy(t testing.TB, n1, n2, n3 int) *Problem {
	t.Helper()
	c, err := crystal.Build("rock-salt", nil)
	if err != nil {
		t.Fatal(err)
	}
	if c, err = c.Supercell(n1, n2, n3); err != nil {
		t.Fatal(err)
	}
	p, err := NewProblem(c, []SiteSpec{
		{Match: "M", Occupants: []Occupant{{Species: "Li", Charge: 1, Fraction: 0.5}, {Fraction: 0.5}}},
		{Match: "X", Occupants: []Occupant{{Species: "O", Charge: -0.5, Fraction: 1}}},
	}, Options{})
	if err != nil {
		t.Fatal(err)
	}
	return p
}

func relDiff(a, b float64) float64 { return math.Abs(a-b) / math.Abs(b) }

// TestEnumerationCoversEveryOrdering: on 16 cation sites (C(16,8) = 12,870
// orderings) the multiplicities of the distinct orderings add up to the
// count, and each listed energy equals ewald.Sum of the ordered crystal
// (itself checked against pymatgen) to 1e-9.
func TestEnumerationCoversEveryOrdering(t *testing.T) {
	p := lithiumVacancy(t, 2, 2, 1)
	out, err := p.Search(SearchOptions{Method: Enumerate, Keep: 1 << 20})
	if err != nil {
		t.Fatal(err)
	}
	if out.Total != 12870 || out.Visited != 12870 {
		t.Fatalf("total %g, visited %d; want 12870 (C(16,8))", out.Total, out.Visited)
	}
	sum := 0
	for _, o := range out.Orderings {
		sum += o.Multiplicity
	}
	if sum != 12870 {
		t.Errorf("%d distinct orderings with multiplicities adding to %d, want 12870 (%d operations)", len(out.Orderings), sum, out.Operations)
	}
	for k, o := range out.Orderings[:min(10, len(out.Orderings))] {
		r, err := ewald.Sum(p.Crystal(o.Assignment), ewald.Options{})
		if err != nil {
			t.Fatal(err)
		}
		if relDiff(o.EnergyEV, r.EnergyEV) > 1e-9 {
			t.Errorf("ordering %d: %.10f eV from the pair potentials, ewald.Sum %.10f eV", k+1, o.EnergyEV, r.EnergyEV)
		}
		if k > 0 && o.EnergyEV < out.Orderings[k-1].EnergyEV-1e-11*math.Abs(o.EnergyEV) {
			t.Errorf("ordering %d (%.15g eV) lies below ordering %d (%.15g eV)", k+1, o.EnergyEV, k, out.Orderings[k-1].EnergyEV)
		}
	}
	t.Logf("%d distinct orderings, %d operations; lowest %.8f eV ×%d", len(out.Orderings), out.Operations, out.Orderings[0].EnergyEV, out.Orderings[0].Multiplicity)
}

// TestAnnealingFindsEnumeratedLowest: annealing (seeded) lists the same
// lowest orderings as the enumeration on a case small enough to enumerate.
func TestAnnealingFindsEnumeratedLowest(t *testing.T) {
	for _, n := range [][3]int{{2, 2, 1}, {1, 1, 3}} {
		p := lithiumVacancy(t, n[0], n[1], n[2])
		all, err := p.Search(SearchOptions{Method: Enumerate, Keep: 3})
		if err != nil {
			t.Fatal(err)
		}
		ann, err := p.Search(SearchOptions{Method: Anneal, Keep: 3, Seed: 1, Sweeps: 500})
		if err != nil {
			t.Fatal(err)
		}
		for k := range all.Orderings {
			a, b := all.Orderings[k], ann.Orderings[k]
			if string(a.Assignment) != string(b.Assignment) || relDiff(a.EnergyEV, b.EnergyEV) > 1e-12 {
				t.Errorf("%v rank %d: annealing %.10f eV, enumeration %.10f eV", n, k+1, b.EnergyEV, a.EnergyEV)
			}
		}
	}
}

// TestEnergiesWithoutSymmetry: the pair potentials filled from one row per
// translation orbit give the energies of the ones summed row by row (no
// symmetry table, Options.MaxSymmetry 1), for seeded random orderings of
// the 96-site cell, to 1e-11 relative.
func TestEnergiesWithoutSymmetry(t *testing.T) {
	c, err := crystal.Build("rock-salt", nil)
	if err != nil {
		t.Fatal(err)
	}
	if c, err = c.Supercell(2, 2, 3); err != nil {
		t.Fatal(err)
	}
	specs := []SiteSpec{
		{Match: "M", Occupants: []Occupant{{Species: "Li", Charge: 1, Fraction: 0.5}, {Fraction: 0.5}}},
		{Match: "X", Occupants: []Occupant{{Species: "O", Charge: -0.5, Fraction: 1}}},
	}
	with, err := NewProblem(c, specs, Options{})
	if err != nil {
		t.Fatal(err)
	}
	without, err := NewProblem(c, specs, Options{MaxSymmetry: 1})
	if err != nil {
		t.Fatal(err)
	}
	if with.symm.size() != 768 || without.symm != nil {
		t.Fatalf("%d and %d operations; want 768 (16 rotations × 48 translations) and none", with.symm.size(), without.symm.size())
	}
	s := newSwapper(with)
	rng := rand.New(rand.NewSource(5))
	for trial := 0; trial < 5; trial++ {
		s.randomise(rng)
		if a, b := with.Energy(s.x), without.Energy(s.x); relDiff(a, b) > 1e-11 {
			t.Errorf("trial %d: %.12f eV from translated rows, %.12f eV row by row", trial, a, b)
		}
	}
}
