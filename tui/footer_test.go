package tui_test

import (
	"strings"
	"testing"

	"enthalpath/tui/internal/drive"
	"enthalpath/tui/screen"
)

// TestFooterKeepsQuitAt80x24: at 80×24 every screen's help line ends with
// the key list and quit keys; the screen's own keys give way instead (the
// Bench's line was cut before "q quit").
func TestFooterKeepsQuitAt80x24(t *testing.T) {
	m, u, _ := newRoot(t, loadDB(t), 80, 24)
	drive.Run(u, screen.OpenMsg{Formula: "NaCl"})
	for _, k := range []string{"2", "3", "4", "5", "6"} {
		keys(u, k)
		lines := strings.Split(m.View(), "\n")
		last := strings.TrimRight(lines[len(lines)-1], " ")
		if !strings.HasSuffix(last, "q quit") || !strings.Contains(last, "all keys") {
			t.Errorf("screen %s at 80×24: help line %q lacks the key list or q quit", k, last)
		}
	}
}

// TestBenchDrawingKeepsLevelLabelsAt80x24: at 80×24 the Bench's drawing
// shows every level label of NaCl's cycle whole (they were cut:
// "Na⁺(g) + ½Cl₂(…").
func TestBenchDrawingKeepsLevelLabelsAt80x24(t *testing.T) {
	m, u, _ := newRoot(t, loadDB(t), 80, 24)
	drive.Run(u, screen.OpenMsg{Formula: "NaCl"})
	v := m.View()
	for _, label := range []string{"Na⁺(g) + Cl(g)", "Na⁺(g) + ½Cl₂(g)", "Na⁺(g) + Cl⁻(g)", "Na(g) + ½Cl₂(g)", "Na(s) + ½Cl₂(g)", "NaCl(s)"} {
		if !strings.Contains(v, "·"+label) {
			t.Errorf("level label %q not shown whole at 80×24:\n%s", label, v)
		}
	}
}
