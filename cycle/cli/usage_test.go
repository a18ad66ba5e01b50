package cli

import (
	"runtime/debug"
	"strings"
	"testing"
)

// TestVersionText: the version line from the build information the Go
// toolchain records (runtime/debug.BuildInfo, settings vcs.revision,
// vcs.time, vcs.modified as documented by "go help buildinfo"), and the
// fallback for a binary without it.
func TestVersionText(t *testing.T) {
	for _, tc := range []struct {
		info *debug.BuildInfo
		ok   bool
		want string
	}{
		{&debug.BuildInfo{GoVersion: "go1.26.8", Main: debug.Module{Path: "enthalpath", Version: "v1.2.0"}}, true,
			"enthalpath v1.2.0, built with go1.26.8"},
		{&debug.BuildInfo{GoVersion: "go1.26.8", Main: debug.Module{Path: "enthalpath", Version: "(devel)"}, Settings: []debug.BuildSetting{
			{Key: "vcs.revision", Value: "3277ee9c07eb097d792a3dbdc3001579fc857b79"},
			{Key: "vcs.time", Value: "2026-12-05T20:00:00Z"},
			{Key: "vcs.modified", Value: "true"},
		}}, true, "enthalpath (devel) (commit 3277ee9c07eb, 2026-12-05T20:00:00Z, modified), built with go1.26.8"},
		{&debug.BuildInfo{Main: debug.Module{Path: "enthalpath"}}, true, "enthalpath (devel)"},
		{nil, false, "enthalpath (version unknown: this binary was built without module information)"},
	} {
		if got := VersionText(tc.info, tc.ok); got != tc.want {
			t.Errorf("VersionText: %q, want %q", got, tc.want)
		}
	}
}

// TestHelpFlagsHaveTwoDashes: every command's --help lists its flags as
// the README writes them, "--name", never "-name" (the flag package's own
// listing used one dash).
func TestHelpFlagsHaveTwoDashes(t *testing.T) {
	for _, c := range nonInteractive() {
		var out, errs strings.Builder
		if code := Run(Env{Stdout: &out, Stderr: &errs, Stdin: strings.NewReader("")}, c.name, []string{"--help"}); code != ExitOK {
			t.Errorf("%s --help: exit %d: %s", c.name, code, errs.String())
		}
		help := out.String() + errs.String()
		if c.name != "completion" && !strings.Contains(help, "\n  --") {
			t.Errorf("%s --help lists no --flag:\n%s", c.name, help)
		}
		for _, line := range strings.Split(help, "\n") {
			if strings.HasPrefix(line, "  -") && !strings.HasPrefix(line, "  --") {
				t.Errorf("%s --help: flag listed with one dash: %q", c.name, line)
			}
		}
	}
}
