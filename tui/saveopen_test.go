package tui_test

import (
	"os"
	"path/filepath"
	"strings"
	"testing"

	"enthalpath/cycle"
	"enthalpath/tui/internal/drive"
	"enthalpath/tui/screen"
)

// TestTypedSaveNameReplacesTheProposal: Save proposes a name; typing
// replaces it (it was appended: "NaCl.hesscyclemine"), the arrow keys edit
// it instead, and the extension is added to the typed name.
func TestTypedSaveNameReplacesTheProposal(t *testing.T) {
	m, u, dir := newRoot(t, loadDB(t), 120, 40)
	openEdited(t, u)
	keys(u, "ctrl+s")
	drive.Run(u, drive.Text("mine")...)
	keys(u, "enter")
	if _, err := os.Stat(filepath.Join(dir, "mine"+cycle.FileExtension)); err != nil {
		entries, _ := os.ReadDir(dir)
		t.Fatalf("typed name not saved as mine%s (%v); folder: %v", cycle.FileExtension, err, entries)
	}
	// ← then typing edits the proposal rather than replacing it.
	keys(u, "ctrl+s", "left", "left", "left", "left", "left", "left", "left", "left", "left", "left")
	drive.Run(u, drive.Text("-2")...)
	keys(u, "enter")
	if v := m.View(); !strings.Contains(v, "Saved mine-2"+cycle.FileExtension) {
		t.Errorf("editing the proposal with ← did not save mine-2%s:\n%s", cycle.FileExtension, v)
	}
}

// TestOpenListsTheCycleFilesAndAddsTheExtension: Open lists the cycle
// files of the folder (it offered no list), ↓ puts one into the input, and
// a name typed without the extension is opened with it, as Save adds it.
func TestOpenListsTheCycleFilesAndAddsTheExtension(t *testing.T) {
	m, u, dir := newRoot(t, loadDB(t), 120, 40)
	for _, f := range []string{"KBr", "MgO"} {
		drive.Run(u, screen.OpenMsg{Formula: f})
		c := m.Session().Cycle
		if err := cycle.Save(filepath.Join(dir, f+cycle.FileExtension), c); err != nil {
			t.Fatal(err)
		}
	}
	if err := os.WriteFile(filepath.Join(dir, "notes.txt"), []byte("x"), 0o600); err != nil {
		t.Fatal(err)
	}
	drive.Run(u, screen.OpenMsg{Formula: "NaCl"})
	keys(u, "ctrl+o")
	v := m.View()
	if !strings.Contains(v, "KBr"+cycle.FileExtension) || !strings.Contains(v, "MgO"+cycle.FileExtension) || strings.Contains(v, "notes.txt") {
		t.Fatalf("Open does not list the folder's cycle files (and only them):\n%s", v)
	}
	drive.Run(u, drive.Text("kbr")...) // narrows the list
	if v := m.View(); strings.Contains(v, "MgO"+cycle.FileExtension) {
		t.Errorf("typing kbr did not narrow the list:\n%s", v)
	}
	keys(u, "esc", "ctrl+o", "down", "enter")
	if c := m.Session().Cycle; c == nil || (c.Formula != "KBr" && c.Formula != "MgO") {
		t.Fatalf("↓ enter opened %v, want one of the listed files", c)
	}
	keys(u, "ctrl+o")
	drive.Run(u, drive.Text("MgO")...)
	keys(u, "enter")
	if c := m.Session().Cycle; c == nil || c.Formula != "MgO" || m.Session().Path != filepath.Join(dir, "MgO"+cycle.FileExtension) {
		t.Errorf("open MgO (no extension): %v at %q", c, m.Session().Path)
	}
}
