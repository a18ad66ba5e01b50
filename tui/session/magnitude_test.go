package session

import (
	"errors"
	"strings"
	"testing"

	"enthalpath/cycle"
	"enthalpath/data"
	"enthalpath/thermo"
	"enthalpath/tui/screen"
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

// TestQuestionNeverWaits: before the data's magnitudes are ready, Question
// answers at once with the pending state (it does not survey every
// compound itself: were it to, the magnitudes would be ready and the
// answer the plausibility question), and the Confirmer does not take that
// for a question asked, so the value is checked once they are ready. An
// attachment of −349 typed in eV is 33,700 kJ/mol, beyond 10× any
// attachment of the data (largest |EA| below 1,000 kJ/mol: CRC Handbook,
// from memory).
func TestQuestionNeverWaits(t *testing.T) {
	db, err := data.Load()
	if err != nil {
		t.Fatal(err)
	}
	ctx := &screen.Context{DB: db, Units: thermo.EVPerFormulaUnit}
	kj := thermo.ToKJPerMol(-349, thermo.EVPerFormulaUnit)
	s := &Session{}
	var confirm Confirmer
	var pending *PendingError
	if q := confirm.Ask("-349", s.Question(ctx, cycle.KindAttachment, "-349", kj)); !errors.As(q, &pending) {
		t.Fatalf("before the magnitudes: %v, want the pending state", q)
	}
	s.magnitudesOf(db) // waits for the computation the question started
	if q := confirm.Ask("-349", s.Question(ctx, cycle.KindAttachment, "-349", kj)); q == nil || errors.As(q, &pending) {
		t.Fatalf("once ready: %v, want the plausibility question", q)
	}
	if q := confirm.Ask("-349", s.Question(ctx, cycle.KindAttachment, "-349", kj)); q != nil {
		t.Errorf("asked again on the same text: %v, want it let through", q)
	}
}
