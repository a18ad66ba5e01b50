package screen

import (
	"strings"

	"github.com/charmbracelet/x/ansi"
)

// Wrap breaks a plain explanatory text into lines of at most width cells,
// at spaces (a word wider than the line is broken), so that nothing is
// cut off; indent starts every line after the first. Style the lines
// after wrapping.
func Wrap(text string, width int, indent string) []string {
	if width < 1 {
		return []string{text}
	}
	if ansi.StringWidth(indent) >= width {
		indent = "" // no room to indent
	}
	var lines []string
	line, lw := "", 0
	limit := width
	flush := func() {
		lines = append(lines, line)
		line, lw = indent, ansi.StringWidth(indent)
		limit = width
	}
	for _, word := range strings.Fields(text) {
		ww := ansi.StringWidth(word)
		sep := 0
		if lw > 0 && strings.TrimSpace(line) != "" {
			sep = 1
		}
		if lw+sep+ww > limit && strings.TrimSpace(line) != "" {
			flush()
			sep = 0
		}
		for lw+sep+ww > limit { // a word wider than a whole line
			room := limit - lw - sep
			if room < 1 {
				flush()
				continue
			}
			head := ansi.Truncate(word, room, "")
			if head == "" { // a character wider than the room: it goes alone
				head = string([]rune(word)[:1])
			}
			line += strings.Repeat(" ", sep) + head
			word = strings.TrimPrefix(word, head)
			ww = ansi.StringWidth(word)
			flush()
			sep = 0
		}
		line += strings.Repeat(" ", sep) + word
		lw += sep + ww
	}
	if strings.TrimSpace(line) != "" || len(lines) == 0 {
		lines = append(lines, line)
	}
	return lines
}

// WrapRow fits a table row of width cells or more to width without losing
// its end: the row's columns stay as laid out up to the last space that
// fits, and the rest continues on indented lines below (wrapped as text).
func WrapRow(row string, width int, indent string) []string {
	if width < 1 || ansi.StringWidth(row) <= width {
		return []string{row}
	}
	head := ansi.Truncate(row, width, "")
	cut := strings.LastIndex(strings.TrimRight(head, " "), " ")
	if cut <= len(indent) || strings.TrimSpace(head[:cut]) == "" {
		cut = len(head) // no space to break at: break the word
	}
	out := []string{strings.TrimRight(row[:cut], " ")}
	for _, l := range Wrap(strings.TrimSpace(row[cut:]), max(1, width-ansi.StringWidth(indent)), "") {
		out = append(out, indent+l)
	}
	return out
}

// Truncate shortens s to at most n display cells (not runes: a wide
// character takes two, an escape sequence none), ending it with "…" when
// anything was cut. The one truncation of every screen.
func Truncate(s string, n int) string {
	switch {
	case n <= 0:
		return ""
	case ansi.StringWidth(s) <= n:
		return s
	case n == 1:
		return "…"
	}
	return ansi.Truncate(s, n, "…")
}

// TruncateStart shortens s to at most n display cells by cutting its
// start, beginning it with "…" when anything was cut: for a path, whose
// end names the file.
func TruncateStart(s string, n int) string {
	w := ansi.StringWidth(s)
	switch {
	case n <= 0:
		return ""
	case w <= n:
		return s
	case n == 1:
		return "…"
	}
	return "…" + ansi.TruncateLeft(s, w-(n-1), "")
}
