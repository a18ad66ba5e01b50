package cli

import (
	"math"

	"enthalpath/cycle"
)

// cycleJSON is the JSON of "enthalpath cycle": the cycle, its solution, the
// models and the settings.
type cycleJSON struct {
	Formula string `json:"formula"` // the compound, the key every command uses
	// Deprecated: the same as formula, kept for scripts that read it.
	Compound             string          `json:"compound"`
	Name                 string          `json:"name,omitempty"`
	Family               string          `json:"family,omitempty"`
	Tabulated            bool            `json:"tabulated"`
	Cation               string          `json:"cation"`
	Anion                string          `json:"anion"`
	Convention           string          `json:"convention"`
	IonizationConvention string          `json:"ionization_convention"`
	Steps                []stepJSON      `json:"steps"`
	Solved               solvedJSON      `json:"solved"`
	Lattice              latticeJSON     `json:"lattice"`
	Handbook             *handbookJSON   `json:"handbook,omitempty"`
	Models               []modelJSON     `json:"models"`
	VerdictThresholds    string          `json:"verdict_thresholds"`
	Verdict              *verdictJSON    `json:"verdict"`
	Notes                []string        `json:"notes"`
	Warnings             []string        `json:"warnings"`
	AnionValue           *anionValueJSON `json:"anion_value,omitempty"`
	Settings             settingsJSON    `json:"settings"`
}

type stepJSON struct {
	Key                string     `json:"key"`
	Label              string     `json:"label"`
	Reaction           string     `json:"reaction"`
	KJPerMol           jsonNumber `json:"kj_per_mol"`
	UncertaintyKJ      jsonNumber `json:"uncertainty_kj_per_mol"`
	Multiplicity       jsonNumber `json:"multiplicity"`
	Source             string     `json:"source"`
	SourceKind         string     `json:"source_kind"`
	Citation           string     `json:"citation,omitempty"`
	Memory             bool       `json:"memory"`
	Derived            bool       `json:"derived"`
	Override           bool       `json:"override"`
	DefaultUncertainty bool       `json:"default_uncertainty"`
	Unknown            bool       `json:"unknown"`
	Parent             string     `json:"parent,omitempty"`
	Missing            bool       `json:"missing"`
}

type solvedJSON struct {
	Key           string     `json:"key"`
	KJPerMol      jsonNumber `json:"kj_per_mol"`
	UncertaintyKJ jsonNumber `json:"uncertainty_kj_per_mol"`
}

type latticeJSON struct {
	EnthalpyKJ    jsonNumber `json:"enthalpy_kj_per_mol"`
	EnergyKJ      jsonNumber `json:"energy_kj_per_mol"`
	UncertaintyKJ jsonNumber `json:"uncertainty_kj_per_mol"`
	CorrectionKJ  jsonNumber `json:"dh_minus_u_kj_per_mol"`
}

type handbookJSON struct {
	Tabulated  jsonNumber `json:"tabulated_kj_per_mol"`
	Convention string     `json:"convention"`
	AsStep     jsonNumber `json:"as_step_kj_per_mol"`
	Difference jsonNumber `json:"difference_kj_per_mol"`
	Percent    jsonNumber `json:"difference_percent"`
	Source     string     `json:"source"`
	Memory     bool       `json:"memory"`
}

type modelJSON struct {
	Model        string     `json:"model"`
	KJPerMol     jsonNumber `json:"kj_per_mol"`
	EnergyKJ     jsonNumber `json:"energy_u_kj_per_mol"`
	Gap          jsonNumber `json:"gap_kj_per_mol"`
	GapPercent   jsonNumber `json:"gap_percent"`
	Verdict      string     `json:"verdict,omitempty"`
	Error        string     `json:"error,omitempty"`
	Madelung     jsonNumber `json:"madelung,omitempty"`
	MadelungFrom string     `json:"madelung_from,omitempty"`
	D0           jsonNumber `json:"d0_angstrom,omitempty"`
	D0From       string     `json:"d0_from,omitempty"`
	BornExponent jsonNumber `json:"born_exponent,omitempty"`
	Rho          jsonNumber `json:"rho_angstrom,omitempty"`
	CationRadius jsonNumber `json:"cation_radius_angstrom,omitempty"`
	AnionRadius  jsonNumber `json:"anion_radius_angstrom,omitempty"`
	MolarVolume  jsonNumber `json:"molar_volume_nm3,omitempty"`
	// Uncertainty is the model's σ and UncertaintyFrom its basis.
	Uncertainty     jsonNumber    `json:"uncertainty_kj_per_mol,omitempty"`
	UncertaintyFrom string        `json:"uncertainty_from,omitempty"`
	Extended        *extendedJSON `json:"extended,omitempty"`
}

type settingsJSON struct {
	LatticeFrom string `json:"lattice_from,omitempty"`
	Structure   string `json:"structure,omitempty"`
	Radius      string `json:"radius"`
	D0          string `json:"d0"`
	Units       string `json:"units"`
}

func cycleJSONOf(c *cycle.Cycle, r *cycle.Result) cycleJSON {
	j := cycleJSON{Formula: c.Formula, Compound: c.Formula, Name: c.Name, Family: c.Family, Tabulated: c.Tabulated,
		Cation: c.Cation.Ion.Symbol, Anion: c.Anion.Ion.Symbol,
		Convention: r.Conventions.Lattice.Symbol(), IonizationConvention: r.Conventions.Ionization.String(),
		Solved:            solvedJSON{Key: r.Solved.Key, KJPerMol: jsonNumber(r.Solved.Value), UncertaintyKJ: jsonNumber(r.Solved.Uncertainty)},
		Lattice:           latticeJSON{jsonNumber(r.Lattice.Enthalpy), jsonNumber(r.Lattice.Energy), jsonNumber(r.Lattice.Uncertainty), jsonNumber(r.Lattice.Correction)},
		VerdictThresholds: cycle.VerdictThresholds(), Verdict: verdictJSONOf(r), Notes: r.Notes, Warnings: r.Warnings,
		Settings: settingsJSON{LatticeFrom: c.Settings.LatticeFrom, Structure: c.Settings.Structure.Name(),
			Radius: c.Settings.Radius.String(), D0: c.Settings.Distance.String(), Units: c.Settings.Units.Key()},
	}
	if j.Warnings == nil {
		j.Warnings = []string{}
	}
	for _, s := range r.Steps {
		src := s.Source.Key
		if src == "" {
			src = s.Source.Kind.String()
		}
		missing := s.Source.Kind == cycle.SourceMissing
		v, unc := jsonNumber(s.Value), jsonNumber(s.Uncertainty)
		if missing {
			v, unc = jsonNumber(math.NaN()), jsonNumber(math.NaN())
		}
		j.Steps = append(j.Steps, stepJSON{Key: s.Key, Label: s.Label, Reaction: s.Reaction, KJPerMol: v, UncertaintyKJ: unc,
			Multiplicity: jsonNumber(s.Multiplicity), Source: src, SourceKind: s.Source.Kind.String(), Citation: s.Source.Citation,
			Memory: s.Source.Memory, Derived: s.Source.Derived, Override: s.Source.Override, DefaultUncertainty: s.Source.DefaultUncertainty,
			Unknown: s.Unknown, Parent: s.Parent, Missing: missing})
	}
	if h := r.Handbook; h != nil {
		j.Handbook = &handbookJSON{jsonNumber(h.Tabulated), h.Convention.Symbol(), jsonNumber(h.Value), jsonNumber(h.Difference),
			jsonNumber(h.Percent), h.Source.Key, h.Source.Memory}
	}
	for _, m := range r.Models {
		mj := modelJSONOf(m)
		if m.Err == nil {
			in := m.Inputs
			mj.Verdict = verdictText(r, m)
			mj.Madelung, mj.MadelungFrom, mj.D0, mj.D0From = jsonNumber(in.Madelung), in.MadelungFrom, jsonNumber(in.D0), in.D0From
			mj.BornExponent, mj.Rho = jsonNumber(in.BornExponent), jsonNumber(in.Rho)
			mj.CationRadius, mj.AnionRadius, mj.MolarVolume = jsonNumber(in.CationRadius), jsonNumber(in.AnionRadius), jsonNumber(in.MolarVolume)
			mj.Uncertainty, mj.UncertaintyFrom, mj.Extended = jsonNumber(m.Uncertainty), m.UncertaintyBasis, extendedJSONOf(in.Extended)
		}
		j.Models = append(j.Models, mj)
	}
	return j
}

// modelJSONOf is the part of a model's JSON that cycle and compare share:
// its value, energy and gap, or its error (the values then null).
func modelJSONOf(m cycle.ModelResult) modelJSON {
	mj := modelJSON{Model: m.Model, KJPerMol: jsonNumber(m.Value), EnergyKJ: jsonNumber(m.Energy), Gap: jsonNumber(m.Gap), GapPercent: jsonNumber(m.GapPercent)}
	if m.Err != nil {
		mj.Error = commandLineText(m.Err)
		mj.KJPerMol, mj.EnergyKJ = jsonNumber(math.NaN()), jsonNumber(math.NaN())
	}
	return mj
}

// verdictText is a model's verdict in words, or why none is given.
func verdictText(r *cycle.Result, m cycle.ModelResult) string {
	if len(r.Circular) > 0 {
		return "not judged: " + r.Circular[0].Ion + " was fitted to this salt"
	}
	return m.Verdict.Character.String()
}

type anionValueJSON struct {
	InForce      string      `json:"in_force"`
	Other        string      `json:"other"`
	Step         string      `json:"step"`
	InForceKJ    jsonNumber  `json:"in_force_kj_per_mol"`
	OtherKJ      jsonNumber  `json:"other_kj_per_mol"`
	Solved       string      `json:"solved"`
	ShiftKJ      jsonNumber  `json:"solved_shift_with_other_kj_per_mol"`
	FittedValue  *jsonNumber `json:"fitted_gas_formation_kj_per_mol,omitempty"`
	FittedSE     *jsonNumber `json:"fitted_standard_error_kj_per_mol,omitempty"`
	FittedSource string      `json:"fitted_lattice_source,omitempty"`
}

func anionValueJSONOf(c *cycle.Cycle, e *cycle.AnionValueEffect) *anionValueJSON {
	if e == nil {
		return nil
	}
	j := &anionValueJSON{InForce: string(e.InForce), Other: string(e.Other), Step: e.Step, InForceKJ: jsonNum(e.InForceValue),
		OtherKJ: jsonNum(e.OtherValue), Solved: e.Solved, ShiftKJ: jsonNum(e.Shift)}
	for _, f := range c.Fitted {
		if f.Ion == c.Anion.Ion.Symbol {
			v, u := jsonNum(f.GasFormation.V), jsonNum(f.GasFormation.U)
			j.FittedValue, j.FittedSE, j.FittedSource = &v, &u, f.Model
		}
	}
	return j
}
