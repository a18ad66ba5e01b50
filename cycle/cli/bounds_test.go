package cli

import (
	"strconv"
	"testing"

	"enthalpath/cycle"
)

// TestModelFlagsTakeTheEngineBounds: --rho and --born-n accept exactly what
// cycle.CheckSetting accepts, the bound the workshop and cycle files use
// too (before: ρ < 5 Å and n < 100 here, ρ ≤ 2 Å and 1 ≤ n ≤ 20 in the
// workshop). The values straddle the ends (common practice, no source).
func TestModelFlagsTakeTheEngineBounds(t *testing.T) {
	for _, tc := range []struct {
		flag    string
		setting cycle.ModelSetting
		values  []float64
	}{
		{"--rho", cycle.SettingRho, []float64{0.345, 2, 2.5, 4, -0.3}},
		{"--born-n", cycle.SettingBornExponent, []float64{1, 1.5, 9, 30, 50}},
	} {
		for _, v := range tc.values {
			_, errs, code := run(t, "cycle", "NaCl", tc.flag, strconv.FormatFloat(v, 'g', -1, 64))
			want := cycle.CheckSetting(tc.setting, v) == nil
			if got := code == ExitOK; got != want {
				t.Errorf("cycle NaCl %s %g: exit %d (%s); engine bound accepts: %v", tc.flag, v, code, errs, want)
			}
		}
	}
}
