package cli

import (
	"fmt"
	"io"
	"strconv"
	"strings"

	"enthalpath/cycle"
	"enthalpath/data"
)

const trustSynopsis = "trust [--dispersion crystal|mayer] [--json] [--list]"

// runTrust prints the validation of every lattice model against the cycles
// of the built-in compounds: per family, the mean and RMS gap, and which
// model the verdict reads a compound of that family against.
func runTrust(env Env, args []string) error {
	fs := NewFlagSet("trust")
	var asJSON, list bool
	var dispersion string
	fs.BoolVar(&asJSON, "json", false, "print JSON")
	fs.StringVar(&dispersion, "dispersion", "crystal", "the extended model's dispersion set to validate: crystal (the default, which the built-in calibration holds) or mayer")
	fs.BoolVar(&list, "list", false, "list every compound a model could not evaluate, with the reason")
	pos, help, err := ParseFlags(fs, args)
	if help || err != nil {
		return err
	}
	if len(pos) > 0 {
		return Usagef("trust takes no formula: usage: enthalpath %s", trustSynopsis)
	}
	set, err := cycle.ParseDispersionSet(dispersion)
	if err != nil {
		return Usagef("--dispersion: %v", err)
	}
	db, err := LoadData(env)
	if err != nil {
		return err
	}
	v := cycle.ValidateWithDispersion(db, cycle.NewMemo(), set)
	matches, err := cycle.MatchesBuiltinCalibration(v)
	if err != nil {
		return err
	}
	if asJSON {
		j := trustJSONOf(v)
		j.CalibrationMatches, j.Overlays, j.Dispersion = matches, db.Overlays(), set.String()
		return writeJSON(env.Stdout, j)
	}
	settings := "default settings"
	if set != cycle.DispersionInCrystal {
		settings = "default settings but the extended model's dispersion set " + set.String()
	}
	writeTrust(env.Stdout, v, list, settings)
	if set != cycle.DispersionInCrystal {
		fmt.Fprintf(env.Stdout, "\nthis report is for the dispersion set %s; the built-in calibration (data/tables/%s), which the verdicts and\nestimates read their σ and thresholds from, is the default set's (%s).\n",
			set, data.CalibrationFile, cycle.DispersionInCrystal)
		return nil
	}
	writeCalibrationCheck(env.Stdout, matches, db.Overlays())
	return nil
}

// writeCalibrationCheck says whether the built-in calibration, where the
// other commands take their σ and thresholds from, matches this report.
func writeCalibrationCheck(w io.Writer, matches bool, overlays []string) {
	fmt.Fprintln(w)
	const table = "the built-in calibration (data/tables/" + data.CalibrationFile + "), which the verdicts and estimates read their σ and thresholds from,"
	switch {
	case len(overlays) > 0 && matches:
		fmt.Fprintf(w, "%s\nmatches this report: the data file %s does not change it.\n", table, strings.Join(overlays, ", "))
	case len(overlays) > 0:
		fmt.Fprintf(w, "%s\ndiffers from this report, which includes the data file %s; the verdicts keep the built-in calibration.\n", table, strings.Join(overlays, ", "))
	case matches:
		fmt.Fprintf(w, "%s\nmatches this report.\n", table)
	default:
		fmt.Fprintf(w, "%s\ndiffers from this report: the program was built with a stale table (go run ./cycle/calibgen rewrites it).\n", table)
	}
}

// familyReference is the model the verdict of a compound of the family is
// read against when the extended model cannot be evaluated for it.
func familyReference(v *cycle.Validation, family string) (string, string) {
	return v.Reference(family, func(name string) bool { return name != cycle.ModelExtended && v.Model(name) != nil })
}

func writeTrust(w io.Writer, v *cycle.Validation, list bool, settings string) {
	fmt.Fprintf(w, "lattice models against the cycles of %d built-in compounds that close (ΔH_L at 298.15 K, %s);\n", v.Compounds, settings)
	fmt.Fprintf(w, "gap = cycle − model in percent of |model|, negative when the cycle binds more\n\n")
	t := table{head: []string{"family", "model", "n", "mean", "RMS", "largest", "", ""}, right: map[int]bool{2: true, 3: true, 4: true, 5: true}}
	add := func(family string, m *cycle.ModelValidation, s cycle.FamilyStats, mark string) {
		if s.N == 0 {
			t.add(family, m.Model, "0", "—", "—", "—", "", mark)
			return
		}
		t.add(family, m.Model, strconv.Itoa(s.N), percent(s.MeanPercent), fmt.Sprintf("%.1f %%", s.RMSPercent),
			fmt.Sprintf("%.1f %%", s.MaxPercent), s.Worst, mark)
	}
	for _, fam := range append(cycle.ValidationFamilies(), "all") {
		ref, _ := familyReference(v, fam)
		for i := range v.Models {
			m := &v.Models[i]
			s, mark := m.All, ""
			if fam != "all" {
				s = m.Family(fam)
				switch m.Model {
				case cycle.ModelExtended:
					mark = "◂ verdict where it evaluates"
				case ref:
					mark = "◂ verdict otherwise"
				}
			}
			label := ""
			if i == 0 {
				label = fam
			}
			add(label, m, s, mark)
		}
	}
	t.write(w, "")
	fmt.Fprintln(w)
	for _, m := range v.Models {
		_, basis := v.Thresholds(m.Model)
		fmt.Fprintf(w, "%-13s verdict %s\n", m.Model, wrapText(basis, 96, strings.Repeat(" ", 14)))
	}
	fmt.Fprintf(w, "\nA compound's verdict is read against the extended model where it can be evaluated. Else, for the\n")
	fams := cycle.ValidatingFamilies()
	fmt.Fprintf(w, "%s and %s: the model with the smallest RMS over the compound's family (at least 5\n", strings.Join(fams[:len(fams)-1], ", "), fams[len(fams)-1])
	fmt.Fprintf(w, "compounds); for the other families, whose covalency is the question: the model with the smallest RMS\n")
	fmt.Fprintf(w, "over the alkali halides.\n")
	fmt.Fprintf(w, "A model's σ for an estimate is its RMS over the compound's family (at least 5 compounds), else over the alkali halides.\n")
	fmt.Fprintf(w, "\nnot evaluated (cycle closes, model cannot be evaluated):")
	for _, m := range v.Models {
		fmt.Fprintf(w, " %s %d;", m.Model, len(m.NotEvaluated))
	}
	if len(v.Molecular) > 0 {
		fmt.Fprintf(w, "\n%d known molecular compound(s) are left out: the models describe ionic solids", len(v.Molecular))
	}
	fmt.Fprintf(w, "\n%d compound(s) whose cycle does not close are left out", len(v.NotClosed))
	if !list {
		fmt.Fprintln(w, " (--list names every compound left out, with the reason)")
		return
	}
	fmt.Fprintln(w, ":")
	for _, n := range v.NotClosed {
		fmt.Fprintf(w, "  %-10s %s\n", n.Formula, wrapText(n.Reason, 100, strings.Repeat(" ", 13)))
	}
	for _, m := range v.Models {
		if len(m.NotEvaluated) == 0 {
			continue
		}
		fmt.Fprintf(w, "not evaluated by %s:\n", m.Model)
		for _, n := range m.NotEvaluated {
			fmt.Fprintf(w, "  %-10s %s\n", n.Formula, wrapText(n.Reason, 100, strings.Repeat(" ", 13)))
		}
	}
}

type familyJSON struct {
	Family      string     `json:"family"`
	N           int        `json:"n"`
	MeanPercent jsonNumber `json:"mean_gap_percent"`
	RMSPercent  jsonNumber `json:"rms_gap_percent"`
	MaxPercent  jsonNumber `json:"largest_gap_percent"`
	Worst       string     `json:"largest_gap_compound,omitempty"`
}

type notEvaluatedJSON struct {
	Formula string `json:"compound"`
	Reason  string `json:"reason"`
}

type modelTrustJSON struct {
	Model        string             `json:"model"`
	Families     []familyJSON       `json:"families"`
	All          familyJSON         `json:"all"`
	Thresholds   string             `json:"verdict_thresholds"`
	NotEvaluated []notEvaluatedJSON `json:"not_evaluated"`
}

type trustJSON struct {
	Compounds int                `json:"compounds_closing"`
	Models    []modelTrustJSON   `json:"models"`
	Reference map[string]string  `json:"verdict_model_without_extended"`
	NotClosed []notEvaluatedJSON `json:"cycle_does_not_close"`
	// Molecular: the known molecular compounds left out of the statistics.
	Molecular []string `json:"molecular_left_out"`
	// CalibrationMatches: the built-in calibration equals this report.
	CalibrationMatches bool     `json:"builtin_calibration_matches"`
	Overlays           []string `json:"data_files,omitempty"`
	// Dispersion is the extended model's dispersion set validated.
	Dispersion string `json:"dispersion_set"`
}

func trustJSONOf(v *cycle.Validation) trustJSON {
	fam := func(s cycle.FamilyStats) familyJSON {
		out := familyJSON{Family: s.Family, N: s.N, MeanPercent: jsonNumber(s.MeanPercent), RMSPercent: jsonNumber(s.RMSPercent),
			MaxPercent: jsonNumber(s.MaxPercent), Worst: s.Worst}
		return out
	}
	list := func(ns []cycle.NotEvaluated) []notEvaluatedJSON {
		out := []notEvaluatedJSON{}
		for _, n := range ns {
			out = append(out, notEvaluatedJSON{n.Formula, n.Reason})
		}
		return out
	}
	j := trustJSON{Compounds: v.Compounds, Reference: map[string]string{}, NotClosed: list(v.NotClosed),
		Molecular: append([]string{}, v.Molecular...)}
	for _, m := range v.Models {
		_, basis := v.Thresholds(m.Model)
		mj := modelTrustJSON{Model: m.Model, All: fam(m.All), Thresholds: basis, NotEvaluated: list(m.NotEvaluated)}
		for _, f := range m.Families {
			mj.Families = append(mj.Families, fam(f))
		}
		j.Models = append(j.Models, mj)
	}
	for _, f := range cycle.ValidationFamilies() {
		j.Reference[f], _ = familyReference(v, f)
	}
	return j
}
