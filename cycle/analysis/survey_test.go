package analysis

import (
	"errors"
	"testing"

	"enthalpath/cycle"
)

// TestSurvey: one entry per compound in the data's order; the NaCl cycle
// closes near the lattice enthalpy of the handbooks, ΔH_L = +787 kJ/mol
// (CRC Handbook, "Lattice energies" table, 787 kJ/mol; from memory), so
// the lattice step as written (ions → solid) is about −787 kJ/mol; a
// formula that is no compound is an entry with its error, not a stop; an
// error of Prepare stops the survey.
func TestSurvey(t *testing.T) {
	a := testAnalyst(t)
	db := a.db
	all, err := Survey(db, nil, SurveyOptions{})
	if err != nil {
		t.Fatal(err)
	}
	comps := db.Compounds()
	if len(all) != len(comps) {
		t.Fatalf("%d entries for %d compounds", len(all), len(comps))
	}
	for i, e := range all {
		if e.Formula != comps[i].Formula {
			t.Fatalf("entry %d is %s, want %s", i, e.Formula, comps[i].Formula)
		}
		if (e.Result == nil) == (e.Err == nil) {
			t.Errorf("%s: result %v and error %v (exactly one expected)", e.Formula, e.Result != nil, e.Err)
		}
	}

	some, err := Survey(db, []string{"NaCl", "Xq2"}, SurveyOptions{})
	if err != nil {
		t.Fatal(err)
	}
	if r := some[0].Result; r == nil || !near(r.Lattice.Enthalpy, -787, 15) {
		t.Errorf("NaCl: %+v, %v; want a lattice step near −787 kJ/mol", r, some[0].Err)
	}
	if some[1].Err == nil || some[1].Cycle != nil {
		t.Errorf("Xq2: %+v; want an entry with its error", some[1])
	}

	stop := errors.New("stop")
	n := 0
	if _, err := Survey(db, []string{"NaCl", "KCl"}, SurveyOptions{Prepare: func(*cycle.Cycle) error { n++; return stop }}); !errors.Is(err, stop) || n != 1 {
		t.Errorf("Prepare's error: %v after %d calls; want it returned after 1", err, n)
	}
}
