package cli

import "errors"

// ExitCode is the status the process ends with: one of the codes below
// and no other. The README's table of exit codes is checked against
// exitCodes (TestReadmeExitCodes).
type ExitCode int

const (
	// ExitOK: the command did what it was asked.
	ExitOK ExitCode = 0
	// ExitInternal: a fault of the program, or output that cannot be
	// written (a full disk, a closed pipe).
	ExitInternal ExitCode = 1
	// ExitUsage: bad usage or input (a UsageError).
	ExitUsage ExitCode = 2
)

// exitCodes describes each code, for the usage and the README.
func exitCodes() []struct {
	code    ExitCode
	meaning string
} {
	return []struct {
		code    ExitCode
		meaning string
	}{
		{ExitOK, "success"},
		{ExitInternal, "internal error, or output that cannot be written (a full disk, a closed pipe)"},
		{ExitUsage, "bad usage or input: an unknown command or flag, a value out of its bounds, a file that cannot be read, an output file that cannot be written where it was named"},
	}
}

// exitCodeOf is the exit code of a command's error.
func exitCodeOf(err error) ExitCode {
	var ue *UsageError
	switch {
	case err == nil:
		return ExitOK
	case errors.As(err, &ue):
		return ExitUsage
	}
	return ExitInternal
}
