package cli

// The data command's JSON output.

import (
	"cmp"

	"enthalpath/data"
)

type dataValueJSON struct {
	Value       float64        `json:"value"`
	Uncertainty float64        `json:"uncertainty"`
	Unit        string         `json:"unit"`
	Source      string         `json:"source"`
	Citation    string         `json:"citation,omitempty"`
	Memory      bool           `json:"memory"`
	Derived     bool           `json:"derived"`
	Override    bool           `json:"override"`
	Replaced    *dataValueJSON `json:"replaced,omitempty"`
	Note        string         `json:"note,omitempty"`
	Locator     string         `json:"locator,omitempty"`
}

func dataValueOf(db *data.DB, v data.Value) *dataValueJSON {
	if !v.Known() {
		return nil
	}
	out := &dataValueJSON{Value: v.V, Uncertainty: v.U, Unit: v.Unit, Source: v.Source,
		Memory: v.Memory, Derived: v.Derived, Override: v.Override, Note: v.Note, Locator: v.Locator}
	if s, err := db.Source(v.Source); err == nil {
		out.Citation = s.Citation
	}
	if v.Replaced != nil {
		out.Replaced = dataValueOf(db, *v.Replaced)
	}
	return out
}

// dataAltsOf writes other compilations' values, each with its difference
// from the preferred value.
func dataAltsOf(db *data.DB, pref data.Value, alts []data.Value) []map[string]any {
	out := []map[string]any{}
	for _, a := range alts {
		out = append(out, map[string]any{"value": dataValueOf(db, a), "difference_from_preferred": a.V - pref.V})
	}
	return out
}

func dataNumber(v data.Value) *float64 {
	if !v.Known() {
		return nil
	}
	n := v.V
	return &n
}

type dataStepJSON struct {
	Kind          string         `json:"kind"`
	Reaction      string         `json:"reaction"`
	AtomsProduced int            `json:"atoms_produced"`
	Enthalpy      *dataValueJSON `json:"enthalpy_kj_per_mol"`
}

type dataRadiusJSON struct {
	CN           string         `json:"cn"`
	Coordination int            `json:"coordination"`
	Spin         string         `json:"spin"`
	Ionic        *dataValueJSON `json:"ionic_radius"`
	Crystal      *dataValueJSON `json:"crystal_radius,omitempty"`
}

type dataScaledJSON struct {
	Scale string         `json:"scale"`
	Value *dataValueJSON `json:"enthalpy"`
}

func dataJSON(db *data.DB, rec any) any {
	switch r := rec.(type) {
	case data.Element:
		ies := []float64{}
		var ieVals []*dataValueJSON
		for _, v := range r.Ionization {
			ies = append(ies, v.V)
			ieVals = append(ieVals, dataValueOf(db, v))
		}
		var steps []dataStepJSON
		for _, s := range db.AtomizationSteps(r.Symbol) {
			steps = append(steps, dataStepJSON{s.Kind, s.Reaction, s.AtomsProduced, dataValueOf(db, s.Enthalpy)})
		}
		return map[string]any{
			"kind": "element", "symbol": r.Symbol, "name": r.Name, "z": r.Z, "standard_state": r.StandardState,
			"atomization_kj_per_mol":            dataNumber(r.Atomization),
			"atomization":                       dataValueOf(db, r.Atomization),
			"atomization_alternatives":          dataAltsOf(db, r.Atomization, r.AtomizationAlternatives),
			"standard_entropy":                  dataValueOf(db, r.StandardEntropy),
			"atomization_steps":                 steps,
			"ionization_energies_ev":            ies,
			"ionization_energies":               ieVals,
			"electron_affinity_ev":              dataNumber(r.ElectronAffinity),
			"electron_affinity":                 dataValueOf(db, r.ElectronAffinity),
			"second_electron_affinity_ev":       dataNumber(r.SecondAffinity),
			"second_electron_affinity":          dataValueOf(db, r.SecondAffinity),
			"ionization_energy_convention":      "0 K, as published",
			"electron_affinity_sign_convention": "positive when attachment releases energy",
		}
	case data.Ion:
		var radii []dataRadiusJSON
		for _, x := range r.Radii {
			radii = append(radii, dataRadiusJSON{x.CN, x.Coordination, x.Spin, dataValueOf(db, x.Ionic), dataValueOf(db, x.Crystal)})
		}
		var hyd []dataScaledJSON
		for _, h := range r.Hydrations {
			hyd = append(hyd, dataScaledJSON{h.Scale, dataValueOf(db, h.Value)})
		}
		return map[string]any{
			"kind": "ion", "symbol": r.Symbol, "core": r.Core, "charge": r.Charge, "polyatomic": r.Polyatomic, "shape": r.Shape,
			"born_config": r.BornConfig, "born_exponent": dataValueOf(db, r.BornExponent),
			"shannon_radii":              radii,
			"thermochemical_radius":      dataValueOf(db, r.ThermochemicalRadius),
			"gas_formation":              dataValueOf(db, r.GasFormation),
			"gas_formation_alternatives": dataAltsOf(db, r.GasFormation, r.GasFormationAlternatives),
			"fitted_gas_formation":       derivedIonJSONOf(db, r.Symbol),
			"hydration":                  hyd,
			"note":                       r.Note,
		}
	case data.Compound:
		params := map[string]float64{}
		for k, v := range r.Params {
			params[k] = v
		}
		return map[string]any{
			"kind": "compound", "formula": r.Formula, "name": r.Name, "family": r.Family,
			"cation": r.Cation, "cation_count": r.CationCount, "anion": r.Anion, "anion_count": r.AnionCount,
			"formation_enthalpy_kj_per_mol": dataNumber(r.Formation),
			"formation_enthalpy":            dataValueOf(db, r.Formation),
			"formation_alternatives":        dataAltsOf(db, r.Formation, r.Alternatives),
			"gibbs_formation":               dataValueOf(db, r.GibbsFormation),
			"entropy":                       dataValueOf(db, r.Entropy),
			"state":                         cmp.Or(r.State, "cr"),
			"polymorph":                     r.Polymorph,
			"molecular":                     r.Molecular,
			"structure":                     r.Structure,
			"params":                        params,
			"params_source":                 r.ParamsSource,
			"params_memory":                 r.ParamsMemory,
			"params_override":               r.ParamsOverride,
			"density_g_cm3":                 dataValueOf(db, r.Density),
			"handbook_lattice_kj_per_mol":   dataValueOf(db, r.HandbookLattice),
			"handbook_lattice_convention":   r.LatticeConvention,
			"note":                          r.Note,
		}
	}
	return nil
}

type derivedIonJSON struct {
	Value   *dataValueJSON `json:"value"`
	Model   string         `json:"lattice_source"`
	Salts   []string       `json:"salts"`
	Outside []string       `json:"outside_2sigma"`
}

func derivedIonJSONOf(db *data.DB, symbol string) *derivedIonJSON {
	d, ok := db.DerivedIon(symbol)
	if !ok {
		return nil
	}
	j := &derivedIonJSON{Value: dataValueOf(db, d.GasFormation), Model: d.Model, Salts: d.Salts, Outside: d.Outside}
	if j.Outside == nil {
		j.Outside = []string{}
	}
	return j
}
