package cycle

import (
	"errors"
	"fmt"
	"math"
	"slices"
	"strconv"
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
	ok := func(name string) bool {
		m := findModel(ms, name)
		return m != nil && m.Err == nil
	}
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
func DefaultModel(c *Cycle) (ModelResult, string, error) {
	ms := EvaluateModels(c)
	name, why := ReferenceModel(c, ms)
	m := findModel(ms, name)
	if m == nil {
		return ModelResult{}, why, &ModelError{Model: ModelAuto, Reason: "no lattice model can be evaluated for " + c.Formula}
	}
	return *m, why, nil
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
		m.Citation = "M. L. Huggins and J. E. Mayer, J. Chem. Phys. 1, 643 (1933); J. E. Mayer, J. Chem. Phys. 1, 270 (1933); F. G. Fumi and M. P. Tosi, J. Phys. Chem. Solids 25, 31 (1964)"
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
	m.Uncertainty = rel * math.Abs(m.Value)
	return m, nil
}

func (c *Cycle) ionKinds() []lattice.IonKind {
	shape := func(s string) lattice.Shape {
		sh, err := lattice.ParseShape(s)
		if err != nil {
			return lattice.Monatomic
		}
		return sh
	}
	return []lattice.IonKind{
		{Charge: c.Cation.Ion.Charge, Count: c.Cation.Count, Shape: shape(c.Cation.Ion.Shape)},
		{Charge: c.Anion.Ion.Charge, Count: c.Anion.Count, Shape: shape(c.Anion.Ion.Shape)},
	}
}

// prototypeCN gives the coordination numbers (cation, anion) of the
// built-in prototypes.
func prototypeCN(name string) (int, int) {
	switch name {
	case "rock-salt", "nickel-arsenide":
		return 6, 6
	case "caesium-chloride":
		return 8, 8
	case "zinc-blende", "wurtzite":
		return 4, 4
	case "fluorite":
		return 8, 4
	case "antifluorite":
		return 4, 8
	case "rutile", "cadmium-chloride", "cadmium-iodide":
		return 6, 3
	case "corundum":
		return 6, 4
	}
	return 6, 6
}

// radius returns the radius of part p (Å) at coordination cn with the kind
// of the settings: a Shannon radius for a monatomic ion (the nearest CN the
// table has when cn is missing, said in from), the thermochemical radius for
// a polyatomic one.
func (c *Cycle) radius(p Part, cn int) (r float64, used int, from string, err error) {
	if p.Ion.Polyatomic || len(p.Ion.Radii) == 0 {
		if p.Ion.ThermochemicalRadius.Known() {
			kind := "thermochemical radius"
			if !p.Ion.Polyatomic {
				kind = "crystal radius, none in Shannon's table" // data/anion_radii.csv
			}
			return p.Ion.ThermochemicalRadius.V, 0, kind + " (" + p.Ion.ThermochemicalRadius.Source + ")", nil
		}
		return 0, 0, "", fmt.Errorf("no radius for %s in the data", p.Ion.Symbol)
	}
	best := -1
	for i, sr := range p.Ion.Radii {
		if sr.Spin == "LS" {
			continue // high-spin (or spin-free) radii unless only low-spin exist
		}
		if best < 0 || abs(sr.Coordination-cn) < abs(p.Ion.Radii[best].Coordination-cn) {
			best = i
		}
	}
	if best < 0 {
		best = 0
	}
	sr := p.Ion.Radii[best]
	v := sr.Ionic
	if c.Settings.Radius == RadiusCrystal {
		v = sr.Crystal
	}
	if !v.Known() {
		return 0, 0, "", fmt.Errorf("no Shannon %s radius for %s", c.Settings.Radius, p.Ion.Symbol)
	}
	from = "Shannon " + c.Settings.Radius.String() + " radius, CN " + sr.CN
	if sr.Coordination != cn {
		from += " (CN " + strconv.Itoa(cn) + " not tabulated)"
	}
	if sr.Substituted != "" {
		from += " (" + sr.Substituted + ")"
	}
	return v.V, sr.Coordination, from, nil
}

func abs(i int) int {
	if i < 0 {
		return -i
	}
	return i
}

// coordination returns the CNs the radii are taken at: the settings', else
// the structure's, else 6 (for Kapustinskii always 6 unless set).
func (c *Cycle) coordination(structureFree bool) (int, int) {
	cc, ac := 6, 6
	if !structureFree {
		if p := c.Settings.Structure.Prototype; p != "" && c.Settings.Structure.Cell == nil {
			cc, ac = prototypeCN(p)
		}
	}
	if c.Settings.CationCN > 0 {
		cc = c.Settings.CationCN
	}
	if c.Settings.AnionCN > 0 {
		ac = c.Settings.AnionCN
	}
	return cc, ac
}

func (e *evaluator) radiiUncached(in *ModelInputs, structureFree bool) error {
	c := e.c
	cc, ac := c.coordination(structureFree)
	rc, ucc, fc, err := c.radius(c.Cation, cc)
	if err != nil {
		return err
	}
	ra, uac, fa, err := c.radius(c.Anion, ac)
	if err != nil {
		return err
	}
	in.CationRadius, in.AnionRadius, in.CationCN, in.AnionCN = rc, ra, ucc, uac
	in.RadiusFrom = c.Cation.Ion.Symbol + ": " + fc + "; " + c.Anion.Ion.Symbol + ": " + fa
	return nil
}

func (e *evaluator) kapustinskii(in *ModelInputs) (float64, error) {
	c := e.c
	if err := e.radii(in, true); err != nil {
		return 0, err
	}
	in.Nu = c.Cation.Count + c.Anion.Count
	return lattice.Kapustinskii(in.Nu, c.Cation.Ion.Charge, c.Anion.Ion.Charge, in.CationRadius, in.AnionRadius)
}

func (e *evaluator) volumeModel(in *ModelInputs) (float64, error) {
	c := e.c
	vm, from, err := c.molarVolume()
	if err != nil {
		return 0, err
	}
	in.MolarVolume, in.VolumeFrom = vm, from
	est, err := lattice.VolumeBased(vm, c.ionKinds())
	if err != nil {
		return 0, err
	}
	in.IonicStrength = est.IonicStrength
	in.Fit = est.Form.String()
	if est.Form == lattice.Form1999 {
		in.Fit += ", " + est.Fit.Name + " fit α = " + strconv.FormatFloat(est.Fit.Alpha, 'g', -1, 64) + " kJ·nm/mol, β = " +
			strconv.FormatFloat(est.Fit.Beta, 'g', -1, 64) + " kJ/mol"
		if est.Fit.Name == "general" {
			in.Fit += " (no constants for this charge type among the published ones the program has: MX 1:1, MX2 2:1, M2X 1:2; the general fit is used)"
		}
	}
	return est.U, nil
}

// molarVolume returns V_m (nm³) from the cell when there is one with
// measured parameters, else from the density and molar mass.
func (c *Cycle) molarVolume() (float64, string, error) {
	st := c.Settings.Structure
	if st.Cell != nil {
		if err := c.structureFits(st, ModelVolume); err != nil {
			return 0, "", err
		}
		vm, err := lattice.MolarVolumeFromCell(st.Cell.Volume(), st.Cell.FormulaUnits)
		return vm, "cell volume of " + st.Name() + " / Z", err
	}
	if st.Prototype != "" && len(st.Params) > 0 {
		mv, err := c.Memo().Madelung(st, c.Cation, c.Anion, c.Settings.Accuracy)
		if err == nil && mv.FormulaUnits > 0 {
			vm, err := lattice.MolarVolumeFromCell(mv.Volume, mv.FormulaUnits)
			return vm, "cell volume of " + describeStructure(st) + " / Z", err
		}
	}
	if c.Compound.Density.Known() && c.MolarMass > 0 {
		vm, err := lattice.MolarVolumeFromDensity(c.MolarMass, c.Compound.Density.V)
		return vm, fmt.Sprintf("molar mass %.3f g/mol / density %g g/cm³ (%s)", c.MolarMass, c.Compound.Density.V, c.Compound.Density.Source), err
	}
	return 0, "", &ModelError{Model: ModelVolume, Reason: "no cell parameters and no density for " + c.Formula, Remedy: RemedyStructureWithCell}
}

// bornModel evaluates Born–Landé (mayer false) or Born–Mayer (mayer true);
// with actual true, the Madelung constant and d₀ are the chosen structure's
// own (the ewald model).
func (e *evaluator) bornModel(in *ModelInputs, mayer, actual bool) (float64, error) {
	c := e.c
	mad, err := e.madelung(in, actual)
	if err != nil {
		return 0, err
	}
	if err := e.distance(in, actual, mad.NearestDistance); err != nil {
		return 0, err
	}
	pair := lattice.IonPair{Madelung: in.Madelung, ZCation: c.Cation.Ion.Charge, ZAnion: c.Anion.Ion.Charge, R0: in.D0}
	if mayer {
		in.Rho = c.Settings.Rho
		if in.Rho == 0 {
			in.Rho = lattice.DefaultRho
		}
		return lattice.BornMayer(pair, in.Rho)
	}
	n := c.Settings.BornExponent
	in.BornExponentFrom = "set by the user"
	if n == 0 {
		n, err = c.bornExponent()
		if err != nil {
			return 0, &ModelError{Model: ModelBornLande, Reason: "no Pauling Born exponent for " + c.Cation.Ion.Symbol + " with " +
				c.Anion.Ion.Symbol, Remedy: RemedyBornExponent, Err: err}
		}
		in.BornExponentFrom = "mean of Pauling's values over the ions (" + c.Cation.Ion.BornConfig + " ×" + strconv.Itoa(c.Cation.Count) +
			", " + c.Anion.Ion.BornConfig + " ×" + strconv.Itoa(c.Anion.Count) + ")"
	}
	in.BornExponent = n
	return lattice.BornLande(pair, n)
}

// bornExponent is the count-weighted mean of the ions' Pauling exponents:
// from the data's Born-exponent table when the ions carry it, else from
// thermo/lattice's table of configurations.
func (c *Cycle) bornExponent() (float64, error) {
	nc, na := c.Cation.Ion.BornExponent, c.Anion.Ion.BornExponent
	if nc.Known() && na.Known() {
		a, b := float64(c.Cation.Count), float64(c.Anion.Count)
		return (a*nc.V + b*na.V) / (a + b), nil
	}
	var configs []string
	for range c.Cation.Count {
		configs = append(configs, c.Cation.Ion.BornConfig)
	}
	for range c.Anion.Count {
		configs = append(configs, c.Anion.Ion.BornConfig)
	}
	return lattice.BornExponent(configs...)
}

// distance sets in.D0 by the settings: for the textbook models (actual
// false) DistanceAuto means the radii sum; for the ewald model the cell's
// nearest cation–anion distance.
func (e *evaluator) distance(in *ModelInputs, actual bool, geometric float64) error {
	c := e.c
	src := c.Settings.Distance
	if src == DistanceAuto {
		src = DistanceRadii
		if actual {
			src = DistanceGeometry
		}
	}
	switch src {
	case DistanceUser:
		if !(c.Settings.D0 > 0) {
			return &ModelError{Model: "d₀", Reason: "user d₀ must be a positive distance in Å"}
		}
		in.D0, in.D0From = c.Settings.D0, "set by the user"
		return nil
	case DistanceRadii:
		err := e.radii(in, false)
		if err == nil {
			in.D0 = in.CationRadius + in.AnionRadius
			in.D0From = "sum of radii (" + in.RadiusFrom + ")"
			return nil
		}
		if c.Settings.Distance == DistanceRadii {
			return err
		}
		// Automatic choice with a radius missing: fall back to the geometry.
	}
	if geometric > 0 {
		in.D0 = geometric
		in.D0From = "nearest cation–anion distance of " + in.Structure
		return nil
	}
	// A prototype with its default parameters gives the shape only (A);
	// its distance is the template crystal's, not the compound's. Take d₀
	// from the compound's own measured cell, else (automatic choice) from
	// the radii, as the textbook models do.
	shape := ""
	if in.Structure != "" {
		shape = "; " + in.Structure + "'s default cell gives the shape (A) only"
	}
	if d, own, err := e.ownCellDistance(); err != nil {
		return err
	} else if d > 0 {
		in.D0 = d
		in.D0From = "nearest cation–anion distance of " + c.Formula + "'s measured cell, " + own + shape
		return nil
	}
	if c.Settings.Distance == DistanceAuto && actual {
		if err := e.radii(in, false); err != nil {
			return err
		}
		in.D0 = in.CationRadius + in.AnionRadius
		in.D0From = "sum of radii (" + in.RadiusFrom + ")" + shape
		return nil
	}
	return &ModelError{Model: "d₀", Reason: "no measured cell to take d₀ from for " + c.Formula +
		"; choose a structure with parameters or a CIF file, or give d₀ in Å"}
}

// ownCellDistance returns the nearest cation–anion distance of the
// compound's own structure in the data when the data give its parameters
// (0 when they do not), with the structure described.
func (e *evaluator) ownCellDistance() (float64, string, error) {
	c := e.c
	if c.Compound.Structure == "" || len(c.Compound.Params) == 0 {
		return 0, "", nil
	}
	own := Structure{Prototype: c.Compound.Structure, Params: c.Compound.Params, FromData: true}
	mv, err := c.Memo().Madelung(own, c.Cation, c.Anion, c.Settings.Accuracy)
	if err != nil {
		return 0, "", err
	}
	return mv.NearestDistance, describeStructure(own), nil
}

// structureFits refuses a cell read from a file that does not hold the
// compound's ions (see cellFits); a prototype is checked when its ions are
// placed (Memo.Madelung). model names the model refused.
func (c *Cycle) structureFits(st Structure, model string) error {
	if st.Cell == nil {
		return nil
	}
	return cellFits(model, st.Name(), c.Formula, st.Cell, c.Cation, c.Anion)
}

// madelung finds the Madelung constant: the Ewald sum of the chosen
// structure with the compound's ions; with no structure (textbook models
// only) the prototype the radius-ratio rule suggests, with its default
// parameters.
func (e *evaluator) madelungUncached(in *ModelInputs, actual bool) (MadelungValue, error) {
	c := e.c
	st := c.Settings.Structure
	guessed := false
	if st.Empty() {
		if actual {
			return MadelungValue{}, &ModelError{Model: ModelEwald, Reason: "no structure for " + c.Formula, Remedy: RemedyStructure}
		}
		p, why, err := e.ratioRule()
		if err != nil {
			return MadelungValue{}, err
		}
		st = Structure{Prototype: p}
		in.MadelungFrom = why
		guessed = true
	}
	if err := c.structureFits(st, ModelEwald); err != nil {
		return MadelungValue{}, err
	}
	mv, err := c.Memo().Madelung(st, c.Cation, c.Anion, c.Settings.Accuracy)
	if err != nil {
		return MadelungValue{}, err
	}
	in.Madelung = mv.A
	in.Structure = st.Name()
	if !guessed {
		in.MadelungFrom = "Ewald sum (conducting boundary) of " + describeStructure(st)
	} else {
		in.MadelungFrom += "; A by Ewald sum of its default cell"
	}
	if guessed || (st.Cell == nil && len(st.Params) == 0) {
		mv.NearestDistance = 0 // the default cell's distance is not this compound's
	}
	return mv, nil
}

func describeStructure(st Structure) string {
	if st.Cell != nil {
		return st.Name()
	}
	if len(st.Params) == 0 {
		return st.Prototype + " (default parameters)"
	}
	return st.Prototype + " (" + formatParams(st.Params) + ")"
}

func formatParams(p map[string]float64) string {
	keys := make([]string, 0, len(p))
	for k := range p {
		keys = append(keys, k)
	}
	slices.Sort(keys)
	parts := make([]string, len(keys))
	for i, k := range keys {
		parts[i] = k + "=" + strconv.FormatFloat(p[k], 'g', -1, 64)
	}
	return strings.Join(parts, ", ")
}

// ratioRule picks a prototype from the stoichiometry and the radius ratio
// r₊/r₋ (CN VI radii): the radius-ratio rule of Pauling (common practice,
// no source for the exact cut-offs 0.414 and 0.732).
func (e *evaluator) ratioRule() (string, string, error) {
	c := e.c
	a, b := c.Cation.Count, c.Anion.Count
	var in ModelInputs
	ratio := math.NaN()
	if err := e.radii(&in, true); err == nil {
		ratio = in.CationRadius / in.AnionRadius
	}
	pick := ""
	switch {
	case a == 1 && b == 1:
		switch {
		case ratio >= 0.732:
			pick = "caesium-chloride"
		case ratio >= 0.414 || math.IsNaN(ratio):
			pick = "rock-salt"
		default:
			pick = "zinc-blende"
		}
	case a == 1 && b == 2:
		pick = "rutile"
		if ratio >= 0.732 || math.IsNaN(ratio) {
			pick = "fluorite"
		}
	case a == 2 && b == 1:
		pick = "antifluorite"
	case a == 2 && b == 3:
		pick = "corundum"
	}
	if pick == "" {
		return "", "", &ModelError{Model: "Madelung", Reason: fmt.Sprintf("no structure for %s and no prototype fits a %d:%d formula; choose a CIF file", c.Formula, a, b)}
	}
	why := fmt.Sprintf("no structure in the data: %s guessed by the radius-ratio rule", pick)
	if !math.IsNaN(ratio) {
		why += fmt.Sprintf(" (r₊/r₋ = %.3f)", ratio)
	}
	return pick, why, nil
}
