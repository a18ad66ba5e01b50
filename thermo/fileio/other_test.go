//go:build !unix

// Platform shims for the tests of this package, not tests themselves:
// where named pipes and file locks do not exist, the tests that need them
// are told so by these errors and skip.
package fileio_test

import (
	"errors"
	"os"
)

func mkfifo(string) error { return errors.New("no named pipes here") }

func lockForTest(*os.File) error { return errors.New("no file locks here") }
