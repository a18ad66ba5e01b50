package session

import (
	"errors"
	"fmt"
	"math"
	"strings"

	tea "github.com/charmbracelet/bubbletea"

	"enthalpath/cycle"
	"enthalpath/cycle/analysis"
	"enthalpath/data"
	"enthalpath/thermo"
	"enthalpath/tui/screen"
)

// PlausibleFactor is how many times the largest magnitude of a step kind
// in the data a typed value may reach before the workshop asks whether it
// is meant (common practice, no source: a guard against a value typed in
// the wrong unit, such as −349 in eV for an attachment of −3.6 eV).
const PlausibleFactor = 10

// Magnitudes holds the largest |value| in kJ/mol of each step kind over
// the cycles of every compound of the data: each step's data value, and
// the lattice step as Hess's law solves it.
type Magnitudes map[cycle.StepKind]float64

// DataMagnitudes builds and solves the cycle of every compound of db and
// records the largest magnitude of each step kind. Compounds whose cycle
// cannot be built or solved are left out.
func DataMagnitudes(db *data.DB) Magnitudes {
	out := Magnitudes{}
	if db == nil {
		return out
	}
	note := func(s *cycle.Step) {
		switch s.Source.Kind {
		case cycle.SourceData, cycle.SourceSum, cycle.SourceSolved:
		default:
			return
		}
		if v := math.Abs(s.Value); !math.IsNaN(v) && !math.IsInf(v, 0) && v > out[s.Kind] {
			out[s.Kind] = v
		}
	}
	entries, _ := analysis.Survey(db, nil, analysis.SurveyOptions{}) // no Prepare: no error
	for _, e := range entries {
		var steps []cycle.Step
		switch {
		case e.Result != nil:
			steps = e.Result.Steps
		case e.Cycle != nil:
			steps = e.Cycle.Steps
		}
		for i := range steps {
			note(&steps[i])
		}
	}
	return out
}

// Implausible returns a warning when |kj| is beyond PlausibleFactor times
// the largest magnitude of kind in the data (nil when it is not, or when
// the data have no step of that kind). largest is that magnitude.
func (m Magnitudes) Implausible(kind cycle.StepKind, kj float64) (largest float64, beyond bool) {
	largest, ok := m[kind]
	if !ok || largest == 0 {
		return 0, false
	}
	return largest, math.Abs(kj) > PlausibleFactor*largest
}

// Check returns the question to put, in place, before a value kj typed as
// text for a step of kind is set when it is implausible (nil otherwise):
// the value in kJ/mol, the data's largest of its kind, and what to do.
func (m Magnitudes) Check(ctx *screen.Context, kind cycle.StepKind, text string, kj float64) error {
	largest, beyond := m.Implausible(kind, kj)
	if !beyond {
		return nil
	}
	return fmt.Errorf("%s %s is %s kJ/mol, over %d× the largest %s step of the data (%s %s): "+
		"check the unit; press enter again to set it anyway, or type another value",
		strings.TrimSpace(text), ctx.Units, screen.FormatEnergy(kj, thermo.KJPerMol), PlausibleFactor,
		kind, ctx.Energy(largest), ctx.Units)
}

// Question returns the plausibility question for a value kj typed as text
// for a step of kind (nil when the value is plausible). The data's
// magnitudes are computed once per session, off the Update path (see
// WarmMagnitudes), and shared by every screen that takes values. Until
// they are ready Question never waits for them: it returns a
// *PendingError, the visible "working" state of the check (and starts
// the computation if nothing has).
func (s *Session) Question(ctx *screen.Context, kind cycle.StepKind, text string, kj float64) error {
	if !s.magReady.Load() {
		if !s.magStarted {
			s.magStarted = true
			go s.magnitudesOf(ctx.DB)
		}
		return &PendingError{}
	}
	return s.magnitudesOf(ctx.DB).Check(ctx, kind, text, kj)
}

// MagnitudesMsg says the data's magnitudes are ready: a screen whose value
// was refused with a *PendingError submits it again (Pending).
type MagnitudesMsg struct{}

// Pending reports whether err is a *PendingError.
func Pending(err error) bool {
	var p *PendingError
	return errors.As(err, &p)
}

// PendingError says a typed value cannot be checked yet: the data's
// largest values are still being read.
type PendingError struct{}

func (*PendingError) Error() string {
	return "a moment: the data's largest values, to check the value against, are still being read; press enter again"
}

// WarmMagnitudes returns the command that computes the data's magnitudes
// (a survey of every compound, ~0.2 s) off the Update path, the first time
// it is called in a session, answering MagnitudesMsg; nil after that. A
// screen returns it when a value editor opens, so that Question finds them
// ready.
func (s *Session) WarmMagnitudes(db *data.DB) tea.Cmd {
	if s.magStarted {
		return nil
	}
	s.magStarted = true
	return func() tea.Msg {
		s.magnitudesOf(db)
		return MagnitudesMsg{}
	}
}

// magnitudesOf returns the data's magnitudes, computing them once.
func (s *Session) magnitudesOf(db *data.DB) Magnitudes {
	s.magOnce.Do(func() {
		s.magnitudes = DataMagnitudes(db)
		s.magReady.Store(true)
	})
	return s.magnitudes
}

// Confirmer lets a questioned value through when it is typed again: Ask
// returns the question the first time a text draws it, nil for the same
// text after that (and nil when there is no question).
type Confirmer struct{ asked string }

// Ask returns question unless text was already asked about. A
// *PendingError is no question: it is returned and not remembered, so the
// check is made once the magnitudes are ready.
func (c *Confirmer) Ask(text string, question error) error {
	if Pending(question) {
		return question
	}
	if question == nil || c.asked == text {
		return nil
	}
	c.asked = text
	return question
}

// Example is a value to type for step s in the display unit: its current
// value and uncertainty (or the data's), as typed, with an ASCII minus.
func Example(ctx *screen.Context, s *cycle.Step) string {
	v, unc := s.Value, s.Uncertainty
	if s.Source.Kind == cycle.SourceMissing || s.Unknown {
		if r := s.Reference; r != nil {
			v, unc = r.Value, r.Uncertainty
		} else if s.Kind == cycle.KindLattice {
			v, unc = -700, 10 // a round lattice value of the usual size
		} else {
			v, unc = 100, 5
		}
	}
	ex := ctx.Energy(v)
	if unc > 0 {
		ex += "±" + screen.FormatEnergy(unc, ctx.Units)
	}
	return strings.ReplaceAll(ex, "−", "-")
}
