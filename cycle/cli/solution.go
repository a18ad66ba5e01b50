package cli

import (
	"fmt"
	"io"
	"strings"

	"enthalpath/cycle/analysis"
	"enthalpath/thermo"
)

const solutionSynopsis = "solution FORMULA [--solve KEY] [--set KEY=VALUE[±UNC]] [--scale conventional|absolute] [--lattice-from MODEL] [--json]"

func runSolution(env Env, args []string) error {
	fs := NewFlagSet("solution")
	var solve, scale, latticeFrom string
	var sets listFlag
	var asJSON bool
	fs.StringVar(&solve, "solve", analysis.KeyDissolution, "the term `KEY` to solve: "+strings.Join(analysis.SolutionKeys(), ", "))
	fs.Var(&sets, "set", "give term KEY a value, `KEY=VALUE[±UNC]` kJ/mol per reaction as written (e.g. dissolution=3.9); repeatable")
	fs.StringVar(&scale, "scale", analysis.ScaleConventional, "hydration-enthalpy `SCALE`: conventional (ΔhydH°(H⁺) = 0) or absolute")
	fs.StringVar(&latticeFrom, "lattice-from", "", "take the lattice term from a `MODEL` instead of the Born–Haber cycle")
	fs.BoolVar(&asJSON, "json", false, "print JSON")
	pos, a, err := analysisSetup(env, fs, args)
	if err != nil || a == nil {
		return err
	}
	if len(pos) != 1 {
		return Usagef("give one formula: usage: enthalpath %s", solutionSynopsis)
	}
	st, err := parseSets(sets)
	if err != nil {
		return err
	}
	sc, err := a.Solution(pos[0], analysis.SolutionOptions{Solve: solve, Sets: st, Scale: scale, LatticeFrom: latticeFrom})
	if err != nil {
		return inputError(err)
	}
	if asJSON {
		return writeJSON(env.Stdout, solutionJSONOf(sc))
	}
	printSolution(env.Stdout, sc)
	return nil
}

type solutionTermJSON struct {
	Key           string     `json:"key"`
	Label         string     `json:"label"`
	Reaction      string     `json:"reaction"`
	Multiplicity  float64    `json:"multiplicity"`
	KJ            jsonNumber `json:"kj_per_mol"`
	UncertaintyKJ jsonNumber `json:"uncertainty_kj_per_mol"`
	Source        string     `json:"source"`
	Citation      string     `json:"citation,omitempty"`
}

type solutionJSON struct {
	Formula string `json:"formula"` // the compound, the key every command uses
	// Deprecated: the same as formula, kept for scripts that read it.
	Compound   string             `json:"compound"`
	Scale      string             `json:"hydration_scale"`
	ScaleNote  string             `json:"hydration_scale_note"`
	Terms      []solutionTermJSON `json:"terms"`
	Solved     solutionTermJSON   `json:"solved"`
	MeasuredKJ *jsonNumber        `json:"measured_dissolution_kj_per_mol,omitempty"`
	Notes      []string           `json:"notes"`
}

func solutionJSONOf(sc *analysis.SolutionCycle) solutionJSON {
	term := func(t analysis.SolutionTerm) solutionTermJSON {
		return solutionTermJSON{Key: t.Key, Label: t.Label, Reaction: t.Reaction, Multiplicity: t.Multiplicity,
			KJ: jsonNum(t.Value), UncertaintyKJ: jsonNum(t.Uncertainty), Source: sourceWords(t.Source), Citation: t.Source.Citation}
	}
	out := solutionJSON{Formula: sc.Formula, Compound: sc.Formula, Scale: sc.Scale, ScaleNote: sc.ScaleNote, Solved: term(sc.Solved), Notes: sc.Notes}
	for _, t := range sc.Terms {
		out.Terms = append(out.Terms, term(t))
	}
	if sc.Measured != nil {
		v := jsonNum(sc.Measured.Value)
		out.MeasuredKJ = &v
	}
	return out
}

func printSolution(w io.Writer, sc *analysis.SolutionCycle) {
	u := thermo.KJPerMol
	fmt.Fprintf(w, "solution cycle of %s (hydration enthalpies: %s scale)\n\n", sc.Formula, sc.Scale)
	t := &table{head: []string{"term", "reaction", "×", "kJ/mol", "σ", "source"}, right: map[int]bool{2: true, 3: true, 4: true}}
	for _, x := range sc.Terms {
		t.add(x.Key, x.Reaction, fmt.Sprintf("%g", x.Multiplicity), energy(x.Value, u), energy(x.Uncertainty, u), sourceWords(x.Source))
	}
	t.write(w, "  ")
	fmt.Fprintf(w, "\n  %s (solved): %s kJ/mol\n", sc.Solved.Key, energyPM(sc.Solved.Value, sc.Solved.Uncertainty, u))
	if sc.Measured != nil && sc.Solved.Key == analysis.KeyDissolution {
		fmt.Fprintf(w, "  measured: %s kJ/mol; cycle − measured = %s kJ/mol\n", energy(sc.Measured.Value, u), energy(sc.Difference, u))
	}
	for _, n := range sc.Notes {
		fmt.Fprintf(w, "  note: %s\n", wrapText(n, 96, "        "))
	}
}
