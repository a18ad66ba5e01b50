package tui_test

import (
	"path/filepath"
	"strings"
	"testing"

	"enthalpath/cycle"
	"enthalpath/tui/internal/drive"

	"github.com/charmbracelet/lipgloss"
)

// TestHeaderKeepsTheMarkerAndUnit: at every size the workshop supports and
// on every screen, the header shows the compound, "(unsaved)" after an
// edit and the unit (at 80 columns the tab names do not leave room for
// them; before, the header dropped them).
func TestHeaderKeepsTheMarkerAndUnit(t *testing.T) {
	db := loadDB(t)
	for _, size := range [][2]int{{80, 24}, {100, 30}, {120, 40}} {
		m, u, _ := newRoot(t, db, size[0], size[1])
		openEdited(t, u)
		for k := 1; k <= 6; k++ {
			keys(u, "tab") // from the Bench, every screen in turn
			head := strings.Split(m.View(), "\n")[0]
			if !strings.Contains(head, "NaCl (unsaved) · kJ/mol") {
				t.Errorf("%d×%d, screen %d: the header lacks the compound, the marker or the unit: %q", size[0], size[1], m.Active()+1, head)
			}
			if w := lipgloss.Width(head); w > size[0] {
				t.Errorf("%d×%d, screen %d: the header is %d columns wide", size[0], size[1], m.Active()+1, w)
			}
		}
	}
}

// TestQuestionHelpLineFitsAt80: while the unsaved-changes question is
// asked, the help line at 80 columns shows every key of the question, the
// last "esc back to work" included (before, it was cut before it).
func TestQuestionHelpLineFitsAt80(t *testing.T) {
	db := loadDB(t)
	const long = "a-rather-long-name-for-a-cycle-file" + cycle.FileExtension
	for _, size := range [][2]int{{80, 24}, {100, 30}, {120, 40}} {
		m, u, dir := newRoot(t, db, size[0], size[1])
		other, err := cycle.Build(db, "MgO", cycle.Options{})
		if err != nil {
			t.Fatal(err)
		}
		if err := cycle.Save(filepath.Join(dir, long), other); err != nil {
			t.Fatal(err)
		}
		openEdited(t, u)
		for _, k := range []string{"q", "ctrl+o"} {
			keys(u, k)
			if k == "ctrl+o" {
				keys(u, "ctrl+u")
				drive.Run(u, drive.Text(long)...)
				keys(u, "enter") // the question, then open …
			}
			foot := lastLine(m.View())
			for _, want := range []string{"s save", "k keep", "x discard", "esc back to work"} {
				if !strings.Contains(foot, want) {
					t.Errorf("%d×%d after %s: the help line %q lacks %q", size[0], size[1], k, foot, want)
				}
			}
			keys(u, "esc")
		}
	}
}
