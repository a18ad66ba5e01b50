package safepath

import (
	"errors"
	"os"
	"path/filepath"
	"strings"
	"testing"
	"unicode"
)

// FuzzJoin: any typed name is refused with a *RefusedError, or resolved to
// a path inside the folder (Rel finds it there) whose name shows only
// visible characters; never a panic. The folder holds a link leading out,
// so escapes through it are tried too. Seeds: the names of TestJoin's
// table and the U+202E.
func FuzzJoin(f *testing.F) {
	base := f.TempDir()
	root := filepath.Join(base, "root")
	outside := filepath.Join(base, "outside")
	for _, d := range []string{filepath.Join(root, "sub"), outside} {
		if err := os.MkdirAll(d, 0o700); err != nil {
			f.Fatal(err)
		}
	}
	if err := os.Symlink(outside, filepath.Join(root, "out")); err != nil {
		f.Fatal(err)
	}
	if err := os.Symlink(filepath.Join(root, "sub"), filepath.Join(root, "in")); err != nil {
		f.Fatal(err)
	}
	for _, seed := range []string{
		"NaCl.hesscycle", "sub/KBr.hesscycle", "in/x", "../x", "sub/../../x", "/etc/passwd", `\x`, "~/x",
		"", ".", "a\x00b", "esc\x1b[2J", "out/secret", "out", "evil\u202etxt.hesscycle", "zero\u200bwidth",
		strings.Repeat("a", 300), "bad\xffutf8", "café/NaCl",
	} {
		f.Add(seed)
	}
	f.Fuzz(func(t *testing.T, name string) {
		path, err := Join(root, name)
		if err != nil {
			var re *RefusedError
			if !errors.As(err, &re) || re.Name != name {
				t.Fatalf("Join(%q): error %v (%T) is not a RefusedError naming it", name, err, err)
			}
			return
		}
		rel, ok := Rel(root, path)
		if !ok || rel == ".." || strings.HasPrefix(rel, ".."+string(filepath.Separator)) || filepath.IsAbs(rel) {
			t.Fatalf("Join(%q) = %q, outside the folder (rel %q, %v)", name, path, rel, ok)
		}
		for _, r := range name {
			if !unicode.IsPrint(r) && r != ' ' {
				t.Fatalf("Join(%q) accepted U+%04X", name, r)
			}
		}
	})
}
