package prompt

import (
	"strings"

	"github.com/charmbracelet/bubbles/key"
	"github.com/charmbracelet/bubbles/textinput"
	tea "github.com/charmbracelet/bubbletea"

	"enthalpath/tui/screen"
	"enthalpath/tui/theme"
)

// KeyMap is the prompt's keys.
type KeyMap struct {
	Submit, Cancel key.Binding
}

// DefaultKeyMap returns the prompt's keys.
func DefaultKeyMap() KeyMap {
	return KeyMap{
		Submit: key.NewBinding(key.WithKeys("enter"), key.WithHelp("enter", "accept")),
		Cancel: key.NewBinding(key.WithKeys("esc"), key.WithHelp("esc", "cancel")),
	}
}

// Accept checks an answer: it returns the command to run for a good one, or
// an error explaining what is wrong (the prompt stays open).
type Accept func(answer string) (tea.Cmd, error)

// Model is an open prompt.
type Model struct {
	KeyMap KeyMap
	// Question is shown above the input; Hint under it when there is no error.
	Question, Hint string

	input  textinput.Model
	accept Accept
	err    error
	done   bool
	styles *theme.Styles
}

// New opens a prompt with an initial answer; limit bounds its length.
func New(st *theme.Styles, question, initial, hint string, limit int, accept Accept) *Model {
	ti := screen.NewInput(st, limit)
	ti.Prompt = "› "
	ti.SetValue(initial)
	ti.CursorEnd()
	ti.Focus()
	return &Model{KeyMap: DefaultKeyMap(), Question: question, Hint: hint, input: ti, accept: accept, styles: st}
}

// Done reports whether the prompt was answered or cancelled.
func (m *Model) Done() bool { return m.done }

// Err is the explanation of the last refused answer, or nil.
func (m *Model) Err() error { return m.err }

// Value is the text typed so far.
func (m *Model) Value() string { return m.input.Value() }

// SetWidth sets the input's width.
func (m *Model) SetWidth(w int) { m.input.Width = max(8, w-4) }

// Update handles a key.
func (m *Model) Update(msg tea.Msg) tea.Cmd {
	if k, ok := msg.(tea.KeyMsg); ok {
		switch {
		case key.Matches(k, m.KeyMap.Cancel):
			m.done = true
			return nil
		case key.Matches(k, m.KeyMap.Submit):
			cmd, err := m.accept(strings.TrimSpace(m.input.Value()))
			if err != nil {
				m.err = err
				return nil
			}
			m.err, m.done = nil, true
			return cmd
		}
	}
	before := m.input.Value()
	var cmd tea.Cmd
	m.input, cmd = m.input.Update(msg)
	if m.input.Value() != before {
		m.err = nil // the explanation was about the old text
	}
	return cmd
}

// View renders the question, the input and the explanation or hint.
func (m *Model) View() string {
	lines := []string{m.styles.Title.Render(m.Question), m.input.View()}
	switch {
	case m.err != nil:
		lines = append(lines, m.styles.Error.Render("✗ not accepted: ")+m.styles.Text.Render(m.err.Error()))
	case m.Hint != "":
		lines = append(lines, m.styles.Muted.Render(m.Hint))
	}
	return strings.Join(lines, "\n")
}
