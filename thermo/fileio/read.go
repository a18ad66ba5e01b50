package fileio

import (
	"bytes"
	"io"
	"os"
)

// ReadFile reads the regular file at path (a link to one is followed),
// holding at most limit bytes. It refuses a folder, device, pipe or socket
// with a *NotRegularError without reading from it, and a file of more than
// limit bytes with a *TooLargeError. Other errors are the *fs.PathError of
// the operating system.
func ReadFile(path string, limit int64) ([]byte, error) {
	// Non-blocking, so that opening a named pipe with no writer returns at
	// once and is refused below instead of waiting forever.
	f, err := os.OpenFile(path, os.O_RDONLY|openNonblock, 0)
	if err != nil {
		return nil, err
	}
	defer f.Close()
	st, err := f.Stat()
	if err != nil {
		return nil, err
	}
	if !st.Mode().IsRegular() {
		return nil, &NotRegularError{Path: path, Kind: kind(st.Mode())}
	}
	if st.Size() > limit {
		return nil, &TooLargeError{Path: path, Limit: limit}
	}
	var buf bytes.Buffer
	buf.Grow(int(min(st.Size(), limit)) + 1)
	// The size may change while reading: the cap holds whatever the file does.
	if _, err := buf.ReadFrom(io.LimitReader(f, limit+1)); err != nil {
		return nil, &os.PathError{Op: "read", Path: path, Err: err}
	}
	if int64(buf.Len()) > limit {
		return nil, &TooLargeError{Path: path, Limit: limit}
	}
	return buf.Bytes(), nil
}
