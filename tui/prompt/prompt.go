package prompt

import (
	"fmt"
	"slices"
	"strings"

	"github.com/charmbracelet/bubbles/key"
	"github.com/charmbracelet/bubbles/textinput"
	tea "github.com/charmbracelet/bubbletea"
	"github.com/charmbracelet/lipgloss"
	"github.com/charmbracelet/x/ansi"

	"enthalpath/tui/nav"
	"enthalpath/tui/screen"
	"enthalpath/tui/theme"
)

// KeyMap is the prompt's keys.
type KeyMap struct {
	Submit, Cancel key.Binding
	// Prev and Next move through the choices, when the prompt has any.
	Prev, Next key.Binding
}

// DefaultKeyMap returns the prompt's keys.
func DefaultKeyMap() KeyMap {
	return KeyMap{
		Submit: nav.Enter.TypingBind("accept"),
		Cancel: nav.Esc.TypingBind("cancel"),
		Prev:   nav.Up.TypingBind("previous choice"),
		Next:   nav.Down.TypingBind("next choice"),
	}
}

// ShortHelp lists the prompt's keys.
func (k KeyMap) ShortHelp() []key.Binding { return []key.Binding{k.Submit, k.Cancel} }

// FullHelp lists the prompt's keys as one group.
func (k KeyMap) FullHelp() [][]key.Binding { return [][]key.Binding{k.ShortHelp()} }

// Accept checks an answer: it returns the command to run for a good one, or
// an error explaining what is wrong (the prompt stays open). It must change
// nothing when it returns an error.
type Accept func(answer string) (tea.Cmd, error)

// Option adjusts a prompt when it is opened.
type Option func(*Model)

// WithLabel sets the label in front of the typed text (by default "› ").
func WithLabel(label string) Option { return func(m *Model) { m.input.Prompt = label } }

// WithPlaceholder sets the muted text shown while nothing is typed.
func WithPlaceholder(text string) Option { return func(m *Model) { m.input.Placeholder = text } }

// WithAside sets muted text shown after the question, on its line.
func WithAside(text string) Option { return func(m *Model) { m.Aside = text } }

// WithSubmitHelp sets what the help says Enter does ("accept" by default).
func WithSubmitHelp(desc string) Option {
	return func(m *Model) { m.KeyMap.Submit.SetHelp(m.KeyMap.Submit.Help().Key, desc) }
}

// WithProposal makes the initial answer a proposal: enter accepts it as
// it is, the first character typed replaces it whole (it is not appended
// to), and a key that moves or deletes within it edits it instead.
func WithProposal() Option { return func(m *Model) { m.proposed = m.input.Value() != "" } }

// WithChoices lists answers to pick from under the input (the files there
// are, for example): those containing the typed text are shown, the keys
// Prev and Next put one into the input as a proposal.
func WithChoices(choices []string) Option { return func(m *Model) { m.choices = choices } }

// WithRefusal opens the prompt showing err, as if its initial answer had
// just been refused (an answer checked by a command, off the Update path,
// comes back to the prompt this way).
func WithRefusal(err error) Option { return func(m *Model) { m.err = err } }

// maxChoicesShown bounds the lines the choices take under the input.
const maxChoicesShown = 6

// Model is an open prompt.
type Model struct {
	KeyMap KeyMap
	// Question is shown above the input (no line when empty), Aside muted
	// after it; Hint under the input when there is no error.
	Question, Aside, Hint string

	input  textinput.Model
	accept Accept
	// proposed is true while the text is a proposal that typing replaces.
	proposed bool
	// choices are the answers offered.
	choices []string
	err     error
	done    bool
	width   int
	styles  *theme.Styles
}

// New opens a prompt with an initial answer; limit bounds its length.
func New(st *theme.Styles, question, initial, hint string, limit int, accept Accept, opts ...Option) *Model {
	ti := screen.NewInput(st, limit)
	ti.Prompt = "› "
	ti.SetValue(initial)
	ti.CursorEnd()
	ti.Focus()
	m := &Model{KeyMap: DefaultKeyMap(), Question: question, Hint: hint, input: ti, accept: accept, styles: st}
	for _, o := range opts {
		o(m)
	}
	return m
}

// Done reports whether the prompt was answered or cancelled.
func (m *Model) Done() bool { return m.done }

// Err is the explanation of the last refused answer, or nil.
func (m *Model) Err() error { return m.err }

// Value is the text typed so far.
func (m *Model) Value() string { return m.input.Value() }

// SetWidth sets the width of the prompt's lines: the question is wrapped
// to it, the input fills what its label leaves, and a refusal is wrapped to
// it. Zero means unbounded.
func (m *Model) SetWidth(w int) {
	m.width = max(w, 0)
	m.input.Width = 0
	if w > 0 {
		m.input.Width = max(8, w-lipgloss.Width(m.input.Prompt)-2)
	}
}

// ShortHelp lists the prompt's keys (the help.KeyMap interface), with
// the choice keys when there are choices.
func (m *Model) ShortHelp() []key.Binding {
	if len(m.choices) > 0 {
		return []key.Binding{m.KeyMap.Submit, m.KeyMap.Prev, m.KeyMap.Next, m.KeyMap.Cancel}
	}
	return m.KeyMap.ShortHelp()
}

// FullHelp lists the prompt's keys (the help.KeyMap interface).
func (m *Model) FullHelp() [][]key.Binding { return [][]key.Binding{m.ShortHelp()} }

// Proposed reports whether the text is still a proposal typing replaces.
func (m *Model) Proposed() bool { return m.proposed }

// shownChoices returns the choices containing the typed text (all of them
// while the text is a proposal or a picked choice).
func (m *Model) shownChoices() []string {
	if m.proposed {
		return m.choices
	}
	var out []string
	typed := strings.ToLower(strings.TrimSpace(m.input.Value()))
	for _, c := range m.choices {
		if strings.Contains(strings.ToLower(c), typed) {
			out = append(out, c)
		}
	}
	return out
}

// pick moves the choice by step and puts it into the input, as a proposal.
func (m *Model) pick(step int) {
	shown := m.shownChoices()
	if len(shown) == 0 {
		return
	}
	i := slices.Index(shown, m.input.Value())
	switch {
	case i < 0 && step < 0:
		i = len(shown) - 1
	case i < 0:
		i = 0
	default:
		i = min(max(i+step, 0), len(shown)-1)
	}
	m.input.SetValue(shown[i])
	m.input.CursorEnd()
	m.proposed, m.err = true, nil
}

// submit checks the answer typed: a good one closes the prompt and gives
// its command, a refused one stays with the reason.
func (m *Model) submit() tea.Cmd {
	cmd, err := m.accept(strings.TrimSpace(m.input.Value()))
	if err != nil {
		m.err = err
		return nil
	}
	m.err, m.done = nil, true
	return cmd
}

// Update handles a key; other messages go to the text input.
func (m *Model) Update(msg tea.Msg) tea.Cmd {
	if k, ok := msg.(tea.KeyMsg); ok {
		switch {
		case key.Matches(k, m.KeyMap.Cancel):
			m.done = true
			return nil
		case key.Matches(k, m.KeyMap.Submit):
			return m.submit()
		case len(m.choices) > 0 && key.Matches(k, m.KeyMap.Prev):
			m.pick(-1)
			return nil
		case len(m.choices) > 0 && key.Matches(k, m.KeyMap.Next):
			m.pick(+1)
			return nil
		}
		if m.proposed {
			m.proposed = false
			if k.Type == tea.KeyRunes || k.Type == tea.KeySpace {
				m.input.SetValue("") // typing replaces the proposal
			}
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
	st := m.styles
	var lines []string
	switch {
	case m.Question == "":
	case m.width == 0 || ansi.StringWidth(m.Question+m.Aside) <= m.width:
		lines = append(lines, st.Title.Render(m.Question)+st.Muted.Render(m.Aside))
	default:
		// Too long for one line: the question wraps, and the aside goes
		// on lines of its own below it, so that nothing is cut.
		for _, l := range screen.Wrap(m.Question, m.width, "  ") {
			lines = append(lines, st.Title.Render(l))
		}
		aside := strings.TrimPrefix(strings.TrimSpace(m.Aside), "— ")
		if aside != "" {
			for _, l := range screen.Wrap(aside, m.width-2, "") {
				lines = append(lines, st.Muted.Render("  "+l))
			}
		}
	}
	in := m.input
	if in.Value() == "" && in.Placeholder != "" && in.Width > 0 {
		// textinput fits the placeholder into Width less the label; give
		// it the room the label takes, so it fills the line like text.
		in.Width += lipgloss.Width(in.Prompt)
	}
	lines = append(lines, in.View())
	if shown := m.shownChoices(); len(shown) > 0 {
		for i, c := range shown {
			if i == maxChoicesShown {
				lines = append(lines, st.Muted.Render(fmt.Sprintf("    … %d more (type to narrow)", len(shown)-i)))
				break
			}
			mark := "  "
			if c == in.Value() {
				mark = "› "
			}
			lines = append(lines, st.Muted.Render("  "+mark+c))
		}
	}
	switch {
	case m.err != nil:
		refusal := st.Error.Render("✗ not accepted: ") + st.Text.Render(m.err.Error())
		if m.width > 0 {
			refusal = st.Renderer().NewStyle().Width(m.width).Render(refusal)
		}
		lines = append(lines, refusal)
	case m.Hint != "":
		lines = append(lines, st.Muted.Render(m.Hint))
	}
	return strings.Join(lines, "\n")
}

// Slot is where a screen keeps its prompt while one is open; the zero
// value is closed. A screen captures the keys exactly while Active.
type Slot struct {
	p     *Model
	width int
}

// Open shows p, at the width last given to SetWidth.
func (s *Slot) Open(p *Model) {
	s.p = p
	if s.width > 0 {
		p.SetWidth(s.width)
	}
}

// Close drops the open prompt, if any, as if cancelled.
func (s *Slot) Close() { s.p = nil }

// Active reports whether a prompt is open.
func (s *Slot) Active() bool { return s.p != nil }

// Err is the open prompt's refusal, or nil.
func (s *Slot) Err() error {
	if s.p == nil {
		return nil
	}
	return s.p.Err()
}

// SetWidth sets the width of the open prompt and of those opened later.
func (s *Slot) SetWidth(w int) {
	s.width = w
	if s.p != nil {
		s.p.SetWidth(w)
	}
}

// Update passes msg to the open prompt and closes it once answered or
// cancelled. With no prompt open it does nothing.
func (s *Slot) Update(msg tea.Msg) tea.Cmd {
	if s.p == nil {
		return nil
	}
	cmd := s.p.Update(msg)
	if s.p.Done() {
		s.p = nil
	}
	return cmd
}

// Retry submits the open prompt's answer again when its refusal says
// only that it had to wait (waiting reports so: a check whose data a
// command was still working out); else it does nothing.
func (s *Slot) Retry(waiting func(error) bool) tea.Cmd {
	if s.p == nil || s.p.err == nil || !waiting(s.p.err) {
		return nil
	}
	cmd := s.p.submit()
	if s.p.Done() {
		s.p = nil
	}
	return cmd
}

// View renders the open prompt, or "".
func (s *Slot) View() string {
	if s.p == nil {
		return ""
	}
	return s.p.View()
}

// ShortHelp lists the open prompt's keys (nil when closed).
func (s *Slot) ShortHelp() []key.Binding {
	if s.p == nil {
		return nil
	}
	return s.p.ShortHelp()
}

// FullHelp lists the open prompt's keys (nil when closed).
func (s *Slot) FullHelp() [][]key.Binding {
	if s.p == nil {
		return nil
	}
	return s.p.FullHelp()
}
