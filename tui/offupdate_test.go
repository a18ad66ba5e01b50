package tui_test

import (
	"strings"
	"testing"

	"enthalpath/tui/internal/drive"
	"enthalpath/tui/screen"
)

// TestFirstValueIsNotCheckedInsideUpdate: the first value typed used to
// build and solve every compound inside Update (163 ms measured) when the
// data's magnitudes were not ready. Now, with the command that computes
// them not yet run, enter answers at once with the visible working state
// and sets nothing (were the survey run inside Update, the value would be
// checked and set); once the command has run, its answer submits the
// value again, without a second enter.
func TestFirstValueIsNotCheckedInsideUpdate(t *testing.T) {
	m, u, _ := newRoot(t, loadDB(t), 100, 30)
	drive.Run(u, screen.OpenMsg{Formula: "NaCl"})
	keys(u, "g") // Na(s) → Na(g)
	before := m.Session().Cycle.Steps[0].Value
	_, warm := m.Update(drive.Key("e")) // its command is held back
	for _, msg := range drive.Text("500") {
		m.Update(msg)
	}
	m.Update(drive.Key("enter"))
	if v := m.View(); !strings.Contains(v, "a moment") {
		t.Errorf("no working state shown:\n%s", v)
	}
	if got := m.Session().Cycle.Steps[0].Value; got != before {
		t.Fatalf("the value was set (%v) before the magnitudes were ready", got)
	}
	drive.RunCmd(u, warm)
	if got := m.Session().Cycle.Steps[0].Value; got != 500 {
		t.Errorf("after the magnitudes: value %v, want 500", got)
	}
}
