package ewald

import (
	"errors"
	"math"

	"enthalpath/thermo"
	"enthalpath/thermo/crystal"
)

// BackgroundConvention is the warning every result of a charged cell
// carries: its energy is that of one convention among several.
const BackgroundConvention = "the cell carries a net charge, summed with a uniform neutralising background; " +
	"its energy and site potentials depend on that convention (and on the cell's size), not on the crystal alone"

// Background is the neutralising background of a charged cell and the
// correction it adds to the Ewald sum.
type Background struct {
	// NetCharge is the cell's charge Q in e (0 for a neutral cell).
	NetCharge float64
	// EnergyEV is the term added to the cell's energy,
	// −π·k·Q²/(2·V·α²), in eV.
	EnergyEV float64
	// PotentialShiftV is the term added to every site potential,
	// −π·k·Q/(V·α²), in volt.
	PotentialShiftV float64
}

// SumCharged is Sum for a cell that may carry a net charge Q. The charge is
// compensated by a uniform background of density −Q/V; the k = 0 term of
// the reciprocal sum, divergent for Q ≠ 0, is then replaced by the finite
// background term −π·k·Q²/(2·V·α²) (k = e²/(4πε₀)), which makes the total
// independent of the splitting parameter α (the standard correction; see
// e.g. G. Hummer, L. R. Pratt and A. E. García, J. Phys. Chem. 100,
// 1206–1215 (1996), from memory; pymatgen's EwaldSummation adds the same
// term as its charged-cell energy). Every site potential shifts by
// −π·k·Q/(V·α²). The Madelung constant is recomputed from the corrected
// energy with the usual convention, and means little for a charged cell.
// A neutral cell gives Sum's result and a zero Background.
func SumCharged(c *crystal.Crystal, opt Options) (Result, Background, error) {
	if c == nil || math.Abs(c.TotalCharge()) <= crystal.NeutralityTolerance {
		r, err := Sum(c, opt)
		return r, Background{}, err
	}
	opt.charged = true
	r, err := Sum(c, opt)
	var acc *AccuracyError
	if err != nil && !errors.As(err, &acc) {
		return r, Background{}, err
	}
	q := c.TotalCharge()
	v := c.Volume()
	ke := thermo.CoulombEVAngstrom
	a2 := r.Alpha * r.Alpha
	bg := Background{
		NetCharge:       q,
		EnergyEV:        -math.Pi * ke * q * q / (2 * v * a2),
		PotentialShiftV: -math.Pi * ke * q / (v * a2),
	}
	old := r.EnergyEV
	r.EnergyEV += bg.EnergyEV
	r.SitePotentials = append([]float64(nil), r.SitePotentials...)
	for i := range r.SitePotentials {
		r.SitePotentials[i] += bg.PotentialShiftV
	}
	r.EnergyPerFormulaUnitEV = r.EnergyEV / float64(c.FormulaUnits)
	r.EnergyKJPerMol = thermo.EVToKJPerMol(r.EnergyPerFormulaUnitEV)
	if old != 0 {
		r.MadelungConstant *= r.EnergyEV / old
	}
	return r, bg, err
}
