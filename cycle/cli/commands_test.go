package cli

import (
	"os"
	"path/filepath"
	"regexp"
	"slices"
	"strings"
	"testing"
)

// The rules checked here are the project's own (issue 13: one command
// table drives dispatch and help; global flags before or after the
// command; exit codes in one place) and the usual conventions of a command
// line (common practice, no source): help on standard output with exit 0,
// bad usage exit 2 on standard error.

// nonInteractive is the table without the commands main hands in (they are
// tested with the real workshop in tui/launch).
func nonInteractive() []command {
	var out []command
	for _, c := range commandTable(Interactive{}) {
		if c.name != "open" && c.name != "serve" {
			out = append(out, c)
		}
	}
	return out
}

// mainFor runs the whole command line in-process.
func mainFor(args ...string) (code ExitCode, stdout, stderr string) {
	var out, errs strings.Builder
	code = Main(Env{Stdout: &out, Stderr: &errs, Stdin: strings.NewReader("")}, args, Interactive{})
	return code, out.String(), errs.String()
}

// TestHelpIsOneText: "enthalpath help NAME" and "enthalpath NAME --help"
// (and -h) print the same text on standard output and exit 0, and the
// text is the table's: synopsis, summary, the global flags.
func TestHelpIsOneText(t *testing.T) {
	for _, c := range nonInteractive() {
		code, viaHelp, errs := mainFor("help", c.name)
		if code != ExitOK || errs != "" {
			t.Errorf("help %s: exit %d, stderr %q", c.name, code, errs)
		}
		for _, flag := range []string{"--help", "-h"} {
			code, viaFlag, errs := mainFor(c.name, flag)
			if code != ExitOK || errs != "" || viaFlag != viaHelp {
				t.Errorf("%s %s: exit %d, stderr %q, and a text other than help %s's:\n%s\n---\n%s", c.name, flag, code, errs, c.name, viaFlag, viaHelp)
			}
		}
		if !strings.HasPrefix(viaHelp, "usage: enthalpath "+c.synopsis+"\n") || !strings.Contains(viaHelp, c.summary[1:]) ||
			!strings.Contains(viaHelp, "global flags") || !strings.Contains(viaHelp, "  --data FILE") {
			t.Errorf("help %s is not the table's:\n%s", c.name, viaHelp)
		}
	}
}

// TestUsageListsTheTable: "enthalpath help" lists every command of the
// table with its summary, every global flag and every exit code.
func TestUsageListsTheTable(t *testing.T) {
	code, out, errs := mainFor("help")
	if code != ExitOK || errs != "" {
		t.Fatalf("help: exit %d, %q", code, errs)
	}
	for _, c := range commandTable(Interactive{}) {
		if !regexp.MustCompile(`(?m)^  ` + c.name + ` +` + regexp.QuoteMeta(c.summary) + `$`).MatchString(out) {
			t.Errorf("help does not list %s with its summary:\n%s", c.name, out)
		}
	}
	for _, g := range globalFlags() {
		if !strings.Contains(out, "  --"+g.name+" "+g.arg+"\n") {
			t.Errorf("help does not list --%s", g.name)
		}
	}
	for _, e := range exitCodes() {
		if !strings.Contains(out, "  "+string(rune('0'+e.code))+"  "+e.meaning+"\n") {
			t.Errorf("help does not list exit code %d", e.code)
		}
	}
	for _, alias := range []string{"-h", "--help", "-help"} {
		if code, again, _ := mainFor(alias); code != ExitOK || again != out {
			t.Errorf("%s: exit %d, not the text of help", alias, code)
		}
	}
}

// TestGlobalFlagAnywhere: --data FILE is taken before the command, after
// it, between its arguments, and as --data=FILE, with the same result. The
// overlay is an invented value, not real data.
func TestGlobalFlagAnywhere(t *testing.T) {
	t.Setenv("XDG_CONFIG_HOME", t.TempDir())
	file := filepath.Join(t.TempDir(), "mine.toml")
	if err := os.WriteFile(file, []byte("[[element]]\nsymbol = \"Na\"\natomization_kj_per_mol = 108.25\n"), 0o600); err != nil {
		t.Fatal(err)
	}
	var first string
	for i, args := range [][]string{
		{"--data", file, "data", "Na"},
		{"data", "Na", "--data", file},
		{"data", "--data=" + file, "Na"},
		{"-data", file, "data", "Na"},
		{"--data", "other.toml", "data", "Na", "--data", file}, // the last wins
	} {
		code, out, errs := mainFor(args...)
		if code != ExitOK || !strings.Contains(out, "108.25 kJ/mol  [user; override") {
			t.Errorf("%q: exit %d, stderr %q, the overlay not read:\n%s", args, code, errs, out)
		}
		if i == 0 {
			first = out
		} else if out != first {
			t.Errorf("%q prints other than %q", args, [][]string{{"--data", file, "data", "Na"}})
		}
	}
	// The issue's case: "cycle NaCl --data FILE" is "--data FILE cycle
	// NaCl", and the overlay reaches the cycle (Na's atomization step).
	_, before, _ := mainFor("--data", file, "cycle", "NaCl")
	_, after, errs := mainFor("cycle", "NaCl", "--data", file)
	if before != after || !strings.Contains(after, "user [override") {
		t.Errorf("cycle NaCl --data FILE (stderr %q) differs from --data FILE cycle NaCl or lacks the overlay:\n%s\n---\n%s", errs, after, before)
	}
	// After "--" it is an argument of the command, not the global flag.
	if code, _, errs := mainFor("data", "--", "--data"); code != ExitUsage || strings.Contains(errs, "needs a file name") {
		t.Errorf("data -- --data: exit %d, %q", code, errs)
	}
}

// TestTakeGlobalFlags: the parser of the global flags (it once took --data
// only before the command, and said `unknown command "--data"` without a
// file).
func TestTakeGlobalFlags(t *testing.T) {
	for _, tc := range []struct {
		args []string
		rest []string
		file string
		err  string
	}{
		{[]string{"--data", "my.toml", "cycle", "NaCl"}, []string{"cycle", "NaCl"}, "my.toml", ""},
		{[]string{"--data=my.toml", "cycle"}, []string{"cycle"}, "my.toml", ""},
		{[]string{"-data", "a.toml", "--data", "b.toml"}, []string{}, "b.toml", ""},
		{[]string{"cycle", "--data", "x", "NaCl"}, []string{"cycle", "NaCl"}, "x", ""},
		{[]string{"cycle", "--", "--data", "x"}, []string{"cycle", "--", "--data", "x"}, "", ""},
		{[]string{"cycle", "--database", "x"}, []string{"cycle", "--database", "x"}, "", ""},
		{[]string{"--data"}, nil, "", "--data needs a file name"},
		{[]string{"cycle", "NaCl", "--data"}, nil, "", "--data needs a file name"},
		{[]string{"--data="}, nil, "", "--data needs a file name"},
		{[]string{"--data", ""}, nil, "", "--data needs a file name"},
	} {
		var env Env
		rest, err := takeGlobalFlags(tc.args, &env)
		if tc.err != "" {
			if err == nil || !strings.Contains(err.Error(), tc.err) {
				t.Errorf("%q: err %v, want %q", tc.args, err, tc.err)
			}
			continue
		}
		if err != nil || env.DataFile != tc.file || !slices.Equal(rest, tc.rest) {
			t.Errorf("%q: %q, %q, %v; want %q, %q", tc.args, rest, env.DataFile, err, tc.rest, tc.file)
		}
	}
	if code, _, errs := mainFor("cycle", "NaCl", "--data"); code != ExitUsage || !strings.Contains(errs, "--data needs a file name") {
		t.Errorf("cycle NaCl --data: exit %d, %q", code, errs)
	}
}

// TestNoCommandFlagShadowsAGlobal: a command's own flag named like a
// global one would never be reached.
func TestNoCommandFlagShadowsAGlobal(t *testing.T) {
	for _, c := range nonInteractive() {
		_, help, _ := mainFor("help", c.name)
		flags := help[:strings.Index(help, "global flags")]
		for _, g := range globalFlags() {
			if strings.Contains(flags, "\n  --"+g.name+" ") || strings.Contains(flags, "\n  --"+g.name+"\n") {
				t.Errorf("%s has a flag --%s of its own", c.name, g.name)
			}
		}
	}
}

// TestBadUsage: an unknown command, an unknown flag and help for an
// unknown command exit 2 with a message on standard error that says where
// to look; nothing is printed on standard output.
func TestBadUsage(t *testing.T) {
	for _, tc := range []struct {
		args []string
		want string
	}{
		{[]string{"cylce", "NaCl"}, `unknown command "cylce" (enthalpath help lists the commands)`},
		{[]string{"cycle", "NaCl", "--bogus"}, "enthalpath cycle: unknown flag --bogus\n(enthalpath help cycle lists its flags)"},
		{[]string{"cycle", "NaCl", "-bogus"}, "enthalpath cycle: unknown flag --bogus\n"},
		{[]string{"cycle", "NaCl", "--save"}, "enthalpath cycle: --save needs a value\n"},
		{[]string{"scan", "Ti", "Cl", "--max-charge", "x"}, `invalid value "x" for --max-charge`},
		{[]string{"help", "cylce"}, `no command "cylce"`},
		{[]string{"help", "cycle", "data"}, "at most one command"},
		{[]string{"version", "extra"}, "no arguments"},
	} {
		code, out, errs := mainFor(tc.args...)
		if code != ExitUsage || out != "" || !strings.Contains(errs, tc.want) {
			t.Errorf("%q: exit %d, stdout %q, stderr %q; want exit 2 and %q", tc.args, code, out, errs, tc.want)
		}
	}
}

// TestReadmeExitCodes: the README's table of exit codes is exitCodes,
// row for row.
func TestReadmeExitCodes(t *testing.T) {
	readme, err := os.ReadFile("../../README.md")
	if err != nil {
		t.Fatal(err)
	}
	var rows []string
	for _, line := range strings.Split(string(readme), "\n") {
		if regexp.MustCompile("^\\| `[0-9]+` \\|").MatchString(line) {
			rows = append(rows, line)
		}
	}
	var want []string
	for _, e := range exitCodes() {
		want = append(want, "| `"+string(rune('0'+e.code))+"` | "+e.meaning+" |")
	}
	if !slices.Equal(rows, want) {
		t.Errorf("README's exit codes:\n%s\nwant:\n%s", strings.Join(rows, "\n"), strings.Join(want, "\n"))
	}
}

// TestReadmeNamesEveryCommand: each command of the table has its line in
// the README's table of commands.
func TestReadmeNamesEveryCommand(t *testing.T) {
	readme, err := os.ReadFile("../../README.md")
	if err != nil {
		t.Fatal(err)
	}
	for _, c := range commandTable(Interactive{}) {
		if !strings.Contains(string(readme), "| `enthalpath "+c.name) {
			t.Errorf("README's table of commands lacks %s", c.name)
		}
	}
}

// TestTerminalCommandsGetTheStreams: the workshop is handed the process's
// own streams, not a wrapper, so that it can see they are a terminal (the
// wrapper once made "enthalpath" refuse to start in a real terminal).
func TestTerminalCommandsGetTheStreams(t *testing.T) {
	var out, errs strings.Builder
	in := strings.NewReader("")
	env := Env{Stdout: &out, Stderr: &errs, Stdin: in}
	var got Env
	stub := func(e Env, _ []string) error { got = e; return nil }
	for _, args := range [][]string{nil, {"open"}, {"serve"}} {
		got = Env{}
		if code := Main(env, args, Interactive{Workshop: stub, Serve: stub}); code != ExitOK {
			t.Errorf("%q: exit %d", args, code)
		}
		if got.Stdout != env.Stdout || got.Stderr != env.Stderr || got.Stdin != env.Stdin {
			t.Errorf("%q: the command got other streams than the process's", args)
		}
	}
}
