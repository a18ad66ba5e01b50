package session

import (
	"testing"

	"enthalpath/cycle"
	"enthalpath/data"
)

// TestMagnitudesWarmedOffUpdate: the data's magnitudes are computed by the
// command WarmMagnitudes returns (once per session), so the first value
// typed does not survey every compound inside Update; the largest lattice
// magnitude is that of a highly charged oxide or nitride, beyond NaCl's
// 787 kJ/mol (CRC Handbook lattice energies, from memory).
func TestMagnitudesWarmedOffUpdate(t *testing.T) {
	db, err := data.Load()
	if err != nil {
		t.Fatal(err)
	}
	s := &Session{}
	cmd := s.WarmMagnitudes(db)
	if cmd == nil {
		t.Fatal("no command the first time")
	}
	if s.WarmMagnitudes(db) != nil {
		t.Error("a second command: the survey would run twice")
	}
	done := make(chan struct{})
	go func() { cmd(); close(done) }() // as bubbletea runs a command
	<-done
	if got := s.magnitudesOf(nil)[cycle.KindLattice]; got <= 787 {
		t.Errorf("largest lattice magnitude %.0f kJ/mol, want above NaCl's 787", got)
	}
}
