package cli

import (
	"flag"
	"fmt"
	"io"
	"runtime/debug"
	"strings"
)

// PrintFlags writes the flags of fs as the README writes them, with two
// dashes ("--accuracy float"), each followed by its usage and default; the
// flag package accepts one dash or two, but its own listing shows one.
func PrintFlags(w io.Writer, fs *flag.FlagSet) {
	fs.VisitAll(func(f *flag.Flag) {
		name, usage := flag.UnquoteUsage(f)
		line := "  --" + f.Name
		if name != "" {
			line += " " + name
		}
		usage = strings.ReplaceAll(usage, "\n", "\n    \t")
		line += "\n    \t" + usage
		if !isZeroDefault(f) {
			if quotedDefault(f) {
				line += fmt.Sprintf(" (default %q)", f.DefValue)
			} else {
				line += fmt.Sprintf(" (default %v)", f.DefValue)
			}
		}
		fmt.Fprintln(w, line)
	})
}

// isZeroDefault reports whether f's default is its type's zero value,
// which the listing leaves unsaid.
func isZeroDefault(f *flag.Flag) bool {
	switch f.DefValue {
	case "", "0", "false", "[]", "0s":
		return true
	}
	return false
}

// quotedDefault reports whether f's default is written in quotes: a
// string flag's, as the flag package does.
func quotedDefault(f *flag.Flag) bool {
	getter, ok := f.Value.(flag.Getter)
	if !ok {
		return false
	}
	_, isString := getter.Get().(string)
	return isString
}

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
