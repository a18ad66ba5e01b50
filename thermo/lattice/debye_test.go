package lattice

import (
	"math"
	"testing"

	"enthalpath/thermo"
)

// TestDebyeFunction: D₃(x) against mpmath 1.2.1's quad of (3/x³)∫₀ˣ
// t³/(eᵗ−1) dt at 30 digits (Debian python3-mpmath, run by hand:
// 3/x**3*mpmath.quad(lambda t: t**3/mpmath.expm1(t), [0, x])); D₃(1) =
// 0.674416 is also Abramowitz and Stegun's Table 27.1 value (from memory).
func TestDebyeFunction(t *testing.T) {
	for _, c := range []struct{ x, want float64 }{
		{0.5, 0.82496296897623372},
		{1.0, 0.67441556407781468},
		{1.2, 0.62079768801318993},
		{2.5, 0.35413603481042395},
		{5.0, 0.11759741179993397},
		{10.0, 0.01929576569034549},
	} {
		if got := DebyeFunction(c.x); math.Abs(got-c.want) > 1e-12 {
			t.Errorf("D₃(%g) = %.17g, mpmath %.17g", c.x, got, c.want)
		}
	}
	// Limits: 1 − 3x/8 near 0 and π⁴/(5x³) far out (the series and the
	// asymptote of the definition).
	if got := DebyeFunction(1e-3); math.Abs(got-(1-3e-3/8)) > 1e-6 {
		t.Errorf("D₃(0.001) = %g, want 1 − 3x/8", got)
	}
	for _, x := range []float64{29.9, 30.1, 60} {
		if got, want := DebyeFunction(x), math.Pow(math.Pi, 4)/(5*x*x*x); math.Abs(got-want) > 1e-9*want {
			t.Errorf("D₃(%g) = %g, want π⁴/(5x³) = %g", x, got, want)
		}
	}
	if !math.IsNaN(DebyeFunction(-1)) {
		t.Error("D₃(−1) should be NaN")
	}
}

// TestDebyeHeatContent: the classical limit 3νRT (Dulong and Petit) when
// θ_D ≪ T, and monotone growth of H(T) − H(0) with T.
func TestDebyeHeatContent(t *testing.T) {
	if got, want := DebyeHeatContent(1, 298.15, 2), 6*thermo.RT(298.15); math.Abs(got-want) > 2e-3*want {
		t.Errorf("θ_D = 1 K: %g kJ/mol, want 3νRT = %g", got, want)
	}
	prev := 0.0
	for temp := 10.0; temp <= 1000; temp += 10 {
		h := DebyeHeatContent(300, temp, 2)
		if !(h > prev) {
			t.Fatalf("H(%g K) − H(0) = %g not above H at 10 K less (%g)", temp, h, prev)
		}
		prev = h
	}
	if !math.IsNaN(DebyeHeatContent(0, 298.15, 2)) {
		t.Error("θ_D = 0 should give NaN")
	}
}
