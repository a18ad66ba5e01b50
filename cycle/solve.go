package cycle

import (
	"fmt"
	"math"
	"slices"

	"enthalpath/thermo"
	"enthalpath/thermo/lattice"
)

// freeElectronEnthalpy is 5/2·RT at 298.15 K in kJ/mol: the heat content
// H(298.15 K) − H(0) of one mole of free electrons treated as an ideal
// monatomic gas.
func freeElectronEnthalpy() float64 { return 2.5 * thermo.RT(thermo.StandardTemperature) }

// degreesOfFreedom is n of Jenkins (2005): 3 monatomic, 5 linear, 6 non-linear.
func degreesOfFreedom(shape string) float64 {
	switch shape {
	case "linear":
		return 5
	case "nonlinear", "non-linear":
		return 6
	}
	return 3
}

// LatticeCorrection returns ΔH_L − U in kJ/mol for the dissociation
// MaXb(s) → a M(g) + b X(g) at 298.15 K, by Jenkins' rule
// [a(n_M/2 − 2) + b(n_X/2 − 2)]·RT (H. D. B. Jenkins, J. Chem. Educ. 82,
// 950 (2005)): −RT for a 1:1 salt of monatomic ions.
func (c *Cycle) LatticeCorrection() float64 {
	k := float64(c.Cation.Count)*(degreesOfFreedom(c.Cation.Ion.Shape)/2-2) +
		float64(c.Anion.Count)*(degreesOfFreedom(c.Anion.Ion.Shape)/2-2)
	return k * thermo.RT(thermo.StandardTemperature)
}

// shift returns Value − base for step s under conventions conv, where base
// is the step's value in the conventions Hess's law is summed in: enthalpies
// at 298.15 K with a thermal electron, lattice enthalpy ΔH_L.
func (c *Cycle) shift(s *Step, conv Conventions) float64 {
	h := freeElectronEnthalpy()
	switch s.Kind {
	case KindIonization:
		if conv.Ionization == Energies0K {
			return -h
		}
	case KindAttachment:
		if conv.Ionization == Energies0K {
			return h * s.electrons()
		}
	case KindIonFormation:
		if conv.Ionization == Energies0K {
			// Tabulated ΔfH°(ion, g) counts the thermal electron; the 0 K
			// convention leaves it out: −5/2·RT per electron removed, +5/2·RT
			// per electron added.
			p := c.Cation
			if s.Side == SideAnion {
				p = c.Anion
			}
			return -float64(p.Ion.Charge) * h
		}
	case KindLattice:
		if conv.Lattice == LatticeEnergy {
			// Step value −U; base −ΔH_L = −U − corr.
			return c.LatticeCorrection()
		}
	}
	return 0
}

// hessSign is +1 for the steps on the path elements → ions → solid and −1
// for the formation step, so that Σ sign·m·base = 0.
func hessSign(s *Step) float64 {
	if s.Kind == KindFormation {
		return -1
	}
	return 1
}

// LatticeValue is the lattice step (gaseous ions → solid, negative) in both
// conventions.
type LatticeValue struct {
	// Enthalpy is −ΔH_L at 298.15 K and Energy is −U, in kJ/mol.
	Enthalpy, Energy float64
	// Uncertainty is the standard uncertainty in kJ/mol (the same for both).
	Uncertainty float64
	// Correction is ΔH_L − U for the dissociation (Jenkins' rule).
	Correction float64
}

// In returns the value in convention conv.
func (l LatticeValue) In(conv LatticeConvention) float64 {
	if conv == LatticeEnergy {
		return l.Energy
	}
	return l.Enthalpy
}

// Handbook compares the cycle's lattice value with the data's tabulated one.
type Handbook struct {
	// Value is the tabulated value as a lattice step (negative) in the
	// cycle's lattice convention, converted with Jenkins' rule when the
	// source tabulated the other quantity.
	Value       float64
	Uncertainty float64
	// Tabulated is the raw row (positive, solid → ions) and Convention
	// what it tabulated (U or ΔH_L).
	Tabulated  float64
	Convention LatticeConvention
	Source     Source
	// Difference is cycle − handbook in kJ/mol and Percent that over |handbook|.
	Difference, Percent float64
}

// Result is a solved cycle. Solve never changes the Cycle it is given.
type Result struct {
	// Steps are the cycle's steps with the solved value filled in, the
	// lattice step filled from a model if Settings.LatticeFrom says so, and
	// composite steps summed.
	Steps []Step
	// Solved is the solved step (Source.Kind SourceSolved).
	Solved Step
	// Lattice is the lattice step in both conventions.
	Lattice LatticeValue
	// Conventions are those the Steps' values are in.
	Conventions Conventions
	// Models are the lattice models, each against Lattice.
	Models []ModelResult
	// Reference is the model the covalency verdict is read against (its
	// Verdict in Models is the verdict; the others are shown beside it),
	// ReferenceWhy why that one; "" when no model could be evaluated.
	Reference, ReferenceWhy string
	// Handbook is the data's tabulated lattice energy beside the cycle's,
	// or nil when the data have none.
	Handbook *Handbook
	// Notes explain conventions and defaults that shaped the numbers.
	Notes []string
	// Warnings are things the user should look at (cycle-derived inputs,
	// values from memory, default uncertainties, models that failed).
	Warnings []string
	// Circular lists the family-fitted ion values the cycle uses that were
	// fitted to this very compound: the comparison with the models is then
	// not independent, and every model's verdict is left Undetermined.
	Circular []Circularity
}

// Step returns the result's step with key.
func (r *Result) Step(key string) (*Step, bool) {
	for i := range r.Steps {
		if r.Steps[i].Key == key {
			return &r.Steps[i], true
		}
	}
	return nil, false
}

// Verdict returns the reference model's result (nil without one).
func (r *Result) Verdict() *ModelResult {
	m, ok := r.Model(r.Reference)
	if !ok {
		return nil
	}
	return m
}

// Model returns the result of the model called name.
func (r *Result) Model(name string) (*ModelResult, bool) {
	for i := range r.Models {
		if r.Models[i].Model == name {
			return &r.Models[i], true
		}
	}
	return nil, false
}

// Solve closes the cycle by Hess's law: exactly one step must be unknown
// (or, with Settings.LatticeFrom, one step other than the lattice). It
// returns the solved cycle with the propagated uncertainty, the lattice
// value in both conventions and the model comparison. Errors: *UnknownsError
// (zero or several unknowns), *MissingError (a step without a value),
// *ModelError (LatticeFrom names a model that cannot be evaluated).
func Solve(c *Cycle) (*Result, error) {
	steps := slices.Clone(c.Steps)
	w := *c
	w.Steps = steps
	res := &Result{Conventions: c.Conventions}
	var models []ModelResult
	if c.Settings.LatticeFrom != "" {
		i, err := w.index("lattice")
		if err != nil {
			return nil, err
		}
		models = EvaluateModels(c)
		m := findModel(models, c.Settings.LatticeFrom)
		if m == nil {
			return nil, &ModelError{Model: c.Settings.LatticeFrom, Reason: "not a lattice model; use one of " + modelList()}
		}
		if m.Err != nil {
			return nil, &ModelError{Model: m.Model, Reason: "cannot fill the lattice step", Err: m.Err}
		}
		s := &steps[i]
		s.Unknown = false
		s.Value = m.Value
		s.Uncertainty = m.Uncertainty
		s.Source = Source{Kind: SourceModel, Key: m.Model, Citation: m.Citation, DefaultUncertainty: m.DefaultUncertainty,
			Note: "lattice step from the " + m.Model + " model"}
		if len(w.Unknowns()) == 0 {
			return nil, &UnknownsError{}
		}
	}
	if err := w.hess(res); err != nil {
		return nil, err
	}
	res.Lattice = w.latticeValue()
	res.Handbook = w.handbook(res.Lattice)
	if models == nil {
		models = EvaluateModels(c)
	}
	res.Models = gaps(c, models, res.Lattice.In(w.Conventions.Lattice))
	res.Reference, res.ReferenceWhy = ReferenceModel(c, res.Models)
	if res.Circular = w.circularity(); len(res.Circular) > 0 {
		for i := range res.Models {
			res.Models[i].Verdict.Character = lattice.Undetermined
		}
	}
	res.Notes, res.Warnings = w.commentary(res)
	return res, nil
}

// hess closes w (a working copy whose Steps the caller owns) by Hess's law:
// the one unknown step gets the value the others leave, with the
// propagated uncertainty; res.Solved and res.Steps are set.
func (w *Cycle) hess(res *Result) error {
	w.refreshComposites()

	unknown := -1
	var unknowns []string
	for i := range w.Steps {
		if w.Steps[i].Unknown {
			unknowns = append(unknowns, w.Steps[i].Key)
			unknown = i
		}
	}
	if len(unknowns) != 1 {
		return &UnknownsError{Keys: unknowns}
	}
	if !w.inSum(unknown) {
		parent := w.Steps[unknown].Parent
		return fmt.Errorf("%w: step %s is a sub-step of %s, which has a value of its own; reset %s (or solve for %s) instead: %w",
			ErrUnknownStep, w.Steps[unknown].Key, parent, parent, parent, ErrTooManyUnknowns)
	}
	sum, variance := 0.0, 0.0
	for i := range w.Steps {
		s := &w.Steps[i]
		if i == unknown || !w.inSum(i) {
			continue
		}
		if s.Source.Kind == SourceMissing {
			return w.MissingDatum(s)
		}
		base := s.Value - w.shift(s, w.Conventions)
		sum += hessSign(s) * s.Multiplicity * base
		variance += sq(s.Multiplicity * s.Uncertainty)
	}
	u := &w.Steps[unknown]
	if u.Multiplicity == 0 {
		return fmt.Errorf("cycle %s: step %s has multiplicity 0 and cannot be solved", w.Formula, u.Key)
	}
	base := -sum / (hessSign(u) * u.Multiplicity)
	u.Value = base + w.shift(u, w.Conventions)
	u.Uncertainty = math.Sqrt(variance) / math.Abs(u.Multiplicity)
	if math.IsNaN(u.Value) || math.IsInf(u.Value, 0) || math.IsNaN(u.Uncertainty) || math.IsInf(u.Uncertainty, 0) {
		return fmt.Errorf("cycle %s: the steps sum to no finite value for %s; check the values given", w.Formula, u.Key)
	}
	u.Source = Source{Kind: SourceSolved, Citation: "Hess's law over the other steps"}
	w.refreshComposites()
	res.Solved = *u
	res.Steps = w.Steps
	return nil
}

// latticeValue is w's lattice step in both conventions.
func (w *Cycle) latticeValue() LatticeValue {
	lat, _ := w.Step("lattice")
	corr := w.LatticeCorrection()
	latBase := lat.Value - w.shift(lat, w.Conventions)
	return LatticeValue{Enthalpy: latBase, Energy: latBase + corr, Uncertainty: lat.Uncertainty, Correction: corr}
}

// SolveHess is Solve without the model comparison, the handbook value and
// the commentary: the solved step and the steps, for callers that solve
// many cycles for one number (a family fit). Result.Lattice is set;
// Models, Handbook, Notes and Warnings are empty. LatticeFrom is not
// applied: give the lattice step a value first.
func SolveHess(c *Cycle) (*Result, error) {
	w := *c
	w.Steps = slices.Clone(c.Steps)
	res := &Result{Conventions: c.Conventions}
	if err := w.hess(res); err != nil {
		return nil, err
	}
	res.Lattice = w.latticeValue()
	return res, nil
}

// Residual returns Σ sign·m·base over every step that has a value (the
// amount by which the cycle fails to close, kJ/mol) and its uncertainty.
// It is what an interactive caller can show when no step is unknown.
//
// It reads c without copying it: the composites refreshComposites would
// set (those summing their sub-steps) are exactly those inSum leaves out,
// their sub-steps standing for them.
func Residual(c *Cycle) (residual, uncertainty float64) {
	variance := 0.0
	for i := range c.Steps {
		s := &c.Steps[i]
		if !c.inSum(i) || s.Unknown || s.Source.Kind == SourceMissing {
			continue
		}
		residual += hessSign(s) * s.Multiplicity * (s.Value - c.shift(s, c.Conventions))
		variance += sq(s.Multiplicity * s.Uncertainty)
	}
	return residual, math.Sqrt(variance)
}
