package shelf

import (
	"fmt"
	"slices"
	"strings"

	"github.com/charmbracelet/bubbles/key"
	"github.com/charmbracelet/bubbles/textinput"
	tea "github.com/charmbracelet/bubbletea"
	"github.com/charmbracelet/lipgloss"

	"enthalpath/data"
	"enthalpath/thermo/notation"
	"enthalpath/tui/screen"
)

// Scenario is the invented setting of the demo the workshop opens on. The
// study, its group and its purpose are fictitious; the compounds are real
// rows of the data, chosen by that invented study.
const Scenario = "Demo (invented scenario): ★ = shortlist of the fictitious Larchmere group's heat-store study; " +
	"data real, cited."

// Shortlist is the invented study's candidate salts, pinned at the top of
// the shelf (those the data have).
var Shortlist = [...]string{"KCl", "MgO", "CaF2", "AgBr", "CsI", "LiF"}

// Model is the shelf screen.
type Model struct {
	KeyMap KeyMap

	ctx    *screen.Context
	input  textinput.Model
	all    []row
	shown  []int // indices into all
	cursor int
	top    int
	// typedNew is the filter when it is a whole formula the data lack: enter
	// then assembles it, and no row is highlighted until ↑/↓ picks one.
	typedNew string
	picked   bool
	w, h     int
	shortSet map[string]bool
}

type row struct {
	c         data.Compound
	shortlist bool
	user      bool
	haystack  string
}

var _ screen.Screen = (*Model)(nil)

// New builds the shelf over the compounds of ctx.DB.
func New(ctx *screen.Context) *Model {
	m := &Model{KeyMap: DefaultKeyMap(), ctx: ctx, shortSet: map[string]bool{}}
	for _, f := range Shortlist {
		m.shortSet[f] = true
	}
	ti := screen.NewInput(ctx.Styles, ctx.MaxInputLen)
	ti.Prompt = "formula or filter › "
	ti.Placeholder = "filter (empty: q quits, 1–6 screens)"
	ti.Focus()
	m.input = ti
	var compounds []data.Compound
	if ctx.DB != nil {
		compounds = ctx.DB.Compounds()
	}
	for _, c := range compounds {
		m.all = append(m.all, row{
			c:         c,
			shortlist: m.shortSet[c.Formula],
			user:      c.Formation.Source == "user" || c.Formation.Override,
			haystack:  strings.ToLower(strings.Join([]string{c.Formula, c.Name, c.Family, c.Structure}, " ")),
		})
	}
	// Shortlist first in the study's order, then the rest as the data list them.
	order := func(r row) int {
		if i := slices.Index(Shortlist[:], r.c.Formula); i >= 0 {
			return i
		}
		return len(Shortlist)
	}
	slices.SortStableFunc(m.all, func(a, b row) int { return order(a) - order(b) })
	m.refilter()
	return m
}

// Init starts the cursor blinking.
func (m *Model) Init() tea.Cmd { return nil }

// Title is the screen's name.
func (m *Model) Title() string { return "Shelf" }

// Capturing is true while the filter holds text: it then takes every
// printable key. While it is empty the workshop's printable keys act (q
// quits, 1–6 switch screens, u the units, ? the key list), as the
// placeholder says; a filter never starts with one of them in practice
// (formulas and names start with a letter, and q and u begin none of the
// data's formulas).
func (m *Model) Capturing() bool { return m.input.Value() != "" }

// SetSize sets the body size.
func (m *Model) SetSize(w, h int) {
	m.w, m.h = w, h
	m.input.Width = max(10, w-lipgloss.Width(m.input.Prompt)-2)
	m.clampScroll()
}

// ShortHelp lists the main keys.
func (m *Model) ShortHelp() []key.Binding {
	return []key.Binding{m.KeyMap.Open, m.KeyMap.Assemble}
}

// FullHelp lists every key.
func (m *Model) FullHelp() [][]key.Binding {
	k := m.KeyMap
	return [][]key.Binding{{k.Up, k.Down, k.PageUp, k.PageDown}, {k.Open, k.Assemble, k.Clear}}
}

// Filter returns the text typed so far.
func (m *Model) Filter() string { return strings.TrimSpace(m.input.Value()) }

// Selected returns the highlighted compound's formula, or "" when no row
// is highlighted (none matches, or the filter is a formula the data lack
// and no row was picked with ↑/↓).
func (m *Model) Selected() string {
	if len(m.shown) == 0 || m.typedNew != "" && !m.picked {
		return ""
	}
	return m.all[m.shown[m.cursor]].c.Formula
}

// Matches returns the formulas shown, in order.
func (m *Model) Matches() []string {
	out := make([]string, len(m.shown))
	for i, j := range m.shown {
		out[i] = m.all[j].c.Formula
	}
	return out
}

// Update handles keys.
func (m *Model) Update(msg tea.Msg) tea.Cmd {
	if k, ok := msg.(tea.KeyMsg); ok {
		switch {
		case key.Matches(k, m.KeyMap.Up):
			m.move(-1)
			return nil
		case key.Matches(k, m.KeyMap.Down):
			m.move(1)
			return nil
		case key.Matches(k, m.KeyMap.PageUp):
			m.move(-m.listHeight())
			return nil
		case key.Matches(k, m.KeyMap.PageDown):
			m.move(m.listHeight())
			return nil
		case key.Matches(k, m.KeyMap.Clear):
			m.input.SetValue("")
			m.refilter()
			return nil
		case key.Matches(k, m.KeyMap.Open), key.Matches(k, m.KeyMap.Assemble):
			return m.open(key.Matches(k, m.KeyMap.Assemble))
		}
	}
	before := m.input.Value()
	var cmd tea.Cmd
	m.input, cmd = m.input.Update(msg)
	if m.input.Value() != before {
		m.refilter()
	}
	return cmd
}

func (m *Model) open(guided bool) tea.Cmd {
	// A whole formula the data lack is assembled as typed, even if the
	// filter still shows compounds that contain it (MgCl shows MgCl2):
	// always by ctrl+g, by enter unless a row was picked with ↑/↓.
	if typed := m.typedNew; typed != "" && (guided || !m.picked) {
		return func() tea.Msg { return screen.OpenMsg{Formula: typed, Guided: true} }
	}
	formula := m.Selected()
	if formula == "" {
		formula = m.Filter()
		guided = true // nothing in the data: the assembly is where it starts
	}
	if formula == "" {
		return screen.Fail(fmt.Errorf("type a formula first (for example NaCl), or pick one with ↑/↓"))
	}
	return func() tea.Msg { return screen.OpenMsg{Formula: formula, Guided: guided} }
}

// lacks reports whether s is a formula of two or more elements that no
// compound of the shelf has (the same composition counts as the same).
func (m *Model) lacks(s string) bool {
	f, err := notation.ParseFormula(s)
	if err != nil || len(f.Composition()) < 2 {
		return false
	}
	want := f.Hill()
	for _, r := range m.all {
		if g, err := notation.ParseFormula(r.c.Formula); err == nil && g.Hill() == want {
			return false
		}
	}
	return true
}

func (m *Model) move(d int) {
	if len(m.shown) == 0 {
		return
	}
	if m.typedNew != "" && !m.picked {
		// The first move picks the first row rather than passing it.
		m.picked = true
		d = max(0, d-1)
	}
	m.cursor = max(0, min(len(m.shown)-1, m.cursor+d))
	m.clampScroll()
}

// refilter recomputes the shown rows: every word of the filter must occur
// in the formula, name, family or structure (case-insensitive); a row whose
// formula equals the filter comes first.
func (m *Model) refilter() {
	f := strings.ToLower(m.Filter())
	words := strings.Fields(f)
	m.shown = m.shown[:0]
	exact := -1
	for i, r := range m.all {
		ok := true
		for _, w := range words {
			if !strings.Contains(r.haystack, w) {
				ok = false
				break
			}
		}
		if !ok {
			continue
		}
		if f != "" && strings.ToLower(r.c.Formula) == f && exact < 0 {
			exact = len(m.shown)
		}
		m.shown = append(m.shown, i)
	}
	if exact > 0 {
		e := m.shown[exact]
		copy(m.shown[1:exact+1], m.shown[:exact])
		m.shown[0] = e
	}
	m.cursor, m.top = 0, 0
	m.typedNew, m.picked = "", false
	if typed := m.Filter(); m.lacks(typed) {
		m.typedNew = typed
	}
}

func (m *Model) listHeight() int { return max(1, m.h-5-len(m.scenarioLines())) }

// scenarioLines is the demo's note, wrapped to the width (it says what is
// invented and that the data are real, so none of it is cut).
func (m *Model) scenarioLines() []string { return screen.Wrap(Scenario, m.w, "  ") }

// columnWidths gives the name and family columns the room a window wider
// than 80 columns has: the family first (its longest entries run to about
// 30 characters), then the name.
func (m *Model) columnWidths() (name, family int) {
	extra := max(0, m.w-80)
	family = 16 + min(extra, 14)
	name = 22 + min(extra-(family-16), 12)
	return name, family
}

func (m *Model) clampScroll() {
	lh := m.listHeight()
	if m.cursor < m.top {
		m.top = m.cursor
	}
	if m.cursor >= m.top+lh {
		m.top = m.cursor - lh + 1
	}
}

// View renders the shelf.
func (m *Model) View() string {
	st := m.ctx.Styles
	var lines []string
	for _, l := range m.scenarioLines() {
		lines = append(lines, st.Muted.Render(l))
	}
	lines = append(lines, m.input.View())
	unit := m.ctx.Units.String()
	nameW, famW := m.columnWidths()
	header := fmt.Sprintf("   %-9s %-*s %-*s %12s  %-12s", "formula", nameW, "name", famW, "family", "ΔfH°("+unit+")", "structure")
	lines = append(lines, st.Title.Render(screen.Truncate(header, m.w)))
	lh := m.listHeight()
	if m.typedNew != "" && len(m.shown) > 0 {
		msg := fmt.Sprintf("%s is not in the data: enter assembles it step by step · ↓ picks a row below", m.typedNew)
		if m.picked {
			msg = fmt.Sprintf("enter opens the highlighted row · ctrl+g assembles %s (not in the data)", m.typedNew)
		}
		lines = append(lines, st.Accent.Render(screen.Truncate(msg, m.w)))
	}
	if len(m.shown) == 0 {
		msg := "No compound of the data matches."
		if f := m.Filter(); f != "" {
			msg += fmt.Sprintf(" Enter assembles a cycle for %q step by step from element data.", f)
		}
		lines = append(lines, st.Warn.Render(screen.Truncate(msg, m.w)))
	}
	for i := m.top; i < len(m.shown) && i < m.top+lh; i++ {
		r := m.all[m.shown[i]]
		mark := " "
		switch {
		case r.shortlist:
			mark = "★"
		case r.user:
			mark = "u"
		}
		cursor := " "
		highlighted := i == m.cursor && (m.typedNew == "" || m.picked)
		if highlighted {
			cursor = "›"
		}
		form := "—"
		if r.c.Formation.Known() {
			form = m.ctx.Energy(r.c.Formation.V)
		}
		structure := r.c.Structure
		if structure == "" {
			structure = "—"
		}
		text := fmt.Sprintf("%s%s %-9s %-*s %-*s %12s  %-12s", cursor, mark, r.c.Formula, nameW, screen.Truncate(r.c.Name, nameW),
			famW, screen.Truncate(r.c.Family, famW), form, structure)
		text = screen.Truncate(text, m.w)
		if highlighted {
			text = st.Selected.Render(text)
		}
		lines = append(lines, text)
	}
	for len(lines) < m.h-1 {
		lines = append(lines, "")
	}
	foot := fmt.Sprintf("%d of %d compounds · ★ the invented study's shortlist · u from your data file", len(m.shown), len(m.all))
	lines = append(lines, st.Muted.Render(screen.Truncate(foot, m.w)))
	return lipgloss.JoinVertical(lipgloss.Left, lines[:min(len(lines), max(m.h, 1))]...)
}
