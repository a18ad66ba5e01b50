package analyses

import (
	"fmt"
	"strings"

	"github.com/charmbracelet/bubbles/key"
	tea "github.com/charmbracelet/bubbletea"
	"github.com/charmbracelet/x/ansi"

	"enthalpath/cycle/analysis"
	"enthalpath/tui/prompt"
	"enthalpath/tui/screen"
	"enthalpath/tui/session"
)

// Model is the analyses screen.
type Model struct {
	KeyMap KeyMap

	ctx     *screen.Context
	sess    *session.Session
	kinds   []kind
	args    []string // the last accepted arguments of each analysis
	results []any    // the last result of each analysis
	errs    []error
	running []bool
	analyst *analysis.Analyst
	cursor  int
	edit    prompt.Slot // the highlighted analysis's arguments, while typed
	gen     []int
	scroll  int // first result line shown, when the result is taller than the screen
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
		running: make([]bool, len(ks)), gen: make([]int, len(ks))}
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
func (m *Model) Capturing() bool { return m.edit.Active() }

// Editing reports whether arguments are being typed, and the refusal shown.
func (m *Model) Editing() (bool, error) { return m.edit.Active(), m.edit.Err() }

// Args returns the arguments analysis i runs with (the last accepted).
func (m *Model) Args(i int) string { return m.args[i] }

// SetSize sets the body size.
func (m *Model) SetSize(w, h int) { m.w, m.h = w, h; m.edit.SetWidth(w) }

// Cursor is the highlighted analysis; Result its last result and error.
func (m *Model) Cursor() int               { return m.cursor }
func (m *Model) Result(i int) (any, error) { return m.results[i], m.errs[i] }

// ShortHelp lists the main keys; while arguments are typed, the prompt's.
func (m *Model) ShortHelp() []key.Binding {
	if m.edit.Active() {
		return m.edit.ShortHelp()
	}
	k := m.KeyMap
	return []key.Binding{k.Down, k.Edit, k.Run}
}

// FullHelp lists every key; while arguments are typed, the prompt's.
func (m *Model) FullHelp() [][]key.Binding {
	if m.edit.Active() {
		return m.edit.FullHelp()
	}
	k := m.KeyMap
	groups := [][]key.Binding{{k.Up, k.Down}, {k.Edit, k.Run}}
	// The scroll keys are listed only when they would move the result.
	var scroll []key.Binding
	top, last := m.scrollRange()
	if top < last {
		scroll = append(scroll, k.More)
	}
	if top > 0 {
		scroll = append(scroll, k.Back)
	}
	if len(scroll) > 0 {
		groups = append(groups, scroll)
	}
	return groups
}

// Update handles keys and results.
func (m *Model) Update(msg tea.Msg) tea.Cmd {
	switch msg := msg.(type) {
	case resultMsg:
		if msg.gen == m.gen[msg.kind] {
			m.results[msg.kind], m.errs[msg.kind], m.running[msg.kind] = msg.result, msg.err, false
			if msg.kind == m.cursor {
				m.scroll = 0
			}
		}
		return nil
	case tea.KeyMsg:
		return m.key(msg)
	}
	return m.edit.Update(msg)
}

func (m *Model) key(k tea.KeyMsg) tea.Cmd {
	if m.edit.Active() {
		return m.edit.Update(k)
	}
	km := m.KeyMap
	switch {
	case key.Matches(k, km.Up):
		m.cursor, m.scroll = max(0, m.cursor-1), 0
	case key.Matches(k, km.Down):
		m.cursor, m.scroll = min(len(m.kinds)-1, m.cursor+1), 0
	case key.Matches(k, km.More):
		top, last := m.scrollRange()
		m.scroll = min(last, top+max(1, m.h/2))
	case key.Matches(k, km.Back):
		top, _ := m.scrollRange()
		m.scroll = max(0, top-max(1, m.h/2))
	case key.Matches(k, km.Edit):
		i := m.cursor
		k := m.kinds[i]
		m.edit.Open(prompt.New(m.ctx.Styles, "", m.args[i], "", m.ctx.MaxInputLen, m.acceptArgs(i),
			prompt.WithLabel(k.name+" › "), prompt.WithPlaceholder(k.syntax), prompt.WithSubmitHelp("run")))
	case key.Matches(k, km.Run):
		return m.run(m.cursor)
	}
	return nil
}

// acceptArgs checks arguments typed for analysis i; good ones are
// remembered for it and run.
func (m *Model) acceptArgs(i int) prompt.Accept {
	return func(text string) (tea.Cmd, error) {
		j, err := m.kinds[i].prepare(strings.Fields(text))
		if err != nil {
			return nil, err
		}
		m.args[i] = text
		return m.start(i, j), nil
	}
}

// run starts analysis i with its remembered arguments.
func (m *Model) run(i int) tea.Cmd {
	j, err := m.kinds[i].prepare(strings.Fields(m.args[i]))
	if err != nil {
		m.gen[i]++
		m.results[i], m.errs[i], m.running[i] = nil, err, false
		return nil
	}
	return m.start(i, j)
}

// start runs j for analysis i in a command.
func (m *Model) start(i int, j job) tea.Cmd {
	if m.analyst == nil {
		m.analyst = analysis.New(m.ctx.DB)
	}
	m.gen[i]++
	m.running[i] = true
	a, k, gen := m.analyst, m.kinds[i], m.gen[i]
	return func() (msg tea.Msg) {
		defer func() {
			if r := recover(); r != nil {
				msg = resultMsg{kind: i, gen: gen, err: fmt.Errorf("%s: internal error: %v", k.name, r)}
			}
		}()
		res, err := j(a)
		return resultMsg{kind: i, gen: gen, result: res, err: err}
	}
}

// View renders the list, the arguments and the last result.
func (m *Model) View() string { return m.window(m.parts()) }

// parts returns the screen's fixed head (the list, the arguments, the
// editor) and the body (the highlighted analysis's result), as entries.
func (m *Model) parts() ([]string, []string) {
	st := m.ctx.Styles
	km := m.KeyMap
	title := "Analyses beyond one cycle"
	aside := screen.Truncate(fmt.Sprintf(" — %s: arguments · %s: run again", km.Edit.Help().Key, km.Run.Help().Key), max(0, m.w-len([]rune(title))))
	lines := []string{st.Title.Render(title) + st.Muted.Render(aside)}
	nameWidth := 0
	for _, k := range m.kinds {
		nameWidth = max(nameWidth, len([]rune(k.name)))
	}
	for i, k := range m.kinds {
		cursor := " "
		if i == m.cursor {
			cursor = "›"
		}
		text := screen.Truncate(fmt.Sprintf("%s %-*s %-34s %s", cursor, nameWidth+1, k.name, screen.Truncate(m.args[i], 34), k.what), m.w)
		if i == m.cursor {
			text = st.Selected.Render(text)
		}
		lines = append(lines, text)
	}
	k := m.kinds[m.cursor]
	// The list cuts the descriptions to its width; the highlighted one
	// reads whole here, with its arguments.
	if ansi.StringWidth(fmt.Sprintf("  %-*s %-34s %s", nameWidth+1, k.name, "", k.what)) > m.w {
		for _, l := range screen.Wrap(k.name+": "+k.what, m.w, "  ") {
			lines = append(lines, st.Muted.Render(l))
		}
	}
	for _, l := range screen.WrapRow("arguments: "+k.syntax+"   e.g. "+k.example, m.w, "  ") {
		lines = append(lines, st.Muted.Render(l))
	}
	if m.edit.Active() {
		lines = append(lines, strings.Split(m.edit.View(), "\n")...)
	}
	lines = append(lines, "")
	var body []string
	switch {
	case m.running[m.cursor]:
		body = append(body, st.Muted.Render("running…"))
	case m.errs[m.cursor] != nil:
		body = append(body, st.Error.Render("not done: ")+wrap(m.errs[m.cursor].Error(), m.w-10))
	case m.results[m.cursor] != nil:
		body = append(body, m.render(m.results[m.cursor])...)
	default:
		body = append(body, st.Muted.Render(fmt.Sprintf("press %s to run %s on %s, or %s to change the arguments",
			km.Run.Help().Key, k.name, m.args[m.cursor], km.Edit.Help().Key)))
	}
	return lines, body
}

// window joins the fixed head and as much of the result body as fits,
// from the scroll position, with a line saying where the window is.
// Lines are counted on screen, not as entries: a wrapped entry holds several.
func (m *Model) window(headEntries, bodyEntries []string) string {
	head, rows := m.split(headEntries, bodyEntries)
	show, last := m.span(len(head), len(rows))
	if show == len(rows) {
		return strings.Join(append(head, rows...), "\n")
	}
	km := m.KeyMap
	top := min(m.scroll, last)
	where := m.ctx.Styles.Muted.Render(screen.Truncate(fmt.Sprintf("lines %d–%d of %d · %s down · %s up", top+1, top+show, len(rows),
		km.More.Help().Key, km.Back.Help().Key), m.w))
	return strings.Join(append(append(head, rows[top:top+show]...), where), "\n")
}

func (m *Model) split(headEntries, bodyEntries []string) (head, rows []string) {
	return strings.Split(strings.Join(headEntries, "\n"), "\n"), strings.Split(strings.Join(bodyEntries, "\n"), "\n")
}

// span returns how many result lines are shown and the last useful scroll
// position, for a head of h lines and a body of n.
func (m *Model) span(h, n int) (show, last int) {
	room := m.h - h
	if room < 2 || n <= room {
		return n, 0
	}
	return room - 1, n - (room - 1)
}

// scrollRange returns the current scroll position (clamped) and the last.
func (m *Model) scrollRange() (top, last int) {
	head, body := m.parts()
	h, rows := m.split(head, body)
	_, last = m.span(len(h), len(rows))
	return min(m.scroll, last), last
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
