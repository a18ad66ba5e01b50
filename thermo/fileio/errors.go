package fileio

import (
	"fmt"
	"io/fs"
)

// NotRegularError refuses a path that is not a regular file: reading a
// device, pipe or folder, or replacing a link, device or folder.
type NotRegularError struct {
	Path string
	Kind string // "a folder", "a symbolic link", "a device", "a named pipe", "a socket", "not a regular file"
	// Replace is true when the path was to be written over, false when read.
	Replace bool
}

func (e *NotRegularError) Error() string {
	if e.Replace {
		return fmt.Sprintf("%s is %s, not a regular file; it is not replaced: choose another name", e.Path, e.Kind)
	}
	return fmt.Sprintf("%s is %s, not a regular file; give a regular file", e.Path, e.Kind)
}

// TooLargeError refuses a file above the reader's byte cap.
type TooLargeError struct {
	Path  string
	Limit int64 // bytes
}

func (e *TooLargeError) Error() string {
	return fmt.Sprintf("%s is larger than %s, the most this kind of file may have", e.Path, Size(e.Limit))
}

// NameError refuses a base name too long to write safely.
type NameError struct {
	Name string // the base name
	Max  int    // bytes
}

func (e *NameError) Error() string {
	return fmt.Sprintf("the file name %q is %d bytes long; use at most %d", shorten(e.Name), len(e.Name), e.Max)
}

// Size prints a byte count as "1 MiB", "512 KiB" or "100 bytes".
func Size(n int64) string {
	switch {
	case n >= 1<<20 && n%(1<<20) == 0:
		return fmt.Sprintf("%d MiB", n>>20)
	case n >= 1<<10 && n%(1<<10) == 0:
		return fmt.Sprintf("%d KiB", n>>10)
	}
	return fmt.Sprintf("%d bytes", n)
}

// kind names what a file mode is, for NotRegularError.
func kind(m fs.FileMode) string {
	switch {
	case m.IsDir():
		return "a folder"
	case m&fs.ModeSymlink != 0:
		return "a symbolic link"
	case m&fs.ModeDevice != 0 || m&fs.ModeCharDevice != 0:
		return "a device"
	case m&fs.ModeNamedPipe != 0:
		return "a named pipe"
	case m&fs.ModeSocket != 0:
		return "a socket"
	}
	return "not a regular file"
}

func shorten(s string) string {
	r := []rune(s)
	if len(r) <= 40 {
		return s
	}
	return string(r[:20]) + "…" + string(r[len(r)-19:])
}
