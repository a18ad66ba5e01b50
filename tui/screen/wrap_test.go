package screen

import (
	"strings"
	"testing"

	"github.com/charmbracelet/x/ansi"
)

// TestWrapKeepsEveryWord: wrapped lines fit the width and, joined again,
// hold every word of the text in order (the property the screens rely on:
// nothing is cut off).
func TestWrapKeepsEveryWord(t *testing.T) {
	text := "verdict thresholds 10 % and 15 % of |model|: common practice, no source; the point-charge models have no dispersion term"
	for _, w := range []int{20, 40, 80} {
		lines := Wrap(text, w, "  ")
		for _, l := range lines {
			if ansi.StringWidth(l) > w {
				t.Errorf("width %d: line %q is %d wide", w, l, ansi.StringWidth(l))
			}
		}
		if got := strings.Join(strings.Fields(strings.Join(lines, " ")), " "); got != text {
			t.Errorf("width %d: the words joined are %q, want %q", w, got, text)
		}
		if w < 80 && len(lines) < 2 {
			t.Errorf("width %d: %d line(s), the text is wider", w, len(lines))
		}
	}
}

// TestWrapBreaksAWordWiderThanTheLine: a path or formula longer than the
// line is broken, not cut (rule of this package, no outside source).
func TestWrapBreaksAWordWiderThanTheLine(t *testing.T) {
	got := strings.Join(Wrap("at users/abcdefghij.hesscycle now", 10, ""), "|")
	if want := "at|users/abcd|efghij.hes|scycle now"; got != want {
		t.Errorf("Wrap = %q, want %q", got, want)
	}
}

// TestWrapRowKeepsTheColumns: a row too wide keeps its first line's
// spacing (the columns) and continues, indented, with the rest.
func TestWrapRowKeepsTheColumns(t *testing.T) {
	row := "  MgCl          1     −86.2 ±50.3 kJ/mol   disproportionates (estimate)"
	got := WrapRow(row, 50, "      ")
	want := []string{"  MgCl          1     −86.2 ±50.3 kJ/mol", "      disproportionates (estimate)"}
	if strings.Join(got, "|") != strings.Join(want, "|") {
		t.Errorf("WrapRow = %q, want %q", got, want)
	}
	if got := WrapRow("short  row", 50, "  "); len(got) != 1 || got[0] != "short  row" {
		t.Errorf("a row that fits changed: %q", got)
	}
}

// TestWrapAtTinyWidths: a width narrower than the indent or than one wide
// character still ends, and each line fits (a screen is sized 1×1 before
// the terminal says its size; this hung).
func TestWrapAtTinyWidths(t *testing.T) {
	for _, w := range []int{1, 2, 3} {
		for _, l := range Wrap("★★ a wide-character text", w, "    ") {
			if ansi.StringWidth(l) > max(w, 1) {
				t.Errorf("width %d: line %q is wider", w, l)
			}
		}
	}
}
