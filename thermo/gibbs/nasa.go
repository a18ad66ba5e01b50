package gibbs

import (
	"math"

	"enthalpath/thermo"
)

// Polynomial is one temperature interval of a species' NASA Glenn
// 9-coefficient polynomials (McBride, Zehe & Gordon, NASA/TP-2002-211556):
//
//	Cp/R = a₁T⁻² + a₂T⁻¹ + a₃ + a₄T + a₅T² + a₆T³ + a₇T⁴
//	H/(RT) = −a₁T⁻² + a₂T⁻¹·ln T + a₃ + a₄T/2 + a₅T²/3 + a₆T³/4 + a₇T⁴/5 + b₁/T
//	S/R = −a₁T⁻²/2 − a₂T⁻¹ + a₃·ln T + a₄T + a₅T²/2 + a₆T³/3 + a₇T⁴/4 + b₂
//
// with H the enthalpy on the scale H(298.15 K) = ΔfH°(298.15 K) and S the
// absolute entropy.
type Polynomial struct {
	// TLow and THigh bound the interval in K.
	TLow, THigh float64
	A           [7]float64
	B1, B2      float64
}

// Cp returns the heat capacity at t in J/(mol·K).
func (p Polynomial) Cp(t float64) float64 {
	a := p.A
	return thermo.GasConstant * (a[0]/(t*t) + a[1]/t + a[2] + a[3]*t + a[4]*t*t + a[5]*t*t*t + a[6]*t*t*t*t)
}

// H returns the enthalpy at t in J/mol.
func (p Polynomial) H(t float64) float64 {
	a := p.A
	h := -a[0]/(t*t) + a[1]*math.Log(t)/t + a[2] + a[3]*t/2 + a[4]*t*t/3 + a[5]*t*t*t/4 + a[6]*t*t*t*t/5 + p.B1/t
	return thermo.GasConstant * t * h
}

// S returns the absolute entropy at t in J/(mol·K).
func (p Polynomial) S(t float64) float64 {
	a := p.A
	s := -a[0]/(2*t*t) - a[1]/t + a[2]*math.Log(t) + a[3]*t + a[4]*t*t/2 + a[5]*t*t*t/3 + a[6]*t*t*t*t/4 + p.B2
	return thermo.GasConstant * s
}

// Chain is one species' polynomials in order of temperature, each
// interval starting where the previous ends; a change of phase between
// intervals (a solid melting) is in the chain as the source gives it.
type Chain []Polynomial

// Range returns the temperatures the chain covers.
func (c Chain) Range() (lo, hi float64) {
	if len(c) == 0 {
		return math.NaN(), math.NaN()
	}
	return c[0].TLow, c[len(c)-1].THigh
}

// state returns H (J/mol) and S (J/(mol·K)) at t. Below the first interval
// its polynomial is taken (the source's first interval of a solid often
// starts at 300 K, 1.85 K above 298.15 K); above the last, Cp is held at
// its value at the chain's end.
func (c Chain) state(t float64) (h, s float64) {
	last := c[len(c)-1]
	if t > last.THigh {
		th := last.THigh
		cp := last.Cp(th)
		return last.H(th) + cp*(t-th), last.S(th) + cp*math.Log(t/th)
	}
	for _, p := range c {
		if t <= p.THigh {
			return p.H(t), p.S(t)
		}
	}
	return last.H(t), last.S(t)
}

// Increments returns H(t) − H(298.15 K) in kJ/mol and S(t) − S(298.15 K)
// in J/(mol·K) for a chain with at least one interval.
func (c Chain) Increments(t float64) (dh, ds float64) {
	h0, s0 := c.state(thermo.StandardTemperature)
	h, s := c.state(t)
	return (h - h0) / 1000, s - s0
}

// Extrapolated reports whether t lies beyond the chain's last interval
// (then Cp is held at its last value).
func (c Chain) Extrapolated(t float64) bool {
	_, hi := c.Range()
	return t > hi
}

// Species is one species' chain with its signed coefficient in a
// reaction (negative for a reactant). NewSpecies also keeps the chain's
// values at 298.15 K, which every increment is taken from.
type Species struct {
	Coefficient float64
	Chain       Chain
	based       bool
	h0, s0      float64
}

// NewSpecies returns the species with its 298.15 K values kept.
func NewSpecies(coefficient float64, chain Chain) Species {
	h0, s0 := chain.state(thermo.StandardTemperature)
	return Species{Coefficient: coefficient, Chain: chain, based: true, h0: h0, s0: s0}
}

// increments is Chain.Increments with the kept 298.15 K values.
func (sp Species) increments(t float64) (dh, ds float64) {
	if !sp.based {
		return sp.Chain.Increments(t)
	}
	h, s := sp.Chain.state(t)
	return (h - sp.h0) / 1000, s - sp.s0
}
