package cli

import (
	"runtime/debug"
	"strings"
)

// VersionText is the line "enthalpath --version" prints: the module
// version the Go toolchain recorded (a tag, a pseudo-version, or "(devel)"
// for a build in a checkout), the commit and its time, "modified" when the
// checkout had uncommitted changes, and the Go version. ok false (a binary
// built without module information) gives a line that says so.
func VersionText(info *debug.BuildInfo, ok bool) string {
	if !ok || info == nil {
		return "enthalpath (version unknown: this binary was built without module information)"
	}
	version := info.Main.Version
	if version == "" {
		version = "(devel)"
	}
	var revision, when, modified string
	for _, s := range info.Settings {
		switch s.Key {
		case "vcs.revision":
			revision = s.Value
		case "vcs.time":
			when = s.Value
		case "vcs.modified":
			modified = s.Value
		}
	}
	var extra []string
	if revision != "" {
		extra = append(extra, "commit "+revision[:min(12, len(revision))])
	}
	if when != "" {
		extra = append(extra, when)
	}
	if modified == "true" {
		extra = append(extra, "modified")
	}
	line := "enthalpath " + version
	if len(extra) > 0 {
		line += " (" + strings.Join(extra, ", ") + ")"
	}
	if info.GoVersion != "" {
		line += ", built with " + info.GoVersion
	}
	return line
}
