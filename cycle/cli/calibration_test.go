package cli

import (
	"bytes"
	"io"
	"os"
	"path/filepath"
	"strings"
	"testing"
)

// BenchmarkCycleNaCl is the whole `enthalpath cycle NaCl` path in-process:
// loading the data, building and solving the cycle, every model, the
// verdict (its σ and thresholds from the built-in calibration) and the
// text. The data and the validation are not shared between iterations.
func BenchmarkCycleNaCl(b *testing.B) {
	env := Env{Stdout: io.Discard, Stderr: io.Discard}
	b.ReportAllocs()
	for b.Loop() {
		if code := Run(env, "cycle", []string{"NaCl"}); code != ExitOK {
			b.Fatalf("exit %d", code)
		}
	}
}

// trust validates live and says whether the built-in calibration, which
// the verdicts read, matches it: it does for the built-in data (the table
// is cycle/calibgen's output, checked byte for byte there); with a data
// file that moves NaCl's ΔfH° by 9 kJ/mol (−420 against NBS −411.15) the
// report differs and the verdicts keep the built-in calibration, and a
// cycle names the data file its σ does not include.
func TestTrustChecksTheBuiltinCalibration(t *testing.T) {
	out, errOut, code := run(t, "trust")
	if code != ExitOK || !strings.Contains(out, "matches this report.") {
		t.Errorf("trust (exit %d, %s) does not say the built-in calibration matches:\n%s", code, errOut, lastLines(out, 3))
	}
	out, _, code = run(t, "trust", "--json")
	if code != ExitOK || !strings.Contains(out, `"builtin_calibration_matches": true`) {
		t.Errorf("trust --json (exit %d) lacks the calibration check:\n%s", code, lastLines(out, 4))
	}
	file := filepath.Join(t.TempDir(), "mine.toml")
	if err := os.WriteFile(file, []byte("[[compound]]\nformula = \"NaCl\"\nformation_kj_per_mol = -420.0\n"), 0o600); err != nil {
		t.Fatal(err)
	}
	withFile := func(args ...string) string {
		var o, e bytes.Buffer
		if code := Run(Env{Stdout: &o, Stderr: &e, Stdin: strings.NewReader(""), DataFile: file}, args[0], args[1:]); code != ExitOK {
			t.Fatalf("%v with %s: exit %d: %s", args, file, code, e.String())
		}
		return o.String()
	}
	if out := withFile("trust"); !strings.Contains(out, "differs from this report, which includes the data file "+file) {
		t.Errorf("trust with a data file does not say the verdicts keep the built-in calibration:\n%s", lastLines(out, 3))
	}
	if out := withFile("cycle", "NaCl"); !strings.Contains(strings.Join(strings.Fields(out), " "), "not on the data overlay "+file) {
		t.Errorf("cycle NaCl with a data file does not say its σ is the built-in data's:\n%s", out)
	}
}

func lastLines(s string, n int) string {
	lines := strings.Split(strings.TrimRight(s, "\n"), "\n")
	return strings.Join(lines[max(0, len(lines)-n):], "\n")
}
