package analysis

import (
	"fmt"
	"math"
	"strconv"

	"enthalpath/cycle"
)

// How the σ of a reaction between estimated salts is combined.
//
// An estimated ΔfH° is Hess's sum over its cycle's steps, the lattice step
// from a model. Two estimates in one reaction (BaO₂ → BaO + ½O₂ from the
// estimates alone) are not independent:
//
//   - a datum both cycles read (the cation's atomization and ionization
//     energies) is one number: its shares are added, coefficient by
//     coefficient, before squaring, so that it cancels where it enters
//     both sides alike;
//   - the lattice model's error in salt i, g_i·|L_i| with g_i its
//     fractional gap to the cycle, is split by the calibration of its
//     family (cycle.Validation, data/tables/model_calibration.csv for the
//     built-in data): the family's mean gap μ (a bias) and the scatter
//     about it, s = √(RMS² − μ²). The biases of the salts of one reaction
//     are taken as one systematic error of the model: they enter as the
//     signed sum Σ cᵢ·μᵢ·|Lᵢ|, which cancels between products and reactants
//     of one family and about equal lattice energies and is counted in
//     full where it does not; the scatters are correlated with coefficient
//     SameCationCorrelation between salts of the same cation and
//     independent otherwise;
//   - a salt with an ion the data do not list (Mg³⁺ of MgCl₃) lies outside
//     the calibration: its model σ enters whole and independent.
//
// With one estimate in the reaction the sum is that estimate's σ, as
// before. The entropies are still combined as independent.

// SameCationCorrelation is the correlation coefficient of the lattice
// model's scatter about its family mean between two salts of the same
// cation in one reaction. Measured over the data's decompositions whose
// salts are both measured (carbonate and oxide, peroxide and oxide, …; the
// stability analysis's own reactions, ReactionModel): 0.55 over 116 pairs
// when written, rounded down; TestSameCationCorrelationMeasured fails
// when the data's value falls below it.
const SameCationCorrelation = 0.5

// ErrorBudget is how an estimated ΔfH° came by its σ: the shares of the
// data its cycle read and its lattice model's error.
type ErrorBudget struct {
	// Inputs are the data's shares: one per step of the cycle other than
	// the lattice step, keyed by the datum (reaction and value).
	Inputs []InputShare
	// Model is the lattice model, Family its calibration family, Cation
	// the cation's symbol.
	Model, Family, Cation string
	// ModelSigma is the model's σ of the lattice step (kJ/mol, RMS·|L|);
	// MeanFraction and RMSFraction the family's mean and RMS gap
	// (fractions of the lattice energy).
	ModelSigma, MeanFraction, RMSFraction float64
	// Calibrated is false when an ion of the salt is not in the data: no
	// correlation is claimed for it.
	Calibrated bool
}

// InputShare is one datum's share of an estimate's σ: Sigma is the step's
// σ times its weight in Hess's sum (kJ/mol).
type InputShare struct {
	Key   string
	Sigma float64
}

// budgetOf returns the error budget of the estimate est made on cycle c.
func budgetOf(est *Estimate, c *cycle.Cycle) *ErrorBudget {
	if c == nil {
		return nil
	}
	b := &ErrorBudget{Model: est.Model, Family: est.Spread.Family, Cation: est.Cation.Symbol,
		ModelSigma: est.ModelUncertainty, MeanFraction: est.Spread.MeanPercent / 100, RMSFraction: est.Spread.Relative(),
		Calibrated: !est.Cation.Hypothetical && !est.Anion.Hypothetical && est.Spread.Compounds > 0}
	for _, t := range cycle.HessTerms(c) {
		s := t.Step
		if s.Kind == cycle.KindLattice || s.Uncertainty == 0 {
			continue
		}
		key := s.Reaction + " = " + strconv.FormatFloat(s.Value, 'g', -1, 64) + " ± " + strconv.FormatFloat(s.Uncertainty, 'g', -1, 64)
		b.Inputs = append(b.Inputs, InputShare{Key: key, Sigma: t.Weight * s.Uncertainty})
	}
	return b
}

// biasAndScatter returns the model σ's parts: the family bias and the
// scatter about it (kJ/mol), whose squares add to ModelSigma².
func (b *ErrorBudget) biasAndScatter() (float64, float64) {
	if !(b.RMSFraction > 0) {
		return 0, b.ModelSigma
	}
	f := math.Max(-1, math.Min(1, b.MeanFraction/b.RMSFraction))
	return b.ModelSigma * f, b.ModelSigma * math.Sqrt(1-f*f)
}

// enthalpySigma returns the σ of Σ cᵢ·ΔfH°ᵢ over the terms (reactants
// with negative coefficients) by the rule above, and whether some
// correlation entered (two or more terms with budgets).
func enthalpySigma(coefs []float64, ths []*Thermo) (float64, bool) {
	var v float64
	inputs := map[string]float64{}
	type share struct {
		c      float64
		b      *ErrorBudget
		scat   float64
		cation string
	}
	byModel := map[string][]share{}
	budgets := 0
	for i, th := range ths {
		c := coefs[i]
		b := th.Budget
		if b == nil {
			v += sq(c * th.Formation.Uncertainty)
			continue
		}
		budgets++
		for _, in := range b.Inputs {
			inputs[in.Key] += c * in.Sigma
		}
		if !b.Calibrated {
			v += sq(c * b.ModelSigma)
			continue
		}
		byModel[b.Model] = append(byModel[b.Model], share{c: c, b: b, cation: b.Cation})
	}
	for _, s := range inputs {
		v += s * s
	}
	for _, group := range byModel {
		var bias float64
		for i := range group {
			bi, sc := group[i].b.biasAndScatter()
			bias += group[i].c * bi
			group[i].scat = group[i].c * sc
			v += sq(group[i].scat)
		}
		v += bias * bias
		for i := range group {
			for j := i + 1; j < len(group); j++ {
				if group[i].cation == group[j].cation {
					v += 2 * SameCationCorrelation * group[i].scat * group[j].scat
				}
			}
		}
	}
	return math.Sqrt(math.Max(v, 0)), budgets > 1
}

// correlationNote words the rule for output.
func correlationNote() string {
	return fmt.Sprintf("σ of ΔrH° between estimated salts: a datum both cycles read counts once (it cancels where it enters both sides alike); the lattice model's error is split by its family's calibration into the family's mean gap, taken as one bias of the model for every salt of the reaction (it cancels between salts of one family and like lattice energies, and counts where it does not), and the scatter about it, correlated at %.2g between salts of the same cation (measured over the data's decompositions of two measured salts) and independent otherwise; a salt with an ion the data do not list keeps its whole model σ, independent", SameCationCorrelation)
}
