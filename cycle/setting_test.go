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

// TestHugeValuesRefused: a step value or uncertainty beyond
// ±MaxStepMagnitude (1e6 kJ/mol, common practice, no source) is refused
// by ParseSetting, Set and a cycle file, with the step key named; before,
// formation=1e308 printed 300-digit numbers and the JSON writer met +Inf.
func TestHugeValuesRefused(t *testing.T) {
	for _, tc := range []struct {
		in     string
		errCol int
	}{
		{"formation=1e308", 11},
		{"formation=-1000001", 11},
		{"lattice=-300000kcal", 9}, // −1.2552e6 kJ/mol after conversion (1 kcal = 4.184 kJ, exact)
		{"formation=-411±2e6", 16},
	} {
		_, err := ParseSetting(tc.in, thermo.KJPerMol)
		var se *SettingError
		key, _, _ := strings.Cut(tc.in, "=")
		if !errors.As(err, &se) || se.Column != tc.errCol || !strings.Contains(se.Reason, "step "+key) || !strings.Contains(se.Reason, "1e+06") {
			t.Errorf("ParseSetting(%q) = %v; want a refusal naming step %s at column %d", tc.in, err, key, tc.errCol)
		}
	}
	if s, err := ParseSetting("formation=-1e6±1e6", thermo.KJPerMol); err != nil || s.Value != -1e6 {
		t.Errorf("the bound itself is accepted: %+v, %v", s, err)
	}
	c := build(t, "NaCl", Options{})
	if err := c.Set("formation", 1e308, 0); err == nil || !strings.Contains(err.Error(), "formation") {
		t.Errorf("Set(formation, 1e308) = %v; want a refusal naming the step", err)
	}
	file := "format = \"enthalpath-cycle\"\nversion = 1\ncompound = \"KBr\"\n[[step]]\nkey = \"lattice\"\nsource = \"user\"\nvalue = -1e308\n"
	_, err := Unmarshal(loadDB(t), []byte(file))
	var fe *FileError
	if !errors.As(err, &fe) || !strings.Contains(err.Error(), "step[1].value") || !strings.Contains(err.Error(), "step lattice") {
		t.Errorf("cycle file with lattice = -1e308: %v; want a refusal of step[1].value", err)
	}
	// The largest values accepted still solve to finite numbers.
	for _, k := range []string{"formation", "atomization-cation", "ionization-1"} {
		if err := c.Set(k, MaxStepMagnitude, MaxStepMagnitude); err != nil {
			t.Fatal(err)
		}
	}
	r := solve(t, c)
	if math.IsInf(r.Solved.Value, 0) || math.IsInf(r.Solved.Uncertainty, 0) {
		t.Errorf("solved %g ± %g", r.Solved.Value, r.Solved.Uncertainty)
	}
}

// TestModelsNeverInfinite: whatever ρ, n and d₀ a cycle file gives, a model
// returns a finite value or an error (a property, no source needed).
func TestModelsNeverInfinite(t *testing.T) {
	for _, set := range []Settings{
		{Rho: 1e300},
		{BornExponent: 1e300},
		{BornExponent: 1e-300},
		{Distance: DistanceUser, D0: 1e-300},
		{Distance: DistanceUser, D0: 1e300},
	} {
		c := build(t, "NaCl", Options{Settings: set})
		for _, m := range EvaluateModels(c) {
			if m.Err == nil && (math.IsInf(m.Value, 0) || math.IsNaN(m.Value) || math.IsInf(m.Uncertainty, 0)) {
				t.Errorf("%+v: %s gave %g ± %g", set, m.Model, m.Value, m.Uncertainty)
			}
		}
	}
}

// TestApplyKeepsTheUncertainty: a value without ± replaces the step's value
// and keeps its uncertainty, as the workshop's prompt does ("without ± the
// old uncertainty is kept", tui/screen Context.ParseValue); ±0 makes it
// exact. Before, MgO's lattice went from ±20 to ±1.3 after
// --set attachment-2=800.
func TestApplyKeepsTheUncertainty(t *testing.T) {
	c := build(t, "MgO", Options{})
	att, _ := c.Step("attachment-2")
	keep := att.Uncertainty
	if !(keep > 0) {
		t.Fatalf("MgO attachment-2 has no uncertainty in the data (%g)", keep)
	}
	for _, tc := range []struct {
		text string
		unc  float64
	}{
		{"attachment-2=800", keep},
		{"attachment-2=800±5", 5},
		{"attachment-2=800±0", 0},
	} {
		d := c.Clone()
		s, err := ParseSetting(tc.text, thermo.KJPerMol)
		if err != nil {
			t.Fatal(err)
		}
		if err := s.Apply(d); err != nil {
			t.Fatal(err)
		}
		got, _ := d.Step("attachment-2")
		if got.Value != 800 || got.Uncertainty != tc.unc || got.Source.Kind != SourceUser {
			t.Errorf("%s: %g ± %g (%v), want 800 ± %g from the user", tc.text, got.Value, got.Uncertainty, got.Source.Kind, tc.unc)
		}
	}
	// An unknown key is still refused.
	s, _ := ParseSetting("no-such-step=1", thermo.KJPerMol)
	if err := s.Apply(c.Clone()); err == nil {
		t.Errorf("Apply accepted an unknown step")
	}
}
