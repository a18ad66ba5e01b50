package cycle

import (
	"math"
	"strings"
	"testing"
)

// A hypothetical ion borrows the radii of the same-charge ion of the nearest
// element (the neighbour rule, common practice, no source): Mg⁺ takes Na⁺'s
// (Z 12 → 11, Shannon 1976 CN VI 1.02 Å), so Kapustinskii can fill the
// lattice step of MgCl, and the model inputs say where the radius came from.
func TestHypotheticalIonNeighbourRadius(t *testing.T) {
	c := build(t, "MgCl", Options{})
	if c.Cation.Ion.Symbol != "Mg+" || len(c.Cation.Ion.Radii) == 0 {
		t.Fatalf("cation %+v, want Mg+ with borrowed radii", c.Cation.Ion)
	}
	mr, err := EvaluateModel(c, ModelKapustinskii)
	if err != nil || !mr.OK() {
		t.Fatalf("kapustinskii for MgCl: %+v, %v", mr, err)
	}
	if math.Abs(mr.Inputs.CationRadius-1.02) > 1e-9 || !strings.Contains(mr.Inputs.RadiusFrom, "neighbour rule") {
		t.Errorf("cation radius %.3f from %q, want Na+'s 1.02 Å by the neighbour rule", mr.Inputs.CationRadius, mr.Inputs.RadiusFrom)
	}
}

// TestFormulaCountsAreDecimal: counts are decimal; a leading zero is
// refused rather than read as octal ("NaCl010" was 8 chlorine atoms and
// "Na09Cl" a "zero count") — no source needed, the decimal reading is the
// only chemical one. An ion charge with a leading zero is refused too.
func TestFormulaCountsAreDecimal(t *testing.T) {
	db := loadDB(t)
	for _, f := range []string{"NaCl010", "Na09Cl", "Na01Cl", "Mg02Cl"} {
		_, err := Build(db, f, Options{})
		if err == nil || !strings.Contains(err.Error(), "leading zero") {
			t.Errorf("Build(%q): %v; want a refusal of the leading zero", f, err)
		}
	}
	if _, err := Build(db, "Na0Cl", Options{}); err == nil || !strings.Contains(err.Error(), "zero count") {
		t.Errorf("Build(Na0Cl): %v; want a zero count", err)
	}
	if _, err := Build(db, "MgCl", Options{Cation: "Mg01+", Anion: "Cl-"}); err == nil {
		t.Errorf("Build(MgCl, Mg01+): accepted a charge with a leading zero")
	}
	// A count of 10 or more still reads in decimal: Cl₁₀ needs Na¹⁰⁺.
	c, err := Build(db, "NaCl10", Options{Cation: "Na10+", Anion: "Cl-"})
	if err != nil || c.Anion.Count != 10 || c.Cation.Ion.Charge != 10 {
		t.Errorf("Build(NaCl10, Na10+): %v; want 10 Cl⁻", err)
	}
}
