package lattice

import (
	"fmt"
	"math"
)

// Thresholds of the covalent-character verdict, in percent of |model|
// (common practice, no source).
//
// Why 10 %: the point-charge models here carry no dispersion (van der
// Waals) or zero-point terms, so even for the alkali halides, the textbook
// ionic solids, they fall 4–9 % short of the cycle value (Born–Mayer with
// the Ewald Madelung constant over the twenty alkali halides of the built-in
// data). A gap inside that band says nothing about covalency. The silver and
// copper(I) halides, the textbook cases of covalent contribution, lie at
// 15–35 %.
const (
	// AdequateBelowPercent: |gap| below this → the ionic model is adequate.
	AdequateBelowPercent = 10.0
	// SubstantialAbovePercent: a gap beyond this → substantial covalent
	// character.
	SubstantialAbovePercent = 15.0
)

// VerdictBasis states where the thresholds come from.
const VerdictBasis = "thresholds 10 % and 15 % of |model|: common practice, no source"

// Character classifies the gap between cycle and model.
type Character int

const (
	// Undetermined: no usable numbers (a value that is not negative and finite).
	Undetermined Character = iota
	// IonicAdequate: |gap| < 10 %.
	IonicAdequate
	// SomeCovalent: the cycle binds 10–15 % more than the model.
	SomeCovalent
	// SubstantialCovalent: the cycle binds more than 15 % more than the model.
	SubstantialCovalent
	// ModelOverbinds: the model binds at least 10 % more than the cycle;
	// that is not covalency — suspect the model's inputs (radii, d₀,
	// structure) or the cycle's data.
	ModelOverbinds
)

// String returns the verdict in words.
func (c Character) String() string {
	switch c {
	case IonicAdequate:
		return "ionic model adequate"
	case SomeCovalent:
		return "some covalent character"
	case SubstantialCovalent:
		return "substantial covalent character"
	case ModelOverbinds:
		return "model binds more than the cycle: check the model's inputs"
	}
	return "undetermined"
}

// Verdict is the comparison of a cycle lattice value with a model.
type Verdict struct {
	// Gap is cycle − model in kJ/mol: negative when the cycle binds more.
	Gap float64
	// GapPercent is 100·Gap/|model|.
	GapPercent float64
	// Character is the classification by the thresholds.
	Character Character
	// Basis is VerdictBasis.
	Basis string
}

// String reads like "gap -18.2 kJ/mol (-2.3 %): ionic model adequate".
func (v Verdict) String() string {
	return fmt.Sprintf("gap %+.1f kJ/mol (%+.1f %%): %s", v.Gap, v.GapPercent, v.Character)
}

// Thresholds are the two cut-offs of a verdict, in percent of |model|.
type Thresholds struct {
	// Adequate: |gap| below it → IonicAdequate.
	Adequate float64
	// Substantial: a cycle more negative than the model by more than it →
	// SubstantialCovalent.
	Substantial float64
}

// DefaultThresholds returns {AdequateBelowPercent, SubstantialAbovePercent}.
func DefaultThresholds() Thresholds {
	return Thresholds{Adequate: AdequateBelowPercent, Substantial: SubstantialAbovePercent}
}

// Judge compares a cycle lattice value with a model value (both negative,
// kJ/mol, same convention): gap = cycle − model. A cycle more negative
// than the model means binding the ionic model misses, read as covalent
// character once it passes AdequateBelowPercent; a cycle less negative by
// as much is reported as ModelOverbinds. An input that is not negative and
// finite (a dissociation value passed by mistake, zero, NaN) gives
// Undetermined with NaN gaps.
func Judge(cycle, model float64) Verdict {
	return JudgeWith(cycle, model, DefaultThresholds())
}

// JudgeWith is Judge with the user's thresholds; Basis then says they were
// set by the user. Thresholds that are not 0 < Adequate ≤ Substantial give
// Undetermined.
func JudgeWith(cycle, model float64, th Thresholds) Verdict {
	basis := VerdictBasis
	if th != DefaultThresholds() {
		basis = fmt.Sprintf("thresholds %g %% and %g %% of |model|: set by the user", th.Adequate, th.Substantial)
	}
	return JudgeAgainst(cycle, model, th, basis)
}

// JudgeAgainst is Judge with thresholds th whose origin basis states (for
// thresholds set from a validation of the model).
func JudgeAgainst(cycle, model float64, th Thresholds, basis string) Verdict {
	v := Verdict{Basis: basis, Gap: math.NaN(), GapPercent: math.NaN()}
	if !(th.Adequate > 0 && th.Adequate <= th.Substantial) || math.IsInf(th.Substantial, 0) {
		return v
	}
	if !(model < 0) || !(cycle < 0) || math.IsNaN(cycle) || math.IsNaN(model) || math.IsInf(cycle, 0) || math.IsInf(model, 0) {
		return v
	}
	v.Gap = cycle - model
	v.GapPercent = 100 * v.Gap / math.Abs(model)
	switch p := v.GapPercent; {
	case math.Abs(p) < th.Adequate:
		v.Character = IonicAdequate
	case p > 0:
		v.Character = ModelOverbinds
	case -p <= th.Substantial:
		v.Character = SomeCovalent
	default:
		v.Character = SubstantialCovalent
	}
	return v
}
