package cli

import (
	"errors"
	"flag"
	"fmt"
	"io"
	"runtime/debug"
	"strings"
)

// Main is the whole command line: it takes the global flags off args
// wherever they stand, runs the command named (the workshop when there is
// none) and returns the exit code. main calls it and nothing else.
func Main(env Env, args []string, in Interactive) ExitCode {
	args, err := takeGlobalFlags(args, &env)
	if err != nil {
		fmt.Fprintf(env.Stderr, "enthalpath: %v\n", err)
		return ExitUsage
	}
	table := commandTable(in)
	if len(args) == 0 {
		return dispatch(env, table, "open", nil)
	}
	name := args[0]
	switch name {
	case "-h", "-help", "--help":
		name = "help"
	case "-version", "--version":
		name = "version"
	}
	return dispatch(env, table, name, args[1:])
}

// Run executes the command name of the table (without the interactive
// ones) with args, the global flags already in env.
func Run(env Env, name string, args []string) ExitCode {
	return dispatch(env, commandTable(Interactive{}), name, args)
}

// dispatch runs one command of table and words its outcome. It never
// panics: an internal panic is reported as ExitInternal.
func dispatch(env Env, table []command, name string, args []string) (code ExitCode) {
	c, ok := find(table, name)
	if !ok {
		fmt.Fprintf(env.Stderr, "enthalpath: unknown command %q (enthalpath help lists the commands)\n", name)
		return ExitUsage
	}
	defer func() {
		if r := recover(); r != nil {
			fmt.Fprintf(env.Stderr, "enthalpath %s: internal error: %v\n", c.name, r)
			code = ExitInternal
		}
	}()
	out := &checkedWriter{w: env.Stdout}
	if !c.terminal {
		env.Stdout = out
	}
	err := c.run(env, args)
	var help *helpRequest
	if errors.As(err, &help) {
		writeCommandHelp(out, c, help.flags)
		err = nil
	}
	if err == nil && out.err != nil {
		// Text output is printed as it goes: a full disk or a closed
		// pipe is found here, once, for every command.
		err = fmt.Errorf("writing the output: %w", out.err)
	}
	if err == nil {
		return ExitOK
	}
	fmt.Fprintf(env.Stderr, "enthalpath %s: %s\n", c.name, commandLineText(err))
	var bad *flagError
	if errors.As(err, &bad) {
		fmt.Fprintf(env.Stderr, "(enthalpath help %s lists its flags)\n", c.name)
	}
	return exitCodeOf(err)
}

// runHelp is the help command: the usage, or a command's help. The help of
// a command is what its own --help gives, so the two never differ.
func runHelp(env Env, table []command, args []string) error {
	fs := NewFlagSet("help")
	pos, help, err := ParseFlags(fs, args)
	if help || err != nil {
		return err
	}
	switch len(pos) {
	case 0:
		writeUsage(env.Stdout, table)
		return nil
	case 1:
		c, ok := find(table, pos[0])
		if !ok {
			return Usagef("no command %q: enthalpath help lists the commands", pos[0])
		}
		err := c.run(env, []string{"--help"})
		var h *helpRequest
		if !errors.As(err, &h) {
			return fmt.Errorf("%s --help gave no help: %v", c.name, err)
		}
		writeCommandHelp(env.Stdout, c, h.flags)
		return nil
	}
	return Usagef("give at most one command: usage: enthalpath help [COMMAND]")
}

// runVersion prints the version line.
func runVersion(env Env, args []string) error {
	fs := NewFlagSet("version")
	pos, help, err := ParseFlags(fs, args)
	if help || err != nil {
		return err
	}
	if len(pos) > 0 {
		return Usagef("version takes no arguments")
	}
	info, ok := debug.ReadBuildInfo()
	_, err = fmt.Fprintln(env.Stdout, VersionText(info, ok))
	return err
}

// writeUsage is the top-level usage, generated from the table.
func writeUsage(w io.Writer, table []command) {
	fmt.Fprint(w, "usage: enthalpath [--data FILE] [COMMAND] [ARGS]\n"+
		"       enthalpath help [COMMAND]\n"+
		"       enthalpath --version\n\n"+
		"With no command, the interactive workshop opens on the shelf.\n\ncommands:\n")
	width := 0
	for _, c := range table {
		width = max(width, len(c.name))
	}
	for _, c := range table {
		fmt.Fprintf(w, "  %-*s  %s\n", width, c.name, c.summary)
	}
	fmt.Fprintln(w)
	writeGlobalFlags(w)
	fmt.Fprintln(w, "\nexit codes:")
	for _, e := range exitCodes() {
		fmt.Fprintf(w, "  %d  %s\n", e.code, e.meaning)
	}
	fmt.Fprintln(w, "\nenthalpath help COMMAND (or enthalpath COMMAND --help) lists a command's flags.")
}

// writeCommandHelp is the help of one command: its synopsis, what it does,
// its flags and the global flags.
func writeCommandHelp(w io.Writer, c command, fs *flag.FlagSet) {
	fmt.Fprintf(w, "usage: enthalpath %s\n\n%s\n", c.synopsis, upperFirst(c.summary)+".")
	if c.about != "" {
		fmt.Fprintf(w, "\n%s\n", c.about)
	}
	hasFlags := false
	fs.VisitAll(func(*flag.Flag) { hasFlags = true })
	if hasFlags {
		fmt.Fprintln(w, "\nflags:")
		printFlags(w, fs)
	}
	fmt.Fprintln(w)
	writeGlobalFlags(w)
}

func upperFirst(s string) string {
	if s == "" {
		return s
	}
	return strings.ToUpper(s[:1]) + s[1:]
}

// flagError marks a command line its flag set refused. It words the flag
// package's messages with two dashes, as the help lists the flags.
type flagError struct{ err error }

func (e *flagError) Error() string {
	msg := e.err.Error()
	if name, ok := strings.CutPrefix(msg, "flag provided but not defined: -"); ok {
		return "unknown flag --" + strings.TrimPrefix(name, "-")
	}
	if name, ok := strings.CutPrefix(msg, "flag needs an argument: -"); ok {
		return "--" + strings.TrimPrefix(name, "-") + " needs a value"
	}
	return strings.Replace(msg, " for flag -", " for --", 1)
}
func (e *flagError) Unwrap() error { return e.err }
