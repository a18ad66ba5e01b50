package drive

import (
	"io"
	"strings"
	"testing"

	tea "github.com/charmbracelet/bubbletea"
	"github.com/charmbracelet/lipgloss"
	"github.com/muesli/termenv"

	"enthalpath/cycle"
	"enthalpath/data"
	"enthalpath/thermo"
	"enthalpath/tui/screen"
	"enthalpath/tui/session"
	"enthalpath/tui/theme"
)

// Renderer returns a renderer with the colour profile pinned to plain
// ASCII (no escape sequences), so views compare as text.
func Renderer() *lipgloss.Renderer {
	r := lipgloss.NewRenderer(io.Discard)
	r.SetColorProfile(termenv.Ascii)
	r.SetHasDarkBackground(true)
	return r
}

var keyTypes = func() map[string]tea.KeyType {
	m := map[string]tea.KeyType{}
	for k := tea.KeyType(-200); k < 200; k++ {
		if s := k.String(); s != "" && k != tea.KeyRunes {
			m[s] = k
		}
	}
	return m
}()

// Key returns the key message for a key name as key.Binding writes it:
// "enter", "ctrl+g", "shift+tab", "esc", "up", or a single character.
func Key(name string) tea.KeyMsg {
	if t, ok := keyTypes[name]; ok {
		return tea.KeyMsg{Type: t}
	}
	return tea.KeyMsg{Type: tea.KeyRunes, Runes: []rune(name)}
}

// Text returns one key message per character of s.
func Text(s string) []tea.Msg {
	var out []tea.Msg
	for _, r := range s {
		out = append(out, tea.KeyMsg{Type: tea.KeyRunes, Runes: []rune{r}})
	}
	return out
}

// Updater is anything that takes a message and returns a command.
type Updater func(tea.Msg) tea.Cmd

// Model adapts a tea.Model whose Update mutates it in place (a pointer).
func Model(m tea.Model) Updater {
	return func(msg tea.Msg) tea.Cmd {
		_, cmd := m.Update(msg)
		return cmd
	}
}

// Run sends msgs to u in order, running every command synchronously and
// feeding its messages back (breadth first, at most limit messages in
// all). It returns every message the commands produced.
func Run(u Updater, msgs ...tea.Msg) []tea.Msg {
	const limit = 10000
	var seen []tea.Msg
	queue := append([]tea.Msg(nil), msgs...)
	for len(queue) > 0 && len(seen) < limit {
		msg := queue[0]
		queue = queue[1:]
		if batch, ok := msg.(tea.BatchMsg); ok {
			for _, c := range batch {
				if c != nil {
					queue = append(queue, c())
				}
			}
			continue
		}
		if msg == nil {
			continue
		}
		seen = append(seen, msg)
		if _, quit := msg.(tea.QuitMsg); quit {
			continue
		}
		if cmd := u(msg); cmd != nil {
			queue = append(queue, cmd())
		}
	}
	return seen
}

// Quit reports whether msgs contain tea.QuitMsg.
func Quit(msgs []tea.Msg) bool {
	for _, m := range msgs {
		if _, ok := m.(tea.QuitMsg); ok {
			return true
		}
	}
	return false
}

// Fixture is what a screen test needs.
type Fixture struct {
	DB      *data.DB
	Ctx     *screen.Context
	Session *session.Session
	// Statuses collects the status lines screens reported.
	Statuses []screen.StatusMsg
}

// NewFixture loads the built-in data and makes a context in kJ/mol with
// plain-text styles; file names resolve inside dir.
func NewFixture(tb testing.TB, dir string) *Fixture {
	tb.Helper()
	db, err := data.Load()
	if err != nil {
		tb.Fatal(err)
	}
	ctx := &screen.Context{Styles: theme.DefaultStyles(Renderer()), Units: thermo.KJPerMol, DB: db, MaxInputLen: 256,
		ResolvePath: func(name string) (string, error) {
			if strings.HasPrefix(name, "/") {
				return name, nil
			}
			return dir + "/" + name, nil
		}}
	return &Fixture{DB: db, Ctx: ctx, Session: &session.Session{}}
}

// Screen returns an updater that applies solves to the session and records
// statuses before handing each message to s.
func (f *Fixture) Screen(s screen.Screen) Updater {
	return func(msg tea.Msg) tea.Cmd {
		switch m := msg.(type) {
		case session.SolvedMsg:
			if !f.Session.Apply(m) {
				return nil
			}
		case screen.StatusMsg:
			f.Statuses = append(f.Statuses, m)
			return nil
		}
		return s.Update(msg)
	}
}

// Open builds formula's cycle, opens it in the session, tells s and runs
// the solve.
func (f *Fixture) Open(tb testing.TB, s screen.Screen, formula string) *cycle.Cycle {
	tb.Helper()
	c, err := cycle.Build(f.DB, formula, cycle.Options{})
	if err != nil {
		tb.Fatalf("Build(%s): %v", formula, err)
	}
	solve := f.Session.Open(c, "")
	Run(f.Screen(s), session.OpenedMsg{})
	Run(f.Screen(s), solve())
	return c
}

// LastStatus returns the last status reported, or "".
func (f *Fixture) LastStatus() string {
	if len(f.Statuses) == 0 {
		return ""
	}
	return f.Statuses[len(f.Statuses)-1].Text
}

// RunCmd runs cmd (if any) and feeds its messages to u as Run does.
func RunCmd(u Updater, cmd tea.Cmd) []tea.Msg {
	if cmd == nil {
		return nil
	}
	return Run(u, cmd())
}
