package cli

import (
	"fmt"
	"io"

	"enthalpath/cycle/analysis"
)

const radiusSynopsis = "radius FORMULA --ion ION [--lattice U] [--counter-radius Å] [--json]\n       enthalpath radius --ion ION --all-salts [--counter-radii ION=Å,...] [--only ION,...] [--json]"

func runRadius(env Env, args []string) error {
	fs := NewFlagSet("radius")
	var ion string
	var u, rc float64
	var asJSON, allSalts bool
	var counterRadii, only string
	fs.BoolVar(&allSalts, "all-salts", false, "fit the radius over every salt of the ion in the data (least squares), instead of one FORMULA")
	fs.StringVar(&counterRadii, "counter-radii", "", "with --all-salts: radii of counter-ions in `ION=Å,...` (e.g. K+=1.33,Na+=0.98) instead of the data's")
	fs.StringVar(&only, "only", "", "with --all-salts: use only the salts of these counter-ions, `ION,...`")
	fs.StringVar(&ion, "ion", "", "the `ION` whose radius to derive (the compound's cation or anion, e.g. NO3-)")
	fs.Float64Var(&u, "lattice", 0, "lattice energy `U` to reproduce, kJ/mol (sign ignored; default: the Born–Haber cycle's, else the data's handbook value)")
	fs.Float64Var(&rc, "counter-radius", 0, "radius of the other ion in `Å` (default: Shannon CN VI, or its thermochemical radius)")
	fs.BoolVar(&asJSON, "json", false, "print JSON")
	pos, a, err := analysisSetup(env, fs, args)
	if err != nil || a == nil {
		return err
	}
	if ion == "" {
		return Usagef("--ion is required: the ion whose radius to derive (usage: enthalpath %s)", radiusSynopsis)
	}
	given := givenFlags(fs)
	if rc < 0 || given["counter-radius"] && !(rc > 0) {
		return Usagef("--counter-radius %g: give the radius in Å, a positive number such as 1.81 (leave the flag out for the data's)", rc)
	}
	if given["lattice"] && u == 0 {
		return Usagef("--lattice 0: give the lattice energy to reproduce in kJ/mol, such as -787 (leave the flag out for the cycle's)")
	}
	if allSalts {
		return runRadiusFit(env, a, pos, ion, counterRadii, only, u, rc, asJSON)
	}
	if counterRadii != "" || only != "" {
		return Usagef("--counter-radii and --only go with --all-salts; for one compound use --counter-radius")
	}
	if len(pos) != 1 {
		return Usagef("give one formula: usage: enthalpath %s", radiusSynopsis)
	}
	d, err := a.DeriveRadius(pos[0], analysis.RadiusOptions{Ion: ion, LatticeEnergy: u, CounterRadius: rc, LatticeSource: "--lattice"})
	if err != nil {
		return inputError(err)
	}
	if asJSON {
		return writeJSON(env.Stdout, radiusJSONOf(d))
	}
	printRadius(env.Stdout, d)
	return nil
}

type radiusJSON struct {
	Formula string `json:"formula"` // the compound, the key every command uses
	// Deprecated: the same as formula, kept for scripts that read it.
	Compound             string      `json:"compound"`
	Ion                  string      `json:"ion"`
	Counter              string      `json:"counter_ion"`
	CounterRadius        float64     `json:"counter_radius_angstrom"`
	CounterFrom          string      `json:"counter_radius_from"`
	LatticeEnergyKJ      jsonNumber  `json:"lattice_energy_kj_per_mol"`
	LatticeFrom          string      `json:"lattice_energy_from"`
	Kapustinskii         *jsonNumber `json:"kapustinskii_radius_angstrom"`
	KapustinskiiHandbook *jsonNumber `json:"kapustinskii_handbook_radius_angstrom"`
	MolarVolume          *jsonNumber `json:"volume_model_formula_volume_nm3"`
	IonVolume            *jsonNumber `json:"volume_model_ion_volume_nm3"`
	VolumeRadius         *jsonNumber `json:"volume_model_radius_angstrom"`
	EffectiveRho         *jsonNumber `json:"effective_rho_angstrom"`
	Madelung             *jsonNumber `json:"madelung_constant,omitempty"`
	D0                   *jsonNumber `json:"d0_angstrom,omitempty"`
	D0From               string      `json:"d0_from,omitempty"`
	Tabulated            *jsonNumber `json:"tabulated_radius_angstrom,omitempty"`
	TabulatedFrom        string      `json:"tabulated_radius_from,omitempty"`
	Problems             []string    `json:"problems,omitempty"`
	Warnings             []string    `json:"warnings,omitempty"`
	Notes                []string    `json:"notes"`
}

func optNum(v float64) *jsonNumber {
	if v == 0 {
		return nil
	}
	j := jsonNum(v)
	return &j
}

func radiusJSONOf(d *analysis.DerivedRadius) radiusJSON {
	out := radiusJSON{Formula: d.Formula, Compound: d.Formula, Ion: d.Ion, Counter: d.Counter, CounterRadius: d.CounterRadius.Value, CounterFrom: d.CounterRadius.From,
		LatticeEnergyKJ: jsonNum(d.LatticeEnergy), LatticeFrom: d.LatticeFrom,
		Kapustinskii: optNum(d.Kapustinskii), KapustinskiiHandbook: optNum(d.KapustinskiiHandbook),
		MolarVolume: optNum(d.MolarVolume), IonVolume: optNum(d.IonVolume), VolumeRadius: optNum(d.VolumeRadius),
		EffectiveRho: optNum(d.EffectiveRho), Madelung: optNum(d.Madelung), D0: optNum(d.D0), D0From: d.D0From, Notes: d.Notes}
	if d.RhoWarning != "" {
		out.Warnings = append(out.Warnings, d.RhoWarning)
	}
	if d.Tabulated != nil {
		out.Tabulated, out.TabulatedFrom = optNum(d.Tabulated.Value), d.Tabulated.From
	}
	for _, p := range []string{d.KapustinskiiErr, d.KapustinskiiHandbookErr, d.VolumeErr, d.RhoErr} {
		if p != "" {
			out.Problems = append(out.Problems, p)
		}
	}
	return out
}

func printRadius(w io.Writer, d *analysis.DerivedRadius) {
	fmt.Fprintf(w, "radius of %s in %s that reproduces U = %.1f kJ/mol\n", d.Ion, d.Formula, d.LatticeEnergy)
	fmt.Fprintf(w, "  U from: %s\n", wrapText(d.LatticeFrom, 96, "    "))
	fmt.Fprintf(w, "  counter-ion %s: %.3f Å (%s)\n\n", d.Counter, d.CounterRadius.Value, d.CounterRadius.From)
	val := func(v float64, unit, prob string) string {
		if v == 0 {
			return "— (" + prob + ")"
		}
		return fmt.Sprintf("%.3f %s", v, unit)
	}
	t := &table{head: []string{"analysis", "result"}}
	t.add("Kapustinskii, K = 121.4 kJ·nm/mol (Jenkins' form)", val(d.KapustinskiiHandbook, "Å", d.KapustinskiiHandbookErr))
	t.add("Kapustinskii 1956, K = 1202.5 kJ·Å/mol", val(d.Kapustinskii, "Å", d.KapustinskiiErr))
	t.add("volume-based: V_m reproducing U", val(d.MolarVolume, "nm³", d.VolumeErr))
	t.add("volume-based: ion volume (V_m − counter-ions)", val(d.IonVolume, "nm³", d.VolumeErr))
	t.add("volume-based: radius of a sphere of that volume", val(d.VolumeRadius, "Å", d.VolumeErr))
	t.add("effective Born–Mayer ρ closing the gap", val(d.EffectiveRho, "Å", d.RhoErr))
	if d.Tabulated != nil {
		t.add("radius in the data", fmt.Sprintf("%.3f Å (%s)", d.Tabulated.Value, d.Tabulated.From))
	}
	t.write(w, "  ")
	if d.EffectiveRho > 0 {
		fmt.Fprintf(w, "\n  ρ with A = %.5f (%s), d₀ = %.3f Å (%s); the usual ρ is %.3f Å\n", d.Madelung, d.Structure, d.D0, d.D0From, d.DefaultRho)
	}
	if d.RhoWarning != "" {
		fmt.Fprintf(w, "  warning: %s\n", wrapText(d.RhoWarning, 96, "           "))
	}
	for _, n := range d.Notes {
		fmt.Fprintf(w, "  note: %s\n", wrapText(n, 96, "        "))
	}
}
