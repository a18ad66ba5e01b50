package cli

import (
	"bytes"
	"encoding/json"
	"math"
	"os"
	"path/filepath"
	"strings"
	"testing"
)

// runDataCmd runs "enthalpath data ARGS" in-process with no user overlay
// unless dataFile is given; XDG_CONFIG_HOME points at an empty directory so
// a real ~/.config/enthalpath/data.toml cannot leak in.
func runDataCmd(t *testing.T, dataFile string, args ...string) (code ExitCode, stdout, stderr string) {
	t.Helper()
	if os.Getenv("ENTHALPATH_TEST_KEEP_CONFIG") == "" {
		t.Setenv("XDG_CONFIG_HOME", t.TempDir())
	}
	var out, errb bytes.Buffer
	code = Run(Env{Stdout: &out, Stderr: &errb, DataFile: dataFile}, "data", args)
	return code, out.String(), errb.String()
}

func TestDataElementJSON(t *testing.T) {
	code, out, errs := runDataCmd(t, "", "Na", "--json")
	if code != ExitOK {
		t.Fatalf("exit %d: %s", code, errs)
	}
	var got struct {
		Kind  string    `json:"kind"`
		IE    []float64 `json:"ionization_energies_ev"`
		EA    *float64  `json:"electron_affinity_ev"`
		Atom  *float64  `json:"atomization_kj_per_mol"`
		Steps []struct {
			Reaction string `json:"reaction"`
		} `json:"atomization_steps"`
		IEVals []struct {
			Source   string `json:"source"`
			Citation string `json:"citation"`
			Unit     string `json:"unit"`
		} `json:"ionization_energies"`
	}
	if err := json.Unmarshal([]byte(out), &got); err != nil {
		t.Fatalf("%v\n%s", err, out)
	}
	// NIST ASD: IE1(Na) = 5.1390767 eV (from memory); CRC 2014: EA(Na) =
	// 0.547926 eV (data/sources/electron-affinities); NBS 1982: ΔfH°(Na, g) =
	// 107.32 kJ/mol (data/sources/nbs-tables-1982, line 10817; before the
	// tables were generated the row held CODATA's 107.5).
	if got.Kind != "element" || len(got.IE) < 4 || math.Abs(got.IE[0]-5.1390767) > 1e-4 {
		t.Errorf("ionization_energies_ev = %v", got.IE)
	}
	if got.EA == nil || math.Abs(*got.EA-0.547926) > 1e-4 {
		t.Errorf("electron_affinity_ev = %v", got.EA)
	}
	if got.Atom == nil || math.Abs(*got.Atom-107.32) > 0.001 {
		t.Errorf("atomization_kj_per_mol = %v", got.Atom)
	}
	if len(got.Steps) != 1 || got.IEVals[0].Source != "nist-asd" || !strings.Contains(got.IEVals[0].Citation, "Kramida") || got.IEVals[0].Unit != "eV" {
		t.Errorf("steps %v, first IE %+v", got.Steps, got.IEVals[0])
	}
}

func TestDataCompoundJSON(t *testing.T) {
	code, out, errs := runDataCmd(t, "", "NaCl", "--json")
	if code != ExitOK {
		t.Fatalf("exit %d: %s", code, errs)
	}
	var got map[string]any
	if err := json.Unmarshal([]byte(out), &got); err != nil {
		t.Fatal(err)
	}
	// NBS tables (Wagman et al. 1982): ΔfH°(NaCl, s) = −411.153 kJ/mol (from memory).
	f, ok := got["formation_enthalpy_kj_per_mol"].(float64)
	if !ok || math.Abs(f-(-411.153)) > 0.5 {
		t.Errorf("formation_enthalpy_kj_per_mol = %v", got["formation_enthalpy_kj_per_mol"])
	}
	if got["kind"] != "compound" || got["cation"] != "Na+" || got["anion"] != "Cl-" {
		t.Errorf("compound JSON: %v", got)
	}
}

func TestDataText(t *testing.T) {
	cases := []struct {
		args []string
		want []string
	}{
		{[]string{"Br"}, []string{"Br2(l) → Br2(g)", "Br2(g) → 2 Br(g)", "Electron affinity", "nbs1982", "Sources"}},
		{[]string{"O"}, []string{"Second electron affinity", "derived", "shriver2010"}},
		{[]string{"Fe3+"}, []string{"Shannon radii", "VI    HS", "shannon1976", "Born exponent"}},
		{[]string{"Ca 2+"}, []string{"Ca2+", "Shannon radii"}},
		{[]string{"sodium"}, []string{"Na  sodium"}},
		{[]string{"ClNa"}, []string{"NaCl", "Formation ΔfH°", "nbs1982"}},
		// The density and the line of the vendored source it stands on (the
		// X-ray density of COD 9003308's cell, a = 5.6401 Å: 4·58.443 g/mol
		// / (N_A·179.42 Å³) = 2.164 g/cm³, the cell volume the file's own
		// comment prints), and a cell read from a deposited structure with
		// the file and line it stands on.
		{[]string{"NaCl"}, []string{"Density  2.164", "  at cod-cells/NaCl_sg225_SodiumChloride.ncmat:"}},
		{[]string{"NiO"}, []string{"a = 4.1684", "[cod-debian]", "COD 9008693", "cod-debian/NiO-Bunsenite.cif:"}},
		{[]string{"--kind", "element", "Co"}, []string{"Co  cobalt"}},
		{[]string{"--list", "sources"}, []string{"shannon1976", "Acta Crystallogr."}},
		{[]string{"--list", "ions", "--json"}, []string{`"Na+"`}},
	}
	for _, c := range cases {
		code, out, errs := runDataCmd(t, "", c.args...)
		if code != ExitOK {
			t.Errorf("data %v: exit %d: %s", c.args, code, errs)
			continue
		}
		for _, w := range c.want {
			if !strings.Contains(out, w) {
				t.Errorf("data %v: output lacks %q:\n%s", c.args, w, out)
			}
		}
	}
}

func TestDataUnknownQuery(t *testing.T) {
	cases := []struct {
		args []string
		want string
	}{
		{[]string{"Nq"}, "did you mean"},
		{[]string{"Na2Q"}, `unknown element "Q" at column 4`}, // "Q" is the fourth character
		{[]string{"Fe9+"}, "Fe3+"},
		{[]string{}, "give one QUERY"},
		{[]string{"--kind", "mineral", "NaCl"}, "--kind"},
		{[]string{"--list", "minerals"}, "--list"},
		// CO is not a compound of the data: it must not quietly give
		// cobalt, though element lookups ignore case.
		{[]string{"CO"}, "compound of C and O"},
	}
	for _, c := range cases {
		code, _, errs := runDataCmd(t, "", c.args...)
		if code != ExitUsage || !strings.Contains(errs, c.want) {
			t.Errorf("data %v: exit %d, stderr %q; want exit 2 mentioning %q", c.args, code, errs, c.want)
		}
	}
}

// An invented overlay value (not real data) shows as an override with the
// built-in value it replaces.
func TestDataOverlay(t *testing.T) {
	dir := t.TempDir()
	file := filepath.Join(dir, "mine.toml")
	os.WriteFile(file, []byte("[[element]]\nsymbol = \"Na\"\natomization_kj_per_mol = 108.25\n"), 0o600)
	code, out, errs := runDataCmd(t, file, "Na")
	if code != ExitOK {
		t.Fatalf("exit %d: %s", code, errs)
	}
	if !strings.Contains(out, "108.25 kJ/mol  [user; override of 107.32 ± 0.18 kJ/mol [nbs1982]]") {
		t.Errorf("override not shown:\n%s", out)
	}
	code, out, _ = runDataCmd(t, file, "Na", "--json")
	if code != ExitOK || !strings.Contains(out, `"override": true`) || !strings.Contains(out, `"replaced"`) {
		t.Errorf("JSON lacks the override: %s", out)
	}
	bad := filepath.Join(dir, "bad.toml")
	os.WriteFile(bad, []byte("[[element]]\nsymbol = \"Na\"\natomization_kj_per_mol = \"abc\"\n"), 0o600)
	code, _, errs = runDataCmd(t, bad, "Na")
	if code != ExitUsage || !strings.Contains(errs, "line 3") || !strings.Contains(errs, "atomization_kj_per_mol") {
		t.Errorf("malformed --data file: exit %d, %q", code, errs)
	}
}

// The default overlay (os.UserConfigDir()/enthalpath/data.toml) is read when
// it exists; a broken one is reported and the built-in data are used.
func TestDataDefaultOverlay(t *testing.T) {
	cfg := t.TempDir()
	t.Setenv("XDG_CONFIG_HOME", cfg)
	t.Setenv("ENTHALPATH_TEST_KEEP_CONFIG", "1")
	os.MkdirAll(filepath.Join(cfg, "enthalpath"), 0o700)
	path := filepath.Join(cfg, "enthalpath", "data.toml")
	os.WriteFile(path, []byte("[[element]]\nsymbol = \"K\"\natomization_kj_per_mol = 90.5\n"), 0o600)
	code, out, errs := runDataCmd(t, "", "K")
	if code != ExitOK || !strings.Contains(out, "90.5 kJ/mol  [user; override of 89") {
		t.Errorf("default overlay not applied: exit %d %s\n%s", code, errs, out)
	}
	os.WriteFile(path, []byte("[[element]\n"), 0o600)
	code, out, errs = runDataCmd(t, "", "K")
	if code != ExitOK || !strings.Contains(errs, "ignoring the overlay file") || !strings.Contains(out, "89") {
		t.Errorf("broken default overlay: exit %d, stderr %q", code, errs)
	}
}

// Every command, not only data, reads the default overlay: a user value of
// KCl's formation enthalpy (an invented −430.0 kJ/mol) reaches the cycle.
func TestDefaultOverlayReachesCycle(t *testing.T) {
	cfg := t.TempDir()
	t.Setenv("XDG_CONFIG_HOME", cfg)
	os.MkdirAll(filepath.Join(cfg, "enthalpath"), 0o700)
	os.WriteFile(filepath.Join(cfg, "enthalpath", "data.toml"),
		[]byte("[[compound]]\nformula = \"KCl\"\nformation_kj_per_mol = -430.0\n"), 0o600)
	var out, errb bytes.Buffer
	if code := Run(Env{Stdout: &out, Stderr: &errb}, "cycle", []string{"KCl", "--json"}); code != ExitOK {
		t.Fatalf("exit %d: %s", code, errb.String())
	}
	if !strings.Contains(out.String(), "-430") {
		t.Errorf("the default overlay's KCl formation enthalpy is not in the cycle:\n%s", out.String())
	}
}

// data --sources counts the built-in rows per source and memory rows per
// table; data X shows where the preferred value is in its pinned source and
// every other compilation's value with its difference. NaCl: NBS 1982
// −411.153 kJ/mol (data/sources/nbs-tables-1982, line 10930); NASA Glenn
// NaCL(cr) −411.26 kJ/mol (data/sources/nasa-cea-thermo/thermo.inp, line 13616).
func TestDataSourcesAndAlternatives(t *testing.T) {
	code, out, errs := runDataCmd(t, "", "--sources")
	if code != ExitOK || !strings.Contains(out, "nbs1982") || !strings.Contains(out, "compounds.csv") || !strings.Contains(out, "memory") {
		t.Errorf("data --sources: exit %d\n%s%s", code, out, errs)
	}
	code, out, _ = runDataCmd(t, "", "--sources", "--json")
	if code != ExitOK || !strings.Contains(out, `"rows_by_source"`) || !strings.Contains(out, `"memory_rows"`) {
		t.Errorf("data --sources --json: exit %d\n%s", code, out)
	}
	code, out, _ = runDataCmd(t, "", "NaCl")
	for _, want := range []string{"-411.153", "nbs-tables-1982/NBS_Tables_with_ErratumValues.csv:10930", "other compilations", "-411.26", "nasa-glenn", "State  crystal"} {
		if code != ExitOK || !strings.Contains(out, want) {
			t.Errorf("data NaCl lacks %q:\n%s", want, out)
		}
	}
	code, out, _ = runDataCmd(t, "", "NaCl", "--json")
	if code != ExitOK || !strings.Contains(out, `"formation_alternatives"`) || !strings.Contains(out, `"difference_from_preferred"`) || !strings.Contains(out, `"locator"`) {
		t.Errorf("data NaCl --json:\n%s", out)
	}
}
