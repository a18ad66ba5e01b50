package cycle

import (
	"errors"
	"math"
	"strings"
	"testing"
	"unicode/utf8"

	"enthalpath/thermo"
)

func TestParseSetting(t *testing.T) {
	kcal := thermo.JoulePerCalorie // exact by definition
	ev := thermo.KJPerMolPerEV
	for _, tc := range []struct {
		in      string
		key     string
		v, u    float64
		hasUnc  bool
		errCol  int // 0: no error
		errWord string
	}{
		{in: "lattice=-787", key: "lattice", v: -787},
		{in: "attachment-2=744±20", key: "attachment-2", v: 744, u: 20, hasUnc: true},
		{in: "attachment-2 = 744 +- 20", key: "attachment-2", v: 744, u: 20, hasUnc: true},
		{in: "formation=−411.2±0.1", key: "formation", v: -411.2, u: 0.1, hasUnc: true},
		{in: "lattice=-188.1kcal", key: "lattice", v: -188.1 * kcal},
		{in: "attachment-1=-3.6±0.01 eV", key: "attachment-1", v: -3.6 * ev, u: 0.01 * ev, hasUnc: true},
		{in: "ionization-1=1e2", key: "ionization-1", v: 100},
		{in: "lattice", errCol: 8, errWord: "missing '='"},
		{in: "=5", errCol: 1, errWord: "missing step key"},
		{in: "lat tice=5", errCol: 4, errWord: "letters"},
		{in: "lattice=", errCol: 9, errWord: "missing value"},
		{in: "lattice=abc", errCol: 9, errWord: "not a number"},
		{in: "lattice=5±", errCol: 11, errWord: "missing uncertainty"},
		{in: "lattice=5±-1", errCol: 11, errWord: "negative"},
		{in: "lattice=NaN", errCol: 9, errWord: "not a number"},
		{in: "lattice=inf", errCol: 9, errWord: "not a number"},
		{in: "lattice=1e999", errCol: 9, errWord: "not a number"},
		{in: "lattice=0x10", errCol: 9, errWord: "not a number"},
	} {
		s, err := ParseSetting(tc.in, thermo.KJPerMol)
		if tc.errCol != 0 {
			var se *SettingError
			if !errors.As(err, &se) || se.Column != tc.errCol || !strings.Contains(err.Error(), tc.errWord) {
				t.Errorf("ParseSetting(%q) = %v, want an error at column %d with %q", tc.in, err, tc.errCol, tc.errWord)
			}
			continue
		}
		if err != nil || s.Key != tc.key || !near(s.Value, tc.v, 1e-9) || !near(s.Uncertainty, tc.u, 1e-9) || s.HasUncertainty != tc.hasUnc {
			t.Errorf("ParseSetting(%q) = %+v, %v; want %s %g ± %g", tc.in, s, err, tc.key, tc.v, tc.u)
		}
	}
	// The default unit applies without a suffix.
	if s, _ := ParseSetting("lattice=-8.16", thermo.EVPerFormulaUnit); !near(s.Value, -8.16*ev, 1e-9) {
		t.Errorf("default unit eV not applied: %g", s.Value)
	}
}

func FuzzParseSetting(f *testing.F) {
	for _, s := range []string{"lattice=-787", "attachment-2=744±20", "x = 1 +- 2 kcal", "a=−1e3±0.5ev", "=", "±", "k=1±"} {
		f.Add(s)
	}
	f.Fuzz(func(t *testing.T, s string) {
		v, err := ParseSetting(s, thermo.KJPerMol)
		if err != nil {
			var se *SettingError
			if !errors.As(err, &se) {
				t.Fatalf("error is not a *SettingError: %v", err)
			}
			if se.Column < 1 || se.Column > utf8.RuneCountInString(s)+1 {
				t.Fatalf("column %d outside 1…%d for %q", se.Column, utf8.RuneCountInString(s)+1, s)
			}
			return
		}
		if v.Key == "" || math.IsNaN(v.Value) || math.IsInf(v.Value, 0) || v.Uncertainty < 0 || math.IsNaN(v.Uncertainty) || math.IsInf(v.Uncertainty, 0) {
			t.Fatalf("ParseSetting(%q) = %+v", s, v)
		}
	})
}
