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
// Run "enthalpath help" for the list of commands, and "enthalpath COMMAND
// --help" for a command's flags. Exit codes: 0 success, 2 bad usage or
// input, 1 internal error.
package main

import (
	"fmt"
	"os"

	"enthalpath/cycle/cli"
)

func main() {
	os.Exit(run(os.Args[1:]))
}

func run(args []string) int {
	env := cli.Env{Stdout: os.Stdout, Stderr: os.Stderr, Stdin: os.Stdin}
	for len(args) >= 2 && (args[0] == "--data" || args[0] == "-data") {
		env.DataFile = args[1]
		args = args[2:]
	}
	if len(args) == 0 {
		return runWorkshop(env, nil)
	}
	switch name := args[0]; {
	case name == "help" || name == "-h" || name == "--help":
		usage(os.Stdout)
		return cli.ExitOK
	case name == "tui" || name == "open":
		return runWorkshop(env, args[1:])
	case name == "serve":
		return runServe(env, args[1:])
	case cli.Has(name):
		return cli.Run(env, name, args[1:])
	default:
		fmt.Fprintf(os.Stderr, "enthalpath: unknown command %q\n\n", name)
		usage(os.Stderr)
		return cli.ExitUsage
	}
}

func usage(w *os.File) {
	fmt.Fprintln(w, "usage: enthalpath [--data FILE] [COMMAND] [ARGS]")
	fmt.Fprintln(w, "\nWith no command, opens the interactive workshop.\n\nCommands:")
	fmt.Fprintln(w, "  open      the interactive workshop (optionally on a formula or cycle file)")
	fmt.Fprintln(w, "  serve     serve the workshop over SSH")
	for _, s := range cli.Summaries() {
		fmt.Fprintln(w, s)
	}
}
