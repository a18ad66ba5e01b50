package cycle

// HessTerm is one step of Residual's sum with its weight: the residual
// changes by Weight for each kJ/mol the step's value changes (its sign in
// Hess's sum times its multiplicity), so Residual's σ² is
// Σ (Weight·Step.Uncertainty)².
type HessTerm struct {
	Step   *Step
	Weight float64
}

// HessTerms returns the steps Residual sums (those with a value, not the
// unknown), each with its weight, pointing into c. A caller that combines
// the residuals of several cycles can add the weights of the same datum
// before squaring, where Residual treats every step as independent.
func HessTerms(c *Cycle) []HessTerm {
	var out []HessTerm
	for i := range c.Steps {
		s := &c.Steps[i]
		if !c.inSum(i) || s.Unknown || s.Source.Kind == SourceMissing {
			continue
		}
		out = append(out, HessTerm{Step: s, Weight: hessSign(s) * s.Multiplicity})
	}
	return out
}
