package analysis

import (
	"math"
	"testing"

	"enthalpath/cycle"
)

// TestMgClSameEverywhere: the estimate of the hypothetical MgCl (Mg⁺, Cl⁻)
// gives one formation enthalpy and one σ whether asked on the command line
// (Estimate), in a batch (Row) or in the workshop's guided build (a cycle
// whose lattice step comes from cycle.DefaultModel, as tui/assembly fills
// it). The three paths share the default model and its σ from the
// validation of the built-in data (no outside source: a consistency check).
func TestMgClSameEverywhere(t *testing.T) {
	a := testAnalyst(t)
	opt := EstimateOptions{Charges: Charges{"Mg": 1, "Cl": -1}}
	est, err := a.Estimate("MgCl", opt)
	if err != nil {
		t.Fatal(err)
	}
	row := a.Row(BatchRow{Line: 2, Formula: "MgCl", Options: opt})
	if row.Error != "" {
		t.Fatal(row.Error)
	}
	c, err := cycle.Build(a.DB(), "MgCl", cycle.Options{Cation: "Mg+", Anion: "Cl-", Memo: a.Memo()})
	if err != nil {
		t.Fatal(err)
	}
	mr, _, err := cycle.DefaultModel(c)
	if err != nil {
		t.Fatalf("guided build: %v", err)
	}
	c.Settings.LatticeFrom = mr.Model
	if err := c.SolveFor("formation"); err != nil {
		t.Fatal(err)
	}
	res, err := cycle.Solve(c)
	if err != nil {
		t.Fatal(err)
	}
	t.Logf("estimate %s %.2f ± %.2f; batch %s %.2f ± %.2f; guided build %s %.2f ± %.2f", est.Model, est.Value, est.Uncertainty,
		row.Model, *row.FormationKJPerMol, *row.UncertaintyKJPerMol, mr.Model, res.Solved.Value, res.Solved.Uncertainty)
	// Batch rows carry three decimals.
	same := func(x, y float64) bool { return math.Abs(x-y) <= 5e-4 }
	if row.Model != est.Model || mr.Model != est.Model {
		t.Errorf("models differ: estimate %s, batch %s, guided build %s", est.Model, row.Model, mr.Model)
	}
	if !same(est.Value, *row.FormationKJPerMol) || !same(est.Value, res.Solved.Value) {
		t.Errorf("values differ: estimate %.6f, batch %.6f, guided build %.6f", est.Value, *row.FormationKJPerMol, res.Solved.Value)
	}
	if !same(est.Uncertainty, *row.UncertaintyKJPerMol) || !same(est.Uncertainty, res.Solved.Uncertainty) {
		t.Errorf("σ differ: estimate %.6f, batch %.6f, guided build %.6f", est.Uncertainty, *row.UncertaintyKJPerMol, res.Solved.Uncertainty)
	}
}
