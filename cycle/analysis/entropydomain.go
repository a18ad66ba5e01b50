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
	// DebyeTemperature in K (0 when not judged); DebyeFrom says whence.
	DebyeTemperature float64
	DebyeFrom        string
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
		return fmt.Sprintf("inside the line's domain (θ_D %.0f K ≤ %.0f K, %s)", d.DebyeTemperature, limit, d.DebyeFrom)
	default:
		return fmt.Sprintf("OUTSIDE the line's domain (θ_D %.0f K > %.0f K, %s: vibrations partly frozen at 298 K, the line overestimates); Debye lattice entropy %.0f J/(mol·K) over %d ions", d.DebyeTemperature, limit, d.DebyeFrom, d.DebyeEntropy, d.Ions)
	}
}

// Whence θ_D comes, for EntropyDomain.DebyeFrom.
const (
	debyeFromExtended = "θ_D from the extended model's curvature"
	debyeFromVolume   = "θ_D from the Born–Mayer curvature of the volume-based lattice energy"
)

// entropyDomain judges the compound of c against the volume line's domain:
// θ_D from the extended model where it runs on the compound's own
// structure from the data, else from the volume
// model's lattice energy and V_m (entropy.DebyeTemperatureFromVolume), else,
// for a compound with no volume of its own, from Kapustinskii's lattice
// energy and the volume vm (nm³) the entropy estimate used.
func entropyDomain(c *cycle.Cycle, vm float64) EntropyDomain {
	if c == nil {
		return EntropyDomain{}
	}
	ions := c.Cation.Count + c.Anion.Count
	if c.Settings.Structure.FromData { // the extended model sums the compound's own structure only
		if m, err := cycle.EvaluateModel(c, cycle.ModelExtended); err == nil {
			if d := domainOf(extendedTheta(&m), debyeFromExtended, ions); d.Judged {
				return d
			}
		}
	}
	if m, err := cycle.EvaluateModel(c, cycle.ModelVolume); err == nil {
		return domainOf(entropy.DebyeTemperatureFromVolume(m.Energy, m.Inputs.MolarVolume, c.MolarMass, ions), debyeFromVolume, ions)
	}
	if m, err := cycle.EvaluateModel(c, cycle.ModelKapustinskii); err == nil {
		return domainOf(entropy.DebyeTemperatureFromVolume(m.Energy, vm, c.MolarMass, ions), "θ_D from the Born–Mayer curvature of the kapustinskii lattice energy", ions)
	}
	return EntropyDomain{}
}

// estimateDomain judges an estimated compound from what its estimate
// already has (no new model evaluation): the extended model's θ_D when the
// solved cycle evaluated it, else θ_D from the estimate's own lattice
// energy, formula-unit volume vm (nm³) and molar mass.
func estimateDomain(est *Estimate, vm, molarMass float64) EntropyDomain {
	ions := est.Cation.Count + est.Anion.Count
	if est.Result != nil {
		if m, ok := est.Result.Model(cycle.ModelExtended); ok && m.Err == nil {
			if d := domainOf(extendedTheta(m), debyeFromExtended, ions); d.Judged {
				return d
			}
		}
	}
	theta := entropy.DebyeTemperatureFromVolume(est.LatticeEnergy, vm, molarMass, ions)
	return domainOf(theta, fmt.Sprintf("θ_D from the Born–Mayer curvature of the %s lattice energy", est.Model), ions)
}

func extendedTheta(m *cycle.ModelResult) float64 {
	if m.Inputs.Extended == nil {
		return 0
	}
	return m.Inputs.Extended.Minimum.DebyeTemperature
}

// domainOf judges θ_D (K; 0 when none) of a compound of ions ions per
// formula unit.
func domainOf(theta float64, from string, ions int) EntropyDomain {
	in, ok := entropy.InVolumeDomain(theta, thermo.StandardTemperature)
	if !ok {
		return EntropyDomain{}
	}
	return EntropyDomain{Judged: true, Inside: in, DebyeTemperature: theta, DebyeFrom: from, Ions: ions,
		DebyeEntropy: entropy.DebyeEntropy(theta, thermo.StandardTemperature, ions)}
}
