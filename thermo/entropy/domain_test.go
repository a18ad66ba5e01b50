package entropy

import (
	"math"
	"testing"

	"enthalpath/thermo"
)

// TestDebyeEntropyLimits checks the Debye entropy against its two textbook
// limits (P. Debye, Ann. Phys. 344, 789 (1912)): the T³ law
// S = (4π⁴/5)·ν·R·(T/θ_D)³ far below θ_D, and the high-temperature series
// S = 3νR·[4/3 − ln x + x²/40 + …] far above it (x = θ_D/T; the series from
// expanding D₃ and ln(1 − e^(−x)), our own derivation).
func TestDebyeEntropyLimits(t *testing.T) {
	r := thermo.GasConstant
	tests := []struct {
		name        string
		theta, temp float64
		ions        int
		want, tol   float64
	}{
		{"T³ law, x = 50", 5000, 100, 2, 4 * math.Pow(math.Pi, 4) / 5 * 2 * r / (50 * 50 * 50), 1e-6},
		{"high T, x = 0.05", 50, 1000, 3, 9 * r * (4.0/3 - math.Log(0.05) + 0.05*0.05/40), 1e-4},
	}
	for _, tc := range tests {
		got := DebyeEntropy(tc.theta, tc.temp, tc.ions)
		if math.Abs(got-tc.want) > tc.tol*tc.want {
			t.Errorf("%s: DebyeEntropy = %.8g, want %.8g", tc.name, got, tc.want)
		}
	}
	if !math.IsNaN(DebyeEntropy(0, 298.15, 2)) || !math.IsNaN(DebyeEntropy(300, 298.15, 0)) {
		t.Error("no θ_D or no ions must give NaN")
	}
}

// TestInVolumeDomain: the bound sits at θ_D = 2T (MaxReducedDebye; common
// practice, no source) and an absent θ_D is not judged.
func TestInVolumeDomain(t *testing.T) {
	tests := []struct {
		theta      float64
		in, judged bool
	}{
		{321, true, true},   // NaCl's calorimetric θ_D, about 321 K (from memory)
		{596.3, true, true}, // exactly 2 × 298.15 K
		{946, false, true},  // MgO, about 946 K (from memory)
		{0, false, false},
		{math.NaN(), false, false},
	}
	for _, tc := range tests {
		in, ok := InVolumeDomain(tc.theta, 298.15)
		if in != tc.in || ok != tc.judged {
			t.Errorf("InVolumeDomain(%g) = %v, %v; want %v, %v", tc.theta, in, ok, tc.in, tc.judged)
		}
	}
}

// TestDebyeTemperatureFromVolume: NaCl from its Born–Haber lattice energy
// 787 kJ/mol, V_m 0.0448 nm³ (a = 5.64 Å, four formula units) and 58.44
// g/mol (all from memory) gives a bulk modulus near the measured 24 GPa
// and θ_D near the calorimetric 321 K (from memory); the bulk sound speed
// puts it somewhat above: within 15 % is asked (common practice, no source).
func TestDebyeTemperatureFromVolume(t *testing.T) {
	got := DebyeTemperatureFromVolume(-787, 0.0448, 58.44, 2)
	if math.Abs(got-321)/321 > 0.15 {
		t.Errorf("θ_D(NaCl) = %.0f K, want 321 K within 15 %%", got)
	}
	if DebyeTemperatureFromVolume(787, 0, 58.44, 2) != 0 || DebyeTemperatureFromVolume(787, 0.0448, 58.44, 0) != 0 {
		t.Error("a missing input must give 0")
	}
}
