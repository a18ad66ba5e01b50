package assembly

import (
	"math"
	"testing"

	"enthalpath/cycle/analysis"
	"enthalpath/tui/internal/drive"
)

// TestGuidedBuildEstimatesAsTheCommandLine: the guided build of the
// hypothetical MgCl (Mg⁺, Cl⁻), its formation enthalpy made the unknown,
// fills the lattice step from the same default model, with the same σ, as
// the command line's estimate (analysis.Estimate with the default model):
// the same formation enthalpy and σ (a consistency check, no outside
// source).
func TestGuidedBuildEstimatesAsTheCommandLine(t *testing.T) {
	f, m, u := setup(t, "MgCl")
	for !m.Done() {
		k := "y"
		if m.currentKey() == "formation" {
			k = "x"
		}
		drive.Run(u, drive.Key(k))
	}
	res := f.Session.Solved()
	if res == nil {
		t.Fatalf("not solved: %v", f.Session.SolveErr)
	}
	est, err := analysis.New(f.DB).Estimate("MgCl", analysis.EstimateOptions{Charges: analysis.Charges{"Mg": 1, "Cl": -1}})
	if err != nil {
		t.Fatal(err)
	}
	if f.Session.Cycle.Settings.LatticeFrom != est.Model {
		t.Errorf("guided build takes the lattice from %q, the estimate from %q", f.Session.Cycle.Settings.LatticeFrom, est.Model)
	}
	form, _ := res.Step("formation")
	if math.Abs(form.Value-est.Value) > 1e-6 || math.Abs(form.Uncertainty-est.Uncertainty) > 1e-6 {
		t.Errorf("guided build %.4f ± %.4f, estimate %.4f ± %.4f", form.Value, form.Uncertainty, est.Value, est.Uncertainty)
	}
}
