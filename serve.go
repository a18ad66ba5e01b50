package main

import (
	"fmt"

	"enthalpath/cycle/cli"
)

// runServe starts the SSH server; replaced when tui/serve lands.
func runServe(env cli.Env, args []string) int {
	fmt.Fprintln(env.Stderr, "enthalpath serve: not built yet")
	return cli.ExitInternal
}
