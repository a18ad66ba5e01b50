package survey

import (
	"cmp"
	"fmt"
	"math"
	"slices"
	"strings"

	"github.com/charmbracelet/bubbles/key"
	"github.com/charmbracelet/bubbles/textinput"
	tea "github.com/charmbracelet/bubbletea"
	"github.com/charmbracelet/lipgloss"
	"github.com/charmbracelet/x/ansi"

	"enthalpath/cycle"
	"enthalpath/thermo"
	"enthalpath/tui/plot"
	"enthalpath/tui/screen"
	"enthalpath/tui/session"
)

// The columns the table sorts by, in the order s steps through them.
var sortNames = [...]string{"formula", "family", "cycle", "model", "gap", "gap %"}

// Views of the survey.
const (
	viewTable = iota
	viewScatter
	viewStrip
	viewCount
)

// Model is the survey screen.
type Model struct {
	KeyMap KeyMap

	ctx       *screen.Context
	rows      []Row
	shown     []int
	computing bool
	computed  bool
	cursor    int
	top       int
	sortBy    int
	reverse   bool
	model     int // index into cycle.ModelNames()
	view      int
	logScale  bool // the chart's axes on a log scale of |value|
	filtering bool
	filter    textinput.Model
	w, h      int
}

var _ screen.Screen = (*Model)(nil)

// New returns the survey; it computes nothing until shown.
func New(ctx *screen.Context) *Model {
	ti := screen.NewInput(ctx.Styles, ctx.MaxInputLen)
	ti.Prompt = "filter › "
	return &Model{KeyMap: DefaultKeyMap(), ctx: ctx, filter: ti, model: 1, sortBy: 1}
}

// Init does nothing: the survey is computed when first shown.
func (m *Model) Init() tea.Cmd { return nil }

// Title is the screen's name.
func (m *Model) Title() string { return "Survey" }

// Capturing reports whether the filter is being typed.
func (m *Model) Capturing() bool { return m.filtering }

// SetSize sets the body size.
func (m *Model) SetSize(w, h int) { m.w, m.h = w, h }

// Computed reports whether the rows are there; Shown returns the formulas
// shown in order; Sort the sort column name and direction; ModelName the
// model of the gap column; ViewIndex the view (0 table, 1 scatter, 2 strip).
func (m *Model) Computed() bool { return m.computed }
func (m *Model) Shown() []string {
	out := make([]string, len(m.shown))
	for i, j := range m.shown {
		out[i] = m.rows[j].Formula
	}
	return out
}
func (m *Model) Sort() (string, bool) { return sortNames[m.sortBy], m.reverse }
func (m *Model) ModelName() string    { return cycle.ModelNames()[m.model] }
func (m *Model) ViewIndex() int       { return m.view }
func (m *Model) Cursor() int          { return m.cursor }

// ShortHelp lists the main keys.
func (m *Model) ShortHelp() []key.Binding {
	k := m.KeyMap
	if m.filtering {
		return []key.Binding{k.Done, k.Clear}
	}
	if m.view == viewScatter {
		return []key.Binding{k.Scale, k.Model, k.View, k.Filter}
	}
	return []key.Binding{k.Open, k.Filter, k.Sort, k.Model, k.View}
}

// FullHelp lists every key.
func (m *Model) FullHelp() [][]key.Binding {
	k := m.KeyMap
	last := []key.Binding{k.Model, k.View, k.Open}
	if m.view == viewScatter {
		last = append(last, k.Scale) // only the chart has axes to change
	}
	return [][]key.Binding{{k.Up, k.Down, k.PageUp, k.PageDown, k.First, k.Last}, {k.Filter, k.Sort, k.Reverse}, last}
}

// Update handles keys and the computed rows.
func (m *Model) Update(msg tea.Msg) tea.Cmd {
	switch msg := msg.(type) {
	case screen.ShownMsg:
		if !m.computed && !m.computing {
			m.computing = true
			return Compute(m.ctx.DB)
		}
		return nil
	case ComputedMsg:
		m.rows, m.computed, m.computing = msg.Rows, true, false
		m.refresh()
		return nil
	case tea.KeyMsg:
		return m.key(msg)
	}
	if m.filtering {
		var cmd tea.Cmd
		m.filter, cmd = m.filter.Update(msg)
		return cmd
	}
	return nil
}

func (m *Model) key(k tea.KeyMsg) tea.Cmd {
	km := m.KeyMap
	if m.filtering {
		switch {
		case key.Matches(k, km.Done):
			m.filtering = false
			m.filter.Blur()
		case key.Matches(k, km.Clear):
			m.filtering = false
			m.filter.SetValue("")
			m.filter.Blur()
			m.refresh()
		default:
			var cmd tea.Cmd
			m.filter, cmd = m.filter.Update(k)
			m.refresh()
			return cmd
		}
		return nil
	}
	switch {
	case key.Matches(k, km.Up):
		m.move(-1)
	case key.Matches(k, km.Down):
		m.move(1)
	case key.Matches(k, km.PageUp):
		m.move(-m.tableRows())
	case key.Matches(k, km.PageDown):
		m.move(m.tableRows())
	case key.Matches(k, km.First):
		m.move(-len(m.shown))
	case key.Matches(k, km.Last):
		m.move(len(m.shown))
	case key.Matches(k, km.Filter):
		m.filtering = true
		return m.filter.Focus()
	case key.Matches(k, km.Clear):
		m.filter.SetValue("")
		m.refresh()
	case key.Matches(k, km.Sort):
		m.sortBy = (m.sortBy + 1) % len(sortNames)
		m.resort()
	case key.Matches(k, km.Reverse):
		m.reverse = !m.reverse
		m.resort()
	case key.Matches(k, km.Model):
		m.model = (m.model + 1) % len(cycle.ModelNames())
		if m.sortByModel() {
			m.resort() // the order changes with the model
		} else {
			m.refresh()
		}
	case key.Matches(k, km.View):
		m.view = (m.view + 1) % viewCount
	case m.view == viewScatter && key.Matches(k, km.Scale):
		m.logScale = !m.logScale
	case key.Matches(k, km.Open):
		if len(m.shown) == 0 {
			return nil
		}
		f := m.rows[m.shown[m.cursor]].Formula
		return func() tea.Msg { return screen.OpenMsg{Formula: f} }
	}
	return nil
}

func (m *Model) move(d int) {
	if len(m.shown) > 0 {
		m.cursor = max(0, min(len(m.shown)-1, m.cursor+d))
	}
}

// resort re-sorts and puts the cursor and the view on the first row.
func (m *Model) resort() {
	m.refresh()
	m.cursor, m.top = 0, 0
}

// sortByModel reports whether the sort column depends on the gap model.
func (m *Model) sortByModel() bool {
	switch sortNames[m.sortBy] {
	case "model", "gap", "gap %":
		return true
	}
	return false
}

// refresh re-filters and re-sorts, keeping the highlighted compound.
func (m *Model) refresh() {
	keep := ""
	if m.cursor < len(m.shown) {
		keep = m.rows[m.shown[m.cursor]].Formula
	}
	words := strings.Fields(strings.ToLower(m.filter.Value()))
	m.shown = m.shown[:0]
	for i, r := range m.rows {
		hay := strings.ToLower(r.Formula + " " + r.Family)
		ok := true
		for _, w := range words {
			ok = ok && strings.Contains(hay, w)
		}
		if ok {
			m.shown = append(m.shown, i)
		}
	}
	slices.SortStableFunc(m.shown, func(a, b int) int {
		c := m.compare(&m.rows[a], &m.rows[b])
		if m.reverse {
			c = -c
		}
		return c
	})
	m.cursor = 0
	for i, j := range m.shown {
		if m.rows[j].Formula == keep {
			m.cursor = i
		}
	}
}

// compare orders two rows by the sort column; NaN values go last.
func (m *Model) compare(a, b *Row) int {
	num := func(x, y float64) int {
		switch {
		case math.IsNaN(x) && math.IsNaN(y):
			return 0
		case math.IsNaN(x):
			return 1
		case math.IsNaN(y):
			return -1
		}
		return cmp.Compare(x, y)
	}
	switch sortNames[m.sortBy] {
	case "formula":
		return strings.Compare(a.Formula, b.Formula)
	case "family":
		return cmp.Or(strings.Compare(a.Family, b.Family), strings.Compare(a.Formula, b.Formula))
	case "cycle":
		return num(a.Cycle, b.Cycle)
	case "model":
		return num(a.Models[m.model], b.Models[m.model])
	case "gap":
		return num(a.Gaps[m.model], b.Gaps[m.model])
	}
	return num(a.GapPercents[m.model], b.GapPercents[m.model])
}

func (m *Model) tableRows() int { return max(1, m.h-4) }

// View renders the survey.
func (m *Model) View() string {
	st := m.ctx.Styles
	if !m.computed {
		return st.Muted.Render("Building and solving the cycle of every compound of the data…")
	}
	order := "ascending"
	if m.reverse {
		order = "descending"
	}
	head := fmt.Sprintf("%d of %d compounds · sorted by %s (%s) · gap to %s · lattice %s in %s",
		len(m.shown), len(m.rows), sortNames[m.sortBy], order, m.ModelName(), "ΔH_L", m.ctx.Units)
	lines := []string{st.Title.Render(screen.Truncate(head, m.w))}
	if m.filtering || m.filter.Value() != "" {
		lines = append(lines, m.filter.View())
	}
	rest := m.h - len(lines)
	switch m.view {
	case viewScatter:
		lines = append(lines, m.scatter(rest))
	case viewStrip:
		lines = append(lines, m.strip(rest))
	default:
		lines = append(lines, m.table(rest)...)
	}
	return strings.Join(lines, "\n")
}

func (m *Model) table(h int) []string {
	st := m.ctx.Styles
	names := cycle.ModelNames()
	// Every model's column when they all fit beside the verdict's codes:
	// the lead (37), 11 a model, the gap columns (20).
	wide := m.w >= 37+11*len(names)+20+screen.VerdictCodeWidth
	var b strings.Builder
	fmt.Fprintf(&b, "  %-9s %-15s %9s", "formula", "family", "cycle")
	if wide {
		for _, n := range names {
			fmt.Fprintf(&b, " %10s", screen.Truncate(n, 10))
		}
	} else {
		fmt.Fprintf(&b, " %12s", screen.Truncate(m.ModelName(), 12))
	}
	fmt.Fprintf(&b, " %9s %7s  ", "gap", "gap %")
	// The verdict column takes what the line leaves; too narrow for the
	// verdicts' words it shows their codes, which a legend explains.
	verdictW := max(screen.VerdictCodeWidth, m.w-lipgloss.Width(b.String()))
	b.WriteString("verdict")
	out := []string{st.Title.Render(screen.Truncate(b.String(), m.w))}
	note := "gap = cycle − model; negative: the cycle binds more than the ionic model"
	if _, code := screen.Verdict(cycle.SubstantialCovalent, verdictW); code {
		note = "gap = cycle − model · " + screen.VerdictLegend
	}
	footer := func(rows int) []string {
		text := note
		if pos := m.position(rows); pos != "" {
			text = pos + " · " + text
		}
		return screen.Wrap(text, m.w, "  ")
	}
	rows := h - 1 - len(footer(h-2))
	rows = h - 1 - len(footer(rows))
	if m.cursor < m.top {
		m.top = m.cursor
	}
	if m.cursor >= m.top+rows {
		m.top = m.cursor - rows + 1
	}
	for i := m.top; i < len(m.shown) && i < m.top+rows; i++ {
		r := &m.rows[m.shown[i]]
		var line strings.Builder
		cursor := " "
		if i == m.cursor {
			cursor = "›"
		}
		fmt.Fprintf(&line, "%s %-9s %-15s %9s", cursor, screen.Truncate(r.Formula, 9), screen.Truncate(r.Family, 15), m.num(r.Cycle))
		if wide {
			for j := range names {
				fmt.Fprintf(&line, " %10s", m.num(r.Models[j]))
			}
		} else {
			fmt.Fprintf(&line, " %12s", m.num(r.Models[m.model]))
		}
		verdict := "—"
		switch {
		case r.Err != nil:
			if verdictW >= len("no cycle") {
				verdict = "no cycle"
			}
			if full := "no cycle: " + session.Message(r.Err); ansi.StringWidth(full) <= verdictW {
				verdict = full
			}
		case !math.IsNaN(r.Models[m.model]):
			verdict, _ = screen.Verdict(r.Verdicts[m.model], verdictW)
		}
		fmt.Fprintf(&line, " %9s %7s  %s", m.num(r.Gaps[m.model]), pct(r.GapPercents[m.model]), verdict)
		text := screen.Truncate(line.String(), m.w)
		if i == m.cursor {
			text = st.Selected.Render(text)
		}
		out = append(out, text)
	}
	for _, l := range footer(rows) {
		out = append(out, st.Muted.Render(l))
	}
	return out
}

// position says which rows the window shows when some are above or below
// it ("rows 21–38 of 277, more above and below"), else "".
func (m *Model) position(rows int) string {
	n := len(m.shown)
	last := min(n, m.top+rows)
	above, below := m.top > 0, last < n
	if !above && !below {
		return ""
	}
	more := "↑ more above"
	switch {
	case above && below:
		more = "↑↓ more above and below"
	case below:
		more = "↓ more below"
	}
	return fmt.Sprintf("rows %d–%d of %d, %s", m.top+1, last, n, more)
}

func (m *Model) num(kj float64) string {
	if math.IsNaN(kj) {
		return "—"
	}
	return m.ctx.Energy(kj)
}

func pct(v float64) string {
	if math.IsNaN(v) {
		return "—"
	}
	return strings.Replace(fmt.Sprintf("%+.1f", v), "-", "−", 1)
}

// families groups the shown rows for a chart: the k most frequent families
// by name, the rest together as "other families" (so each group keeps its
// own glyph). group maps a row index to its group.
func (m *Model) families(k int) (names []string, group map[int]int) {
	count := map[string]int{}
	var order []string
	for _, j := range m.shown {
		f := familyOf(&m.rows[j])
		if count[f] == 0 {
			order = append(order, f)
		}
		count[f]++
	}
	slices.SortStableFunc(order, func(a, b string) int { return cmp.Compare(count[b], count[a]) })
	k = max(1, min(k, len([]rune(plot.Glyphs))-1))
	idx := map[string]int{}
	for i, f := range order {
		if i < k || len(order) == k+1 {
			idx[f] = len(names)
			names = append(names, f)
		}
	}
	if len(order) > len(names) {
		names = append(names, fmt.Sprintf("other families (%d)", len(order)-len(idx)))
	}
	group = map[int]int{}
	for _, j := range m.shown {
		g, ok := idx[familyOf(&m.rows[j])]
		if !ok {
			g = len(names) - 1
		}
		group[j] = g
	}
	return names, group
}

func familyOf(r *Row) string {
	if r.Family == "" {
		return "no family"
	}
	return r.Family
}

func (m *Model) scatter(h int) string {
	st := m.ctx.Styles
	fams, group := m.families(len([]rune(plot.Glyphs)) - 1)
	var pts []plot.Point
	for _, j := range m.shown {
		r := &m.rows[j]
		pts = append(pts, plot.Point{X: m.conv(r.Cycle), Y: m.conv(r.Models[m.model]), Group: group[j]})
	}
	s := plot.Scatter{Points: pts, Groups: fams, XLabel: "cycle lattice (" + m.ctx.Units.String() + ")", Diagonal: true, Log: m.logScale}
	title := st.Muted.Render(screen.Truncate(m.ModelName()+" (up) against the cycle (across); dots: model = cycle; "+string(plot.Crowded)+" two groups on one cell; l log/linear; / filters", m.w))
	return title + "\n" + s.Render(m.w, h-1, plot.Styles{Axis: st.Muted, Point: st.Accent, Guide: st.Rule, Label: st.Text})
}

func (m *Model) strip(h int) string {
	st := m.ctx.Styles
	fams, group := m.families(h - 5)
	vals := make([][]float64, len(fams))
	for _, j := range m.shown {
		vals[group[j]] = append(vals[group[j]], m.rows[j].GapPercents[m.model])
	}
	s := plot.Strip{Groups: fams, Values: vals, XLabel: "gap to " + m.ModelName() + " (%)", Zero: true}
	title := st.Muted.Render(screen.Truncate("gap (cycle − model) in % by family, most frequent first; left of ┊: the cycle binds more; / filters", m.w))
	return title + "\n" + s.Render(m.w, h-1, plot.Styles{Axis: st.Muted, Point: st.Accent, Guide: st.Rule, Label: st.Text})
}

func (m *Model) conv(kj float64) float64 {
	if math.IsNaN(kj) {
		return kj
	}
	return thermo.FromKJPerMol(kj, m.ctx.Units)
}
