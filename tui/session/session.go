package session

import (
	"fmt"
	"sync"
	"sync/atomic"

	tea "github.com/charmbracelet/bubbletea"

	"enthalpath/cycle"
)

// Session is the state shared by the screens that show one cycle.
type Session struct {
	// Cycle is nil until a compound is opened.
	Cycle *cycle.Cycle
	// Result is the last successful solve (nil before one, or after an
	// error) and SolveErr the last solve's error.
	Result   *cycle.Result
	SolveErr error
	// Dirty is true when the cycle has changes not yet saved.
	Dirty bool
	// Path is the file the cycle was opened from or last saved to.
	Path string

	gen, resultGen int
	// magnitudes are the data's largest step values by kind, for the
	// plausibility question: computed once, in the command WarmMagnitudes
	// returns when a value editor opens (or, failing that, in a goroutine
	// the first value typed starts); magOnce orders the write before every
	// read, magReady lets Question see without waiting that it is done.
	magOnce    sync.Once
	magStarted bool
	magReady   atomic.Bool // set once magnitudes is written
	magnitudes Magnitudes
}

// SolvedMsg carries the answer of a solve started by Solve.
type SolvedMsg struct {
	Gen    int
	Result *cycle.Result
	Err    error
}

// Open makes c the session's cycle, clean, from path ("" when built from
// the data), and returns the command that solves it.
func (s *Session) Open(c *cycle.Cycle, path string) tea.Cmd {
	s.Cycle, s.Path, s.Dirty = c, path, false
	s.Result, s.SolveErr = nil, nil
	return s.Solve()
}

// Change applies f to the cycle, marks the session dirty and returns the
// re-solve command. If f fails, the cycle is put back as it was before f
// (a change is applied whole or not at all), nothing is marked and the
// error is returned.
func (s *Session) Change(f func(c *cycle.Cycle) error) (tea.Cmd, error) {
	if s.Cycle == nil {
		return nil, fmt.Errorf("no cycle is open: pick a compound on the shelf first")
	}
	before := s.Cycle.Clone()
	if err := f(s.Cycle); err != nil {
		*s.Cycle = *before // in place: screens hold the pointer
		return nil, err
	}
	s.Dirty = true
	return s.Solve(), nil
}

// Solve returns a command that solves a snapshot of the cycle.
func (s *Session) Solve() tea.Cmd {
	if s.Cycle == nil {
		return nil
	}
	s.gen++
	gen, snapshot := s.gen, s.Cycle.Clone()
	return func() tea.Msg {
		res, err := solveSafely(snapshot)
		return SolvedMsg{Gen: gen, Result: res, Err: err}
	}
}

// solveSafely turns a panic inside the engine into an error, so a bad input
// costs one answer and not the session.
func solveSafely(c *cycle.Cycle) (res *cycle.Result, err error) {
	defer func() {
		if r := recover(); r != nil {
			res, err = nil, fmt.Errorf("internal error while solving %s: %v", c.Formula, r)
		}
	}()
	return cycle.Solve(c)
}

// Apply stores the answer of the latest solve; it reports false for an
// answer to an older question, which it drops.
func (s *Session) Apply(m SolvedMsg) bool {
	if m.Gen != s.gen {
		return false
	}
	s.Result, s.SolveErr, s.resultGen = m.Result, m.Err, m.Gen
	return true
}

// Fresh reports whether Result and SolveErr answer the cycle as it is now
// (no change is waiting for its solve).
func (s *Session) Fresh() bool { return s.Cycle != nil && s.resultGen == s.gen }

// Solved returns the result when it is fresh and the solve succeeded.
func (s *Session) Solved() *cycle.Result {
	if s.Fresh() && s.SolveErr == nil {
		return s.Result
	}
	return nil
}

// Generation counts the solves asked (one per change): a value worked out
// for one generation of the cycle is stale at the next.
func (s *Session) Generation() int { return s.gen }

// Clean marks the session saved to path.
func (s *Session) Clean(path string) { s.Dirty, s.Path = false, path }

// OpenedMsg tells the screens that the session now holds another cycle.
type OpenedMsg struct{}
