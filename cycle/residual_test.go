package cycle

import (
	"math"
	"testing"
)

// Hess's law closes on the solved value, so the residual of a cycle whose
// unknown is given the solved value is zero (common practice, no source).
// KBr's bromine atomization is a composite of two sub-steps
// (atomization_steps.csv: Br2(l) → Br2(g), Br2(g) → 2 Br(g)): Residual sums
// the sub-steps, so neither a stale value of the composite itself changes
// it nor is the cycle written to.
func TestResidualSumsSubStepsAndReadsOnly(t *testing.T) {
	c := build(t, "KBr", Options{})
	if s, ok := c.Step("atomization-anion"); !ok || !s.Composite || len(c.SubSteps("atomization-anion")) != 2 {
		t.Fatalf("KBr: atomization-anion is not a composite of two sub-steps")
	}
	r := solve(t, c)
	if err := c.Set("lattice", r.Solved.Value, r.Solved.Uncertainty); err != nil {
		t.Fatal(err)
	}
	res, u := Residual(c)
	if math.Abs(res) > 1e-9 || !(u > 0) {
		t.Fatalf("KBr residual with the solved lattice = %g ± %g, want 0 ± a positive σ", res, u)
	}
	comp, _ := c.Step("atomization-anion")
	comp.Value = 1e6 // stale: Residual must not read it
	if res2, u2 := Residual(c); res2 != res || u2 != u {
		t.Errorf("a stale composite value changed the residual: %g ± %g, was %g ± %g", res2, u2, res, u)
	}
	if comp.Value != 1e6 {
		t.Error("Residual wrote to the cycle")
	}
	// Given by the user, the composite is a term itself and its sub-steps are not.
	if err := c.Set("atomization-anion", 1e6, 0); err != nil {
		t.Fatal(err)
	}
	if res3, _ := Residual(c); math.Abs(res3) < 1e5 {
		t.Errorf("a user value of the composite did not enter the residual: %g", res3)
	}
}
