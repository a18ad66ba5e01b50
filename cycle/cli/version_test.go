package cli

import (
	"runtime"
	"strings"
	"testing"
)

// TestVersionFlag: "enthalpath --version" prints one line naming the
// program and the Go version that built it, and exits 0 (it once said
// `unknown command "--version"` and exited 2).
func TestVersionFlag(t *testing.T) {
	for _, arg := range []string{"--version", "-version", "version"} {
		var out, errs strings.Builder
		code := Main(Env{Stdout: &out, Stderr: &errs, Stdin: strings.NewReader("")}, []string{arg}, Interactive{})
		if code != ExitOK || errs.Len() > 0 {
			t.Errorf("%s: exit %d, stderr %q", arg, code, errs.String())
		}
		if s := out.String(); !strings.HasPrefix(s, "enthalpath ") || !strings.Contains(s, runtime.Version()) || strings.Count(s, "\n") != 1 {
			t.Errorf("%s: %q, want one line with the program and %s", arg, s, runtime.Version())
		}
	}
}

// TestHelpListsVersion: the top-level usage names --version, with two
// dashes as the README writes options.
func TestHelpListsVersion(t *testing.T) {
	var out strings.Builder
	if code := Main(Env{Stdout: &out, Stderr: &out}, []string{"--help"}, Interactive{}); code != ExitOK || !strings.Contains(out.String(), "enthalpath --version") {
		t.Errorf("--help: exit %d, %q", code, out.String())
	}
}
