package entropy

import (
	"errors"
	"math"
	"testing"
)

// The published lines (Jenkins & Glasser 2003, abstract): S = 1360·V + 15,
// 1579·V + 6, 1262·V + 13; the density forms quoted there, 2.258·M/ρ + 15
// etc., follow with V = M/(ρ·N_A) = 1.6605e-3·M/ρ nm³ (1360·1.6605e-3 = 2.258).
func TestLines(t *testing.T) {
	for _, tc := range []struct {
		c       Class
		density float64 // the paper's coefficient of M/ρ
	}{{Salt, 2.258}, {Hydrate, 2.621}, {Mineral, 2.095}} {
		l := LineFor(tc.c)
		if got := l.K * 1.66054e-3; math.Abs(got-tc.density) > 0.002 {
			t.Errorf("%v: K·u = %.4f, paper %.3f", tc.c, got, tc.density)
		}
	}
	// CaF2: V_m = a³/4 with a = 5.4626 Å (Wyckoff 1963, as in data/tables/compounds.csv)
	// = 0.040751 nm³ → 1360·0.040751 + 15 = 70.4; NBS 1982 S°(CaF2, cr) = 68.87
	// (line 9311 of the pinned NBS file): within 3 %.
	s, err := FromVolume(math.Pow(5.4626, 3)/4/1000, Salt)
	if err != nil || math.Abs(s-70.42) > 0.05 {
		t.Errorf("CaF2: %.2f, %v", s, err)
	}
	if math.Abs(s-68.87)/68.87 > 0.03 {
		t.Errorf("CaF2 estimate %.1f strays from NBS 68.87", s)
	}
	for _, bad := range []float64{0, -1, math.NaN(), math.Inf(1)} {
		var ve *VolumeError
		if _, err := FromVolume(bad, Salt); !errors.As(err, &ve) {
			t.Errorf("FromVolume(%g) err %v", bad, err)
		}
	}
	// A sphere of 1 Å: 4.18879e-3 nm³.
	if v := SphereVolume(1); math.Abs(v-4.18879e-3) > 1e-8 {
		t.Errorf("SphereVolume(1) = %g", v)
	}
}
