// Package unsaved is the question put before unsaved work is lost (to
// quit, or to open another cycle in its place): save, keep a recovery
// file, discard, or back to work. Each answer's help says what follows
// ("save, then quit"). In a window smaller than the workshop's least size
// the question is drawn short (Small), and where it cannot be drawn at
// all its answers do not act: a key must never discard work the user
// could not see asked about.
package unsaved

import (
	"slices"
	"strings"

	"github.com/charmbracelet/bubbles/key"
	tea "github.com/charmbracelet/bubbletea"
	"github.com/charmbracelet/lipgloss"

	"enthalpath/tui/nav"
	"enthalpath/tui/screen"
	"enthalpath/tui/theme"
)

// Keys are the question's answers.
type Keys struct {
	Save, Keep, Discard, Back key.Binding
}

// DefaultKeys returns the question's keys.
func DefaultKeys() Keys {
	return Keys{
		Save:    nav.New("save", "s"),
		Keep:    nav.New("keep a recovery file", "k"),
		Discard: nav.New("discard the changes", "x"),
		Back:    nav.Esc.Bind("back to work"),
	}
}

// Answer is what a key answered.
type Answer int

// The answers.
const (
	None Answer = iota // the key is no answer: the question stays
	Back
	Save
	Keep
	Discard
)

// Question is the unsaved-changes question, open or closed.
type Question struct {
	Keys Keys
	// CanKeep offers the keep answer (there is a recovery file to write).
	CanKeep bool

	open    bool
	formula string
	pending *screen.OpenMsg // nil: the question is about quitting
}

// New returns a closed question.
func New(canKeep bool) *Question { return &Question{Keys: DefaultKeys(), CanKeep: canKeep} }

// Ask opens the question about the formula's cycle, before quitting
// (pending nil) or before opening pending.
func (q *Question) Ask(formula string, pending *screen.OpenMsg) {
	q.open, q.formula, q.pending = true, formula, pending
}

// Active reports whether the question is open.
func (q *Question) Active() bool { return q.open }

// Answer reads a key: an answer closes the question and comes back with
// what the question was about (nil: quitting); None leaves it open.
func (q *Question) Answer(k tea.KeyMsg) (Answer, *screen.OpenMsg) {
	c := q.Keys
	var a Answer
	switch {
	case key.Matches(k, c.Back):
		a = Back
	case key.Matches(k, c.Save):
		a = Save
	case key.Matches(k, c.Keep) && q.CanKeep:
		a = Keep
	case key.Matches(k, c.Discard):
		a = Discard
	default:
		return None, nil
	}
	pending := q.pending
	q.open, q.pending = false, nil
	return a, pending
}

// then is what the answers do after their part: "quit", or "open MgO".
func (q *Question) then() string {
	switch {
	case q.pending == nil:
		return "quit"
	case q.pending.File != "":
		return "open " + q.pending.File
	case q.pending.Guided:
		return "assemble " + q.pending.Formula
	}
	return "open " + q.pending.Formula
}

// Bindings are the answers with help that says what follows (quitting or
// the open asked for); the keep key only when CanKeep.
func (q *Question) Bindings() []key.Binding {
	with := func(b key.Binding) key.Binding {
		b.SetHelp(b.Help().Key, b.Help().Desc+", then "+q.then())
		return b
	}
	out := []key.Binding{with(q.Keys.Save)}
	if q.CanKeep {
		out = append(out, with(q.Keys.Keep))
	}
	return append(out, with(q.Keys.Discard), q.Keys.Back)
}

// Declared are the answers as declared, without what follows.
func (q *Question) Declared() []key.Binding {
	out := []key.Binding{q.Keys.Save}
	if q.CanKeep {
		out = append(out, q.Keys.Keep)
	}
	return append(out, q.Keys.Discard, q.Keys.Back)
}

// Small is the question as a window of width×height smaller than the
// workshop's least size draws it: whole when it fits, else a line per
// answer, else nil (not drawn: then only Back may act).
func (q *Question) Small(width, height int) []string {
	long := []string{q.title()}
	for _, b := range q.Bindings() {
		long = append(long, b.Help().Key+"  "+b.Help().Desc)
	}
	short := []string{"Unsaved changes:"}
	for _, b := range q.Declared() {
		short = append(short, b.Help().Key+" "+b.Help().Desc)
	}
	for _, lines := range [][]string{long, short} {
		fits := len(lines) <= height
		for _, l := range lines {
			fits = fits && lipgloss.Width(l) <= width
		}
		if fits {
			return lines
		}
	}
	return nil
}

// SmallView draws the question in a window of width×height smaller than
// the workshop's least size: as Small has it, its title in st.Title, or
// where it cannot be drawn the advice to enlarge the window or go back.
func (q *Question) SmallView(st *theme.Styles, width, height int) string {
	lines := q.Small(width, height)
	if lines == nil {
		return st.Warn.Render("The window is too small to show the unsaved-changes question; enlarge it, or press " +
			q.Keys.Back.Help().Key + " to go back to work.")
	}
	lines[0] = st.Title.Render(lines[0])
	return strings.Join(lines, "\n")
}

func (q *Question) title() string { return "The " + q.formula + " cycle has unsaved changes." }

// View draws the question in inner cells of width; recoveryFile is the
// file the keep answer would write, shown under it (its start cut when
// too long).
func (q *Question) View(st *theme.Styles, inner int, recoveryFile string) string {
	fit := func(s string) string { return screen.Truncate(s, inner) }
	lines := []string{fit(st.Title.Render(q.title()))}
	if q.pending != nil {
		lines = append(lines, fit(st.Muted.Render("To "+q.then()+", it must close first.")))
	}
	lines = append(lines, "")
	for _, b := range q.Bindings() {
		lines = append(lines, fit(st.HelpKey.Render(b.Help().Key)+"  "+b.Help().Desc))
		if slices.Equal(b.Keys(), q.Keys.Keep.Keys()) {
			lines = append(lines, "   "+st.Muted.Render(screen.TruncateStart(recoveryFile, inner-5)))
		}
	}
	return strings.Join(lines, "\n")
}
