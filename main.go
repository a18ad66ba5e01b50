// Command enthalpath builds thermochemical (Born–Haber) cycles of ionic
// solids, computes Madelung constants by Ewald summation and compares the
// cycle's lattice energy with ionic models.
//
// Usage:
//
//	enthalpath                      open the terminal workshop on the demo data
//	enthalpath [--data FILE] COMMAND [ARGS]
//	enthalpath serve [FLAGS]        serve the workshop over SSH
//
// Run "enthalpath help" for the list of commands, "enthalpath COMMAND
// --help" for a command's flags, and "enthalpath --version" for the version
// and commit the binary was built from. Exit codes: 0 success, 2 bad usage or
// input, 1 internal error.
package main

import (
	"fmt"
	"io"
	"os"
	"runtime/debug"
	"strings"

	"enthalpath/cycle/cli"
)

func main() {
	os.Exit(run(cli.Env{Stdout: os.Stdout, Stderr: os.Stderr, Stdin: os.Stdin}, os.Args[1:]))
}

func run(env cli.Env, args []string) int {
	args, file, err := dataFlag(args)
	if err != nil {
		fmt.Fprintf(env.Stderr, "enthalpath: %v\n", err)
		return cli.ExitUsage
	}
	env.DataFile = file
	if len(args) == 0 {
		return runWorkshop(env, nil)
	}
	switch name := args[0]; {
	case name == "help" || name == "-h" || name == "--help":
		usage(env.Stdout)
		return cli.ExitOK
	case name == "--version" || name == "-version" || name == "version":
		info, ok := debug.ReadBuildInfo()
		fmt.Fprintln(env.Stdout, cli.VersionText(info, ok))
		return cli.ExitOK
	case name == "tui" || name == "open":
		return runWorkshop(env, args[1:])
	case name == "serve":
		return runServe(env, args[1:])
	case cli.Has(name):
		return cli.Run(env, name, args[1:])
	default:
		fmt.Fprintf(env.Stderr, "enthalpath: unknown command %q\n\n", name)
		usage(env.Stderr)
		return cli.ExitUsage
	}
}

// dataFlag takes the --data FILE (or --data=FILE) options before the
// command off args: the last one given wins.
func dataFlag(args []string) (rest []string, file string, err error) {
	for len(args) > 0 {
		name, value, hasValue := strings.Cut(args[0], "=")
		if name != "--data" && name != "-data" {
			break
		}
		if !hasValue {
			if len(args) < 2 || args[1] == "" {
				return nil, "", fmt.Errorf("%s needs a file name: enthalpath --data FILE [COMMAND]", name)
			}
			value, args = args[1], args[1:]
		}
		if value == "" {
			return nil, "", fmt.Errorf("%s needs a file name: enthalpath --data FILE [COMMAND]", name)
		}
		file, args = value, args[1:]
	}
	return args, file, nil
}

func usage(w io.Writer) {
	fmt.Fprintln(w, "usage: enthalpath [--data FILE] [COMMAND] [ARGS]")
	fmt.Fprintln(w, "       enthalpath --version")
	fmt.Fprintln(w, "\nWith no command, opens the interactive workshop.\n\nCommands:")
	fmt.Fprintln(w, "  open      the interactive workshop (optionally on a formula or cycle file)")
	fmt.Fprintln(w, "  serve     serve the workshop over SSH")
	for _, s := range cli.Summaries() {
		fmt.Fprintln(w, s)
	}
}
