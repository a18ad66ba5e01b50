package tui_test

import (
	"reflect"
	"strings"
	"testing"

	"enthalpath/cycle"
	"enthalpath/tui"
	"enthalpath/tui/internal/drive"
	"enthalpath/tui/prompt"
	"enthalpath/tui/screen"
)

type (
	editor interface{ Editing() (bool, error) }
	argser interface {
		Args(i int) string
		Result(i int) (any, error)
	}
)

// cycleState is what a refused or cancelled value must leave as it was.
func cycleState(m *tui.Model) any {
	return []any{m.Session().Cycle.Clone(), m.Session().Dirty}
}

func step(m *tui.Model, key string) cycle.Step {
	s, _ := m.Session().Cycle.Step(key)
	return *s
}

// TestEveryValueEditor drives the in-place editor of each screen through
// the root model: it captures the keys exactly while open, its help is
// the prompt's keys, a refused value is explained in place and changes
// nothing, esc leaves everything as it was (even with a good value typed),
// and an accepted value is applied and reported as before. The refusal
// texts are the screens' own (bench sign rule, screen.ParseEnergy, the
// model panel's settings, the analyses' usage); the status lines are the
// screens' existing wording.
func TestEveryValueEditor(t *testing.T) {
	db := loadDB(t)
	cases := []struct {
		name    string
		id      screen.ID
		prep    func(u drive.Updater)
		state   func(m *tui.Model) any
		bad     string
		refusal string
		good    string
		status  string // in the status line after the good value, "" for none
		applied func(m *tui.Model) bool
	}{
		{
			name: "bench", id: screen.Bench,
			prep:  func(u drive.Updater) { drive.Run(u, screen.OpenMsg{Formula: "NaCl"}); keys(u, "g", "j") },
			state: cycleState, bad: "-495.8", refusal: "takes energy in, so its value is positive",
			good: "500±1", status: "ionization-1 set to +500.0 ±1.0 kJ/mol (your value).",
			applied: func(m *tui.Model) bool {
				s := step(m, "ionization-1")
				return s.Value == 500 && s.Uncertainty == 1 && s.Source.Kind == cycle.SourceUser
			},
		},
		{
			name: "assembly", id: screen.Assembly,
			prep:  func(u drive.Updater) { drive.Run(u, screen.OpenMsg{Formula: "NaCl", Guided: true}) },
			state: cycleState, bad: "x12", refusal: `"x12": not a number (column 1)`,
			good: "90±1",
			applied: func(m *tui.Model) bool {
				s := step(m, "atomization-cation")
				return s.Value == 90 && s.Uncertainty == 1 && s.Source.Kind == cycle.SourceUser
			},
		},
		{
			name: "models", id: screen.Models,
			prep:  func(u drive.Updater) { drive.Run(u, screen.OpenMsg{Formula: "NaCl"}); keys(u, "4", "j") },
			state: cycleState, bad: "abc", refusal: `ρ: "abc" is not a number`,
			good: "0.30", status: "ρ (Born–Mayer range): 0.3 Å.",
			applied: func(m *tui.Model) bool { return m.Session().Cycle.Settings.Rho == 0.30 },
		},
		{
			name: "analyses", id: screen.Analyses,
			prep: func(u drive.Updater) { keys(u, "shift+tab") },
			state: func(m *tui.Model) any {
				a := m.Screen(screen.Analyses).(argser)
				res, err := a.Result(0)
				return []any{a.Args(0), res, err}
			},
			bad: "MgCl nosuchmodel", refusal: `"nosuchmodel" is neither charges`,
			good: "CaF2",
			applied: func(m *tui.Model) bool {
				a := m.Screen(screen.Analyses).(argser)
				res, err := a.Result(0)
				return a.Args(0) == "CaF2" && res != nil && err == nil
			},
		},
	}
	submit, cancel := prompt.DefaultKeyMap().Submit.Keys(), prompt.DefaultKeyMap().Cancel.Keys()
	for _, c := range cases {
		t.Run(c.name, func(t *testing.T) {
			m, u, _ := newRoot(t, db, 100, 30)
			c.prep(u)
			if m.Active() != c.id {
				t.Fatalf("prep left screen %d active, want %d", m.Active(), c.id)
			}
			scr := m.Screen(c.id)
			capturing := func(want bool, when string) {
				t.Helper()
				if scr.Capturing() != want {
					t.Fatalf("%s: Capturing() = %v, want %v", when, scr.Capturing(), want)
				}
				if editing, _ := scr.(editor).Editing(); editing != want {
					t.Fatalf("%s: Editing() = %v, want %v", when, editing, want)
				}
			}
			capturing(false, "before e")
			before := c.state(m)

			keys(u, "e")
			capturing(true, "after e")
			short := m.ShortHelp()
			if len(short) < 2 || !reflect.DeepEqual(short[0].Keys(), submit) || !reflect.DeepEqual(short[1].Keys(), cancel) {
				t.Errorf("short help while editing is not the prompt's keys: %v", short)
			}
			for _, g := range m.FullHelp() {
				for _, b := range g {
					for _, k := range b.Keys() {
						if len([]rune(k)) == 1 {
							t.Errorf("full help while editing lists %q (%s), which is text now", k, b.Help().Desc)
						}
					}
				}
			}
			if got := m.FullHelp()[0]; len(got) != 2 || !reflect.DeepEqual(got[0].Keys(), submit) {
				t.Errorf("full help does not start with the prompt's keys: %v", got)
			}

			// A refused value: explained in place, the editor stays open,
			// nothing changes.
			keys(u, "ctrl+u") // the analyses' editor opens on the last arguments
			drive.Run(u, drive.Text(c.bad)...)
			keys(u, "enter")
			capturing(true, "after a refused value")
			if _, err := scr.(editor).Editing(); err == nil || !strings.Contains(err.Error(), c.refusal) {
				t.Errorf("refusal %v, want one saying %q", err, c.refusal)
			}
			if v := m.View(); !strings.Contains(v, "✗ not accepted: ") || !strings.Contains(v, c.refusal) {
				t.Errorf("the refusal is not shown in place:\n%s", v)
			}
			if after := c.state(m); !reflect.DeepEqual(after, before) {
				t.Errorf("a refused value changed the state")
			}

			// esc closes it with nothing applied.
			keys(u, "esc")
			capturing(false, "after esc")
			if v := m.View(); strings.Contains(v, "not accepted") {
				t.Errorf("the refusal outlived the editor:\n%s", v)
			}
			// esc over a good value typed but not entered applies nothing
			// either.
			keys(u, "e", "ctrl+u")
			drive.Run(u, drive.Text(c.good)...)
			keys(u, "esc")
			capturing(false, "after esc over a good value")
			if after := c.state(m); !reflect.DeepEqual(after, before) {
				t.Errorf("esc applied the typed value")
			}

			// A good value is applied whole and the editor closes.
			keys(u, "e", "ctrl+u")
			drive.Run(u, drive.Text(c.good)...)
			keys(u, "enter")
			capturing(false, "after an accepted value")
			if !c.applied(m) {
				t.Errorf("%q was not applied", c.good)
			}
			if c.status != "" && !strings.Contains(m.View(), c.status) {
				t.Errorf("status line lacks %q:\n%s", c.status, m.View())
			}
		})
	}
}
