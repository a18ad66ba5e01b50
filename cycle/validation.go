package cycle

import (
	"cmp"
	"fmt"
	"math"
	"slices"
	"strings"

	"enthalpath/data"
	"enthalpath/thermo/lattice"
	"enthalpath/thermo/notation"
)

// The validation families: every compound falls in one, from its ions.
const (
	FamilyAlkaliHalides        = "alkali halides"
	FamilyAlkalineEarthHalides = "alkaline-earth halides"
	FamilyOxides               = "oxides"
	FamilyChalcogenides        = "chalcogenides"
	FamilyD10Halides           = "silver, copper(I) and thallium(I) halides"
	FamilyTransitionHalides    = "transition-metal halides"
	FamilyPolyatomic           = "salts of polyatomic ions"
	FamilyOther                = "other salts"
)

// ValidationFamilies lists the families in report order.
func ValidationFamilies() []string {
	return []string{FamilyAlkaliHalides, FamilyAlkalineEarthHalides, FamilyOxides, FamilyChalcogenides,
		FamilyD10Halides, FamilyTransitionHalides, FamilyPolyatomic, FamilyOther}
}

// IonicFamily is the family whose scatter sets each model's σ and the
// verdict's thresholds: the alkali halides, the textbook ionic solids.
const IonicFamily = FamilyAlkaliHalides

// Verdict thresholds in multiples of the reference model's σ over the
// ionic family: some covalent character beyond 3σ (a gap the ionic scatter
// reaches by chance about once in 300 if it were normal), substantial
// beyond 6σ (our choice, no source).
const (
	AdequateSigmas    = 3.0
	SubstantialSigmas = 6.0
)

// minFamily is the fewest compounds a family needs for its own statistics
// to stand for a model's σ or to pick the best-validated model.
const minFamily = 5

// ValidationFamily returns the family of c by its ions.
func ValidationFamily(c *Cycle) string {
	cat, an := c.Cation.Ion, c.Anion.Ion
	if cat.Polyatomic || an.Polyatomic {
		return FamilyPolyatomic
	}
	z := notation.AtomicNumber(cat.Core)
	switch an.Core {
	case "F", "Cl", "Br", "I":
		switch {
		case isAlkali(z):
			return FamilyAlkaliHalides
		case isAlkalineEarth(z):
			return FamilyAlkalineEarthHalides
		case cat.Charge == 1 && (cat.Core == "Ag" || cat.Core == "Cu" || cat.Core == "Tl" || cat.Core == "Au"):
			return FamilyD10Halides
		case isTransition(z):
			return FamilyTransitionHalides
		}
	case "O":
		if an.Charge == -2 {
			return FamilyOxides
		}
	case "S", "Se", "Te":
		return FamilyChalcogenides
	}
	return FamilyOther
}

func isAlkali(z int) bool { return slices.Contains([]int{3, 11, 19, 37, 55, 87}, z) }

func isAlkalineEarth(z int) bool { return slices.Contains([]int{4, 12, 20, 38, 56, 88}, z) }

func isTransition(z int) bool {
	return (z >= 21 && z <= 30) || (z >= 39 && z <= 48) || z == 57 || (z >= 72 && z <= 80)
}

// FamilyStats are one model's gaps over one family: 100·(cycle −
// model)/|model| averaged (MeanPercent, negative when the cycle binds more)
// and as root mean square, over N compounds; the largest |gap| is Worst's.
type FamilyStats struct {
	Family                              string
	N                                   int
	MeanPercent, RMSPercent, MaxPercent float64
	Worst                               string
}

// NotEvaluated is a compound left out, with the reason.
type NotEvaluated struct {
	Formula, Reason string
}

// ModelValidation is one model over the built-in compounds.
type ModelValidation struct {
	Model    string
	Families []FamilyStats // in ValidationFamilies order
	All      FamilyStats
	// NotEvaluated lists the compounds whose cycle closes but the model
	// cannot evaluate.
	NotEvaluated []NotEvaluated
}

// Family returns the stats of one family.
func (m *ModelValidation) Family(name string) FamilyStats {
	for _, f := range m.Families {
		if f.Family == name {
			return f
		}
	}
	return FamilyStats{Family: name}
}

// Validation is every model against the cycles of the built-in compounds
// that close, in the default conventions and settings: how far each model
// can be trusted, by family.
type Validation struct {
	// Compounds is how many compounds' cycles close; NotClosed the others.
	Compounds int
	NotClosed []NotEvaluated
	// Molecular are the built-in compounds known to be molecular (CO2(g),
	// TiCl4(l) …), left out: the models describe ionic solids, and a
	// molecule's "gap" would measure nothing but that it is no salt.
	Molecular []string
	Models    []ModelValidation
	// Builtin is true when the validation was read from the built-in
	// calibration (data/tables/model_calibration.csv) rather than computed:
	// it then has the statistics but no lists of compounds left out.
	Builtin bool
	// note ends every σ's and threshold's basis (overlayNote).
	note string
	// thresholds and sigmas are Thresholds and Sigma of every model (and
	// family), worded once by Validate.
	thresholds map[string]thresholdEntry
	sigmas     map[[2]string]sigmaEntry
	// whys are Reference's whys, worded once by index; rmsOrder byRMS's
	// answers by family.
	whys     map[whyKey]string
	rmsOrder map[string][]int
}

// Model returns one model's validation (nil for an unknown name).
func (v *Validation) Model(name string) *ModelValidation {
	for i := range v.Models {
		if v.Models[i].Model == name {
			return &v.Models[i]
		}
	}
	return nil
}

// Sigma returns the model's relative σ for a compound of family: the RMS
// gap over that family when it has at least five compounds, else over the
// ionic family (0 when the model was never evaluated there), and what it
// was computed over.
func (v *Validation) Sigma(model, family string) (float64, string) {
	if e, ok := v.sigmas[[2]string{model, family}]; ok {
		return e.rel, e.basis
	}
	return v.sigma(model, family)
}

func (v *Validation) sigma(model, family string) (float64, string) {
	f := v.SigmaStats(model, family)
	if f.N == 0 {
		return 0, ""
	}
	return f.RMSPercent / 100, fmt.Sprintf("RMS gap of the %s model over %d built-in %s (mean %+.1f %%, largest %.1f %% for %s; validation of the built-in data%s)",
		model, f.N, f.Family, f.MeanPercent, f.MaxPercent, f.Worst, v.note)
}

// SigmaStats returns the family statistics Sigma takes the model's σ from:
// the family's when it has at least five compounds, else the ionic
// family's (N = 0 when the model was evaluated for neither).
func (v *Validation) SigmaStats(model, family string) FamilyStats {
	m := v.Model(model)
	if m == nil {
		return FamilyStats{Family: family}
	}
	if f := m.Family(family); f.N >= minFamily {
		return f
	}
	return m.Family(IonicFamily)
}

// Thresholds returns the verdict's thresholds for a model: 3σ and 6σ of
// its RMS gap over the ionic family, with their basis in words. A model
// never evaluated there keeps lattice.DefaultThresholds.
func (v *Validation) Thresholds(model string) (lattice.Thresholds, string) {
	if e, ok := v.thresholds[model]; ok {
		return e.th, e.basis
	}
	return v.thresholdsOf(model)
}

func (v *Validation) thresholdsOf(model string) (lattice.Thresholds, string) {
	m := v.Model(model)
	if m == nil || m.Family(IonicFamily).N == 0 || !(m.Family(IonicFamily).RMSPercent > 0) {
		return lattice.DefaultThresholds(), lattice.VerdictBasis
	}
	f := m.Family(IonicFamily)
	th := lattice.Thresholds{Adequate: AdequateSigmas * f.RMSPercent, Substantial: SubstantialSigmas * f.RMSPercent}
	return th, fmt.Sprintf("thresholds %.1f %% and %.1f %% of |model| (%g σ and %g σ; σ = %.2f %%, the %s model's RMS gap over %d built-in %s%s)",
		th.Adequate, th.Substantial, AdequateSigmas, SubstantialSigmas, f.RMSPercent, model, f.N, IonicFamily, v.note)
}

// ValidatingFamilies are the families whose salts are taken as ionic, so
// that a model's fit to them may choose the model their verdicts are read
// against: the alkali and alkaline-earth halides and the oxides. The other
// families (chalcogenides, silver, copper(I) and thallium(I) halides,
// transition-metal halides, salts of polyatomic ions, other salts) hold
// the salts whose covalent character is in question: a model picked for
// fitting them best would have absorbed the very covalency the verdict is
// to detect (Kapustinskii fits the transition-metal halides best and read
// NiCl₂ as ionic). Our choice, no source.
func ValidatingFamilies() []string {
	return []string{FamilyAlkaliHalides, FamilyAlkalineEarthHalides, FamilyOxides}
}

// Reference picks the model the verdict of a compound of family is read
// against, among those evaluated (ok): the extended model where it could be
// evaluated; else, for a validating family (ValidatingFamilies), the model
// with the smallest RMS gap over that family (at least five compounds);
// else the model with the smallest RMS gap over the ionic family, whose
// scatter also sets the thresholds. It returns the model and why, the why
// naming what the model is judged against and how it fares on the
// compound's own family.
func (v *Validation) Reference(family string, ok func(model string) bool) (string, string) {
	if ok(ModelExtended) {
		return ModelExtended, "the extended model evaluates here"
	}
	// The model of smallest RMS gap over fam (the first in v.Models among
	// equals) that can be evaluated: the models in order of that RMS, the
	// first that ok accepts, so that ok (which may evaluate the model) is
	// asked as little as possible.
	pick := func(fam string, least int) string {
		for _, i := range v.byRMS(fam) {
			if v.Models[i].Family(fam).N >= max(least, 1) && ok(v.Models[i].Model) {
				return v.Models[i].Model
			}
		}
		return ""
	}
	if slices.Contains(ValidatingFamilies(), family) {
		if best := pick(family, minFamily); best != "" {
			return best, v.referenceWhy(best, family, true)
		}
	}
	best := pick(IonicFamily, 1)
	if best == "" {
		return "", "no model could be evaluated"
	}
	return best, v.referenceWhy(best, family, false)
}

// byRMS returns the indices in v.Models of the models with a finite RMS gap
// over fam, smallest first (stable: v.Models order among equals), from
// index's table when it has the family.
func (v *Validation) byRMS(fam string) []int {
	if order, ok := v.rmsOrder[fam]; ok {
		return order
	}
	var order []int
	for i := range v.Models {
		if r := v.Models[i].Family(fam).RMSPercent; r < math.Inf(1) {
			order = append(order, i)
		}
	}
	slices.SortStableFunc(order, func(i, j int) int {
		return cmp.Compare(v.Models[i].Family(fam).RMSPercent, v.Models[j].Family(fam).RMSPercent)
	})
	return order
}

// whyKey names a why of Reference: the model picked, the compound's family
// and whether the model was picked over that family (else the ionic one).
type whyKey struct {
	model, family string
	own           bool
}

// referenceWhy is Reference's why for best, worded once by index.
func (v *Validation) referenceWhy(best, family string, own bool) string {
	if w, ok := v.whys[whyKey{best, family, own}]; ok {
		return w
	}
	return v.referenceWhyOf(best, family, own)
}

func (v *Validation) referenceWhyOf(best, family string, own bool) string {
	m := v.Model(best)
	over := IonicFamily
	if own {
		over = family
	}
	f := m.Family(over)
	why := fmt.Sprintf("the extended model cannot be evaluated here; %s has the smallest RMS gap (%.1f %%) over %d built-in %s", best, f.RMSPercent, f.N, over)
	if !own && family != IonicFamily && !slices.Contains(ValidatingFamilies(), family) {
		why += "; " + family + " do not choose their own model (their covalent character is what is asked)"
		if own := m.Family(family); own.N > 0 {
			why += fmt.Sprintf("; over %d built-in %s it is off by %s on average (RMS %.1f %%)", own.N, family, strings.Replace(fmt.Sprintf("%+.1f %%", own.MeanPercent), "-", "−", 1), own.RMSPercent)
		}
	}
	return why
}

// Validate evaluates every model for every compound of db whose cycle
// closes, in the default conventions, with memo for the Ewald sums.
func Validate(db *data.DB, memo *Memo) *Validation {
	return ValidateWithDispersion(db, memo, DispersionInCrystal)
}

// ValidateWithDispersion is Validate with the extended model's dispersion
// set d (the built-in calibration is Validate's, the default set's).
func ValidateWithDispersion(db *data.DB, memo *Memo, d DispersionSet) *Validation {
	v := &Validation{}
	families := ValidationFamilies()
	type acc struct {
		n                  int
		sum, sumSq, absMax float64
		worst              string
	}
	accs := make(map[string][]acc, len(ModelNames()))
	notEval := map[string][]NotEvaluated{}
	for _, name := range ModelNames() {
		accs[name] = make([]acc, len(families)+1) // the last one is "all"
	}
	for _, comp := range db.Compounds() {
		if comp.Molecular {
			v.Molecular = append(v.Molecular, comp.Formula)
			continue
		}
		c, err := Build(db, comp.Formula, Options{Memo: memo})
		if err != nil {
			v.NotClosed = append(v.NotClosed, NotEvaluated{comp.Formula, err.Error()})
			continue
		}
		c.db = nil // the verdicts of this inner solve need no validation
		c.Settings.Dispersion = d
		r, err := Solve(c)
		if err != nil {
			v.NotClosed = append(v.NotClosed, NotEvaluated{comp.Formula, err.Error()})
			continue
		}
		v.Compounds++
		cyc := r.Lattice.In(c.Conventions.Lattice)
		fi := slices.Index(families, ValidationFamily(c))
		for _, m := range r.Models {
			name := m.Model
			if m.Err != nil {
				notEval[name] = append(notEval[name], NotEvaluated{comp.Formula, m.Err.Error()})
				continue
			}
			g := 100 * (cyc - m.Value) / math.Abs(m.Value)
			for _, k := range []int{fi, len(families)} {
				a := &accs[name][k]
				a.n++
				a.sum += g
				a.sumSq += g * g
				if math.Abs(g) > a.absMax {
					a.absMax, a.worst = math.Abs(g), comp.Formula
				}
			}
		}
	}
	stats := func(fam string, a acc) FamilyStats {
		s := FamilyStats{Family: fam, N: a.n}
		if a.n > 0 {
			s.MeanPercent, s.RMSPercent, s.MaxPercent, s.Worst = a.sum/float64(a.n), math.Sqrt(a.sumSq/float64(a.n)), a.absMax, a.worst
		}
		return s
	}
	for _, name := range ModelNames() {
		mv := ModelValidation{Model: name, NotEvaluated: notEval[name], All: stats("all", accs[name][len(families)])}
		for i, fam := range families {
			mv.Families = append(mv.Families, stats(fam, accs[name][i]))
		}
		v.Models = append(v.Models, mv)
	}
	v.index()
	return v
}

// index words every model's thresholds and σ once, so that a Solve reads
// them instead of formatting them anew.
func (v *Validation) index() {
	v.thresholds = map[string]thresholdEntry{}
	v.sigmas = map[[2]string]sigmaEntry{}
	v.whys = map[whyKey]string{}
	v.rmsOrder = map[string][]int{}
	for _, fam := range ValidationFamilies() {
		v.rmsOrder[fam] = v.byRMS(fam)
	}
	for _, m := range v.Models {
		for _, fam := range append(ValidationFamilies(), IonicFamily) {
			for _, own := range []bool{false, true} {
				k := whyKey{m.Model, fam, own}
				v.whys[k] = v.referenceWhyOf(k.model, k.family, k.own)
			}
		}
		th, basis := v.thresholdsOf(m.Model)
		v.thresholds[m.Model] = thresholdEntry{th, basis}
		for _, fam := range ValidationFamilies() {
			rel, basis := v.sigma(m.Model, fam)
			v.sigmas[[2]string{m.Model, fam}] = sigmaEntry{rel, basis}
		}
	}
}

type thresholdEntry struct {
	th    lattice.Thresholds
	basis string
}

type sigmaEntry struct {
	rel   float64
	basis string
}

// validationKey is the key of the models' validation among the values
// derived from a data set (data.DB.Computed).
const validationKey = "cycle.Validation"

// Validation returns the validation of the models over the compounds of
// c's data, computed once per data set (nil for a cycle built without
// data).
func (c *Cycle) Validation() *Validation {
	if c.db == nil {
		return nil
	}
	return c.Memo().Validation(c.db)
}

// Validation returns the validation of the models for db, once per data
// set: the built-in calibration for the built-in data, with or without
// overlays (data.DB.Calibrated; an overlay's σ and thresholds say they are
// the built-in data's), else Validate(db, m) (the first caller's memo does
// the Ewald sums).
func (m *Memo) Validation(db *data.DB) *Validation {
	m.mu.Lock()
	if m.validationOf == db && m.validation != nil {
		v := m.validation
		m.mu.Unlock()
		return v
	}
	m.mu.Unlock()
	v := db.Computed(validationKey, func() any {
		if db.Calibrated() {
			if cal, err := data.ModelCalibration(); err == nil {
				if v, err := validationOf(cal, overlayNote(db.Overlays())); err == nil {
					return v
				}
			}
		}
		return Validate(db, m)
	}).(*Validation)
	m.mu.Lock()
	m.validationOf, m.validation = db, v
	m.mu.Unlock()
	return v
}
