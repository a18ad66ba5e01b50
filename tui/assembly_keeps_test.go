package tui_test

import (
	"strings"
	"testing"

	"enthalpath/cycle"
	"enthalpath/tui/internal/drive"
	"enthalpath/tui/screen"
)

// TestAssemblyKeepsBenchWork: the path that once lost work. On the Bench,
// K's atomization is made the unknown and Cl's attachment given a value of
// one's own; the Assembly then proposes to keep both (it re-proposed the
// data's values, and accepting replaced the edits), labels the typed value
// "user" (it said "data"), solves the Bench's unknown, and once complete
// its footer offers "on to the bench", not "accept the proposal".
func TestAssemblyKeepsBenchWork(t *testing.T) {
	m, u, _ := newRoot(t, loadDB(t), 120, 40)
	drive.Run(u, screen.OpenMsg{Formula: "KCl"})
	keys(u, "2", "g", "x") // atomization-cation is solved for
	if s := step(m, "atomization-cation"); !s.Unknown {
		t.Fatal("x on the first row did not make atomization-cation the unknown")
	}
	keys(u, "g", "j", "j", "j", "j", "e") // attachment-1, the fifth row (after dissociation-anion)
	drive.Run(u, drive.Text("-355±5")...)
	keys(u, "enter")
	att := step(m, "attachment-1")
	if att.Source.Kind != cycle.SourceUser || att.Value != -355 || att.Uncertainty != 5 {
		t.Fatalf("attachment-1 not set on the bench: %+v", att)
	}
	keys(u, "3")
	for i := 0; i < 12 && !strings.Contains(m.View(), "on to the bench"); i++ {
		keys(u, "y")
	}
	if s := step(m, "attachment-1"); s.Source.Kind != cycle.SourceUser || s.Value != -355 || s.Uncertainty != 5 {
		t.Errorf("the Assembly replaced the Bench's attachment-1: %+v", s)
	}
	if s := step(m, "atomization-cation"); !s.Unknown {
		t.Errorf("the Assembly dropped the Bench's unknown")
	}
	res := m.Session().Solved()
	if res == nil || res.Solved.Key != "atomization-cation" {
		t.Fatalf("after the Assembly: %v solved (%v); want atomization-cation", res != nil && res.Solved.Key != "", m.Session().SolveErr)
	}
	v := m.View()
	for _, line := range strings.Split(v, "\n") {
		if strings.Contains(line, "Cl(g) + e⁻") && (!strings.Contains(line, "user") || strings.Contains(line, "data")) {
			t.Errorf("the attachment row is not labelled user: %q", line)
		}
	}
	if !strings.Contains(v, "on to the bench") || strings.Contains(v, "accept the proposal") {
		t.Errorf("the footer of a complete assembly:\n%s", v)
	}
}
