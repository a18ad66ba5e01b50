package fileio_test

import (
	"errors"
	"io"
	"os"
	"path/filepath"
	"slices"
	"strings"
	"sync"
	"testing"

	"enthalpath/thermo/fileio"
)

func write(t *testing.T, path, content string, perm os.FileMode) {
	t.Helper()
	if err := os.WriteFile(path, []byte(content), perm); err != nil {
		t.Fatal(err)
	}
}

func text(s string) func(io.Writer) error {
	return func(w io.Writer) error { _, err := io.WriteString(w, s); return err }
}

// leftovers lists the temporary files left in dir.
func leftovers(t *testing.T, dir string) []string {
	t.Helper()
	var out []string
	entries, _ := os.ReadDir(dir)
	for _, e := range entries {
		if strings.Contains(e.Name(), ".tmp-") {
			out = append(out, e.Name())
		}
	}
	return out
}

func TestReadFile(t *testing.T) {
	dir := t.TempDir()
	small := filepath.Join(dir, "small")
	write(t, small, "0123456789", 0o644)
	link := filepath.Join(dir, "link")
	if err := os.Symlink(small, link); err != nil {
		t.Fatal(err)
	}
	for _, tc := range []struct {
		name  string
		path  string
		limit int64
		want  string
		err   any
	}{
		{"under the cap", small, 100, "0123456789", nil},
		{"exactly the cap", small, 10, "0123456789", nil},
		{"one byte over the cap", small, 9, "", new(*fileio.TooLargeError)},
		{"a link to a regular file is read", link, 10, "0123456789", nil},
		{"a folder", dir, 10, "", new(*fileio.NotRegularError)},
	} {
		t.Run(tc.name, func(t *testing.T) {
			got, err := fileio.ReadFile(tc.path, tc.limit)
			if tc.err != nil {
				if !errors.As(err, tc.err) {
					t.Fatalf("err = %v, want %T", err, tc.err)
				}
				return
			}
			if err != nil || string(got) != tc.want {
				t.Fatalf("got %q, %v; want %q", got, err, tc.want)
			}
		})
	}
}

// TestReadFileDevice: /dev/zero (the file a hostile cycle file names as its
// CIF) is refused without reading a byte.
func TestReadFileDevice(t *testing.T) {
	if _, err := os.Stat("/dev/zero"); err != nil {
		t.Skip("no /dev/zero here")
	}
	_, err := fileio.ReadFile("/dev/zero", 1<<20)
	var nr *fileio.NotRegularError
	if !errors.As(err, &nr) || nr.Kind != "a device" {
		t.Fatalf("err = %v, want a device refused", err)
	}
}

func TestWriteAtomicKeepsModeAndReplaces(t *testing.T) {
	dir := t.TempDir()
	p := filepath.Join(dir, "kept.hesscycle")
	write(t, p, "old", 0o600)
	if err := os.Chmod(p, 0o600); err != nil {
		t.Fatal(err)
	}
	if err := fileio.WriteAtomic(p, 0o644, text("new")); err != nil {
		t.Fatal(err)
	}
	st, err := os.Stat(p)
	if err != nil {
		t.Fatal(err)
	}
	if st.Mode().Perm() != 0o600 {
		t.Errorf("mode %v after replacing a 0600 file, want 0600", st.Mode().Perm())
	}
	if b, _ := os.ReadFile(p); string(b) != "new" {
		t.Errorf("content %q", b)
	}
	fresh := filepath.Join(dir, "fresh")
	if err := fileio.WriteAtomic(fresh, 0o640, text("x")); err != nil {
		t.Fatal(err)
	}
	if st, _ := os.Stat(fresh); st.Mode().Perm() != 0o640 {
		t.Errorf("new file mode %v, want 0640", st.Mode().Perm())
	}
	if l := leftovers(t, dir); len(l) > 0 {
		t.Errorf("temporary files left: %v", l)
	}
}

// TestWriteAtomicRefusesNonRegular: a symbolic link, a folder and a named
// pipe at the path are refused and stay as they were.
func TestWriteAtomicRefusesNonRegular(t *testing.T) {
	dir := t.TempDir()
	target := filepath.Join(dir, "target")
	write(t, target, "target", 0o644)
	link := filepath.Join(dir, "link.hesscycle")
	if err := os.Symlink(target, link); err != nil {
		t.Fatal(err)
	}
	folder := filepath.Join(dir, "folder.hesscycle")
	if err := os.Mkdir(folder, 0o755); err != nil {
		t.Fatal(err)
	}
	cases := []struct {
		path, kind string
	}{{link, "a symbolic link"}, {folder, "a folder"}}
	if pipe := filepath.Join(dir, "pipe.hesscycle"); mkfifo(pipe) == nil {
		cases = append(cases, struct{ path, kind string }{pipe, "a named pipe"})
	}
	for _, tc := range cases {
		before, _ := os.Lstat(tc.path)
		err := fileio.WriteAtomic(tc.path, 0o644, text("new"))
		var nr *fileio.NotRegularError
		if !errors.As(err, &nr) || nr.Kind != tc.kind || !nr.Replace {
			t.Errorf("%s: err = %v, want %s refused", tc.path, err, tc.kind)
		}
		if !strings.Contains(err.Error(), "not replaced") {
			t.Errorf("message %q does not say it is not replaced", err)
		}
		after, _ := os.Lstat(tc.path)
		if after.Mode() != before.Mode() || !os.SameFile(before, after) {
			t.Errorf("%s changed: %v → %v", tc.path, before.Mode(), after.Mode())
		}
	}
	if b, _ := os.ReadFile(target); string(b) != "target" {
		t.Errorf("the link's target was written: %q", b)
	}
	if l := leftovers(t, dir); len(l) > 0 {
		t.Errorf("temporary files left: %v", l)
	}
}

func TestWriteAtomicFailedWriteKeepsOld(t *testing.T) {
	dir := t.TempDir()
	p := filepath.Join(dir, "a")
	write(t, p, "old", 0o644)
	boom := errors.New("boom")
	if err := fileio.WriteAtomic(p, 0o644, func(io.Writer) error { return boom }); err != boom {
		t.Fatalf("err = %v, want the writer's own", err)
	}
	if b, _ := os.ReadFile(p); string(b) != "old" {
		t.Errorf("content %q after a failed write", b)
	}
	if l := leftovers(t, dir); len(l) > 0 {
		t.Errorf("temporary files left: %v", l)
	}
}

// TestStaleTemporaryCleaned: a temporary file left by a writer that died
// (kill -9 during the sync) goes at the next write of the same name; one a
// live writer holds (locked) stays; names of another file stay.
func TestStaleTemporaryCleaned(t *testing.T) {
	dir := t.TempDir()
	stale := filepath.Join(dir, ".NaCl.hesscycle.tmp-123456")
	write(t, stale, "half", 0o600)
	other := filepath.Join(dir, ".KBr.hesscycle.tmp-99")
	write(t, other, "x", 0o600)
	notOurs := filepath.Join(dir, ".NaCl.hesscycle.tmp-notes")
	write(t, notOurs, "x", 0o600)
	live := filepath.Join(dir, ".NaCl.hesscycle.tmp-777")
	write(t, live, "busy", 0o600)
	held, err := os.Open(live)
	if err != nil {
		t.Fatal(err)
	}
	defer held.Close()
	if err := lockForTest(held); err != nil {
		t.Skipf("no file locks: %v", err)
	}
	if err := fileio.WriteAtomic(filepath.Join(dir, "NaCl.hesscycle"), 0o644, text("new")); err != nil {
		t.Fatal(err)
	}
	for path, want := range map[string]bool{stale: false, other: true, notOurs: true, live: true} {
		_, err := os.Lstat(path)
		if exists := err == nil; exists != want {
			t.Errorf("%s exists = %v, want %v", filepath.Base(path), exists, want)
		}
	}
}

func TestLongNameRefusedBeforeWriting(t *testing.T) {
	dir := t.TempDir()
	long := strings.Repeat("n", 245) + ".hesscycle" // fits NAME_MAX, not with the temporary suffix
	err := fileio.WriteAtomic(filepath.Join(dir, long), 0o644, text("x"))
	var ne *fileio.NameError
	if !errors.As(err, &ne) || ne.Max != fileio.MaxBaseName {
		t.Fatalf("err = %v, want a NameError with the limit", err)
	}
	if entries, _ := os.ReadDir(dir); len(entries) != 0 {
		t.Errorf("files created: %v", entries)
	}
}

// TestWriteNewNeverReplaces: successive writes to the same name keep every
// earlier file, numbered as Series lists them.
func TestWriteNewNeverReplaces(t *testing.T) {
	dir := t.TempDir()
	p := filepath.Join(dir, "recovery.hesscycle")
	var got []string
	for _, content := range []string{"NaCl", "KBr", "MgO"} {
		if next := fileio.NextFree(p); next != fileio.Numbered(p, len(got)+1) {
			t.Errorf("NextFree = %s before write %d", next, len(got)+1)
		}
		name, err := fileio.WriteNew(p, 0o600, []byte(content))
		if err != nil {
			t.Fatal(err)
		}
		got = append(got, name)
	}
	want := []string{p, filepath.Join(dir, "recovery-2.hesscycle"), filepath.Join(dir, "recovery-3.hesscycle")}
	if !slices.Equal(got, want) {
		t.Fatalf("names %v, want %v", got, want)
	}
	for i, content := range []string{"NaCl", "KBr", "MgO"} {
		if b, _ := os.ReadFile(want[i]); string(b) != content {
			t.Errorf("%s holds %q, want %q", want[i], b, content)
		}
		if st, _ := os.Stat(want[i]); st.Mode().Perm() != 0o600 {
			t.Errorf("%s mode %v", want[i], st.Mode().Perm())
		}
	}
	series := fileio.Series(p)
	slices.Sort(series)
	slices.Sort(want)
	if !slices.Equal(series, want) {
		t.Errorf("Series = %v, want %v", series, want)
	}
	if l := leftovers(t, dir); len(l) > 0 {
		t.Errorf("temporary files left: %v", l)
	}
}

// TestWriteNewConcurrent: writers at once get different names, all of the
// series (a second concurrent keep once wrote recovery-2-2, never offered).
func TestWriteNewConcurrent(t *testing.T) {
	dir := t.TempDir()
	p := filepath.Join(dir, "recovery.hesscycle")
	const writers = 16
	names := make([]string, writers)
	var wg sync.WaitGroup
	for i := range writers {
		wg.Go(func() {
			name, err := fileio.WriteNew(p, 0o600, []byte{byte('a' + i)})
			if err != nil {
				t.Error(err)
			}
			names[i] = name
		})
	}
	wg.Wait()
	slices.Sort(names)
	if len(slices.Compact(slices.Clone(names))) != writers {
		t.Fatalf("names repeat: %v", names)
	}
	series := fileio.Series(p)
	slices.Sort(series)
	if !slices.Equal(series, names) {
		t.Errorf("Series = %v\nwritten = %v", series, names)
	}
}

// TestSeriesIgnoresLookalikes: only the names WriteNew writes are listed.
func TestSeriesIgnoresLookalikes(t *testing.T) {
	dir := t.TempDir()
	p := filepath.Join(dir, "recovery.hesscycle")
	for _, n := range []string{"recovery-02.hesscycle", "recovery-2-2.hesscycle", "recovery-x.hesscycle", "recovery-1.hesscycle", "recovery-4.hesscycle"} {
		write(t, filepath.Join(dir, n), "x", 0o600)
	}
	if got := fileio.Series(p); len(got) != 1 || filepath.Base(got[0]) != "recovery-4.hesscycle" {
		t.Errorf("Series = %v, want only recovery-4.hesscycle", got)
	}
}

func TestCheckTOMLNesting(t *testing.T) {
	deep := strings.Repeat("[", fileio.MaxTOMLNesting+1) + strings.Repeat("]", fileio.MaxTOMLNesting+1)
	for _, tc := range []struct {
		name, text string
		line       int // 0: accepted
	}{
		{"a cycle file's shape", "[models]\nrho = 0.3\n[[step]]\nkey = \"lattice\"\nv = [1, [2, {a = 3}]]\n", 0},
		{"as deep as allowed", "a = " + deep[1:len(deep)-1] + "\n", 0},
		{"one level deeper", "x = 1\na = " + deep + "\n", 2},
		{"brackets in strings do not count", `a = "` + deep + `"` + "\nb = '" + deep + "'\n", 0},
		{"nor in multi-line strings", "a = \"\"\"\n" + deep + "\n\"\"\"\nb = '''" + deep + "'''\n", 0},
		{"nor in comments", "# " + deep + "\n", 0},
		{"an escaped quote does not end a string", `a = "\"` + deep + `"` + "\n", 0},
		{"inline tables count", "a = " + strings.Repeat("{b=", 40) + "1" + strings.Repeat("}", 40) + "\n", 1},
	} {
		err := fileio.CheckTOMLNesting([]byte(tc.text))
		var ne *fileio.NestingError
		switch {
		case tc.line == 0 && err != nil:
			t.Errorf("%s: refused: %v", tc.name, err)
		case tc.line != 0 && (!errors.As(err, &ne) || ne.Line != tc.line):
			t.Errorf("%s: err = %v, want a NestingError on line %d", tc.name, err, tc.line)
		}
	}
}
