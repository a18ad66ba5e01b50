package cli

import (
	"encoding/json"
	"os"
	"path/filepath"
	"strings"
	"testing"
)

// TestJSONNamesTheCompoundFormula: cycle, estimate, solution, radius,
// compare and batch name the compound with one key, "formula" (cycle and
// estimate once said "compound", compare and batch "formula"); the old
// "compound" key stays beside it where it was, for scripts that read it.
func TestJSONNamesTheCompoundFormula(t *testing.T) {
	dir := t.TempDir()
	batchFile := filepath.Join(dir, "in.csv")
	if err := os.WriteFile(batchFile, []byte("formula\nNaCl\n"), 0o600); err != nil {
		t.Fatal(err)
	}
	for _, tc := range []struct {
		args       []string
		first      func(any) map[string]any // the object naming the compound
		oldKeyKept bool
	}{
		{[]string{"cycle", "NaCl", "--json"}, object, true},
		{[]string{"estimate", "NaCl", "--json"}, object, true},
		{[]string{"solution", "NaCl", "--json"}, object, true},
		{[]string{"radius", "NH4Cl", "--ion", "NH4+", "--json"}, object, true},
		{[]string{"compare", "NaCl", "--json"}, func(v any) map[string]any { return object(object(v)["compounds"].([]any)[0]) }, false},
		{[]string{"batch", batchFile, "--json"}, func(v any) map[string]any { return object(v.([]any)[0]) }, false},
	} {
		var out, errs strings.Builder
		if code := Run(Env{Stdout: &out, Stderr: &errs, Stdin: strings.NewReader("")}, tc.args[0], tc.args[1:]); code != ExitOK {
			t.Fatalf("%v: exit %d: %s", tc.args, code, errs.String())
		}
		var v any
		if err := json.Unmarshal([]byte(out.String()), &v); err != nil {
			t.Fatalf("%v: %v", tc.args, err)
		}
		o := tc.first(v)
		want := "NaCl"
		if tc.args[1] == "NH4Cl" {
			want = "NH4Cl"
		}
		if o["formula"] != want {
			t.Errorf("%v: formula = %v, want %s", tc.args, o["formula"], want)
		}
		if tc.oldKeyKept && o["compound"] != want {
			t.Errorf("%v: the deprecated compound key = %v, want it kept as %s", tc.args, o["compound"], want)
		}
	}
}

func object(v any) map[string]any { m, _ := v.(map[string]any); return m }

// TestReadmeListsSolutionFlags: every flag of solution is in README.md
// (--scale absolute exists and README once did not list it).
func TestReadmeListsSolutionFlags(t *testing.T) {
	readme, err := os.ReadFile("../../README.md")
	if err != nil {
		t.Fatal(err)
	}
	var help strings.Builder
	Run(Env{Stdout: &help, Stderr: &help}, "solution", []string{"--help"})
	for _, line := range strings.Split(help.String(), "\n") {
		if name, ok := strings.CutPrefix(line, "  --"); ok {
			flag := "--" + strings.Fields(name)[0]
			if !strings.Contains(string(readme), flag) {
				t.Errorf("README.md does not list solution %s", flag)
			}
		}
	}
	if !strings.Contains(string(readme), "--scale conventional\\|absolute") {
		t.Errorf("README.md's solution row does not give --scale conventional|absolute")
	}
}
