// Package status is the workshop's status line: the last message (news,
// or an error that the next key or screen change answers), else the file
// the cycle lives in, else how to list the keys. A notice (the recovery
// files found at the start) is a message that goes stale on its own.
package status

import (
	"enthalpath/tui/screen"
	"enthalpath/tui/theme"
)

// Line holds the status message.
type Line struct {
	text   string
	err    bool
	notice string
}

// Say shows text as news.
func (l *Line) Say(text string) { l.text, l.err = text, false }

// Fail shows text as an error.
func (l *Line) Fail(text string) { l.text, l.err = text, true }

// Set shows text, as an error when err.
func (l *Line) Set(text string, err bool) { l.text, l.err = text, err }

// Text is the message shown ("" for none).
func (l *Line) Text() string { return l.text }

// IsErr reports whether the message is an error.
func (l *Line) IsErr() bool { return l.err }

// ClearError takes an error off the line (it has been answered).
func (l *Line) ClearError() {
	if l.err {
		l.text, l.err = "", false
	}
}

// Notice shows text as a notice unless a message is shown; it reports
// whether it did.
func (l *Line) Notice(text string) bool {
	if l.text != "" {
		return false
	}
	l.text, l.err, l.notice = text, false, text
	return true
}

// DropNotice takes the notice off the line if it is still shown and
// stale says it no longer applies.
func (l *Line) DropNotice(stale func() bool) {
	if l.notice != "" && l.text == l.notice && stale() {
		l.text, l.notice = "", ""
	}
}

// View draws the line in width cells: the message (shown through shown,
// which words paths as the user types them), else file (a cycle file's
// name, "" for none), else idle.
func (l *Line) View(st *theme.Styles, width int, shown func(string) string, file, idle string) string {
	text := shown(l.text)
	var out string
	switch {
	case text != "" && l.err:
		out = st.Error.Render("error: ") + st.Text.Render(text)
	case text != "":
		out = st.Text.Render(text)
	case file != "":
		out = st.Muted.Render("file: " + file)
	default:
		out = st.Muted.Render(idle)
	}
	return screen.Truncate(out, width) // a cut shows
}
