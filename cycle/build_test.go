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
