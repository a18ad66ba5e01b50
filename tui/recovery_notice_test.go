package tui_test

import (
	"os"
	"path/filepath"
	"strings"
	"testing"

	tea "github.com/charmbracelet/bubbletea"

	"enthalpath/cycle"
	"enthalpath/data"
	"enthalpath/tui"
	"enthalpath/tui/internal/drive"
	"enthalpath/tui/screen"
)

// TestRecoveryNoticeClearedOnceDealtWith: the start announces a recovery
// file; once the user has dealt with it (opened it, or opened another
// cycle to work on, or removed it) the line is gone from every screen (it
// stayed on); before, it stays.
func TestRecoveryNoticeClearedOnceDealtWith(t *testing.T) {
	db := loadDB(t)
	for _, how := range []string{"open it", "open a compound", "remove it", "switch screens"} {
		dir := t.TempDir()
		m, u := startWithRecoveryFile(t, db, dir, 120, 40)
		if !strings.Contains(m.View(), "recovery file") {
			t.Fatalf("no notice at the start:\n%s", m.View())
		}
		switch how {
		case "open it":
			keys(u, "ctrl+o", "enter")
		case "open a compound":
			drive.Run(u, screen.OpenMsg{Formula: "NaCl"})
		case "remove it":
			if err := os.Remove(filepath.Join(dir, "recovery.hesscycle")); err != nil {
				t.Fatal(err)
			}
		case "switch screens":
			keys(u, "2", "3", "1")
			if !strings.Contains(m.View(), "recovery file") {
				t.Errorf("the notice went before the recovery file was dealt with")
			}
			continue
		}
		for _, k := range []string{"2", "4", "5"} {
			keys(u, k)
			if v := m.View(); strings.Contains(v, "recovery file") {
				t.Errorf("%s, then screen %s: the recovery notice is still shown:\n%s", how, k, v)
			}
		}
	}
}

// startWithRecoveryFile starts the workshop in the confined folder dir,
// which holds a recovery file of MgO, in a width×height window, its first
// commands run.
func startWithRecoveryFile(t *testing.T, db *data.DB, dir string, width, height int) (*tui.Model, drive.Updater) {
	t.Helper()
	c, err := cycle.Build(db, "MgO", cycle.Options{})
	if err != nil {
		t.Fatal(err)
	}
	if err := cycle.Save(filepath.Join(dir, "recovery.hesscycle"), c); err != nil {
		t.Fatal(err)
	}
	m := tui.New(tui.Options{Renderer: drive.Renderer(), DB: db, FileRoot: dir, RecoveryPath: dir + "/recovery.hesscycle"}).(*tui.Model)
	u := drive.Model(m)
	drive.Run(u, tea.WindowSizeMsg{Width: width, Height: height})
	drive.RunCmd(u, m.Init())
	return m, u
}
