package cycle

import (
	"errors"
	"fmt"
	"math"
	"slices"
	"strings"

	"enthalpath/thermo/lattice"
)

// The lattice model names, as used by Settings.LatticeFrom, the command
// line and the cycle file.
const (
	ModelBornLande    = "born-lande"
	ModelBornMayer    = "born-mayer"
	ModelKapustinskii = "kapustinskii"
	ModelVolume       = "volume"
	ModelEwald        = "ewald"
)

// ModelKapustinkii is the first, misspelt name of ModelKapustinskii.
//
// Deprecated: use ModelKapustinskii.
const ModelKapustinkii = ModelKapustinskii

// ModelNames lists the models in display order.
func ModelNames() []string {
	return []string{ModelBornLande, ModelBornMayer, ModelKapustinskii, ModelVolume, ModelEwald, ModelExtended}
}

func isModelName(s string) bool { return slices.Contains(ModelNames(), s) }

func modelList() string { return strings.Join(ModelNames(), ", ") }

// ParseModel checks a model name and returns it.
func ParseModel(s string) (string, error) {
	s = strings.ToLower(strings.TrimSpace(s))
	if isModelName(s) {
		return s, nil
	}
	return "", &ModelError{Model: s, Reason: "not a lattice model; use one of " + modelList()}
}

// Default relative uncertainties of the models, used where a model result
// fills the lattice step (common practice, no source): they express how far
// each model typically strays from cycle values for ionic salts.
const (
	ModelUncertaintyBorn         = 0.03
	ModelUncertaintyKapustinskii = 0.05
	ModelUncertaintyVolume       = 0.07
)

// ModelInputs are the numbers a model used, with where each came from. Only
// the fields the model uses are set.
type ModelInputs struct {
	// Madelung is A (per formula unit, referred to D0; thermo/ewald's
	// convention) and MadelungFrom says how it was obtained.
	Madelung     float64
	MadelungFrom string
	// Structure is the prototype or file A was computed for.
	Structure string
	// D0 is the cation–anion distance in Å and D0From its origin.
	D0     float64
	D0From string
	// BornExponent n and its origin (Born–Landé).
	BornExponent     float64
	BornExponentFrom string
	// Rho is ρ in Å (Born–Mayer, Ewald).
	Rho float64
	// Radii in Å with the coordination numbers and kind used.
	CationRadius, AnionRadius float64
	CationCN, AnionCN         int
	RadiusFrom                string
	// Nu is the number of ions per formula unit (Kapustinskii).
	Nu int
	// MolarVolume is V_m in nm³ per formula unit and VolumeFrom its origin.
	MolarVolume float64
	VolumeFrom  string
	// IonicStrength is I = ½Σnz² (volume model).
	IonicStrength float64
	// Fit names the volume-model equation or fit used.
	Fit string
	// Extended is the extended model's breakdown (that model only).
	Extended *ExtendedBreakdown
}

// ModelResult is one lattice model's value beside the cycle's.
type ModelResult struct {
	// Model is one of ModelNames.
	Model string
	// Title is the model's name in words with its reference.
	Title string
	// Energy is the model's lattice energy U (negative, kJ/mol).
	Energy float64
	// Value is the lattice step in the cycle's lattice convention (U, or
	// ΔH_L by Jenkins' correction), the number compared with the cycle.
	Value float64
	// Uncertainty is the model's σ (kJ/mol): its RMS gap over the
	// validation (UncertaintyBasis says over which compounds), or, for a
	// cycle without the built-in data, the default of ModelUncertaintyBorn
	// … with DefaultUncertainty true.
	Uncertainty        float64
	DefaultUncertainty bool
	UncertaintyBasis   string
	// Citation is the model's reference.
	Citation string
	// Gap is cycle − model in kJ/mol (negative when the cycle binds more)
	// and GapPercent is 100·Gap/|model|; NaN without a cycle value.
	Gap, GapPercent float64
	// Verdict classifies the gap (thermo/lattice.Judge, common-practice thresholds).
	Verdict lattice.Verdict
	Inputs  ModelInputs
	// Err is why the model could not be evaluated; the numbers are then 0.
	Err error
}

// OK reports whether the model produced a value.
func (m *ModelResult) OK() bool { return m.Err == nil }

func findModel(ms []ModelResult, name string) *ModelResult {
	for i := range ms {
		if ms[i].Model == name {
			return &ms[i]
		}
	}
	return nil
}

// gaps fills Gap, GapPercent and Verdict of every model against the cycle
// lattice value (in the cycle's lattice convention), with each model's
// thresholds from the validation of c's data (common-practice thresholds
// for a cycle without data).
func gaps(c *Cycle, ms []ModelResult, cycleValue float64) []ModelResult {
	v := c.Validation()
	for i := range ms {
		m := &ms[i]
		if m.Err != nil {
			m.Gap, m.GapPercent = math.NaN(), math.NaN()
			continue
		}
		th, basis := lattice.DefaultThresholds(), lattice.VerdictBasis
		if v != nil {
			th, basis = v.Thresholds(m.Model)
		}
		m.Verdict = lattice.JudgeAgainst(cycleValue, m.Value, th, basis)
		m.Gap, m.GapPercent = m.Verdict.Gap, m.Verdict.GapPercent
	}
	return ms
}

// Compare evaluates every lattice model for c and compares each with
// cycleValue, a lattice step (negative, kJ/mol) in c's lattice convention.
func Compare(c *Cycle, cycleValue float64) []ModelResult {
	return gaps(c, EvaluateModels(c), cycleValue)
}

// ReferenceModel returns the model c's covalency verdict is read against
// among ms (evaluated models of c) and why: see Validation.Reference. A
// cycle without data reads it against the extended model, else ewald, else
// born-mayer, else kapustinskii.
func ReferenceModel(c *Cycle, ms []ModelResult) (string, string) {
	return referenceModel(c, func(name string) bool {
		m := findModel(ms, name)
		return m != nil && m.Err == nil
	})
}

// referenceModel is ReferenceModel with ok saying whether a model can be
// evaluated (asked only of the models the choice needs).
func referenceModel(c *Cycle, ok func(model string) bool) (string, string) {
	if v := c.Validation(); v != nil {
		return v.Reference(ValidationFamily(c), ok)
	}
	for _, name := range []string{ModelExtended, ModelEwald, ModelBornMayer, ModelKapustinskii} {
		if ok(name) {
			return name, "first of extended, ewald, born-mayer, kapustinskii that can be evaluated (no validation without the built-in data)"
		}
	}
	return "", "no model could be evaluated"
}

// ModelAuto asks for the default model of an estimate: the model c's
// verdict would be read against (ReferenceModel).
const ModelAuto = "auto"

// DefaultModel evaluates the model an estimate of c takes its lattice step
// from when none is asked: the one its verdict is read against, with its σ
// from the validation. It returns the model and why it was chosen.
//
// Only the models the choice needs are evaluated, each once, as the choice
// asks whether it can be (the extended model first, which is the reference
// wherever it evaluates): a batch row costs one model or a few, not six.
// The choice and its value are those of ReferenceModel over EvaluateModels.
func DefaultModel(c *Cycle) (ModelResult, string, error) {
	e := &evaluator{c: c}
	var (
		ms   [8]ModelResult
		done = ms[:0]
	)
	get := func(name string) *ModelResult {
		if m := findModel(done, name); m != nil {
			return m
		}
		m, err := e.evaluate(name)
		if err != nil {
			m = ModelResult{Model: name, Err: err}
		}
		calibrate(c, &m)
		done = append(done, m)
		return &done[len(done)-1]
	}
	ok := func(name string) bool {
		if !isModelName(name) || (name == ModelExtended && extendedLacksDispersion(c)) {
			return false
		}
		return get(name).Err == nil
	}
	name, why := referenceModel(c, ok)
	if name == "" {
		return ModelResult{}, why, &ModelError{Model: ModelAuto, Reason: "no lattice model can be evaluated for " + c.Formula}
	}
	return *get(name), why, nil
}

// calibrate sets m's uncertainty from the validation of c's data: the
// model's RMS gap over c's family, or over the ionic family (see
// Validation.Sigma); without it the model keeps its default.
func calibrate(c *Cycle, m *ModelResult) {
	if m.Err != nil {
		return
	}
	v := c.Validation()
	if v == nil {
		return
	}
	if rel, basis := v.Sigma(m.Model, ValidationFamily(c)); rel > 0 {
		m.Uncertainty = rel * math.Abs(m.Value)
		m.DefaultUncertainty = false
		m.UncertaintyBasis = basis
	}
}

// evaluator evaluates the models of one cycle, sharing the radii and the
// Madelung constant between them.
type evaluator struct {
	c       *Cycle
	radDone [2]bool
	rad     [2]ModelInputs
	radErr  [2]error
	madDone [2]bool
	mad     [2]MadelungValue
	madIn   [2]ModelInputs
	madErr  [2]error
}

func index(b bool) int {
	if b {
		return 1
	}
	return 0
}

// radii sets the radius fields of in (see radiiUncached), once per kind.
func (e *evaluator) radii(in *ModelInputs, structureFree bool) error {
	k := index(structureFree)
	if !e.radDone[k] {
		e.radErr[k] = e.radiiUncached(&e.rad[k], structureFree)
		e.radDone[k] = true
	}
	if e.radErr[k] != nil {
		return e.radErr[k]
	}
	r := e.rad[k]
	in.CationRadius, in.AnionRadius, in.CationCN, in.AnionCN, in.RadiusFrom = r.CationRadius, r.AnionRadius, r.CationCN, r.AnionCN, r.RadiusFrom
	return nil
}

// madelung sets the Madelung fields of in (see madelungUncached), once per kind.
func (e *evaluator) madelung(in *ModelInputs, actual bool) (MadelungValue, error) {
	k := index(actual)
	if !e.madDone[k] {
		e.mad[k], e.madErr[k] = e.madelungUncached(&e.madIn[k], actual)
		e.madDone[k] = true
	}
	m := e.madIn[k]
	in.Madelung, in.MadelungFrom, in.Structure = m.Madelung, m.MadelungFrom, m.Structure
	return e.mad[k], e.madErr[k]
}

// EvaluateModels returns every lattice model's value for c, in ModelNames
// order, without gaps. A model that cannot be evaluated has Err set (and the
// others are still returned). The Ewald sums go through c's Memo.
func EvaluateModels(c *Cycle) []ModelResult {
	out := make([]ModelResult, 0, len(ModelNames()))
	e := &evaluator{c: c}
	for _, name := range ModelNames() {
		m, err := e.evaluate(name)
		if err != nil {
			m = ModelResult{Model: name, Err: err}
		}
		calibrate(c, &m)
		out = append(out, m)
	}
	return out
}

// VerdictThresholds says in words how the verdict's thresholds are set.
func VerdictThresholds() string {
	return fmt.Sprintf("thresholds %g σ and %g σ of the reference model, σ its RMS gap over the built-in %s (validation of the built-in data); without the built-in data, %s",
		AdequateSigmas, SubstantialSigmas, IonicFamily, lattice.VerdictBasis)
}

// EvaluateModel returns one model's lattice value for c (no gap).
func EvaluateModel(c *Cycle, name string) (ModelResult, error) {
	m, err := (&evaluator{c: c}).evaluate(name)
	if err == nil {
		calibrate(c, &m)
	}
	return m, err
}

func (e *evaluator) evaluate(name string) (ModelResult, error) {
	c := e.c
	m := ModelResult{Model: name, DefaultUncertainty: true, Gap: math.NaN(), GapPercent: math.NaN()}
	if c.Cation.Count <= 0 || c.Anion.Count <= 0 {
		return m, &ModelError{Model: name, Reason: "the cycle has no ions"}
	}
	var (
		u   float64
		err error
		rel = ModelUncertaintyBorn
	)
	switch name {
	case ModelBornLande:
		m.Title = "Born–Landé"
		m.Citation = "M. Born and A. Landé, Verh. Dtsch. Phys. Ges. 20, 210 (1918)"
		u, err = e.bornModel(&m.Inputs, false, false)
	case ModelBornMayer:
		m.Title = "Born–Mayer"
		m.Citation = "M. Born and J. E. Mayer, Z. Phys. 75, 1 (1932)"
		u, err = e.bornModel(&m.Inputs, true, false)
	case ModelEwald:
		m.Title = "Born–Mayer with the Ewald Madelung constant of the structure"
		m.Citation = "P. P. Ewald, Ann. Phys. 369, 253 (1921); Born–Mayer repulsion"
		u, err = e.bornModel(&m.Inputs, true, true)
	case ModelExtended:
		m.Title = "extended ionic model: Ewald Coulomb, Born–Mayer–Huggins repulsion, C/r⁶ and D/r⁸ dispersion, zero-point energy"
		m.Citation = "M. L. Huggins and J. E. Mayer, J. Chem. Phys. 1, 643 (1933); J. E. Mayer, J. Chem. Phys. 1, 270 (1933); F. G. Fumi and M. P. Tosi, J. Phys. Chem. Solids 25, 31 (1964); J. C. Slater and J. G. Kirkwood, Phys. Rev. 37, 682 (1931); J. R. Tessman, A. H. Kahn and W. Shockley, Phys. Rev. 92, 890 (1953)"
		u, err = e.extended(&m.Inputs)
	case ModelKapustinskii:
		m.Title = "Kapustinskii (1956)"
		m.Citation = "A. F. Kapustinskii, Q. Rev. Chem. Soc. 10, 283 (1956)"
		rel = ModelUncertaintyKapustinskii
		u, err = e.kapustinskii(&m.Inputs)
	case ModelVolume:
		m.Title = "Jenkins–Glasser volume-based"
		m.Citation = "H. D. B. Jenkins, H. K. Roobottom, J. Passmore, L. Glasser, Inorg. Chem. 38, 3609 (1999)"
		rel = ModelUncertaintyVolume
		u, err = e.volumeModel(&m.Inputs)
	default:
		return m, &ModelError{Model: name, Reason: "not a lattice model; use one of " + modelList()}
	}
	if err != nil {
		var me *ModelError
		if errors.As(err, &me) && me.Model != name {
			// A shared input (the Madelung constant, summed once for
			// every model that needs it) failed under another model's
			// name: the error is this model's.
			return m, &ModelError{Model: name, Reason: me.Reason, Err: me.Err}
		}
		if errors.As(err, &me) {
			return m, err
		}
		return m, &ModelError{Model: name, Reason: "cannot be evaluated", Err: err}
	}
	if math.IsNaN(u) || math.IsInf(u, 0) {
		return m, &ModelError{Model: name, Reason: "its inputs give no finite lattice energy; check d₀, ρ and n"}
	}
	m.Energy = u
	m.Value = u
	if c.Conventions.Lattice == LatticeEnthalpy {
		m.Value = u - c.LatticeCorrection()
	}
	if b := m.Inputs.Extended; b != nil {
		// The extended model carries its own heat contents to 298.15 K.
		m.Value = b.Value(b.Minimum)
	}
	m.Uncertainty = rel * math.Abs(m.Value)
	return m, nil
}
