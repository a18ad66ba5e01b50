package launch

import (
	"strings"
	"testing"

	"enthalpath/cycle/cli"
)

// The interactive commands answer help from the command table as every
// other does: "help NAME" and "NAME --help" print the same text on
// standard output and exit 0 (issue 13: one table drives help; help on
// standard output, common practice, no source).
func TestInteractiveHelpIsOneText(t *testing.T) {
	in := cli.Interactive{Workshop: Workshop, Serve: Serve}
	main := func(args ...string) (cli.ExitCode, string, string) {
		var out, errs strings.Builder
		code := cli.Main(cli.Env{Stdout: &out, Stderr: &errs, Stdin: strings.NewReader("")}, args, in)
		return code, out.String(), errs.String()
	}
	for _, tc := range []struct{ name, synopsis, flag string }{
		{"open", cli.WorkshopSynopsis, ""},
		{"serve", cli.ServeSynopsis, "  --authorized-keys FILE"},
	} {
		code, viaHelp, errs := main("help", tc.name)
		if code != cli.ExitOK || errs != "" || !strings.HasPrefix(viaHelp, "usage: enthalpath "+tc.synopsis+"\n") ||
			!strings.Contains(viaHelp, tc.flag) || !strings.Contains(viaHelp, "  --data FILE") {
			t.Errorf("help %s: exit %d, stderr %q:\n%s", tc.name, code, errs, viaHelp)
		}
		code, viaFlag, errs := main(tc.name, "--help")
		if code != cli.ExitOK || errs != "" || viaFlag != viaHelp {
			t.Errorf("%s --help: exit %d, stderr %q, not the text of help %s:\n%s", tc.name, code, errs, tc.name, viaFlag)
		}
	}
	// Without a terminal the workshop says what to run instead, exit 2,
	// before it loads any data.
	code, out, errs := main()
	if code != cli.ExitUsage || out != "" || !strings.Contains(errs, "needs a terminal") {
		t.Errorf("enthalpath without a terminal: exit %d, stdout %q, stderr %q", code, out, errs)
	}
	code, _, errs = main("open", "NaCl", "KCl")
	if code != cli.ExitUsage || !strings.Contains(errs, "give one formula or cycle file") {
		t.Errorf("open NaCl KCl: exit %d, %q", code, errs)
	}
}
