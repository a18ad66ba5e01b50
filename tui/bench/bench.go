package bench

import (
	"fmt"
	"io"
	"path/filepath"

	"github.com/charmbracelet/bubbles/key"
	tea "github.com/charmbracelet/bubbletea"

	"enthalpath/cycle"
	"enthalpath/thermo/fileio"
	"enthalpath/tui/hessdiagram"
	"enthalpath/tui/prompt"
	"enthalpath/tui/screen"
	"enthalpath/tui/session"
)

// Model is the bench screen.
type Model struct {
	KeyMap KeyMap

	ctx  *screen.Context
	sess *session.Session

	cursor     int
	top        int
	edit       prompt.Slot // a step's new value, while typed
	showSource bool
	drawing    bool        // in a small window: the drawing instead of the list
	export     prompt.Slot // the SVG file name, while typed
	w, h       int
}

var _ screen.Screen = (*Model)(nil)

// New returns the bench over the session's cycle.
func New(ctx *screen.Context, sess *session.Session) *Model {
	return &Model{KeyMap: DefaultKeyMap(), ctx: ctx, sess: sess}
}

// Init does nothing.
func (m *Model) Init() tea.Cmd { return nil }

// Title is the screen's name.
func (m *Model) Title() string { return "Bench" }

// Capturing reports whether a value or file name is being typed.
func (m *Model) Capturing() bool { return m.edit.Active() || m.export.Active() }

// SetSize sets the body size.
func (m *Model) SetSize(w, h int) {
	m.w, m.h = w, h
	m.edit.SetWidth(w)
	m.export.SetWidth(min(w-6, 80))
}

// Cursor returns the index of the highlighted step.
func (m *Model) Cursor() int { return m.cursor }

// Editing reports whether a value is being typed, and the refusal shown.
func (m *Model) Editing() (bool, error) { return m.edit.Active(), m.edit.Err() }

// ShowingSource reports whether the citation box is open.
func (m *Model) ShowingSource() bool { return m.showSource }

// ShowingDrawing reports whether the small-window view shows the drawing.
func (m *Model) ShowingDrawing() bool { return m.drawing }

// Exporting reports whether the SVG file name is being asked.
func (m *Model) Exporting() bool { return m.export.Active() }

// typing returns the prompt being typed in, if any.
func (m *Model) typing() *prompt.Slot {
	if m.export.Active() {
		return &m.export
	}
	return &m.edit
}

// ShortHelp lists the main keys; while a value or file name is typed, the
// prompt's.
func (m *Model) ShortHelp() []key.Binding {
	if m.Capturing() {
		return m.typing().ShortHelp()
	}
	if m.sess.Cycle == nil {
		return nil // no key of the bench works before a cycle is open
	}
	k := m.KeyMap
	return []key.Binding{k.Edit, k.Unknown, k.Reset, k.Source}
}

// FullHelp lists every key; while a value or file name is typed, the
// prompt's.
func (m *Model) FullHelp() [][]key.Binding {
	if m.Capturing() {
		return m.typing().FullHelp()
	}
	if m.sess.Cycle == nil {
		return nil
	}
	k := m.KeyMap
	return [][]key.Binding{
		{k.Up, k.Down, k.Top, k.Bottom},
		{k.Edit, k.Unknown, k.Reset, k.Source},
		{k.Assemble, k.Pane, k.Export, k.Lattice, k.Electrons},
	}
}

func (m *Model) steps() []cycle.Step {
	if res := m.sess.Solved(); res != nil {
		return res.Steps
	}
	if m.sess.Cycle == nil {
		return nil
	}
	return m.sess.Cycle.Steps
}

// current returns the highlighted step of the cycle (not the result).
func (m *Model) current() *cycle.Step {
	c := m.sess.Cycle
	if c == nil || m.cursor < 0 || m.cursor >= len(c.Steps) {
		return nil
	}
	return &c.Steps[m.cursor]
}

// Update handles keys and results.
func (m *Model) Update(msg tea.Msg) tea.Cmd {
	switch msg := msg.(type) {
	case session.OpenedMsg:
		m.cursor, m.top, m.showSource = 0, 0, false
		m.edit.Close()
		m.export.Close()
		if c := m.sess.Cycle; c != nil {
			for i := range c.Steps {
				if c.Steps[i].Unknown {
					m.cursor = i
				}
			}
		}
		return nil
	case session.MagnitudesMsg:
		return m.edit.Retry(session.Pending) // a value typed before they were ready
	case tea.KeyMsg:
		return m.key(msg)
	}
	return m.typing().Update(msg)
}

func (m *Model) key(k tea.KeyMsg) tea.Cmd {
	if m.Capturing() {
		return m.typing().Update(k)
	}
	if m.showSource {
		// Any key closes the box; movement keys also move.
		m.showSource = false
		if key.Matches(k, m.KeyMap.Source) || k.Type == tea.KeyEsc {
			return nil
		}
	}
	c := m.sess.Cycle
	if c == nil {
		if key.Matches(k, m.KeyMap.Edit, m.KeyMap.Unknown, m.KeyMap.Reset, m.KeyMap.Source, m.KeyMap.Assemble, m.KeyMap.Export) {
			return screen.Status("No cycle yet: pick a compound on the Shelf (1) and press enter.")
		}
		return nil
	}
	km := m.KeyMap
	switch {
	case key.Matches(k, km.Up):
		m.move(-1)
	case key.Matches(k, km.Down):
		m.move(1)
	case key.Matches(k, km.Top):
		m.move(-len(c.Steps))
	case key.Matches(k, km.Bottom):
		m.move(len(c.Steps))
	case key.Matches(k, km.Edit):
		m.startEdit()
		return m.sess.WarmMagnitudes(m.ctx.DB) // ready by the time the value is typed
	case key.Matches(k, km.Unknown):
		s := m.current()
		return m.change(func(c *cycle.Cycle) error { return c.SolveFor(s.Key) },
			"Solving for "+s.Label+" ("+s.Key+").")
	case key.Matches(k, km.Reset):
		s := m.current()
		return m.change(func(c *cycle.Cycle) error { return c.Reset(s.Key) }, "Reset "+s.Key+" to the data.")
	case key.Matches(k, km.Source):
		m.showSource = true
	case key.Matches(k, km.Assemble):
		return screen.Switch(screen.Assembly)
	case key.Matches(k, km.Pane):
		m.drawing = !m.drawing
	case key.Matches(k, km.Export):
		m.askExport()
	case key.Matches(k, km.Lattice):
		conv := c.Conventions
		conv.Lattice = 1 - conv.Lattice
		return m.change(func(c *cycle.Cycle) error { c.SetConventions(conv); return nil },
			"Lattice step now as "+conv.Lattice.String()+" ("+conv.Lattice.Symbol()+").")
	case key.Matches(k, km.Electrons):
		conv := c.Conventions
		conv.Ionization = 1 - conv.Ionization
		return m.change(func(c *cycle.Cycle) error { c.SetConventions(conv); return nil },
			"Ionization and attachment steps now at "+conv.Ionization.String()+".")
	}
	return nil
}

func (m *Model) change(f func(*cycle.Cycle) error, done string) tea.Cmd {
	cmd, err := m.sess.Change(f)
	if err != nil {
		return screen.Fail(err)
	}
	return tea.Batch(cmd, screen.Status(done))
}

func (m *Model) move(d int) {
	n := len(m.steps())
	if n == 0 {
		return
	}
	m.cursor = max(0, min(n-1, m.cursor+d))
}

// startEdit asks for a new value of the highlighted step.
func (m *Model) startEdit() {
	s := m.current()
	if s == nil {
		return
	}
	cur := "no value yet"
	if s.Source.Kind != cycle.SourceMissing && !s.Unknown {
		cur = "now " + m.ctx.SignedPM(s.Value, s.Uncertainty)
	}
	p := prompt.New(m.ctx.Styles, "New value for "+s.Label, "", "", m.ctx.MaxInputLen, m.acceptValue(s.Key),
		prompt.WithLabel(fmt.Sprintf("%s (%s) › ", s.Key, m.ctx.Units)),
		prompt.WithPlaceholder(cur+"; type e.g. "+session.Example(m.ctx, s)),
		prompt.WithAside(" — "+s.Reaction+", per reaction as written; ± uncertainty optional"),
		prompt.WithSubmitHelp("accept the value"))
	km := p.KeyMap
	p.Hint = km.Submit.Help().Key + " accepts · " + km.Cancel.Help().Key + " cancels · without ± the old uncertainty is kept"
	m.edit.Open(p)
}

// acceptValue checks a value typed for step key (a number, of the sign the
// step's physics allows, of a plausible size) and sets it; without ± the
// old uncertainty stays. A value beyond session.PlausibleFactor times the
// largest of its kind in the data is refused once with that said; enter
// again on the same text sets it.
func (m *Model) acceptValue(key string) prompt.Accept {
	var confirm session.Confirmer
	return func(text string) (tea.Cmd, error) {
		s, ok := m.sess.Cycle.Step(key)
		if !ok {
			return nil, fmt.Errorf("the cycle has no step %s any more", key)
		}
		kj, unc, err := m.ctx.ParseValue(text, s.Uncertainty)
		if err == nil {
			err = m.plausible(s, kj)
		}
		if err != nil {
			return nil, session.ValueError(text, err)
		}
		if err := confirm.Ask(text, m.sess.Question(m.ctx, s.Kind, text, kj)); err != nil {
			return nil, err
		}
		cmd, err := m.sess.Change(func(c *cycle.Cycle) error { return c.Set(key, kj, unc) })
		if err != nil {
			return nil, session.ValueError(text, err)
		}
		return tea.Batch(cmd, screen.Status(fmt.Sprintf("%s set to %s %s (your value).", key,
			m.ctx.SignedPM(kj, unc), m.ctx.Units))), nil
	}
}

// plausible refuses values whose sign contradicts the step's physics, with
// the reason: ionization and atomization take energy in; the lattice step
// (gaseous ions → solid) gives it out.
func (m *Model) plausible(s *cycle.Step, kj float64) error {
	switch s.Kind {
	case cycle.KindIonization, cycle.KindAtomization, cycle.KindSublimation, cycle.KindVaporization, cycle.KindDissociation:
		if kj <= 0 {
			return fmt.Errorf("%s takes energy in, so its value is positive; did you mean %s?", s.Label, m.flip(kj))
		}
	case cycle.KindLattice:
		if kj >= 0 {
			return fmt.Errorf("the lattice step goes from the gaseous ions to the solid and is negative; did you mean %s?", m.flip(kj))
		}
	}
	return nil
}

func (m *Model) flip(kj float64) string { return m.ctx.Signed(-kj) }

func (m *Model) askExport() {
	c := m.sess.Cycle
	d := hessdiagram.Build(c.Formula, m.steps(), hessdiagram.ForCycle(c, hessdiagram.Options{Units: m.ctx.Units, Limit: -1, Solved: m.sess.Solved() != nil}))
	d.Notes = drawingNotes(m.sess.Solved())
	name := stem(c.Formula) + "-cycle.svg"
	m.export.Open(prompt.New(m.ctx.Styles, "Export the drawing as SVG", name, "A file name; esc cancels.", m.ctx.MaxInputLen,
		func(answer string) (tea.Cmd, error) {
			if filepath.Ext(answer) != ".svg" {
				answer += ".svg"
			}
			path, err := m.ctx.ResolvePath(answer)
			if err != nil {
				return nil, err
			}
			return func() tea.Msg {
				if err := writeSVG(path, d); err != nil {
					return screen.StatusMsg{Text: "SVG not written: " + err.Error(), Err: true}
				}
				return screen.StatusMsg{Text: "Drawing written to " + path + "."}
			}, nil
		}, prompt.WithProposal()))
}

// writeSVG writes the drawing atomically (fileio.WriteAtomic): it keeps
// the mode of a file it replaces and never replaces a link or a device.
func writeSVG(path string, d interface{ WriteSVG(w io.Writer) error }) error {
	return fileio.WriteAtomic(path, 0o644, d.WriteSVG)
}

func stem(s string) string {
	out := make([]rune, 0, len(s))
	for _, r := range s {
		if r < 128 && (r >= '0' && r <= '9' || r|0x20 >= 'a' && r|0x20 <= 'z') {
			out = append(out, r)
		}
	}
	if len(out) == 0 {
		return "cycle"
	}
	return string(out)
}
