package bench

import (
	"errors"
	"fmt"
	"strings"

	"github.com/charmbracelet/lipgloss"
	"github.com/charmbracelet/x/ansi"

	"enthalpath/cycle"
	"enthalpath/tui/diagram"
	"enthalpath/tui/hessdiagram"
	"enthalpath/tui/screen"
	"enthalpath/tui/session"
)

// minDrawing is the least height the drawing is shown in under the list;
// below roomyDrawing the list's legend gives its line to the drawing and
// goes into the drawing's caption (our own choice: at 80×24 NaCl's drawing
// gets 10 rows instead of 9).
const (
	minDrawing   = 8
	roomyDrawing = 12
)

// View renders the bench.
func (m *Model) View() string {
	st := m.ctx.Styles
	c := m.sess.Cycle
	if c == nil {
		return st.Muted.Render("No cycle open. Pick a compound on the Shelf (press 1, or tab) and press enter,\n" +
			"or type a formula there and press ctrl+g to assemble it step by step.")
	}
	top := []string{m.titleLine(), m.solvedLine()}
	if m.Capturing() {
		top = append(top, m.typing().View())
	}
	used := lipgloss.Height(strings.Join(top, "\n"))
	rest := m.h - used
	var parts []string
	switch {
	case m.showSource:
		parts = append(parts, m.sourceView(rest))
	case m.drawing:
		parts = append(parts, m.drawingView(rest, false))
	case rest-(m.rowCount()+1) >= minDrawing:
		listH := m.rowCount() + 2
		legendBelow := rest-listH >= roomyDrawing
		if !legendBelow {
			listH-- // the legend goes into the drawing's caption
		}
		parts = append(parts, m.listView(listH, legendBelow), m.drawingView(rest-listH, !legendBelow))
	default:
		parts = append(parts, m.listView(rest, true))
	}
	return strings.Join(append(top, parts...), "\n")
}

func (m *Model) titleLine() string {
	st := m.ctx.Styles
	c := m.sess.Cycle
	name := c.Formula
	if c.Name != "" {
		name += " — " + c.Name
	}
	if !c.Tabulated {
		name += " (not in the data: hypothetical)"
	}
	if s := c.Settings.Structure.Name(); s != "" {
		name += " · " + s
	}
	conv := c.Conventions.Lattice.Symbol() + ", ionization at " + c.Conventions.Ionization.String()
	return st.Title.Render(screen.Truncate(name, m.w-ansi.StringWidth(conv)-3)) + "   " + st.Muted.Render(conv)
}

func (m *Model) solvedLine() string {
	st := m.ctx.Styles
	if !m.sess.Fresh() {
		return st.Muted.Render("solving…")
	}
	var unk *cycle.UnknownsError
	if errors.As(m.sess.SolveErr, &unk) && len(unk.Keys) == 0 {
		// Over-determined: every step has a value. Say by how much the
		// cycle misses closing (the miss is drawn too).
		r, u := cycle.Residual(m.sess.Cycle)
		line := fmt.Sprintf("closure residual %s %s", m.ctx.SignedPM(r, u), m.ctx.Units)
		return st.Warn.Render("over-determined: ") + st.Accent.Render(line) +
			st.Muted.Render(screen.Truncate(" (Σ of the steps − ΔfH°) · x on a step solves for it", max(0, m.w-ansi.StringWidth(line)-17)))
	}
	if m.sess.SolveErr != nil {
		return st.Error.Render("not solved: ") + st.Text.Render(explainShort(m.sess.SolveErr, m.w-12))
	}
	res := m.sess.Result
	s := res.Solved
	line := fmt.Sprintf("%s = %s %s", s.Key, m.ctx.SignedPM(s.Value, s.Uncertainty), m.ctx.Units)
	extra := ""
	room := max(0, m.w-ansi.StringWidth(line)-10)
	if s.Kind == cycle.KindLattice {
		extra = fmt.Sprintf(" · ΔH_L %s · U %s", m.ctx.Signed(res.Lattice.Enthalpy), m.ctx.Signed(res.Lattice.Energy))
	} else {
		// The lattice value first; the step's name (in the list and the
		// source box too) only when it fits whole.
		extra = fmt.Sprintf(" · lattice ΔH_L %s", m.ctx.Signed(res.Lattice.Enthalpy))
		if more := " · " + s.Label; ansi.StringWidth(extra+more) <= room {
			extra += more
		}
	}
	return st.Solved.Render(diagram.SolvedMark+" solved: ") + st.Accent.Render(line) + st.Muted.Render(screen.Truncate(extra, room))
}

func explainShort(err error, w int) string { return screen.Truncate(session.Explain(err), w) }

// Column widths of the step list.
const (
	colFlag  = 3
	colMult  = 5
	colValue = 10
	colUnc   = 8
)

// listView draws the step list in h rows, its legend on the last when
// legend is set.
func (m *Model) listView(h int, legend bool) string {
	st := m.ctx.Styles
	steps := m.steps()
	if h < 3 {
		return ""
	}
	colReaction := 12
	for i := range steps {
		n := ansi.StringWidth(steps[i].Reaction) + 1
		if steps[i].Parent != "" {
			n += 2
		}
		colReaction = max(colReaction, n)
	}
	colReaction = min(colReaction, m.w-colFlag-colMult-colValue-colUnc-5-14)
	colSource := max(10, m.w-colFlag-colMult-colValue-colUnc-colReaction-5)
	header := fmt.Sprintf("%-*s%-*s %*s %*s %*s %-*s", colFlag, "", colReaction, "reaction", colMult, "×",
		colValue, m.ctx.Units.String(), colUnc, "±", colSource, "source")
	lines := []string{st.Title.Render(screen.Truncate(header, m.w))}
	// The rows: the steps, and under U the correction row after the
	// lattice step (-1), so that the values shown sum by Hess's law.
	order := make([]int, 0, len(steps)+1)
	at := 0 // the cursor's row
	for i := range steps {
		if i == m.cursor {
			at = len(order)
		}
		order = append(order, i)
		if steps[i].Kind == cycle.KindLattice && m.showCorrection() {
			order = append(order, -1)
		}
	}
	rows := h - 1
	if legend {
		rows--
	}
	if at < m.top {
		m.top = at
	}
	if at >= m.top+rows {
		m.top = at - rows + 1
	}
	for r := m.top; r < len(order) && r < m.top+rows; r++ {
		i := order[r]
		if i < 0 {
			lines = append(lines, st.Muted.Render(screen.Truncate(m.correctionRow(colReaction, colSource), m.w)))
			continue
		}
		s := &steps[i]
		cursor := " "
		if i == m.cursor {
			cursor = "›"
		}
		flag := " "
		switch {
		case s.Unknown || s.Source.Kind == cycle.SourceSolved:
			flag = diagram.SolvedMark
		case s.Source.Kind == cycle.SourceMissing:
			flag = "!"
		case s.Source.Kind == cycle.SourceUser:
			flag = "*"
		}
		reaction := s.Reaction
		if s.Parent != "" {
			reaction = "└ " + reaction
		}
		value, unc := m.ctx.Measured(s.Value, s.Uncertainty)
		switch {
		case s.Unknown && s.Source.Kind != cycle.SourceSolved:
			value, unc = "unknown", ""
		case s.Source.Kind == cycle.SourceMissing:
			value, unc = "missing", ""
		}
		text := fmt.Sprintf("%s%s %-*s %*s %*s %*s %-*s", cursor, flag, colReaction, screen.Truncate(reaction, colReaction),
			colMult, screen.Multiplicity(s.Multiplicity), colValue, value, colUnc, unc, colSource, screen.Truncate(sourceFitting(s, colSource), colSource))
		text = screen.Truncate(text, m.w)
		switch {
		case i == m.cursor:
			text = st.Selected.Render(text)
		case flag == diagram.SolvedMark:
			text = st.Solved.Render(text)
		case flag == "!":
			text = st.Warn.Render(text)
		}
		lines = append(lines, text)
	}
	if legend {
		lines = append(lines, st.Muted.Render(screen.Truncate(diagram.SolvedMark+" the unknown (solved)  ! no value in the data  * your value  └ sub-step", m.w)))
	}
	return strings.Join(lines, "\n")
}

// marksShown is the legend of the marks the step list shows now, for the
// drawing's caption: "∴ the unknown (solved) · └ sub-step".
func (m *Model) marksShown() string {
	var solved, missing, user, sub bool
	for _, s := range m.steps() {
		solved = solved || s.Unknown || s.Source.Kind == cycle.SourceSolved
		missing = missing || (!s.Unknown && s.Source.Kind == cycle.SourceMissing)
		user = user || s.Source.Kind == cycle.SourceUser
		sub = sub || s.Parent != ""
	}
	var out []string
	for _, mk := range []struct {
		on   bool
		text string
	}{{solved, diagram.SolvedMark + " the unknown (solved)"}, {missing, "! no value in the data"}, {user, "* your value"}, {sub, "└ sub-step"}} {
		if mk.on {
			out = append(out, mk.text)
		}
	}
	return strings.Join(out, " · ")
}

// showCorrection reports whether the lattice step is shown as U, which
// then needs the correction row to keep the rows summing to the formation.
func (m *Model) showCorrection() bool {
	c := m.sess.Cycle
	return c != nil && c.Conventions.Lattice == cycle.LatticeEnergy
}

// rowCount is the number of rows of the step list.
func (m *Model) rowCount() int {
	n := len(m.steps())
	if m.showCorrection() {
		n++
	}
	return n
}

// correctionRow is ΔH_L − U of the lattice step (gaseous ions → solid),
// the −LatticeCorrection of Jenkins' rule (−RT for the dissociation of a
// 1:1 salt of monatomic ions, so +RT here): with the lattice step shown as
// U, it is the term that makes the rows add up to the formation enthalpy.
func (m *Model) correctionRow(colReaction, colSource int) string {
	corr := -m.sess.Cycle.LatticeCorrection()
	return fmt.Sprintf("%s%s %-*s %*s %*s %*s %-*s", " ", " ", colReaction, screen.Truncate("└ ΔH_L − U (nRT)", colReaction),
		colMult, "", colValue, m.ctx.Signed(corr), colUnc, m.ctx.Uncertainty(0), colSource,
		screen.Truncate("U → ΔH_L, Jenkins' rule", colSource))
}

// sourceFitting is sourceText in n cells: a data row's source without the
// word "data" when the whole does not fit (data is what a bare key means),
// so a narrow window keeps the key and its markers.
func sourceFitting(s *cycle.Step, n int) string {
	t := sourceText(s)
	if ansi.StringWidth(t) > n && s.Source.Kind == cycle.SourceData {
		t = strings.TrimPrefix(t, "data: ")
	}
	return t
}

func sourceText(s *cycle.Step) string {
	src := s.Source
	t := src.Kind.String()
	if src.Key != "" && src.Key != "user" {
		t += ": " + src.Key
	}
	if mk := src.Markers(); len(mk) > 0 {
		t += " (" + strings.Join(mk, ", ") + ")"
	}
	return t
}

// drawingView draws the cycle to scale in h rows under its caption, which
// carries the step list's legend when legend is set.
func (m *Model) drawingView(h int, legend bool) string {
	st := m.ctx.Styles
	if h < 6 {
		return st.Muted.Render("(no room for the drawing; press v, or enlarge the window)")
	}
	d := hessdiagram.Build(m.sess.Cycle.Formula, m.steps(), hessdiagram.ForCycle(m.sess.Cycle, hessdiagram.Options{Units: m.ctx.Units, Limit: -1, Solved: m.sess.Solved() != nil}))
	head := " · " + m.ctx.Units.String() + " per formula unit"
	if lat, ok := latticeOf(m.steps(), m.sess.Solved() != nil); ok && m.showCorrection() {
		// The drawing closes by Hess's law over ΔH_L: its lattice arrow is
		// ΔH_L, the table's U plus the correction row.
		corr := -m.sess.Cycle.LatticeCorrection()
		head = fmt.Sprintf(" · lattice arrow ΔH_L %s = U %s %s", m.ctx.Signed(lat.Value+corr), m.ctx.Signed(lat.Value), m.ctx.Signed(corr))
	}
	marks := diagram.SolvedMark + " marks the solved step"
	if shown := m.marksShown(); legend && shown != "" {
		marks = shown
	}
	note := head + " · " + marks + " · d exports SVG"
	title := st.Title.Render("Drawn to scale") + st.Muted.Render(screen.Truncate(note, m.w-14))
	return title + "\n" + d.Render(m.w, h-1, m.diagramStyles())
}

// latticeOf returns the lattice step of steps, when it has a value
// (solved is whether steps are a solved result's).
func latticeOf(steps []cycle.Step, solved bool) (*cycle.Step, bool) {
	for i := range steps {
		if s := &steps[i]; s.Kind == cycle.KindLattice {
			return s, s.Source.Kind != cycle.SourceMissing && (solved || !s.Unknown)
		}
	}
	return nil, false
}

func (m *Model) diagramStyles() diagram.Styles {
	st := m.ctx.Styles
	return diagram.Styles{Rule: st.Rule, Arrow: st.Text, Solved: st.Solved, Label: st.Text, Axis: st.Muted}
}

func (m *Model) sourceView(h int) string {
	st := m.ctx.Styles
	s := m.current()
	if res := m.sess.Solved(); res != nil {
		if rs, ok := res.Step(s.Key); ok {
			s = rs
		}
	}
	src := s.Source
	w := min(m.w-4, 100)
	wrap := m.ctx.Styles.Renderer().NewStyle().Width(w - 4)
	lines := []string{
		st.Title.Render(s.Label) + st.Muted.Render("  ("+s.Key+")"),
		"reaction:   " + s.Reaction,
		fmt.Sprintf("value:      %s %s per reaction as written, ×%g in the sum", m.ctx.SignedPM(s.Value, s.Uncertainty), m.ctx.Units, s.Multiplicity),
		"source:     " + sourceText(s),
	}
	if src.Citation != "" {
		lines = append(lines, wrap.Render("citation:   "+src.Citation))
	}
	if src.Note != "" {
		lines = append(lines, wrap.Render("note:       "+src.Note))
	}
	if src.Memory {
		lines = append(lines, st.Warn.Render("This value was entered from memory: check it against the citation before relying on it."))
	}
	if src.Derived {
		lines = append(lines, st.Warn.Render("This value is itself derived from a thermochemical cycle, not measured."))
	}
	if src.DefaultUncertainty {
		lines = append(lines, st.Warn.Render("The source states no uncertainty; the default for this kind of step is used."))
	}
	if r := s.Reference; r != nil && (src.Kind != r.Source.Kind || r.Value != s.Value) {
		lines = append(lines, fmt.Sprintf("data value: %s (%s) — r resets to it", m.ctx.SignedPM(r.Value, r.Uncertainty), r.Source.Key))
	}
	if res := m.sess.Solved(); res != nil && s.Kind == cycle.KindLattice && res.Handbook != nil {
		hb := res.Handbook
		lines = append(lines, fmt.Sprintf("handbook:   %s (%s), cycle − handbook %s (%+.1f %%)",
			m.ctx.SignedPM(hb.Value, hb.Uncertainty), hb.Source.Key, m.ctx.Signed(hb.Difference), hb.Percent))
	}
	lines = append(lines, "", st.Muted.Render("any key closes this box"))
	box := st.Panel.Width(w).Render(strings.Join(lines, "\n"))
	return m.ctx.Styles.Renderer().NewStyle().MaxHeight(max(h, 1)).Render(box)
}
