package analysis

import (
	"fmt"

	"enthalpath/cycle"
	"enthalpath/thermo"
	"enthalpath/thermo/entropy"
)

// EntropyDomain says whether a compound lies inside the volume-based
// entropy line's domain (thermo/entropy.InVolumeDomain): θ_D/T at 298.15 K
// against entropy.MaxReducedDebye, with θ_D the extended lattice model's
// (from its repulsion curvature, thermo/lattice).
type EntropyDomain struct {
	// Judged is false when no θ_D could be had (the extended model does
	// not run on the compound): then the domain is not known.
	Judged, Inside bool
	// DebyeTemperature in K (0 when not judged).
	DebyeTemperature float64
	// DebyeEntropy is the Debye lattice entropy at θ_D (J/(mol·K)) of the
	// formula unit's ions, each a vibrating unit (a polyatomic ion's
	// internal modes left out), the estimate offered outside the domain; 0
	// when not judged.
	DebyeEntropy float64
	// Ions is the number of ions per formula unit the Debye entropy counts.
	Ions int
}

// String says the verdict in a line for the estimate's basis.
func (d EntropyDomain) String() string {
	limit := entropy.MaxReducedDebye * thermo.StandardTemperature
	switch {
	case !d.Judged:
		return "domain not judged (no θ_D)"
	case d.Inside:
		return fmt.Sprintf("inside the line's domain (θ_D %.0f K ≤ %.0f K)", d.DebyeTemperature, limit)
	default:
		return fmt.Sprintf("OUTSIDE the line's domain (θ_D %.0f K > %.0f K: vibrations partly frozen at 298 K, the line overestimates); Debye lattice entropy %.0f J/(mol·K) over %d ions", d.DebyeTemperature, limit, d.DebyeEntropy, d.Ions)
	}
}

// entropyDomain judges the compound of c against the volume line's domain,
// evaluating the extended model on it.
func entropyDomain(c *cycle.Cycle) EntropyDomain {
	if c == nil {
		return EntropyDomain{}
	}
	m, err := cycle.EvaluateModel(c, cycle.ModelExtended)
	if err != nil {
		return EntropyDomain{}
	}
	return domainOf(&m, c.Cation.Count+c.Anion.Count)
}

// resultDomain judges a solved cycle from the extended model it already
// evaluated (no new evaluation).
func resultDomain(r *cycle.Result, ions int) EntropyDomain {
	if r == nil {
		return EntropyDomain{}
	}
	m, ok := r.Model(cycle.ModelExtended)
	if !ok || m.Err != nil {
		return EntropyDomain{}
	}
	return domainOf(m, ions)
}

// domainOf reads θ_D from the extended model's result m of a compound of
// ions ions per formula unit.
func domainOf(m *cycle.ModelResult, ions int) EntropyDomain {
	if m.Inputs.Extended == nil {
		return EntropyDomain{}
	}
	theta := m.Inputs.Extended.Minimum.DebyeTemperature
	in, ok := entropy.InVolumeDomain(theta, thermo.StandardTemperature)
	if !ok {
		return EntropyDomain{}
	}
	return EntropyDomain{Judged: true, Inside: in, DebyeTemperature: theta, Ions: ions,
		DebyeEntropy: entropy.DebyeEntropy(theta, thermo.StandardTemperature, ions)}
}
