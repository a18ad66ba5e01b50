package modelpanel

import (
	"fmt"
	"strings"

	"enthalpath/cycle"
	"enthalpath/tui/screen"
)

// verdictNote says which model the verdict is read against and how its
// thresholds were set.
func verdictNote(res *cycle.Result) string {
	if res == nil {
		return "gap = cycle − model (█ left of │: the cycle binds more); verdict " + cycle.VerdictThresholds()
	}
	v := res.Verdict()
	if v == nil {
		return "gap = cycle − model (█ left of │: the cycle binds more); no model gives a verdict"
	}
	return fmt.Sprintf("gap = cycle − model (█ left of │: the cycle binds more). Verdict: %s, read against %s (%s); %s",
		v.Verdict.Character, v.Model, res.ReferenceWhy, v.Verdict.Basis)
}

// extendedLines give the extended model's terms at its least energy.
func (m *Model) extendedLines(res *cycle.Result) []string {
	if res == nil {
		return nil
	}
	mr, ok := res.Model(cycle.ModelExtended)
	if !ok || !mr.OK() || mr.Inputs.Extended == nil {
		return nil
	}
	b := mr.Inputs.Extended
	terms := b.Terms(b.Minimum)
	parts := make([]string, len(terms))
	for i, t := range terms {
		parts[i] = t.Name + " " + m.ctx.Signed(t.Value)
	}
	text := fmt.Sprintf("extended model at d = %.4f Å (least energy; %.4f Å from %s): %s; θ_D %.0f K",
		b.Minimum.D, b.Reference, refKind(b), strings.Join(parts, " · "), b.Minimum.DebyeTemperature)
	return screen.Wrap(text, m.w, "  ")
}

func refKind(b *cycle.ExtendedBreakdown) string {
	if b.ReferenceMeasured {
		return "the measured cell"
	}
	return "the radii"
}
