package bench

import (
	"fmt"

	"enthalpath/cycle"
)

// drawingNotes are the lines under an exported drawing: the covalency
// verdict with the model it is read against, and the extended model's
// terms.
func drawingNotes(res *cycle.Result) []string {
	if res == nil {
		return nil
	}
	var out []string
	if v := res.Verdict(); v != nil {
		out = append(out, fmt.Sprintf("verdict: %s (gap %+.1f %% against the %s model; %s)", v.Verdict.Character, v.GapPercent, v.Model, v.Verdict.Basis))
	}
	if m, ok := res.Model(cycle.ModelExtended); ok && m.OK() && m.Inputs.Extended != nil {
		out = append(out, m.Inputs.Extended.Summary())
	}
	return out
}
