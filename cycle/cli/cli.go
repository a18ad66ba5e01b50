// Package cli runs enthalpath's non-interactive subcommands (madelung, data,
// cycle, compare, estimate, scan, solution, radius, ionfit, batch, orderings, completion) and prints their
// results as text, JSON or CSV. main hands it every subcommand except the
// interactive ones (the TUI and serve), so this package never imports tui.
package cli

import (
	"errors"
	"fmt"
	"io"
)

// Exit codes.
const (
	ExitOK       = 0
	ExitInternal = 1
	ExitUsage    = 2
)

// Env is what a command runs with: its streams and its arguments after the
// command name. Nothing is global.
type Env struct {
	Stdout io.Writer
	Stderr io.Writer
	Stdin  io.Reader
	// DataFile is a user overlay named with --data before the command, or "".
	DataFile string
}

// UsageError is an error in the command line or an input file: exit code 2.
type UsageError struct{ Err error }

func (e *UsageError) Error() string { return e.Err.Error() }
func (e *UsageError) Unwrap() error { return e.Err }

// Usagef makes a UsageError.
func Usagef(format string, args ...any) error {
	return &UsageError{fmt.Errorf(format, args...)}
}

type command struct {
	name    string
	summary string
	run     func(env Env, args []string) error
}

// commands is the fixed table of subcommands; each run function lives in the
// file named after its command.
func commands() []command {
	return []command{
		{"madelung", "Madelung constant, Ewald energy and site potentials of a structure", runMadelung},
		{"data", "show an element, ion or compound with values, uncertainties and sources", runData},
		{"cycle", "build and solve a Born–Haber cycle", runCycle},
		{"compare", "cycle lattice value against the ionic models, one row per compound", runCompare},
		{"estimate", "formation enthalpy of a hypothetical compound from a model lattice energy", runEstimate},
		{"scan", "formation enthalpies across oxidation states and their disproportionations", runScan},
		{"stability", "decompositions with ΔrG(T), verdicts beyond 2σ, temperatures of gas loss", runStability},
		{"solution", "enthalpy of solution cycle", runSolution},
		{"radius", "thermochemical radius derived from a cycle lattice energy", runRadius},
		{"ionfit", "gas-phase enthalpy of an ion fitted over its salts (SO4^2-, O2-, ...)", runIonfit},
		{"batch", "solve many formulas from a CSV file", runBatch},
		{"completion", "print a shell completion script: bash, zsh or fish", runCompletion},
		{"orderings", "rank orderings of ions and vacancies on mixed sites by Ewald energy", runOrderings},
		{"trust", "how far each lattice model can be trusted: its gaps to the cycles of the built-in compounds, by family", runTrust},
	}
}

// Has reports whether name is a subcommand of this package.
func Has(name string) bool {
	for _, c := range commands() {
		if c.name == name {
			return true
		}
	}
	return false
}

// Summaries returns "name: summary" lines for the main usage message.
func Summaries() []string {
	var out []string
	for _, c := range commands() {
		out = append(out, fmt.Sprintf("  %-9s %s", c.name, c.summary))
	}
	return out
}

// Run executes subcommand name with args and returns the process exit code.
// It never panics: an internal panic is reported as exit code 1.
func Run(env Env, name string, args []string) (code int) {
	defer func() {
		if r := recover(); r != nil {
			fmt.Fprintf(env.Stderr, "enthalpath %s: internal error: %v\n", name, r)
			code = ExitInternal
		}
	}()
	for _, c := range commands() {
		if c.name != name {
			continue
		}
		out := &checkedWriter{w: env.Stdout}
		env.Stdout = out
		err := c.run(env, args)
		if err == nil && out.err != nil {
			// Text output is printed as it goes: a full disk or a closed
			// pipe is found here, once, for every command.
			err = fmt.Errorf("writing the output: %w", out.err)
		}
		if err == nil {
			return ExitOK
		}
		fmt.Fprintf(env.Stderr, "enthalpath %s: %s\n", name, commandLineText(err))
		var ue *UsageError
		if errors.As(err, &ue) {
			return ExitUsage
		}
		return ExitInternal
	}
	fmt.Fprintf(env.Stderr, "enthalpath: unknown command %q\n", name)
	return ExitUsage
}

// checkedWriter keeps the first error of its writer and refuses every
// later write, so a command's output stops at the first failure and Run
// can report it.
type checkedWriter struct {
	w   io.Writer
	err error
}

func (c *checkedWriter) Write(p []byte) (int, error) {
	if c.err != nil {
		return 0, c.err
	}
	n, err := c.w.Write(p)
	if err == nil && n < len(p) {
		err = io.ErrShortWrite
	}
	c.err = err
	return n, err
}
