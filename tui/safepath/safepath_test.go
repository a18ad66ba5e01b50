package safepath

import (
	"errors"
	"os"
	"path/filepath"
	"strings"
	"testing"

	"enthalpath/thermo/fileio"
)

// The rules tested here are common practice for confining user-typed names
// to a folder, no source: refuse "..", absolute paths, NUL and control
// bytes, over-long names, and links that lead out.

// layout builds, under a fresh temporary directory:
//
//	outside/secret            a file the user must not reach
//	root/sub/file             an ordinary file
//	root/in -> sub            a relative link that stays inside
//	root/inabs -> ROOT/sub    an absolute link that stays inside
//	root/out -> ../outside    a link to a directory outside
//	root/sub/up -> ../..      a link that climbs out
//	root/secret -> OUT/secret a final component linking to a file outside
//	root/dangling -> nowhere  a link whose target does not exist
//	rootlink -> root          the folder reached through a link
func layout(t *testing.T) (base, root string) {
	t.Helper()
	base, err := filepath.EvalSymlinks(t.TempDir())
	if err != nil {
		t.Fatal(err)
	}
	root = filepath.Join(base, "root")
	outside := filepath.Join(base, "outside")
	for _, dir := range []string{filepath.Join(root, "sub"), outside} {
		if err := os.MkdirAll(dir, 0o700); err != nil {
			t.Fatal(err)
		}
	}
	for _, file := range []string{filepath.Join(root, "sub", "file"), filepath.Join(outside, "secret")} {
		if err := os.WriteFile(file, []byte("x"), 0o600); err != nil {
			t.Fatal(err)
		}
	}
	links := []struct{ target, link string }{
		{"sub", filepath.Join(root, "in")},
		{filepath.Join(root, "sub"), filepath.Join(root, "inabs")},
		{"../outside", filepath.Join(root, "out")},
		{"../..", filepath.Join(root, "sub", "up")},
		{filepath.Join(outside, "secret"), filepath.Join(root, "secret")},
		{"nowhere", filepath.Join(root, "dangling")},
		{"root", filepath.Join(base, "rootlink")},
	}
	for _, l := range links {
		if err := os.Symlink(l.target, l.link); err != nil {
			t.Fatal(err)
		}
	}
	return base, root
}

func TestJoin(t *testing.T) {
	base, root := layout(t)
	tests := []struct {
		name string
		want string // path relative to root when accepted
		err  error  // reason when refused
	}{
		{name: "NaCl.cycle", want: "NaCl.cycle"},
		{name: "sub/file", want: "sub/file"},
		{name: "./sub/../sub/file", err: ErrClimb},
		{name: "sub/new/deeper.cycle", want: "sub/new/deeper.cycle"},
		{name: "sub//file", want: "sub/file"},
		{name: "in/file", want: "sub/file"},
		{name: "inabs/file", want: "sub/file"},
		{name: "in", want: "sub"},
		{name: "..", err: ErrClimb},
		{name: "../outside/secret", err: ErrClimb},
		{name: "sub/../../outside/secret", err: ErrClimb},
		{name: "/etc/passwd", err: ErrAbsolute},
		{name: filepath.Join(base, "outside", "secret"), err: ErrAbsolute},
		{name: `\etc\passwd`, err: ErrAbsolute},
		{name: "~/notes", err: ErrHome},
		{name: "", err: ErrEmpty},
		{name: ".", err: ErrEmpty},
		{name: "a\x00b", err: ErrControl},
		{name: "bell\x07", err: ErrControl},
		{name: "esc\x1b[2J", err: ErrControl},
		{name: "c1\u009b2J", err: ErrControl},
		{name: strings.Repeat("a", MaxComponentLen+1), err: ErrTooLong},
		// A folder may take NAME_MAX; the file's own name less, for the
		// temporary name a save writes beside it (issue 11: a 245-byte
		// name passed and then failed on the temporary name).
		{name: strings.Repeat("a", MaxComponentLen) + "/x", want: strings.Repeat("a", MaxComponentLen) + "/x"},
		{name: strings.Repeat("a", fileio.MaxBaseName), want: strings.Repeat("a", fileio.MaxBaseName)},
		{name: strings.Repeat("a", fileio.MaxBaseName+1), err: ErrTooLong},
		{name: "evil\u202etxt.hesscycle", err: ErrInvisible},
		{name: "zero\u200bwidth", err: ErrInvisible},
		{name: "bom\ufeff", err: ErrInvisible},
		{name: "private\ue000use", err: ErrInvisible},
		{name: "line\u2028sep", err: ErrInvisible},
		{name: "bad\xffutf8", err: ErrInvisible},
		{name: "café cycles/NaCl", want: "café cycles/NaCl"},
		{name: strings.Repeat("abcdefgh/", MaxNameLen/9+1), err: ErrTooLong},
		{name: "out/secret", err: ErrLinkOutside},
		{name: "out/new.cycle", err: ErrLinkOutside},
		{name: "out", err: ErrLinkOutside},
		{name: "sub/up/outside/secret", err: ErrLinkOutside},
		{name: "secret", err: ErrLinkOutside},
		{name: "dangling", err: ErrDanglingLink},
		{name: "dangling/x", err: ErrDanglingLink},
		{name: "Ünïcödé name.cycle", want: "Ünïcödé name.cycle"},
	}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			got, err := Join(root, tt.name)
			if tt.err != nil {
				if !errors.Is(err, tt.err) {
					t.Fatalf("Join(root, %q) = %q, %v; want refusal %v", tt.name, got, err, tt.err)
				}
				var refused *RefusedError
				if !errors.As(err, &refused) || refused.Name != tt.name || refused.Hint == "" {
					t.Fatalf("Join(root, %q): error %v is not a RefusedError naming the input with a hint", tt.name, err)
				}
				return
			}
			if err != nil {
				t.Fatalf("Join(root, %q): unexpected error %v", tt.name, err)
			}
			if want := filepath.Join(root, tt.want); got != want {
				t.Fatalf("Join(root, %q) = %q, want %q", tt.name, got, want)
			}
		})
	}
}

// TestJoinRootThroughLink checks that a folder reached through a link still
// accepts its own files and still refuses the ways out.
func TestJoinRootThroughLink(t *testing.T) {
	base, root := layout(t)
	linked := filepath.Join(base, "rootlink")
	got, err := Join(linked, "sub/file")
	if err != nil || got != filepath.Join(root, "sub", "file") {
		t.Fatalf("Join(rootlink, sub/file) = %q, %v; want %q", got, err, filepath.Join(root, "sub", "file"))
	}
	if _, err := Join(linked, "out/secret"); !errors.Is(err, ErrLinkOutside) {
		t.Fatalf("Join(rootlink, out/secret) error = %v, want ErrLinkOutside", err)
	}
}

func TestJoinMissingRoot(t *testing.T) {
	_, err := Join(filepath.Join(t.TempDir(), "absent"), "x.cycle")
	if !errors.Is(err, ErrRootUnusable) || !errors.Is(err, os.ErrNotExist) {
		t.Fatalf("Join(absent root) error = %v, want ErrRootUnusable wrapping ErrNotExist", err)
	}
}

// TestJoinNeverLeaves is a property test: whatever ASCII name is typed,
// an accepted path lies inside the folder. Names are built from a small
// alphabet rich in separators, dots and link names; no randomness is needed
// since every name up to the length is tried.
func TestJoinNeverLeaves(t *testing.T) {
	_, root := layout(t)
	atoms := []string{"/", "..", ".", "sub", "in", "out", "up", "secret", "x", "~", "dangling"}
	var names []string
	var grow func(prefix string, depth int)
	grow = func(prefix string, depth int) {
		if prefix != "" {
			names = append(names, prefix)
		}
		if depth == 0 {
			return
		}
		for _, a := range atoms {
			grow(prefix+a, depth-1)
		}
	}
	grow("", 4)
	for _, name := range names {
		got, err := Join(root, name)
		if err != nil {
			continue
		}
		if !within(root, got) {
			t.Fatalf("Join(root, %q) = %q, outside %q", name, got, root)
		}
		if real, err := filepath.EvalSymlinks(filepath.Dir(got)); err == nil && !within(root, real) {
			t.Fatalf("Join(root, %q) = %q whose parent resolves to %q, outside", name, got, real)
		}
	}
	if len(names) < 10000 {
		t.Fatalf("only %d names tried", len(names))
	}
}

// TestRelGivesTheTypedName: a path Join returned is shown back as the name
// typed, also when the folder was configured through a link; a path
// outside the folder (or the folder itself) is not made relative.
func TestRelGivesTheTypedName(t *testing.T) {
	base, root := layout(t)
	link := filepath.Join(base, "rootlink")
	for _, r := range []string{root, link} {
		p, err := Join(r, "sub/new.hesscycle")
		if err != nil {
			t.Fatal(err)
		}
		if got, ok := Rel(r, p); !ok || got != filepath.Join("sub", "new.hesscycle") {
			t.Errorf("Rel(%s, %s) = %q, %v; want sub/new.hesscycle, true", r, p, got, ok)
		}
		for _, out := range []string{filepath.Join(base, "outside", "secret"), r, "/etc/passwd"} {
			if got, ok := Rel(r, out); ok || got != out {
				t.Errorf("Rel(%s, %s) = %q, %v; want the path unchanged and false", r, out, got, ok)
			}
		}
	}
}
