package lattice

import (
	"math"

	"enthalpath/thermo"
)

// DebyeFunction returns D₃(x) = (3/x³)·∫₀ˣ t³/(eᵗ − 1) dt, the Debye
// function of order three (P. Debye, Ann. Phys. 344, 789 (1912)): 1 at
// x = 0, falling as π⁴/(5x³) for large x. x ≥ 0; NaN otherwise.
func DebyeFunction(x float64) float64 {
	switch {
	case !(x >= 0) || math.IsInf(x, 1):
		if math.IsInf(x, 1) {
			return 0
		}
		return math.NaN()
	case x < 1e-6:
		return 1 - 3*x/8
	}
	// Composite Gauss–Legendre, 8 panels of 8 points: the integrand is
	// smooth (t³/(eᵗ−1) ≈ t² near 0), so this is exact to double precision
	// for x up to the tens; beyond 30 the tail past x is below 1e-9 of the
	// whole and the closed form π⁴/15 is used.
	if x > 30 {
		return 3 * math.Pow(math.Pi, 4) / 15 / (x * x * x)
	}
	integrand := func(t float64) float64 {
		if t == 0 {
			return 0
		}
		return t * t * t / math.Expm1(t)
	}
	// Eight-point Gauss–Legendre nodes and weights on [−1, 1] (Abramowitz
	// and Stegun, Table 25.4).
	nodes := [8]float64{-0.9602898564975363, -0.7966664774136267, -0.5255324099163290, -0.1834346424956498,
		0.1834346424956498, 0.5255324099163290, 0.7966664774136267, 0.9602898564975363}
	weights := [8]float64{0.1012285362903763, 0.2223810344533745, 0.3137066458778873, 0.3626837833783620,
		0.3626837833783620, 0.3137066458778873, 0.2223810344533745, 0.1012285362903763}
	const panels = 8
	h := x / panels
	sum := 0.0
	for p := range panels {
		mid := (float64(p) + 0.5) * h
		for i, node := range nodes {
			sum += weights[i] * integrand(mid+node*h/2)
		}
	}
	return 3 / (x * x * x) * sum * h / 2
}

// DebyeHeatContent returns H(T) − H(0) of a Debye solid of ν ions per
// formula unit, kJ/mol, the zero-point energy excluded:
//
//	H(T) − H(0) = 3·ν·R·T·D₃(θ_D/T)
//
// (the thermal energy of 3ν oscillators with Debye's spectrum; the p·V
// term of a solid at 1 bar is below 1 J/mol and left out). It tends to the
// classical 3·ν·R·T of Dulong and Petit when θ_D ≪ T. theta and t in K.
func DebyeHeatContent(theta, t float64, ions int) float64 {
	if !(theta > 0) || !(t > 0) || ions <= 0 {
		return math.NaN()
	}
	return 3 * float64(ions) * thermo.RT(t) * DebyeFunction(theta/t)
}
