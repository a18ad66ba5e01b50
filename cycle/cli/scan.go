package cli

import (
	"fmt"
	"io"
	"math"
	"strings"

	"enthalpath/cycle/analysis"
	"enthalpath/thermo"
)

const scanSynopsis = "scan METAL NONMETAL [--max-charge N] [--anion ION] [--model MODEL] [--structure PROTOTYPE] [--temperature K] [--pressure BAR] [--json]"

func runScan(env Env, args []string) error {
	fs := NewFlagSet("scan")
	var maxCharge int
	var anion, model, structure string
	var temp, pres float64
	var asJSON bool
	fs.Float64Var(&temp, "temperature", thermo.StandardTemperature, "temperature of the Gibbs energies and verdicts in `K`")
	fs.Float64Var(&pres, "pressure", 1, "partial pressure in `BAR` of the non-metal given off")
	fs.IntVar(&maxCharge, "max-charge", 0, fmt.Sprintf("highest metal charge `N` (default: as far as the data's ionization energies go, at most %d)", analysis.DefaultMaxCharge))
	fs.StringVar(&anion, "anion", "", "the non-metal's `ION` (default: its monatomic anion in the data)")
	fs.StringVar(&model, "model", analysis.DefaultModel, "lattice `MODEL` of the estimates: "+strings.Join(analysis.EstimateModels(), ", "))
	fs.StringVar(&structure, "structure", "", "`PROTOTYPE` for the Born models")
	fs.BoolVar(&asJSON, "json", false, "print JSON")
	pos, a, err := analysisSetup(env, fs, args)
	if err != nil || a == nil {
		return err
	}
	if len(pos) != 2 {
		return Usagef("give a metal and a non-metal: usage: enthalpath %s", scanSynopsis)
	}
	if maxCharge < 0 || givenFlags(fs)["max-charge"] && maxCharge == 0 {
		return Usagef("--max-charge %d: give the highest metal charge to try, 1 or more (leave the flag out to go as far as the data's ionization energies)", maxCharge)
	}
	if err := positiveFlags(flagValue{"temperature", temp}, flagValue{"pressure", pres}); err != nil {
		return err
	}
	sc, err := a.Scan(pos[0], pos[1], analysis.ScanOptions{MaxCharge: maxCharge, Anion: anion, Model: model, Structure: structure, Temperature: temp, Pressure: pres})
	if err != nil {
		return inputError(err)
	}
	if asJSON {
		return writeJSON(env.Stdout, scanJSONOf(sc))
	}
	printScan(env.Stdout, sc)
	return nil
}

type scanCompoundJSON struct {
	Formula           string         `json:"formula"`
	Charge            int            `json:"charge"`
	MetalAtoms        int            `json:"metal_atoms"`
	FormationKJ       jsonNumber     `json:"formation_kj_per_mol"`
	UncertaintyKJ     jsonNumber     `json:"uncertainty_kj_per_mol"`
	FormationFrom     string         `json:"formation_from"`
	EstimateKJ        jsonNumber     `json:"estimate_kj_per_mol"`
	EstimateUncKJ     jsonNumber     `json:"estimate_uncertainty_kj_per_mol"`
	MeasuredKJ        *jsonNumber    `json:"measured_kj_per_mol,omitempty"`
	PerMetalKJ        jsonNumber     `json:"per_metal_kj_per_mol"`
	PerMetalUncKJ     jsonNumber     `json:"per_metal_uncertainty_kj_per_mol"`
	Stable            bool           `json:"stable_to_disproportionation"`
	LosesNonMetal     bool           `json:"loses_nonmetal"`
	LowerState        string         `json:"lower_state,omitempty"`
	CationRadiusA     float64        `json:"cation_radius_angstrom"`
	CationRadiusBasis string         `json:"cation_radius_from"`
	Thermo            *thermoJSON    `json:"compared"`
	Estimate          *thermoJSON    `json:"ionic_estimate"`
	GibbsKJ           *jsonNumber    `json:"gibbs_formation_kj_per_mol,omitempty"`
	GibbsUncKJ        *jsonNumber    `json:"gibbs_formation_uncertainty_kj_per_mol,omitempty"`
	Undecided         bool           `json:"some_reaction_undecided"`
	Releases          []reactionJSON `json:"losses_of_nonmetal"`
	Notes             []string       `json:"notes,omitempty"`
}

type disproportionationJSON struct {
	Reaction      string       `json:"reaction"`
	From          int          `json:"from_charge"`
	Lower         int          `json:"lower_charge"`
	Upper         int          `json:"upper_charge"`
	KJ            jsonNumber   `json:"kj_per_mol"`
	UncertaintyKJ jsonNumber   `json:"uncertainty_kj_per_mol"`
	Favoured      bool         `json:"favoured"`
	Energies      reactionJSON `json:"energies"`
}

type scanJSON struct {
	Metal               string                   `json:"metal"`
	NonMetal            string                   `json:"nonmetal"`
	Anion               string                   `json:"anion"`
	Model               string                   `json:"model"`
	ModelBasis          string                   `json:"model_uncertainty_basis"`
	Compounds           []scanCompoundJSON       `json:"compounds"`
	Disproportionations []disproportionationJSON `json:"disproportionations"`
	Favoured            string                   `json:"favoured"`
	FavouredTie         string                   `json:"within_2_sigma_of_favoured,omitempty"`
	TemperatureK        jsonNumber               `json:"temperature_k"`
	PressureBar         jsonNumber               `json:"nonmetal_pressure_bar"`
	Gibbs               bool                     `json:"gibbs_energies"`
	Skipped             []string                 `json:"skipped,omitempty"`
	Notes               []string                 `json:"notes"`
}

func scanJSONOf(sc *analysis.Scan) scanJSON {
	out := scanJSON{Metal: sc.Metal, NonMetal: sc.NonMetal, Anion: sc.Anion, Model: sc.Model, ModelBasis: sc.Spread.Basis(),
		Favoured: sc.Favoured, FavouredTie: sc.FavouredTie, Skipped: sc.Skipped, Notes: sc.Notes,
		TemperatureK: jsonNum(sc.Temperature), PressureBar: jsonNum(sc.Pressure), Gibbs: sc.Gibbs,
		Compounds: []scanCompoundJSON{}, Disproportionations: []disproportionationJSON{}}
	for _, c := range sc.Compounds {
		j := scanCompoundJSON{Formula: c.Formula, Charge: c.Charge, MetalAtoms: c.MetalCount,
			FormationKJ: jsonNum(c.Formation), UncertaintyKJ: jsonNum(c.Uncertainty), FormationFrom: "estimate",
			EstimateKJ: jsonNum(c.Estimate), EstimateUncKJ: jsonNum(c.EstimateUncertainty),
			PerMetalKJ: jsonNum(c.PerMetal), PerMetalUncKJ: jsonNum(c.PerMetalUncertainty),
			Stable: c.Stable, LosesNonMetal: c.LosesNonMetal, LowerState: c.LowerState,
			CationRadiusA: c.CationRadius.Value, CationRadiusBasis: c.CationRadius.From,
			Thermo: thermoJSONOf(c.Thermo), Estimate: thermoJSONOf(c.Estimated), Undecided: c.Undecided,
			Releases: []reactionJSON{}, Notes: c.Notes}
		if !math.IsNaN(c.Gibbs) {
			j.GibbsKJ, j.GibbsUncKJ = numPtr(c.Gibbs), numPtr(c.GibbsUncertainty)
		}
		for _, r := range c.Releases {
			j.Releases = append(j.Releases, reactionJSONOf(r, nil))
		}
		if c.FromData {
			j.FormationFrom = "data (" + c.Measured.Source.Key + ")"
		}
		if c.Measured != nil {
			v := jsonNum(c.Measured.Value)
			j.MeasuredKJ = &v
		}
		out.Compounds = append(out.Compounds, j)
	}
	for _, d := range sc.Disproportionations {
		out.Disproportionations = append(out.Disproportionations, disproportionationJSON{Reaction: d.Reaction, From: d.From, Lower: d.Lower, Upper: d.Upper,
			KJ: jsonNum(d.Enthalpy), UncertaintyKJ: jsonNum(d.Uncertainty), Favoured: d.Favoured, Energies: reactionJSONOf(d.Energies, nil)})
	}
	return out
}

func printScan(w io.Writer, sc *analysis.Scan) {
	u := thermo.KJPerMol
	fmt.Fprintf(w, "oxidation states of %s with %s (%s), lattice steps from %s; Gibbs energies at %s K, %s at %g bar\n\n",
		sc.Metal, sc.NonMetal, sc.Anion, sc.Model, kelvin(sc.Temperature), sc.Released, sc.Pressure)
	gHead := "ΔfG(" + kelvin(sc.Temperature) + " K)"
	t := &table{head: []string{"compound", "charge", "ΔfH° kJ/mol", gHead, "per mol " + sc.Metal, "from", "verdict"}, right: map[int]bool{1: true, 2: true, 3: true, 4: true}}
	for _, c := range sc.Compounds {
		from := "estimate"
		switch {
		case c.Thermo.Known && c.Thermo.Molecular:
			from = fmt.Sprintf("molecular %s, %s; ionic estimate %s is not the real compound", stateName(c.Thermo.State), c.Thermo.Formation.Basis, energy(c.Estimate, u))
		case c.FromData:
			from = c.Thermo.Formation.Basis + "; estimate " + energy(c.Estimate, u)
		}
		var why []string
		if c.Formation > 0 {
			why = append(why, "endothermic: unstable with respect to the elements")
		}
		if !c.Stable {
			why = append(why, "disproportionates")
		}
		if c.LosesNonMetal {
			why = append(why, "gives off "+sc.Released+", forming "+c.LowerState)
		}
		verdict := "no reaction favoured beyond 2σ"
		if len(why) > 0 {
			verdict = strings.Join(why, "; ")
		} else if c.Undecided {
			verdict = "some reaction undecided within the data"
		}
		per := c.PerMetalGibbs
		if !sc.Gibbs {
			per = c.PerMetal
		}
		t.add(c.Formula, fmt.Sprintf("%+d", c.Charge), energyPM(c.Formation, c.Uncertainty, u), energyPM(c.Gibbs, c.GibbsUncertainty, u), energy(per, u), from, verdict)
	}
	t.write(w, "  ")
	fmt.Fprintln(w)
	d := &table{head: []string{"reaction", "ΔrH° kJ/mol", "ΔrG kJ/mol", "verdict"}, right: map[int]bool{1: true, 2: true}}
	for _, r := range sc.Disproportionations {
		e := r.Energies
		d.add(arrow(e.Equation), energyPM(e.Standard.Enthalpy, e.Standard.EnthalpyUncertainty, u), energyPM(e.Gibbs, e.GibbsUncertainty, u), e.Verdict.String())
	}
	for _, c := range sc.Compounds {
		for _, e := range c.Releases {
			v := e.Verdict.String()
			if x := crossingText(e); e.Crossing != nil {
				v += "; ΔrG = 0 at " + x
			}
			d.add(arrow(e.Equation), energyPM(e.Standard.Enthalpy, e.Standard.EnthalpyUncertainty, u), energyPM(e.Gibbs, e.GibbsUncertainty, u), v)
		}
	}
	d.write(w, "  ")
	basis := "ΔfG"
	if !sc.Gibbs {
		basis = "ΔfH°"
	}
	switch {
	case sc.Favoured == "":
		fmt.Fprintf(w, "\n  favoured: none — every state is endothermic\n")
	case sc.FavouredTie != "":
		fmt.Fprintf(w, "\n  favoured: undecided within the data between %s and %s (most negative %s per mole of %s, within 2σ)\n", sc.Favoured, sc.FavouredTie, basis, sc.Metal)
	default:
		fmt.Fprintf(w, "\n  favoured: %s (most negative %s per mole of %s, beyond 2σ of the next)\n", sc.Favoured, basis, sc.Metal)
	}
	fmt.Fprintf(w, "  %s\n", wrapText("model σ basis: "+sc.Spread.Basis(), 96, "    "))
	for _, s := range sc.Skipped {
		fmt.Fprintf(w, "  skipped: %s\n", wrapText(s, 96, "           "))
	}
	for _, c := range sc.Compounds {
		for _, n := range c.Notes {
			fmt.Fprintf(w, "  %s: %s\n", c.Formula, wrapText(n, 96, "    "))
		}
	}
	for _, n := range sc.Notes {
		fmt.Fprintf(w, "  note: %s\n", wrapText(n, 96, "        "))
	}
}
