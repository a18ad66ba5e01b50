package cli

import (
	"encoding/csv"
	"fmt"
	"io"
	"strconv"
	"strings"

	"enthalpath/cycle/analysis"
)

const ionfitSynopsis = "ionfit ION [--from auto|handbook|MODEL] [--ionic-salts | --only ION,...] [--exclude FORMULA,...] [--json | --csv]"

func runIonfit(env Env, args []string) error {
	fs := NewFlagSet("ionfit")
	var from, only, exclude string
	var asJSON, asCSV, ionic bool
	fs.BoolVar(&ionic, "ionic-salts", false, "use only the salts the ionic models describe: of the s-block cations and NH4+ for an anion, of the halides for a cation (every salt when there are none); the rule of the built-in derived values")
	fs.StringVar(&from, "from", analysis.FitAuto, "where each salt's lattice enthalpy comes from: `SOURCE` "+strings.Join(analysis.IonFitSources(), ", ")+
		" (auto: volume-based where the salt has a measured density or cell, Kapustinskii where it has radii, otherwise volume-based with V_m summed from ion volumes fitted over the data's salts; handbook: the data's handbook lattice energies)")
	fs.StringVar(&only, "only", "", "use only the salts of these counter-ions, `ION,...`")
	fs.StringVar(&exclude, "exclude", "", "leave these salts out, `FORMULA,...`")
	fs.BoolVar(&asJSON, "json", false, "print JSON")
	fs.BoolVar(&asCSV, "csv", false, "print CSV, one row per salt")
	pos, a, err := analysisSetup(env, fs, args)
	if err != nil || a == nil {
		return err
	}
	if len(pos) != 1 {
		return Usagef("give one ion, such as SO4^2- or O2-: usage: enthalpath %s", ionfitSynopsis)
	}
	if asJSON && asCSV {
		return Usagef("--json and --csv exclude each other; give one")
	}
	if ionic && only != "" {
		return Usagef("--ionic-salts and --only both choose the counter-ions; give one")
	}
	f, err := a.FitIon(pos[0], analysis.IonFitOptions{From: from, Only: splitComma(only), Exclude: splitComma(exclude), Ionic: ionic})
	if err != nil {
		return inputError(err)
	}
	switch {
	case asJSON:
		return writeJSON(env.Stdout, ionFitJSONOf(f))
	case asCSV:
		return writeIonFitCSV(env.Stdout, f)
	}
	return printIonFit(env.Stdout, f)
}

func splitComma(s string) []string {
	var out []string
	for _, p := range strings.Split(s, ",") {
		if p = strings.TrimSpace(p); p != "" {
			out = append(out, p)
		}
	}
	return out
}

type ionFitSaltJSON struct {
	Formula string `json:"formula"` // the compound, the key every command uses
	// Deprecated: the same as formula, kept for scripts that read it.
	Compound           string      `json:"compound"`
	Counter            string      `json:"counter_ion"`
	Count              int         `json:"ions_per_formula_unit"`
	Lattice            *jsonNumber `json:"lattice_enthalpy_kj_per_mol,omitempty"`
	LatticeUncertainty *jsonNumber `json:"lattice_uncertainty_kj_per_mol,omitempty"`
	LatticeFrom        string      `json:"lattice_from,omitempty"`
	Value              *jsonNumber `json:"gas_formation_kj_per_mol,omitempty"`
	Uncertainty        *jsonNumber `json:"uncertainty_kj_per_mol,omitempty"`
	Residual           *jsonNumber `json:"residual_kj_per_mol,omitempty"`
	Normalized         *jsonNumber `json:"residual_in_sigma,omitempty"`
	Outside            bool        `json:"outside_2sigma,omitempty"`
	CounterFitted      bool        `json:"counter_ion_fitted,omitempty"`
	Skipped            string      `json:"skipped,omitempty"`
}

type ionFitJSON struct {
	Ion            string           `json:"ion"`
	Quantity       string           `json:"quantity"`
	From           string           `json:"lattice_source"`
	Models         string           `json:"lattice_sources_used"`
	Value          jsonNumber       `json:"gas_formation_kj_per_mol"`
	SE             jsonNumber       `json:"standard_error_kj_per_mol"`
	InternalSE     jsonNumber       `json:"internal_standard_error_kj_per_mol"`
	ChiSquared     jsonNumber       `json:"chi_squared"`
	EffectiveSalts jsonNumber       `json:"effective_salts"`
	Birge          *jsonNumber      `json:"birge_ratio"`
	Used           int              `json:"salts_used"`
	Outside        []string         `json:"outside_2sigma"`
	Builtin        *jsonNumber      `json:"builtin_kj_per_mol,omitempty"`
	BuiltinSE      *jsonNumber      `json:"builtin_standard_error_kj_per_mol,omitempty"`
	BuiltinModel   string           `json:"builtin_lattice_source,omitempty"`
	Salts          []ionFitSaltJSON `json:"salts"`
	Notes          []string         `json:"notes"`
}

const ionFitQuantity = "standard enthalpy of formation of the gaseous ion at 298.15 K, thermal-electron convention of the NBS tables"

func ionFitJSONOf(f *analysis.IonFit) ionFitJSON {
	out := ionFitJSON{Ion: f.Ion, Quantity: ionFitQuantity, From: f.From, Models: f.Models(), Value: jsonNum(f.Value), SE: jsonNum(f.SE),
		InternalSE: jsonNum(f.InternalSE), ChiSquared: jsonNum(f.ChiSquared), EffectiveSalts: jsonNum(f.EffectiveSalts),
		Used: len(f.Used()), Outside: f.Outside(), Notes: f.Notes, Salts: []ionFitSaltJSON{}}
	if out.Outside == nil {
		out.Outside = []string{}
	}
	if f.Birge > 0 {
		b := jsonNum(f.Birge)
		out.Birge = &b
	}
	if f.Builtin != nil {
		v, u := jsonNum(f.Builtin.GasFormation.V), jsonNum(f.Builtin.GasFormation.U)
		out.Builtin, out.BuiltinSE, out.BuiltinModel = &v, &u, f.Builtin.Model
	}
	for _, s := range f.Salts {
		j := ionFitSaltJSON{Formula: s.Formula, Compound: s.Formula, Counter: s.Counter, Count: s.Count, Skipped: s.Skipped}
		if s.Skipped == "" {
			l, lu, v, u, r, z := jsonNum(s.Lattice), jsonNum(s.LatticeUncertainty), jsonNum(s.Value), jsonNum(s.Uncertainty), jsonNum(s.Residual), jsonNum(s.Normalized)
			j.Lattice, j.LatticeUncertainty, j.LatticeFrom, j.Value, j.Uncertainty, j.Residual, j.Normalized = &l, &lu, s.LatticeFrom, &v, &u, &r, &z
			j.Outside, j.CounterFitted = s.Outside, s.CounterFitted
		}
		out.Salts = append(out.Salts, j)
	}
	return out
}

func writeIonFitCSV(w io.Writer, f *analysis.IonFit) error {
	cw := csv.NewWriter(w)
	head := []string{"ion", "fit_kj_per_mol", "fit_standard_error_kj_per_mol", "compound", "counter_ion", "ions_per_formula_unit",
		"lattice_enthalpy_kj_per_mol", "lattice_uncertainty_kj_per_mol", "lattice_from", "gas_formation_kj_per_mol", "uncertainty_kj_per_mol",
		"residual_kj_per_mol", "residual_in_sigma", "outside_2sigma", "skipped"}
	if err := cw.Write(head); err != nil {
		return err
	}
	for _, s := range f.Salts {
		rec := []string{f.Ion, num(f.Value), num(f.SE), s.Formula, s.Counter, strconv.Itoa(s.Count)}
		if s.Skipped == "" {
			rec = append(rec, num(s.Lattice), num(s.LatticeUncertainty), s.LatticeFrom, num(s.Value), num(s.Uncertainty),
				num(s.Residual), num(s.Normalized), strconv.FormatBool(s.Outside), "")
		} else {
			rec = append(rec, "", "", "", "", "", "", "", "", s.Skipped)
		}
		if err := cw.Write(rec); err != nil {
			return err
		}
	}
	cw.Flush()
	return cw.Error()
}

func printIonFit(w io.Writer, f *analysis.IonFit) error {
	used := f.Used()
	birge := "one salt: no scatter"
	if f.Birge > 0 {
		birge = fmt.Sprintf("Birge ratio %.2f over %.1f effective salts", f.Birge, f.EffectiveSalts)
	}
	fmt.Fprintf(w, "ΔfH°(%s, g, 298.15 K) over %d of %d salts: %s kJ/mol (standard error; internal %.1f, %s)\n",
		f.Ion, len(used), len(f.Salts), plusMinus(f.Value, f.SE), f.InternalSE, birge)
	fmt.Fprintf(w, "lattice enthalpies from: %s (asked: %s)\n", f.Models(), f.From)
	if b := f.Builtin; b != nil {
		fmt.Fprintf(w, "built-in derived value: %s kJ/mol (%s, %d salts)\n", plusMinus(b.GasFormation.V, b.GasFormation.U), b.Model, len(b.Salts))
	}
	fmt.Fprintln(w)
	t := &table{head: []string{"salt", "counter", "ΔH_L (kJ/mol)", "from", "ΔfH° alone", "residual", "in σ", ""}}
	for _, s := range used {
		mark := ""
		if s.Outside {
			mark = "outside 2σ"
		}
		if s.CounterFitted {
			mark = strings.TrimSpace(mark + " counter-ion fitted")
		}
		t.add(s.Formula, s.Counter, plusMinus(s.Lattice, s.LatticeUncertainty), s.LatticeFrom,
			plusMinus(s.Value, s.Uncertainty), fmt.Sprintf("%+.1f", s.Residual), fmt.Sprintf("%+.2f", s.Normalized), mark)
	}
	t.write(w, "  ")
	if out := f.Outside(); len(out) > 0 {
		fmt.Fprintf(w, "\n  outside 2σ (%d): %s — often the salts with covalent character, which no ionic model describes\n", len(out), strings.Join(out, ", "))
	}
	if n := len(f.Salts) - len(used); n > 0 {
		fmt.Fprintf(w, "\n  left out (%d):\n", n)
		for _, s := range f.Salts {
			if s.Skipped != "" {
				fmt.Fprintf(w, "    %s: %s\n", s.Formula, wrapText(s.Skipped, 90, "      "))
			}
		}
	}
	fmt.Fprintln(w)
	for _, n := range f.Notes {
		fmt.Fprintf(w, "  note: %s\n", wrapText(n, 96, "        "))
	}
	fmt.Fprintf(w, "  note: %s\n", wrapText("the value is ΔfH° of the gaseous ion in the thermal-electron convention of the NBS tables; each salt's σ holds the model's stated scatter, so |in σ| > 2 marks a salt the model fits worse than it claims", 96, "        "))
	return nil
}
