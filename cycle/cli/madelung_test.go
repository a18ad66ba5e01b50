package cli

import (
	"bytes"
	"encoding/json"
	"math"
	"strings"
	"testing"

	"enthalpath/thermo"
)

// runForTest runs command with args and empty standard input.
func runForTest(t *testing.T, command string, args ...string) (code ExitCode, stdout, stderr string) {
	t.Helper()
	var out, errb bytes.Buffer
	code = Run(Env{Stdout: &out, Stderr: &errb, Stdin: strings.NewReader("")}, command, args)
	return code, out.String(), errb.String()
}

func runMadelungForTest(t *testing.T, args ...string) (code ExitCode, stdout, stderr string) {
	t.Helper()
	return runForTest(t, "madelung", args...)
}

func decodeMadelung(t *testing.T, s string) map[string]any {
	t.Helper()
	var m map[string]any
	if err := json.Unmarshal([]byte(s), &m); err != nil {
		t.Fatalf("output is not one JSON object: %v\n%s", err, s)
	}
	return m
}

// TestMadelungCommandJSON checks the JSON contract and the values against
// published Madelung constants (NaCl 1.747565, CsCl 1.762675, CaF2 2.51939;
// handbook tables of Madelung constants, from memory).
func TestMadelungCommandJSON(t *testing.T) {
	tests := []struct {
		args []string
		want float64
		tol  float64
		z    float64 // formula units
	}{
		{[]string{"rock-salt", "--json"}, 1.747565, 1e-6, 4},
		// Flags before and after the name, a changed parameter.
		{[]string{"--json", "caesium-chloride", "--param", "a=4.0"}, 1.762675, 1e-6, 1},
		{[]string{"fluorite", "--supercell", "2", "--json", "--accuracy", "1e-9"}, 2.51939, 1e-5, 32},
		// Charges scaled ×2 (MgO-like rock salt): same A.
		{[]string{"rock-salt", "--charges", "M=2,X=-2", "--json"}, 1.747565, 1e-6, 4},
		// The NaCl CIF file carries no charges; give them by element.
		{[]string{"../../testdata/cif/real_NaCl_rocksalt_Fm-3m.cif", "--charges", "Na=1,Cl=-1", "--json"}, 1.747565, 1e-6, 4},
	}
	for _, tt := range tests {
		code, out, errs := runMadelungForTest(t, tt.args...)
		if code != ExitOK {
			t.Errorf("%v: exit %d, stderr %s", tt.args, code, errs)
			continue
		}
		m := decodeMadelung(t, out)
		for _, key := range []string{"structure", "madelung_constant", "nearest_distance_angstrom",
			"energy_ev_per_formula_unit", "energy_kj_per_mol", "formula_units", "site_potentials_volt",
			"convention", "accuracy", "boundary_condition"} {
			if _, ok := m[key]; !ok {
				t.Errorf("%v: key %q missing", tt.args, key)
			}
		}
		a, _ := m["madelung_constant"].(float64)
		if math.Abs(a-tt.want) > tt.tol {
			t.Errorf("%v: madelung_constant %.9f, want %.6f ± %g", tt.args, a, tt.want, tt.tol)
		}
		if z, _ := m["formula_units"].(float64); z != tt.z {
			t.Errorf("%v: formula_units %g, want %g", tt.args, z, tt.z)
		}
		pots, _ := m["site_potentials_volt"].([]any)
		st, _ := m["structure"].(map[string]any)
		sites, _ := st["sites"].([]any)
		if len(pots) == 0 || len(pots) != len(sites) {
			t.Errorf("%v: %d potentials for %d sites", tt.args, len(pots), len(sites))
		}
		// E_fu = −A·z₊|z₋|·e²/(4πε₀d): the printed numbers must imply a
		// charge product between 1 and 4 (these structures).
		d, _ := m["nearest_distance_angstrom"].(float64)
		e, _ := m["energy_ev_per_formula_unit"].(float64)
		if zz := -e * d / (a * thermo.CoulombEVAngstrom); zz < 0.999 || zz > 4.001 {
			t.Errorf("%v: energy %.6f eV, d %.6f, A %.6f imply z₊|z₋| = %.4f", tt.args, e, d, a, zz)
		}
		kj, _ := m["energy_kj_per_mol"].(float64)
		if math.Abs(kj/e-thermo.KJPerMolPerEV) > 1e-9 { // converted through package thermo
			t.Errorf("%v: kJ/mol %.6f vs eV %.6f", tt.args, kj, e)
		}
	}
}

func TestMadelungCommandText(t *testing.T) {
	code, out, errs := runMadelungForTest(t, "zinc-blende")
	if code != ExitOK {
		t.Fatalf("exit %d: %s", code, errs)
	}
	for _, want := range []string{"zinc-blende", "1.638055", "tin-foil", "E_fu = −A·z₊·|z₋|", "kJ/mol", "site potentials"} {
		if !strings.Contains(out, want) {
			t.Errorf("text output lacks %q:\n%s", want, out)
		}
	}
	code, out, _ = runMadelungForTest(t, "--list")
	if code != ExitOK {
		t.Fatalf("--list: exit %d", code)
	}
	for _, name := range []string{"rock-salt", "caesium-chloride", "zinc-blende", "wurtzite", "fluorite", "antifluorite",
		"rutile", "cadmium-chloride", "cadmium-iodide", "corundum", "perovskite", "spinel", "nickel-arsenide", "z_cation"} {
		if !strings.Contains(out, name) {
			t.Errorf("--list lacks %q", name)
		}
	}
	code, out, _ = runMadelungForTest(t, "--list", "--json")
	if code != ExitOK || !strings.Contains(out, `"prototypes"`) {
		t.Errorf("--list --json: exit %d, %s", code, out)
	}
}

func TestMadelungCommandUsageErrors(t *testing.T) {
	tests := []struct {
		args    []string
		mention string
	}{
		{nil, "exactly one"},
		{[]string{"halite"}, "valid names"},
		{[]string{"rock-salt", "--param", "b=2"}, `"b"`},
		{[]string{"rock-salt", "--param", "a"}, "key=value"},
		{[]string{"rock-salt", "--param", "a=-3"}, "positive"},
		{[]string{"rock-salt", "--charges", "M=2"}, "neutral"},
		{[]string{"rock-salt", "--charges", "Q=2"}, `"Q"`},
		{[]string{"rock-salt", "--supercell", "0"}, "positive"},
		{[]string{"rock-salt", "--supercell", "2x2"}, "n1xn2xn3"},
		{[]string{"rock-salt", "--accuracy", "0.5"}, "accuracy"},
		{[]string{"rock-salt", "--frobnicate"}, "frobnicate"},
		{[]string{"no/such/file.cif"}, "file.cif"},
		{[]string{"../../testdata/cif/real_TiO2_rutile.cif", "--param", "a=3"}, "prototypes only"},
		{[]string{"--list", "rock-salt"}, "--list"},
	}
	for _, tt := range tests {
		code, _, errs := runMadelungForTest(t, tt.args...)
		if code != ExitUsage {
			t.Errorf("%v: exit %d, want %d (stderr %q)", tt.args, code, ExitUsage, errs)
		}
		if !strings.Contains(errs, tt.mention) {
			t.Errorf("%v: stderr %q does not mention %s", tt.args, errs, tt.mention)
		}
	}
}

// TestMadelungUnphysicalGeometry: wurtzite with u = 0.9 puts each anion
// (1 − 0.9)·c = 0.52 Å from a cation (geometry of the parameters), below
// crystal.ShortestBond (1 Å, common practice, no source): the sum is done
// and warned about on stderr and under "warnings" in the JSON; the default
// ZnO cell has no warning. A prototype length of 1e5 Å is refused like a
// CIF cell length of 10000 Å or more.
func TestMadelungUnphysicalGeometry(t *testing.T) {
	code, out, errs := runMadelungForTest(t, "wurtzite", "--param", "u=0.9", "--json")
	if code != ExitOK {
		t.Fatalf("exit %d: %s", code, errs)
	}
	if !strings.Contains(errs, "warning: the nearest cation and anion") || !strings.Contains(errs, "0.52 Å apart") {
		t.Errorf("stderr %q lacks the warning with 0.52 Å", errs)
	}
	w, ok := decodeMadelung(t, out)["warnings"].([]any)
	if !ok || len(w) != 1 || !strings.Contains(w[0].(string), "shorter than any real bond") {
		t.Errorf("JSON warnings = %v, want one about the short bond", w)
	}
	code, out, errs = runMadelungForTest(t, "wurtzite", "--json")
	if _, has := decodeMadelung(t, out)["warnings"]; code != ExitOK || has || errs != "" {
		t.Errorf("default wurtzite: exit %d, warnings %v, stderr %q; want none", code, has, errs)
	}
	code, _, errs = runMadelungForTest(t, "rock-salt", "--param", "a=1e5")
	if code != ExitUsage || !strings.Contains(errs, "below 10000 Å") {
		t.Errorf("a=1e5: exit %d, stderr %q; want exit 2 and the 10000 Å cap", code, errs)
	}
}
