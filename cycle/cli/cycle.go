package cli

import (
	"fmt"
	"io"
	"path/filepath"
	"strconv"
	"strings"

	"enthalpath/cycle"
	"enthalpath/thermo/notation"
)

const cycleSynopsis = `cycle FORMULA [--solve KEY] [--set KEY=VALUE[±UNC]]... [--lattice-from MODEL]
                  [--structure NAME|FILE.cif] [--units kj|kcal|ev] [--anion-value fitted|textbook] [--save FILE] [--json]
       enthalpath cycle --open FILE [flags]`

func runCycle(env Env, args []string) error {
	fs := NewFlagSet("cycle")
	var mf modelFlags
	mf.register(fs)
	var solve, sets listFlag
	var latticeFrom, save, open, cation, anion, note, anionValue string
	var asJSON bool
	fs.StringVar(&anionValue, "anion-value", string(cycle.AnionFitted), "value of a multiply charged anion such as O2- or S2-: `CHOICE` "+
		strings.Join(cycle.AnionValueNames(), " or ")+" (fitted: the gas-phase value fitted over the family of salts; textbook: the cycle-derived second electron affinity of the data)")
	fs.Var(&solve, "solve", "the step `KEY` to solve for (default lattice); repeat to see the error for two unknowns")
	fs.Var(&sets, "set", "give step KEY a value: `KEY=VALUE[±UNC]` (±, +- accepted; optional unit suffix kj, kcal, ev); repeatable")
	fs.StringVar(&latticeFrom, "lattice-from", "", "fill the lattice step from a model ("+strings.Join(cycle.ModelNames(), ", ")+") and solve another step")
	fs.StringVar(&save, "save", "", "write the cycle to `FILE` (cycle file, "+cycle.FileExtension+")")
	fs.StringVar(&open, "open", "", "read the cycle from a cycle `FILE`")
	fs.StringVar(&cation, "cation", "", "cation `ION` for a hypothetical compound, e.g. Mg+")
	fs.StringVar(&anion, "anion", "", "anion `ION` for a hypothetical compound, e.g. Cl-")
	fs.BoolVar(&asJSON, "json", false, "print JSON")
	fs.StringVar(&note, "note", "", "free `TEXT` saved with the cycle file")
	pos, help, err := ParseFlags(fs, args)
	if help || err != nil {
		return err
	}
	set := givenFlags(fs)
	switch {
	case open != "" && len(pos) > 0:
		return Usagef("give either a FORMULA or --open FILE, not both")
	case open == "" && len(pos) == 0:
		return Usagef("no formula: usage: enthalpath %s", cycleSynopsis)
	case len(pos) > 1:
		return Usagef("one formula at a time (got %s); use compare for several", notation.ShortInput(strings.Join(pos, " ")))
	}
	db, err := LoadData(env)
	if err != nil {
		return err
	}
	var c *cycle.Cycle
	if open != "" {
		if c, err = cycle.Open(db, open); err != nil {
			return &UsageError{err}
		}
		if !set["structure"] {
			if err := c.ReopenStructureFile(open, nil); err != nil {
				return Usagef("--open %s: the structure file it names: %v", open, err)
			}
		}
		if err := mf.apply(c, set, false); err != nil {
			return err
		}
	} else {
		conv, err := mf.conventions()
		if err != nil {
			return err
		}
		av, err := cycle.ParseAnionValue(anionValue)
		if err != nil {
			return Usagef("--anion-value: %v", err)
		}
		if c, err = cycle.Build(db, pos[0], cycle.Options{Cation: cation, Anion: anion, Conventions: conv, AnionValue: av}); err != nil {
			return &UsageError{err}
		}
		set["lattice-as"], set["ionization-at"] = false, false
		if err := mf.apply(c, set, false); err != nil {
			return err
		}
		if err := mf.apply(c, map[string]bool{"units": true, "radii": set["radii"], "d0": set["d0"]}, false); err != nil {
			return err
		}
	}
	for _, s := range sets {
		st, err := cycle.ParseSetting(s, c.Settings.Units)
		if err != nil {
			return Usagef("--set: %v", err)
		}
		if err := st.Apply(c); err != nil {
			return Usagef("--set %s: %v", s, err)
		}
	}
	if latticeFrom != "" {
		m, err := cycle.ParseModel(latticeFrom)
		if err != nil {
			return Usagef("--lattice-from: %v", err)
		}
		c.Settings.LatticeFrom = m
		if len(solve) == 0 {
			solve = append(solve, defaultSolveWithModel(c))
		}
	}
	for i, k := range solve {
		if k == "lattice" && c.Settings.LatticeFrom != "" {
			return Usagef("--solve lattice and --lattice-from %s contradict each other: the model fills the lattice step; solve another step (e.g. --solve formation)", c.Settings.LatticeFrom)
		}
		var err error
		if i == 0 {
			err = c.SolveFor(k)
		} else {
			err = c.MarkUnknown(k)
		}
		if err != nil {
			return Usagef("--solve: %v", err)
		}
	}
	if c.Settings.LatticeFrom != "" {
		if l, ok := c.Step("lattice"); ok && l.Unknown {
			l.Unknown = false
		}
	}
	if set["note"] {
		c.Note = note
	}
	if save != "" {
		toSave := c
		if st := c.Settings.Structure; st.CIF != "" && !filepath.IsAbs(st.CIF) && open == "" {
			// The file records the CIF path relative to its own folder.
			if abs, err := filepath.Abs(st.CIF); err == nil {
				if dir, err := filepath.Abs(filepath.Dir(save)); err == nil {
					if rel, err := filepath.Rel(dir, abs); err == nil {
						toSave = c.Clone()
						toSave.Settings.Structure.CIF = rel
					}
				}
			}
		}
		if err := cycle.Save(save, toSave); err != nil {
			return outputFileError("--save", save, err)
		}
	}
	r, err := cycle.Solve(c)
	if err != nil {
		return &UsageError{err}
	}
	eff := cycle.AnionValueChoice(db, c, r)
	if asJSON {
		j := cycleJSONOf(c, r)
		j.AnionValue = anionValueJSONOf(c, eff)
		return writeJSON(env.Stdout, j)
	}
	printCycle(env.Stdout, c, r)
	printAnionValue(env.Stdout, c, eff)
	if save != "" {
		fmt.Fprintf(env.Stdout, "\nsaved to %s\n", save)
	}
	return nil
}

// defaultSolveWithModel picks the step to solve when the lattice comes from
// a model and --solve is not given: the formation enthalpy when the data
// lack it, else a cycle-derived step (the second attachment of O or S),
// else the formation enthalpy.
func defaultSolveWithModel(c *cycle.Cycle) string {
	if f, ok := c.Step("formation"); ok && f.Source.Kind == cycle.SourceMissing {
		return "formation"
	}
	for _, s := range c.Steps {
		if s.Source.Derived {
			return s.Key
		}
	}
	return "formation"
}

func sourceText(s cycle.Step) string {
	var t string
	switch s.Source.Kind {
	case cycle.SourceData:
		t = s.Source.Key
	case cycle.SourceUser:
		t = "user"
	case cycle.SourceModel:
		t = "model " + s.Source.Key
	case cycle.SourceSolved:
		t = "SOLVED"
	case cycle.SourceSum:
		t = "sum of sub-steps"
	case cycle.SourceMissing:
		t = "MISSING"
	}
	if m := s.Source.Markers(); len(m) > 0 {
		t += " [" + strings.Join(m, ", ") + "]"
	}
	return t
}

func printCycle(w io.Writer, c *cycle.Cycle, r *cycle.Result) {
	u := c.Settings.Units
	title := "Born–Haber cycle of " + c.Formula
	if c.Name != "" {
		title += " (" + c.Name + ")"
	}
	if !c.Tabulated {
		title += " — not tabulated: hypothetical"
	}
	fmt.Fprintln(w, title)
	fmt.Fprintf(w, "ions: %s ×%d, %s ×%d; conventions: %s\n\n", cycle.IonText(c.Cation.Ion), c.Cation.Count,
		cycle.IonText(c.Anion.Ion), c.Anion.Count, r.Conventions)
	t := table{head: []string{"step", "reaction", "value (" + u.String() + ")", "×", "source"}, right: map[int]bool{2: true, 3: true}}
	for _, s := range r.Steps {
		key := s.Key
		if s.Parent != "" {
			key = "  └ " + key
		}
		val := energyPM(s.Value, s.Uncertainty, u)
		if s.Source.Kind == cycle.SourceMissing {
			val = "—"
		}
		t.add(key, s.Reaction, val, strconv.FormatFloat(s.Multiplicity, 'g', 4, 64), sourceText(s))
	}
	t.write(w, "  ")
	sv := r.Solved
	fmt.Fprintf(w, "\nsolved  %s = %s %s  (%s)\n", sv.Key, energyPM(sv.Value, sv.Uncertainty, u), u, sv.Label)
	l := r.Lattice
	fmt.Fprintf(w, "lattice step (gaseous ions → solid): as enthalpy %s, as energy U %s %s\n",
		energyPM(l.Enthalpy, l.Uncertainty, u), energy(l.Energy, u), u)
	if h := r.Handbook; h != nil {
		fmt.Fprintf(w, "handbook %s %s as tabulated (%s, source %s%s) = %s as a lattice step; cycle − handbook = %s (%s)\n",
			energy(h.Tabulated, u), u, h.Convention.Symbol(), h.Source.Key, memoText(h.Source.Memory), energy(h.Value, u),
			energy(h.Difference, u), percent(h.Percent))
	}
	fmt.Fprintf(w, "\nlattice models against the cycle (%s %s; gap = cycle − model, negative when the cycle binds more)\n",
		c.Conventions.Lattice.Symbol(), "values")
	mt := table{head: []string{"model", "value", "gap", "gap %", "verdict"}, right: map[int]bool{1: true, 2: true, 3: true}}
	for _, m := range r.Models {
		if m.Err != nil {
			mt.add(m.Model, "—", "—", "—", "not available")
			continue
		}
		mt.add(m.Model, energy(m.Value, u), energy(m.Gap, u), percent(m.GapPercent), verdictText(r, m))
	}
	mt.write(w, "  ")
	fmt.Fprintf(w, "  %s\n", wrapText(verdictLine(r), 96, "    "))
	fmt.Fprintln(w, "\nmodel inputs")
	for _, m := range r.Models {
		if m.Err != nil {
			fmt.Fprintf(w, "  %-12s %s\n", m.Model, wrapText(commandLineText(m.Err), 90, strings.Repeat(" ", 15)))
			continue
		}
		fmt.Fprintf(w, "  %-12s %s\n", m.Model, wrapText(inputsText(m), 90, strings.Repeat(" ", 15)))
	}
	fmt.Fprintln(w, "  Ewald sums use conducting (tin-foil) boundary conditions.")
	writeExtended(w, r, u)
	fmt.Fprintln(w, "\nnotes")
	for _, n := range r.Notes {
		fmt.Fprintf(w, "  • %s\n", wrapText(n, 96, "    "))
	}
	if len(r.Warnings) > 0 {
		fmt.Fprintln(w, "\nlook at")
		for _, n := range r.Warnings {
			fmt.Fprintf(w, "  ! %s\n", wrapText(n, 96, "    "))
		}
	}
}

func memoText(m bool) string {
	if m {
		return ", from memory"
	}
	return ""
}

// inputsText says what a model used.
func inputsText(m cycle.ModelResult) string {
	in := m.Inputs
	var parts []string
	if in.Madelung > 0 {
		parts = append(parts, fmt.Sprintf("A = %.5f (%s)", in.Madelung, in.MadelungFrom))
	}
	if in.D0 > 0 {
		parts = append(parts, fmt.Sprintf("d₀ = %.4f Å (%s)", in.D0, in.D0From))
	} else if in.CationRadius > 0 {
		parts = append(parts, fmt.Sprintf("r₊ = %.3f Å, r₋ = %.3f Å (%s)", in.CationRadius, in.AnionRadius, in.RadiusFrom))
	}
	if in.BornExponent > 0 {
		// A mean over the ions (25/3 for MgCl₂) is no more exact than
		// Pauling's integers: three figures.
		parts = append(parts, fmt.Sprintf("n = %.3g (%s)", in.BornExponent, in.BornExponentFrom))
	}
	if in.Rho > 0 {
		parts = append(parts, fmt.Sprintf("ρ = %g Å", in.Rho))
	}
	if in.Nu > 0 {
		parts = append(parts, fmt.Sprintf("ν = %d", in.Nu))
	}
	if in.MolarVolume > 0 {
		parts = append(parts, fmt.Sprintf("V_m = %.5f nm³ (%s), I = %g, %s", in.MolarVolume, in.VolumeFrom, in.IonicStrength, in.Fit))
	}
	parts = append(parts, fmt.Sprintf("U = %.1f kJ/mol", m.Energy))
	return strings.Join(parts, "; ")
}

// printAnionValue says which value of a multiply charged anion is in force
// and how much the other would move the solved step.
func printAnionValue(w io.Writer, c *cycle.Cycle, e *cycle.AnionValueEffect) {
	if e == nil {
		return
	}
	u := c.Settings.Units
	ion := cycle.IonText(c.Anion.Ion)
	what := "the textbook value (the data's cycle-derived second electron affinity)"
	if e.InForce == cycle.AnionFitted {
		what = "the value fitted over its family of salts"
		for _, f := range c.Fitted {
			if f.Ion == c.Anion.Ion.Symbol {
				what += fmt.Sprintf(" (ΔfH° = %s kJ/mol, %s, %d salts)", plusMinus(f.GasFormation.V, f.GasFormation.U), f.Model, len(f.Salts))
			}
		}
	}
	fmt.Fprintf(w, "\n%s\n", wrapText(fmt.Sprintf("%s(g): %s is in force: %s = %s %s.", ion, what, e.Step, energy(e.InForceValue, u), u), 100, "  "))
	if e.Solved == e.Step {
		fmt.Fprintf(w, "  the %s value would be %s = %s %s; here that step is the one solved.\n", e.Other, e.Step, energy(e.OtherValue, u), u)
		return
	}
	fmt.Fprintf(w, "  with the %s value (%s = %s %s; --anion-value %s) %s would move by %s %s.\n",
		e.Other, e.Step, energy(e.OtherValue, u), u, e.Other, e.Solved, energy(e.Shift, u), u)
}
