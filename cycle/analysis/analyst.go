package analysis

import (
	"fmt"
	"math"
	"sync"

	"enthalpath/cycle"
	"enthalpath/data"
	"enthalpath/thermo/entropy"
)

// Analyst runs the analyses over one data set. Make one with New and share
// it: it is safe for concurrent use.
type Analyst struct {
	db        *data.DB
	memo      *cycle.Memo
	standards Standards

	additiveOnce sync.Once
	additiveFit  *entropy.Additive
	additiveErr  error

	saltsOnce sync.Once
	saltsOf   map[string][]data.Compound // ion symbol → its compounds (ionfit.go)

	volumesOnce sync.Once
	volumes     *IonVolumes // ionvolume.go
	volumesErr  error

	mu      sync.Mutex
	spreads map[string]spreadEntry
	built   map[string]builtEntry
	radii   map[ionKey]radiusEntry
	symbols map[chargeKey]string // ionSymbol's answers
	// familySpreads are spreadFor's answers by model and family.
	familySpreads map[[2]string]Spread
}

// chargeKey names an ion by its core and charge (ionSymbol's memo).
type chargeKey struct {
	core   string
	charge int
}

// ionKey names an ion in the radius memo.
type ionKey struct {
	symbol, core string
	charge       int
	polyatomic   bool
}

type radiusEntry struct {
	r   Radius
	err error
}

// ionRadius is IonRadius remembered per ion (the neighbour rule looks at
// every element).
func (a *Analyst) ionRadius(ion data.Ion) (Radius, error) {
	key := ionKey{ion.Symbol, ion.Core, ion.Charge, ion.Polyatomic}
	a.mu.Lock()
	e, ok := a.radii[key]
	a.mu.Unlock()
	if ok {
		return e.r, e.err
	}
	r, err := IonRadius(a.db, ion)
	a.mu.Lock()
	if len(a.radii) >= maxBuilt {
		clear(a.radii)
	}
	a.radii[key] = radiusEntry{r, err}
	a.mu.Unlock()
	return r, err
}

type builtEntry struct {
	c   *cycle.Cycle
	err error
}

// maxBuilt bounds the remembered cycles; when full the memory is emptied.
const maxBuilt = 1024

// build returns a fresh copy of the cycle of formula with the given ions,
// built once per Analyst: a data lookup of a formula the data do not have
// is far slower than copying the cycle built the first time.
func (a *Analyst) build(formula, cation, anion string) (*cycle.Cycle, error) {
	return a.buildInto(formula, cation, anion, nil)
}

// buildInto is build copying the cycle into into's storage when into is
// not nil (see cycle.Cycle.CloneInto): a batch worker's one scratch cycle.
func (a *Analyst) buildInto(formula, cation, anion string, into *cycle.Cycle) (*cycle.Cycle, error) {
	key := formula + "|" + cation + "|" + anion
	a.mu.Lock()
	e, ok := a.built[key]
	a.mu.Unlock()
	if !ok {
		c, err := cycle.Build(a.db, formula, cycle.Options{Cation: cation, Anion: anion, Memo: a.memo})
		e = builtEntry{c, err}
		a.mu.Lock()
		if len(a.built) >= maxBuilt {
			clear(a.built)
		}
		a.built[key] = e
		a.mu.Unlock()
	}
	if e.err != nil {
		return nil, e.err
	}
	if into == nil {
		return e.c.Clone(), nil
	}
	return e.c.CloneInto(into), nil
}

type spreadEntry struct {
	s   Spread
	err error
}

// Option changes how New makes an Analyst.
type Option func(*Analyst)

// WithStandards makes the Analyst read measured standard data (ΔfH°, ΔfG°,
// S° of compounds, gases and elements) from s instead of from the data set.
func WithStandards(s Standards) Option { return func(a *Analyst) { a.standards = s } }

// New returns an Analyst over db (which it only reads).
func New(db *data.DB, opts ...Option) *Analyst {
	a := &Analyst{db: db, memo: cycle.NewMemo(), standards: dbStandards{db}, spreads: map[string]spreadEntry{}, built: map[string]builtEntry{}, radii: map[ionKey]radiusEntry{}, symbols: map[chargeKey]string{}, familySpreads: map[[2]string]Spread{}}
	for _, o := range opts {
		o(a)
	}
	return a
}

// DB returns the data the Analyst reads.
func (a *Analyst) DB() *data.DB { return a.db }

// Memo returns the Madelung memo the Analyst's cycles share.
func (a *Analyst) Memo() *cycle.Memo { return a.memo }

// SpreadFamilies are the compound families over which Spread measures a
// model against the cycle: the salts for which the ionic models were made.
func SpreadFamilies() []string { return []string{"alkali halide", "alkaline-earth halide"} }

// Spread is how far one lattice model strays from the Born–Haber cycle over
// a set of built-in salts: for an estimate, the model's validation over the
// compound's family (cycle.Validation, Family set); for ModelSpread, the
// alkali and alkaline-earth halides.
type Spread struct {
	// Model is the model name (cycle.ModelNames).
	Model string
	// Family is the validation family an estimate's spread is over ("" for
	// ModelSpread's halides).
	Family string
	// Compounds is how many salts entered; Skipped lists those the model or
	// the cycle could not evaluate, with the reason.
	Compounds int
	Skipped   []string
	// MeanPercent is the mean of 100·(cycle − model)/|model| (negative when
	// the cycle binds more), RMSPercent its root mean square and
	// MaxPercent the largest |gap| %, reached for Worst.
	MeanPercent, RMSPercent, MaxPercent float64
	Worst                               string

	basis string // Basis, worded once
}

// Relative returns the model's relative standard uncertainty (RMS/100).
func (s Spread) Relative() float64 { return s.RMSPercent / 100 }

// Basis describes the spread in words, for output.
func (s Spread) Basis() string {
	if s.basis != "" {
		return s.basis
	}
	over := "alkali and alkaline-earth halides"
	if s.Family != "" {
		over = s.Family
	}
	return fmt.Sprintf("%s model σ = %.1f %% of its value: RMS gap to the cycle over %d built-in %s (mean %+.1f %%, largest %.1f %% for %s), computed from the data",
		s.Model, s.RMSPercent, s.Compounds, over, s.MeanPercent, s.MaxPercent, s.Worst)
}

// spreadOf returns the spread an estimate of c with model takes its σ
// from: the model's validation over c's family, or over the ionic family
// (cycle.Validation.SigmaStats), the σ the cycle's own model results carry.
func spreadOf(c *cycle.Cycle, model string) Spread {
	v := c.Validation()
	if v == nil {
		return Spread{Model: model}
	}
	f := v.SigmaStats(model, cycle.ValidationFamily(c))
	return Spread{Model: model, Family: f.Family, Compounds: f.N, MeanPercent: f.MeanPercent, RMSPercent: f.RMSPercent,
		MaxPercent: f.MaxPercent, Worst: f.Worst}
}

// spreadFor is spreadOf with its basis worded, once per Analyst, model and
// family: the validation c reads is the Analyst's data's (c is built from
// them), so the spread depends on nothing else.
func (a *Analyst) spreadFor(c *cycle.Cycle, model string) Spread {
	key := [2]string{model, cycle.ValidationFamily(c)}
	a.mu.Lock()
	s, ok := a.familySpreads[key]
	a.mu.Unlock()
	if ok {
		return s
	}
	s = spreadOf(c, model)
	s.basis = s.Basis()
	a.mu.Lock()
	a.familySpreads[key] = s // bounded: models × families
	a.mu.Unlock()
	return s
}

// ModelSpread computes (once per Analyst and model, then remembers) the
// Spread of model with the same options an estimate uses by default.
func (a *Analyst) ModelSpread(model string) (Spread, error) {
	a.mu.Lock()
	e, ok := a.spreads[model]
	a.mu.Unlock()
	if ok {
		return e.s, e.err
	}
	s, err := a.computeSpread(model)
	s.basis = s.Basis() // once, not on every estimate
	a.mu.Lock()
	a.spreads[model] = spreadEntry{s, err}
	a.mu.Unlock()
	return s, err
}

func (a *Analyst) computeSpread(model string) (Spread, error) {
	if _, err := cycle.ParseModel(model); err != nil {
		return Spread{}, err
	}
	s := Spread{Model: model}
	var sum, sumSq float64
	for comp := range a.db.CompoundsIn(SpreadFamilies()...) {
		if !comp.Formation.Known() {
			continue
		}
		c, err := cycle.Build(a.db, comp.Formula, cycle.Options{Memo: a.memo})
		if err != nil {
			s.Skipped = append(s.Skipped, comp.Formula+": "+err.Error())
			continue
		}
		// c is this loop's own: close its lattice step in place (no copy).
		cyc, _, err := closeLattice(c)
		if err != nil {
			s.Skipped = append(s.Skipped, comp.Formula+": "+err.Error())
			continue
		}
		m, err := cycle.EvaluateModel(c, model)
		if err != nil {
			s.Skipped = append(s.Skipped, comp.Formula+": "+err.Error())
			continue
		}
		g := 100 * (cyc - m.Value) / math.Abs(m.Value)
		sum += g
		sumSq += g * g
		s.Compounds++
		if math.Abs(g) > s.MaxPercent {
			s.MaxPercent, s.Worst = math.Abs(g), comp.Formula
		}
	}
	if s.Compounds < 3 {
		return s, &InputError{Subject: model, Reason: fmt.Sprintf("only %d built-in halides can be evaluated with this model, too few to measure its spread", s.Compounds)}
	}
	n := float64(s.Compounds)
	s.MeanPercent = sum / n
	s.RMSPercent = math.Sqrt(sumSq / n)
	return s, nil
}

// cycleLattice returns the lattice step of c (negative, in c's lattice
// convention) closed by Hess's law over the other steps, and its σ, without
// evaluating any model. Every other step must have a value.
func cycleLattice(c *cycle.Cycle) (float64, float64, error) {
	return closeLattice(c.Clone())
}

// closeLattice is cycleLattice on w itself: it makes the lattice step w's
// only unknown (which a cycle fresh from cycle.Build already has).
func closeLattice(w *cycle.Cycle) (float64, float64, error) {
	if err := w.SolveFor("lattice"); err != nil {
		return 0, 0, err
	}
	if err := missingStep(w); err != nil {
		return 0, 0, err
	}
	r, u := cycle.Residual(w)
	// Σ sign·m·base over the other steps plus the lattice step's base is
	// zero; under LatticeEnergy the step is shifted from its base by the
	// Jenkins correction.
	v := -r
	if w.Conventions.Lattice == cycle.LatticeEnergy {
		v += w.LatticeCorrection()
	}
	return v, u, nil
}

// missingStep returns a *cycle.MissingError for the first step without a
// value that Hess's sum needs (a composite's sub-steps stand for it).
func missingStep(c *cycle.Cycle) error {
	for i := range c.Steps {
		s := &c.Steps[i]
		if !s.Missing() {
			continue
		}
		if s.Parent != "" {
			if p, ok := c.Step(s.Parent); ok && p.Source.Kind != cycle.SourceSum {
				continue // the parent's own value stands for its sub-steps
			}
		}
		return c.MissingDatum(s)
	}
	return nil
}
