package tui_test

import (
	"strings"
	"testing"

	"enthalpath/tui/diagram"
	"enthalpath/tui/internal/drive"
	"enthalpath/tui/plot"
	"enthalpath/tui/screen"
)

// TestQuestionMarkIsOnlyTheHelpKey: "?" was the help key, the solved
// step's marker and the survey chart's "two groups on one cell" mark. The
// solved mark and the crowded-cell mark are now marks of their own, apart
// from every group glyph, and a solved Bench shows "?" only in the key
// help.
func TestQuestionMarkIsOnlyTheHelpKey(t *testing.T) {
	marks := map[string]string{"help key": "?", "solved step": diagram.SolvedMark, "crowded cell": string(plot.Crowded)}
	seen := map[string]string{}
	for what, mk := range marks {
		if other, ok := seen[mk]; ok {
			t.Errorf("%s and %s share the mark %q", what, other, mk)
		}
		seen[mk] = what
		if what != "help key" && strings.Contains(plot.Glyphs, mk) {
			t.Errorf("the %s mark %q is also a group glyph", what, mk)
		}
	}
	m, u, _ := newRoot(t, loadDB(t), 120, 40)
	drive.Run(u, screen.OpenMsg{Formula: "NaCl"})
	keys(u, "2")
	v := m.View()
	if !strings.Contains(v, diagram.SolvedMark+" solved: lattice") {
		t.Fatalf("NaCl not solved on the Bench:\n%s", v)
	}
	noQuestionMark := func(where, v string) {
		for _, line := range strings.Split(v, "\n") {
			if strings.Contains(line, "?") && !strings.Contains(line, "?/f1") && !strings.Contains(line, "? or f1") {
				t.Errorf("%s: a \"?\" outside the key help: %q", where, line)
			}
		}
	}
	noQuestionMark("bench", v)
	keys(u, "5")
	drive.RunCmd(u, m.Screen(screen.Survey).Update(screen.ShownMsg{}))
	keys(u, "p")
	if v := m.View(); !strings.Contains(v, "against the cycle") {
		t.Fatalf("no survey chart:\n%s", v)
	}
	noQuestionMark("survey chart", m.View())
}
