package analyses

import (
	"strings"

	"github.com/charmbracelet/bubbles/key"
	tea "github.com/charmbracelet/bubbletea"

	"enthalpath/tui/screen"
	"enthalpath/tui/session"
)

// KeyMap is the analyses screen's keys.
type KeyMap struct {
	Up, Down key.Binding
}

// DefaultKeyMap returns the analyses screen's keys.
func DefaultKeyMap() KeyMap {
	return KeyMap{
		Up:   key.NewBinding(key.WithKeys("up", "k"), key.WithHelp("↑/k", "previous analysis")),
		Down: key.NewBinding(key.WithKeys("down", "j"), key.WithHelp("↓/j", "next analysis")),
	}
}

// Model is the analyses screen.
type Model struct {
	KeyMap KeyMap
	ctx    *screen.Context
	sess   *session.Session
	cursor int
	w, h   int
}

var _ screen.Screen = (*Model)(nil)

// New returns the analyses screen.
func New(ctx *screen.Context, sess *session.Session) *Model {
	return &Model{KeyMap: DefaultKeyMap(), ctx: ctx, sess: sess}
}

type analysis struct{ name, what string }

func list() []analysis {
	return []analysis{
		{"estimate", "formation enthalpy of a hypothetical compound from a model lattice energy"},
		{"scan", "formation enthalpies across oxidation states, and their disproportionations"},
		{"solution", "enthalpy of solution from the lattice and hydration enthalpies"},
		{"radius", "thermochemical radius of an ion from the cycle's lattice energy"},
	}
}

// Init does nothing.
func (m *Model) Init() tea.Cmd { return nil }

// Title is the screen's name.
func (m *Model) Title() string { return "Analyses" }

// Capturing is false: nothing is typed here yet.
func (m *Model) Capturing() bool { return false }

// SetSize sets the body size.
func (m *Model) SetSize(w, h int) { m.w, m.h = w, h }

// Cursor is the highlighted analysis.
func (m *Model) Cursor() int { return m.cursor }

// ShortHelp lists the main keys.
func (m *Model) ShortHelp() []key.Binding { return []key.Binding{m.KeyMap.Down} }

// FullHelp lists every key.
func (m *Model) FullHelp() [][]key.Binding { return [][]key.Binding{{m.KeyMap.Up, m.KeyMap.Down}} }

// Update handles keys.
func (m *Model) Update(msg tea.Msg) tea.Cmd {
	if k, ok := msg.(tea.KeyMsg); ok {
		switch {
		case key.Matches(k, m.KeyMap.Up):
			m.cursor = max(0, m.cursor-1)
		case key.Matches(k, m.KeyMap.Down):
			m.cursor = min(len(list())-1, m.cursor+1)
		}
	}
	return nil
}

// View renders the list of analyses.
func (m *Model) View() string {
	st := m.ctx.Styles
	lines := []string{st.Title.Render("Analyses beyond one cycle"), ""}
	for i, a := range list() {
		cursor := " "
		if i == m.cursor {
			cursor = "›"
		}
		text := cursor + " " + a.name + " — " + a.what
		if i == m.cursor {
			text = st.Selected.Render(text)
		}
		lines = append(lines, text)
	}
	lines = append(lines, "", st.Warn.Render("not yet available: the engine's analyses have not landed in this build"))
	return strings.Join(lines, "\n")
}
