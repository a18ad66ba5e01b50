package modelpanel

import (
	"fmt"
	"math"
	"strings"

	"github.com/charmbracelet/bubbles/key"
	tea "github.com/charmbracelet/bubbletea"

	"enthalpath/cycle"
	"enthalpath/tui/prompt"
	"enthalpath/tui/screen"
	"enthalpath/tui/session"
)

// Model is the model panel.
type Model struct {
	KeyMap KeyMap

	ctx  *screen.Context
	sess *session.Session

	rows   []setting
	cursor int
	edit   prompt.Slot // the highlighted setting, while typed
	// reading is the structure file being read by a command, "" if none.
	reading string
	w, h    int
}

var _ screen.Screen = (*Model)(nil)

// New returns the model panel over the session's cycle.
func New(ctx *screen.Context, sess *session.Session) *Model {
	return &Model{KeyMap: DefaultKeyMap(), ctx: ctx, sess: sess, rows: settingsRows()}
}

// Init does nothing.
func (m *Model) Init() tea.Cmd { return nil }

// Title is the screen's name.
func (m *Model) Title() string { return "Models" }

// Capturing reports whether a setting is being typed.
func (m *Model) Capturing() bool { return m.edit.Active() }

// SetSize sets the body size.
func (m *Model) SetSize(w, h int) { m.w, m.h = w, h; m.edit.SetWidth(w) }

// Cursor returns the highlighted setting's index; Editing whether it is
// being typed and the refusal shown.
func (m *Model) Cursor() int            { return m.cursor }
func (m *Model) Editing() (bool, error) { return m.edit.Active(), m.edit.Err() }
func (m *Model) SettingNames() (out []string) {
	for _, r := range m.rows {
		out = append(out, r.name)
	}
	return out
}

// ShortHelp lists the main keys; while a setting is typed, the prompt's.
func (m *Model) ShortHelp() []key.Binding {
	if m.edit.Active() {
		return m.edit.ShortHelp()
	}
	if m.sess.Cycle == nil {
		return nil // no setting to change before a cycle is open
	}
	k := m.KeyMap
	return []key.Binding{k.Down, k.Edit, k.Next, k.Default}
}

// FullHelp lists every key; while a setting is typed, the prompt's.
func (m *Model) FullHelp() [][]key.Binding {
	if m.edit.Active() {
		return m.edit.FullHelp()
	}
	if m.sess.Cycle == nil {
		return nil
	}
	k := m.KeyMap
	return [][]key.Binding{{k.Up, k.Down}, {k.Edit, k.Next, k.Prev, k.Default}}
}

// Update handles keys and the answer of a structure file read.
func (m *Model) Update(msg tea.Msg) tea.Cmd {
	if r, ok := msg.(structureReadMsg); ok {
		return m.structureRead(r)
	}
	k, ok := msg.(tea.KeyMsg)
	if !ok || m.edit.Active() {
		return m.edit.Update(msg)
	}
	c := m.sess.Cycle
	if c == nil {
		return screen.Status("No cycle yet: open a compound from the Shelf first.")
	}
	row := m.rows[m.cursor]
	km := m.KeyMap
	switch {
	case key.Matches(k, km.Up):
		m.cursor = max(0, m.cursor-1)
	case key.Matches(k, km.Down):
		m.cursor = min(len(m.rows)-1, m.cursor+1)
	case key.Matches(k, km.Edit):
		m.openEdit(row, "")
	case key.Matches(k, km.Next), key.Matches(k, km.Prev):
		d := 1
		if key.Matches(k, km.Prev) {
			d = -1
		}
		cmd, err := m.sess.Change(func(c *cycle.Cycle) error { return step(row, c, d) })
		if err != nil {
			return screen.Fail(err)
		}
		return tea.Batch(cmd, screen.Status(row.name+": "+row.show(&c.Settings)+"."))
	case key.Matches(k, km.Default):
		cmd, _ := m.sess.Change(func(c *cycle.Cycle) error { row.reset(c); return nil })
		return tea.Batch(cmd, screen.Status(row.name+" back to its default."))
	}
	return nil
}

// openEdit opens the prompt to type row's value, starting from text.
func (m *Model) openEdit(row setting, text string, opts ...prompt.Option) {
	opts = append([]prompt.Option{prompt.WithLabel(row.name + " › "), prompt.WithPlaceholder(row.hint)}, opts...)
	m.edit.Open(prompt.New(m.ctx.Styles, "", text, "", m.ctx.MaxInputLen, m.acceptSetting(row), opts...))
}

// acceptSetting applies text typed for row through its parse, which
// refuses what the setting cannot take; the status line says the result.
// A structure file is read by a command instead (structurefile.go).
func (m *Model) acceptSetting(row setting) prompt.Accept {
	return func(text string) (tea.Cmd, error) {
		if row.file && isStructureFile(text) {
			return m.readStructure(row, text)
		}
		cmd, err := m.sess.Change(func(c *cycle.Cycle) error { return row.parse(c, text) })
		if err != nil {
			return nil, err
		}
		return tea.Batch(cmd, screen.Status(row.name+": "+row.show(&m.sess.Cycle.Settings)+".")), nil
	}
}

// View renders the panel.
func (m *Model) View() string {
	st := m.ctx.Styles
	c := m.sess.Cycle
	if c == nil {
		return st.Muted.Render("No cycle open: pick a compound on the Shelf first.")
	}
	var lines []string
	res := m.sess.Solved()
	ref := c.Settings.LatticeFrom // the model the lattice step comes from, "" for the cycle
	switch {
	case res != nil && ref != "":
		// The lattice step is a model's: the reference is named for what
		// it is, and the gaps below are one model against another.
		head := fmt.Sprintf("%s: lattice from the %s model %s = %s %s", c.Formula, ref, c.Conventions.Lattice.Symbol(),
			m.ctx.SignedPM(res.Lattice.In(c.Conventions.Lattice), res.Lattice.Uncertainty), m.ctx.Units)
		if more := " · " + res.Solved.Key + " solved from it"; len([]rune(head+more)) <= m.w {
			head += more
		}
		lines = append(lines, st.Title.Render(screen.Truncate(head, m.w)))
	case res != nil:
		cycleValue := res.Lattice.In(c.Conventions.Lattice)
		lines = append(lines, st.Title.Render(fmt.Sprintf("%s: cycle lattice %s = %s %s", c.Formula, c.Conventions.Lattice.Symbol(),
			m.ctx.SignedPM(cycleValue, res.Lattice.Uncertainty), m.ctx.Units)))
	case !m.sess.Fresh():
		lines = append(lines, st.Muted.Render("solving…"))
	default:
		wrapped := screen.Wrap("The cycle is not solved: "+session.Explain(m.sess.SolveErr), m.w, "  ")
		for _, l := range wrapped {
			lines = append(lines, st.Error.Render(l))
		}
	}
	lines = append(lines, m.modelTable(res, ref)...)
	// The explanations wrap rather than lose their end.
	note := verdictNote(res)
	if ref != "" {
		note = "gap = " + ref + " − model: model–model differences, no covalency verdict"
	}
	for _, l := range screen.Wrap(note, m.w, "  ") {
		lines = append(lines, st.Muted.Render(l))
	}
	lines = append(lines, m.madelungLines(res)...)
	lines = append(lines, m.extendedLines(res)...)
	lines = append(lines, m.siteLines()...)
	// The settings take the rows left; when too few, the list scrolls with
	// the cursor and its title says which rows are shown.
	var edit []string
	switch {
	case m.edit.Active():
		edit = strings.Split(m.edit.View(), "\n")
	case m.reading != "":
		edit = []string{st.Muted.Render(screen.Truncate("reading "+m.reading+" and assigning its charges…", m.w))}
	}
	room := m.h - len(lines) - 2 - len(edit)
	if room < len(m.rows) {
		room++ // the blank line goes first
	} else {
		lines = append(lines, "")
	}
	room = max(room, 1)
	first := min(max(0, m.cursor-room+1), max(0, len(m.rows)-room))
	last := min(len(m.rows), first+room)
	title := " (↑/↓ choose · e type · ←/→ step · r default)"
	if first > 0 || last < len(m.rows) {
		title = fmt.Sprintf(" %d–%d of %d, ↑/↓ for more · e type · ←/→ step · r default", first+1, last, len(m.rows))
	}
	lines = append(lines, st.Title.Render("Settings")+st.Muted.Render(screen.Truncate(title, m.w-8)))
	for i, r := range m.rows[first:last] {
		i += first
		cursor := " "
		if i == m.cursor {
			cursor = "›"
		}
		text := screen.Truncate(fmt.Sprintf("%s %-22s %s", cursor, r.name, r.show(&c.Settings)), m.w)
		if i == m.cursor {
			text = st.Selected.Render(text)
		}
		lines = append(lines, text)
	}
	lines = append(lines, edit...)
	if len(lines) > m.h {
		lines = lines[:m.h]
	}
	return strings.Join(lines, "\n")
}

// barCell is the percent one cell of the gap bar stands for.
const barCell = 2.0

// modelTable lists the models against the lattice value; ref names the
// model that value comes from ("" for the cycle), whose gaps are then
// model–model differences and carry no verdict.
func (m *Model) modelTable(res *cycle.Result, ref string) []string {
	st := m.ctx.Styles
	var models []cycle.ModelResult
	if res != nil {
		models = res.Models
	}
	nameW := 13
	half := 5
	if m.w >= 110 {
		half = 10
	}
	scale := fmt.Sprintf("−%g%%", barCell*float64(half))
	scale = scale + strings.Repeat(" ", max(1, 2*half+1-2*len([]rune(scale))-1)) + "0" + strings.Replace(scale, "−", "+", 1)
	verdictW := max(10, m.w-nameW-10-9-8-(2*half+1)-6)
	verdictHead := "verdict"
	if ref != "" {
		verdictHead = "no verdict"
	}
	head := fmt.Sprintf("%-*s %10s %9s %8s %-*s %s", nameW, "model", m.ctx.Units.String(), "gap", "gap %", 2*half+1, screen.Truncate(scale, 2*half+1), verdictHead)
	out := []string{st.Title.Render(screen.Truncate(head, m.w))}
	if len(models) == 0 {
		return append(out, st.Muted.Render("  (the models appear once the cycle is solved)"))
	}
	for _, mr := range models {
		if !mr.OK() {
			lead := fmt.Sprintf("%-*s %10s  ", nameW, mr.Model, "—")
			for i, l := range screen.Wrap("not available: "+session.Message(mr.Err), m.w-len([]rune(lead)), "") {
				if i > 0 {
					lead = strings.Repeat(" ", len([]rune(lead)))
				}
				out = append(out, lead+l)
			}
			continue
		}
		verdict, _ := screen.Verdict(mr.Verdict.Character, verdictW)
		switch {
		case ref == mr.Model:
			verdict = "reference"
		case ref != "":
			verdict = "model–model"
		}
		line := fmt.Sprintf("%-*s %10s %9s %8s %s %s", nameW, mr.Model, m.ctx.Signed(mr.Value), m.ctx.Signed(mr.Gap), pct(mr.GapPercent),
			bar(mr.GapPercent, half), verdict)
		out = append(out, screen.Truncate(line, m.w))
	}
	if hb := res.Handbook; hb != nil {
		out = append(out, st.Muted.Render(screen.Truncate(fmt.Sprintf("%-*s %10s %9s %8s  (%s, tabulated as %s)", nameW, "handbook", m.ctx.Signed(hb.Value),
			m.ctx.Signed(hb.Difference), pct(hb.Percent), hb.Source.Key, hb.Convention.Symbol()), m.w)))
	}
	return out
}

func pct(v float64) string {
	if math.IsNaN(v) {
		return "—"
	}
	return strings.Replace(fmt.Sprintf("%+.1f %%", v), "-", "−", 1)
}

// bar draws a gap in percent as a bar about zero, barCell percent a cell,
// barHalf cells each side, clipped with an arrow: negative to the left.
func bar(pct float64, barHalf int) string {
	cells := []rune(strings.Repeat("·", barHalf) + "│" + strings.Repeat("·", barHalf))
	if math.IsNaN(pct) {
		return string(cells)
	}
	n := int(math.Round(math.Abs(pct) / barCell))
	clipped := n > barHalf
	n = min(n, barHalf)
	for i := 1; i <= n; i++ {
		if pct < 0 {
			cells[barHalf-i] = '█'
		} else {
			cells[barHalf+i] = '█'
		}
	}
	if clipped {
		if pct < 0 {
			cells[0] = '◀'
		} else {
			cells[2*barHalf] = '▶'
		}
	}
	return string(cells)
}

func (m *Model) madelungLines(res *cycle.Result) []string {
	st := m.ctx.Styles
	if res == nil {
		return []string{""}
	}
	mr, ok := res.Model(cycle.ModelEwald)
	if !ok || !mr.OK() || mr.Inputs.Madelung == 0 {
		return []string{st.Muted.Render("Ewald Madelung constant: not available for this structure")}
	}
	in := mr.Inputs
	return screen.Wrap(fmt.Sprintf("Ewald Madelung constant A = %.6f for %s, referred to d₀ = %.4f Å (%s; tin-foil boundary)",
		in.Madelung, in.Structure, in.D0, in.MadelungFrom), m.w, "  ")
}
