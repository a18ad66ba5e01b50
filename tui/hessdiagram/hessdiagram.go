package hessdiagram

import (
	"strconv"
	"strings"

	"enthalpath/cycle"
	"enthalpath/thermo"
	"enthalpath/tui/diagram"
)

// Terms returns the indices of the steps that are terms of Hess's sum, in
// order: every top-level step except a composite that sums its sub-steps,
// whose sub-steps are taken instead; the formation step is excluded (it is
// the closing arrow).
func Terms(steps []cycle.Step) []int {
	byKey := make(map[string]*cycle.Step, len(steps))
	for i := range steps {
		byKey[steps[i].Key] = &steps[i]
	}
	expands := func(s *cycle.Step) bool {
		return s.Composite && s.Source.Kind == cycle.SourceSum && !s.Unknown
	}
	var out []int
	for i := range steps {
		s := &steps[i]
		if s.Kind == cycle.KindFormation {
			continue
		}
		if s.Parent != "" {
			if p, ok := byKey[s.Parent]; ok && expands(p) {
				out = append(out, i)
			}
			continue
		}
		if expands(s) {
			continue
		}
		out = append(out, i)
	}
	return out
}

// Options shape the diagram.
type Options struct {
	// Units is the unit the levels and values are drawn in.
	Units thermo.Unit
	// Limit, when ≥ 0, draws only the first Limit terms (the assembly grows
	// the diagram one arrow at a time) and no closing arrow unless every
	// term is drawn. A negative Limit draws everything.
	Limit int
	// Solved marks the values as a solved result (the unknown has a value).
	Solved bool
	// LatticeAsU says the lattice step's value is the lattice energy U and
	// LatticeCorrection is ΔH_L − U (kJ/mol): the arrow is then drawn as
	// ΔH_L, so the path still closes on the formation enthalpy, and the
	// title names both. See ForCycle.
	LatticeAsU        bool
	LatticeCorrection float64
}

// ForCycle sets the lattice fields of opt from the cycle's conventions.
func ForCycle(c *cycle.Cycle, opt Options) Options {
	if c != nil && c.Conventions.Lattice == cycle.LatticeEnergy {
		opt.LatticeAsU, opt.LatticeCorrection = true, -c.LatticeCorrection()
	}
	return opt
}

// Build makes the diagram of a cycle's steps (the result's steps when
// solved, the cycle's otherwise).
func Build(formula string, steps []cycle.Step, opt Options) diagram.Diagram {
	d := diagram.Diagram{Title: "Born–Haber cycle of " + formula, Unit: opt.Units.String()}
	terms := Terms(steps)
	limit := len(terms)
	if opt.Limit >= 0 && opt.Limit < limit {
		limit = opt.Limit
	}
	var formation *cycle.Step
	for i := range steps {
		if steps[i].Kind == cycle.KindFormation {
			formation = &steps[i]
		}
	}
	cation, anion := elementStates(steps, formation)
	d.Levels = append(d.Levels, diagram.Level{Label: join(cation, anion), Energy: 0})
	if formation != nil && limit == len(terms) {
		// The closing arrow is drawn first, on the left, as usual.
		d.Arrows = append(d.Arrows, diagram.Arrow{From: 0, To: -1, Tag: formation.Key})
	}
	energy := 0.0
	for _, i := range terms[:limit] {
		s := &steps[i]
		known := hasValue(s, opt.Solved)
		value := arrowValue(s, known, opt.Units)
		if known {
			contribution := s.Contribution()
			if s.Kind == cycle.KindLattice && opt.LatticeAsU {
				u := *s
				u.Value += opt.LatticeCorrection // U → ΔH_L
				contribution = u.Contribution()
				value = arrowValue(&u, true, opt.Units)
				d.Title += " (lattice arrow ΔH_L " + value + "; U " + arrowValue(s, true, opt.Units) + ")"
			}
			energy += thermo.FromKJPerMol(contribution, opt.Units)
		}
		species := product(s)
		switch {
		case s.Kind == cycle.KindLattice:
			cation, anion = species, ""
		case s.Side == cycle.SideCation:
			cation = species
		case s.Side == cycle.SideAnion:
			anion = species
		}
		d.Levels = append(d.Levels, diagram.Level{Label: join(cation, anion), Energy: energy})
		d.Arrows = append(d.Arrows, diagram.Arrow{
			From: len(d.Levels) - 2, To: len(d.Levels) - 1, Tag: s.Key,
			Value: value, Unknown: s.Unknown, Name: words(s), Reading: reading(s, known, opt.Units),
			User: s.Source.Kind == cycle.SourceUser,
		})
	}
	if formation != nil && limit == len(terms) {
		a := &d.Arrows[0]
		a.Unknown = formation.Unknown
		a.Value = arrowValue(formation, hasValue(formation, opt.Solved), opt.Units)
		a.Name, a.Reading = words(formation), reading(formation, hasValue(formation, opt.Solved), opt.Units)
		a.User = formation.Source.Kind == cycle.SourceUser
		target := thermo.FromKJPerMol(formation.Contribution(), opt.Units)
		last := len(d.Levels) - 1
		// Closed cycle: the formation arrow ends on the solid's level.
		if hasValue(formation, opt.Solved) && abs(target-d.Levels[last].Energy) > closeTolerance(opt.Units) {
			if complete(steps, terms, opt.Solved) {
				// Over-determined: every step has a value and the path
				// misses the solid. The solid is drawn once, at ΔfH°;
				// the path's open end is joined to it by the miss, the
				// closure residual (Σ of the steps − ΔfH°).
				end := last
				d.Levels[end].Label = ""
				d.Levels = append(d.Levels, diagram.Level{Label: product(formation), Energy: target})
				last = len(d.Levels) - 1
				d.Arrows = append(d.Arrows, diagram.Arrow{From: last, To: end, Tag: "closure residual",
					Value: "miss " + signed(d.Levels[end].Energy-target, opt.Units), Miss: true})
			} else {
				// Not closed because a step has no value yet: the
				// formation arrow gets its own level.
				d.Levels = append(d.Levels, diagram.Level{Label: product(formation) + " (from ΔfH°)", Energy: target})
				last = len(d.Levels) - 1
			}
		}
		a.To = last
	}
	return d
}

// complete reports whether every term and the formation step have a value
// of their own (none unknown, none missing): the cycle is over-determined.
func complete(steps []cycle.Step, terms []int, solved bool) bool {
	if solved {
		return false
	}
	for i := range steps {
		s := &steps[i]
		if s.Unknown || s.Source.Kind == cycle.SourceMissing {
			return false
		}
	}
	return len(terms) > 0
}

// signed writes v (already in unit u) with its sign, as the arrows' values.
func signed(v float64, u thermo.Unit) string {
	prec := 1
	if u == thermo.EVPerFormulaUnit {
		prec = 3
	}
	str := strconv.FormatFloat(v, 'f', prec, 64)
	if v > 0 {
		str = "+" + str
	}
	return strings.Replace(str, "-", "−", 1)
}

// words names a step for a reader: its label without the parenthesis
// ("first ionization energy of Na", "dissociation of Cl"), with the
// multiplicity it enters the cycle with when that is not 1.
func words(s *cycle.Step) string {
	w, _, _ := strings.Cut(s.Label, " (")
	switch {
	case s.Multiplicity == 0.5:
		w = "½ × " + w
	case s.Multiplicity != 1:
		w = strconv.FormatFloat(s.Multiplicity, 'g', -1, 64) + " × " + w
	}
	return w
}

// reading is a step's contribution with its standard uncertainty, in unit
// u, by the one rule of thermo.UncertaintyDecimals ("+107.32 ± 0.18"); ""
// when it has no value yet.
func reading(s *cycle.Step, known bool, u thermo.Unit) string {
	if !known {
		return ""
	}
	v := thermo.FromKJPerMol(s.Contribution(), u)
	value, unc := thermo.FormatWithUncertainty(v, thermo.FromKJPerMol(abs(s.Multiplicity)*s.Uncertainty, u), 1)
	if v > 0 {
		value = "+" + value
	}
	value = strings.Replace(value, "-", "−", 1)
	if unc == "" {
		return value
	}
	return value + " ± " + unc
}

func closeTolerance(u thermo.Unit) float64 { return thermo.FromKJPerMol(0.5, u) }

func abs(x float64) float64 {
	if x < 0 {
		return -x
	}
	return x
}

func hasValue(s *cycle.Step, solved bool) bool {
	if s.Unknown {
		return solved
	}
	return s.Source.Kind != cycle.SourceMissing
}

func arrowValue(s *cycle.Step, known bool, u thermo.Unit) string {
	if !known {
		if s.Unknown {
			return ""
		}
		return "missing"
	}
	v := thermo.FromKJPerMol(s.Contribution(), u)
	prec := 0
	if u == thermo.EVPerFormulaUnit {
		prec = 2
	}
	str := strconv.FormatFloat(v, 'f', prec, 64)
	if v > 0 {
		str = "+" + str
	}
	return strings.Replace(str, "-", "−", 1)
}

// elementStates splits the formation reaction's left side into the cation
// and anion elements ("Na(s)", "½Cl₂(g)").
func elementStates(steps []cycle.Step, formation *cycle.Step) (string, string) {
	if formation != nil {
		lhs, _, ok := strings.Cut(formation.Reaction, "→")
		if ok {
			parts := strings.SplitN(strings.TrimSpace(lhs), " + ", 2)
			if len(parts) == 2 {
				return strings.TrimSpace(parts[0]), strings.TrimSpace(parts[1])
			}
			return strings.TrimSpace(lhs), ""
		}
	}
	return "elements", ""
}

// product returns what a step leaves, with the amount per formula unit:
// the right side of its reaction without the free electron, its leading
// coefficient multiplied by the step's multiplicity.
func product(s *cycle.Step) string {
	_, rhs, ok := strings.Cut(s.Reaction, "→")
	if !ok {
		return s.Label
	}
	rhs = strings.TrimSpace(rhs)
	var kept []string
	for _, p := range strings.Split(rhs, " + ") {
		p = strings.TrimSpace(p)
		if p == "e⁻" || p == "e-" || p == "" {
			continue
		}
		kept = append(kept, p)
	}
	if len(kept) != 1 || s.Kind == cycle.KindLattice || s.Kind == cycle.KindFormation {
		return strings.Join(kept, " + ")
	}
	coef, species := splitCoefficient(kept[0])
	return formatCoefficient(coef*s.Multiplicity) + species
}

func splitCoefficient(p string) (float64, string) {
	i := 0
	for i < len(p) && (p[i] >= '0' && p[i] <= '9' || p[i] == '.') {
		i++
	}
	if i == 0 {
		if strings.HasPrefix(p, "½") {
			return 0.5, strings.TrimSpace(strings.TrimPrefix(p, "½"))
		}
		return 1, p
	}
	v, err := strconv.ParseFloat(p[:i], 64)
	if err != nil {
		return 1, p
	}
	return v, strings.TrimSpace(p[i:])
}

func formatCoefficient(c float64) string {
	switch {
	case abs(c-1) < 1e-9:
		return ""
	case abs(c-0.5) < 1e-9:
		return "½"
	case abs(c-1.5) < 1e-9:
		return "³⁄₂"
	}
	return strconv.FormatFloat(c, 'f', -1, 64) + " "
}

func join(a, b string) string {
	switch {
	case a == "":
		return b
	case b == "":
		return a
	}
	return a + " + " + b
}
