// Package cli is enthalpath's command line: the one command table
// (commands.go) that drives dispatch, usage, each command's help and shell
// completion; the global flags (globals.go); the exit codes (exitcode.go);
// and the non-interactive commands, each in the file named after it, which
// print their results as text, JSON or CSV. The interactive commands (the
// workshop and serve) are handed in by main from tui/launch, so this
// package never imports tui.
package cli

import (
	"fmt"
	"io"
)

// Env is what a command runs with: its streams and its arguments after the
// command name. Nothing is global.
type Env struct {
	Stdout io.Writer
	Stderr io.Writer
	Stdin  io.Reader
	// DataFile is a user overlay named with --data, or "".
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
