// Command enthalpath builds thermochemical (Born–Haber) cycles of ionic
// solids, computes Madelung constants by Ewald summation and compares the
// cycle's lattice energy with ionic models.
//
// Run "enthalpath help" for the commands, the global flags and the exit
// codes. The command line lives in cycle/cli; the workshop and the SSH
// server, which it starts, in tui/launch.
package main

import (
	"os"

	"enthalpath/cycle/cli"
	"enthalpath/tui/launch"
)

func main() {
	env := cli.Env{Stdout: os.Stdout, Stderr: os.Stderr, Stdin: os.Stdin}
	os.Exit(int(cli.Main(env, os.Args[1:], cli.Interactive{Workshop: launch.Workshop, Serve: launch.Serve})))
}
