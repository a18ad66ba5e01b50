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
	why := ""
	if v.Model != cycle.ModelExtended {
		why = " (" + res.ReferenceWhy + ")"
	}
	return fmt.Sprintf("gap = cycle − model (█ left of │: the cycle binds more). Verdict read against %s%s; %s",
		v.Model, why, v.Verdict.Basis)
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
	t := b.Minimum
	parts := []string{"Coulomb " + m.ctx.Signed(t.Coulomb), "repulsion " + m.ctx.Signed(t.Repulsion),
		"dispersion " + m.ctx.Signed(t.Dispersion()), "zero-point " + m.ctx.Signed(t.ZP), "heat content " + m.ctx.Signed(t.ThermalStep())}
	text := fmt.Sprintf("extended: %s (least at d = %.4f Å; %.4f Å from %s)",
		strings.Join(parts, " · "), t.D, b.Reference, refKind(b))
	if b.RepulsionFitted {
		text = fmt.Sprintf("extended: %s (repulsion fitted to d = %.4f Å from %s)",
			strings.Join(parts, " · "), b.Reference, refKind(b))
	}
	return screen.Wrap(text, m.w, "  ")
}

func refKind(b *cycle.ExtendedBreakdown) string {
	if b.ReferenceMeasured {
		return "the measured cell"
	}
	return "the radii"
}
