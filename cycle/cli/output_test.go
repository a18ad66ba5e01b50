package cli

import (
	"os"
	"path/filepath"
	"strings"
	"syscall"
	"testing"
)

// fullWriter fails every write as a full disk does (/dev/full).
type fullWriter struct{}

func (fullWriter) Write([]byte) (int, error) { return 0, syscall.ENOSPC }

// TestTextOutputWriteErrorsExitNonZero: every command in text mode exits 1
// when its output cannot be written (`cycle NaCl > /dev/full` once exited
// 0; the exit codes are the README's).
func TestTextOutputWriteErrorsExitNonZero(t *testing.T) {
	cases := [][]string{
		{"cycle", "NaCl"},
		{"compare", "NaCl", "KBr"},
		{"madelung", "rock-salt"},
		{"data", "NaCl"},
		{"estimate", "MgCl", "--charges", "Mg=+1,Cl=-1"},
		{"scan", "Mg", "Cl"},
		{"solution", "NaCl"},
		{"radius", "NH4Cl", "--ion", "NH4+"},
	}
	for _, c := range cases {
		var errs strings.Builder
		code := Run(Env{Stdout: fullWriter{}, Stderr: &errs, Stdin: strings.NewReader("")}, c[0], c[1:])
		if code != ExitInternal {
			t.Errorf("%v > /dev/full: exit %d, want %d", c, code, ExitInternal)
		}
		if !strings.Contains(errs.String(), "no space left") {
			t.Errorf("%v > /dev/full: stderr %q does not say why", c, errs.String())
		}
	}
}

// TestOutputFileFaultsAreUsageErrors: a --save or --out that names a
// folder, a missing folder or a link exits 2 and names the flag (they once
// exited 1 with "rename … file exists"); the link is left as it was.
func TestOutputFileFaultsAreUsageErrors(t *testing.T) {
	dir := t.TempDir()
	input := filepath.Join(dir, "in.csv")
	os.WriteFile(input, []byte("formula\nNaCl\n"), 0o644)
	link := filepath.Join(dir, "link.hesscycle")
	if err := os.Symlink(input, link); err != nil {
		t.Fatal(err)
	}
	cases := []struct {
		args []string
		want string
	}{
		{[]string{"cycle", "NaCl", "--save", dir}, "--save " + dir + ": it is a folder"},
		{[]string{"cycle", "NaCl", "--save", filepath.Join(dir, "missing", "x.hesscycle")}, "does not exist"},
		{[]string{"cycle", "NaCl", "--save", link}, "it is a symbolic link"},
		{[]string{"cycle", "NaCl", "--save", filepath.Join(dir, strings.Repeat("n", 245)+".hesscycle")}, "use at most"},
		{[]string{"batch", input, "--out", dir}, "--out " + dir + ": it is a folder"},
		{[]string{"batch", input, "--out", filepath.Join(dir, "missing", "out.csv")}, "does not exist"},
	}
	for _, c := range cases {
		_, errs, code := run(t, c.args[0], c.args[1:]...)
		if code != ExitUsage || !strings.Contains(errs, c.want) {
			t.Errorf("%v: exit %d, stderr %q; want exit %d and %q", c.args, code, errs, ExitUsage, c.want)
		}
	}
	if st, err := os.Lstat(link); err != nil || st.Mode()&os.ModeSymlink == 0 {
		t.Errorf("the link was replaced: %v", err)
	}
	if b, _ := os.ReadFile(input); string(b) != "formula\nNaCl\n" {
		t.Errorf("the link's target was written: %q", b)
	}
}

// TestSaveKeepsMode: saving over a 0600 cycle file keeps it 0600 (it once
// became 0644).
func TestSaveKeepsMode(t *testing.T) {
	path := filepath.Join(t.TempDir(), "private.hesscycle")
	for range 2 {
		if _, errs, code := run(t, "cycle", "NaCl", "--save", path); code != ExitOK {
			t.Fatalf("exit %d: %s", code, errs)
		}
		if err := os.Chmod(path, 0o600); err != nil {
			t.Fatal(err)
		}
	}
	if _, _, code := run(t, "cycle", "KBr", "--save", path); code != ExitOK {
		t.Fatal("save failed")
	}
	if st, _ := os.Stat(path); st.Mode().Perm() != 0o600 {
		t.Errorf("mode %v after saving over a 0600 file", st.Mode().Perm())
	}
}

// TestMessagesOfEmptyAndHugeInput: the messages of the item 10
// (report: ": empty formula"; "-Inf kJ/mol"; NUL bytes copied into the CSV).
func TestMessagesOfEmptyAndHugeInput(t *testing.T) {
	for _, c := range []struct {
		args         []string
		want, banned string
	}{
		{[]string{"cycle", ""}, "the formula is empty", ": :"},
		{[]string{"estimate", " "}, "the formula is empty", ": :"},
		{[]string{"scan", "", "Cl"}, "metal (empty)", ": :"},
		{[]string{"cycle", "NaCl", "--units", "ev", "--set", "formation=-1e307"}, "-1e+307 eV", "Inf"},
	} {
		_, errs, code := run(t, c.args[0], c.args[1:]...)
		if code != ExitUsage || !strings.Contains(errs, c.want) || strings.Contains(errs, c.banned) {
			t.Errorf("%q: exit %d, stderr %q; want exit 2 with %q and without %q", c.args, code, errs, c.want, c.banned)
		}
	}
	in := filepath.Join(t.TempDir(), "nul.csv")
	os.WriteFile(in, []byte("formula\nNa\x00Cl\nKBr\n"), 0o644)
	out, errs, _ := run(t, "batch", in)
	if strings.ContainsRune(out, 0) {
		t.Errorf("batch copied a NUL byte into its output:\n%q", out)
	}
	if !strings.Contains(out, "U+0000") || !strings.Contains(out, "KBr") {
		t.Errorf("batch output %q (stderr %q): want the NUL row refused by name and KBr estimated", out, errs)
	}
}

// TestCycleFileNamingADevice: a cycle file whose CIF is /dev/zero is
// refused at once (it once read until 2.9 GB).
func TestCycleFileNamingADevice(t *testing.T) {
	if _, err := os.Stat("/dev/zero"); err != nil {
		t.Skip("no /dev/zero")
	}
	path := filepath.Join(t.TempDir(), "zero.hesscycle")
	if _, errs, code := run(t, "cycle", "NaCl", "--save", path); code != ExitOK {
		t.Fatal(errs)
	}
	b, _ := os.ReadFile(path)
	os.WriteFile(path, []byte(strings.Replace(string(b), "[models]\n", "[models]\ncif = \"/dev/zero\"\n", 1)), 0o644)
	_, errs, code := run(t, "cycle", "--open", path)
	if code != ExitUsage || !strings.Contains(errs, "a device, not a regular file") {
		t.Errorf("exit %d, stderr %q; want exit 2 refusing the device", code, errs)
	}
}
