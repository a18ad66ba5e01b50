//go:build unix

// Platform shims for the tests of this package, not tests themselves: a
// named pipe (for the refusal of FIFOs) and an exclusive lock (for the
// stale-temporary-file rule), checked by the tests that call them.
package fileio_test

import (
	"os"
	"syscall"
)

func mkfifo(path string) error { return syscall.Mkfifo(path, 0o600) }

func lockForTest(f *os.File) error {
	return syscall.Flock(int(f.Fd()), syscall.LOCK_EX|syscall.LOCK_NB)
}
