//go:build !unix

package fileio

import (
	"errors"
	"os"
)

const openNonblock = 0

// lock is unavailable here: stale temporary files are then left alone.
func lock(f *os.File, wait bool) error {
	if wait {
		return nil
	}
	return errors.New("file locks are not available on this system")
}
