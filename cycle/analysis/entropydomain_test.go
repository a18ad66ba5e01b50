package analysis

import (
	"strings"
	"testing"
)

// TestEstimateSaysDomain: an estimate's volume-based S° says whether the
// salt is inside the line's domain, and widens σ outside. MgO (calorimetric
// θ_D about 946 K, from memory) lies outside θ_D ≤ 2·298.15 K, NaCl and KCl
// (about 321 K and 235 K, from memory) inside.
func TestEstimateSaysDomain(t *testing.T) {
	a := testAnalyst(t)
	tests := []struct {
		formula string
		inside  bool
	}{
		{"MgO", false},
		{"NaCl", true},
		{"KCl", true},
	}
	for _, tc := range tests {
		est, err := a.Estimate(tc.formula, EstimateOptions{})
		if err != nil {
			t.Fatalf("%s: %v", tc.formula, err)
		}
		th := a.estimatedThermo(est, nil)
		d := th.EntropyDomain
		if d == nil || !d.Judged {
			t.Fatalf("%s: domain not judged (%+v)", tc.formula, d)
		}
		t.Logf("%s: %s", tc.formula, th.Entropy.Basis)
		if d.Inside != tc.inside {
			t.Errorf("%s: inside = %v at θ_D %.0f K, want %v", tc.formula, d.Inside, d.DebyeTemperature, tc.inside)
		}
		if got := strings.Contains(th.Entropy.Basis, "OUTSIDE the line's domain"); got == tc.inside {
			t.Errorf("%s: basis does not say the verdict: %s", tc.formula, th.Entropy.Basis)
		}
		want := EntropyRelativeUncertainty
		if !tc.inside {
			want = EntropyOutsideRelativeUncertainty
		}
		if th.Entropy.Uncertainty < want*th.Entropy.Value {
			t.Errorf("%s: σ %.1f below %.0f %% of %.1f", tc.formula, th.Entropy.Uncertainty, 100*want, th.Entropy.Value)
		}
	}
}
