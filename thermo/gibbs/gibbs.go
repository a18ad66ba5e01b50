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
	g := r.Enthalpy - t*r.Entropy/1000 + r.GasMoles*thermo.RT(t)*math.Log(p/StandardPressure)
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
}

func (e *NoCrossingError) Error() string {
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
