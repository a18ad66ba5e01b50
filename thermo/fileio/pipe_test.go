//go:build unix

package fileio_test

import (
	"errors"
	"path/filepath"
	"testing"

	"enthalpath/thermo/fileio"
)

// TestReadFilePipeDoesNotBlock: a named pipe with no writer (a cycle file
// naming a FIFO as its CIF once hung the program) is refused at once.
func TestReadFilePipeDoesNotBlock(t *testing.T) {
	pipe := filepath.Join(t.TempDir(), "pipe.cif")
	if err := mkfifo(pipe); err != nil {
		t.Skip(err)
	}
	_, err := fileio.ReadFile(pipe, 1<<20)
	var nr *fileio.NotRegularError
	if !errors.As(err, &nr) || nr.Kind != "a named pipe" {
		t.Fatalf("err = %v, want a named pipe refused", err)
	}
}
