package cli

import (
	"bytes"
	"encoding/csv"
	"encoding/json"
	"os"
	"path/filepath"
	"strings"
	"testing"
	"time"
)

func runAnalysisCmd(t testing.TB, stdin string, name string, args ...string) (stdout, stderr string, code ExitCode) {
	t.Helper()
	var out, errb bytes.Buffer
	code = Run(Env{Stdout: &out, Stderr: &errb, Stdin: strings.NewReader(stdin)}, name, args)
	return out.String(), errb.String(), code
}

// TestEstimateJSONContract: the keys the issue fixes, flags after the
// positional, and a hypothetical compound solved.
func TestEstimateJSONContract(t *testing.T) {
	out, errs, code := runAnalysisCmd(t, "", "estimate", "MgCl", "--charges", "M=+1,X=-1", "--model", "kapustinskii", "--json")
	if code != ExitOK {
		t.Fatalf("exit %d: %s", code, errs)
	}
	var j map[string]any
	if err := json.Unmarshal([]byte(out), &j); err != nil {
		t.Fatal(err)
	}
	for _, k := range []string{"formation_kj_per_mol", "uncertainty_kj_per_mol", "model_uncertainty_basis", "steps"} {
		if _, ok := j[k]; !ok {
			t.Errorf("JSON has no %q", k)
		}
	}
	if f, _ := j["formation_kj_per_mol"].(float64); !(f < 0) {
		t.Errorf("ΔfH(MgCl) = %v, the textbook estimate is negative (from memory)", j["formation_kj_per_mol"])
	}
}

func TestScanJSONContract(t *testing.T) {
	out, errs, code := runAnalysisCmd(t, "", "scan", "Mg", "Cl", "--max-charge", "3", "--json")
	if code != ExitOK {
		t.Fatalf("exit %d: %s", code, errs)
	}
	var j struct {
		Compounds []struct {
			Formula   string   `json:"formula"`
			Formation *float64 `json:"formation_kj_per_mol"`
		} `json:"compounds"`
		Disproportionations []struct {
			Reaction string   `json:"reaction"`
			KJ       *float64 `json:"kj_per_mol"`
		} `json:"disproportionations"`
	}
	if err := json.Unmarshal([]byte(out), &j); err != nil {
		t.Fatal(err)
	}
	if len(j.Compounds) != 3 || j.Compounds[0].Formula != "MgCl" || j.Compounds[0].Formation == nil {
		t.Errorf("compounds: %+v", j.Compounds)
	}
	found := false
	for _, d := range j.Disproportionations {
		if d.Reaction == "2 MgCl -> Mg + MgCl2" && d.KJ != nil && *d.KJ < 0 {
			found = true
		}
	}
	if !found {
		t.Errorf("no exothermic 2 MgCl -> Mg + MgCl2 in %+v", j.Disproportionations)
	}
}

func TestSolutionAndRadiusCommands(t *testing.T) {
	out, errs, code := runAnalysisCmd(t, "", "solution", "KCl", "--json")
	if code != ExitOK || !strings.Contains(out, `"hydration_scale": "conventional"`) {
		t.Fatalf("solution KCl: exit %d %s\n%s", code, errs, out)
	}
	out, errs, code = runAnalysisCmd(t, "", "solution", "NaCl", "--solve", "hydration-anion", "--set", "dissolution=3.87", "--scale", "absolute")
	if code != ExitOK || !strings.Contains(out, "hydration-anion (solved)") {
		t.Fatalf("solution --solve: exit %d %s\n%s", code, errs, out)
	}
	out, errs, code = runAnalysisCmd(t, "", "radius", "KNO3", "--lattice", "685", "--ion", "NO3-", "--json")
	if code != ExitOK || !strings.Contains(out, "kapustinskii_handbook_radius_angstrom") {
		t.Fatalf("radius: exit %d %s\n%s", code, errs, out)
	}
	out, errs, code = runAnalysisCmd(t, "", "radius", "--ion", "NO3-", "--all-salts", "--only", "K+,Na+", "--counter-radii", "K+=1.33", "--json")
	var fit struct {
		Radius float64 `json:"fitted_radius_angstrom"`
		Used   int     `json:"salts_used"`
		Salts  []struct {
			Compound, CounterFrom string
			Counter               string  `json:"counter_ion"`
			CounterRadius         float64 `json:"counter_radius_angstrom"`
		} `json:"salts"`
	}
	if code != ExitOK || json.Unmarshal([]byte(out), &fit) != nil {
		t.Fatalf("radius --all-salts: exit %d %s\n%s", code, errs, out)
	}
	// --only keeps the two salts; --counter-radii replaces K+'s radius only.
	if fit.Used != 2 || len(fit.Salts) != 2 || !(fit.Radius > 1.5 && fit.Radius < 2.2) {
		t.Errorf("radius --all-salts --only K+,Na+: %d used of %d, r = %.3f Å\n%s", fit.Used, len(fit.Salts), fit.Radius, out)
	}
	for _, s := range fit.Salts {
		if s.Counter == "K+" && s.CounterRadius != 1.33 {
			t.Errorf("K+ radius %.3f, want the given 1.33", s.CounterRadius)
		}
		if s.Counter == "Na+" && s.CounterRadius == 1.33 {
			t.Errorf("Na+ took K+'s given radius")
		}
	}
}

func TestAnalysisUsageErrors(t *testing.T) {
	cases := []struct {
		name string
		args []string
		want string // in stderr
	}{
		{"estimate", nil, "give one formula"},
		{"estimate", []string{"MgCl", "--charges", "Mg=+x"}, "column 4"},
		{"estimate", []string{"Qq2"}, "Qq"},
		{"estimate", []string{"MgCl", "--model", "guess"}, "guess"},
		{"scan", []string{"Mg"}, "metal and a non-metal"},
		{"scan", []string{"Mg", "Cl", "--max-charge", "9"}, "--max-charge"},
		{"solution", []string{"NaCl", "--solve", "heat"}, "heat"},
		{"radius", []string{"KNO3"}, "--ion"},
		{"radius", []string{"KNO3", "--ion", "SO4^2-", "--lattice", "685"}, "not an ion of KNO3"},
		{"radius", []string{"KNO3", "--ion", "NO3-", "--all-salts"}, "takes no formula"},
		{"radius", []string{"--ion", "NO3-", "--all-salts", "--lattice", "685"}, "--lattice goes with one FORMULA"},
		{"radius", []string{"--ion", "NO3-", "--all-salts", "--counter-radii", "K+=1.33,Na+"}, "column 9"},
		{"radius", []string{"--ion", "NO3-", "--all-salts", "--counter-radii", "K+=-1"}, "positive"},
		{"radius", []string{"--ion", "NO3-", "--all-salts", "--only", "Kx+"}, "Kx+"},
		{"radius", []string{"--ion", "ClO4-", "--all-salts"}, "circular"},
		{"radius", []string{"KNO3", "--ion", "NO3-", "--only", "K+"}, "go with --all-salts"},
		{"batch", []string{"/nonexistent/file.csv"}, "file.csv"},
		{"estimate", []string{"MgCl", "--bogus"}, "bogus"},
	}
	for _, tc := range cases {
		_, errs, code := runAnalysisCmd(t, "", tc.name, tc.args...)
		if code != ExitUsage || !strings.Contains(errs, tc.want) {
			t.Errorf("%s %v: exit %d, stderr %q (want exit 2 naming %q)", tc.name, tc.args, code, errs, tc.want)
		}
	}
}

func TestBatchCommand(t *testing.T) {
	dir := t.TempDir()
	in := filepath.Join(dir, "screen.csv")
	// Invented screening list (demo data).
	os.WriteFile(in, []byte("formula,charges\nMgCl,\nCaCl,\"Ca=+1,Cl=-1\"\nNaCl,\n"), 0o644)
	outFile := filepath.Join(dir, "out.csv")
	_, errs, code := runAnalysisCmd(t, "", "batch", in, "--out", outFile)
	if code != ExitOK {
		t.Fatalf("exit %d: %s", code, errs)
	}
	b, err := os.ReadFile(outFile)
	if err != nil {
		t.Fatal(err)
	}
	recs, err := csv.NewReader(bytes.NewReader(b)).ReadAll()
	if err != nil || len(recs) != 4 {
		t.Fatalf("%v\n%s", err, b)
	}
	if strings.Contains(errs, "[") {
		t.Errorf("progress bar drawn on a non-terminal stderr: %q", errs)
	}
	// Standard input, JSON.
	out, errs, code := runAnalysisCmd(t, "formula\nMgCl\n", "batch", "-", "--json")
	var rows []map[string]any
	if code != ExitOK || json.Unmarshal([]byte(out), &rows) != nil || len(rows) != 1 {
		t.Fatalf("stdin JSON: exit %d %s\n%s", code, errs, out)
	}
	// A bad cell is that row's error (naming line and column); the batch
	// goes on and says on stderr how many rows failed.
	bad := filepath.Join(dir, "bad.csv")
	os.WriteFile(bad, []byte("formula,anion_radius\nNaCl,1.8\nKCl,big\n"), 0o644)
	badOut := filepath.Join(dir, "bad-out.csv")
	_, errs, code = runAnalysisCmd(t, "", "batch", bad, "--out", badOut)
	got, _ := os.ReadFile(badOut)
	if code != ExitOK || !strings.Contains(errs, "1 of 2 rows") || !strings.Contains(string(got), "line 3") || !strings.Contains(string(got), "anion_radius") {
		t.Errorf("bad cell: exit %d, stderr %q, output\n%s", code, errs, got)
	}
	// A file that is not the table its header declares stops the batch
	// (exit 2, naming the line), and --out is not written.
	broken := filepath.Join(dir, "broken.csv")
	os.WriteFile(broken, []byte("formula,model\nNaCl,kapustinskii\nKCl\n"), 0o644)
	brokenOut := filepath.Join(dir, "broken-out.csv")
	_, errs, code = runAnalysisCmd(t, "", "batch", broken, "--out", brokenOut)
	if code != ExitUsage || !strings.Contains(errs, "line 3") {
		t.Errorf("broken file: exit %d, %q", code, errs)
	}
	if _, err := os.Stat(brokenOut); !os.IsNotExist(err) {
		t.Errorf("--out written despite the error: %v", err)
	}
}

// TestProgressBar: nothing before one second or off a terminal; a bar with
// the share of the file read after it.
func TestProgressBar(t *testing.T) {
	var buf bytes.Buffer
	read := &countingReader{n: 50}
	b := &progressBar{w: &buf, on: true, start: time.Now(), size: 100, read: read}
	b.update(64)
	if buf.Len() != 0 {
		t.Errorf("drawn before one second: %q", buf.String())
	}
	b.start = time.Now().Add(-2 * time.Second)
	b.update(128)
	b.finish()
	if !strings.Contains(buf.String(), " 50 %") || !strings.Contains(buf.String(), "128 rows") {
		t.Errorf("bar: %q", buf.String())
	}
	buf.Reset()
	off := &progressBar{w: &buf, on: false, start: time.Now().Add(-2 * time.Second), size: 100, read: read}
	off.update(64)
	off.finish()
	if buf.Len() != 0 {
		t.Errorf("drawn while off: %q", buf.String())
	}
	if newProgressBar(&buf, 0, read).on {
		t.Error("a bytes.Buffer taken for a terminal")
	}
}
