//go:build !unix

// Platform shims for the tests of this package: where named pipes and
// file locks do not exist, the tests that need them are told so by these
// errors and skip; a test holds the shims to that.
package fileio_test

import (
	"errors"
	"os"
	"testing"
)

func mkfifo(string) error { return errors.New("no named pipes here") }

func lockForTest(*os.File) error { return errors.New("no file locks here") }

// TestShimsRefuse: without named pipes and file locks, both shims return
// an error (the tests that need them skip on it) and make nothing.
func TestShimsRefuse(t *testing.T) {
	pipe := t.TempDir() + string(os.PathSeparator) + "pipe"
	if err := mkfifo(pipe); err == nil {
		t.Error("mkfifo returned no error where named pipes do not exist")
	}
	if _, err := os.Lstat(pipe); !errors.Is(err, os.ErrNotExist) {
		t.Errorf("mkfifo left %s (Lstat error %v)", pipe, err)
	}
	if err := lockForTest(nil); err == nil {
		t.Error("lockForTest returned no error where file locks do not exist")
	}
}
