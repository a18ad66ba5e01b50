//go:build unix

package data

import (
	"errors"
	"os"
	"path/filepath"
	"strings"
	"syscall"
	"testing"
)

// TestOverlayLimits: a user data file is read only when it is a regular
// file of at most MaxOverlaySize bytes, and a compound count beyond what a
// formula may hold is refused at its line (it once loaded and then failed
// later without naming the file).
func TestOverlayLimits(t *testing.T) {
	dir := t.TempDir()
	big := filepath.Join(dir, "big.toml")
	os.WriteFile(big, []byte(strings.Repeat("# padding\n", MaxOverlaySize/10+1)), 0o644)
	count := filepath.Join(dir, "count.toml")
	os.WriteFile(count, []byte("[[compound]]\nformula = \"NaCl\"\ncation_count = 1000000000000\n"), 0o644)
	deep := filepath.Join(dir, "deep.toml")
	os.WriteFile(deep, []byte("a = "+strings.Repeat("[", 100000)+"\n"), 0o644)
	pipe := filepath.Join(dir, "pipe.toml")
	cases := []struct {
		name, path, want string
	}{
		{"too large", big, "larger than the 1 MiB"},
		{"count beyond a formula's", count, `line 3 field "cation_count": count 1000000000000 must be between 1 and 999999`},
		{"a folder", dir, "a folder, not a regular file"},
		// Decoded, 1 MiB of brackets took 7.6 s and 465 MB to refuse.
		{"nesting deeper than a decoder should recurse", deep, "line 1 column 13: arrays or inline tables nested more than 8 deep"},
	}
	if _, err := os.Stat("/dev/zero"); err == nil {
		cases = append(cases, struct{ name, path, want string }{"a device", "/dev/zero", "a device, not a regular file"})
	}
	if syscall.Mkfifo(pipe, 0o600) == nil {
		cases = append(cases, struct{ name, path, want string }{"a named pipe (must not block)", pipe, "a named pipe"})
	}
	for _, tc := range cases {
		t.Run(tc.name, func(t *testing.T) {
			db, err := LoadWithUserFile(tc.path)
			var te *TableError
			if !errors.As(err, &te) || !strings.Contains(err.Error(), tc.want) || !strings.HasPrefix(err.Error(), tc.path) {
				t.Fatalf("err = %v; want a TableError naming %s and saying %q", err, tc.path, tc.want)
			}
			if db == nil {
				t.Error("the built-in data are not returned beside the error")
			}
		})
	}
}
