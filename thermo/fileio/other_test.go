//go:build !unix

package fileio_test

import (
	"errors"
	"os"
)

func mkfifo(string) error { return errors.New("no named pipes here") }

func lockForTest(*os.File) error { return errors.New("no file locks here") }
