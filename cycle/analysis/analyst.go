package analysis

import (
	"fmt"
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

	mu    sync.Mutex
	built map[string]builtEntry
	radii map[string]radiusEntry
}

type radiusEntry struct {
	r   Radius
	err error
}

// ionRadius is IonRadius remembered per ion (the neighbour rule looks at
// every element).
func (a *Analyst) ionRadius(ion data.Ion) (Radius, error) {
	key := fmt.Sprintf("%s|%s|%d|%v", ion.Symbol, ion.Core, ion.Charge, ion.Polyatomic)
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
	return e.c.Clone(), nil
}

// Option changes how New makes an Analyst.
type Option func(*Analyst)

// WithStandards makes the Analyst read measured standard data (ΔfH°, ΔfG°,
// S° of compounds, gases and elements) from s instead of from the data set.
func WithStandards(s Standards) Option { return func(a *Analyst) { a.standards = s } }

// New returns an Analyst over db (which it only reads).
func New(db *data.DB, opts ...Option) *Analyst {
	a := &Analyst{db: db, memo: cycle.NewMemo(), standards: dbStandards{db}, built: map[string]builtEntry{}, radii: map[string]radiusEntry{}}
	for _, o := range opts {
		o(a)
	}
	return a
}

// DB returns the data the Analyst reads.
func (a *Analyst) DB() *data.DB { return a.db }

// Memo returns the Madelung memo the Analyst's cycles share.
func (a *Analyst) Memo() *cycle.Memo { return a.memo }

// Spread is how far one lattice model strays from the Born–Haber cycle over
// one family of the built-in compounds (cycle.Validation): the basis of the
// model uncertainty of an estimate.
type Spread struct {
	// Model is the model name (cycle.ModelNames).
	Model string
	// Family is the validation family the spread is over and Compounds how
	// many of its compounds entered.
	Family    string
	Compounds int
	// MeanPercent is the mean of 100·(cycle − model)/|model| (negative when
	// the cycle binds more), RMSPercent its root mean square and
	// MaxPercent the largest |gap| %, reached for Worst.
	MeanPercent, RMSPercent, MaxPercent float64
	Worst                               string
}

// Relative returns the model's relative standard uncertainty (RMS/100).
func (s Spread) Relative() float64 { return s.RMSPercent / 100 }

// Basis describes the spread in words, for output.
func (s Spread) Basis() string {
	return fmt.Sprintf("%s model σ = %.1f %% of its value: RMS gap to the cycle over %d built-in %s (mean %+.1f %%, largest %.1f %% for %s; validation of the built-in data)",
		s.Model, s.RMSPercent, s.Compounds, s.Family, s.MeanPercent, s.MaxPercent, s.Worst)
}

// spreadOf returns the spread model's σ for c is taken from: its
// validation over c's family, or over the ionic family (cycle.Validation.SigmaStats).
func spreadOf(c *cycle.Cycle, model string) Spread {
	v := c.Validation()
	if v == nil {
		return Spread{Model: model}
	}
	return spreadFrom(v.SigmaStats(model, cycle.ValidationFamily(c)), model)
}

func spreadFrom(f cycle.FamilyStats, model string) Spread {
	return Spread{Model: model, Family: f.Family, Compounds: f.N, MeanPercent: f.MeanPercent, RMSPercent: f.RMSPercent,
		MaxPercent: f.MaxPercent, Worst: f.Worst}
}

// ModelSpread returns the model's spread over the ionic family (the alkali
// halides) from the validation of the Analyst's data.
func (a *Analyst) ModelSpread(model string) (Spread, error) {
	if _, err := cycle.ParseModel(model); err != nil {
		return Spread{}, err
	}
	v := a.memo.Validation(a.db)
	s := spreadFrom(v.SigmaStats(model, cycle.IonicFamily), model)
	if s.Compounds < 3 {
		return s, &InputError{Subject: model, Reason: fmt.Sprintf("only %d built-in %s can be evaluated with this model, too few to measure its spread", s.Compounds, cycle.IonicFamily)}
	}
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
		return &cycle.MissingError{Key: s.Key, What: s.Label}
	}
	return nil
}
