package cli

import (
	"cmp"
	"errors"
	"fmt"
	"io"
	"math"
	"slices"
	"strconv"
	"strings"

	"enthalpath/data"
	"enthalpath/thermo"
	"enthalpath/thermo/notation"
)

const dataSynopsis = `data QUERY [--kind element|ion|compound] [--json]
       enthalpath data --list elements|ions|compounds|sources [--json]
       enthalpath data --sources [--json]`

// runData shows one element, ion or compound with every value, its
// uncertainty, unit and source, or lists the keys of one table.
func runData(env Env, args []string) error {
	fs := NewFlagSet("data")
	var asJSON, sources bool
	var kind, list string
	fs.BoolVar(&asJSON, "json", false, "print JSON")
	fs.StringVar(&kind, "kind", "", "read QUERY as an `element`, ion or compound (default: an ion if it ends in a charge, else an element, else a compound)")
	fs.StringVar(&list, "list", "", "list every `TABLE` row key: elements, ions, compounds or sources")
	fs.BoolVar(&sources, "sources", false, "count the built-in rows citing each source, and the rows entered from memory, per table")
	pos, help, err := ParseFlags(fs, args)
	if help || err != nil {
		return err
	}
	if sources {
		if len(pos) > 0 || list != "" {
			return Usagef("--sources takes no QUERY and no --list")
		}
		return dataSources(env.Stdout, asJSON)
	}
	if list == "" && len(pos) != 1 {
		return Usagef("give one QUERY (an element symbol, an ion such as Fe3+ or SO4^2-, or a formula): usage: enthalpath %s", dataSynopsis)
	}
	if list != "" && len(pos) > 0 {
		return Usagef("--list takes no QUERY")
	}
	db, err := LoadData(env)
	if err != nil {
		return err
	}
	if list != "" {
		return dataList(env.Stdout, db, list, asJSON)
	}
	q := pos[0]
	var rec any
	switch kind {
	case "element":
		e, err := db.Element(q)
		if err != nil {
			return &UsageError{err}
		}
		rec = e
	case "ion":
		ion, err := db.Ion(q)
		if err != nil {
			return &UsageError{err}
		}
		rec = ion
	case "compound":
		c, err := db.Compound(q)
		if err != nil {
			return &UsageError{err}
		}
		rec = c
	case "":
		if rec, err = dataFindAny(db, q); err != nil {
			return err
		}
	default:
		return Usagef("--kind %q: give element, ion or compound", kind)
	}
	if asJSON {
		return writeJSON(env.Stdout, dataJSON(db, rec))
	}
	dataPrint(env.Stdout, db, rec)
	return nil
}

// dataFindAny resolves a query: an ion when it ends in a charge, then an
// element, then a compound. A miss is a usage error with suggestions of
// every kind.
func dataFindAny(db *data.DB, q string) (any, error) {
	t := strings.TrimSpace(q)
	endsInCharge := strings.HasSuffix(t, "+") || strings.HasSuffix(t, "-") || strings.HasSuffix(t, "⁺") || strings.HasSuffix(t, "⁻")
	var errs []error
	if endsInCharge {
		ion, err := db.Ion(t)
		if err == nil {
			return ion, nil
		}
		errs = append(errs, err)
	} else {
		e, eerr := db.Element(t)
		if eerr == nil && e.Symbol == t {
			return e, nil
		}
		c, err := db.Compound(t)
		if err == nil {
			return c, nil
		}
		if eerr == nil {
			// Element lookups ignore case ("na" is Na), but a query that
			// reads as a formula of several elements ("HF", "CO", "SN")
			// means that compound, not the element its letters spell.
			if f, ferr := notation.ParseFormula(t); ferr == nil && len(f.Elements()) > 1 {
				var parts []string
				for _, g := range f.Groups {
					parts = append(parts, g.Text)
				}
				return nil, Usagef("%s reads as a compound of %s, which is not in the data; for the element %s (%s) ask for %q",
					notation.QuoteInput(q), strings.Join(parts, " and "), e.Symbol, e.Name, e.Symbol)
			}
			return e, nil
		}
		errs = append(errs, eerr, err)
	}
	var sugg []string
	for _, err := range errs {
		var nf *data.NotFoundError
		if errors.As(err, &nf) {
			for _, s := range nf.Suggestions {
				if !slices.Contains(sugg, s) {
					sugg = append(sugg, s)
				}
			}
		}
	}
	msg := "nothing called " + notation.QuoteInput(q) + " in the data"
	var fe *notation.FormulaError
	if _, ferr := notation.ParseFormula(t); errors.As(ferr, &fe) && !endsInCharge && len(t) > 2 {
		msg += " (read as a formula: " + fe.Detail() + ")"
	}
	if len(sugg) > 0 {
		msg += "; did you mean " + strings.Join(sugg, ", ") + "?"
	}
	return nil, Usagef("%s", msg)
}

// ---- text output ----

// dataValueText writes "107.5 ± 0.7 kJ/mol" with the source key and markers.
func dataValueText(v data.Value) string {
	if !v.Known() {
		return "—"
	}
	return dataNumberText(v) + "  " + dataProvenance(v)
}

func dataNumberText(v data.Value) string {
	s := tableNumber(v, v.V)
	if v.U > 0 {
		s = dataPlusMinus(v)
	}
	if v.Unit != "" && v.Unit != "1" {
		s += " " + v.Unit
	}
	return s
}

// tableNumber writes x, a number of value v: as entered (every digit the
// table has) for a tabulated value, to six significant figures for one
// derived here from others, whose trailing digits are arithmetic, not data.
func tableNumber(v data.Value, x float64) string {
	if v.Derived {
		return strconv.FormatFloat(x, 'g', 6, 64)
	}
	return strconv.FormatFloat(x, 'f', -1, 64)
}

// dataPlusMinus writes a tabulated value with its uncertainty by the one
// rule of thermo.UncertaintyDecimals (the uncertainty to two significant
// figures, the value to the same place), except that a digit the source
// published is never cut: "71.62 ± 0.0012" is written 71.6200 ± 0.0012,
// "-411.153 ± 0.107" stays as published. A derived value has no published
// digits and follows the rule alone. Signs are ASCII, as the table has them.
func dataPlusMinus(v data.Value) string {
	d, _ := thermo.UncertaintyDecimals(v.U)
	if !v.Derived {
		d = max(d, publishedDecimals(v.V), publishedDecimals(v.U))
	}
	return strconv.FormatFloat(v.V, 'f', d, 64) + " ± " + strconv.FormatFloat(v.U, 'f', d, 64)
}

// publishedDecimals is the number of decimals of x written as entered
// (the shortest form that reads back as x).
func publishedDecimals(x float64) int {
	s := strconv.FormatFloat(x, 'f', -1, 64)
	if i := strings.IndexByte(s, '.'); i >= 0 {
		return len(s) - i - 1
	}
	return 0
}

// dataProvenance writes "[source; memory, derived, override of …]".
func dataProvenance(v data.Value) string {
	parts := []string{v.Source}
	if v.Memory {
		parts = append(parts, "memory")
	}
	if v.Derived {
		parts = append(parts, "derived")
	}
	if v.Override {
		if v.Replaced != nil {
			parts = append(parts, "override of "+dataNumberText(*v.Replaced)+" ["+v.Replaced.Source+"]")
		} else {
			parts = append(parts, "user value")
		}
	}
	return "[" + strings.Join(parts, "; ") + "]"
}

// dataPrintAlternatives writes where the preferred value is in its source
// and every other compilation's value with its difference from it.
func dataPrintAlternatives(w io.Writer, pref data.Value, alts []data.Value, cite *dataCitations) {
	if pref.Locator != "" {
		fmt.Fprintf(w, "  at %s\n", pref.Locator)
	}
	if len(alts) == 0 {
		return
	}
	t := table{head: []string{"other compilations", "difference", "source", "at"}, right: map[int]bool{1: true}}
	for _, a := range alts {
		t.add(dataNumberText(a), strconv.FormatFloat(math.Round((a.V-pref.V)*1e6)/1e6, 'f', -1, 64), a.Source, a.Locator)
		cite.add(a)
	}
	t.write(w, "  ")
}

// dataState names a compound's phase ("cr" when the row gives none).
func dataState(s string) string {
	switch s {
	case "l":
		return "liquid"
	case "g":
		return "gas"
	}
	return "crystal"
}

// dataCitations collects the source keys used by the values shown.
type dataCitations struct{ keys []string }

func (c *dataCitations) add(v data.Value) {
	if v.Known() && !slices.Contains(c.keys, v.Source) {
		c.keys = append(c.keys, v.Source)
	}
	if v.Replaced != nil {
		c.add(*v.Replaced)
	}
}

func (c *dataCitations) write(w io.Writer, db *data.DB) {
	fmt.Fprintln(w, "\nSources")
	for _, k := range c.keys {
		s, err := db.Source(k)
		if err != nil {
			fmt.Fprintf(w, "  %-16s (no citation: %v)\n", k, err)
			continue
		}
		fmt.Fprintf(w, "  %-16s %s\n", k, hangingWrap(s.Citation, 78-19, 19))
	}
	fmt.Fprintln(w, "\nmemory: entered without the cited document at hand (check it there); derived: from a")
	fmt.Fprintln(w, "thermochemical cycle; override / user value: from the user's overlay file.")
}

// hangingWrap wraps s to width runes and indents the continuation lines.
func hangingWrap(s string, width, indent int) string {
	return strings.ReplaceAll(wrapText(s, width, ""), "\n", "\n"+strings.Repeat(" ", indent))
}

func dataPrint(w io.Writer, db *data.DB, rec any) {
	var cite dataCitations
	switch r := rec.(type) {
	case data.Element:
		dataPrintElement(w, db, r, &cite)
	case data.Ion:
		dataPrintIon(w, r, &cite)
		dataPrintDerivedIon(w, db, r, &cite)
	case data.Compound:
		dataPrintCompound(w, db, r, &cite)
	}
	cite.write(w, db)
	if ov := db.Overlays(); len(ov) > 0 {
		fmt.Fprintf(w, "overlay files applied: %s\n", strings.Join(ov, ", "))
	}
}

func dataPrintElement(w io.Writer, db *data.DB, e data.Element, cite *dataCitations) {
	fmt.Fprintf(w, "%s  %s  (Z = %d)   standard state at 298.15 K: %s\n\n", e.Symbol, e.Name, e.Z, e.StandardState)
	fmt.Fprintf(w, "Atomization ΔfH°(%s, g, 298.15 K)  %s\n", e.Symbol, dataValueText(e.Atomization))
	cite.add(e.Atomization)
	dataPrintAlternatives(w, e.Atomization, e.AtomizationAlternatives, cite)
	if e.StandardEntropy.Known() {
		fmt.Fprintf(w, "Standard entropy S°(%s, 298.15 K)  %s\n", e.StandardState, dataValueText(e.StandardEntropy))
		cite.add(e.StandardEntropy)
	}
	if steps := db.AtomizationSteps(e.Symbol); len(steps) > 0 {
		t := table{head: []string{"step", "kind", "ΔH° (kJ/mol)", "source"}}
		for _, s := range steps {
			t.add(s.Reaction, s.Kind, dataNumberText(s.Enthalpy), dataProvenance(s.Enthalpy))
			cite.add(s.Enthalpy)
		}
		fmt.Fprintln(w)
		t.write(w, "  ")
	}
	if len(e.Ionization) > 0 {
		fmt.Fprintln(w, "\nIonization energies (as published, 0 K)")
		t := table{head: []string{"stage", "ion formed", "eV", "kJ/mol", "source"}, right: map[int]bool{2: true, 3: true}}
		for i, v := range e.Ionization {
			ev := tableNumber(v, v.V)
			if v.U > 0 {
				ev = dataPlusMinus(v)
			}
			t.add(strconv.Itoa(i+1), e.Symbol+dataChargeText(i+1), ev, strconv.FormatFloat(thermo.EVToKJPerMol(v.V), 'f', 1, 64), dataProvenance(v))
			cite.add(v)
		}
		t.write(w, "  ")
	}
	fmt.Fprintln(w)
	for _, a := range []struct {
		label string
		v     data.Value
	}{{"Electron affinity", e.ElectronAffinity}, {"Second electron affinity", e.SecondAffinity}} {
		if !a.v.Known() {
			continue
		}
		kj := thermo.EVToKJPerMol(a.v.V)
		fmt.Fprintf(w, "%s  %s eV = %.1f kJ/mol (attachment enthalpy %+.1f kJ/mol)  %s\n", a.label,
			tableNumber(a.v, a.v.V), kj, -kj, dataProvenance(a.v))
		cite.add(a.v)
	}
	if !e.ElectronAffinity.Known() {
		fmt.Fprintln(w, "Electron affinity  none tabulated (no bound anion, or not in the data)")
	}
}

func dataChargeText(n int) string {
	if n == 1 {
		return "+"
	}
	return strconv.Itoa(n) + "+"
}

func dataPrintIon(w io.Writer, ion data.Ion, cite *dataCitations) {
	kind := "monatomic"
	if ion.Polyatomic {
		kind = "polyatomic, " + ion.Shape
	}
	fmt.Fprintf(w, "%s  core %s, charge %+d, %s\n", ion.Symbol, ion.Core, ion.Charge, kind)
	if ion.Note != "" {
		fmt.Fprintf(w, "  %s\n", wrapText(ion.Note, 76, "  "))
	}
	fmt.Fprintln(w)
	if ion.BornConfig != "" {
		fmt.Fprintf(w, "Born exponent (Pauling, %s class)  n = %s\n", ion.BornConfig, dataValueText(ion.BornExponent))
		cite.add(ion.BornExponent)
	}
	if len(ion.Radii) > 0 {
		fmt.Fprintln(w, "\nShannon radii (Å)")
		t := table{head: []string{"CN", "spin", "ionic", "crystal", "source"}, right: map[int]bool{2: true, 3: true}}
		for _, r := range ion.Radii {
			cr := "—"
			if r.Crystal.Known() {
				cr = strconv.FormatFloat(r.Crystal.V, 'f', -1, 64)
			}
			t.add(r.CN, r.Spin, strconv.FormatFloat(r.Ionic.V, 'f', -1, 64), cr, dataProvenance(r.Ionic))
			cite.add(r.Ionic)
			cite.add(r.Crystal)
		}
		t.write(w, "  ")
	} else if !ion.Polyatomic {
		fmt.Fprintln(w, "Shannon radii  none tabulated")
	}
	fmt.Fprintln(w)
	for _, x := range []struct {
		label string
		v     data.Value
	}{{"Thermochemical radius", ion.ThermochemicalRadius}, {"ΔfH°(ion, g, 298.15 K)", ion.GasFormation}} {
		if x.v.Known() {
			fmt.Fprintf(w, "%s  %s\n", x.label, dataValueText(x.v))
			cite.add(x.v)
		}
	}
	dataPrintAlternatives(w, ion.GasFormation, ion.GasFormationAlternatives, cite)
	for _, h := range ion.Hydrations {
		fmt.Fprintf(w, "Hydration enthalpy (%s scale)  %s\n", h.Scale, dataValueText(h.Value))
		if h.Value.Note != "" {
			fmt.Fprintf(w, "  %s\n", wrapText(h.Value.Note, 76, "  "))
		}
		cite.add(h.Value)
	}
	if len(ion.Hydrations) == 0 {
		fmt.Fprintln(w, "Hydration enthalpy  none tabulated")
	}
}

func dataPrintCompound(w io.Writer, db *data.DB, c data.Compound, cite *dataCitations) {
	fmt.Fprintf(w, "%s  %s", c.Formula, c.Name)
	if c.Family != "" {
		fmt.Fprintf(w, "  (%s)", c.Family)
	}
	fmt.Fprintf(w, "\n  ions: %d × %s, %d × %s\n\n", c.CationCount, c.Cation, c.AnionCount, c.Anion)
	state := dataState(c.State)
	if c.Polymorph != "" {
		state += ", " + c.Polymorph
	}
	if c.Molecular {
		state += "; molecular, not an ionic solid: the ions are formal"
	}
	fmt.Fprintf(w, "State  %s\n", state)
	fmt.Fprintf(w, "Formation ΔfH°(298.15 K)  %s\n", dataValueText(c.Formation))
	cite.add(c.Formation)
	dataPrintAlternatives(w, c.Formation, c.Alternatives, cite)
	if c.GibbsFormation.Known() {
		fmt.Fprintf(w, "Gibbs energy of formation ΔfG°(298.15 K)  %s\n", dataValueText(c.GibbsFormation))
		cite.add(c.GibbsFormation)
	}
	if c.Entropy.Known() {
		fmt.Fprintf(w, "Entropy S°(298.15 K)  %s\n", dataValueText(c.Entropy))
		cite.add(c.Entropy)
	}
	st := c.Structure
	if st == "" {
		st = "no prototype fits"
	}
	fmt.Fprintf(w, "Structure  %s\n", st)
	if len(c.Params) > 0 {
		var parts []string
		for _, k := range slices.Sorted(dataMapKeys(c.Params)) {
			parts = append(parts, k+" = "+strconv.FormatFloat(c.Params[k], 'f', -1, 64))
		}
		marks := []string{c.ParamsSource}
		if c.ParamsMemory {
			marks = append(marks, "memory")
		}
		if c.ParamsOverride {
			marks = append(marks, "user value")
		}
		fmt.Fprintf(w, "  parameters  %s (lengths in Å)  [%s]\n", strings.Join(parts, ", "), strings.Join(marks, "; "))
		cite.add(data.Value{Unit: "Å", Source: c.ParamsSource})
	}
	if c.Density.Known() {
		fmt.Fprintf(w, "Density  %s\n", dataValueText(c.Density))
		cite.add(c.Density)
	}
	if c.HandbookLattice.Known() {
		conv := map[string]string{"U": "lattice energy U", "dH": "lattice enthalpy ΔH_L"}[c.LatticeConvention]
		fmt.Fprintf(w, "Handbook %s (solid → gaseous ions)  %s\n", conv, dataValueText(c.HandbookLattice))
		cite.add(c.HandbookLattice)
	}
	if c.Note != "" {
		fmt.Fprintf(w, "Note  %s\n", wrapText(c.Note, 72, "      "))
	}
	for _, sym := range []string{c.Cation, c.Anion} {
		if _, err := db.Ion(sym); err != nil {
			fmt.Fprintf(w, "warning: %v\n", err)
		}
	}
}

func dataMapKeys[V any](m map[string]V) func(func(string) bool) {
	return func(yield func(string) bool) {
		for k := range m {
			if !yield(k) {
				return
			}
		}
	}
}

// ---- lists ----

func dataList(w io.Writer, db *data.DB, what string, asJSON bool) error {
	var keys []string
	switch what {
	case "elements":
		for _, e := range db.Elements() {
			keys = append(keys, e.Symbol)
		}
	case "ions":
		for _, i := range db.Ions() {
			keys = append(keys, i.Symbol)
		}
	case "compounds":
		for _, c := range db.Compounds() {
			keys = append(keys, c.Formula)
		}
	case "sources":
		if asJSON {
			out := []map[string]string{}
			for _, s := range db.Sources() {
				out = append(out, map[string]string{"key": s.Key, "citation": s.Citation})
			}
			return writeJSON(w, out)
		}
		for _, s := range db.Sources() {
			fmt.Fprintf(w, "%-16s %s\n", s.Key, hangingWrap(s.Citation, 78-17, 17))
		}
		return nil
	default:
		return Usagef("--list %q: give elements, ions, compounds or sources", what)
	}
	if asJSON {
		return writeJSON(w, keys)
	}
	fmt.Fprintln(w, wrapText(strings.Join(keys, " "), 78, ""))
	return nil
}

// dataSources prints data.Census: rows per source key and memory rows per
// table of the built-in data.
func dataSources(w io.Writer, asJSON bool) error {
	census, err := data.Census()
	if err != nil {
		return err
	}
	bySource := map[string]int{}
	for _, c := range census {
		for k, n := range c.BySource {
			bySource[k] += n
		}
	}
	if asJSON {
		type tableJSON struct {
			File     string         `json:"file"`
			Rows     int            `json:"rows"`
			Memory   int            `json:"memory_rows"`
			BySource map[string]int `json:"rows_by_source"`
		}
		var tables []tableJSON
		for _, c := range census {
			tables = append(tables, tableJSON{c.File, c.Rows, c.Memory, c.BySource})
		}
		return writeJSON(w, map[string]any{"tables": tables, "rows_by_source": bySource})
	}
	fmt.Fprintln(w, "Built-in rows citing each source (a row citing several counts under each)")
	t := table{head: []string{"source", "rows"}, right: map[int]bool{1: true}}
	for _, k := range slices.Sorted(dataMapKeys(bySource)) {
		t.add(k, strconv.Itoa(bySource[k]))
	}
	t.write(w, "  ")
	fmt.Fprintln(w, "\nRows per table, and those entered from memory (without the cited document at hand)")
	t = table{head: []string{"table", "rows", "memory"}, right: map[int]bool{1: true, 2: true}}
	var rows, mem int
	for _, c := range census {
		t.add(c.File, strconv.Itoa(c.Rows), strconv.Itoa(c.Memory))
		rows += c.Rows
		mem += c.Memory
	}
	t.add("all", strconv.Itoa(rows), strconv.Itoa(mem))
	t.write(w, "  ")
	return nil
}

// ---- JSON ----

type dataValueJSON struct {
	Value       float64        `json:"value"`
	Uncertainty float64        `json:"uncertainty"`
	Unit        string         `json:"unit"`
	Source      string         `json:"source"`
	Citation    string         `json:"citation,omitempty"`
	Memory      bool           `json:"memory"`
	Derived     bool           `json:"derived"`
	Override    bool           `json:"override"`
	Replaced    *dataValueJSON `json:"replaced,omitempty"`
	Note        string         `json:"note,omitempty"`
	Locator     string         `json:"locator,omitempty"`
}

func dataValueOf(db *data.DB, v data.Value) *dataValueJSON {
	if !v.Known() {
		return nil
	}
	out := &dataValueJSON{Value: v.V, Uncertainty: v.U, Unit: v.Unit, Source: v.Source,
		Memory: v.Memory, Derived: v.Derived, Override: v.Override, Note: v.Note, Locator: v.Locator}
	if s, err := db.Source(v.Source); err == nil {
		out.Citation = s.Citation
	}
	if v.Replaced != nil {
		out.Replaced = dataValueOf(db, *v.Replaced)
	}
	return out
}

// dataAltsOf writes other compilations' values, each with its difference
// from the preferred value.
func dataAltsOf(db *data.DB, pref data.Value, alts []data.Value) []map[string]any {
	out := []map[string]any{}
	for _, a := range alts {
		out = append(out, map[string]any{"value": dataValueOf(db, a), "difference_from_preferred": a.V - pref.V})
	}
	return out
}

func dataNumber(v data.Value) *float64 {
	if !v.Known() {
		return nil
	}
	n := v.V
	return &n
}

type dataStepJSON struct {
	Kind          string         `json:"kind"`
	Reaction      string         `json:"reaction"`
	AtomsProduced int            `json:"atoms_produced"`
	Enthalpy      *dataValueJSON `json:"enthalpy_kj_per_mol"`
}

type dataRadiusJSON struct {
	CN           string         `json:"cn"`
	Coordination int            `json:"coordination"`
	Spin         string         `json:"spin"`
	Ionic        *dataValueJSON `json:"ionic_radius"`
	Crystal      *dataValueJSON `json:"crystal_radius,omitempty"`
}

type dataScaledJSON struct {
	Scale string         `json:"scale"`
	Value *dataValueJSON `json:"enthalpy"`
}

func dataJSON(db *data.DB, rec any) any {
	switch r := rec.(type) {
	case data.Element:
		ies := []float64{}
		var ieVals []*dataValueJSON
		for _, v := range r.Ionization {
			ies = append(ies, v.V)
			ieVals = append(ieVals, dataValueOf(db, v))
		}
		var steps []dataStepJSON
		for _, s := range db.AtomizationSteps(r.Symbol) {
			steps = append(steps, dataStepJSON{s.Kind, s.Reaction, s.AtomsProduced, dataValueOf(db, s.Enthalpy)})
		}
		return map[string]any{
			"kind": "element", "symbol": r.Symbol, "name": r.Name, "z": r.Z, "standard_state": r.StandardState,
			"atomization_kj_per_mol":            dataNumber(r.Atomization),
			"atomization":                       dataValueOf(db, r.Atomization),
			"atomization_alternatives":          dataAltsOf(db, r.Atomization, r.AtomizationAlternatives),
			"standard_entropy":                  dataValueOf(db, r.StandardEntropy),
			"atomization_steps":                 steps,
			"ionization_energies_ev":            ies,
			"ionization_energies":               ieVals,
			"electron_affinity_ev":              dataNumber(r.ElectronAffinity),
			"electron_affinity":                 dataValueOf(db, r.ElectronAffinity),
			"second_electron_affinity_ev":       dataNumber(r.SecondAffinity),
			"second_electron_affinity":          dataValueOf(db, r.SecondAffinity),
			"ionization_energy_convention":      "0 K, as published",
			"electron_affinity_sign_convention": "positive when attachment releases energy",
		}
	case data.Ion:
		var radii []dataRadiusJSON
		for _, x := range r.Radii {
			radii = append(radii, dataRadiusJSON{x.CN, x.Coordination, x.Spin, dataValueOf(db, x.Ionic), dataValueOf(db, x.Crystal)})
		}
		var hyd []dataScaledJSON
		for _, h := range r.Hydrations {
			hyd = append(hyd, dataScaledJSON{h.Scale, dataValueOf(db, h.Value)})
		}
		return map[string]any{
			"kind": "ion", "symbol": r.Symbol, "core": r.Core, "charge": r.Charge, "polyatomic": r.Polyatomic, "shape": r.Shape,
			"born_config": r.BornConfig, "born_exponent": dataValueOf(db, r.BornExponent),
			"shannon_radii":              radii,
			"thermochemical_radius":      dataValueOf(db, r.ThermochemicalRadius),
			"gas_formation":              dataValueOf(db, r.GasFormation),
			"gas_formation_alternatives": dataAltsOf(db, r.GasFormation, r.GasFormationAlternatives),
			"fitted_gas_formation":       derivedIonJSONOf(db, r.Symbol),
			"hydration":                  hyd,
			"note":                       r.Note,
		}
	case data.Compound:
		params := map[string]float64{}
		for k, v := range r.Params {
			params[k] = v
		}
		return map[string]any{
			"kind": "compound", "formula": r.Formula, "name": r.Name, "family": r.Family,
			"cation": r.Cation, "cation_count": r.CationCount, "anion": r.Anion, "anion_count": r.AnionCount,
			"formation_enthalpy_kj_per_mol": dataNumber(r.Formation),
			"formation_enthalpy":            dataValueOf(db, r.Formation),
			"formation_alternatives":        dataAltsOf(db, r.Formation, r.Alternatives),
			"gibbs_formation":               dataValueOf(db, r.GibbsFormation),
			"entropy":                       dataValueOf(db, r.Entropy),
			"state":                         cmp.Or(r.State, "cr"),
			"polymorph":                     r.Polymorph,
			"molecular":                     r.Molecular,
			"structure":                     r.Structure,
			"params":                        params,
			"params_source":                 r.ParamsSource,
			"params_memory":                 r.ParamsMemory,
			"params_override":               r.ParamsOverride,
			"density_g_cm3":                 dataValueOf(db, r.Density),
			"handbook_lattice_kj_per_mol":   dataValueOf(db, r.HandbookLattice),
			"handbook_lattice_convention":   r.LatticeConvention,
			"note":                          r.Note,
		}
	}
	return nil
}

// dataPrintDerivedIon shows the ion's family-fitted gas-phase enthalpy.
func dataPrintDerivedIon(w io.Writer, db *data.DB, ion data.Ion, cite *dataCitations) {
	d, ok := db.DerivedIon(ion.Symbol)
	if !ok {
		return
	}
	fmt.Fprintf(w, "ΔfH°(ion, g, 298.15 K), family fit  %s\n", dataValueText(d.GasFormation))
	line := fmt.Sprintf("fitted over %d salts (%s): %s", len(d.Salts), d.Model, strings.Join(d.Salts, ", "))
	if len(d.Outside) > 0 {
		line += "; outside 2σ: " + strings.Join(d.Outside, ", ")
	}
	fmt.Fprintf(w, "  %s\n", wrapText(line, 76, "  "))
	cite.add(d.GasFormation)
}

type derivedIonJSON struct {
	Value   *dataValueJSON `json:"value"`
	Model   string         `json:"lattice_source"`
	Salts   []string       `json:"salts"`
	Outside []string       `json:"outside_2sigma"`
}

func derivedIonJSONOf(db *data.DB, symbol string) *derivedIonJSON {
	d, ok := db.DerivedIon(symbol)
	if !ok {
		return nil
	}
	j := &derivedIonJSON{Value: dataValueOf(db, d.GasFormation), Model: d.Model, Salts: d.Salts, Outside: d.Outside}
	if j.Outside == nil {
		j.Outside = []string{}
	}
	return j
}
