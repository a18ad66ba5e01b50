package cli

import (
	"errors"
	"flag"
	"fmt"
	"io"
	"strings"

	"enthalpath/data"
)

// NewFlagSet makes the flag set of the command name: it reports errors
// instead of exiting and prints nothing itself. --help is answered by the
// dispatcher with the text generated from the command table and these
// flags (writeCommandHelp), the same text "enthalpath help NAME" prints.
func NewFlagSet(name string) *flag.FlagSet {
	fs := flag.NewFlagSet(name, flag.ContinueOnError)
	fs.SetOutput(io.Discard)
	fs.Usage = func() {}
	return fs
}

// helpRequest is what ParseFlags returns for --help: the command hands it
// back to the dispatcher, which prints the command's help on standard
// output and exits 0.
type helpRequest struct{ flags *flag.FlagSet }

func (h *helpRequest) Error() string { return "help requested for " + h.flags.Name() }

// ParseFlags parses a command's flags, which may come before, between or
// after its positional arguments ("--" ends them). A parse error is a
// UsageError; for --help (or -h) help is true and err the request the
// command returns as it stands: `if help || err != nil { return err }`.
func ParseFlags(fs *flag.FlagSet, args []string) (pos []string, help bool, err error) {
	pos, err = parseInterleaved(fs, args)
	if errors.Is(err, flag.ErrHelp) {
		return nil, true, &helpRequest{fs}
	}
	if err != nil {
		return nil, false, &UsageError{&flagError{err}}
	}
	return pos, false, nil
}

// parseInterleaved parses flags that may come before, between or after the
// positional arguments; "--" ends the flags.
func parseInterleaved(fs *flag.FlagSet, args []string) ([]string, error) {
	var pos []string
	for {
		if err := fs.Parse(args); err != nil {
			return nil, err
		}
		rest := fs.Args()
		if len(rest) == 0 {
			return pos, nil
		}
		if rest[0] == "--" {
			return append(pos, rest[1:]...), nil
		}
		pos = append(pos, rest[0])
		args = rest[1:]
	}
}

// givenFlags returns the names of the flags the command line set, so that a
// value the user typed (0 too) is told apart from a default left alone.
func givenFlags(fs *flag.FlagSet) map[string]bool {
	set := map[string]bool{}
	fs.Visit(func(f *flag.Flag) { set[f.Name] = true })
	return set
}

// listFlag is a repeatable string flag.
type listFlag []string

func (l *listFlag) String() string     { return strings.Join(*l, ",") }
func (l *listFlag) Set(s string) error { *l = append(*l, s); return nil }

// printFlags writes the flags of fs as the README writes them, with two
// dashes ("--accuracy float"), each followed by its usage and default; the
// flag package accepts one dash or two, but its own listing shows one.
func printFlags(w io.Writer, fs *flag.FlagSet) {
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

// LoadData loads the built-in tables with the user's overlay: --data FILE,
// else the default overlay file when it exists (data.UserDataPath). A broken
// --data file is a usage error (the user named it); a broken default file is
// reported on stderr and the built-in data are used.
func LoadData(env Env) (*data.DB, error) {
	path := data.UserDataPath(env.DataFile)
	db, err := data.LoadWithUserFile(path)
	switch {
	case err == nil:
		return db, nil
	case db == nil:
		return nil, fmt.Errorf("loading the built-in data: %w", err)
	case env.DataFile != "":
		return nil, &UsageError{fmt.Errorf("--data %s: %w", env.DataFile, err)}
	}
	// A broken default overlay must not stop the program: say so and go on
	// with the built-in data.
	fmt.Fprintf(env.Stderr, "enthalpath: ignoring the overlay file: %v\n", err)
	return db, nil
}
