package analysis

import (
	"fmt"
	"math"
	"strings"

	"enthalpath/thermo/gibbs"
)

// Term is one species of a reaction with its (positive) coefficient.
type Term struct {
	Coefficient float64
	Thermo      Thermo
	// Released marks the gas given off, held at the reaction's Pressure.
	Released bool
}

// Reaction is a decomposition or a disproportionation with its energies
// at the temperature asked. Energies are kJ/mol of the reaction as written.
type Reaction struct {
	// Equation in ASCII with states of gases and liquids ("CaCO3 -> CaO + CO2(g)").
	Equation string
	// Kind is "disproportionation", "loss of <gas>" or "decomposition".
	Kind                string
	Reactants, Products []Term
	// Standard holds ΔrH° and ΔrS° at 298.15 K with σ, and Δn of the gas
	// given off; EntropyKnown is false when a species lacks S° (then the
	// Gibbs energies are NaN and the verdict is on ΔrH° alone).
	Standard     gibbs.Reaction
	EntropyKnown bool
	// Temperature (K) and Pressure of the gas given off (bar) of Gibbs.
	Temperature, Pressure float64
	// Gibbs is ΔrG at Temperature and Pressure, with its σ.
	Gibbs, GibbsUncertainty float64
	// EnthalpyVerdict judges ΔrH°; Verdict judges ΔrG (ΔrH° when the
	// entropy is unknown). Only beyond gibbs.Coverage·σ is a reaction
	// favoured or disfavoured.
	EnthalpyVerdict, Verdict gibbs.Verdict
	// Released names the gas given off ("" for none); Crossing is the
	// temperature at which ΔrG changes sign at Pressure (nil when there is
	// none at a positive temperature, NoCrossing says why).
	Released   string
	Crossing   *gibbs.Crossing
	NoCrossing string
	// Estimated is true when a species' values are estimates.
	Estimated bool
	// Correlated is true when two or more estimates enter and their σ are
	// combined with their shared data and correlated model errors
	// (correlation.go) rather than as independent.
	Correlated bool
	// HeatCapacitySpecies names the species whose NASA Glenn polynomials
	// ΔrG(T) includes (empty when the heat capacities are neglected);
	// HeatCapacityMissing the species without polynomials, for which they
	// are neglected.
	HeatCapacitySpecies, HeatCapacityMissing []string
}

// newReaction sums the terms into ΔrH°, ΔrS° and judges the reaction at
// temperature t (K) and pressure p (bar) of the gas given off.
func newReaction(kind string, reactants, products []Term, t, p float64) Reaction {
	r := Reaction{Kind: kind, Reactants: reactants, Products: products, Temperature: t, Pressure: p, EntropyKnown: true}
	var s2 float64
	coefs := make([]float64, 0, len(reactants)+len(products))
	ths := make([]*Thermo, 0, len(reactants)+len(products))
	add := func(terms []Term, sign float64) {
		for i := range terms {
			tm := &terms[i]
			c := sign * tm.Coefficient
			th := &tm.Thermo
			r.Standard.Enthalpy += c * th.Formation.Value
			coefs, ths = append(coefs, c), append(ths, th)
			if th.Entropy.Known() {
				r.Standard.Entropy += c * th.Entropy.Value
				s2 += sq(c * th.Entropy.Uncertainty)
			} else {
				r.EntropyKnown = false
			}
			if !th.Formation.Measured || th.Entropy.Known() && !th.Entropy.Measured {
				r.Estimated = true
			}
			if tm.Released {
				r.Standard.GasMoles += c
				r.Released = th.Formula
			}
		}
	}
	add(reactants, -1)
	add(products, 1)
	r.Standard.EnthalpyUncertainty, r.Correlated = enthalpySigma(coefs, ths)
	r.Standard.EntropyUncertainty = math.Sqrt(s2)
	r.attachHeatCapacities()
	r.Equation = side(reactants) + " -> " + side(products)
	r.EnthalpyVerdict = gibbs.Judge(r.Standard.Enthalpy, r.Standard.EnthalpyUncertainty)
	if !r.EntropyKnown {
		r.Gibbs, r.GibbsUncertainty = math.NaN(), math.NaN()
		r.Verdict = r.EnthalpyVerdict
		r.NoCrossing = "a standard entropy is missing"
		return r
	}
	r.Gibbs, r.GibbsUncertainty = r.Standard.Gibbs(t, p)
	r.Verdict = gibbs.Judge(r.Gibbs, r.GibbsUncertainty)
	if r.Released != "" {
		c, err := r.Standard.Zero(p)
		if err != nil {
			r.NoCrossing = err.Error()
		} else {
			r.Crossing = &c
		}
	}
	return r
}

// Curve is ΔrG(T) of the reaction at its Pressure over [t0, t1] with n
// points (nil when the entropy is unknown).
func (r Reaction) Curve(t0, t1 float64, n int) []gibbs.Point {
	if !r.EntropyKnown {
		return nil
	}
	return r.Standard.Curve(t0, t1, n, r.Pressure)
}

func side(terms []Term) string {
	parts := make([]string, len(terms))
	for i, t := range terms {
		name := t.Thermo.Formula
		if t.Thermo.State == "g" || t.Thermo.State == "l" {
			name += "(" + t.Thermo.State + ")"
		}
		parts[i] = coefText(t.Coefficient) + name
	}
	return strings.Join(parts, " + ")
}

// coefText writes a stoichiometric coefficient: "" for 1, "½ " for 0.5,
// "3/2 " for 1.5, "2 " for 2.
func coefText(c float64) string {
	switch {
	case c == 1:
		return ""
	case c == 0.5:
		return "½ "
	case c == math.Trunc(c):
		return fmt.Sprintf("%d ", int(c))
	case c*2 == math.Trunc(c*2):
		return fmt.Sprintf("%d/2 ", int(c*2))
	}
	return fmt.Sprintf("%g ", c)
}
