package analyses

import (
	"fmt"
	"strings"

	"github.com/charmbracelet/bubbles/key"
	"github.com/charmbracelet/bubbles/textinput"
	tea "github.com/charmbracelet/bubbletea"

	"enthalpath/cycle/analysis"
	"enthalpath/tui/screen"
	"enthalpath/tui/session"
)

// Model is the analyses screen.
type Model struct {
	KeyMap KeyMap

	ctx     *screen.Context
	sess    *session.Session
	kinds   []kind
	args    []string // the last arguments of each analysis
	results []any    // the last result of each analysis
	errs    []error
	running []bool
	analyst *analysis.Analyst
	cursor  int
	editing bool
	input   textinput.Model
	gen     []int
	w, h    int
}

var _ screen.Screen = (*Model)(nil)

// resultMsg is the answer of one run.
type resultMsg struct {
	kind, gen int
	result    any
	err       error
}

// New returns the analyses screen, each analysis filled with an example.
func New(ctx *screen.Context, sess *session.Session) *Model {
	ks := kinds()
	m := &Model{KeyMap: DefaultKeyMap(), ctx: ctx, sess: sess, kinds: ks,
		args: make([]string, len(ks)), results: make([]any, len(ks)), errs: make([]error, len(ks)),
		running: make([]bool, len(ks)), gen: make([]int, len(ks)), input: screen.NewInput(ctx.Styles, ctx.MaxInputLen)}
	for i, k := range ks {
		m.args[i] = k.example
	}
	return m
}

// Init does nothing: analyses run when asked.
func (m *Model) Init() tea.Cmd { return nil }

// Title is the screen's name.
func (m *Model) Title() string { return "Analyses" }

// Capturing reports whether arguments are being typed.
func (m *Model) Capturing() bool { return m.editing }

// SetSize sets the body size.
func (m *Model) SetSize(w, h int) { m.w, m.h = w, h; m.input.Width = max(10, w-20) }

// Cursor is the highlighted analysis; Result its last result and error.
func (m *Model) Cursor() int               { return m.cursor }
func (m *Model) Result(i int) (any, error) { return m.results[i], m.errs[i] }

// ShortHelp lists the main keys.
func (m *Model) ShortHelp() []key.Binding {
	k := m.KeyMap
	if m.editing {
		return []key.Binding{k.Accept, k.Cancel}
	}
	return []key.Binding{k.Down, k.Edit, k.Run}
}

// FullHelp lists every key.
func (m *Model) FullHelp() [][]key.Binding {
	k := m.KeyMap
	return [][]key.Binding{{k.Up, k.Down}, {k.Edit, k.Run}}
}

// Update handles keys and results.
func (m *Model) Update(msg tea.Msg) tea.Cmd {
	switch msg := msg.(type) {
	case resultMsg:
		if msg.gen == m.gen[msg.kind] {
			m.results[msg.kind], m.errs[msg.kind], m.running[msg.kind] = msg.result, msg.err, false
		}
		return nil
	case tea.KeyMsg:
		return m.key(msg)
	}
	if m.editing {
		var cmd tea.Cmd
		m.input, cmd = m.input.Update(msg)
		return cmd
	}
	return nil
}

func (m *Model) key(k tea.KeyMsg) tea.Cmd {
	km := m.KeyMap
	if m.editing {
		switch {
		case key.Matches(k, km.Cancel):
			m.editing = false
			m.input.Blur()
			return nil
		case key.Matches(k, km.Accept):
			m.editing = false
			m.input.Blur()
			m.args[m.cursor] = strings.TrimSpace(m.input.Value())
			return m.run(m.cursor)
		}
		var cmd tea.Cmd
		m.input, cmd = m.input.Update(k)
		return cmd
	}
	switch {
	case key.Matches(k, km.Up):
		m.cursor = max(0, m.cursor-1)
	case key.Matches(k, km.Down):
		m.cursor = min(len(m.kinds)-1, m.cursor+1)
	case key.Matches(k, km.Edit):
		m.editing = true
		m.input.Prompt = m.kinds[m.cursor].name + " › "
		m.input.Placeholder = m.kinds[m.cursor].syntax
		m.input.SetValue(m.args[m.cursor])
		m.input.CursorEnd()
		return m.input.Focus()
	case key.Matches(k, km.Run):
		return m.run(m.cursor)
	}
	return nil
}

// run starts analysis i with its arguments in a command.
func (m *Model) run(i int) tea.Cmd {
	if m.analyst == nil {
		m.analyst = analysis.New(m.ctx.DB)
	}
	m.gen[i]++
	m.running[i] = true
	a, k, gen, args := m.analyst, m.kinds[i], m.gen[i], strings.Fields(m.args[i])
	return func() (msg tea.Msg) {
		defer func() {
			if r := recover(); r != nil {
				msg = resultMsg{kind: i, gen: gen, err: fmt.Errorf("%s: internal error: %v", k.name, r)}
			}
		}()
		res, err := k.run(a, args)
		return resultMsg{kind: i, gen: gen, result: res, err: err}
	}
}

// View renders the list, the arguments and the last result.
func (m *Model) View() string {
	st := m.ctx.Styles
	lines := []string{st.Title.Render("Analyses beyond one cycle") + st.Muted.Render(" — e types the arguments, enter runs")}
	for i, k := range m.kinds {
		cursor := " "
		if i == m.cursor {
			cursor = "›"
		}
		text := trunc(fmt.Sprintf("%s %-9s %-34s %s", cursor, k.name, trunc(m.args[i], 34), k.what), m.w)
		if i == m.cursor {
			text = st.Selected.Render(text)
		}
		lines = append(lines, text)
	}
	k := m.kinds[m.cursor]
	lines = append(lines, st.Muted.Render(trunc("arguments: "+k.syntax+"   e.g. "+k.example, m.w)))
	if m.editing {
		lines = append(lines, m.input.View())
	}
	lines = append(lines, "")
	switch {
	case m.running[m.cursor]:
		lines = append(lines, st.Muted.Render("running…"))
	case m.errs[m.cursor] != nil:
		lines = append(lines, st.Error.Render("not done: ")+wrap(m.errs[m.cursor].Error(), m.w-10))
	case m.results[m.cursor] != nil:
		lines = append(lines, m.render(m.results[m.cursor])...)
	default:
		lines = append(lines, st.Muted.Render("press r to run "+k.name+" on "+m.args[m.cursor]+", or e to change the arguments"))
	}
	if len(lines) > m.h {
		lines = append(lines[:m.h-1], st.Muted.Render("… (enlarge the window for the rest)"))
	}
	return strings.Join(lines, "\n")
}

func trunc(s string, n int) string {
	r := []rune(s)
	if len(r) <= n {
		return s
	}
	if n <= 1 {
		return string(r[:max(n, 0)])
	}
	return string(r[:n-1]) + "…"
}

// wrap breaks s into lines of at most w cells at spaces.
func wrap(s string, w int) string {
	if w < 10 {
		return s
	}
	var out []string
	line := ""
	for _, word := range strings.Fields(s) {
		if line != "" && len([]rune(line))+1+len([]rune(word)) > w {
			out = append(out, line)
			line = ""
		}
		if line != "" {
			line += " "
		}
		line += word
	}
	if line != "" {
		out = append(out, line)
	}
	return strings.Join(out, "\n")
}
