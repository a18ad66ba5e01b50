//go:build unix

// Platform shims for the tests of this package: a named pipe (for the
// refusal of FIFOs) and an exclusive lock (for the stale-temporary-file
// rule), with a test that they do what those tests rely on.
package fileio_test

import (
	"os"
	"path/filepath"
	"syscall"
	"testing"
)

func mkfifo(path string) error { return syscall.Mkfifo(path, 0o600) }

func lockForTest(f *os.File) error {
	return syscall.Flock(int(f.Fd()), syscall.LOCK_EX|syscall.LOCK_NB)
}

// TestShimsDoWhatTheTestsNeed: mkfifo makes a named pipe (the mode the
// refusal of FIFOs is tested on), and lockForTest takes a lock that a
// second open of the same file cannot take while it is held (flock(2):
// locks belong to the open file description).
func TestShimsDoWhatTheTestsNeed(t *testing.T) {
	dir := t.TempDir()
	pipe := filepath.Join(dir, "pipe")
	if err := mkfifo(pipe); err != nil {
		t.Fatalf("mkfifo: %v", err)
	}
	if info, err := os.Lstat(pipe); err != nil || info.Mode()&os.ModeNamedPipe == 0 {
		t.Fatalf("mkfifo made %v (err %v), want a named pipe", info, err)
	}
	path := filepath.Join(dir, "locked")
	first, err := os.Create(path)
	if err != nil {
		t.Fatal(err)
	}
	defer first.Close()
	if err := lockForTest(first); err != nil {
		t.Fatalf("first lock: %v", err)
	}
	second, err := os.Open(path)
	if err != nil {
		t.Fatal(err)
	}
	defer second.Close()
	if err := lockForTest(second); err == nil {
		t.Error("a second open of the file took the lock the first holds")
	}
}
