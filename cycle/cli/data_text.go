package cli

// The data command's text output: values with their uncertainty and
// provenance, elements, ions, compounds and the citations they use.

import (
	"fmt"
	"io"
	"math"
	"slices"
	"strconv"
	"strings"

	"enthalpath/data"
	"enthalpath/thermo"
)

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
		dataPrintAlternatives(w, c.Density, nil, cite)
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
