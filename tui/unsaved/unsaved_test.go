package unsaved

import (
	"strings"
	"testing"

	tea "github.com/charmbracelet/bubbletea"

	"enthalpath/tui/screen"
)

func press(s string) tea.KeyMsg {
	if s == "esc" {
		return tea.KeyMsg{Type: tea.KeyEsc}
	}
	return tea.KeyMsg{Type: tea.KeyRunes, Runes: []rune(s)}
}

// TestAnswers: each key answers once and closes the question; keep acts
// only with a recovery file to write; another key leaves it open (the
// question's contract, package doc).
func TestAnswers(t *testing.T) {
	open := &screen.OpenMsg{Formula: "MgO"}
	cases := []struct {
		canKeep bool
		key     string
		want    Answer
	}{
		{true, "s", Save}, {true, "k", Keep}, {true, "x", Discard}, {true, "esc", Back},
		{false, "k", None}, {true, "q", None},
	}
	for _, c := range cases {
		q := New(c.canKeep)
		q.Ask("NaCl", open)
		got, pending := q.Answer(press(c.key))
		if got != c.want {
			t.Errorf("canKeep %v, key %q: answer %v, want %v", c.canKeep, c.key, got, c.want)
		}
		if (got == None) != q.Active() {
			t.Errorf("key %q: question open %v after answer %v", c.key, q.Active(), got)
		}
		if got != None && pending != open {
			t.Errorf("key %q: the open asked for was lost", c.key)
		}
	}
}

// TestSmallFormsFitOrAreNotDrawn: the long form where it fits, the short
// one where only it fits, nothing below that; each line within the width.
func TestSmallFormsFitOrAreNotDrawn(t *testing.T) {
	q := New(true)
	q.Ask("NaCl", nil)
	long := q.Small(79, 23)
	if len(long) != 5 || !strings.Contains(long[1], "save, then quit") {
		t.Fatalf("at 79×23: %q", long)
	}
	short := q.Small(28, 6)
	if len(short) != 5 || short[0] != "Unsaved changes:" {
		t.Fatalf("at 28×6: %q", short)
	}
	if got := q.Small(28, 4); got != nil {
		t.Errorf("at 28×4 (5 lines needed) drawn as %q", got)
	}
	if got := q.Small(10, 23); got != nil {
		t.Errorf("at 10×23 drawn as %q", got)
	}
}
