package analyses

import (
	"fmt"
	"strconv"
	"strings"

	"enthalpath/cycle/analysis"
	"enthalpath/tui/plot"
)

// stabilityKind is the stability analysis: decompositions with ΔrG(T).
func stabilityKind(k func() kind) kind {
	return kind{
		name: "stability", what: "decompositions and disproportionations with ΔrG(T), verdicts beyond 2σ, temperatures of gas loss",
		syntax: "FORMULA [TEMPERATURE-K] [GAS-PRESSURE-BAR]", example: "CaCO3 298.15 1",
		prepare: func(args []string) (job, error) {
			if len(args) < 1 || len(args) > 3 {
				return nil, usage(k(), "give a formula, then optionally a temperature in K and a gas pressure in bar")
			}
			var opt analysis.StabilityOptions
			for i, p := range []*float64{&opt.Temperature, &opt.Pressure} {
				if len(args) > i+1 {
					v, err := strconv.ParseFloat(args[i+1], 64)
					if err != nil || !(v > 0) || v > 1e6 {
						return nil, usage(k(), "%q is not a positive number", args[i+1])
					}
					*p = v
				}
			}
			return func(a *analysis.Analyst) (any, error) { return a.Stability(args[0], opt) }, nil
		},
	}
}

// stabilityPlotHeight is the height of the ΔrG(T) chart in lines.
const stabilityPlotHeight = 14

func (m *Model) stability(s *analysis.Stability) []string {
	st := m.ctx.Styles
	lines := []string{st.Accent.Render(fmt.Sprintf("%s at %g K, gases at %g bar (%s)", s.Formula, s.Temperature, s.Pressure, s.HeatCapacitySummary()))}
	c := s.Compound
	what := "ionic estimate"
	switch {
	case c.Known && c.Molecular:
		what = "molecular, measured"
	case c.Known:
		what = "measured"
	}
	lines = append(lines, m.row(fmt.Sprintf("  %s (%s): ΔfH° %s · S° %s J/(mol·K) · ΔfG°(298 K) %s", c.Formula, what,
		quantityPM(m, c.Formation), entropyPM(c.Entropy), quantityPM(m, c.Gibbs))))
	if d := c.EntropyDomain; d != nil && d.Judged && !d.Inside {
		lines = append(lines, m.row("  S°: "+d.String()))
	}
	if len(s.Reactions) > 0 {
		lines = append(lines, st.Title.Render(fmt.Sprintf("  %-30s %24s %24s  %s", "reaction", "ΔrH°", fmt.Sprintf("ΔrG(%g K)", s.Temperature), "verdict")))
	}
	var pts []plot.Point
	var groups []string
	for i, r := range s.Reactions {
		g := "—"
		if r.EntropyKnown {
			g = m.pm(r.Gibbs, r.GibbsUncertainty)
		}
		verdict := r.Verdict.String()
		if r.Crossing != nil {
			verdict += fmt.Sprintf(" · ΔrG = 0 at %.0f ± %.0f K", r.Crossing.Temperature, r.Crossing.Uncertainty)
		}
		if r.Estimated {
			verdict += " (estimate)"
		}
		eq := strings.ReplaceAll(r.Equation, "->", "→")
		lines = append(lines, m.row(fmt.Sprintf("  %c %-28s %24s %24s  %s", plot.Glyph(i), eq, m.pm(r.Standard.Enthalpy, r.Standard.EnthalpyUncertainty), g, verdict)))
		for _, p := range s.Curves[i] {
			pts = append(pts, plot.Point{X: p.Temperature, Y: p.Gibbs, Group: i})
		}
		groups = append(groups, eq)
	}
	if len(pts) > 0 {
		sc := plot.Scatter{Points: pts, Groups: groups, XLabel: "T (K); up: ΔrG (kJ/mol); - ΔrG = 0", Zero: true}
		chart := sc.Render(m.w, stabilityPlotHeight, plot.Styles{Axis: st.Muted, Point: st.Accent, Guide: st.Rule, Label: st.Text})
		lines = append(lines, strings.Split(chart, "\n")...)
	}
	return append(lines, m.notes(s.Notes)...)
}

func quantityPM(m *Model, q analysis.Quantity) string {
	if !q.Known() {
		return "—"
	}
	return m.pm(q.Value, q.Uncertainty)
}

func entropyPM(q analysis.Quantity) string {
	if !q.Known() {
		return "—"
	}
	return fmt.Sprintf("%.1f ± %.1f", q.Value, q.Uncertainty)
}
