package cli

import (
	"encoding/csv"
	"fmt"
	"io"
	"math"
	"os"
	"strconv"
	"strings"

	"enthalpath/cycle/analysis"
	"enthalpath/thermo"
)

const stabilitySynopsis = "stability FORMULA [--temperature K] [--pressure BAR] [--from K] [--to K] [--points N] [--estimate-only] [--charges M=+2,X=-1] [--model MODEL] [--structure PROTOTYPE] [--set KEY=VALUE] [--json|--csv] [--svg FILE]"

func runStability(env Env, args []string) error {
	fs := NewFlagSet("stability")
	var charges, model, structure, svgFile string
	var temp, pres, from, to float64
	var points int
	var sets listFlag
	var asJSON, asCSV, estimateOnly bool
	fs.Float64Var(&temp, "temperature", thermo.StandardTemperature, "temperature of the verdicts in `K`")
	fs.Float64Var(&pres, "pressure", 1, "partial pressure in `BAR` of every gas given off")
	fs.Float64Var(&from, "from", thermo.StandardTemperature, "lowest temperature of the ΔrG(T) curves in `K`")
	fs.Float64Var(&to, "to", analysis.DefaultCurveTo, "highest temperature of the ΔrG(T) curves in `K`")
	fs.IntVar(&points, "points", analysis.DefaultCurvePoints, "`N` temperatures on each curve")
	fs.BoolVar(&estimateOnly, "estimate-only", false, "leave out the compound's own measured ΔfH°, S° and ΔfG° and use the estimates")
	fs.StringVar(&charges, "charges", "", "ion charges by element, `M=+2,X=-1`")
	fs.StringVar(&model, "model", analysis.DefaultModel, "lattice `MODEL` of the estimates: "+strings.Join(analysis.EstimateModels(), ", "))
	fs.StringVar(&structure, "structure", "", "`PROTOTYPE` for the Born models")
	fs.Var(&sets, "set", "give step KEY of the compound's cycle a value, `KEY=VALUE[±UNC]` kJ/mol; repeatable")
	fs.BoolVar(&asJSON, "json", false, "print JSON")
	fs.BoolVar(&asCSV, "csv", false, "print the ΔrG(T) curves as CSV")
	fs.StringVar(&svgFile, "svg", "", "write the ΔrG(T) curves as an SVG drawing to `FILE`")
	pos, a, err := analysisSetup(env, fs, args)
	if err != nil || a == nil {
		return err
	}
	if len(pos) != 1 {
		return Usagef("give one formula: usage: enthalpath %s", stabilitySynopsis)
	}
	if asJSON && asCSV {
		return Usagef("choose one of --csv and --json")
	}
	if err := positiveFlags(flagValue{"temperature", temp}, flagValue{"pressure", pres}, flagValue{"from", from}, flagValue{"to", to}); err != nil {
		return err
	}
	if to <= from {
		return Usagef("--to %g is not above --from %g: give the curves' range lowest first", to, from)
	}
	if points < 2 || points > 10000 {
		return Usagef("--points %d: give 2 to 10000 temperatures", points)
	}
	opt := analysis.StabilityOptions{Temperature: temp, Pressure: pres, From: from, To: to, Points: points, EstimateOnly: estimateOnly,
		Estimate: analysis.EstimateOptions{Model: model, Structure: structure}}
	if charges != "" {
		if opt.Estimate.Charges, err = analysis.ParseCharges(charges, pos[0]); err != nil {
			return inputError(err)
		}
	}
	if opt.Estimate.Sets, err = parseSets(sets); err != nil {
		return err
	}
	st, err := a.Stability(pos[0], opt)
	if err != nil {
		return inputError(err)
	}
	if svgFile != "" {
		if err := writeStabilitySVG(svgFile, st); err != nil {
			return err
		}
	}
	switch {
	case asJSON:
		return writeJSON(env.Stdout, stabilityJSONOf(st))
	case asCSV:
		return writeStabilityCSV(env.Stdout, st)
	}
	printStability(env.Stdout, st)
	return nil
}

// flagValue is a numeric flag's name and value.
type flagValue struct {
	name string
	v    float64
}

// positiveFlags refuses the first flag whose value is not a positive
// finite number.
func positiveFlags(flags ...flagValue) error {
	for _, f := range flags {
		if !(f.v > 0) || math.IsInf(f.v, 0) {
			return Usagef("--%s %g: give a positive number", f.name, f.v)
		}
	}
	return nil
}

func writeStabilitySVG(name string, st *analysis.Stability) error {
	f, err := os.Create(name)
	if err != nil {
		return &UsageError{fmt.Errorf("--svg %s: %w", name, err)}
	}
	if _, err := io.WriteString(f, stabilitySVG(st)); err != nil {
		f.Close()
		return fmt.Errorf("writing %s: %w", name, err)
	}
	return f.Close()
}

// quantityText writes a quantity with its σ, or "—".
func quantityText(q analysis.Quantity, unit string) string {
	if !q.Known() {
		return "—"
	}
	return energyPM(q.Value, q.Uncertainty, thermo.KJPerMol) + " " + unit
}

func kelvin(t float64) string { return strconv.FormatFloat(t, 'f', -1, 64) }

// crossingText words where ΔrG changes sign.
func crossingText(r analysis.Reaction) string {
	switch {
	case r.Crossing != nil:
		side := "goes above"
		if r.Crossing.Below {
			side = "goes below"
		}
		return fmt.Sprintf("%s K (%s)", plusMinus(r.Crossing.Temperature, r.Crossing.Uncertainty), side)
	case r.Released == "":
		return ""
	}
	return r.NoCrossing
}

func thermoLines(w io.Writer, label string, t analysis.Thermo) {
	what := "ionic estimate"
	switch {
	case t.Known && t.Molecular:
		what = "molecular " + stateName(t.State) + ", measured"
	case t.Known:
		what = stateName(t.State) + ", measured"
	}
	name := ""
	if t.Name != "" {
		name = " — " + t.Name
	}
	fmt.Fprintf(w, "  %s %s%s: %s\n", label, t.Formula, name, what)
	tb := &table{head: []string{"quantity", "value", "from"}, right: map[int]bool{1: true}}
	tb.add("ΔfH°", quantityText(t.Formation, "kJ/mol"), t.Formation.Basis)
	tb.add("S°", quantityText(t.Entropy, "J/(mol·K)"), t.Entropy.Basis)
	if t.AdditiveEntropy.Known() {
		tb.add("S°, additive", quantityText(t.AdditiveEntropy, "J/(mol·K)"), t.AdditiveEntropy.Basis)
	}
	tb.add("ΔfG°(298.15 K)", quantityText(t.Gibbs, "kJ/mol"), t.Gibbs.Basis)
	tb.write(w, "    ")
}

func stateName(s string) string {
	switch {
	case s == "l":
		return "liquid"
	case s == "g":
		return "gas"
	}
	return "solid"
}

func printStability(w io.Writer, st *analysis.Stability) {
	fmt.Fprintf(w, "stability of %s at %s K, gases given off at %g bar\n\n", st.Formula, kelvin(st.Temperature), st.Pressure)
	thermoLines(w, "compound", st.Compound)
	if st.Estimate != nil && (st.Compound.Known || st.Compound.Formula != st.Estimate.Formula) {
		thermoLines(w, "beside it", *st.Estimate)
	} else if st.EstimateError != nil && st.Compound.Known {
		fmt.Fprintf(w, "  no ionic estimate: %s\n", wrapText(st.EstimateError.Error(), 96, "    "))
	}
	fmt.Fprintln(w)
	printReactions(w, st)
	for _, n := range st.Notes {
		fmt.Fprintf(w, "  note: %s\n", wrapText(n, 96, "        "))
	}
}

// printReactions writes the reactions of a stability analysis as a table.
func printReactions(w io.Writer, st *analysis.Stability) {
	u := thermo.KJPerMol
	if len(st.Reactions) > 0 {
		t := &table{head: []string{"reaction", "ΔrH° kJ/mol", "ΔrS° J/(mol·K)", "ΔrG(" + kelvin(st.Temperature) + " K) kJ/mol", "verdict", "ΔrG = 0 at"},
			right: map[int]bool{1: true, 2: true, 3: true}}
		for _, r := range st.Reactions {
			s := "—"
			if r.EntropyKnown {
				s = energyPM(r.Standard.Entropy, r.Standard.EntropyUncertainty, u)
			}
			verdict := r.Verdict.String()
			if r.Estimated {
				verdict += " (estimate)"
			}
			t.add(strings.ReplaceAll(r.Equation, "->", "→"), energyPM(r.Standard.Enthalpy, r.Standard.EnthalpyUncertainty, u), s,
				energyPM(r.Gibbs, r.GibbsUncertainty, u), verdict, crossingText(r))
		}
		t.write(w, "  ")
		fmt.Fprintln(w)
	}
}

type quantityJSON struct {
	Value       jsonNumber `json:"value"`
	Uncertainty jsonNumber `json:"uncertainty"`
	Measured    bool       `json:"measured"`
	Basis       string     `json:"basis"`
}

func quantityJSONOf(q analysis.Quantity) *quantityJSON {
	if !q.Known() {
		return nil
	}
	return &quantityJSON{jsonNum(q.Value), jsonNum(q.Uncertainty), q.Measured, q.Basis}
}

type thermoJSON struct {
	Formula        string        `json:"formula"`
	Name           string        `json:"name,omitempty"`
	State          string        `json:"state"`
	Known          bool          `json:"in_data"`
	Molecular      bool          `json:"molecular"`
	FormationKJ    *quantityJSON `json:"formation_kj_per_mol"`
	EntropyJK      *quantityJSON `json:"entropy_j_per_mol_k"`
	GibbsKJ        *quantityJSON `json:"gibbs_formation_298_kj_per_mol"`
	FormationEntJK *quantityJSON `json:"formation_entropy_j_per_mol_k"`
	VolumeNM3      *quantityJSON `json:"formula_unit_volume_nm3,omitempty"`
	AdditiveJK     *quantityJSON `json:"additive_entropy_j_per_mol_k,omitempty"`
	// EntropyDomain is set when the entropy is the volume-based estimate.
	EntropyDomain *entropyDomainJSON `json:"volume_entropy_domain,omitempty"`
}

// entropyDomainJSON is the volume line's domain verdict (analysis.EntropyDomain).
type entropyDomainJSON struct {
	Judged       bool       `json:"judged"`
	Inside       bool       `json:"inside"`
	DebyeK       jsonNumber `json:"debye_temperature_k,omitempty"`
	DebyeEntropy jsonNumber `json:"debye_lattice_entropy_j_per_mol_k,omitempty"`
	Verdict      string     `json:"verdict"`
}

func thermoJSONOf(t analysis.Thermo) *thermoJSON {
	return &thermoJSON{Formula: t.Formula, Name: t.Name, State: t.State, Known: t.Known, Molecular: t.Molecular,
		FormationKJ: quantityJSONOf(t.Formation), EntropyJK: quantityJSONOf(t.Entropy), GibbsKJ: quantityJSONOf(t.Gibbs),
		FormationEntJK: quantityJSONOf(t.FormationEntropy), VolumeNM3: quantityJSONOf(t.Volume), AdditiveJK: quantityJSONOf(t.AdditiveEntropy),
		EntropyDomain: entropyDomainJSONOf(t.EntropyDomain)}
}

func entropyDomainJSONOf(d *analysis.EntropyDomain) *entropyDomainJSON {
	if d == nil {
		return nil
	}
	return &entropyDomainJSON{Judged: d.Judged, Inside: d.Inside, DebyeK: jsonNumber(d.DebyeTemperature),
		DebyeEntropy: jsonNumber(d.DebyeEntropy), Verdict: d.String()}
}

type pointJSON struct {
	T     jsonNumber `json:"temperature_k"`
	G     jsonNumber `json:"gibbs_kj_per_mol"`
	Sigma jsonNumber `json:"uncertainty_kj_per_mol"`
}

type reactionJSON struct {
	Equation        string      `json:"reaction"`
	Kind            string      `json:"kind"`
	EnthalpyKJ      jsonNumber  `json:"enthalpy_kj_per_mol"`
	EnthalpyUncKJ   jsonNumber  `json:"enthalpy_uncertainty_kj_per_mol"`
	EntropyJK       *jsonNumber `json:"entropy_j_per_mol_k,omitempty"`
	EntropyUncJK    *jsonNumber `json:"entropy_uncertainty_j_per_mol_k,omitempty"`
	GibbsKJ         *jsonNumber `json:"gibbs_kj_per_mol,omitempty"`
	GibbsUncKJ      *jsonNumber `json:"gibbs_uncertainty_kj_per_mol,omitempty"`
	EnthalpyVerdict string      `json:"enthalpy_verdict"`
	Verdict         string      `json:"verdict"`
	Estimated       bool        `json:"uses_estimates"`
	Correlated      bool        `json:"uncertainty_correlated"`
	Released        string      `json:"gas_given_off,omitempty"`
	CrossingK       *jsonNumber `json:"gibbs_zero_k,omitempty"`
	CrossingUncK    *jsonNumber `json:"gibbs_zero_uncertainty_k,omitempty"`
	GoesAbove       *bool       `json:"goes_above_zero_temperature,omitempty"`
	NoCrossing      string      `json:"no_zero,omitempty"`
	HeatCapacity    string      `json:"heat_capacities"`
	Curve           []pointJSON `json:"curve,omitempty"`
}

func numPtr(v float64) *jsonNumber { n := jsonNum(v); return &n }

func reactionJSONOf(r analysis.Reaction, curve []pointJSON) reactionJSON {
	j := reactionJSON{Equation: r.Equation, Kind: r.Kind, EnthalpyKJ: jsonNum(r.Standard.Enthalpy), EnthalpyUncKJ: jsonNum(r.Standard.EnthalpyUncertainty),
		EnthalpyVerdict: r.EnthalpyVerdict.String(), Verdict: r.Verdict.String(), Estimated: r.Estimated, Correlated: r.Correlated, Released: r.Released, NoCrossing: r.NoCrossing,
		HeatCapacity: r.HeatCapacityBasis(), Curve: curve}
	if r.EntropyKnown {
		j.EntropyJK, j.EntropyUncJK = numPtr(r.Standard.Entropy), numPtr(r.Standard.EntropyUncertainty)
		j.GibbsKJ, j.GibbsUncKJ = numPtr(r.Gibbs), numPtr(r.GibbsUncertainty)
	}
	if r.Crossing != nil {
		above := !r.Crossing.Below
		j.CrossingK, j.CrossingUncK, j.GoesAbove = numPtr(r.Crossing.Temperature), numPtr(r.Crossing.Uncertainty), &above
	}
	return j
}

type stabilityJSON struct {
	Formula      string         `json:"formula"`
	TemperatureK jsonNumber     `json:"temperature_k"`
	PressureBar  jsonNumber     `json:"gas_pressure_bar"`
	HeatCapacity string         `json:"heat_capacities"`
	Compound     *thermoJSON    `json:"compound"`
	Estimate     *thermoJSON    `json:"ionic_estimate,omitempty"`
	Reactions    []reactionJSON `json:"reactions"`
	Notes        []string       `json:"notes"`
}

func stabilityJSONOf(st *analysis.Stability) stabilityJSON {
	out := stabilityJSON{Formula: st.Formula, TemperatureK: jsonNum(st.Temperature), PressureBar: jsonNum(st.Pressure),
		HeatCapacity: st.HeatCapacitySummary(), Compound: thermoJSONOf(st.Compound), Reactions: []reactionJSON{}, Notes: st.Notes}
	if st.Estimate != nil {
		out.Estimate = thermoJSONOf(*st.Estimate)
	}
	for i, r := range st.Reactions {
		var curve []pointJSON
		for _, p := range st.Curves[i] {
			curve = append(curve, pointJSON{jsonNum(p.Temperature), jsonNum(p.Gibbs), jsonNum(p.Uncertainty)})
		}
		out.Reactions = append(out.Reactions, reactionJSONOf(r, curve))
	}
	return out
}

// writeStabilityCSV writes one row per reaction and temperature of the curves.
func writeStabilityCSV(w io.Writer, st *analysis.Stability) error {
	cw := csv.NewWriter(w)
	cw.Write([]string{"reaction", "kind", "temperature_k", "gibbs_kj_per_mol", "uncertainty_kj_per_mol", "gas_pressure_bar", "verdict", "heat_capacities"})
	f := func(v float64) string { return strconv.FormatFloat(v, 'f', 3, 64) }
	for i, r := range st.Reactions {
		for _, p := range st.Curves[i] {
			v := analysis.CurveVerdict(p).String()
			cw.Write([]string{r.Equation, r.Kind, f(p.Temperature), f(p.Gibbs), f(p.Uncertainty), strconv.FormatFloat(st.Pressure, 'g', -1, 64), v, r.HeatCapacityBasis()})
		}
	}
	cw.Flush()
	return cw.Error()
}
