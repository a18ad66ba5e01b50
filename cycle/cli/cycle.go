package cli

import (
	"errors"
	"flag"
	"fmt"
	"io"
	"math"
	"path/filepath"
	"strconv"
	"strings"

	"enthalpath/cycle"
	"enthalpath/thermo"
	"enthalpath/thermo/crystal"
	"enthalpath/thermo/notation"
)

const cycleSynopsis = `cycle FORMULA [--solve KEY] [--set KEY=VALUE[±UNC]]... [--lattice-from MODEL]
                  [--structure NAME|FILE.cif] [--units kj|kcal|ev] [--anion-value fitted|textbook] [--save FILE] [--json]
       enthalpath cycle --open FILE [flags]`

// modelFlags are the settings shared by cycle and compare.
type modelFlags struct {
	structure, units, radii, d0, latticeAs, ionAt string
	params                                        listFlag
	rho, bornN, accuracy                          float64
	cnCation, cnAnion                             int
}

func (m *modelFlags) register(fs *flag.FlagSet) {
	fs.StringVar(&m.structure, "structure", "", "structure for the Madelung constant: a prototype name ("+strings.Join(crystal.PrototypeNames(), ", ")+") or a CIF file")
	fs.Var(&m.params, "param", "prototype parameter `KEY=VALUE` (a, c in Å; u, x, z fractional); repeatable")
	fs.StringVar(&m.units, "units", "kj", "energy unit of printed output and of --set values: kj, kcal or ev (JSON stays in kJ/mol, as its keys say)")
	fs.Float64Var(&m.rho, "rho", 0, "Born–Mayer range parameter ρ in Å (default 0.345)")
	fs.Float64Var(&m.bornN, "born-n", 0, "Born exponent n for Born–Landé (default: mean of Pauling's values)")
	fs.StringVar(&m.radii, "radii", "ionic", "Shannon radius set: ionic or crystal")
	fs.IntVar(&m.cnCation, "cn-cation", 0, "coordination number of the cation radius (default: the structure's)")
	fs.IntVar(&m.cnAnion, "cn-anion", 0, "coordination number of the anion radius (default: the structure's)")
	fs.StringVar(&m.d0, "d0", "auto", "cation–anion distance: auto, geometry, radii, or a distance in Å")
	fs.StringVar(&m.latticeAs, "lattice-as", "enthalpy", "lattice convention: enthalpy (ΔH_L at 298.15 K) or energy (U)")
	fs.StringVar(&m.ionAt, "ionization-at", "0k", "ionization convention: 0k (energies as published) or 298k (enthalpies, ±5/2·RT per electron)")
	fs.Float64Var(&m.accuracy, "accuracy", 0, "relative accuracy of the Ewald sums (default 1e-8)")
}

// conventions reads the convention flags.
func (m *modelFlags) conventions() (cycle.Conventions, error) {
	var conv cycle.Conventions
	var err error
	if conv.Lattice, err = cycle.ParseLatticeConvention(m.latticeAs); err != nil {
		return conv, Usagef("--lattice-as: %v", err)
	}
	if conv.Ionization, err = cycle.ParseIonizationConvention(m.ionAt); err != nil {
		return conv, Usagef("--ionization-at: %v", err)
	}
	return conv, nil
}

// apply puts the flags that were given (set) into c's settings; with all
// true every flag is applied (a fresh cycle).
func (m *modelFlags) apply(c *cycle.Cycle, set map[string]bool, all bool) error {
	given := func(n string) bool { return all || set[n] }
	s := &c.Settings
	var err error
	if given("units") {
		if s.Units, err = thermo.ParseUnit(m.units); err != nil {
			return Usagef("--units: %v", err)
		}
	}
	// A flag given explicitly is checked even at 0, the value that stands
	// for "the default" only while the flag is left out.
	if given("rho") {
		if err := cycle.CheckSetting(cycle.SettingRho, m.rho); err != nil {
			return boundUsage("rho", "give the Born–Mayer range in Å", err)
		}
		s.Rho = m.rho
	}
	if given("born-n") {
		if err := cycle.CheckSetting(cycle.SettingBornExponent, m.bornN); err != nil {
			return boundUsage("born-n", "give the Born exponent", err)
		}
		s.BornExponent = m.bornN
	}
	if given("radii") {
		if s.Radius, err = cycle.ParseRadiusKind(m.radii); err != nil {
			return Usagef("--radii: %v", err)
		}
	}
	for _, cn := range []struct {
		name string
		v    int
		dst  *int
	}{{"cn-cation", m.cnCation, &s.CationCN}, {"cn-anion", m.cnAnion, &s.AnionCN}} {
		if given(cn.name) {
			if err := cycle.CheckSetting(cycle.SettingCN, float64(cn.v)); err != nil {
				return boundUsage(cn.name, "give a whole coordination number", err)
			}
			*cn.dst = cn.v
		}
	}
	if given("d0") {
		if s.Distance, s.D0, err = cycle.ParseDistance(m.d0); err != nil {
			return Usagef("--d0: %v", err)
		}
	}
	if given("accuracy") {
		if err := cycle.CheckSetting(cycle.SettingAccuracy, m.accuracy); err != nil {
			return boundUsage("accuracy", "give the relative accuracy of the Ewald sum", err)
		}
		s.Accuracy = m.accuracy
	}
	if given("lattice-as") || given("ionization-at") {
		conv, err := m.conventions()
		if err != nil {
			return err
		}
		if !given("lattice-as") {
			conv.Lattice = c.Conventions.Lattice
		}
		if !given("ionization-at") {
			conv.Ionization = c.Conventions.Ionization
		}
		c.SetConventions(conv)
	}
	if given("structure") && m.structure != "" || given("param") && len(m.params) > 0 {
		st, err := m.structureFor(c)
		if err != nil {
			return err
		}
		s.Structure = st
	}
	return nil
}

// structureFor reads --structure and --param for cycle c.
func (m *modelFlags) structureFor(c *cycle.Cycle) (cycle.Structure, error) {
	name := m.structure
	if name == "" {
		name = c.Settings.Structure.Prototype
		if name == "" {
			return cycle.Structure{}, Usagef("--param needs a prototype: give --structure NAME")
		}
	}
	if strings.HasSuffix(strings.ToLower(name), ".cif") {
		if len(m.params) > 0 {
			return cycle.Structure{}, Usagef("--param applies to a prototype, not to the CIF file %s", name)
		}
		st, err := readCIF(name, c)
		if err != nil {
			return cycle.Structure{}, Usagef("--structure: %v", err)
		}
		return st, nil
	}
	if _, err := crystal.LookupPrototype(name); err != nil {
		return cycle.Structure{}, Usagef("--structure: %v (or give a .cif file)", err)
	}
	params := map[string]float64{}
	if name == c.Compound.Structure {
		for k, v := range c.Compound.Params {
			params[k] = v
		}
	}
	for _, p := range m.params {
		k, v, ok := strings.Cut(p, "=")
		x, err := strconv.ParseFloat(strings.TrimSpace(v), 64)
		if !ok || err != nil || math.IsNaN(x) || math.IsInf(x, 0) {
			return cycle.Structure{}, Usagef("--param %q: write KEY=VALUE, e.g. a=5.64", p)
		}
		params[strings.TrimSpace(k)] = x
	}
	if _, err := crystal.Build(name, params); err != nil {
		return cycle.Structure{}, Usagef("--structure %s: %v", name, err)
	}
	st := cycle.Structure{Prototype: name, Params: params}
	if len(params) == 0 {
		st.Params = nil
	}
	return st, nil
}

// readCIF reads a CIF file for cycle c: charges the file does not give
// are assigned with the compound's ions as the only candidates. The error
// names the file; the caller says where the name came from.
func readCIF(path string, c *cycle.Cycle) (cycle.Structure, error) {
	sf, err := cycle.OpenStructureFile(nil, path, nil, []cycle.Part{c.Cation, c.Anion})
	if err != nil {
		return cycle.Structure{}, err
	}
	return sf.Structure(path), nil
}

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
	set := map[string]bool{}
	fs.Visit(func(f *flag.Flag) { set[f.Name] = true })
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
		if st := c.Settings.Structure; st.CIF != "" && st.Cell == nil && !set["structure"] {
			p := st.CIF
			if !filepath.IsAbs(p) {
				p = filepath.Join(filepath.Dir(open), p)
			}
			s, err := readCIF(p, c)
			if err != nil {
				return Usagef("--open %s: the structure file it names: %v", open, err)
			}
			s.CIF = st.CIF
			c.Settings.Structure = s
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

type cycleJSON struct {
	Formula string `json:"formula"` // the compound, the key every command uses
	// Deprecated: the same as formula, kept for scripts that read it.
	Compound             string          `json:"compound"`
	Name                 string          `json:"name,omitempty"`
	Family               string          `json:"family,omitempty"`
	Tabulated            bool            `json:"tabulated"`
	Cation               string          `json:"cation"`
	Anion                string          `json:"anion"`
	Convention           string          `json:"convention"`
	IonizationConvention string          `json:"ionization_convention"`
	Steps                []stepJSON      `json:"steps"`
	Solved               solvedJSON      `json:"solved"`
	Lattice              latticeJSON     `json:"lattice"`
	Handbook             *handbookJSON   `json:"handbook,omitempty"`
	Models               []modelJSON     `json:"models"`
	VerdictThresholds    string          `json:"verdict_thresholds"`
	Verdict              *verdictJSON    `json:"verdict"`
	Notes                []string        `json:"notes"`
	Warnings             []string        `json:"warnings"`
	AnionValue           *anionValueJSON `json:"anion_value,omitempty"`
	Settings             settingsJSON    `json:"settings"`
}

type stepJSON struct {
	Key                string     `json:"key"`
	Label              string     `json:"label"`
	Reaction           string     `json:"reaction"`
	KJPerMol           jsonNumber `json:"kj_per_mol"`
	UncertaintyKJ      jsonNumber `json:"uncertainty_kj_per_mol"`
	Multiplicity       jsonNumber `json:"multiplicity"`
	Source             string     `json:"source"`
	SourceKind         string     `json:"source_kind"`
	Citation           string     `json:"citation,omitempty"`
	Memory             bool       `json:"memory"`
	Derived            bool       `json:"derived"`
	Override           bool       `json:"override"`
	DefaultUncertainty bool       `json:"default_uncertainty"`
	Unknown            bool       `json:"unknown"`
	Parent             string     `json:"parent,omitempty"`
	Missing            bool       `json:"missing"`
}

type solvedJSON struct {
	Key           string     `json:"key"`
	KJPerMol      jsonNumber `json:"kj_per_mol"`
	UncertaintyKJ jsonNumber `json:"uncertainty_kj_per_mol"`
}

type latticeJSON struct {
	EnthalpyKJ    jsonNumber `json:"enthalpy_kj_per_mol"`
	EnergyKJ      jsonNumber `json:"energy_kj_per_mol"`
	UncertaintyKJ jsonNumber `json:"uncertainty_kj_per_mol"`
	CorrectionKJ  jsonNumber `json:"dh_minus_u_kj_per_mol"`
}

type handbookJSON struct {
	Tabulated  jsonNumber `json:"tabulated_kj_per_mol"`
	Convention string     `json:"convention"`
	AsStep     jsonNumber `json:"as_step_kj_per_mol"`
	Difference jsonNumber `json:"difference_kj_per_mol"`
	Percent    jsonNumber `json:"difference_percent"`
	Source     string     `json:"source"`
	Memory     bool       `json:"memory"`
}

type modelJSON struct {
	Model        string     `json:"model"`
	KJPerMol     jsonNumber `json:"kj_per_mol"`
	EnergyKJ     jsonNumber `json:"energy_u_kj_per_mol"`
	Gap          jsonNumber `json:"gap_kj_per_mol"`
	GapPercent   jsonNumber `json:"gap_percent"`
	Verdict      string     `json:"verdict,omitempty"`
	Error        string     `json:"error,omitempty"`
	Madelung     jsonNumber `json:"madelung,omitempty"`
	MadelungFrom string     `json:"madelung_from,omitempty"`
	D0           jsonNumber `json:"d0_angstrom,omitempty"`
	D0From       string     `json:"d0_from,omitempty"`
	BornExponent jsonNumber `json:"born_exponent,omitempty"`
	Rho          jsonNumber `json:"rho_angstrom,omitempty"`
	CationRadius jsonNumber `json:"cation_radius_angstrom,omitempty"`
	AnionRadius  jsonNumber `json:"anion_radius_angstrom,omitempty"`
	MolarVolume  jsonNumber `json:"molar_volume_nm3,omitempty"`
	// Uncertainty is the model's σ and UncertaintyFrom its basis.
	Uncertainty     jsonNumber    `json:"uncertainty_kj_per_mol,omitempty"`
	UncertaintyFrom string        `json:"uncertainty_from,omitempty"`
	Extended        *extendedJSON `json:"extended,omitempty"`
}

type settingsJSON struct {
	LatticeFrom string `json:"lattice_from,omitempty"`
	Structure   string `json:"structure,omitempty"`
	Radius      string `json:"radius"`
	D0          string `json:"d0"`
	Units       string `json:"units"`
}

func cycleJSONOf(c *cycle.Cycle, r *cycle.Result) cycleJSON {
	j := cycleJSON{Formula: c.Formula, Compound: c.Formula, Name: c.Name, Family: c.Family, Tabulated: c.Tabulated,
		Cation: c.Cation.Ion.Symbol, Anion: c.Anion.Ion.Symbol,
		Convention: r.Conventions.Lattice.Symbol(), IonizationConvention: r.Conventions.Ionization.String(),
		Solved:            solvedJSON{Key: r.Solved.Key, KJPerMol: jsonNumber(r.Solved.Value), UncertaintyKJ: jsonNumber(r.Solved.Uncertainty)},
		Lattice:           latticeJSON{jsonNumber(r.Lattice.Enthalpy), jsonNumber(r.Lattice.Energy), jsonNumber(r.Lattice.Uncertainty), jsonNumber(r.Lattice.Correction)},
		VerdictThresholds: cycle.VerdictThresholds(), Verdict: verdictJSONOf(r), Notes: r.Notes, Warnings: r.Warnings,
		Settings: settingsJSON{LatticeFrom: c.Settings.LatticeFrom, Structure: c.Settings.Structure.Name(),
			Radius: c.Settings.Radius.String(), D0: c.Settings.Distance.String(), Units: c.Settings.Units.Key()},
	}
	if j.Warnings == nil {
		j.Warnings = []string{}
	}
	for _, s := range r.Steps {
		src := s.Source.Key
		if src == "" {
			src = s.Source.Kind.String()
		}
		missing := s.Source.Kind == cycle.SourceMissing
		v, unc := jsonNumber(s.Value), jsonNumber(s.Uncertainty)
		if missing {
			v, unc = jsonNumber(math.NaN()), jsonNumber(math.NaN())
		}
		j.Steps = append(j.Steps, stepJSON{Key: s.Key, Label: s.Label, Reaction: s.Reaction, KJPerMol: v, UncertaintyKJ: unc,
			Multiplicity: jsonNumber(s.Multiplicity), Source: src, SourceKind: s.Source.Kind.String(), Citation: s.Source.Citation,
			Memory: s.Source.Memory, Derived: s.Source.Derived, Override: s.Source.Override, DefaultUncertainty: s.Source.DefaultUncertainty,
			Unknown: s.Unknown, Parent: s.Parent, Missing: missing})
	}
	if h := r.Handbook; h != nil {
		j.Handbook = &handbookJSON{jsonNumber(h.Tabulated), h.Convention.Symbol(), jsonNumber(h.Value), jsonNumber(h.Difference),
			jsonNumber(h.Percent), h.Source.Key, h.Source.Memory}
	}
	for _, m := range r.Models {
		mj := modelJSON{Model: m.Model, KJPerMol: jsonNumber(m.Value), EnergyKJ: jsonNumber(m.Energy), Gap: jsonNumber(m.Gap), GapPercent: jsonNumber(m.GapPercent)}
		if m.Err != nil {
			mj.Error = commandLineText(m.Err)
			mj.KJPerMol, mj.EnergyKJ = jsonNumber(math.NaN()), jsonNumber(math.NaN())
		} else {
			in := m.Inputs
			mj.Verdict = verdictText(r, m)
			mj.Madelung, mj.MadelungFrom, mj.D0, mj.D0From = jsonNumber(in.Madelung), in.MadelungFrom, jsonNumber(in.D0), in.D0From
			mj.BornExponent, mj.Rho = jsonNumber(in.BornExponent), jsonNumber(in.Rho)
			mj.CationRadius, mj.AnionRadius, mj.MolarVolume = jsonNumber(in.CationRadius), jsonNumber(in.AnionRadius), jsonNumber(in.MolarVolume)
			mj.Uncertainty, mj.UncertaintyFrom, mj.Extended = jsonNumber(m.Uncertainty), m.UncertaintyBasis, extendedJSONOf(in.Extended)
		}
		j.Models = append(j.Models, mj)
	}
	return j
}

// verdictText is a model's verdict in words, or why none is given.
func verdictText(r *cycle.Result, m cycle.ModelResult) string {
	if len(r.Circular) > 0 {
		return "not judged: " + r.Circular[0].Ion + " was fitted to this salt"
	}
	return m.Verdict.Character.String()
}

type anionValueJSON struct {
	InForce      string      `json:"in_force"`
	Other        string      `json:"other"`
	Step         string      `json:"step"`
	InForceKJ    jsonNumber  `json:"in_force_kj_per_mol"`
	OtherKJ      jsonNumber  `json:"other_kj_per_mol"`
	Solved       string      `json:"solved"`
	ShiftKJ      jsonNumber  `json:"solved_shift_with_other_kj_per_mol"`
	FittedValue  *jsonNumber `json:"fitted_gas_formation_kj_per_mol,omitempty"`
	FittedSE     *jsonNumber `json:"fitted_standard_error_kj_per_mol,omitempty"`
	FittedSource string      `json:"fitted_lattice_source,omitempty"`
}

func anionValueJSONOf(c *cycle.Cycle, e *cycle.AnionValueEffect) *anionValueJSON {
	if e == nil {
		return nil
	}
	j := &anionValueJSON{InForce: string(e.InForce), Other: string(e.Other), Step: e.Step, InForceKJ: jsonNum(e.InForceValue),
		OtherKJ: jsonNum(e.OtherValue), Solved: e.Solved, ShiftKJ: jsonNum(e.Shift)}
	for _, f := range c.Fitted {
		if f.Ion == c.Anion.Ion.Symbol {
			v, u := jsonNum(f.GasFormation.V), jsonNum(f.GasFormation.U)
			j.FittedValue, j.FittedSE, j.FittedSource = &v, &u, f.Model
		}
	}
	return j
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

// boundUsage words a model setting refused by the engine's bound for the
// command line: the flag and the value as typed, what to give, the bound
// and the usual values, and how to get the default.
func boundUsage(flag, advice string, err error) error {
	var be *cycle.BoundError
	if !errors.As(err, &be) {
		return Usagef("--%s: %v", flag, err)
	}
	return Usagef("--%s %s: %s (%s; %s); leave the flag out for the default", flag, strconv.FormatFloat(be.Value, 'g', -1, 64),
		advice, be.Bound.Range(be.Setting.String()), be.Bound.Usual)
}
