package filedialog

import (
	"path/filepath"
	"testing"
)

// TestNames: the cycle file extension is added to a bare name only; a
// formula's file name keeps letters, digits and - _ . only; inside a
// confined folder paths are shown as the names typed (the package's
// rules).
func TestNames(t *testing.T) {
	for in, want := range map[string]string{"nacl": "nacl.hesscycle", "nacl.hesscycle": "nacl.hesscycle", "notes.txt": "notes.txt", "": ""} {
		if got := FileName(in); got != want {
			t.Errorf("FileName(%q) = %q, want %q", in, got, want)
		}
	}
	for in, want := range map[string]string{"Ca(OH)2": "CaOH2", "Fe₃O₄": "FeO", "₂": "cycle"} {
		if got := safeStem(in); got != want {
			t.Errorf("safeStem(%q) = %q, want %q", in, got, want)
		}
	}
	root := t.TempDir()
	f := Folder{Root: root}
	if got := f.Name(filepath.Join(root, "sub", "a.hesscycle")); got != filepath.Join("sub", "a.hesscycle") {
		t.Errorf("Name = %q", got)
	}
	if got := f.Shown("open " + filepath.Join(root, "a.hesscycle") + ": denied"); got != "open a.hesscycle: denied" {
		t.Errorf("Shown = %q", got)
	}
	if got := (Folder{}).Name("/x/a.hesscycle"); got != "/x/a.hesscycle" {
		t.Errorf("Name without a root = %q", got)
	}
}
