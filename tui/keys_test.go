package tui_test

import (
	"strings"
	"testing"

	"github.com/charmbracelet/bubbles/key"

	"enthalpath/tui/internal/drive"
	"enthalpath/tui/nav"
	"enthalpath/tui/screen"
)

// TestHelpLabelsAreTheKeys: on every screen, and while the unsaved-changes
// question or a file name is asked, each binding the help line or the key
// list shows has the label its keys give (nav.Label): the help never
// names a key that does not act or leaves out one that does. Its partner,
// nav's TestKeysDeclaredOnce, fails on a key declared outside nav.
func TestHelpLabelsAreTheKeys(t *testing.T) {
	db := loadDB(t)
	check := func(state string, short []key.Binding, full [][]key.Binding) {
		t.Helper()
		all := append([]key.Binding(nil), short...)
		for _, g := range full {
			all = append(all, g...)
		}
		if len(all) == 0 {
			t.Errorf("%s: no key in the help", state)
		}
		for _, b := range all {
			if len(b.Keys()) == 0 {
				t.Errorf("%s: binding %q without keys", state, b.Help().Desc)
			}
			if want := nav.Label(b.Keys()); b.Help().Key != want {
				t.Errorf("%s: %q is labelled %q, its keys %q read %q", state, b.Help().Desc, b.Help().Key, b.Keys(), want)
			}
		}
	}
	for _, p := range preps {
		m, u, _ := newRoot(t, db, 100, 30)
		p.prep(t, u)
		check(p.name, m.ShortHelp(), m.FullHelp())
	}
	m, u, _ := newRoot(t, db, 100, 30)
	drive.Run(u, screen.OpenMsg{Formula: "NaCl"})
	keys(u, "e")
	check("bench typing", m.ShortHelp(), m.FullHelp())
	keys(u, "esc", "j", "x", "q")
	if !strings.Contains(m.View(), "unsaved changes") {
		t.Fatalf("q after a change did not ask:\n%s", m.View())
	}
	check("unsaved question", m.ShortHelp(), nil)
	keys(u, "esc", "ctrl+o")
	if !strings.Contains(m.View(), "Open a cycle file") {
		t.Fatalf("ctrl+o did not ask for a file:\n%s", m.View())
	}
	check("open prompt", m.ShortHelp(), nil)
}
