package cli

import (
	"fmt"
	"io"
	"strings"

	"enthalpath/cycle"

	"enthalpath/cycle/analysis"
	"enthalpath/thermo"
)

const estimateSynopsis = "estimate FORMULA [--charges M=+2,X=-1] [--model MODEL] [--structure PROTOTYPE] [--cation-radius Å] [--anion-radius Å] [--set KEY=VALUE] [--solve KEY] [--temperature K] [--pressure BAR] [--json]"

func runEstimate(env Env, args []string) error {
	fs := NewFlagSet("estimate")
	var charges, model, structure, solve string
	var rc, ra, temp, pres float64
	var sets listFlag
	var asJSON bool
	fs.Float64Var(&temp, "temperature", thermo.StandardTemperature, "temperature of the stability verdicts in `K`")
	fs.Float64Var(&pres, "pressure", 1, "partial pressure in `BAR` of a gas given off")
	fs.StringVar(&charges, "charges", "", "ion charges by element, `M=+2,X=-1` or Mg=+1,Cl=-1 (M: first element of the formula, X: second)")
	fs.StringVar(&model, "model", analysis.DefaultModel, "lattice `MODEL`: "+strings.Join(analysis.EstimateModels(), ", "))
	fs.StringVar(&structure, "structure", "", "`PROTOTYPE` for the Born models (rock-salt, fluorite, …); default: the compound's own or the radius-ratio rule")
	fs.Float64Var(&rc, "cation-radius", 0, "cation radius in `Å` (default: Shannon CN VI, or the neighbour rule for a hypothetical ion)")
	fs.Float64Var(&ra, "anion-radius", 0, "anion radius in `Å`")
	fs.Var(&sets, "set", "give step KEY a value, `KEY=VALUE[±UNC]` kJ/mol; repeatable")
	fs.StringVar(&solve, "solve", "formation", "the step `KEY` to solve (the lattice step comes from the model)")
	fs.BoolVar(&asJSON, "json", false, "print JSON")
	pos, a, err := analysisSetup(env, fs, args)
	if err != nil || a == nil {
		return err
	}
	if len(pos) != 1 {
		return Usagef("give one formula: usage: enthalpath %s", estimateSynopsis)
	}
	opt := analysis.EstimateOptions{Model: model, Structure: structure, CationRadius: rc, AnionRadius: ra, Solve: solve}
	given := givenFlags(fs)
	for _, r := range []struct {
		name string
		v    float64
	}{{"cation-radius", rc}, {"anion-radius", ra}} {
		if r.v < 0 || given[r.name] && !(r.v > 0) {
			return Usagef("--%s %g: give the radius in Å, a positive number such as 1.02 (leave the flag out for the data's)", r.name, r.v)
		}
	}
	if err := positiveFlags(flagValue{"temperature", temp}, flagValue{"pressure", pres}); err != nil {
		return err
	}
	if charges != "" {
		if opt.Charges, err = analysis.ParseCharges(charges, pos[0]); err != nil {
			return inputError(err)
		}
	}
	if opt.Sets, err = parseSets(sets); err != nil {
		return err
	}
	est, err := a.Estimate(pos[0], opt)
	if err != nil {
		return inputError(err)
	}
	// The compound's decompositions; an estimate that solves another step
	// than the formation has none to offer.
	var st *analysis.Stability
	var stErr error
	if est.Solved.Key == "formation" {
		st, stErr = a.Stability(pos[0], analysis.StabilityOptions{Estimate: opt, Temperature: temp, Pressure: pres})
	}
	if asJSON {
		j := estimateJSONOf(est)
		if st != nil {
			sj := stabilityJSONOf(st)
			j.Stability = &sj
		} else if stErr != nil {
			j.StabilityError = stErr.Error()
		}
		return writeJSON(env.Stdout, j)
	}
	if st != nil && st.Compound.Known && st.Compound.Molecular {
		fmt.Fprintf(env.Stdout, "%s is a molecular %s in the data, not an ionic solid: what follows is the estimate of a hypothetical ionic %s, not of the real compound\n\n",
			st.Compound.Formula, stateName(st.Compound.State), est.Formula)
	}
	printEstimate(env.Stdout, est)
	switch {
	case st != nil:
		fmt.Fprintf(env.Stdout, "\n  stability at %s K, gases given off at %g bar:\n", kelvin(st.Temperature), st.Pressure)
		printReactions(env.Stdout, st)
		for _, n := range st.Notes {
			fmt.Fprintf(env.Stdout, "  note: %s\n", wrapText(n, 96, "        "))
		}
	case stErr != nil:
		fmt.Fprintf(env.Stdout, "\n  stability: %s\n", wrapText(stErr.Error(), 96, "    "))
	}
	return nil
}

type estimateIonJSON struct {
	Symbol       string  `json:"symbol"`
	Charge       int     `json:"charge"`
	Count        int     `json:"count"`
	Hypothetical bool    `json:"hypothetical"`
	RadiusA      float64 `json:"radius_angstrom"`
	RadiusFrom   string  `json:"radius_from"`
}

type estimateJSON struct {
	Formula string `json:"formula"` // the compound, the key every command uses
	// Deprecated: the same as formula, kept for scripts that read it.
	Compound  string          `json:"compound"`
	Tabulated bool            `json:"tabulated"`
	Cation    estimateIonJSON `json:"cation"`
	Anion     estimateIonJSON `json:"anion"`
	Model     string          `json:"model"`
	Citation  string          `json:"model_citation"`
	// Lattice step as ΔH_L (298.15 K) and as U, negative.
	LatticeKJ        jsonNumber         `json:"lattice_kj_per_mol"`
	LatticeEnergyKJ  jsonNumber         `json:"lattice_energy_kj_per_mol"`
	ModelUncertainty jsonNumber         `json:"model_uncertainty_kj_per_mol"`
	ModelBasis       string             `json:"model_uncertainty_basis"`
	Solved           string             `json:"solved"`
	FormationKJ      *jsonNumber        `json:"formation_kj_per_mol,omitempty"`
	ValueKJ          jsonNumber         `json:"kj_per_mol"`
	UncertaintyKJ    jsonNumber         `json:"uncertainty_kj_per_mol"`
	InputUncertainty jsonNumber         `json:"input_uncertainty_kj_per_mol"`
	MeasuredKJ       *jsonNumber        `json:"measured_kj_per_mol,omitempty"`
	MeasuredSource   string             `json:"measured_source,omitempty"`
	Steps            []analysisStepJSON `json:"steps"`
	Notes            []string           `json:"notes"`
	Warnings         []string           `json:"warnings,omitempty"`
	Stability        *stabilityJSON     `json:"stability,omitempty"`
	StabilityError   string             `json:"stability_error,omitempty"`
}

type analysisStepJSON struct {
	Key           string     `json:"key"`
	Reaction      string     `json:"reaction"`
	Multiplicity  float64    `json:"multiplicity"`
	KJ            jsonNumber `json:"kj_per_mol"`
	UncertaintyKJ jsonNumber `json:"uncertainty_kj_per_mol"`
	Source        string     `json:"source"`
}

func estimateJSONOf(e *analysis.Estimate) estimateJSON {
	ion := func(u analysis.IonUse) estimateIonJSON {
		return estimateIonJSON{Symbol: u.Symbol, Charge: u.Charge, Count: u.Count, Hypothetical: u.Hypothetical, RadiusA: u.Radius.Value, RadiusFrom: u.Radius.From}
	}
	out := estimateJSON{Formula: e.Formula, Compound: e.Formula, Tabulated: e.Tabulated, Cation: ion(e.Cation), Anion: ion(e.Anion),
		Model: e.Model, Citation: e.ModelCitation, LatticeKJ: jsonNum(e.Lattice), LatticeEnergyKJ: jsonNum(e.LatticeEnergy),
		ModelUncertainty: jsonNum(e.ModelUncertainty), ModelBasis: e.Spread.Basis(), Solved: e.Solved.Key,
		ValueKJ: jsonNum(e.Value), UncertaintyKJ: jsonNum(e.Uncertainty), InputUncertainty: jsonNum(e.InputUncertainty),
		Notes: e.Notes}
	if e.Solved.Key == "formation" {
		v := jsonNum(e.Value)
		out.FormationKJ = &v
	}
	if e.Measured != nil {
		v := jsonNum(e.Measured.Value)
		out.MeasuredKJ, out.MeasuredSource = &v, e.Measured.Source.Key
	}
	if e.Result != nil {
		for _, s := range e.Result.Steps {
			out.Steps = append(out.Steps, analysisStepJSON{Key: s.Key, Reaction: s.Reaction, Multiplicity: s.Multiplicity,
				KJ: jsonNum(s.Value), UncertaintyKJ: jsonNum(s.Uncertainty), Source: sourceWords(s.Source)})
		}
		out.Notes = append(out.Notes, e.Result.Notes...)
		out.Warnings = e.Result.Warnings
	}
	return out
}

func printEstimate(w io.Writer, e *analysis.Estimate) {
	u := thermo.KJPerMol
	kind := "hypothetical compound"
	if e.Tabulated {
		kind = "tabulated compound"
	}
	fmt.Fprintf(w, "%s (%s): %s ×%d, %s ×%d\n", e.Formula, kind, e.Cation.Symbol, e.Cation.Count, e.Anion.Symbol, e.Anion.Count)
	fmt.Fprintf(w, "  radii: %s %.3f Å (%s); %s %.3f Å (%s)\n", e.Cation.Symbol, e.Cation.Radius.Value, e.Cation.Radius.From,
		e.Anion.Symbol, e.Anion.Radius.Value, e.Anion.Radius.From)
	fmt.Fprintf(w, "  lattice step from %s: ΔH_L %s kJ/mol (U %s), model σ %s kJ/mol\n", e.ModelTitle,
		energy(e.Lattice, u), energy(e.LatticeEnergy, u), energy(e.ModelUncertainty, u))
	fmt.Fprintf(w, "  %s\n", wrapText("model σ basis: "+e.Spread.Basis(), 96, "    "))
	if e.Result != nil {
		t := &table{head: []string{"step", "reaction", "×", "kJ/mol", "σ", "source"}, right: map[int]bool{2: true, 3: true, 4: true}}
		for _, s := range e.Result.Steps {
			if s.Parent != "" {
				continue
			}
			t.add(s.Key, s.Reaction, fmt.Sprintf("%g", s.Multiplicity), energy(s.Value, u), energy(s.Uncertainty, u), sourceWords(s.Source))
		}
		fmt.Fprintln(w)
		t.write(w, "  ")
	}
	fmt.Fprintf(w, "\n  %s (solved): %s kJ/mol  (σ from the data alone %s, model σ %s)\n", e.Solved.Key,
		energyPM(e.Value, e.Uncertainty, u), energy(e.InputUncertainty, u), energy(e.ModelUncertainty, u))
	if e.Measured != nil {
		fmt.Fprintf(w, "  measured %s: %s kJ/mol (%s); estimate − measured = %s kJ/mol\n", e.Solved.Key,
			energyPM(e.Measured.Value, e.Measured.Uncertainty, u), e.Measured.Source.Key, energy(e.Value-e.Measured.Value, u))
	}
	for _, n := range e.Notes {
		fmt.Fprintf(w, "  note: %s\n", wrapText(n, 96, "        "))
	}
	if e.Result != nil {
		for _, wn := range e.Result.Warnings {
			if otherModel(wn, e.Model) {
				continue // a model the estimate does not use
			}
			fmt.Fprintf(w, "  warning: %s\n", wrapText(wn, 96, "           "))
		}
	}
}

// otherModel reports whether warning w is about a lattice model other than
// the one an estimate used ("model born-lande: …").
func otherModel(w, used string) bool {
	for _, m := range cycle.ModelNames() {
		if m != used && strings.HasPrefix(w, "model "+m+":") {
			return true
		}
	}
	return false
}
