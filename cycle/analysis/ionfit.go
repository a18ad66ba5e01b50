package analysis

import (
	"errors"
	"fmt"
	"math"
	"slices"
	"strings"

	"enthalpath/cycle"
	"enthalpath/data"
)

// Lattice sources of an ion fit besides the model names of package cycle.
const (
	// FitAuto takes, per salt, the volume-based model where the salt has a
	// measured density or cell, Kapustinskii (thermochemical or Shannon
	// radii) where it has radii, and otherwise the volume-based model with
	// V_m summed from the ion volumes fitted over the data's salts
	// (FitEstimatedVolume, Analyst.IonVolumes).
	FitAuto = "auto"
	// FitHandbook takes each salt's handbook lattice energy from the data;
	// salts without one are left out.
	FitHandbook = "handbook"
	// FitEstimatedVolume names, in a fit's per-salt sources, the
	// volume-based model with V_m summed from fitted ion volumes: what
	// FitAuto takes for a salt with neither a measured volume nor radii.
	FitEstimatedVolume = "volume from ion volumes"
)

// IonFitSources lists what an ion fit can take its lattice values from.
func IonFitSources() []string { return append([]string{FitAuto, FitHandbook}, cycle.ModelNames()...) }

// IonFitOptions say how an ion's gas-phase enthalpy is fitted over its salts.
type IonFitOptions struct {
	// From is FitAuto (also ""), FitHandbook or a lattice model name.
	From string
	// Only, when non-empty, limits the fit to salts with these counter-ions.
	Only []string
	// Exclude names salts (formulas) to leave out.
	Exclude []string
	// Ionic limits the fit to the salts the ionic models were made for
	// (IonicCounterIons), or takes every salt when the data have none of
	// those. Only, when given, wins.
	Ionic bool
}

// IonicCounterIons are the counter-ions of the salts an ionic lattice model
// describes best: for an anion the cations of the s-block metals and NH₄⁺,
// for a cation the halides. Over the salts of ions whose gas-phase value is
// measured (NO₃⁻, OH⁻, CN⁻, N₃⁻, NH₄⁺, BF₄⁻, O₂⁻) a fit over these lands
// within 3σ of the measured value, and a fit over every salt up to 5σ below
// it: the salts of the d-, p- and f-block cations bind more than the models
// say (TestFitIonAgainstMeasuredIonValues).
func IonicCounterIons(anion bool) []string {
	if anion {
		return []string{"Li+", "Na+", "K+", "Rb+", "Cs+", "Be2+", "Mg2+", "Ca2+", "Sr2+", "Ba2+", "Ra2+", "NH4+"}
	}
	return []string{"F-", "Cl-", "Br-", "I-"}
}

// SaltIonValue is one salt's part in an ion fit: the gas-phase enthalpy of
// the ion that this salt's cycle alone gives, or why it was left out.
type SaltIonValue struct {
	Formula string
	// Counter is the other ion; Count how many of the fitted ion the
	// formula unit holds.
	Counter string
	Count   int
	// Lattice is the lattice step ΔH_L used (gaseous ions → solid,
	// negative, kJ/mol), with its uncertainty and where it came from (a
	// model name or FitHandbook).
	Lattice, LatticeUncertainty float64
	LatticeFrom                 string
	// Value ± Uncertainty is ΔfH°(ion, g, 298.15 K) from this salt alone
	// (kJ/mol per ion, thermal-electron convention): the cycle solved for
	// the ion's step with the lattice step above. Uncertainty carries the
	// model's scatter and every other step's uncertainty.
	Value, Uncertainty float64
	// Residual is Value − the fitted value; Normalized is Residual /
	// Uncertainty; Outside is |Normalized| > 2.
	Residual, Normalized float64
	Outside              bool
	// CounterFitted marks a salt whose counter-ion value is itself a family
	// fit (the two values are then correlated).
	CounterFitted bool
	// Skipped says why the salt is not in the fit ("" when it is).
	Skipped string
}

// IonFit is an ion's gas-phase enthalpy of formation fitted by weighted
// least squares over the salts of the ion whose other steps are known.
type IonFit struct {
	// Ion is the ion's symbol; From the lattice source asked for.
	Ion, From string
	// Value is ΔfH°(ion, g, 298.15 K) in kJ/mol (thermal-electron
	// convention of the NBS tables): the weighted mean Σwᵢxᵢ/Σwᵢ of the
	// one-salt values xᵢ with wᵢ = 1/σᵢ².
	Value float64
	// InternalSE = (Σwᵢ)^−½ is the standard error the stated uncertainties
	// give. Birge = √(χ²/(n_eff − 1)) compares the scatter with them
	// (χ² = Σwᵢ(xᵢ − Value)², n_eff = (Σwᵢ)²/Σwᵢ², the number of salts that
	// carry weight); SE = InternalSE·max(1, Birge), the standard error
	// stated, which grows when the salts scatter more than their σ say.
	InternalSE, ChiSquared, EffectiveSalts, Birge, SE float64
	// Salts holds every salt of the ion considered, used or skipped.
	Salts []SaltIonValue
	// Builtin is the data's own family-fitted value of the ion, if any.
	Builtin *data.DerivedIon
	Notes   []string
}

// Used returns the salts in the fit.
func (f *IonFit) Used() []SaltIonValue {
	return kept(f.Salts, func(s SaltIonValue) string { return s.Skipped })
}

// Outside returns the formulas of the used salts more than 2σ from the fit.
func (f *IonFit) Outside() []string {
	var out []string
	for _, s := range f.Salts {
		if s.Skipped == "" && s.Outside {
			out = append(out, s.Formula)
		}
	}
	return out
}

// Models returns the lattice sources the used salts took, with counts
// ("volume ×18; kapustinskii ×2"), or the one source when all agree.
func (f *IonFit) Models() string {
	var names []string
	counts := map[string]int{}
	for _, s := range f.Used() {
		if counts[s.LatticeFrom] == 0 {
			names = append(names, s.LatticeFrom)
		}
		counts[s.LatticeFrom]++
	}
	if len(names) == 1 {
		return names[0]
	}
	parts := make([]string, len(names))
	for i, n := range names {
		parts[i] = fmt.Sprintf("%s ×%d", n, counts[n])
	}
	return strings.Join(parts, "; ")
}

// FitIon derives the gas-phase enthalpy of formation of ion over every salt
// of the data that contains it: each salt's Born–Haber cycle is solved for
// the ion's unmeasured step (ion-formation of a polyatomic ion, the last
// attachment of a monatomic anion) with the lattice step from opt.From, and
// the one-salt values are combined by weighted least squares. This is how
// the published values for SO₄²⁻, CO₃²⁻ or O²⁻ were obtained: none is
// measured. A salt whose other steps the data lack is left out and named
// with its reason.
func (a *Analyst) FitIon(ion string, opt IonFitOptions) (*IonFit, error) {
	in, err := a.db.Ion(ion)
	if err != nil {
		return nil, &InputError{Subject: ion, Field: "ion", Reason: "not an ion of the data", Err: err}
	}
	from := strings.ToLower(strings.TrimSpace(opt.From))
	if from == "" {
		from = FitAuto
	}
	if !slices.Contains(IonFitSources(), from) {
		return nil, &InputError{Subject: in.Symbol, Field: "lattice source", Reason: fmt.Sprintf("%q is none of %s", opt.From, strings.Join(IonFitSources(), ", "))}
	}
	if !in.Polyatomic && in.Charge > 0 {
		return nil, &InputError{Subject: in.Symbol, Field: "ion", Reason: "a monatomic cation's gas-phase enthalpy is measured (ionization energies): nothing to fit"}
	}
	var only []string
	for _, sym := range opt.Only {
		ci, err := a.db.Ion(sym)
		if err != nil {
			return nil, &InputError{Subject: in.Symbol, Field: "counter-ion " + sym, Reason: "not an ion of the data", Err: err}
		}
		only = append(only, ci.Symbol)
	}
	if opt.Ionic && len(only) == 0 {
		only = IonicCounterIons(in.Charge < 0)
		has := false
		for _, comp := range a.compoundsOf(in.Symbol) {
			has = has || comp.Anion == in.Symbol && slices.Contains(only, comp.Cation) || comp.Cation == in.Symbol && slices.Contains(only, comp.Anion)
		}
		if !has {
			only = nil
		}
	}
	f := &IonFit{Ion: in.Symbol, From: from}
	if opt.Ionic && len(opt.Only) == 0 {
		if only != nil {
			f.Notes = append(f.Notes, "limited to the salts of "+strings.Join(only, " ")+", the ionic ones the models describe")
		} else {
			f.Notes = append(f.Notes, "no salt of the ionic counter-ions in the data: every salt taken")
		}
	}
	if d, ok := a.db.DerivedIon(in.Symbol); ok {
		f.Builtin = &d
	}
	others := 0
	for _, comp := range a.compoundsOf(in.Symbol) {
		if (comp.Molecular || comp.State != "" && comp.State != "cr") && (comp.Anion == in.Symbol || comp.Cation == in.Symbol) {
			others++ // not an ionic solid: no lattice to model
			continue
		}
		side, counter, count := cycle.SideAnion, comp.Cation, comp.AnionCount
		switch in.Symbol {
		case comp.Anion:
		case comp.Cation:
			side, counter, count = cycle.SideCation, comp.Anion, comp.CationCount
		default:
			continue
		}
		if len(only) > 0 && !slices.Contains(only, counter) {
			continue
		}
		s := SaltIonValue{Formula: comp.Formula, Counter: counter, Count: count}
		if slices.Contains(opt.Exclude, comp.Formula) {
			s.Skipped = "left out as asked"
		} else {
			a.saltIonValue(&s, side, from)
		}
		f.Salts = append(f.Salts, s)
	}
	used := f.Used()
	if len(used) == 0 {
		return f, noSalts(in.Symbol, only, f.Salts, "salts has every other step", func(s SaltIonValue) (string, string) { return s.Formula, s.Skipped })
	}
	f.combine()
	f.Notes = append(f.Notes, fmt.Sprintf("weighted least squares over %d of %d salts, weights 1/σ²; σ holds every other step's uncertainty and the lattice step's: for a model its RMS gap to the cycle over the built-in alkali and alkaline-earth halides (measured from the data), for a handbook value the data's", len(used), len(f.Salts)))
	if n := len(f.Salts) - len(used); n > 0 {
		var names []string
		for _, s := range f.Salts {
			if s.Skipped != "" {
				names = append(names, s.Formula)
			}
		}
		f.Notes = append(f.Notes, fmt.Sprintf("fitted over the rest: %d salts left out for a missing input (%s)", n, strings.Join(names, ", ")))
	}
	if others > 0 {
		f.Notes = append(f.Notes, fmt.Sprintf("%d compounds of the ion in the data are molecular, liquid or gaseous and are not salts: not considered", others))
	}
	if len(used) == 1 {
		f.Notes = append(f.Notes, "one salt only: the value is that salt's own cycle, and its σ the standard error")
	}
	for _, s := range used {
		if s.LatticeFrom != FitEstimatedVolume {
			continue
		}
		if v, err := a.IonVolumes(); err == nil {
			f.Notes = append(f.Notes, fmt.Sprintf("%s: V_m summed from ion volumes fitted over the %d salts of the data with a measured volume (relative RMS %.0f %%, a third of it added to the lattice step's σ); a rough estimate for salts with no density, cell or radii",
				FitEstimatedVolume, v.Salts, 100*v.RelativeRMS))
		}
		break
	}
	for _, s := range used {
		if s.CounterFitted {
			f.Notes = append(f.Notes, "some counter-ions' values are themselves family fits (marked): those salts are correlated with other fits")
			break
		}
	}
	return f, nil
}

// compoundsOf returns the data's compounds that hold ion, indexed once per
// Analyst (a family fit would otherwise copy every compound of the data).
// The records are shared: read only.
func (a *Analyst) compoundsOf(ion string) []data.Compound {
	a.saltsOnce.Do(func() {
		a.saltsOf = map[string][]data.Compound{}
		for _, c := range a.db.Compounds() {
			a.saltsOf[c.Cation] = append(a.saltsOf[c.Cation], c)
			if c.Anion != c.Cation {
				a.saltsOf[c.Anion] = append(a.saltsOf[c.Anion], c)
			}
		}
	})
	return a.saltsOf[ion]
}

// saltIonValue solves one salt for the ion's step.
func (a *Analyst) saltIonValue(s *SaltIonValue, side cycle.Side, from string) {
	c, err := a.build(s.Formula, "", "")
	if err != nil {
		s.Skipped = err.Error()
		return
	}
	key, ok := c.IonStep(side)
	if !ok {
		s.Skipped = "no step of the cycle carries the ion's value"
		return
	}
	if err := c.SolveFor(key); err != nil {
		s.Skipped = err.Error()
		return
	}
	model := from
	if from == FitAuto {
		model = cycle.ModelKapustinskii
		if c.Compound.Density.Known() || len(c.Compound.Params) > 0 {
			model = cycle.ModelVolume
		}
	}
	if from == FitHandbook {
		if lat, ok := c.Step("lattice"); !ok || lat.Reference == nil {
			s.Skipped = "no handbook lattice energy in the data"
			return
		}
	} else {
		m, err := cycle.EvaluateModel(c, model)
		volumeRel := 0.0
		if err != nil && from == FitAuto {
			// Neither a measured volume nor radii: the volume-based model
			// with V_m summed from the fitted ion volumes (ionvolume.go).
			var est error
			m, volumeRel, est = a.estimatedVolumeModel(c)
			if est == nil {
				model, err = FitEstimatedVolume, nil
			} else {
				err = fmt.Errorf("%w; %v", err, est)
			}
		}
		if err != nil {
			s.Skipped = err.Error()
			return
		}
		// The model's measured scatter (Analyst.ModelSpread), else its
		// stated default, is the lattice step's uncertainty; an estimated
		// V_m adds its own: U ∝ V_m^(−1/3), so a third of its relative
		// uncertainty.
		u := m.Uncertainty
		if sp, err := a.ModelSpread(cycle.ModelVolume); model == FitEstimatedVolume && err == nil && sp.Relative() > 0 {
			u = sp.Relative() * math.Abs(m.Value)
		} else if sp, err := a.ModelSpread(model); err == nil && sp.Relative() > 0 {
			u = sp.Relative() * math.Abs(m.Value)
		}
		u = math.Hypot(u, volumeRel/3*math.Abs(m.Value))
		if err := c.Set("lattice", m.Value, u); err != nil {
			s.Skipped = err.Error()
			return
		}
	}
	r, err := cycle.SolveHess(c)
	if err != nil {
		var me *cycle.MissingError
		if errors.As(err, &me) {
			s.Skipped = "no value for " + me.Key + " (" + me.What + ")"
		} else {
			s.Skipped = err.Error()
		}
		return
	}
	other := cycle.SideCation
	if side == cycle.SideCation {
		other = cycle.SideAnion
	}
	for _, st := range r.Steps {
		if st.Side == other && st.Source.Key == data.FamilyFitSource {
			s.CounterFitted = true
		}
	}
	s.LatticeFrom = model
	s.Lattice, s.LatticeUncertainty = r.Lattice.Enthalpy, r.Lattice.Uncertainty
	s.Value, s.Uncertainty = c.IonEnthalpy(r, side)
	if !(s.Uncertainty > 0) {
		s.Skipped = "its cycle gives the ion's value no uncertainty, so it cannot be weighted"
	}
}

// combine computes the weighted mean, its standard errors and the residuals.
func (f *IonFit) combine() {
	var sw, sw2, swx float64
	for _, s := range f.Salts {
		if s.Skipped != "" {
			continue
		}
		w := 1 / (s.Uncertainty * s.Uncertainty)
		sw += w
		sw2 += w * w
		swx += w * s.Value
	}
	f.Value = swx / sw
	f.InternalSE = 1 / math.Sqrt(sw)
	f.EffectiveSalts = sw * sw / sw2
	for i := range f.Salts {
		s := &f.Salts[i]
		if s.Skipped != "" {
			continue
		}
		s.Residual = s.Value - f.Value
		s.Normalized = s.Residual / s.Uncertainty
		s.Outside = math.Abs(s.Normalized) > 2
		f.ChiSquared += s.Normalized * s.Normalized
	}
	f.SE = f.InternalSE
	if f.EffectiveSalts > 1+1e-9 {
		f.Birge = math.Sqrt(f.ChiSquared / (f.EffectiveSalts - 1))
		f.SE = f.InternalSE * max(1, f.Birge)
	}
}
