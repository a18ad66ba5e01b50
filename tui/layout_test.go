package tui_test

import (
	"strings"
	"testing"

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
