package session

import (
	"strings"
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

// TestModelRemedyOnTheModelsScreen: a model error's remedy is worded as
// the Models screen's row, from its field (no sentence fragment replaced),
// and no flag reaches the screen.
func TestModelRemedyOnTheModelsScreen(t *testing.T) {
	for r, want := range map[cycle.Remedy]string{
		cycle.RemedyBornExponent:      "type n on the Models screen (4)",
		cycle.RemedyStructure:         "set the structure on the Models screen (4)",
		cycle.RemedyStructureWithCell: "cell parameters or a CIF file on the Models screen (4)",
		cycle.RemedyReadCIF:           "give the CIF file again on the Models screen (4)",
	} {
		msg := Message(&cycle.ModelError{Model: cycle.ModelEwald, Reason: "cannot run", Remedy: r})
		if !strings.Contains(msg, want) || strings.Contains(msg, "--") {
			t.Errorf("remedy %v: %q, want %q and no flag", r, msg, want)
		}
	}
}
