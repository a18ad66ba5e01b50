package recovery

import (
	"os"
	"path/filepath"
	"strings"
	"testing"

	"enthalpath/cycle"
	"enthalpath/data"
)

// TestKeepNeverReplaces: the keeper writes the path, then the next free
// name of its series for other work (never over an earlier file: the
// package's contract), and the same work twice to the same file.
func TestKeepNeverReplaces(t *testing.T) {
	db, err := data.Load()
	if err != nil {
		t.Fatal(err)
	}
	dir := t.TempDir()
	k := &Keeper{Path: filepath.Join(dir, "recovery.hesscycle")}
	nacl, err := cycle.Build(db, "NaCl", cycle.Options{})
	if err != nil {
		t.Fatal(err)
	}
	first, err := k.Keep(nacl)
	if err != nil || first != k.Path {
		t.Fatalf("first keep: %q, %v", first, err)
	}
	again, _ := k.Keep(nacl)
	if again != first {
		t.Errorf("the same work kept twice: %q then %q", first, again)
	}
	if next := k.Next(); next == first || !strings.Contains(next, "recovery-2") {
		t.Errorf("next free name %q", next)
	}
	mgo, err := cycle.Build(db, "MgO", cycle.Options{})
	if err != nil {
		t.Fatal(err)
	}
	second, err := k.Keep(mgo)
	if err != nil || second == first {
		t.Fatalf("other work: %q, %v", second, err)
	}
	if b, _ := os.ReadFile(first); !strings.Contains(string(b), "NaCl") {
		t.Errorf("the first file was replaced:\n%s", b)
	}
	if files := k.Files(); len(files) != 2 {
		t.Errorf("Files() = %q, want both", files)
	}
	if p, err := (&Keeper{}).Keep(nacl); p != "" || err != nil {
		t.Errorf("a keeper without a path wrote %q, %v", p, err)
	}
}

// TestNoticeNamesTheOpenKey: the notice says which key opens the files and
// names them as the session shows names.
func TestNoticeNamesTheOpenKey(t *testing.T) {
	dir := t.TempDir()
	k := &Keeper{Path: filepath.Join(dir, "recovery.hesscycle")}
	if msg := k.Notice("ctrl+o", filepath.Base)(); msg != nil {
		t.Errorf("a notice without any file: %v", msg)
	}
	if err := os.WriteFile(k.Path, []byte("x"), 0o600); err != nil {
		t.Fatal(err)
	}
	msg, ok := k.Notice("ctrl+o", filepath.Base)().(NoticeMsg)
	if !ok || !strings.Contains(msg.Text, "(ctrl+o opens it): recovery.hesscycle") {
		t.Errorf("notice %+v", msg)
	}
	if (&Keeper{}).Notice("ctrl+o", filepath.Base) != nil {
		t.Error("a keeper without a path looks for files")
	}
}
