package cells_test

import (
	"errors"
	"math"
	"testing"

	"enthalpath/cycle/cells"
)

// The engine's side of the structure commands gives what the physics
// packages give: the Madelung constant of rock salt (published value
// 1.747565, handbook tables of Madelung constants, from memory), a refused
// accuracy as ErrBadOptions, and a sum coarser when asked coarser.
func TestSumChargedRockSalt(t *testing.T) {
	c, err := cells.Build("rock-salt", map[string]float64{"a": 5.6402})
	if err != nil {
		t.Fatal(err)
	}
	r, bg, err := cells.SumCharged(c, 0)
	if err != nil {
		t.Fatal(err)
	}
	if math.Abs(r.MadelungConstant-1.747565) > 1e-6 || bg.NetCharge != 0 {
		t.Errorf("rock salt: A = %.7f, net charge %g; want 1.747565 (from memory), 0", r.MadelungConstant, bg.NetCharge)
	}
	if r.Accuracy != cells.DefaultAccuracy {
		t.Errorf("accuracy 0 summed to %g, want the default %g", r.Accuracy, cells.DefaultAccuracy)
	}
	coarse, _, err := cells.SumCharged(c, 1e-4)
	if err != nil || coarse.Accuracy != 1e-4 {
		t.Errorf("accuracy 1e-4: summed to %g (%v)", coarse.Accuracy, err)
	}
	if _, _, err := cells.SumCharged(c, -1); !errors.Is(err, cells.ErrBadOptions) {
		t.Errorf("accuracy −1: %v, want ErrBadOptions", err)
	}
}

// A prototype that does not exist is refused by name; one that does is
// listed among the prototypes.
func TestLookupPrototype(t *testing.T) {
	if _, err := cells.LookupPrototype("no-such-structure"); err == nil {
		t.Error("an unknown prototype was accepted")
	}
	p, err := cells.LookupPrototype("fluorite")
	if err != nil {
		t.Fatal(err)
	}
	found := false
	for _, q := range cells.Prototypes() {
		found = found || q.Name == p.Name
	}
	if !found {
		t.Errorf("fluorite is not among the listed prototypes")
	}
}

// Li/vacancy on half the cation sites of a 2×1×1 rock-salt supercell
// (4 of 8 sites: C(8,4) = 70 orderings, counted by hand) with the anions
// at −1/2 to keep the cell neutral: the problem set up through the engine
// enumerates them all.
func TestNewProblemEnumerates(t *testing.T) {
	c, err := cells.Build("rock-salt", nil)
	if err != nil {
		t.Fatal(err)
	}
	if c, err = c.Supercell(2, 1, 1); err != nil {
		t.Fatal(err)
	}
	specs := []cells.SiteSpec{
		{Match: "M", Occupants: []cells.Occupant{{Species: "Li", Charge: 1, Fraction: 0.5}, {Fraction: 0.5}}},
		{Match: "X", Occupants: []cells.Occupant{{Species: "O", Charge: -0.5, Fraction: 1}}},
	}
	p, err := cells.NewProblem(c, specs, 1e-6)
	if err != nil {
		t.Fatal(err)
	}
	out, err := p.Search(cells.SearchOptions{Method: cells.Enumerate})
	if err != nil {
		t.Fatal(err)
	}
	if out.Total != 70 {
		t.Errorf("%g orderings, want C(8,4) = 70", out.Total)
	}
}
