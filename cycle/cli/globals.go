package cli

import (
	"fmt"
	"io"
	"strings"
)

// globalFlag is a flag of the whole program, taken off the command line
// before the command runs, wherever it stands (before or after the
// command, but not after "--").
type globalFlag struct {
	name  string // without the dashes
	arg   string // the placeholder of its value
	needs string // what its value is, for the error without one
	usage string
	set   func(env *Env, value string)
}

// globalFlags is the table of global flags: the usage, every command's
// help and the completion scripts are written from it.
func globalFlags() []globalFlag {
	return []globalFlag{
		{name: "data", arg: "FILE", needs: "a file name",
			usage: "a user data file (TOML) over the built-in tables; without it, data.toml in the user's config folder when there is one",
			set:   func(env *Env, value string) { env.DataFile = value }},
	}
}

// takeGlobalFlags takes the global flags (--name VALUE, --name=VALUE, one
// dash or two) off args into env and returns the rest. The last of a flag
// given twice wins.
func takeGlobalFlags(args []string, env *Env) ([]string, error) {
	rest := make([]string, 0, len(args))
	for i := 0; i < len(args); i++ {
		if args[i] == "--" {
			return append(rest, args[i:]...), nil
		}
		g, value, hasValue, ok := matchGlobalFlag(args[i])
		if !ok {
			rest = append(rest, args[i])
			continue
		}
		if !hasValue && i+1 < len(args) {
			i++
			value = args[i]
		}
		if value == "" {
			return nil, fmt.Errorf("--%s needs %s: enthalpath --%s %s [COMMAND], before or after the command", g.name, g.needs, g.name, g.arg)
		}
		g.set(env, value)
	}
	return rest, nil
}

// matchGlobalFlag reads arg as a global flag.
func matchGlobalFlag(arg string) (g globalFlag, value string, hasValue, ok bool) {
	name, found := strings.CutPrefix(arg, "--")
	if !found {
		if name, found = strings.CutPrefix(arg, "-"); !found {
			return g, "", false, false
		}
	}
	name, value, hasValue = strings.Cut(name, "=")
	for _, g := range globalFlags() {
		if g.name == name {
			return g, value, hasValue, true
		}
	}
	return g, "", false, false
}

// writeGlobalFlags lists the global flags as a command's flags are listed.
func writeGlobalFlags(w io.Writer) {
	fmt.Fprintln(w, "global flags (before or after the command):")
	for _, g := range globalFlags() {
		fmt.Fprintf(w, "  --%s %s\n    \t%s\n", g.name, g.arg, g.usage)
	}
}
