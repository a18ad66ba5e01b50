package thermo

import (
	"math"
	"testing"
)

func TestDerivedConstants(t *testing.T) {
	// Expected values: CODATA 2018 (NIST SP 961, 2019 wallet card and
	// physics.nist.gov/constants): Faraday constant F = 96 485.332 12 C/mol
	// (exact), so 1 eV = 96.485 332 12 kJ/mol; e²/(4πε₀) = α·ħc =
	// 7.297 352 5693e-3 × 197.326 980 4 MeV fm = 1.439 964 548 MeV fm
	// = 14.399 645 48 eV Å.
	tests := []struct {
		name      string
		got, want float64
		relTol    float64
	}{
		{"kJ/mol per eV (Faraday/1000)", KJPerMolPerEV, 96.48533212, 1e-10},
		{"e^2/(4 pi eps0) in eV A", CoulombEVAngstrom, 14.39964548, 1e-9},
		{"R in J/(mol K)", GasConstant, 8.314462618, 1e-9},
		{"RT at 298.15 K in kJ/mol", RT(298.15), 2.478957, 1e-6},
	}
	for _, tc := range tests {
		if rel := math.Abs(tc.got-tc.want) / math.Abs(tc.want); rel > tc.relTol {
			t.Errorf("%s = %.12g, want %.12g (rel. diff %.2g > %.2g)", tc.name, tc.got, tc.want, rel, tc.relTol)
		}
	}
}

func TestUnitRoundTrip(t *testing.T) {
	// Property: converting out and back is the identity for every unit.
	for _, u := range Units() {
		for _, v := range []float64{-3000, -787.4, 0, 1e-3, 495.8} {
			back := ToKJPerMol(FromKJPerMol(v, u), u)
			if math.Abs(back-v) > 1e-12*math.Max(1, math.Abs(v)) {
				t.Errorf("%s: %g → %g", u, v, back)
			}
		}
		parsed, err := ParseUnit(u.Key())
		if err != nil || parsed != u {
			t.Errorf("ParseUnit(%q) = %v, %v; want %v", u.Key(), parsed, err, u)
		}
	}
	// 1 kcal = 4.184 kJ exactly (thermochemical calorie, NIST SP 811 appendix B).
	if got := FromKJPerMol(4.184, KcalPerMol); math.Abs(got-1) > 1e-15 {
		t.Errorf("4.184 kJ/mol = %g kcal/mol, want 1", got)
	}
	if _, err := ParseUnit("joule"); err == nil {
		t.Error("ParseUnit(joule) accepted")
	}
}
