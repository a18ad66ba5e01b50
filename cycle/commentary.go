package cycle

import (
	"fmt"
	"math"
	"strings"
	"sync"

	"enthalpath/data"
)

// ionizationNotes are the two explanations of the ionization convention,
// built once (they depend only on constants).
var ionizationNotes = sync.OnceValue(func() map[IonizationConvention]string {
	h := freeElectronEnthalpy()
	return map[IonizationConvention]string{
		Energies0K:    fmt.Sprintf("ionization energies and electron affinities are 0 K values; at 298.15 K each ionization gains 5/2·RT = %.3f kJ/mol and each attachment loses it, but the cations release exactly the electrons the anions take, so the terms cancel and the lattice value is the same in either convention", h),
		Enthalpies298: fmt.Sprintf("ionization and attachment steps include ±5/2·RT = %.3f kJ/mol per electron (298.15 K enthalpies); for a neutral salt these terms cancel, so the lattice value equals the 0 K-convention one", h),
	}
})

func (c *Cycle) handbook(l LatticeValue) *Handbook {
	v := c.Compound.HandbookLattice
	if !v.Known() || !(v.V > 0) {
		return nil
	}
	conv := LatticeEnergy
	if c.Compound.LatticeConvention == "dH" {
		conv = LatticeEnthalpy
	}
	h := &Handbook{Tabulated: v.V, Convention: conv, Uncertainty: v.U,
		Source: Source{Kind: SourceData, Key: v.Source, Memory: v.Memory, Override: v.Override, Note: v.Note}}
	// As a lattice step (negative) in the cycle's convention.
	step := -v.V
	switch {
	case conv == LatticeEnthalpy && c.Conventions.Lattice == LatticeEnergy:
		step += l.Correction // −ΔH_L + (ΔH_L − U) = −U
	case conv == LatticeEnergy && c.Conventions.Lattice == LatticeEnthalpy:
		step -= l.Correction
	}
	h.Value = step
	cyc := l.In(c.Conventions.Lattice)
	h.Difference = cyc - step
	h.Percent = 100 * h.Difference / math.Abs(step)
	return h
}

// commentary explains the conventions and flags inputs worth a look.
func (c *Cycle) commentary(r *Result) (notes, warnings []string) {
	conv := c.Conventions
	notes = append(notes, "values in kJ/mol per reaction as written; conventions: "+conv.String())
	notes = append(notes, ionizationNotes()[conv.Ionization])
	notes = append(notes, fmt.Sprintf("lattice step (gaseous ions → solid): %.1f kJ/mol as an enthalpy, %.1f kJ/mol as an energy U; they differ by %+.3f kJ/mol (Jenkins 2005: ΔH_L = U + Σ nᵢ(nᵢ/2 − 2)RT for the dissociation, n = 3 monatomic, 5 linear, 6 non-linear ions)",
		r.Lattice.Enthalpy, r.Lattice.Energy, r.Lattice.Enthalpy-r.Lattice.Energy))
	notes = append(notes, "attachment steps are attachment enthalpies, the negatives of the electron affinities")
	notes = append(notes, "uncertainties: independent inputs, root sum of squares with multiplicities")
	var memory, defaults []string
	for i := range r.Steps {
		s := &r.Steps[i]
		if s.Source.Kind == SourceSum || (s.Parent != "" && !c.inSum(i)) {
			continue
		}
		if s.Source.Key == data.FamilyFitSource {
			notes = append(notes, fmt.Sprintf("%s: %s; its standard error is part of the cycle's uncertainty", s.Key, s.Source.Note))
		} else if s.Source.Derived {
			warnings = append(warnings, fmt.Sprintf("%s is derived in the data (%s) from other values, for O²⁻ and S²⁻ from a cycle, not measured; replace it with --set %s=VALUE if you have a better value",
				s.Key, s.Source.Key, s.Key))
		}
		if s.Source.DefaultUncertainty {
			defaults = append(defaults, fmt.Sprintf("%s ±%.2g", s.Key, s.Uncertainty))
		}
		if s.Source.Memory {
			memory = append(memory, s.Key)
		}
	}
	for _, cc := range r.Circular {
		warnings = append(warnings, fmt.Sprintf("the value of %s was fitted to %s among %d salts (%s): a comparison of this cycle with the lattice models is not independent, so no covalency verdict is given",
			cc.Ion, c.Formula, cc.Salts, cc.Model))
	}
	if len(defaults) > 0 {
		warnings = append(warnings, "no uncertainty stated by the source, default of the kind used (kJ/mol): "+strings.Join(defaults, ", "))
	}
	if len(memory) > 0 {
		warnings = append(warnings, "values entered in the data from memory (check them against the cited source): "+strings.Join(memory, ", "))
	}
	if c.Settings.LatticeFrom != "" {
		basis := "its default relative uncertainty (common practice, no source)"
		if m, ok := r.Model(c.Settings.LatticeFrom); ok && m.UncertaintyBasis != "" {
			basis = "σ the " + m.UncertaintyBasis
		}
		notes = append(notes, "lattice step taken from the "+c.Settings.LatticeFrom+" model with "+basis)
	}
	if m, ok := r.Model(ModelExtended); ok && m.Err == nil && m.Inputs.Extended != nil {
		notes = append(notes, m.Inputs.Extended.Summary())
	}
	for _, m := range r.Models {
		if m.Err != nil {
			warnings = append(warnings, m.Err.Error())
		}
	}
	return notes, warnings
}
