package cli

import (
	"os"
	"os/exec"
	"path/filepath"
	"strconv"
	"strings"
	"testing"
)

// TestBashCompletion: the bash script is valid bash (bash -n), completes
// the commands of the table, and a command's flags from its own --help: a
// stand-in enthalpath on PATH prints this package's real `cycle --help`.
func TestBashCompletion(t *testing.T) {
	bash, err := exec.LookPath("bash")
	if err != nil {
		t.Skip("no bash on this machine")
	}
	var script, help strings.Builder
	if code := Run(Env{Stdout: &script, Stderr: &script}, "completion", []string{"bash"}); code != ExitOK {
		t.Fatalf("completion bash: exit %d: %s", code, script.String())
	}
	Run(Env{Stdout: &help, Stderr: &help}, "cycle", []string{"--help"})
	dir := t.TempDir()
	if err := os.WriteFile(filepath.Join(dir, "completion.bash"), []byte(script.String()), 0o600); err != nil {
		t.Fatal(err)
	}
	if err := os.WriteFile(filepath.Join(dir, "help.txt"), []byte(help.String()), 0o600); err != nil {
		t.Fatal(err)
	}
	stand := "#!/bin/sh\ncat " + filepath.Join(dir, "help.txt") + "\n"
	if err := os.WriteFile(filepath.Join(dir, "enthalpath"), []byte(stand), 0o700); err != nil {
		t.Fatal(err)
	}
	if out, err := exec.Command(bash, "-n", filepath.Join(dir, "completion.bash")).CombinedOutput(); err != nil {
		t.Fatalf("bash -n: %v: %s", err, out)
	}
	complete := func(words ...string) string {
		t.Helper()
		prog := "source " + filepath.Join(dir, "completion.bash") + "\nCOMP_WORDS=(" + strings.Join(words, " ") + ")\nCOMP_CWORD=" +
			strconv.Itoa(len(words)-1) + "\n_enthalpath\necho \"${COMPREPLY[*]}\"\n"
		cmd := exec.Command(bash, "-c", prog)
		cmd.Env = append(os.Environ(), "PATH="+dir+":"+os.Getenv("PATH"))
		out, err := cmd.CombinedOutput()
		if err != nil {
			t.Fatalf("%v: %v: %s", words, err, out)
		}
		return strings.TrimSpace(string(out))
	}
	if got := complete("enthalpath", "cyc"); got != "cycle" {
		t.Errorf("enthalpath cyc<TAB>: %q, want cycle", got)
	}
	if got := complete("enthalpath", "--data", "x.toml", "comp"); got != "compare completion" {
		t.Errorf("enthalpath --data x.toml comp<TAB>: %q, want compare completion", got)
	}
	if got := complete("enthalpath", "cycle", "NaCl", "--accu"); got != "--accuracy" {
		t.Errorf("enthalpath cycle NaCl --accu<TAB>: %q, want --accuracy", got)
	}
}

// TestCompletionShells: zsh and fish scripts name every command; another
// shell is a usage error.
func TestCompletionShells(t *testing.T) {
	for _, sh := range []string{"zsh", "fish"} {
		var out strings.Builder
		if code := Run(Env{Stdout: &out, Stderr: &out}, "completion", []string{sh}); code != ExitOK {
			t.Fatalf("completion %s: exit %d: %s", sh, code, out.String())
		}
		for _, c := range commandTable(Interactive{}) {
			if !strings.Contains(out.String(), c.name) {
				t.Errorf("completion %s lacks %s", sh, c.name)
			}
		}
	}
	var errs strings.Builder
	if code := Run(Env{Stdout: &errs, Stderr: &errs}, "completion", []string{"tcsh"}); code != ExitUsage {
		t.Errorf("completion tcsh: exit %d, want %d", code, ExitUsage)
	}
}
