package analyses

import (
	"enthalpath/tui/diagram"
	"fmt"
	"math"
	"strings"

	"enthalpath/cycle/analysis"
	"enthalpath/tui/screen"
)

// render lays out a result as lines.
func (m *Model) render(r any) []string {
	switch r := r.(type) {
	case *analysis.Estimate:
		return m.estimate(r)
	case *analysis.Scan:
		return m.scan(r)
	case *analysis.SolutionCycle:
		return m.solution(r)
	case *analysis.DerivedRadius:
		return m.radius(r)
	case *analysis.FittedRadius:
		return m.radiusFit(r)
	case *analysis.IonFit:
		return m.ionFit(r)
	case *analysis.Stability:
		return m.stability(r)
	}
	return []string{fmt.Sprintf("%v", r)}
}

func (m *Model) pm(v, u float64) string {
	return m.ctx.SignedPM(v, u) + " " + m.ctx.Units.String()
}

func (m *Model) notes(notes []string) []string {
	var out []string
	for _, n := range notes {
		out = append(out, m.ctx.Styles.Muted.Render(wrap("· "+n, m.w-2)))
	}
	return out
}

func (m *Model) estimate(e *analysis.Estimate) []string {
	st := m.ctx.Styles
	hyp := func(u analysis.IonUse) string {
		s := fmt.Sprintf("%s (r = %.3f Å, %s)", u.Symbol, u.Radius.Value, u.Radius.From)
		if u.Hypothetical {
			s += " — not in the data"
		}
		return s
	}
	lines := []string{
		st.Accent.Render(fmt.Sprintf("%s: %s = %s", e.Formula, e.Solved.Label, m.pm(e.Value, e.Uncertainty))) +
			st.Muted.Render(fmt.Sprintf("   (inputs alone ±%s)", strings.TrimPrefix(m.ctx.Uncertainty(e.InputUncertainty), "±"))),
		fmt.Sprintf("lattice ΔH_L from %s: %s (U %s)", e.Model, m.pm(e.Lattice, e.ModelUncertainty), m.ctx.Signed(e.LatticeEnergy)),
		"ions: " + hyp(e.Cation) + ", " + hyp(e.Anion),
	}
	if e.Measured != nil {
		lines = append(lines, fmt.Sprintf("the data's value: %s — estimate − data %s", m.pm(e.Measured.Value, e.Measured.Uncertainty), m.ctx.Signed(e.Value-e.Measured.Value)))
	}
	lines = append(lines, st.Muted.Render(wrap("model σ: "+e.Spread.Basis(), m.w)))
	return append(lines, m.notes(e.Notes)...)
}

func (m *Model) scan(s *analysis.Scan) []string {
	st := m.ctx.Styles
	lines := []string{st.Accent.Render(fmt.Sprintf("%s with %s (%s), lattice from %s", s.Metal, s.NonMetal, s.Anion, s.Model)),
		st.Title.Render(fmt.Sprintf("  %-8s %6s %22s %22s  %s", "formula", "charge", "ΔfH° per formula", fmt.Sprintf("ΔfG(%g K)", s.Temperature), "verdict"))}
	for _, c := range s.Compounds {
		from := "estimate"
		if c.FromData {
			from = "data"
		}
		verdict := "no reaction favoured beyond 2σ"
		switch {
		case c.LosesNonMetal:
			verdict = "gives off " + s.Released + " to form " + c.LowerState
		case !c.Stable:
			verdict = "disproportionates"
		case c.Undecided:
			verdict = "undecided within the data"
		}
		switch {
		case c.Formula == s.Favoured && s.FavouredTie != "":
			verdict += " · lowest, within 2σ of " + s.FavouredTie
		case c.Formula == s.Favoured:
			verdict += " · favoured"
		}
		g := "—"
		if !math.IsNaN(c.Gibbs) {
			g = m.pm(c.Gibbs, c.GibbsUncertainty)
		}
		lines = append(lines, m.row(fmt.Sprintf("  %-8s %6d %22s %22s  %s (%s)", c.Formula, c.Charge, m.pm(c.Formation, c.Uncertainty),
			g, verdict, from)))
	}
	if len(s.Disproportionations) > 0 {
		lines = append(lines, st.Title.Render("  disproportionations"))
	}
	for _, d := range s.Disproportionations {
		g := ""
		if e := d.Energies; e.EntropyKnown {
			g = " · ΔrG " + m.pm(e.Gibbs, e.GibbsUncertainty)
		}
		lines = append(lines, m.row(fmt.Sprintf("  %-28s ΔrH° %s%s  %s", d.Reaction, m.pm(d.Enthalpy, d.Uncertainty), g, d.Energies.Verdict)))
	}
	for _, c := range s.Compounds {
		for _, n := range c.Notes {
			lines = append(lines, st.Muted.Render(wrap("· "+c.Formula+": "+n, m.w-2)))
		}
	}
	for _, sk := range s.Skipped {
		lines = append(lines, st.Warn.Render(m.row("  skipped: "+sk)))
	}
	return append(lines, m.notes(s.Notes)...)
}

func (m *Model) solution(s *analysis.SolutionCycle) []string {
	st := m.ctx.Styles
	lines := []string{st.Accent.Render(fmt.Sprintf("%s: %s = %s", s.Formula, s.Solved.Label, m.pm(s.Solved.Value, s.Solved.Uncertainty)))}
	for _, t := range s.Terms {
		flag := " "
		if t.Unknown {
			flag = diagram.SolvedMark
		}
		src := t.Source.Kind.String()
		if t.Source.Key != "" {
			src += ": " + t.Source.Key
		}
		lines = append(lines, m.row(fmt.Sprintf(" %s %-34s ×%-3g %22s  %s", flag, t.Reaction, t.Multiplicity, m.pm(t.Value, t.Uncertainty), src)))
	}
	if s.Measured != nil {
		lines = append(lines, fmt.Sprintf("measured: %s — solved − measured %s", m.pm(s.Measured.Value, s.Measured.Uncertainty), m.ctx.Signed(s.Difference)))
	}
	lines = append(lines, st.Muted.Render(wrap("hydration scale: "+s.Scale+" — "+s.ScaleNote, m.w)))
	return append(lines, m.notes(s.Notes)...)
}

func (m *Model) radius(r *analysis.DerivedRadius) []string {
	st := m.ctx.Styles
	val := func(v float64, err string) string {
		if err != "" {
			return "— (" + err + ")"
		}
		return fmt.Sprintf("%.3f Å", v)
	}
	lines := []string{
		st.Accent.Render(fmt.Sprintf("%s: radius of %s reproducing U = %s %s (%s)", r.Formula, r.Ion, m.ctx.Signed(r.LatticeEnergy), m.ctx.Units, r.LatticeFrom)),
		fmt.Sprintf("counter-ion %s at %.3f Å (%s)", r.Counter, r.CounterRadius.Value, r.CounterRadius.From),
		"Kapustinskii (1956 constants):        " + val(r.Kapustinskii, r.KapustinskiiErr),
		"Kapustinskii (K = 1214 kJ·Å/mol):     " + val(r.KapustinskiiHandbook, r.KapustinskiiHandbookErr),
		"volume-based (sphere of its volume):  " + val(r.VolumeRadius, r.VolumeErr),
		fmt.Sprintf("effective Born–Mayer ρ:               %s (usual %.3f Å; %s, d₀ %.3f Å)", val(r.EffectiveRho, r.RhoErr), r.DefaultRho, r.Structure, r.D0),
	}
	if r.RhoWarning != "" {
		lines = append(lines, st.Warn.Render(wrap("warning: "+r.RhoWarning, m.w)))
	}
	if r.Tabulated != nil {
		lines = append(lines, fmt.Sprintf("the data's radius: %.3f Å (%s)", r.Tabulated.Value, r.Tabulated.From))
	}
	return append(lines, m.notes(r.Notes)...)
}

func (m *Model) radiusFit(f *analysis.FittedRadius) []string {
	st := m.ctx.Styles
	used := f.Used()
	spread := "one salt only: no spread"
	if f.HasSpread {
		spread = fmt.Sprintf("one-salt radii %.3f ± %.3f Å, rms misfit %.1f kJ/mol", f.Mean, f.SD, f.RMSResidual)
	}
	lines := []string{
		st.Accent.Render(fmt.Sprintf("%s: %.3f Å fitted over %d salt(s)", f.Ion, f.Radius, len(used))) + st.Muted.Render("   "+spread),
		wrap(f.CounterRadiiFrom(), m.w),
	}
	if f.Tabulated != nil {
		lines = append(lines, fmt.Sprintf("the data's radius: %.3f Å (%s)", f.Tabulated.Value, f.Tabulated.From))
	}
	lines = append(lines, st.Title.Render(fmt.Sprintf("  %-12s %-14s %12s %10s %10s", "salt", "counter r/Å", "U kJ/mol", "r alone", "misfit")))
	for _, s := range used {
		lines = append(lines, m.row(fmt.Sprintf("  %-12s %-14s %12.1f %10.3f %+10.1f", s.Formula,
			fmt.Sprintf("%s %.2f", s.Counter, s.CounterRadius.Value), s.LatticeEnergy, s.Radius, s.Residual)))
	}
	if n := len(f.Salts) - len(used); n > 0 {
		var names []string
		for _, s := range f.Salts {
			if s.Skipped != "" {
				names = append(names, s.Formula)
			}
		}
		lines = append(lines, st.Warn.Render(wrap(fmt.Sprintf("  left out (no lattice energy): %s", strings.Join(names, ", ")), m.w)))
	}
	return append(lines, m.notes(f.Notes)...)
}

func (m *Model) ionFit(f *analysis.IonFit) []string {
	st := m.ctx.Styles
	used := f.Used()
	scatter := "one salt: no scatter"
	if f.Birge > 0 {
		scatter = fmt.Sprintf("internal SE %.1f, Birge ratio %.2f", f.InternalSE, f.Birge)
	}
	lines := []string{
		st.Accent.Render(fmt.Sprintf("ΔfH°(%s, g) = %s over %d of %d salts", f.Ion, m.pm(f.Value, f.SE), len(used), len(f.Salts))) + st.Muted.Render("   "+scatter),
		"lattice enthalpies from: " + f.Models(),
	}
	if b := f.Builtin; b != nil {
		lines = append(lines, fmt.Sprintf("built-in derived value: %s (%s, %d salts)", m.pm(b.GasFormation.V, b.GasFormation.U), b.Model, len(b.Salts)))
	}
	lines = append(lines, st.Title.Render(fmt.Sprintf("  %-11s %-8s %16s %22s %10s %6s", "salt", "counter", "ΔH_L", "ΔfH° alone", "residual", "in σ")))
	for _, s := range used {
		row := m.row(fmt.Sprintf("  %-11s %-8s %16s %22s %10s %+6.1f", s.Formula, s.Counter, m.ctx.Signed(s.Lattice),
			m.pm(s.Value, s.Uncertainty), m.ctx.Signed(s.Residual), s.Normalized))
		if s.Outside {
			row = st.Warn.Render(row + "  outside 2σ")
		}
		lines = append(lines, row)
	}
	if out := f.Outside(); len(out) > 0 {
		lines = append(lines, st.Warn.Render(wrap("  outside 2σ: "+strings.Join(out, ", "), m.w)))
	}
	for _, s := range f.Salts {
		if s.Skipped != "" {
			lines = append(lines, st.Muted.Render(wrap("  left out: "+s.Formula+": "+s.Skipped, m.w-2)))
		}
	}
	return append(lines, m.notes(f.Notes)...)
}

// row fits a result row to the width: the columns as laid out, and what
// does not fit on indented lines below rather than cut (the result
// scrolls, so it may take more lines).
func (m *Model) row(s string) string { return strings.Join(screen.WrapRow(s, m.w, "      "), "\n") }
