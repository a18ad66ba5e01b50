package gibbs

import (
	"fmt"
	"math"

	"enthalpath/thermo"
)

// StandardPressure is p° in bar.
const StandardPressure = 1.0

// Reaction is a reaction's standard enthalpy and entropy at 298.15 K with
// their standard uncertainties, and the moles of gas it gives off.
type Reaction struct {
	// Enthalpy ΔrH° (kJ/mol) and its σ.
	Enthalpy, EnthalpyUncertainty float64
	// Entropy ΔrS° (J/(mol·K)) and its σ.
	Entropy, EntropyUncertainty float64
	// GasMoles is Δn of the gas held at the partial pressure of Gibbs
	// (positive when the reaction gives it off).
	GasMoles float64
	// HeatCapacity, when not empty, holds every species' polynomials: ΔrH
	// and ΔrS then follow them away from 298.15 K (Kirchhoff), and the
	// crossing is searched within the temperatures they all cover. Empty:
	// the heat capacities are neglected (ΔrH°, ΔrS° constant).
	HeatCapacity []Species
}

// increments returns ΔrH(t) − ΔrH° (kJ/mol) and ΔrS(t) − ΔrS° (J/(mol·K)).
func (r Reaction) increments(t float64) (dh, ds float64) {
	for _, sp := range r.HeatCapacity {
		h, s := sp.increments(t)
		dh += sp.Coefficient * h
		ds += sp.Coefficient * s
	}
	return dh, ds
}

// CoveredRange returns the temperatures every species' polynomials cover
// (NaN without heat capacities).
func (r Reaction) CoveredRange() (lo, hi float64) {
	if len(r.HeatCapacity) == 0 {
		return math.NaN(), math.NaN()
	}
	lo, hi = 0, math.Inf(1)
	for _, sp := range r.HeatCapacity {
		l, h := sp.Chain.Range()
		lo, hi = math.Max(lo, l), math.Min(hi, h)
	}
	return lo, hi
}

// Point is ΔrG at one temperature with its σ.
type Point struct {
	Temperature float64
	Gibbs       float64
	Uncertainty float64
}

// Gibbs returns ΔrG (kJ/mol) and its σ at temperature t (K) with the
// released gas at partial pressure p (bar).
func (r Reaction) Gibbs(t, p float64) (float64, float64) {
	dh, ds := r.increments(t)
	g := r.Enthalpy + dh - t*(r.Entropy+ds)/1000 + r.GasMoles*thermo.RT(t)*math.Log(p/StandardPressure)
	u := math.Hypot(r.EnthalpyUncertainty, t*r.EntropyUncertainty/1000)
	return g, u
}

// Curve returns ΔrG at n evenly spaced temperatures from t0 to t1
// inclusive (n ≥ 2; n < 2 gives the single point t0).
func (r Reaction) Curve(t0, t1 float64, n int, p float64) []Point {
	if n < 2 {
		g, u := r.Gibbs(t0, p)
		return []Point{{t0, g, u}}
	}
	pts := make([]Point, n)
	for i := range pts {
		t := t0 + (t1-t0)*float64(i)/float64(n-1)
		g, u := r.Gibbs(t, p)
		pts[i] = Point{t, g, u}
	}
	return pts
}

// Crossing is the temperature at which ΔrG changes sign.
type Crossing struct {
	// Temperature in K and its σ from σ_H and σ_S (independent).
	Temperature, Uncertainty float64
	// Below is true when ΔrG < 0 below the crossing (the reaction goes on
	// cooling), false when it goes on heating (the usual case for a
	// reaction giving off a gas).
	Below bool
}

// NoCrossingError says why ΔrG has no zero at a positive temperature.
type NoCrossingError struct {
	// Sign is the sign ΔrG keeps at every positive temperature (−1, +1),
	// or 0 when both ΔrH and the effective ΔrS are zero.
	Sign int
	// Lo and Hi (K), when Hi > 0, bound the temperatures searched: those
	// the heat-capacity polynomials cover.
	Lo, Hi float64
}

func (e *NoCrossingError) Error() string {
	if e.Hi > 0 {
		word := "positive"
		if e.Sign < 0 {
			word = "negative"
		}
		return fmt.Sprintf("ΔrG is %s from %.0f to %.0f K, the temperatures the heat-capacity polynomials cover", word, e.Lo, e.Hi)
	}
	switch e.Sign {
	case -1:
		return "ΔrG is negative at every temperature (ΔrH < 0 and ΔrS > 0)"
	case 1:
		return "ΔrG is positive at every temperature (ΔrH > 0 and ΔrS < 0)"
	}
	return "ΔrG is zero at every temperature"
}

// Zero returns the temperature where ΔrG(T, p) = 0: T* = ΔrH/(ΔrS − Δn·R·ln(p/p°)),
// and its σ by first-order propagation,
// σ_T² = (σ_H/S′)² + (T*·σ_S/S′)² with S′ the effective entropy.
func (r Reaction) Zero(p float64) (Crossing, error) {
	if len(r.HeatCapacity) > 0 {
		return r.zeroWithHeatCapacity(p)
	}
	s := r.Entropy/1000 - r.GasMoles*thermo.GasConstant/1000*math.Log(p/StandardPressure) // kJ/(mol·K)
	h := r.Enthalpy
	if s == 0 || h == 0 || (h > 0) != (s > 0) {
		sign := 0
		switch {
		case h < 0 || (h == 0 && s > 0):
			sign = -1
		case h > 0 || (h == 0 && s < 0):
			sign = 1
		}
		return Crossing{}, &NoCrossingError{Sign: sign}
	}
	t := h / s
	u := math.Hypot(r.EnthalpyUncertainty/s, t*r.EntropyUncertainty/1000/s)
	return Crossing{Temperature: t, Uncertainty: math.Abs(u), Below: h < 0}, nil
}

// String writes the reaction's numbers for messages.
func (r Reaction) String() string {
	return fmt.Sprintf("ΔrH° %.1f ± %.1f kJ/mol, ΔrS° %.1f ± %.1f J/(mol·K), Δn(gas) %g",
		r.Enthalpy, r.EnthalpyUncertainty, r.Entropy, r.EntropyUncertainty, r.GasMoles)
}

// crossingSamples is how many temperatures the search for a sign change of
// ΔrG takes over the covered range before bisecting.
const crossingSamples = 120

// zeroWithHeatCapacity finds the lowest temperature within the range the
// polynomials cover where ΔrG(T, p) changes sign, by sampling and
// bisection; σ_T = √(σ_H² + (T·σ_S)²)/|∂ΔrG/∂T| with ∂ΔrG/∂T = −ΔrS_eff(T).
func (r Reaction) zeroWithHeatCapacity(p float64) (Crossing, error) {
	lo, hi := r.CoveredRange()
	lo = math.Max(lo, thermo.StandardTemperature)
	g := func(t float64) float64 { v, _ := r.Gibbs(t, p); return v }
	prevT, prevG := lo, g(lo)
	for i := 1; i <= crossingSamples; i++ {
		t := lo + (hi-lo)*float64(i)/crossingSamples
		gt := g(t)
		if (prevG < 0) != (gt < 0) || gt == 0 {
			a, b, ga := prevT, t, prevG
			for k := 0; k < 60 && b-a > 1e-9*b; k++ {
				m := (a + b) / 2
				if gm := g(m); (gm < 0) == (ga < 0) && gm != 0 {
					a, ga = m, gm
				} else {
					b = m
				}
			}
			tc := (a + b) / 2
			_, ds := r.increments(tc)
			slope := (r.Entropy+ds)/1000 - r.GasMoles*thermo.GasConstant/1000*math.Log(p/StandardPressure)
			u := math.Hypot(r.EnthalpyUncertainty, tc*r.EntropyUncertainty/1000) / math.Abs(slope)
			return Crossing{Temperature: tc, Uncertainty: u, Below: g(lo) < 0}, nil
		}
		prevT, prevG = t, gt
	}
	sign := 1
	if prevG < 0 {
		sign = -1
	}
	return Crossing{}, &NoCrossingError{Sign: sign, Lo: lo, Hi: hi}
}
