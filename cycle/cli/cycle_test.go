package cli

import (
	"bytes"
	"encoding/csv"
	"encoding/json"
	"enthalpath/cycle"
	"io"
	"math"
	"os"
	"path/filepath"
	"strings"
	"testing"
)

func run(t testing.TB, name string, args ...string) (stdout, stderr string, code ExitCode) {
	t.Helper()
	var o, e bytes.Buffer
	code = Run(Env{Stdout: &o, Stderr: &e, Stdin: strings.NewReader("")}, name, args)
	return o.String(), e.String(), code
}

// The JSON contract of the issue: compound, convention, steps with key,
// reaction, kj_per_mol, uncertainty_kj_per_mol, source; solved; models with
// model, kj_per_mol, gap_kj_per_mol, gap_percent.
func TestCycleJSONContract(t *testing.T) {
	out, errOut, code := run(t, "cycle", "NaCl", "--json")
	if code != ExitOK {
		t.Fatalf("exit %d: %s", code, errOut)
	}
	var doc struct {
		Compound   string `json:"compound"`
		Convention string `json:"convention"`
		Steps      []struct {
			Key         string   `json:"key"`
			Reaction    string   `json:"reaction"`
			KJ          *float64 `json:"kj_per_mol"`
			Uncertainty *float64 `json:"uncertainty_kj_per_mol"`
			Source      string   `json:"source"`
		} `json:"steps"`
		Solved struct {
			Key         string  `json:"key"`
			KJ          float64 `json:"kj_per_mol"`
			Uncertainty float64 `json:"uncertainty_kj_per_mol"`
		} `json:"solved"`
		Models []struct {
			Model      string   `json:"model"`
			KJ         *float64 `json:"kj_per_mol"`
			Gap        *float64 `json:"gap_kj_per_mol"`
			GapPercent *float64 `json:"gap_percent"`
		} `json:"models"`
	}
	if err := json.Unmarshal([]byte(out), &doc); err != nil {
		t.Fatalf("%v\n%s", err, out)
	}
	if doc.Compound != "NaCl" || doc.Convention == "" || len(doc.Steps) < 6 || len(doc.Models) != len(cycle.ModelNames()) {
		t.Errorf("JSON shape: %+v", doc)
	}
	for _, s := range doc.Steps {
		if s.Key == "" || s.Reaction == "" || s.KJ == nil || s.Uncertainty == nil || s.Source == "" {
			t.Errorf("step %+v lacks a contract field", s)
		}
	}
	// Atkins' worked example, from memory: ΔH_L(NaCl) = 787 kJ/mol.
	if doc.Solved.Key != "lattice" || math.Abs(doc.Solved.KJ-(-787)) > 3 {
		t.Errorf("solved %+v, want lattice ≈ −787", doc.Solved)
	}
	for _, m := range doc.Models {
		if m.KJ == nil || m.Gap == nil || m.GapPercent == nil {
			t.Errorf("model %s lacks a value or gap", m.Model)
		}
	}
}

// Flags after the formula, --set with ± and +-, units, --solve, and the
// typed errors as exit code 2 with a message naming the problem.
func TestCycleCommandLine(t *testing.T) {
	out, errOut, code := run(t, "cycle", "MgO", "--lattice-from", "born-mayer", "--solve", "attachment-2", "--units", "kj")
	if code != ExitOK || !strings.Contains(out, "solved  attachment-2 = ") {
		t.Errorf("MgO attachment-2: exit %d\n%s%s", code, out, errOut)
	}
	out, _, code = run(t, "cycle", "NaCl", "--set", "formation=-411.0+-0.5", "--set", "attachment-1=-349±0.1", "--json")
	if code != ExitOK || !strings.Contains(out, `"source": "user"`) {
		t.Errorf("--set: exit %d\n%s", code, out)
	}
	out, _, code = run(t, "cycle", "NaCl", "--units", "ev")
	if code != ExitOK || !strings.Contains(out, "value (eV)") || !strings.Contains(out, "−8.16") {
		t.Errorf("--units ev (NaCl lattice ≈ −8.16 eV): exit %d\n%s", code, out)
	}
	for _, tc := range []struct {
		args []string
		want string
	}{
		{[]string{"NaCl", "--set", "formation=-411", "--solve", "lattice", "--solve", "formation"}, "2 unknowns"},
		{[]string{"NaCl", "--solve", "ionisation-1"}, "ionization-1"},
		{[]string{"NaHg", "--cation", "Na+", "--anion", "Hg-"}, "--set attachment-1=VALUE"}, // Hg has no electron affinity in the data
		{[]string{"NaCl", "--set", "lattice"}, "missing '='"},
		{[]string{"NaCl", "--lattice-from", "quantum"}, "born-lande"},
		{[]string{"NaCl", "--lattice-from", "ewald", "--solve", "lattice"}, "contradict"},
		{[]string{"Na2Cl3"}, "charge"},
		{[]string{"NaQ"}, "NaQ"},
		{[]string{}, "no formula"},
		{[]string{"NaCl", "KCl"}, "one formula"},
		{[]string{"NaCl", "--structure", "diamond"}, "rock-salt"},
		{[]string{"NaCl", "--units", "erg"}, "kj, kcal or ev"},
		{[]string{"--open", "/nonexistent/x.hesscycle"}, "cannot open"},
		{[]string{"NaCl", "--bogus"}, "bogus"},
	} {
		_, errOut, code := run(t, "cycle", tc.args...)
		if code != ExitUsage || !strings.Contains(errOut, tc.want) {
			t.Errorf("cycle %v: exit %d, stderr %q; want exit 2 mentioning %q", tc.args, code, errOut, tc.want)
		}
	}
}

// --save then --open gives the same solved value.
func TestCycleSaveOpen(t *testing.T) {
	dir := t.TempDir()
	path := filepath.Join(dir, "kbr.hesscycle")
	out1, errOut, code := run(t, "cycle", "KBr", "--set", "formation=-393.8±0.3", "--lattice-as", "energy", "--save", path, "--json")
	if code != ExitOK {
		t.Fatalf("save: %s", errOut)
	}
	out2, errOut, code := run(t, "cycle", "--open", path, "--json")
	if code != ExitOK {
		t.Fatalf("open: %s", errOut)
	}
	var a, b struct {
		Convention string `json:"convention"`
		Solved     struct {
			KJ float64 `json:"kj_per_mol"`
		} `json:"solved"`
	}
	json.Unmarshal([]byte(out1), &a)
	json.Unmarshal([]byte(out2), &b)
	if a.Convention != "U" || b.Convention != "U" || math.Abs(a.Solved.KJ-b.Solved.KJ) > 1e-6 {
		t.Errorf("saved %+v, reopened %+v", a, b)
	}
	if _, err := os.Stat(path); err != nil {
		t.Error(err)
	}
}

// compare --all --csv: one row per built-in compound, cycles that cannot
// close reported with their reason.
func TestCompareAllCSV(t *testing.T) {
	out, errOut, code := run(t, "compare", "--all", "--csv")
	if code != ExitOK {
		t.Fatalf("exit %d: %s", code, errOut)
	}
	recs, err := csv.NewReader(strings.NewReader(out)).ReadAll()
	if err != nil {
		t.Fatal(err)
	}
	db, err := LoadData(Env{})
	if err != nil {
		t.Fatal(err)
	}
	if len(recs)-1 != len(db.Compounds()) {
		t.Errorf("%d rows for %d compounds", len(recs)-1, len(db.Compounds()))
	}
	head := recs[0]
	col := map[string]int{}
	for i, h := range head {
		col[h] = i
	}
	for _, want := range []string{"formula", "cycle_kj_per_mol", "ewald_gap_percent", "born-mayer_verdict", "status", "reason"} {
		if _, ok := col[want]; !ok {
			t.Errorf("no column %s", want)
		}
	}
	closed, notClosed := 0, 0
	for _, r := range recs[1:] {
		if r[col["status"]] == "ok" {
			closed++
			if r[col["cycle_kj_per_mol"]] == "" {
				t.Errorf("%s: ok without a value", r[0])
			}
		} else {
			notClosed++
			// The status is a short code a script can compare; the
			// sentence is in its own column (status once held it whole).
			if s := r[col["status"]]; s != "missing-datum" && s != "not-closed" {
				t.Errorf("%s: status %q is not one of ok, missing-datum, not-closed", r[0], s)
			}
			if len(r[col["reason"]]) < 20 {
				t.Errorf("%s: reason %q says nothing", r[0], r[col["reason"]])
			}
		}
	}
	if closed < 40 {
		t.Errorf("only %d cycles closed", closed)
	}
	t.Logf("%d closed, %d not closed", closed, notClosed)
}

func TestCompareFormulas(t *testing.T) {
	out, errOut, code := run(t, "compare", "NaCl", "AgCl", "--json")
	if code != ExitOK {
		t.Fatalf("exit %d: %s", code, errOut)
	}
	var doc struct {
		Compounds []struct {
			Formula string `json:"formula"`
			Models  []struct {
				Model      string  `json:"model"`
				GapPercent float64 `json:"gap_percent"`
			} `json:"models"`
		} `json:"compounds"`
	}
	if err := json.Unmarshal([]byte(out), &doc); err != nil || len(doc.Compounds) != 2 {
		t.Fatalf("%v\n%s", err, out)
	}
	out, _, code = run(t, "compare", "NaCl", "KBr")
	if code != ExitOK || !strings.Contains(out, "NaCl") || !strings.Contains(out, "common practice") {
		t.Errorf("text compare: %d\n%s", code, out)
	}
	if _, errOut, code := run(t, "compare"); code != ExitUsage || !strings.Contains(errOut, "no formula") {
		t.Errorf("compare without arguments: %d %s", code, errOut)
	}
	if _, errOut, code := run(t, "compare", "NaQ"); code != ExitUsage || !strings.Contains(errOut, "NaQ") {
		t.Errorf("compare NaQ: %d %s", code, errOut)
	}
}

// BenchmarkCompareAllCSV is the whole "compare --all --csv" in-process:
// data loading, every cycle, every model and one Ewald sum per structure.
func BenchmarkCompareAllCSV(b *testing.B) {
	env := Env{Stdout: io.Discard, Stderr: io.Discard}
	b.ReportAllocs()
	for i := 0; i < b.N; i++ {
		if code := Run(env, "compare", []string{"--all", "--csv"}); code != ExitOK {
			b.Fatalf("exit %d", code)
		}
	}
}

// A cycle file whose CIF has become unreadable is refused naming the cycle
// file and the structure file once each, not a --structure the user never
// typed (a defect seen in review: "--structure PATH: PATH: …").
func TestOpenWithBrokenCIFNamesTheCycleFile(t *testing.T) {
	dir := t.TempDir()
	cif, err := os.ReadFile(filepath.Join("..", "..", "testdata", "oxidation", "real_NaCl_rock_salt_P1.cif"))
	if err != nil {
		t.Fatal(err)
	}
	cifPath := filepath.Join(dir, "nacl.cif")
	if err := os.WriteFile(cifPath, cif, 0o644); err != nil {
		t.Fatal(err)
	}
	path := filepath.Join(dir, "n.hesscycle")
	if _, errOut, code := run(t, "cycle", "NaCl", "--structure", cifPath, "--save", path); code != ExitOK {
		t.Fatalf("save: %s", errOut)
	}
	if err := os.WriteFile(cifPath, []byte("data_x\n"), 0o644); err != nil {
		t.Fatal(err)
	}
	_, errOut, code := run(t, "cycle", "--open", path)
	if code != ExitUsage {
		t.Fatalf("exit %d, want %d: %s", code, ExitUsage, errOut)
	}
	if strings.Contains(errOut, "--structure") || strings.Count(errOut, "nacl.cif") != 1 || !strings.Contains(errOut, "--open "+path) {
		t.Errorf("stderr %q: want the cycle file named with --open and nacl.cif once, no --structure", errOut)
	}
}
