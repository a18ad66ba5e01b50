//go:build unix

package fileio

import (
	"os"
	"syscall"
)

const openNonblock = syscall.O_NONBLOCK

// lock takes an exclusive advisory lock on f: blocking when wait, else
// failing at once when another process holds it.
func lock(f *os.File, wait bool) error {
	how := syscall.LOCK_EX
	if !wait {
		how |= syscall.LOCK_NB
	}
	return syscall.Flock(int(f.Fd()), how)
}
