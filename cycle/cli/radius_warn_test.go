package cli

import (
	"strings"
	"testing"
)

// TestRadiusWarnsOfUnphysicalRho: an effective Born–Mayer ρ outside
// 0.20–0.50 Å (the range taken as physical: common practice, no source;
// Born and Mayer's 0.345 Å and the alkali halides' fitted 0.29–0.36 Å lie
// inside, from memory) is printed with a warning naming the range and
// where it comes from, in text and JSON. NH4Cl's cycle asks ρ ≈ 0.05 Å (it
// was printed without a word); MgO's ρ ≈ 0.33 Å draws no warning.
func TestRadiusWarnsOfUnphysicalRho(t *testing.T) {
	run := func(args ...string) string {
		var out, errs strings.Builder
		if code := Run(Env{Stdout: &out, Stderr: &errs}, "radius", args); code != ExitOK {
			t.Fatalf("radius %v: exit %d: %s", args, code, errs.String())
		}
		return out.String()
	}
	text := run("NH4Cl", "--ion", "NH4+")
	if !strings.Contains(text, "warning: the effective ρ") || !strings.Contains(text, "0.20–0.50 Å") || !strings.Contains(text, "common practice, no source") {
		t.Errorf("NH4Cl: no warning of an unphysical ρ:\n%s", text)
	}
	if js := run("NH4Cl", "--ion", "NH4+", "--json"); !strings.Contains(js, `"warnings"`) {
		t.Errorf("NH4Cl --json: no warnings key:\n%s", js)
	}
	if text := run("MgO", "--ion", "O2-"); strings.Contains(text, "warning:") {
		t.Errorf("MgO: a warning for a physical ρ:\n%s", text)
	}
}

// TestRadiusFitSaysWhichCounterRadii: the fit names where its counter-ion
// radii came from (the data's by default, as in the workshop; given ones by
// ion), in text and JSON.
func TestRadiusFitSaysWhichCounterRadii(t *testing.T) {
	for args, want := range map[string]string{
		"--ion NO3- --all-salts":                         "counter-ion radii: the data's",
		"--ion NO3- --all-salts --counter-radii K+=1.33": "K+ 1.33 Å as given",
		"--ion NO3- --all-salts --json":                  `"counter_radii_from": "counter-ion radii: the data's`,
	} {
		var out, errs strings.Builder
		if code := Run(Env{Stdout: &out, Stderr: &errs}, "radius", strings.Fields(args)); code != ExitOK || !strings.Contains(out.String(), want) {
			t.Errorf("radius %s: exit %d, lacks %q:\n%s%s", args, code, want, out.String(), errs.String())
		}
	}
}
