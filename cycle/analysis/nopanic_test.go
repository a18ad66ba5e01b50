package analysis

import (
	"math/rand/v2"
	"testing"
)

// TestNoPanicOnAnyPair: scans, estimates, solution cycles and derived radii
// over seeded random element pairs and formulas return values or errors,
// never panic, and every number they return is finite.
func TestNoPanicOnAnyPair(t *testing.T) {
	a := testAnalyst(t)
	els := a.DB().Elements()
	rng := rand.New(rand.NewPCG(2026, 12))
	for range 150 {
		m, x := els[rng.IntN(len(els))].Symbol, els[rng.IntN(len(els))].Symbol
		sc, err := a.Scan(m, x, ScanOptions{MaxCharge: 1 + rng.IntN(3)})
		if err == nil {
			for _, d := range sc.Disproportionations {
				if d.Enthalpy != d.Enthalpy || d.Uncertainty != d.Uncertainty {
					t.Errorf("%s/%s: NaN in %q", m, x, d.Reaction)
				}
			}
		}
		f := m + countText(1+rng.IntN(3)) + x + countText(1+rng.IntN(3))
		if e, err := a.Estimate(f, EstimateOptions{Model: EstimateModels()[rng.IntN(len(EstimateModels()))]}); err == nil && e.Value != e.Value {
			t.Errorf("%s: NaN estimate", f)
		}
		a.Solution(f, SolutionOptions{})
		a.DeriveRadius(f, RadiusOptions{Ion: "anion", LatticeEnergy: -rng.Float64() * 5000})
	}
	for _, f := range []string{"", " ", "(", "Na((Cl", "NaCl2-", "H2O", "He", "NaNa", "ClNa", "Na0Cl", "Na999999Cl"} {
		a.Estimate(f, EstimateOptions{})
		a.Solution(f, SolutionOptions{})
		a.DeriveRadius(f, RadiusOptions{})
		a.Scan(f, f, ScanOptions{})
	}
}
