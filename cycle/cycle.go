package cycle

import (
	"maps"
	"math"
	"slices"

	"enthalpath/data"
)

// Part is one kind of ion in the compound with its count per formula unit.
type Part struct {
	// Ion is the data record (symbol, core, charge, shape, radii …).
	Ion data.Ion
	// Count is the number of these ions per formula unit.
	Count int
	// StandardState is the core element's standard state ("Na(s)",
	// "Cl2(g)") for a monatomic ion; for a polyatomic ion the elements'
	// states joined as in its formation reaction.
	StandardState string
}

// Charge returns the ion's signed charge.
func (p Part) Charge() int { return p.Ion.Charge }

// Cycle is the Born–Haber cycle of one compound: its steps, the compound's
// data and the settings. Copying the struct shares its slices; use Clone
// for an independent copy.
type Cycle struct {
	// Formula is the compound's formula as tabulated or as given.
	Formula string
	// Name and Family come from the data ("" for a formula not tabulated).
	Name, Family string
	// Tabulated is true when the compound is a row of the data.
	Tabulated bool
	// Cation and Anion are the compound's ions.
	Cation, Anion Part
	// Compound is the data row (zero when not Tabulated): structure,
	// parameters, density, handbook lattice energy.
	Compound data.Compound
	// MolarMass is the formula's molar mass in g/mol (0 when unknown).
	MolarMass float64
	// Steps in cycle order.
	Steps []Step
	// Conventions the step values are in. Read it freely; change it only
	// with SetConventions, which converts the values.
	Conventions Conventions
	// Settings for the models and output; change them freely.
	Settings Settings
	// Note is free text saved with the cycle file.
	Note string
	// AnionValue is the choice in force for a multiply charged monatomic
	// anion's value (AnionFitted or AnionTextbook), "" when the anion has
	// no such choice. Fitted holds the family-fitted ion values the cycle
	// uses (read only).
	AnionValue AnionValue
	Fitted     []data.DerivedIon

	memo *Memo
	// refs holds the steps' copies of their references (CloneInto).
	refs []Entry
	// db is the data the cycle was built from (for the validation of the
	// models); nil for a cycle read from a file.
	db *data.DB
}

// Clone returns a deep copy of c that shares only the Madelung memo and the
// ions' tables of Shannon radii, which nothing changes in place (they are
// replaced whole; their capacity is clipped so that an append copies).
func (c *Cycle) Clone() *Cycle {
	return c.CloneInto(new(Cycle))
}

// CloneInto makes d the deep copy of c that Clone returns, reusing d's
// storage (its steps, their references and parameter maps) so that a
// worker filling many cycles one after the other allocates little; it
// returns d. Whatever pointed into d before (its steps' references, its
// parameter maps) now sees the copy of c: pass only a cycle nothing else
// holds.
func (c *Cycle) CloneInto(d *Cycle) *Cycle {
	steps, refs := d.Steps[:0], d.refs[:0]
	params, stParams := d.Compound.Params, d.Settings.Structure.Params
	*d = *c
	d.Steps = append(steps, c.Steps...)
	if d.Steps == nil && c.Steps != nil {
		d.Steps = []Step{}
	}
	n := 0
	for i := range d.Steps {
		if d.Steps[i].Reference != nil {
			n++
		}
	}
	refs = slices.Grow(refs, n) // one allocation for every step's copy
	for i := range d.Steps {
		if r := d.Steps[i].Reference; r != nil {
			refs = append(refs, *r)
			d.Steps[i].Reference = &refs[len(refs)-1]
		}
	}
	d.refs = refs
	d.Cation.Ion.Radii = slices.Clip(c.Cation.Ion.Radii)
	d.Anion.Ion.Radii = slices.Clip(c.Anion.Ion.Radii)
	d.Compound.Params = cloneInto(params, c.Compound.Params)
	d.Settings.Structure = c.Settings.Structure.cloneInto(stParams)
	return d
}

// cloneInto returns a copy of src in dst's storage (nil for a nil src, as
// maps.Clone gives).
func cloneInto[K comparable, V any](dst, src map[K]V) map[K]V {
	if src == nil {
		return nil
	}
	if dst == nil {
		return maps.Clone(src)
	}
	clear(dst)
	maps.Copy(dst, src)
	return dst
}

// Memo returns the Madelung memo the cycle uses (never nil after Build).
func (c *Cycle) Memo() *Memo {
	if c.memo == nil {
		c.memo = NewMemo()
	}
	return c.memo
}

// SetMemo makes the cycle use m (for example one memo for many cycles).
func (c *Cycle) SetMemo(m *Memo) { c.memo = m }

// Keys returns the step keys in order.
func (c *Cycle) Keys() []string {
	keys := make([]string, len(c.Steps))
	for i := range c.Steps {
		keys[i] = c.Steps[i].Key
	}
	return keys
}

func (c *Cycle) index(key string) (int, error) {
	for i := range c.Steps {
		if c.Steps[i].Key == key {
			return i, nil
		}
	}
	return -1, &StepError{Key: key, Valid: c.Keys()}
}

// Step returns a pointer to the step with key, and whether there is one.
func (c *Cycle) Step(key string) (*Step, bool) {
	i, err := c.index(key)
	if err != nil {
		return nil, false
	}
	return &c.Steps[i], true
}

// SubSteps returns the keys of the sub-steps of the composite step key.
func (c *Cycle) SubSteps(key string) []string {
	var out []string
	for i := range c.Steps {
		if c.Steps[i].Parent == key {
			out = append(out, c.Steps[i].Key)
		}
	}
	return out
}

// Unknowns returns the keys of the steps marked unknown.
func (c *Cycle) Unknowns() []string {
	var out []string
	for i := range c.Steps {
		if c.Steps[i].Unknown {
			out = append(out, c.Steps[i].Key)
		}
	}
	return out
}

// Set gives step key the value and uncertainty (kJ/mol per reaction as
// written, in the cycle's conventions) as a user entry; the step is no
// longer unknown. A negative or non-finite uncertainty, or a non-finite
// value, is refused.
func (c *Cycle) Set(key string, value, uncertainty float64) error {
	i, err := c.index(key)
	if err != nil {
		return err
	}
	if math.IsNaN(value) || math.IsInf(value, 0) {
		return &SettingError{Text: key, Column: 1, Reason: "value is not a finite number"}
	}
	if math.IsNaN(uncertainty) || math.IsInf(uncertainty, 0) || uncertainty < 0 {
		return &SettingError{Text: key, Column: 1, Reason: "uncertainty must be a finite number ≥ 0"}
	}
	if why := checkMagnitude("the value of step "+key, value); why != "" {
		return &SettingError{Text: key, Column: 1, Reason: why}
	}
	if why := checkMagnitude("the uncertainty of step "+key, uncertainty); why != "" {
		return &SettingError{Text: key, Column: 1, Reason: why}
	}
	s := &c.Steps[i]
	s.Value, s.Uncertainty, s.Unknown = value, uncertainty, false
	s.Source = Source{Kind: SourceUser, Key: "user", Citation: "entered by the user", Override: s.Reference != nil}
	c.refreshComposites()
	return nil
}

// MarkUnknown marks step key as unknown, keeping any other unknown (Solve
// then reports too many unknowns until one is given a value).
func (c *Cycle) MarkUnknown(key string) error {
	i, err := c.index(key)
	if err != nil {
		return err
	}
	c.Steps[i].Unknown = true
	return nil
}

// SolveFor makes step key the only unknown: other unknown steps go back to
// their reference value (or stay missing when the data have none).
func (c *Cycle) SolveFor(key string) error {
	i, err := c.index(key)
	if err != nil {
		return err
	}
	for j := range c.Steps {
		if j != i && c.Steps[j].Unknown {
			c.Steps[j].Unknown = false
			c.reset(j)
		}
	}
	c.Steps[i].Unknown = true
	return nil
}

// Reset returns step key to its data value (or to missing when the data
// have none) and clears its unknown mark.
func (c *Cycle) Reset(key string) error {
	i, err := c.index(key)
	if err != nil {
		return err
	}
	c.Steps[i].Unknown = false
	c.reset(i)
	return nil
}

func (c *Cycle) reset(i int) {
	s := &c.Steps[i]
	switch {
	case s.Composite:
		s.Source = Source{Kind: SourceSum, Citation: "sum of its sub-steps"}
		c.refreshComposites()
	case s.Reference != nil:
		s.Value, s.Uncertainty, s.Source = s.Reference.Value, s.Reference.Uncertainty, s.Reference.Source
	default:
		s.Value, s.Uncertainty = 0, 0
		s.Source = Source{Kind: SourceMissing}
	}
}

// SetConventions changes the conventions and converts every step value
// (and reference value) to them. The lattice value from Hess's law does not
// depend on the ionization convention; see the package comment.
func (c *Cycle) SetConventions(conv Conventions) {
	old := c.Conventions
	for i := range c.Steps {
		s := &c.Steps[i]
		d := c.shift(s, conv) - c.shift(s, old)
		if s.Source.Kind != SourceMissing {
			s.Value += d
		}
		if s.Reference != nil {
			s.Reference.Value += d
		}
	}
	c.Conventions = conv
}

// inSum reports whether step i is a term of Hess's sum: every top-level
// step, except that a composite counts either itself (when set by the user,
// unknown, missing, or when it has no sub-steps) or its sub-steps.
func (c *Cycle) inSum(i int) bool {
	s := &c.Steps[i]
	if s.Composite && s.Source.Kind == SourceSum && !s.Unknown {
		return false
	}
	if s.Parent != "" {
		p, ok := c.Step(s.Parent)
		return ok && p.Source.Kind == SourceSum && !p.Unknown
	}
	return true
}

// refreshComposites sets each composite step that sums its sub-steps to that
// sum (per its own reaction: Σ mᵢvᵢ / m). A composite whose sub-step is
// unknown or missing keeps the value 0 and Source SourceSum.
func (c *Cycle) refreshComposites() {
	for i := range c.Steps {
		p := &c.Steps[i]
		if !p.Composite || p.Source.Kind != SourceSum || p.Unknown {
			continue
		}
		sum, varsum := 0.0, 0.0
		for j := range c.Steps {
			s := &c.Steps[j]
			if s.Parent != p.Key || (s.Unknown && s.Source.Kind != SourceSolved) || s.Source.Kind == SourceMissing {
				continue
			}
			sum += s.Multiplicity * s.Value
			varsum += sq(s.Multiplicity * s.Uncertainty)
		}
		if p.Multiplicity != 0 {
			p.Value = sum / p.Multiplicity
			p.Uncertainty = math.Sqrt(varsum) / math.Abs(p.Multiplicity)
		}
	}
}

func sq(x float64) float64 { return x * x }
