package analysis

import (
	"errors"
	"fmt"
	"math"
	"strings"

	"enthalpath/cycle"
	"enthalpath/data"
	"enthalpath/thermo/notation"
)

// DefaultModel is the lattice model of an estimate unless another is asked:
// cycle.ModelAuto, the model the compound's verdict would be read against
// (cycle.DefaultModel), the same the workshop's guided build uses.
const DefaultModel = cycle.ModelAuto

// EstimateModels are the models an estimate can take its lattice step from.
func EstimateModels() []string {
	return []string{cycle.ModelAuto, cycle.ModelExtended, cycle.ModelKapustinkii, cycle.ModelBornMayer, cycle.ModelBornLande, cycle.ModelVolume, cycle.ModelEwald}
}

// EstimateOptions choose how an estimate is made; the zero value estimates
// the formation enthalpy with Kapustinskii and the ions the data choose.
type EstimateOptions struct {
	// Charges fix the ions' charges by element symbol (or polyatomic core).
	Charges Charges
	// Model is one of EstimateModels; "" means DefaultModel.
	Model string
	// Structure is a prototype of thermo/crystal for the Born models
	// ("rock-salt") or the path of a CIF file (charges it does not give
	// come from the compound's ions); "" keeps the compound's own, or the
	// radius-ratio rule.
	Structure string
	// CationRadius and AnionRadius (Å), when positive, replace the radii.
	CationRadius, AnionRadius float64
	// Sets replace step values (kJ/mol per reaction as written).
	Sets []cycle.Setting
	// Solve is the step to solve; "" means formation.
	Solve string
}

// IonUse is one ion of an estimate.
type IonUse struct {
	Symbol string
	Charge int
	Count  int
	// Hypothetical marks an ion the data do not list.
	Hypothetical bool
	Radius       Radius
}

// Estimate is the outcome of an estimate: the lattice step from a model
// and the step solved by Hess's law (usually the formation enthalpy).
type Estimate struct {
	Formula   string
	Tabulated bool
	Cation    IonUse
	Anion     IonUse
	// Model is the model name, ModelTitle and ModelCitation describe it.
	Model, ModelTitle, ModelCitation string
	// Lattice is the model's lattice step (negative, kJ/mol) as ΔH_L at
	// 298.15 K, LatticeEnergy the same as U.
	Lattice, LatticeEnergy float64
	// ModelUncertainty is the model's σ (kJ/mol), from Spread.
	ModelUncertainty float64
	Spread           Spread
	// Solved is the solved step; Value and Uncertainty repeat its value
	// and total σ, InputUncertainty the part of σ from the data alone.
	Solved                               cycle.Step
	Value, Uncertainty, InputUncertainty float64
	// Measured is the data's value of the solved step, when it has one.
	Measured *cycle.Entry
	// Result is the solved cycle (steps, notes, warnings, other models).
	Result *cycle.Result
	// Notes explain the choices made.
	Notes []string
}

// Estimate builds the cycle of formula (tabulated or not), fills its
// lattice step from a model with the model's σ, and solves opt.Solve
// (formation unless said otherwise).
func (a *Analyst) Estimate(formula string, opt EstimateOptions) (*Estimate, error) {
	c, est, err := a.prepare(formula, opt)
	if err != nil {
		return nil, err
	}
	res, err := cycle.Solve(c)
	if err != nil {
		return nil, err
	}
	est.Result = res
	est.Solved = res.Solved
	est.Value, est.Uncertainty = res.Solved.Value, res.Solved.Uncertainty
	m := math.Abs(res.Solved.Multiplicity)
	est.InputUncertainty = math.Sqrt(math.Max(0, sq(est.Uncertainty)-sq(est.ModelUncertainty/m)))
	return est, nil
}

// quickFormation is Estimate's answer without the model comparison: the
// solved value and σ (for scans and batches, where speed matters).
func (a *Analyst) quickEstimate(formula string, opt EstimateOptions) (*Estimate, error) {
	est, _, err := a.quickEstimateCycle(formula, opt)
	return est, err
}

// quickEstimateCycle is quickEstimate with the cycle it solved.
func (a *Analyst) quickEstimateCycle(formula string, opt EstimateOptions) (*Estimate, *cycle.Cycle, error) {
	return a.quickEstimateInto(formula, opt, nil)
}

// quickEstimateInto is quickEstimateCycle building the cycle in into's
// storage when into is not nil (see buildInto): the estimate's Solved step
// then refers into into, valid until into is used again.
func (a *Analyst) quickEstimateInto(formula string, opt EstimateOptions, into *cycle.Cycle) (*Estimate, *cycle.Cycle, error) {
	c, est, err := a.prepareInto(formula, opt, into)
	if err != nil {
		return nil, nil, err
	}
	if est.Solved.Key != "formation" {
		est, err := a.Estimate(formula, opt)
		return est, c, err
	}
	if err := missingStep(c); err != nil {
		return nil, nil, err
	}
	r, u := cycle.Residual(c)
	est.Value, est.Uncertainty = r, u
	est.InputUncertainty = math.Sqrt(math.Max(0, sq(u)-sq(est.ModelUncertainty)))
	if s, ok := c.Step("formation"); ok {
		est.Solved = *s
		est.Solved.Value, est.Solved.Uncertainty = r, u
		est.Solved.Source = cycle.Source{Kind: cycle.SourceSolved, Citation: "Hess's law over the other steps"}
	}
	return est, c, nil
}

func sq(x float64) float64 { return x * x }

// isCIFPath reports a structure given as a CIF file rather than a
// prototype name.
func isCIFPath(s string) bool { return strings.HasSuffix(strings.ToLower(s), ".cif") }

// prepare builds the cycle with the model's lattice step and the unknown.
func (a *Analyst) prepare(formula string, opt EstimateOptions) (*cycle.Cycle, *Estimate, error) {
	return a.prepareInto(formula, opt, nil)
}

// prepareInto is prepare building the cycle in into's storage when into is
// not nil (see buildInto).
func (a *Analyst) prepareInto(formula string, opt EstimateOptions, into *cycle.Cycle) (*cycle.Cycle, *Estimate, error) {
	model := opt.Model
	if model == "" {
		model = DefaultModel
	}
	var err error
	if model = strings.ToLower(strings.TrimSpace(model)); model != cycle.ModelAuto {
		if model, err = cycle.ParseModel(model); err != nil {
			return nil, nil, err
		}
	}
	var cation, anion string
	if len(opt.Charges) > 0 {
		cation, anion, err = a.ionsFromCharges(formula, opt.Charges)
		if err != nil {
			return nil, nil, err
		}
	}
	c, err := a.buildInto(formula, cation, anion, into)
	if err != nil {
		return nil, nil, err
	}
	est := &Estimate{Formula: c.Formula, Tabulated: c.Tabulated, Model: model}
	switch {
	case isCIFPath(opt.Structure):
		// A measured cell: d₀ from its geometry.
		if err := c.LoadStructureFile(opt.Structure, opt.Structure); err != nil {
			return nil, nil, &InputError{Subject: formula, Field: "structure", Reason: "cannot use the CIF file", Err: err}
		}
	case opt.Structure != "":
		c.Settings.Structure = cycle.Structure{Prototype: opt.Structure}
		c.Settings.Distance = cycle.DistanceRadii
	}
	if c.Settings.Structure.Cell == nil && (!c.Tabulated || c.Settings.Structure.Empty() || !c.Settings.Structure.FromData) {
		// No measured cell of this compound: d₀ from the radii.
		c.Settings.Distance = cycle.DistanceRadii
	}
	for _, side := range []struct {
		p    *cycle.Part
		use  *IonUse
		user float64
	}{{&c.Cation, &est.Cation, opt.CationRadius}, {&c.Anion, &est.Anion, opt.AnionRadius}} {
		in := &side.p.Ion
		*side.use = IonUse{Symbol: in.Symbol, Charge: in.Charge, Count: side.p.Count,
			Hypothetical: strings.Contains(in.Note, "hypothetical")}
		var r Radius
		switch {
		case side.user > 0:
			r = Radius{Value: side.user, Kind: "user", From: fmt.Sprintf("radius of %s given by the user", in.Symbol)}
			useRadius(in, r)
		default:
			r, err = a.ionRadius(*in)
			if err == nil && r.Kind == "neighbour" {
				useRadius(in, r)
			}
		}
		if err != nil && model != cycle.ModelVolume {
			return nil, nil, &InputError{Subject: formula, Field: "radius of " + in.Symbol, Reason: "the " + model + " model needs it", Err: err}
		}
		side.use.Radius = r
		if r.Kind == "neighbour" || r.Kind == "user" {
			est.Notes = append(est.Notes, r.From)
		}
	}
	for _, s := range opt.Sets {
		if err := s.Apply(c); err != nil {
			return nil, nil, &InputError{Subject: formula, Field: FieldStepValue, Key: s.Key, Reason: "cannot be applied", Err: err}
		}
	}
	var m cycle.ModelResult
	if model == cycle.ModelAuto {
		var why string
		if m, why, err = cycle.DefaultModel(c); err != nil {
			return nil, nil, &InputError{Subject: formula, Field: "lattice step", Reason: "no model can give it", Err: err}
		}
		model, est.Model = m.Model, m.Model
		est.Notes = append(est.Notes, "lattice model "+m.Model+": "+why)
	} else if m, err = cycle.EvaluateModel(c, model); err != nil {
		return nil, nil, &InputError{Subject: formula, Field: "lattice step", Reason: "the " + model + " model cannot give it", Err: err}
	}
	spread := a.spreadFor(c, model)
	if !(spread.RMSPercent > 0) {
		return nil, nil, &InputError{Subject: formula, Field: "model uncertainty", Reason: "the " + model + " model could not be validated on the built-in compounds"}
	}
	est.ModelTitle, est.ModelCitation = m.Title, m.Citation
	est.Spread = spread
	est.ModelUncertainty = spread.Relative() * math.Abs(m.Value)
	est.Lattice = m.Value
	if c.Conventions.Lattice == cycle.LatticeEnergy {
		est.Lattice = m.Value - c.LatticeCorrection()
	}
	est.LatticeEnergy = m.Energy
	if err := c.Set("lattice", m.Value, est.ModelUncertainty); err != nil {
		return nil, nil, err
	}
	if s, ok := c.Step("lattice"); ok {
		s.Source = cycle.Source{Kind: cycle.SourceModel, Key: model, Citation: m.Citation,
			Note: "lattice step from the " + model + " model; σ: " + spread.Basis()}
	}
	solve := opt.Solve
	if solve == "" {
		solve = "formation"
	}
	if solve == "lattice" {
		return nil, nil, &InputError{Subject: formula, Field: FieldUnknownStep, Key: "lattice", Reason: "an estimate takes the lattice step from a model; solve another step, or close the cycle itself"}
	}
	s, ok := c.Step(solve)
	if !ok {
		return nil, nil, &cycle.StepError{Key: solve, Valid: c.Keys()}
	}
	if s.Reference != nil {
		ref := *s.Reference
		est.Measured = &ref
	}
	if err := c.SolveFor(solve); err != nil {
		return nil, nil, err
	}
	est.Solved = *s
	est.Notes = append(est.Notes, "entropy is not included: these are enthalpies, and stability is decided by free energies")
	return c, est, nil
}

// ionsFromCharges turns charges into the cation and anion symbols of
// cycle.Options for formula.
func (a *Analyst) ionsFromCharges(formula string, ch Charges) (string, string, error) {
	var cat, an string
	for core, z := range ch {
		sym := a.ionSymbol(core, z)
		switch {
		case z > 0 && cat == "":
			cat = sym
		case z < 0 && an == "":
			an = sym
		default:
			return "", "", &InputError{Subject: formula, Field: FieldCharges, Reason: "give one positive and one negative charge (one cation and one anion)"}
		}
	}
	first, second := firstTwoSymbols(formula)
	if cat == "" || an == "" {
		// The other ion: the data's ion of the other element.
		other, positive := second, false
		if cat == "" {
			other, positive = first, true
		}
		if _, given := ch[other]; given || other == "" {
			return "", "", &InputError{Subject: formula, Field: FieldCharges, Reason: "give one positive and one negative charge"}
		}
		sym, err := a.dataIon(other, positive)
		if err != nil {
			return "", "", &InputError{Subject: formula, Field: FieldCharges, Reason: "give the charge of " + other + " too", Err: err}
		}
		if positive {
			cat = sym
		} else {
			an = sym
		}
	}
	return cat, an, nil
}

// ionSymbol is the symbol of the data's ion of core with charge z, or the
// symbol of a hypothetical one; remembered per Analyst, since a lookup that
// misses words its suggestions over every ion of the data.
func (a *Analyst) ionSymbol(core string, z int) string {
	key := chargeKey{core, z}
	a.mu.Lock()
	sym, ok := a.symbols[key]
	a.mu.Unlock()
	if ok {
		return sym
	}
	if in, err := a.db.IonByCharge(core, z); err == nil {
		sym = in.Symbol
	} else {
		sym = core + notation.ChargeSuffix(z, false)
	}
	a.mu.Lock()
	if len(a.symbols) >= maxBuilt {
		clear(a.symbols)
	}
	a.symbols[key] = sym
	a.mu.Unlock()
	return sym
}

// dataIon returns the symbol of the data's monatomic ion of element el with
// the sign asked; several: the one of lowest |charge| for a cation, highest
// for an anion.
func (a *Analyst) dataIon(el string, positive bool) (string, error) {
	var best *data.Ion
	for _, in := range a.db.IonsOf(el) {
		if in.Polyatomic || (in.Charge > 0) != positive {
			continue
		}
		if best == nil || (positive && in.Charge < best.Charge) || (!positive && in.Charge < best.Charge) {
			b := in
			best = &b
		}
	}
	if best == nil {
		return "", errors.New("the data have no such ion of " + el)
	}
	return best.Symbol, nil
}
