package analysis

import (
	"errors"
	"fmt"
	"math"
	"strings"

	"enthalpath/cycle"
	"enthalpath/data"
)

// The keys of the solution cycle (kJ/mol per reaction as written):
//
//	lattice-dissociation  MaXb(s) → a M^z+(g) + b X^w−(g)       ×1 (+ΔH_L, positive)
//	hydration-cation      M^z+(g) → M^z+(aq)                   ×a
//	hydration-anion       X^w−(g) → X^w−(aq)                   ×b
//	dissolution           MaXb(s) → a M^z+(aq) + b X^w−(aq)    ×1
//
// dissolution = lattice-dissociation + a·hydration-cation + b·hydration-anion.
const (
	KeyLatticeDissociation = "lattice-dissociation"
	KeyHydrationCation     = "hydration-cation"
	KeyHydrationAnion      = "hydration-anion"
	KeyDissolution         = "dissolution"
)

// SolutionKeys returns the keys in cycle order.
func SolutionKeys() []string {
	return []string{KeyLatticeDissociation, KeyHydrationCation, KeyHydrationAnion, KeyDissolution}
}

// Hydration scales of the data.
const (
	// ScaleConventional sets the hydration enthalpy of H⁺ to zero.
	ScaleConventional = "conventional"
	// ScaleAbsolute rests on an absolute hydration enthalpy of H⁺ (the data
	// use −1103 kJ/mol, Marcus 1987).
	ScaleAbsolute = "absolute"
)

// SolutionOptions choose what a solution cycle solves and from what.
type SolutionOptions struct {
	// Solve is the unknown key; "" means dissolution.
	Solve string
	// Sets give terms their values (kJ/mol per reaction as written).
	Sets []cycle.Setting
	// Scale is ScaleConventional (default) or ScaleAbsolute. For a neutral
	// salt the sum of the hydration terms is the same on both scales.
	Scale string
	// LatticeFrom, when a model name, takes the lattice dissociation from
	// that model (as ΔH_L) instead of the Born–Haber cycle.
	LatticeFrom string
	// Measured is a measured enthalpy of solution to use when another term
	// is solved, or to compare with when the dissolution is solved; nil
	// means the data's value when they have one.
	Measured *cycle.Entry
}

// SolutionTerm is one term of the solution cycle.
type SolutionTerm struct {
	Key, Label, Reaction string
	// Value per reaction as written and its σ, in kJ/mol.
	Value, Uncertainty float64
	// Multiplicity counts the reaction in the sum.
	Multiplicity float64
	Source       cycle.Source
	Unknown      bool
}

// SolutionCycle is a solved solution cycle.
type SolutionCycle struct {
	Formula string
	// Scale of the hydration enthalpies, and a sentence on what it means.
	Scale, ScaleNote string
	Terms            []SolutionTerm
	Solved           SolutionTerm
	// Measured is the measured enthalpy of solution when known;
	// Difference is solved − measured when the dissolution was solved.
	Measured   *cycle.Entry
	Difference float64
	Notes      []string
}

// Term returns the term with key.
func (s *SolutionCycle) Term(key string) (*SolutionTerm, bool) {
	for i := range s.Terms {
		if s.Terms[i].Key == key {
			return &s.Terms[i], true
		}
	}
	return nil, false
}

// solutionTable is what a data set offers when it carries measured
// enthalpies of solution (a method the data package may provide).
type solutionTable interface {
	SolutionEnthalpy(formula string) (data.Value, error)
}

// Solution builds and solves the solution cycle of formula.
func (a *Analyst) Solution(formula string, opt SolutionOptions) (*SolutionCycle, error) {
	scale := opt.Scale
	if scale == "" {
		scale = ScaleConventional
	}
	if scale != ScaleConventional && scale != ScaleAbsolute {
		return nil, &InputError{Subject: formula, Field: FieldScale, Reason: fmt.Sprintf("unknown hydration scale %q: use %s or %s", scale, ScaleConventional, ScaleAbsolute)}
	}
	solve := opt.Solve
	if solve == "" {
		solve = KeyDissolution
	}
	c, err := a.build(formula, "", "")
	if err != nil {
		return nil, err
	}
	sc := &SolutionCycle{Formula: c.Formula, Scale: scale}
	if scale == ScaleConventional {
		sc.ScaleNote = "hydration enthalpies on the conventional scale (ΔhydH°(H⁺) = 0); for a neutral salt their sum equals the sum on the absolute scale"
	} else {
		sc.ScaleNote = "hydration enthalpies on the absolute scale (ΔhydH°(H⁺) = −1103 kJ/mol, Marcus 1987); for a neutral salt their sum equals the sum on the conventional scale"
	}
	cat, an := c.Cation.Ion, c.Anion.Ion
	latticeText := fmt.Sprintf("%s(s) → %s%s(g) + %s%s(g)", c.Formula, coef(c.Cation.Count), cat.Symbol, coef(c.Anion.Count), an.Symbol)
	terms := []SolutionTerm{
		{Key: KeyLatticeDissociation, Label: "lattice dissociation enthalpy ΔH_L (solid → gaseous ions)", Reaction: latticeText, Multiplicity: 1},
		{Key: KeyHydrationCation, Label: "hydration enthalpy of " + cat.Symbol, Reaction: cat.Symbol + "(g) → " + cat.Symbol + "(aq)", Multiplicity: float64(c.Cation.Count)},
		{Key: KeyHydrationAnion, Label: "hydration enthalpy of " + an.Symbol, Reaction: an.Symbol + "(g) → " + an.Symbol + "(aq)", Multiplicity: float64(c.Anion.Count)},
		{Key: KeyDissolution, Label: "enthalpy of solution at infinite dilution", Reaction: fmt.Sprintf("%s(s) → %s%s(aq) + %s%s(aq)", c.Formula, coef(c.Cation.Count), cat.Symbol, coef(c.Anion.Count), an.Symbol), Multiplicity: 1},
	}
	known := map[string]bool{}
	idx := map[string]int{}
	for i, t := range terms {
		idx[t.Key] = i
	}
	ui, ok := idx[solve]
	if !ok {
		return nil, &InputError{Subject: formula, Field: FieldUnknownStep, Key: solve, Reason: "not a term of the solution cycle; the terms are " + strings.Join(SolutionKeys(), ", ")}
	}
	terms[ui].Unknown = true
	// Measured enthalpy of solution.
	measured := opt.Measured
	if measured == nil {
		if tab, ok := any(a.db).(solutionTable); ok {
			if v, err := tab.SolutionEnthalpy(c.Formula); err == nil && v.Known() {
				e := a.entry(v, 1.0)
				measured = &e
			}
		}
	}
	sc.Measured = measured
	for _, s := range opt.Sets {
		i, ok := idx[s.Key]
		if !ok {
			return nil, &InputError{Subject: formula, Field: FieldStepValue, Key: s.Key, Reason: "not a term of the solution cycle; the terms are " + strings.Join(SolutionKeys(), ", ")}
		}
		if i == ui {
			return nil, &InputError{Subject: formula, Field: FieldStepValue, Key: s.Key, Reason: "is the term being solved; solve for another one"}
		}
		if s.Key == KeyLatticeDissociation && !(s.Value > 0) {
			return nil, &InputError{Subject: formula, Field: FieldStepValue, Key: s.Key,
				Reason: fmt.Sprintf("%g kJ/mol: a lattice dissociation enthalpy is positive (the solid takes up heat to become gaseous ions); the Born–Haber cycle prints the lattice step in the other direction, negative, so give its magnitude", s.Value)}
		}
		u := s.Uncertainty
		if !s.HasUncertainty {
			// As for a cycle step: a value without ± keeps the uncertainty
			// the term has from the data (none when the data have none).
			u = a.solutionDataUncertainty(c, s.Key, cat, an, scale, opt.LatticeFrom, measured)
		}
		terms[i].Value, terms[i].Uncertainty = s.Value, u
		terms[i].Source = cycle.Source{Kind: cycle.SourceUser, Key: "user", Citation: "entered by the user"}
		known[s.Key] = true
	}
	// Lattice dissociation.
	if li := idx[KeyLatticeDissociation]; li != ui && !known[KeyLatticeDissociation] {
		v, u, src, err := a.latticeDissociation(c, opt.LatticeFrom)
		if err != nil {
			// The cycle's own hint (--set of a cycle step) is not an option
			// of the solution cycle: say what is missing, then what to give.
			why := err.Error()
			var miss *cycle.MissingError
			if errors.As(err, &miss) {
				why = "the Born–Haber cycle cannot be closed (no " + miss.What + " in the data) and the data have no handbook lattice value"
				err = nil
			}
			return nil, &InputError{Subject: formula, Field: FieldStepValue, Key: KeyLatticeDissociation,
				Reason: "no value: " + why + "; give it a value (kJ/mol, positive), or take it from a model", Err: err}
		}
		terms[li].Value, terms[li].Uncertainty, terms[li].Source = v, u, src
	}
	for _, side := range []struct {
		key string
		ion data.Ion
	}{{KeyHydrationCation, cat}, {KeyHydrationAnion, an}} {
		i := idx[side.key]
		if i == ui || known[side.key] {
			continue
		}
		v, err := a.db.HydrationOnScale(side.ion.Symbol, scale)
		if err != nil {
			return nil, &InputError{Subject: formula, Field: FieldStepValue, Key: side.key, Reason: "no " + scale + " hydration enthalpy of " + side.ion.Symbol + " in the data; give it a value", Err: err}
		}
		e := a.entry(v, defaultHydrationUncertainty)
		terms[i].Value, terms[i].Uncertainty, terms[i].Source = e.Value, e.Uncertainty, e.Source
	}
	if di := idx[KeyDissolution]; di != ui && !known[KeyDissolution] {
		if measured == nil {
			return nil, &InputError{Subject: formula, Field: FieldStepValue, Key: KeyDissolution, Reason: "no measured enthalpy of solution in the data; give it a value (kJ/mol)"}
		}
		terms[di].Value, terms[di].Uncertainty, terms[di].Source = measured.Value, measured.Uncertainty, measured.Source
	}
	// Hess: dissolution − (lattice + a·hc + b·ha) = 0.
	sign := func(key string) float64 {
		if key == KeyDissolution {
			return -1
		}
		return 1
	}
	sum, variance := 0.0, 0.0
	for i, t := range terms {
		if i == ui {
			continue
		}
		sum += sign(t.Key) * t.Multiplicity * t.Value
		variance += sq(t.Multiplicity * t.Uncertainty)
	}
	u := &terms[ui]
	u.Value = -sum / (sign(u.Key) * u.Multiplicity)
	u.Uncertainty = math.Sqrt(variance) / u.Multiplicity
	u.Source = cycle.Source{Kind: cycle.SourceSolved, Citation: "Hess's law over the other terms"}
	sc.Terms = terms
	sc.Solved = *u
	if solve == KeyDissolution && measured != nil {
		sc.Difference = u.Value - measured.Value
	}
	sc.Notes = append(sc.Notes, sc.ScaleNote,
		"the lattice term is the lattice enthalpy ΔH_L at 298.15 K (dissociation direction, positive), the quantity that pairs with hydration enthalpies",
		"enthalpies only: whether a salt dissolves also depends on the entropy of solution")
	return sc, nil
}

// defaultHydrationUncertainty (kJ/mol) is used for a hydration enthalpy
// whose source states none: the conventional values are differences of
// tabulated formation enthalpies good to a few kJ/mol (common practice,
// no source).
const defaultHydrationUncertainty = 4.0

func (a *Analyst) entry(v data.Value, def float64) cycle.Entry {
	e := cycle.Entry{Value: v.V, Uncertainty: math.Abs(v.U),
		Source: cycle.Source{Kind: cycle.SourceData, Key: v.Source, Memory: v.Memory, Derived: v.Derived, Override: v.Override, Note: v.Note}}
	if src, err := a.db.Source(v.Source); err == nil {
		e.Source.Citation = src.Citation
	}
	if !(e.Uncertainty > 0) {
		e.Uncertainty, e.Source.DefaultUncertainty = def, true
	}
	return e
}

// solutionDataUncertainty returns the uncertainty the data give term key of
// the solution cycle of c, or 0 when the data have no value for it.
func (a *Analyst) solutionDataUncertainty(c *cycle.Cycle, key string, cat, an data.Ion, scale, latticeFrom string, measured *cycle.Entry) float64 {
	switch key {
	case KeyLatticeDissociation:
		if _, u, _, err := a.latticeDissociation(c, latticeFrom); err == nil {
			return u
		}
	case KeyHydrationCation, KeyHydrationAnion:
		ion := cat
		if key == KeyHydrationAnion {
			ion = an
		}
		if v, err := a.db.HydrationOnScale(ion.Symbol, scale); err == nil {
			return a.entry(v, defaultHydrationUncertainty).Uncertainty
		}
	case KeyDissolution:
		if measured != nil {
			return measured.Uncertainty
		}
	}
	return 0
}

// latticeDissociation returns ΔH_L (positive) of c: from the Born–Haber
// cycle, else from a model when asked, else the data's handbook value.
func (a *Analyst) latticeDissociation(c *cycle.Cycle, model string) (float64, float64, cycle.Source, error) {
	if model != "" {
		m, err := cycle.EvaluateModel(c, model)
		if err != nil {
			return 0, 0, cycle.Source{}, err
		}
		spread, err := a.ModelSpread(model)
		if err != nil {
			return 0, 0, cycle.Source{}, err
		}
		v := -m.Value
		return v, spread.Relative() * v, cycle.Source{Kind: cycle.SourceModel, Key: model, Citation: m.Citation, Note: spread.Basis()}, nil
	}
	v, u, err := cycleLattice(c)
	if err == nil {
		return -v, u, cycle.Source{Kind: cycle.SourceSolved, Key: "Born–Haber cycle", Citation: "Born–Haber cycle of " + c.Formula + " from the data (ΔH_L, 298.15 K)"}, nil
	}
	if s, ok := c.Step("lattice"); ok && s.Reference != nil {
		src := s.Reference.Source
		src.Note = strings.TrimSpace("handbook lattice value; the Born–Haber cycle could not be closed (" + err.Error() + "). " + src.Note)
		return -s.Reference.Value, s.Reference.Uncertainty, src, nil
	}
	return 0, 0, cycle.Source{}, err
}
