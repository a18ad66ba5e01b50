package assembly

import (
	"errors"
	"fmt"

	tea "github.com/charmbracelet/bubbletea"

	"enthalpath/cycle"
	"enthalpath/tui/session"
)

// The proposals: what the assembly offers for each step, and the lattice
// model it needs for the lattice step, worked out in a command.

// modelMsg is the answer of the command askModel returns.
type modelMsg struct {
	c      *cycle.Cycle
	gen    int
	result cycle.ModelResult
	err    error
}

// errWorking says the lattice model is still being worked out.
var errWorking = errors.New("a moment: the lattice model is being worked out")

// proposal returns what the workshop proposes for step s: a data value, for
// the lattice step when another step is the unknown the data's handbook
// value (what the Bench keeps there: the step's Reference, to which
// cycle.Reset returns) or else a model value, or the unknown itself (the
// lattice step otherwise).
func (m *Model) proposal(s *cycle.Step) (text string, ok bool) {
	switch m.kept(s) {
	case "unknown":
		return "keep it the unknown, as the cycle has it (one unknown only)", true
	case "user":
		return fmt.Sprintf("keep your value %s %s", m.ctx.SignedPM(s.Value, s.Uncertainty), m.ctx.Units), true
	case "":
	default:
		return "keep the " + m.sess.Cycle.Settings.LatticeFrom + " model's value, as chosen", true
	}
	if s.Kind == cycle.KindLattice {
		unknown := m.unknownKey()
		if unknown == "" {
			return "solve it by Hess's law from the other steps (the usual unknown)", true
		}
		if r := s.Reference; r != nil {
			return fmt.Sprintf("%s %s, the data's handbook value from %s (%s is the unknown)",
				m.ctx.SignedPM(r.Value, r.Uncertainty), m.ctx.Units, sourceName(r.Source), unknown), true
		}
		mr, err := m.latticeModelErr()
		if errors.Is(err, errWorking) {
			return "working out the lattice model…", false
		}
		if err == nil {
			return fmt.Sprintf("%s %s from the %s model (%s is the unknown)",
				m.ctx.SignedPM(mr.Value, mr.Uncertainty), m.ctx.Units, mr.Model, unknown), true
		}
		return "no model can give it (" + session.Message(err) + "): type a value with e", false
	}
	if r := s.Reference; r != nil {
		return fmt.Sprintf("%s %s from %s", m.ctx.SignedPM(r.Value, r.Uncertainty), m.ctx.Units, sourceName(r.Source)), true
	}
	if s.Composite && s.Source.Kind == cycle.SourceSum {
		return fmt.Sprintf("%s %s, the sum of its sub-steps", m.ctx.SignedPM(s.Value, s.Uncertainty), m.ctx.Units), true
	}
	return "the data have no value: type one (e) or make it the unknown (x)", false
}

func sourceName(s cycle.Source) string {
	if s.Key != "" {
		return s.Key
	}
	return s.Kind.String()
}

// latticeModel picks the model that fills the lattice step when another
// step is solved and the data have no handbook value for it: the default
// model of an estimate (cycle.DefaultModel), as on the command line.
func (m *Model) latticeModel() (cycle.ModelResult, bool) {
	mr, err := m.latticeModelErr()
	return mr, err == nil
}

func (m *Model) latticeModelErr() (cycle.ModelResult, error) {
	if m.model == nil || m.model.c != m.sess.Cycle || m.model.gen != m.sess.Generation() {
		return cycle.ModelResult{}, errWorking
	}
	return m.model.result, m.model.err
}

// needsModel reports whether the proposal for s is a lattice model's value:
// the lattice step, another step the unknown, no handbook value.
func (m *Model) needsModel(s *cycle.Step) bool {
	return s != nil && s.Kind == cycle.KindLattice && m.unknownKey() != "" && s.Reference == nil
}

// askModel returns the command that works out the lattice model, off the
// Update path, when the current step's proposal needs it and it is not
// asked for this cycle and generation yet; else nil.
func (m *Model) askModel() tea.Cmd {
	c, gen := m.sess.Cycle, m.sess.Generation()
	if !m.needsModel(m.current()) || (m.modelFor.c == c && m.modelFor.gen == gen) {
		return nil
	}
	m.modelFor.c, m.modelFor.gen, m.model = c, gen, nil
	snapshot := c.Clone()
	return func() tea.Msg {
		mr, _, err := cycle.DefaultModel(snapshot)
		return modelMsg{c: c, gen: gen, result: mr, err: err}
	}
}
