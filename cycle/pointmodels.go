package cycle

import (
	"fmt"
	"strconv"

	"enthalpath/thermo/lattice"
)

// The point-charge models' evaluations: Born–Landé, Born–Mayer (with the
// Ewald constant of the structure too), Kapustinskii and the volume-based
// equations, each from the inputs modelinputs.go gathers.

func (e *evaluator) kapustinskii(in *ModelInputs) (float64, error) {
	c := e.c
	if err := e.radii(in, true); err != nil {
		return 0, err
	}
	in.Nu = c.Cation.Count + c.Anion.Count
	return lattice.Kapustinskii(in.Nu, c.Cation.Ion.Charge, c.Anion.Ion.Charge, in.CationRadius, in.AnionRadius)
}

func (e *evaluator) volumeModel(in *ModelInputs) (float64, error) {
	c := e.c
	vm, from, err := c.molarVolume()
	if err != nil {
		return 0, err
	}
	in.MolarVolume, in.VolumeFrom = vm, from
	est, err := lattice.VolumeBased(vm, c.ionKinds())
	if err != nil {
		return 0, err
	}
	in.IonicStrength = est.IonicStrength
	in.Fit = est.Form.String()
	if est.Form == lattice.Form1999 {
		in.Fit += ", " + est.Fit.Name + " fit α = " + strconv.FormatFloat(est.Fit.Alpha, 'g', -1, 64) + " kJ·nm/mol, β = " +
			strconv.FormatFloat(est.Fit.Beta, 'g', -1, 64) + " kJ/mol"
		if est.Fit.Name == "general" {
			in.Fit += " (no constants for this charge type among the published ones the program has: MX 1:1, MX2 2:1, M2X 1:2; the general fit is used)"
		}
	}
	return est.U, nil
}

// molarVolume returns V_m (nm³) from the cell when there is one with
// measured parameters, else from the density and molar mass.
func (c *Cycle) molarVolume() (float64, string, error) {
	st := c.Settings.Structure
	if st.Cell != nil {
		if err := c.structureFits(st, ModelVolume); err != nil {
			return 0, "", err
		}
		vm, err := lattice.MolarVolumeFromCell(st.Cell.Volume(), st.Cell.FormulaUnits)
		return vm, "cell volume of " + st.Name() + " / Z", err
	}
	if st.Prototype != "" && len(st.Params) > 0 {
		mv, err := c.Memo().Madelung(st, c.Cation, c.Anion, c.Settings.Accuracy)
		if err == nil && mv.FormulaUnits > 0 {
			vm, err := lattice.MolarVolumeFromCell(mv.Volume, mv.FormulaUnits)
			return vm, "cell volume of " + describeStructure(st) + " / Z", err
		}
	}
	if c.Compound.Density.Known() && c.MolarMass > 0 {
		vm, err := lattice.MolarVolumeFromDensity(c.MolarMass, c.Compound.Density.V)
		return vm, fmt.Sprintf("molar mass %.3f g/mol / density %g g/cm³ (%s)", c.MolarMass, c.Compound.Density.V, c.Compound.Density.Source), err
	}
	return 0, "", &ModelError{Model: ModelVolume, Reason: "no cell parameters and no density for " + c.Formula, Remedy: RemedyStructureWithCell}
}

// bornModel evaluates Born–Landé (mayer false) or Born–Mayer (mayer true);
// with actual true, the Madelung constant and d₀ are the chosen structure's
// own (the ewald model).
func (e *evaluator) bornModel(in *ModelInputs, mayer, actual bool) (float64, error) {
	c := e.c
	mad, err := e.madelung(in, actual)
	if err != nil {
		return 0, err
	}
	if err := e.distance(in, actual, mad.NearestDistance); err != nil {
		return 0, err
	}
	pair := lattice.IonPair{Madelung: in.Madelung, ZCation: c.Cation.Ion.Charge, ZAnion: c.Anion.Ion.Charge, R0: in.D0}
	if mayer {
		in.Rho = c.Settings.Rho
		if in.Rho == 0 {
			in.Rho = lattice.DefaultRho
		}
		return lattice.BornMayer(pair, in.Rho)
	}
	n := c.Settings.BornExponent
	in.BornExponentFrom = "set by the user"
	if n == 0 {
		n, err = c.bornExponent()
		if err != nil {
			return 0, &ModelError{Model: ModelBornLande, Reason: "no Pauling Born exponent for " + c.Cation.Ion.Symbol + " with " +
				c.Anion.Ion.Symbol, Remedy: RemedyBornExponent, Err: err}
		}
		in.BornExponentFrom = "mean of Pauling's values over the ions (" + c.Cation.Ion.BornConfig + " ×" + strconv.Itoa(c.Cation.Count) +
			", " + c.Anion.Ion.BornConfig + " ×" + strconv.Itoa(c.Anion.Count) + ")"
	}
	in.BornExponent = n
	return lattice.BornLande(pair, n)
}

// bornExponent is the count-weighted mean of the ions' Pauling exponents:
// from the data's Born-exponent table when the ions carry it, else from
// thermo/lattice's table of configurations.
func (c *Cycle) bornExponent() (float64, error) {
	nc, na := c.Cation.Ion.BornExponent, c.Anion.Ion.BornExponent
	if nc.Known() && na.Known() {
		a, b := float64(c.Cation.Count), float64(c.Anion.Count)
		return (a*nc.V + b*na.V) / (a + b), nil
	}
	var configs []string
	for range c.Cation.Count {
		configs = append(configs, c.Cation.Ion.BornConfig)
	}
	for range c.Anion.Count {
		configs = append(configs, c.Anion.Ion.BornConfig)
	}
	return lattice.BornExponent(configs...)
}
