//go:build unix

package tui_test

import (
	"os"
	"path/filepath"
	"strings"
	"syscall"
	"testing"

	"enthalpath/tui/internal/drive"
)

// TestSaveRefusesWhatIsNotAFile: a save name that is a named pipe (or a
// device: the same rule, fileio.CheckReplaceable) is refused in the prompt
// with the reason, and the pipe stays (saving once replaced whatever was at
// the path).
func TestSaveRefusesWhatIsNotAFile(t *testing.T) {
	db := loadDB(t)
	m, u, dir := newRoot(t, db, 80, 24)
	pipe := filepath.Join(dir, "pipe.hesscycle")
	if err := syscall.Mkfifo(pipe, 0o600); err != nil {
		t.Skip(err)
	}
	openEdited(t, u)
	keys(u, "ctrl+s", "ctrl+u")
	drive.Run(u, drive.Text("pipe.hesscycle")...)
	keys(u, "enter")
	if v := m.View(); !strings.Contains(v, "pipe.hesscycle is a named") || !strings.Contains(v, "not replaced") {
		t.Errorf("no refusal in the prompt:\n%s", v)
	}
	if st, err := os.Lstat(pipe); err != nil || st.Mode()&os.ModeNamedPipe == 0 {
		t.Errorf("the pipe was replaced: %v", err)
	}
	if !m.Session().Dirty {
		t.Error("the session says saved")
	}
}
