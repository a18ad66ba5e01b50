package screen

import (
	"errors"
	"math"
	"testing"

	"enthalpath/thermo"
)

func TestParseEnergy(t *testing.T) {
	// Expected conversions use the exact factors of package thermo
	// (thermochemical calorie 4.184 J; 1 eV per particle = 96.485332… kJ/mol,
	// CODATA 2018).
	cases := []struct {
		text    string
		u       thermo.Unit
		kj, unc float64
		hasUnc  bool
	}{
		{"-787.2", thermo.KJPerMol, -787.2, 0, false},
		{"−787.2 ± 2", thermo.KJPerMol, -787.2, 2, true},
		{"744+-20", thermo.KJPerMol, 744, 20, true},
		{"-100", thermo.KcalPerMol, -418.4, 0, false},
		{"1", thermo.EVPerFormulaUnit, thermo.KJPerMolPerEV, 0, false},
		// A unit typed after the number wins over the screen's, as on the
		// command line (one reader, cycle.ParseQuantity).
		{"12kJ", thermo.KcalPerMol, 12, 0, false},
		{"-100 ± 1 kcal", thermo.KJPerMol, -418.4, 4.184, true},
		{"5 +/- 1", thermo.KJPerMol, 5, 1, true},
	}
	for _, c := range cases {
		kj, unc, has, err := ParseEnergy(c.text, c.u)
		if err != nil {
			t.Errorf("ParseEnergy(%q): %v", c.text, err)
			continue
		}
		if math.Abs(kj-c.kj) > 1e-9 || math.Abs(unc-c.unc) > 1e-9 || has != c.hasUnc {
			t.Errorf("ParseEnergy(%q) = %v ± %v (%v), want %v ± %v (%v)", c.text, kj, unc, has, c.kj, c.unc, c.hasUnc)
		}
	}
	for _, bad := range []string{"", "abc", "12kQ", "5 ± x", "5 ± -1", "NaN", "Inf"} {
		_, _, _, err := ParseEnergy(bad, thermo.KJPerMol)
		var ie *InputError
		if !errors.As(err, &ie) {
			t.Errorf("ParseEnergy(%q): error %v, want *InputError", bad, err)
		}
	}
}

func TestFormatEnergyRoundTrip(t *testing.T) {
	for _, u := range thermo.Units() {
		for _, kj := range []float64{-787.25, 0, 496.0, 1e-4} {
			s := FormatEnergy(kj, u)
			back, _, _, err := ParseEnergy(s, u)
			if err != nil {
				t.Fatalf("%s: %v", s, err)
			}
			// Printing rounds to the unit's decimals: 0.05 kJ/mol, 0.05 kcal/mol, 0.0005 eV.
			tol := 0.05 * 4.2
			if u == thermo.EVPerFormulaUnit {
				tol = 0.0005 * 96.5
			}
			if math.Abs(back-kj) > tol {
				t.Errorf("%v in %v → %q → %v", kj, u, s, back)
			}
		}
	}
	if got := FormatEnergy(-0.01, thermo.KJPerMol); got != "0.0" {
		t.Errorf("negative zero printed as %q", got)
	}
}

// TestParseValueKeepsTheUncertainty: without "±" the uncertainty given is
// kept; with one it is read (in the context's unit; 1 kcal = 4.184 kJ, the
// thermochemical calorie, exact by definition).
func TestParseValueKeepsTheUncertainty(t *testing.T) {
	cases := []struct {
		text    string
		u       thermo.Unit
		keep    float64
		kj, unc float64
		bad     bool
	}{
		{"500", thermo.KJPerMol, 3, 500, 3, false},
		{"500±1", thermo.KJPerMol, 3, 500, 1, false},
		{"500 ± 0", thermo.KJPerMol, 3, 500, 0, false},
		{"-100", thermo.KcalPerMol, 2, -418.4, 2, false},
		{"-100±1", thermo.KcalPerMol, 2, -418.4, 4.184, false},
		{"abc", thermo.KJPerMol, 3, 0, 0, true},
	}
	for _, c := range cases {
		ctx := &Context{Units: c.u}
		kj, unc, err := ctx.ParseValue(c.text, c.keep)
		if c.bad {
			if err == nil {
				t.Errorf("ParseValue(%q) accepted %v ± %v", c.text, kj, unc)
			}
			continue
		}
		if err != nil || math.Abs(kj-c.kj) > 1e-9 || math.Abs(unc-c.unc) > 1e-9 {
			t.Errorf("ParseValue(%q, keep %v) = %v ± %v, %v; want %v ± %v", c.text, c.keep, kj, unc, err, c.kj, c.unc)
		}
	}
}

// TestMeasuredFollowsTheUncertainty: a value and its uncertainty are
// printed to the decimal place of the uncertainty rounded to two
// significant figures (JCGM 100:2008, GUM, 7.2.6), at most four decimals
// (the step list's columns: our own bound), an uncertainty below that
// shown as a bound ("±<0.0001", never as zero); with no uncertainty, the
// unit's usual decimals. Inputs are NaCl's steps as the data give them
// (Na ionization 495.845547 ± 0.000024 kJ/mol, NIST ASD; sublimation
// 107.32 ± 0.18, NBS 1982); 1 eV = 96.485332… kJ/mol (CODATA 2018).
func TestMeasuredFollowsTheUncertainty(t *testing.T) {
	cases := []struct {
		kj, unc   float64
		u         thermo.Unit
		value, pm string
	}{
		{107.32, 0.18, thermo.KJPerMol, "+107.32", "±0.18"},
		{-348.57, 0.964853, thermo.KJPerMol, "−348.57", "±0.96"},
		{243.4, 2, thermo.KJPerMol, "+243.4", "±2.0"},
		{-787.44, 14.2, thermo.KJPerMol, "−787", "±14"},
		{-787.44, 0, thermo.KJPerMol, "−787.4", "±0.0"},
		{495.845547, 0.000024, thermo.KJPerMol, "+495.8455", "±<0.0001"},
		{495.845547, 0.000024, thermo.EVPerFormulaUnit, "+5.1391", "±<0.0001"},
		{100, 0.00004, thermo.KJPerMol, "+100.0000", "±<0.0001"},
		{100, 0.00006, thermo.KJPerMol, "+100.0000", "±0.0001"},
		{-787.44, 1.4, thermo.EVPerFormulaUnit, "−8.161", "±0.015"},
		{-418.4, 4.184, thermo.KcalPerMol, "−100.0", "±1.0"},
		{0.01, 0.5, thermo.KJPerMol, "0.01", "±0.50"},
	}
	for _, c := range cases {
		ctx := &Context{Units: c.u}
		v, pm := ctx.Measured(c.kj, c.unc)
		if v != c.value || pm != c.pm {
			t.Errorf("Measured(%v, %v) in %v = %q %q, want %q %q", c.kj, c.unc, c.u, v, pm, c.value, c.pm)
		}
	}
}
