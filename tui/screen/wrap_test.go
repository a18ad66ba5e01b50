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

// TestTruncate: widths in display cells (Unicode East Asian Width: CJK
// ideographs are wide, two cells; "…" and "²" are one), the tail counted
// in; a styled string keeps its escape sequences out of the count.
func TestTruncate(t *testing.T) {
	for _, tc := range []struct {
		in   string
		n    int
		want string
	}{
		{"NaCl", 10, "NaCl"},
		{"sodium chloride", 6, "sodiu…"},
		{"Mg²⁺ ion", 5, "Mg²⁺…"},
		{"塩化ナトリウム", 5, "塩化…"}, // 2+2+1 cells
		{"abc", 1, "…"},
		{"abc", 0, ""},
	} {
		got := Truncate(tc.in, tc.n)
		if got != tc.want || ansi.StringWidth(got) > tc.n {
			t.Errorf("Truncate(%q, %d) = %q (%d cells), want %q", tc.in, tc.n, got, ansi.StringWidth(got), tc.want)
		}
	}
	styled := "\x1b[1mbold text\x1b[0m"
	if got := Truncate(styled, 20); got != styled {
		t.Errorf("a styled string that fits was changed: %q", got)
	}
	if got := ansi.StringWidth(Truncate(styled, 5)); got != 5 {
		t.Errorf("styled string cut to %d cells, want 5", got)
	}
}

// TestTruncateStart: the cut is from the start, counted in display cells
// (a CJK character is two cells wide: Unicode UAX #11, East Asian Wide),
// the result never wider than asked.
func TestTruncateStart(t *testing.T) {
	cases := []struct {
		s    string
		n    int
		want string
	}{
		{"recovery.hesscycle", 30, "recovery.hesscycle"},
		{"/home/a/recovery.hesscycle", 19, "…recovery.hesscycle"},
		{"/home/化学/x.hesscycle", 15, "…学/x.hesscycle"},
		{"abc", 1, "…"},
		{"abc", 0, ""},
	}
	for _, c := range cases {
		got := TruncateStart(c.s, c.n)
		if got != c.want || ansi.StringWidth(got) > max(c.n, 0) {
			t.Errorf("TruncateStart(%q, %d) = %q, want %q", c.s, c.n, got, c.want)
		}
	}
}
