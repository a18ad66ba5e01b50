//go:build unix

package fileio_test

import (
	"os"
	"syscall"
)

func mkfifo(path string) error { return syscall.Mkfifo(path, 0o600) }

func lockForTest(f *os.File) error {
	return syscall.Flock(int(f.Fd()), syscall.LOCK_EX|syscall.LOCK_NB)
}
