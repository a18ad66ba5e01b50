package session_test

import (
	"errors"
	"reflect"
	"testing"

	"enthalpath/cycle"
	"enthalpath/data"
	"enthalpath/tui/session"
)

// TestChangeIsWholeOrNothing: a change that fails part-way leaves the
// cycle exactly as it was (the same pointer, equal contents) and the
// session clean; one that succeeds is kept and marks the session dirty.
// The changes are made up for the test (no outside source).
func TestChangeIsWholeOrNothing(t *testing.T) {
	db, err := data.Load()
	if err != nil {
		t.Fatal(err)
	}
	refused := errors.New("refused after a partial change")
	cases := []struct {
		name   string
		change func(c *cycle.Cycle) error
		kept   bool
	}{
		{"value set, then refused", func(c *cycle.Cycle) error {
			if err := c.Set("ionization-1", 1, 0); err != nil {
				return err
			}
			return refused
		}, false},
		{"settings touched, then refused", func(c *cycle.Cycle) error {
			c.Settings.Rho, c.Settings.LatticeFrom = 0.9, cycle.ModelBornMayer
			c.Steps = c.Steps[:1]
			return refused
		}, false},
		{"refused by the cycle itself", func(c *cycle.Cycle) error { return c.Set("no-such-step", 1, 0) }, false},
		{"accepted", func(c *cycle.Cycle) error { return c.Set("ionization-1", 500, 1) }, true},
	}
	for _, tc := range cases {
		t.Run(tc.name, func(t *testing.T) {
			c, err := cycle.Build(db, "NaCl", cycle.Options{})
			if err != nil {
				t.Fatal(err)
			}
			s := &session.Session{}
			s.Open(c, "")
			before := c.Clone()
			cmd, err := s.Change(tc.change)
			if s.Cycle != c {
				t.Fatal("Change replaced the session's cycle pointer")
			}
			if tc.kept {
				if err != nil || cmd == nil || !s.Dirty {
					t.Fatalf("accepted change: err %v, cmd %v, dirty %v", err, cmd != nil, s.Dirty)
				}
				if st, _ := c.Step("ionization-1"); st.Value != 500 || st.Uncertainty != 1 {
					t.Errorf("accepted change not kept: %+v", *st)
				}
				return
			}
			if err == nil || cmd != nil || s.Dirty {
				t.Fatalf("refused change: err %v, cmd %v, dirty %v", err, cmd != nil, s.Dirty)
			}
			if !reflect.DeepEqual(c, before) {
				t.Errorf("a refused change left the cycle altered:\nbefore %+v\nafter  %+v", before.Settings, c.Settings)
			}
		})
	}
}
