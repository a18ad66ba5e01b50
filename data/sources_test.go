package data

import (
	"bufio"
	"maps"
	"math"
	"os"
	"path/filepath"
	"strconv"
	"strings"
	"testing"
)

// pinnedLines caches the lines of the vendored source files (data/sources).
type pinnedLines map[string][]string

func (p pinnedLines) line(t *testing.T, file string, n int) string {
	t.Helper()
	lines, ok := p[file]
	if !ok {
		f, err := os.Open(filepath.Join("sources", file))
		if err != nil {
			t.Fatalf("locator names %s: %v", file, err)
		}
		sc := bufio.NewScanner(f)
		sc.Buffer(make([]byte, 1<<20), 1<<20)
		for sc.Scan() {
			lines = append(lines, sc.Text())
		}
		f.Close()
		p[file] = lines
	}
	if n < 1 || n > len(lines) {
		t.Fatalf("%s has no line %d", file, n)
	}
	return lines[n-1]
}

// numbersIn reads every cell of a source line that is a number: cells
// separated by ";" or tabs, with a decimal comma or point (the NBS file
// mixes both), and cells separated by "," (the other copies).
func numbersIn(line string) []float64 {
	var out []float64
	add := func(cell string) {
		if x, err := strconv.ParseFloat(strings.Trim(strings.TrimSpace(cell), `"`), 64); err == nil {
			out = append(out, x)
		}
	}
	for _, cell := range strings.FieldsFunc(line, func(r rune) bool { return r == ';' || r == '\t' }) {
		add(strings.TrimSuffix(strings.ReplaceAll(cell, ",", "."), "*")) // "*": a footnote mark of the printed tables
	}
	for _, cell := range strings.Split(line, ",") {
		add(cell)
	}
	return out
}

// Every generated value that carries a locator is found at that place of
// the vendored source file it cites: an independent reading of the pinned
// files (data/sources), not of the generator's code. Per source:
//   - nbs1982: a number of the NBS line equals the value (kJ/mol or J/(mol·K));
//   - nasa-glenn: the species' second line ends in ΔfH° in J/mol = 1000 × value;
//   - atct1.112: ΔfH°(298.15 K) in J/mol = 1000 × value, an ion's value
//     shifted by a whole multiple of 5/2·RT = 6.197 kJ/mol (the electron
//     convention, converted once by the generator);
//   - nist-asd, crc2014-ea: the value as printed;
//   - shannon1976: 100 × the radius in Å is one of the line's radii in pm;
//   - ciaaw: the atomic weight as printed;
//   - nist-xraylib: the density in g/cm³ as printed.
//
// correctedAtLocator lists the values the generator corrects on purpose (a
// slip of the vendored copy, data/gen/choices.csv): they are not at their
// locator as printed, and each must be checked as not found there.
var correctedAtLocator = map[string]string{
	"Ce4+ radius X":          "radiusslip: the copy prints 97 pm, Shannon's table 107 pm (crystal 121 − 14)",
	"Cu3+ crystal radius VI": "radiusslip: the copy prints 60 pm, Shannon's table 68 pm (ionic 54 + 14)",
}

func TestValuesAtTheirLocators(t *testing.T) {
	db := mustLoad(t)
	pinned := pinnedLines{}
	checked := map[string]int{}
	pendingCorrections := maps.Clone(correctedAtLocator)
	check := func(what string, v Value) {
		if v.Locator == "" || !v.Known() {
			return
		}
		file, lineText, ok := strings.Cut(v.Locator, ":")
		if !ok || strings.Contains(lineText, ";") {
			return // a step computed from several lines (atomization_steps)
		}
		n, err := strconv.Atoi(lineText)
		if err != nil {
			t.Errorf("%s: locator %q", what, v.Locator)
			return
		}
		line := pinned.line(t, file, n)
		found := false
		switch v.Source {
		case "nasa-glenn":
			next := pinned.line(t, file, n+1)
			if len(next) >= 80 {
				x, err := strconv.ParseFloat(strings.TrimSpace(next[65:80]), 64)
				found = err == nil && math.Abs(x/1000-v.V) < 1e-6
			}
		case "atct1.112":
			cells := strings.Split(line, "\t")
			if len(cells) > 4 {
				x, err := strconv.ParseFloat(cells[4], 64)
				if err == nil {
					for k := -3; k <= 3 && !found; k++ {
						found = math.Abs(x/1000+float64(k)*6.197-v.V) < 1e-6
					}
				}
			}
		case "shannon1976":
			for _, x := range numbersIn(line) {
				found = found || math.Abs(x-100*v.V) < 1e-6
			}
		case "cod-debian", "cod-ncrystal":
			// A density computed from a deposited structure (the X-ray
			// density Z·M/(N_A·V); data/gen's TestXrayDensity checks that
			// computation against the densities the CIFs print): the
			// locator is the structure's cell.
			found = strings.HasSuffix(what, " density") && (strings.TrimSpace(line) == "@CELL" || strings.HasPrefix(line, "_cell_length_a"))
		default:
			for _, x := range numbersIn(line) {
				found = found || math.Abs(x-v.V) < 1e-9
			}
		}
		checked[v.Source]++
		if reason, corrected := correctedAtLocator[what]; corrected {
			if found {
				t.Errorf("%s is listed as corrected (%s) but stands at %s as printed", what, reason, v.Locator)
			}
			delete(pendingCorrections, what)
			return
		}
		if !found {
			t.Errorf("%s = %g [%s] not found at %s: %q", what, v.V, v.Source, v.Locator, line)
		}
	}
	for _, e := range db.Elements() {
		check(e.Symbol+" atomization", e.Atomization)
		check(e.Symbol+" S°", e.StandardEntropy)
		check(e.Symbol+" EA", e.ElectronAffinity)
		check(e.Symbol+" atomic weight", e.AtomicMass)
		for i, v := range e.Ionization {
			check(e.Symbol+" IE"+strconv.Itoa(i+1), v)
		}
		for _, a := range e.AtomizationAlternatives {
			check(e.Symbol+" atomization (other compilation)", a)
		}
	}
	for _, ion := range db.Ions() {
		check(ion.Symbol+" gas formation", ion.GasFormation)
		for _, a := range ion.GasFormationAlternatives {
			check(ion.Symbol+" gas formation (other compilation)", a)
		}
		for _, r := range ion.Radii {
			check(ion.Symbol+" radius "+r.CN, r.Ionic)
			check(ion.Symbol+" crystal radius "+r.CN, r.Crystal)
		}
	}
	for _, c := range db.Compounds() {
		check(c.Formula+" formation", c.Formation)
		check(c.Formula+" ΔfG°", c.GibbsFormation)
		check(c.Formula+" S°", c.Entropy)
		check(c.Formula+" density", c.Density)
		for _, a := range c.Alternatives {
			check(c.Formula+" formation (other compilation)", a)
		}
	}
	for _, sp := range db.SpeciesList() {
		check(sp.Formula+" formation", sp.Formation)
		check(sp.Formula+" ΔfG°", sp.GibbsFormation)
		check(sp.Formula+" S°", sp.Entropy)
		for _, a := range sp.Alternatives {
			check(sp.Formula+" formation (other compilation)", a)
		}
	}
	for what := range pendingCorrections {
		t.Errorf("correctedAtLocator lists %s, which was not checked: remove it", what)
	}
	t.Logf("values found at their locators, by source: %v", checked)
	for _, src := range []string{"nbs1982", "nasa-glenn", "atct1.112", "nist-asd", "crc2014-ea", "shannon1976", "ciaaw", "nist-xraylib"} {
		if checked[src] == 0 {
			t.Errorf("no value of %s was checked at its locator", src)
		}
	}
}

// The preferred value's uncertainty covers every other compilation's value
// that differs by more than their combined stated uncertainties and more
// than one unit of the preferred value's last printed digit (the rule of
// data/gen: NBS states no uncertainty, its last digit is significant).
func TestUncertaintyCoversCompilations(t *testing.T) {
	db := mustLoad(t)
	cover := func(what string, v Value, alts []Value) {
		for _, a := range alts {
			d := math.Abs(a.V - v.V)
			if d > math.Max(math.Hypot(v.U, a.U), printedUnit(v.V))+1e-9 && d > v.U+1e-6 {
				t.Errorf("%s: %g ± %g [%s] does not cover %g [%s]", what, v.V, v.U, v.Source, a.V, a.Source)
			}
		}
	}
	for _, e := range db.Elements() {
		cover(e.Symbol, e.Atomization, e.AtomizationAlternatives)
	}
	for _, ion := range db.Ions() {
		cover(ion.Symbol, ion.GasFormation, ion.GasFormationAlternatives)
	}
	for _, c := range db.Compounds() {
		cover(c.Formula, c.Formation, c.Alternatives)
	}
	for _, sp := range db.SpeciesList() {
		cover(sp.Formula, sp.Formation, sp.Alternatives)
	}
}

// printedUnit is one unit of the last digit of x as the tables print it
// (a trailing zero is not printed, so this may be ten times too large).
func printedUnit(x float64) float64 {
	s := strconv.FormatFloat(x, 'f', -1, 64)
	if i := strings.IndexByte(s, '.'); i >= 0 {
		return math.Pow(10, -float64(len(s)-i-1))
	}
	return 1
}
