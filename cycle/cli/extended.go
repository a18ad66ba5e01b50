package cli

import (
	"fmt"
	"io"
	"strings"

	"enthalpath/cycle"
	"enthalpath/thermo"
)

// ev writes kJ/mol as eV per formula unit with a true minus sign.
func ev(kj float64) string {
	return strings.Replace(fmt.Sprintf("%+.3f eV", thermo.KJPerMolToEV(kj)), "-", "−", 1)
}

// verdictLine says the covalency verdict, the model it is read against and
// the thresholds' basis.
func verdictLine(r *cycle.Result) string {
	m := r.Verdict()
	if m == nil {
		return "verdict: no model could be evaluated"
	}
	return fmt.Sprintf("verdict: %s, read against the %s model (%s); %s", m.Verdict.Character, m.Model, r.ReferenceWhy, m.Verdict.Basis)
}

// writeExtended prints the extended model's per-term breakdown.
func writeExtended(w io.Writer, r *cycle.Result, u thermo.Unit) {
	m, ok := r.Model(cycle.ModelExtended)
	if !ok || m.Err != nil || m.Inputs.Extended == nil {
		return
	}
	b := m.Inputs.Extended
	fmt.Fprintf(w, "\nextended model, per term (%s; and eV per formula unit)\n", u)
	first := "least U"
	if b.RepulsionFitted {
		first = "repulsion fitted"
	}
	t := table{head: []string{"term", fmt.Sprintf("%s, d = %.4f Å", first, b.Minimum.D), "", fmt.Sprintf("at d₀ = %.4f Å", b.AtReference.D), ""},
		right: map[int]bool{1: true, 2: true, 3: true, 4: true}}
	min, ref := b.Terms(b.Minimum), b.Terms(b.AtReference)
	for i := range min {
		t.add(min[i].Name, energy(min[i].Value, u), ev(min[i].Value),
			energy(ref[i].Value, u), ev(ref[i].Value))
	}
	tot := b.Value
	t.add("total (the model's lattice step)", energy(tot(b.Minimum), u), ev(tot(b.Minimum)),
		energy(tot(b.AtReference), u), ev(tot(b.AtReference)))
	t.write(w, "  ")
	ind := strings.Repeat(" ", 4)
	fmt.Fprintf(w, "  d₀: %s\n", wrapText(b.ReferenceFrom, 92, ind))
	fmt.Fprintf(w, "  repulsion: %s\n", wrapText(b.RepulsionFrom, 92, ind))
	fmt.Fprintf(w, "  dispersion: %s\n", wrapText(b.DispersionFrom, 92, ind))
	fmt.Fprintf(w, "  zero-point: θ_D = %.0f K; %s\n", b.Minimum.DebyeTemperature, wrapText(b.ZeroPointFrom, 92, ind))
	fmt.Fprintf(w, "  heat content: %s\n", wrapText(b.HeatContentFrom, 92, ind))
	if len(b.Coefficients) > 0 {
		fmt.Fprintln(w, "  coefficients:")
		for _, k := range b.Coefficients {
			mem := ""
			if k.Memory {
				mem = ", from memory"
			}
			fmt.Fprintf(w, "    %s = %g %s (%s%s)\n", k.Name, k.Value, k.Unit, k.Source, mem)
		}
		seen := map[string]bool{}
		for _, k := range b.Coefficients {
			if !seen[k.Source] && k.Citation != "" {
				seen[k.Source] = true
				fmt.Fprintf(w, "  %s: %s\n", k.Source, wrapText(k.Citation, 92, ind))
			}
		}
	}
}

type verdictJSON struct {
	Model     string `json:"model"`
	Why       string `json:"why"`
	Character string `json:"character"`
	Basis     string `json:"thresholds"`
}

func verdictJSONOf(r *cycle.Result) *verdictJSON {
	m := r.Verdict()
	if m == nil {
		return nil
	}
	return &verdictJSON{Model: m.Model, Why: r.ReferenceWhy, Character: m.Verdict.Character.String(), Basis: m.Verdict.Basis}
}

type termJSON struct {
	Name string     `json:"term"`
	KJ   jsonNumber `json:"kj_per_mol"`
	EV   jsonNumber `json:"ev_per_formula_unit"`
}

type extendedAtJSON struct {
	D                jsonNumber `json:"d_angstrom"`
	Terms            []termJSON `json:"terms"`
	TotalKJ          jsonNumber `json:"lattice_step_kj_per_mol"`
	DebyeTemperature jsonNumber `json:"debye_temperature_k"`
	BulkModulusGPa   jsonNumber `json:"bulk_modulus_gpa"`
}

type coefficientJSON struct {
	Name     string     `json:"name"`
	Value    jsonNumber `json:"value"`
	Unit     string     `json:"unit"`
	Source   string     `json:"source"`
	Citation string     `json:"citation"`
	Memory   bool       `json:"memory"`
}

type extendedJSON struct {
	Minimum        extendedAtJSON    `json:"least_energy"`
	AtReference    extendedAtJSON    `json:"at_reference_distance"`
	ReferenceFrom  string            `json:"reference_distance_from"`
	Measured       bool              `json:"reference_distance_measured"`
	DispersionSet  string            `json:"dispersion_set"`
	Fitted         bool              `json:"repulsion_fitted"`
	RepulsionFrom  string            `json:"repulsion_from"`
	DispersionFrom string            `json:"dispersion_from"`
	ZeroPointFrom  string            `json:"zero_point_from"`
	HeatFrom       string            `json:"heat_content_from"`
	Coefficients   []coefficientJSON `json:"coefficients"`
}

func extendedJSONOf(b *cycle.ExtendedBreakdown) *extendedJSON {
	if b == nil {
		return nil
	}
	at := func(x cycle.ExtendedTerms) extendedAtJSON {
		out := extendedAtJSON{D: jsonNumber(x.D), TotalKJ: jsonNumber(b.Value(x)),
			DebyeTemperature: jsonNumber(x.DebyeTemperature), BulkModulusGPa: jsonNumber(x.BulkModulus)}
		for _, t := range b.Terms(x) {
			out.Terms = append(out.Terms, termJSON{t.Name, jsonNumber(t.Value), jsonNumber(thermo.KJPerMolToEV(t.Value))})
		}
		return out
	}
	j := &extendedJSON{Minimum: at(b.Minimum), AtReference: at(b.AtReference), ReferenceFrom: b.ReferenceFrom, Measured: b.ReferenceMeasured,
		DispersionSet: b.Dispersion.String(), Fitted: b.RepulsionFitted,
		RepulsionFrom: b.RepulsionFrom, DispersionFrom: b.DispersionFrom, ZeroPointFrom: b.ZeroPointFrom, HeatFrom: b.HeatContentFrom, Coefficients: []coefficientJSON{}}
	for _, k := range b.Coefficients {
		j.Coefficients = append(j.Coefficients, coefficientJSON{k.Name, jsonNumber(k.Value), k.Unit, k.Source, k.Citation, k.Memory})
	}
	return j
}
