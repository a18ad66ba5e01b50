package assembly

import (
	"errors"
	"fmt"
	"strings"

	"github.com/charmbracelet/bubbles/key"
	tea "github.com/charmbracelet/bubbletea"
	"github.com/charmbracelet/lipgloss"

	"enthalpath/cycle"
	"enthalpath/tui/diagram"
	"enthalpath/tui/hessdiagram"
	"enthalpath/tui/prompt"
	"enthalpath/tui/screen"
	"enthalpath/tui/session"
)

// Model is the assembly screen.
type Model struct {
	KeyMap KeyMap

	ctx  *screen.Context
	sess *session.Session

	forCycle *cycle.Cycle // the cycle the order below was made for
	order    []string     // step keys in the order they are proposed
	decided  []string     // what was done with each decided step (the rows are labelled from the cycle as it is now)
	edit     prompt.Slot  // a value of one's own for the proposed step, while typed
	w, h     int
	// model is the lattice model a lattice proposal needs, worked out in
	// a command for one cycle and generation (cycle.DefaultModel evaluates
	// every model: 0.6 s cold, measured on KCl); nil while it is worked out.
	model    *modelMsg
	modelFor struct {
		c   *cycle.Cycle
		gen int
	}
}

var _ screen.Screen = (*Model)(nil)

// New returns the assembly over the session's cycle.
func New(ctx *screen.Context, sess *session.Session) *Model {
	return &Model{KeyMap: DefaultKeyMap(), ctx: ctx, sess: sess}
}

// Init does nothing.
func (m *Model) Init() tea.Cmd { return nil }

// Title is the screen's name.
func (m *Model) Title() string { return "Assembly" }

// Capturing reports whether a value is being typed.
func (m *Model) Capturing() bool { return m.edit.Active() }

// Editing reports whether a value is being typed, and the refusal shown.
func (m *Model) Editing() (bool, error) { return m.edit.Active(), m.edit.Err() }

// SetSize sets the body size.
func (m *Model) SetSize(w, h int) {
	m.w, m.h = w, h
	m.edit.SetWidth(w - 2) // indented under the proposal
}

// Position returns how many steps are decided and how many there are.
func (m *Model) Position() (decided, total int) { return len(m.decided), len(m.order) }

// Unknown returns the key of the step chosen as the unknown so far.
func (m *Model) Unknown() string { return m.unknownKey() }

// unknownKey is the step other than the lattice that the cycle holds as
// its unknown, chosen here or on the Bench, or "". It is read from the
// cycle each time, so work done on the Bench is never overlooked.
func (m *Model) unknownKey() string {
	c := m.sess.Cycle
	if c == nil {
		return ""
	}
	for _, k := range c.Unknowns() {
		if s, _ := c.Step(k); s.Kind != cycle.KindLattice {
			return k
		}
	}
	return ""
}

// ShortHelp lists the main keys; while a value is typed, the prompt's.
func (m *Model) ShortHelp() []key.Binding {
	if m.edit.Active() {
		return m.edit.ShortHelp()
	}
	if m.sess.Cycle == nil {
		return nil // nothing to assemble: no key of this screen works
	}
	k := m.KeyMap
	if m.Done() {
		return []key.Binding{k.onward(), k.Back}
	}
	return []key.Binding{k.Accept, k.Type, k.Unknown, k.Back}
}

// FullHelp lists every key; while a value is typed, the prompt's.
func (m *Model) FullHelp() [][]key.Binding {
	if m.edit.Active() {
		return m.edit.FullHelp()
	}
	if m.sess.Cycle == nil {
		return nil
	}
	k := m.KeyMap
	if m.Done() {
		return [][]key.Binding{{k.onward()}, {k.Back, k.Bench}}
	}
	return [][]key.Binding{{k.Accept, k.Type, k.Unknown}, {k.Back, k.Bench}}
}

// restart makes the proposal order for the session's cycle: the terms of
// Hess's sum in cycle order with the lattice step moved last and the
// formation step just before it.
func (m *Model) restart() {
	c := m.sess.Cycle
	m.forCycle, m.order, m.decided = c, nil, nil
	m.edit.Close()
	if c == nil {
		return
	}
	var lattice, formation string
	for _, i := range hessdiagram.Terms(c.Steps) {
		s := &c.Steps[i]
		if s.Kind == cycle.KindLattice {
			lattice = s.Key
			continue
		}
		m.order = append(m.order, s.Key)
	}
	for i := range c.Steps {
		if c.Steps[i].Kind == cycle.KindFormation {
			formation = c.Steps[i].Key
		}
	}
	if formation != "" {
		m.order = append(m.order, formation)
	}
	if lattice != "" {
		m.order = append(m.order, lattice)
	}
}

// kept says what the cycle already holds for step s that the assembly
// keeps rather than re-proposes from the data: a value the user typed
// (on the Bench or here), the unknown chosen on the Bench, or a model
// filling the lattice step. "" when the step holds the data's value.
func (m *Model) kept(s *cycle.Step) string {
	c := m.sess.Cycle
	switch {
	case s.Unknown && s.Kind != cycle.KindLattice:
		return "unknown"
	case s.Source.Kind == cycle.SourceUser:
		return "user"
	case s.Kind == cycle.KindLattice && c.Settings.LatticeFrom != "":
		return "from the " + c.Settings.LatticeFrom + " model"
	}
	return ""
}

// label says where a decided step's value comes from, read from the cycle
// as it is now (the Bench may have changed it since): unknown, user, a
// model, the data's handbook value, or data.
func (m *Model) label(s *cycle.Step) string {
	if s.Unknown {
		return "unknown"
	}
	if k := m.kept(s); k != "" {
		return k
	}
	if s.Kind == cycle.KindLattice {
		return "data (handbook)"
	}
	return "data"
}

// Update handles keys and results; it asks for the lattice model when the
// proposal comes to need it.
func (m *Model) Update(msg tea.Msg) tea.Cmd {
	cmd := m.update(msg)
	return tea.Batch(cmd, m.askModel())
}

func (m *Model) update(msg tea.Msg) tea.Cmd {
	switch msg := msg.(type) {
	case modelMsg:
		if msg.c == m.modelFor.c && msg.gen == m.modelFor.gen {
			m.model = &msg
		}
		return nil
	case session.OpenedMsg:
		m.restart()
		return nil
	case session.MagnitudesMsg:
		return m.edit.Retry(session.Pending) // a value typed before they were ready
	case screen.ShownMsg:
		if m.forCycle != m.sess.Cycle {
			m.restart()
		}
		return nil
	case tea.KeyMsg:
		return m.key(msg)
	}
	return m.edit.Update(msg)
}

func (m *Model) currentKey() string {
	if len(m.decided) < len(m.order) {
		return m.order[len(m.decided)]
	}
	return ""
}

func (m *Model) current() *cycle.Step {
	if m.sess.Cycle == nil {
		return nil
	}
	s, ok := m.sess.Cycle.Step(m.currentKey())
	if !ok {
		return nil
	}
	return s
}

// Done reports whether every step is decided.
func (m *Model) Done() bool { return m.sess.Cycle != nil && len(m.decided) == len(m.order) }

func (m *Model) key(k tea.KeyMsg) tea.Cmd {
	if m.sess.Cycle == nil {
		return screen.Status("Nothing to assemble: type a formula on the Shelf and press ctrl+g.")
	}
	if m.forCycle != m.sess.Cycle {
		m.restart()
	}
	if m.edit.Active() {
		return m.edit.Update(k)
	}
	km := m.KeyMap
	switch {
	case key.Matches(k, km.Bench):
		return screen.Switch(screen.Bench)
	case key.Matches(k, km.Back):
		return m.back()
	case m.Done() && key.Matches(k, km.Accept):
		return screen.Switch(screen.Bench)
	case m.Done():
		return nil
	case key.Matches(k, km.Accept):
		return m.accept()
	case key.Matches(k, km.Type):
		m.startEdit()
		return m.sess.WarmMagnitudes(m.ctx.DB) // ready by the time the value is typed
	case key.Matches(k, km.Unknown):
		return m.markUnknown()
	}
	return nil
}

func (m *Model) accept() tea.Cmd {
	s := m.current()
	if s == nil {
		return nil
	}
	if _, err := m.latticeModelErr(); m.needsModel(s) && errors.Is(err, errWorking) {
		return screen.Status(errWorking.Error() + "; accept again once it is shown")
	}
	if _, ok := m.proposal(s); !ok {
		return screen.Fail(fmt.Errorf("%s has nothing to accept: type a value with e or make it the unknown with x", s.Key))
	}
	key := s.Key
	if kept := m.kept(s); kept != "" {
		// What the cycle holds stays: accepting never replaces it.
		m.decided = append(m.decided, kept)
		return nil
	}
	var f func(c *cycle.Cycle) error
	var note string
	switch {
	case s.Kind == cycle.KindLattice && m.unknownKey() == "":
		f = func(c *cycle.Cycle) error { c.Settings.LatticeFrom = ""; return c.SolveFor(key) }
		note = "unknown"
	case s.Kind == cycle.KindLattice && s.Reference != nil:
		// The handbook value, as the Bench has it when another step is solved.
		f = func(c *cycle.Cycle) error { c.Settings.LatticeFrom = ""; return c.Reset(key) }
		note = "data (handbook)"
	case s.Kind == cycle.KindLattice:
		mr, _ := m.latticeModel()
		f = func(c *cycle.Cycle) error {
			c.Settings.LatticeFrom = mr.Model
			return c.Reset(key)
		}
		note = "from the " + mr.Model + " model"
	default:
		f = func(c *cycle.Cycle) error { return c.Reset(key) }
		note = "data"
	}
	cmd, err := m.sess.Change(f)
	if err != nil {
		return screen.Fail(err)
	}
	m.decided = append(m.decided, note)
	return cmd
}

func (m *Model) markUnknown() tea.Cmd {
	s := m.current()
	if s == nil {
		return nil
	}
	key, prev := s.Key, m.unknownKey()
	cmd, err := m.sess.Change(func(c *cycle.Cycle) error {
		if prev != "" {
			if err := c.Reset(prev); err != nil {
				return err
			}
		}
		return c.MarkUnknown(key)
	})
	if err != nil {
		return screen.Fail(err)
	}
	m.decided = append(m.decided, "unknown")
	status := key + " is the unknown."
	if prev != "" {
		status += " " + prev + " went back to its data value (one unknown only)."
	}
	return tea.Batch(cmd, screen.Status(status))
}

func (m *Model) back() tea.Cmd {
	if len(m.decided) == 0 {
		return screen.Status("Already at the first step.")
	}
	m.decided = m.decided[:len(m.decided)-1]
	return nil
}

// startEdit asks for a value of one's own for the proposed step.
func (m *Model) startEdit() {
	s := m.current()
	if s == nil {
		return
	}
	m.edit.Open(prompt.New(m.ctx.Styles, "", "", "", m.ctx.MaxInputLen, m.acceptValue(s.Key),
		prompt.WithLabel("value › "),
		prompt.WithPlaceholder("e.g. "+session.Example(m.ctx, s)+" ("+m.ctx.Units.String()+")"),
		prompt.WithSubmitHelp("accept the value")))
}

// acceptValue checks a value typed for step key and sets it as decided;
// without ± the data's uncertainty is taken (0 when the data have none).
// An implausibly large value is questioned once, as on the bench.
func (m *Model) acceptValue(key string) prompt.Accept {
	var confirm session.Confirmer
	return func(text string) (tea.Cmd, error) {
		s, ok := m.sess.Cycle.Step(key)
		if !ok {
			return nil, fmt.Errorf("the cycle has no step %s any more", key)
		}
		keep := 0.0 // the data's uncertainty, when the data have the step
		if s.Reference != nil {
			keep = s.Reference.Uncertainty
		}
		kj, unc, err := m.ctx.ParseValue(text, keep)
		if err != nil {
			return nil, session.ValueError(text, err)
		}
		if err := confirm.Ask(text, m.sess.Question(m.ctx, s.Kind, text, kj)); err != nil {
			return nil, err
		}
		lattice := s.Kind == cycle.KindLattice
		cmd, err := m.sess.Change(func(c *cycle.Cycle) error {
			if lattice {
				c.Settings.LatticeFrom = ""
			}
			return c.Set(key, kj, unc)
		})
		if err != nil {
			return nil, session.ValueError(text, err)
		}
		m.decided = append(m.decided, "user")
		return cmd, nil
	}
}

// View renders the assembly.
func (m *Model) View() string {
	st := m.ctx.Styles
	c := m.sess.Cycle
	if c == nil {
		return st.Muted.Render("Nothing to assemble yet. On the Shelf, type a formula (one the data lack works too) and press ctrl+g.")
	}
	if m.forCycle != c {
		m.restart()
	}
	lines := []string{st.Title.Render(fmt.Sprintf("Assembling the cycle of %s — step %d of %d", c.Formula, min(len(m.decided)+1, len(m.order)), len(m.order)))}
	// The decided steps, one line each; in a small window only the latest,
	// so the proposal and the drawing keep their room.
	first := 0
	if keep := max(3, m.h/3); len(m.decided) > keep {
		first = len(m.decided) - keep
		lines = append(lines, st.Muted.Render(fmt.Sprintf(" … %d earlier steps decided", first)))
	}
	for i, k := range m.order[:len(m.decided)] {
		if i < first {
			continue
		}
		s, _ := c.Step(k)
		val := m.ctx.Signed(s.Value)
		if s.Unknown {
			val = "unknown"
		}
		if s.Kind == cycle.KindLattice && c.Settings.LatticeFrom != "" {
			val = m.modelValue(c)
		}
		marker := "✓"
		if s.Unknown {
			marker = diagram.SolvedMark
		}
		// The multiplicity the value enters the sum with (×½ for Cl₂ → 2Cl).
		lines = append(lines, screen.Truncate(fmt.Sprintf(" %s %-34s %3s %10s  %s", marker, s.Reaction, screen.Multiplicity(s.Multiplicity), val, m.label(s)), m.w))
	}
	if s := m.current(); s != nil {
		text, ok := m.proposal(s)
		lines = append(lines, "", st.Accent.Render(fmt.Sprintf("Next: %s", s.Label))+st.Muted.Render("  ("+s.Key+")"),
			"  "+s.Reaction+multNote(s.Multiplicity))
		if ok {
			lines = append(lines, "  proposed: "+text)
		} else {
			lines = append(lines, st.Warn.Render("  "+text))
		}
		if m.edit.Active() {
			lines = append(lines, indent(m.edit.View(), "  "))
		}
	} else {
		lines = append(lines, "", m.doneLine())
	}
	top := strings.Join(lines, "\n")
	rest := m.h - lipgloss.Height(top) - 1
	if rest >= 6 {
		limit := m.drawnTerms()
		d := hessdiagram.Build(c.Formula, m.drawSteps(), hessdiagram.ForCycle(c, hessdiagram.Options{Units: m.ctx.Units, Limit: limit, Solved: m.Done() && m.sess.Solved() != nil}))
		top += "\n" + d.Render(m.w, rest, diagram.Styles{Rule: st.Rule, Arrow: st.Text, Solved: st.Solved, Label: st.Text, Axis: st.Muted})
	}
	return top
}

// modelValue is the lattice step's value when a model fills it: the
// solve's, or the model's own while the solve runs.
func (m *Model) modelValue(c *cycle.Cycle) string {
	if res := m.sess.Solved(); res != nil {
		if s, ok := res.Step("lattice"); ok {
			return m.ctx.Signed(s.Value)
		}
	}
	if mr, err := cycle.EvaluateModel(c, c.Settings.LatticeFrom); err == nil && mr.OK() {
		return m.ctx.Signed(mr.Value)
	}
	return "—"
}

func (m *Model) drawSteps() []cycle.Step {
	if m.Done() {
		if res := m.sess.Solved(); res != nil {
			return res.Steps
		}
	}
	return m.sess.Cycle.Steps
}

// drawnTerms counts the decided steps that are arrows of the drawing (the
// formation step is the closing arrow, drawn once everything is decided).
func (m *Model) drawnTerms() int {
	if m.Done() {
		return -1
	}
	n := 0
	for _, k := range m.order[:len(m.decided)] {
		if s, ok := m.sess.Cycle.Step(k); ok && s.Kind != cycle.KindFormation {
			n++
		}
	}
	return n
}

func (m *Model) doneLine() string {
	st := m.ctx.Styles
	if !m.sess.Fresh() {
		return st.Muted.Render("solving…")
	}
	if err := m.sess.SolveErr; err != nil {
		var unk *cycle.UnknownsError
		msg := session.Explain(err)
		if errors.As(err, &unk) {
			msg += " Press b to go back."
		}
		return st.Error.Render("Not solved: ") + msg
	}
	s := m.sess.Result.Solved
	return st.Solved.Render(diagram.SolvedMark+" solved: ") + st.Accent.Render(fmt.Sprintf("%s = %s %s", s.Label,
		m.ctx.SignedPM(s.Value, s.Uncertainty), m.ctx.Units)) + st.Muted.Render("   enter: on to the bench")
}

func indent(s, by string) string { return by + strings.ReplaceAll(s, "\n", "\n"+by) }

func multNote(v float64) string {
	if v == 1 {
		return ""
	}
	if v == 0.5 {
		return "   (×½ per formula unit)"
	}
	return fmt.Sprintf("   (×%g per formula unit)", v)
}
