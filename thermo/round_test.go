package thermo

import "testing"

// TestFormatWithUncertainty: the uncertainty to two significant figures,
// the value to the same decimal place (JCGM 100:2008, GUM 7.2.6); the
// cases the command line once printed unevenly ("1.843 ± 0.0083",
// "6.113 ± 0.001", "495.8 ± 2.4e-05") come out with one rule.
func TestFormatWithUncertainty(t *testing.T) {
	for _, tc := range []struct {
		v, u       float64
		value, unc string
	}{
		{1.843, 0.0083, "1.8430", "0.0083"},
		{6.113, 0.001, "6.1130", "0.0010"},
		{495.8454, 2.4e-05, "495.845400", "0.000024"},
		{-787.38, 1.41, "-787.4", "1.4"},
		{-411.153, 0.107, "-411.15", "0.11"},
		{-411.153, 0.0996, "-411.15", "0.10"}, // u rounds up to the next decade
		{788.2, 115.3, "788", "115"},          // whole numbers: value keeps its units digit
		{-3791.6, 20, "-3792", "20"},
		{3.7, 0.95, "3.70", "0.95"},
		{3.7, 0, "3.7", ""}, // no uncertainty: the caller's default
	} {
		value, unc := FormatWithUncertainty(tc.v, tc.u, 1)
		if value != tc.value || unc != tc.unc {
			t.Errorf("FormatWithUncertainty(%g, %g) = %q ± %q, want %q ± %q", tc.v, tc.u, value, unc, tc.value, tc.unc)
		}
	}
}
