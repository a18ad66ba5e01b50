package tui_test

import (
	"path/filepath"
	"strings"
	"testing"

	"enthalpath/cycle"
	"enthalpath/tui/internal/drive"
	"enthalpath/tui/screen"

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

// TestConfinedFolderShowsTypableNames: in a confined folder (the SSH
// server's per-member folder) every file the workshop names is shown
// relative to the folder, the name the member can type (absolute paths are
// refused there); ctrl+o proposes the recovery file by that name, and a
// status line too long for the window ends in "…" rather than being cut.
func TestConfinedFolderShowsTypableNames(t *testing.T) {
	db := loadDB(t)
	dir := t.TempDir()
	m, u := startWithRecoveryFile(t, db, dir, 80, 24)
	noDir := func(when string) string {
		t.Helper()
		v := m.View()
		if strings.Contains(v, dir) {
			t.Errorf("%s: the screen shows the server's path %s:\n%s", when, dir, v)
		}
		return v
	}
	if v := noDir("start"); !strings.Contains(v, "A recovery file from an earlier session (ctrl+o opens it): recovery.hesscycle") {
		t.Errorf("start: the recovery file is not named as typed:\n%s", v)
	}
	keys(u, "ctrl+o")
	if v := noDir("ctrl+o"); !strings.Contains(v, "recovery.hesscycle") {
		t.Errorf("ctrl+o does not propose the recovery file:\n%s", v)
	}
	keys(u, "enter")
	if c := m.Session().Cycle; c == nil || c.Formula != "MgO" {
		t.Fatalf("enter on the proposed name did not open the recovery file's MgO: %v", c)
	}
	if v := noDir("opened"); !strings.Contains(v, "Opened recovery.hesscycle.") {
		t.Errorf("the open is not reported by the typed name:\n%s", v)
	}
	keys(u, "g", "j", "e")
	drive.Run(u, drive.Text("600")...)
	keys(u, "enter", "ctrl+s", "ctrl+u")
	drive.Run(u, drive.Text("cycles/mgo-with-my-ionization-energy-and-a-name-long-enough-to-be-cut.hesscycle")...)
	keys(u, "enter")
	v := noDir("saved")
	status := strings.Split(v, "\n")[22]
	if !strings.HasPrefix(status, "Saved cycles/mgo-") || !strings.HasSuffix(strings.TrimRight(status, " "), "…") {
		t.Errorf("the status of a long save is %q, want the typed name cut with …", status)
	}
	keys(u, "g", "j", "e")
	drive.Run(u, drive.Text("610")...)
	keys(u, "enter", "q")
	if v := noDir("question"); !strings.Contains(v, "recovery-2.hesscycle") {
		t.Errorf("the question does not name the recovery file:\n%s", v)
	}
	keys(u, "k")
	if v := noDir("kept"); !strings.Contains(v, "Unsaved work kept in recovery-2.hesscycle") {
		t.Errorf("the last frame does not name the recovery file as typed:\n%s", v)
	}
}

// TestValuePromptIsNotCut: the Bench's value prompt, whose question and
// reaction are longer than 80 columns for an attachment step, wraps them
// instead of cutting ("… Cl(g) + e⁻ → Cl⁻(g), per r…" before).
func TestValuePromptIsNotCut(t *testing.T) {
	db := loadDB(t)
	for _, size := range [][2]int{{80, 24}, {100, 30}, {120, 40}} {
		m, u, _ := newRoot(t, db, size[0], size[1])
		drive.Run(u, screen.OpenMsg{Formula: "NaCl"})
		keys(u, "g", "j", "j", "j", "j", "e")
		flat := strings.Join(strings.Fields(m.View()), " ")
		for _, want := range []string{"(minus the first electron affinity)", "Cl(g) + e⁻ → Cl⁻(g), per reaction as written; ± uncertainty optional"} {
			if !strings.Contains(flat, want) {
				t.Errorf("%d×%d: the value prompt lacks %q:\n%s", size[0], size[1], want, m.View())
			}
		}
	}
}
