package cli

import (
	"fmt"
	"io"
	"strings"

	"enthalpath/cycle/analysis"
	"enthalpath/data"
)

func runRadiusFit(env Env, a *analysis.Analyst, pos []string, ion, counterRadii, only string, u, rc float64, asJSON bool) error {
	switch {
	case len(pos) != 0:
		return Usagef("--all-salts takes no formula (it uses every salt of %s in the data); got %s", ion, data.QuoteInput(strings.Join(pos, " ")))
	case u != 0:
		return Usagef("--lattice goes with one FORMULA, not with --all-salts (each salt's lattice energy is its own cycle's)")
	case rc != 0:
		return Usagef("--counter-radius goes with one FORMULA; with --all-salts give --counter-radii ION=Å,...")
	}
	var radii map[string]float64
	if strings.TrimSpace(counterRadii) != "" {
		var err error
		if radii, err = analysis.ParseRadii(counterRadii); err != nil {
			return Usagef("--counter-radii: %v", err)
		}
	}
	f, err := a.FitRadius(ion, analysis.FitOptions{CounterRadii: radii, Only: splitComma(only)})
	if err != nil {
		return inputError(err)
	}
	if asJSON {
		return writeJSON(env.Stdout, radiusFitJSONOf(f))
	}
	printRadiusFit(env.Stdout, f)
	return nil
}

type radiusFitSaltJSON struct {
	Formula string `json:"formula"` // the compound, the key every command uses
	// Deprecated: the same as formula, kept for scripts that read it.
	Compound        string      `json:"compound"`
	Counter         string      `json:"counter_ion"`
	CounterRadius   *jsonNumber `json:"counter_radius_angstrom,omitempty"`
	CounterFrom     string      `json:"counter_radius_from,omitempty"`
	LatticeEnergyKJ *jsonNumber `json:"lattice_energy_kj_per_mol,omitempty"`
	LatticeFrom     string      `json:"lattice_energy_from,omitempty"`
	Radius          *jsonNumber `json:"radius_angstrom,omitempty"`
	ResidualKJ      *jsonNumber `json:"residual_kj_per_mol,omitempty"`
	Skipped         string      `json:"skipped,omitempty"`
}

type radiusFitJSON struct {
	Ion           string              `json:"ion"`
	Radius        jsonNumber          `json:"fitted_radius_angstrom"`
	Mean          jsonNumber          `json:"mean_radius_angstrom"`
	SD            *jsonNumber         `json:"sd_angstrom"`
	SE            *jsonNumber         `json:"se_angstrom"`
	RMSResidual   jsonNumber          `json:"rms_residual_kj_per_mol"`
	Used          int                 `json:"salts_used"`
	Tabulated     *jsonNumber         `json:"tabulated_radius_angstrom,omitempty"`
	TabulatedFrom string              `json:"tabulated_radius_from,omitempty"`
	CounterRadii  string              `json:"counter_radii_from"`
	Salts         []radiusFitSaltJSON `json:"salts"`
	Notes         []string            `json:"notes"`
}

func radiusFitJSONOf(f *analysis.FittedRadius) radiusFitJSON {
	out := radiusFitJSON{Ion: f.Ion, Radius: jsonNum(f.Radius), Mean: jsonNum(f.Mean),
		RMSResidual: jsonNum(f.RMSResidual), Used: len(f.Used()), Notes: f.Notes, CounterRadii: f.CounterRadiiFrom(), Salts: []radiusFitSaltJSON{}}
	if f.HasSpread { // null with one salt: no spread can be given
		sd, se := jsonNum(f.SD), jsonNum(f.SE)
		out.SD, out.SE = &sd, &se
	}
	if f.Tabulated != nil {
		out.Tabulated, out.TabulatedFrom = optNum(f.Tabulated.Value), f.Tabulated.From
	}
	for _, s := range f.Salts {
		j := radiusFitSaltJSON{Formula: s.Formula, Compound: s.Formula, Counter: s.Counter, Skipped: s.Skipped}
		if s.Skipped == "" {
			j.CounterRadius, j.CounterFrom = optNum(s.CounterRadius.Value), s.CounterRadius.From
			j.LatticeEnergyKJ, j.LatticeFrom = optNum(s.LatticeEnergy), s.LatticeFrom
			r, res := jsonNum(s.Radius), jsonNum(s.Residual)
			j.Radius, j.ResidualKJ = &r, &res
		}
		out.Salts = append(out.Salts, j)
	}
	return out
}

func printRadiusFit(w io.Writer, f *analysis.FittedRadius) {
	used := f.Used()
	spread := "one salt only: no spread"
	if f.HasSpread {
		spread = fmt.Sprintf("one-salt radii %s Å, SE %.3f Å; rms misfit %.1f kJ/mol", plusMinus(f.Mean, f.SD), f.SE, f.RMSResidual)
	}
	fmt.Fprintf(w, "radius of %s fitted over %d salt(s): %.3f Å (%s)\n", f.Ion, len(used), f.Radius, spread)
	fmt.Fprintf(w, "  %s\n", f.CounterRadiiFrom())
	if f.Tabulated != nil {
		fmt.Fprintf(w, "  radius in the data: %.3f Å (%s)\n", f.Tabulated.Value, f.Tabulated.From)
	}
	fmt.Fprintln(w)
	t := &table{head: []string{"salt", "counter-ion r/Å", "U/(kJ/mol)", "r alone/Å", "misfit/(kJ/mol)"}}
	for _, s := range used {
		t.add(s.Formula, fmt.Sprintf("%s %.3f", s.Counter, s.CounterRadius.Value), fmt.Sprintf("%.1f", s.LatticeEnergy),
			fmt.Sprintf("%.3f", s.Radius), fmt.Sprintf("%+.1f", s.Residual))
	}
	t.write(w, "  ")
	if n := len(f.Salts) - len(used); n > 0 {
		fmt.Fprintf(w, "\n  left out (%d):\n", n)
		for _, s := range f.Salts {
			if s.Skipped != "" {
				fmt.Fprintf(w, "    %s: %s\n", s.Formula, wrapText(s.Skipped, 90, "      "))
			}
		}
	}
	for _, n := range f.Notes {
		fmt.Fprintf(w, "  note: %s\n", wrapText(n, 96, "        "))
	}
}
