package main

import (
	"fmt"

	"enthalpath/cycle/cli"
)

// runWorkshop starts the terminal UI; replaced when tui lands.
func runWorkshop(env cli.Env, args []string) int {
	fmt.Fprintln(env.Stderr, "enthalpath: the interactive workshop is not built yet")
	return cli.ExitInternal
}
