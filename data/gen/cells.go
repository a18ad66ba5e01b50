package main

// Cell parameters read from deposited structures: Crystallography Open
// Database entries, as converted into the NCrystal data library
// (data/sources/cod-cells/*.ncmat) and as deposited CIF files (and one
// NCMAT file) shipped in Debian packages (data/sources/cod-debian/). Each
// file names its COD entry and the journal reference; its cell and atoms
// give the parameters of the conventional cell. A deposited cell replaces
// the cell typed from Wyckoff (1963) in kept/compounds.csv when it gives
// every parameter the typed one gives and agrees with it within
// cellTolerance; the typed value stays in the row's note.

import (
	"fmt"
	"math"
	"os"
	"path/filepath"
	"regexp"
	"slices"
	"strconv"
	"strings"
)

// cellFolders are the folders of deposited structures under the sources
// folder, each with the source key its cells cite.
var cellFolders = []struct{ dir, key string }{
	{"cod-cells", "cod-ncrystal"},
	{"cod-debian", "cod-debian"},
}

// cellTolerance is how far a deposited cell may lie from the typed one and
// still replace it: 1 % on lengths (room-temperature refinements of these
// salts differ by a few parts in a thousand; common practice, no source)
// and 0.01 on a fractional coordinate. A larger gap means a slip in one
// of the two, to be looked at by hand; the typed value then stays.
var cellTolerance = struct{ length, fraction float64 }{0.01, 0.01}

// positionTolerance is how close two fractional coordinates must be to be
// the same: CIF files print 1/3 as 0.33333.
const positionTolerance = 1e-4

// depositedCell is one structure file: its cell and atoms as printed.
type depositedCell struct {
	file     string // relative to the sources folder
	source   string // source key of sources.csv
	cellLine int    // line of the @CELL keyword or of _cell_length_a
	entry    string // COD entry number
	measured string // the temperature of the measurement as printed ("T = 473 K"), if stated
	lengths  [3]float64
	angles   [3]float64
	atoms    []cellAtom
	printed  map[string]string // a, c as printed
}

type cellAtom struct {
	element string
	x       [3]float64
}

// readDepositedCells reads every structure file of the cell folders, by
// composition key: an NCMAT file's from its file name ("MgO2H2_sg164_…" is
// Mg(OH)2), a CIF's from its _chemical_formula_sum.
func readDepositedCells(sourcesDir string) (map[string]depositedCell, error) {
	out := map[string]depositedCell{}
	for _, folder := range cellFolders {
		names, err := filepath.Glob(filepath.Join(sourcesDir, folder.dir, "*"))
		if err != nil {
			return nil, err
		}
		for _, name := range names {
			base := filepath.Base(name)
			var formula string
			var c depositedCell
			switch filepath.Ext(base) {
			case ".ncmat":
				raw, err := os.ReadFile(name)
				if err != nil {
					return nil, err
				}
				formula, _, _ = strings.Cut(base, "_")
				formula, _, _ = strings.Cut(formula, "-")
				c, err = parseNCMATCell(string(raw))
				if err != nil {
					return nil, fmt.Errorf("%s: %w", base, err)
				}
			case ".cif":
				raw, err := os.ReadFile(name)
				if err != nil {
					return nil, err
				}
				c, formula, err = parseCIFCell(string(raw))
				if err != nil {
					return nil, fmt.Errorf("%s: %w", base, err)
				}
			default:
				continue
			}
			comp, _, ok := composition(formula)
			if !ok {
				return nil, fmt.Errorf("%s: %q is not a formula", base, formula)
			}
			c.file, c.source = folder.dir+"/"+base, folder.key
			key := compKey(comp, 0)
			if prev, dup := out[key]; dup {
				return nil, fmt.Errorf("%s and %s give the same composition", prev.file, c.file)
			}
			out[key] = c
		}
	}
	return out, nil
}

// measuredAt finds the temperature of a measurement in a comment line
// ("… at T = 473 K", "T = 25 C, P = 0.0 kbar").
var measuredAt = regexp.MustCompile(`T = [0-9.]+ ?[KC]\b`)

// parseNCMATCell reads the COD entry, @CELL and @ATOMPOSITIONS of an
// NCMAT file. "!!" in a lengths line repeats the length before it.
func parseNCMATCell(text string) (depositedCell, error) {
	var c depositedCell
	c.printed = map[string]string{}
	section := ""
	for i, line := range strings.Split(text, "\n") {
		f := strings.Fields(line)
		if strings.HasPrefix(line, "#") {
			// "Crystallography Open Database entry N", or else the
			// first COD address (a file converted from AMCSD names the
			// COD copy of the same entry so).
			if j := slices.Index(f, "entry"); j > 0 && f[j-1] == "Database" && j+1 < len(f) && c.entry == "" {
				c.entry = f[j+1]
			}
			if _, after, ok := strings.Cut(line, "crystallography.net/cod/"); ok && c.entry == "" {
				c.entry = strings.TrimSuffix(strings.Fields(after)[0], ".html")
			}
			if m := measuredAt.FindString(line); m != "" && c.measured == "" {
				c.measured = m
			}
			continue
		}
		if len(f) == 0 {
			continue
		}
		if strings.HasPrefix(f[0], "@") {
			section = f[0]
			if section == "@CELL" {
				c.cellLine = i + 1
			}
			continue
		}
		switch section {
		case "@CELL":
			switch f[0] {
			case "cubic":
				if len(f) != 2 {
					return c, fmt.Errorf("line %d: cubic takes one length", i+1)
				}
				a, err := strconv.ParseFloat(f[1], 64)
				if err != nil {
					return c, fmt.Errorf("line %d: %w", i+1, err)
				}
				c.lengths, c.angles = [3]float64{a, a, a}, [3]float64{90, 90, 90}
				c.printed["a"], c.printed["c"] = f[1], f[1]
			case "lengths", "angles":
				if len(f) != 4 {
					return c, fmt.Errorf("line %d: %s takes three numbers", i+1, f[0])
				}
				var v [3]float64
				for k, s := range f[1:] {
					if s == "!!" && k > 0 {
						v[k] = v[k-1]
						continue
					}
					x, err := strconv.ParseFloat(s, 64)
					if err != nil {
						return c, fmt.Errorf("line %d: %w", i+1, err)
					}
					v[k] = x
				}
				if f[0] == "angles" {
					c.angles = v
				} else {
					c.lengths = v
					c.printed["a"], c.printed["c"] = f[1], f[3]
				}
			}
		case "@ATOMPOSITIONS":
			if len(f) != 4 {
				return c, fmt.Errorf("line %d: an atom takes an element and three coordinates", i+1)
			}
			a := cellAtom{element: f[0]}
			for k, s := range f[1:] {
				x, err := fraction(s)
				if err != nil {
					return c, fmt.Errorf("line %d: %w", i+1, err)
				}
				a.x[k] = x
			}
			c.atoms = append(c.atoms, a)
		}
	}
	switch {
	case c.entry == "":
		return c, fmt.Errorf("no Crystallography Open Database entry named")
	case c.lengths[0] == 0 || c.angles[0] == 0:
		return c, fmt.Errorf("no cell")
	case len(c.atoms) == 0:
		return c, fmt.Errorf("no atoms")
	}
	return c, nil
}

// fraction reads a coordinate written as a decimal or as p/q.
func fraction(s string) (float64, error) {
	if p, q, ok := strings.Cut(s, "/"); ok {
		n, err1 := strconv.ParseFloat(p, 64)
		d, err2 := strconv.ParseFloat(q, 64)
		if err1 != nil || err2 != nil || d == 0 {
			return 0, fmt.Errorf("%q is not a fraction", s)
		}
		return n / d, nil
	}
	return strconv.ParseFloat(s, 64)
}

// params gives the deposited cell's values of the parameter names the
// structure prototype uses (a; a, c; and the free coordinates x, u,
// z_cation, x_anion), reading the free coordinates from the atoms of the
// cation and anion elements. ok is false when the cell's shape does not fit
// the prototype or a name cannot be read.
func (c depositedCell) params(structure string, names []string, cation, anion string) (map[string]float64, bool) {
	cubic := c.lengths[0] == c.lengths[1] && c.lengths[1] == c.lengths[2] && c.angles == [3]float64{90, 90, 90}
	hexagonal := c.lengths[0] == c.lengths[1] && c.angles == [3]float64{90, 90, 120}
	tetragonal := c.lengths[0] == c.lengths[1] && c.angles == [3]float64{90, 90, 90}
	shapeOK := map[string]bool{
		"rock-salt": cubic, "fluorite": cubic, "antifluorite": cubic, "caesium-chloride": cubic, "zinc-blende": cubic,
		"rutile": tetragonal && !cubic, "wurtzite": hexagonal, "cadmium-iodide": hexagonal, "corundum": hexagonal,
		"cadmium-chloride": hexagonal, "nickel-arsenide": hexagonal,
	}[structure]
	if !shapeOK {
		return nil, false
	}
	out := map[string]float64{}
	for _, n := range names {
		var v float64
		ok := true
		switch n {
		case "a":
			v = c.lengths[0]
		case "c":
			ok = !cubic
			v = c.lengths[2]
		case "x": // rutile: the anion at (x, x, 0)
			v, ok = c.find(anion, func(p [3]float64) bool { return near(p[0], p[1]) && near(p[2], 0) && p[0] < 0.5 }, 0)
		case "u": // wurtzite: the anion's height above the cation on the same column
			var zc, za float64
			zc, ok = c.find(cation, func(p [3]float64) bool { return near(p[0], 1.0/3) && near(p[1], 2.0/3) }, 2)
			if ok {
				za, ok = c.find(anion, func(p [3]float64) bool { return near(p[0], 1.0/3) && near(p[1], 2.0/3) }, 2)
			}
			v = math.Mod(za-zc+1, 1)
		case "z_cation": // corundum: the cation at (0, 0, z), 1/4 < z < 1/2
			v, ok = c.find(cation, func(p [3]float64) bool { return near(p[0], 0) && near(p[1], 0) && p[2] > 0.25 && p[2] < 0.5 }, 2)
		case "x_anion": // corundum: the anion at (x, 0, 1/4)
			v, ok = c.find(anion, func(p [3]float64) bool { return near(p[1], 0) && near(p[2], 0.25) && p[0] < 0.5 }, 0)
		default:
			ok = false
		}
		if !ok {
			return nil, false
		}
		out[n] = v
	}
	return out, true
}

// find returns coordinate k of the first atom of element el whose
// position fits.
func (c depositedCell) find(el string, fits func([3]float64) bool, k int) (float64, bool) {
	for _, a := range c.atoms {
		if a.element == el && fits(a.x) {
			return a.x[k], true
		}
	}
	return 0, false
}

func near(a, b float64) bool { return math.Abs(a-b) < positionTolerance }

// elementOf is the element of a monatomic ion symbol ("Mg2+" → "Mg"); ""
// for a polyatomic ion.
func elementOf(ion string) string {
	s := strings.TrimRight(ion, "+-0123456789")
	if comp, _, ok := composition(s); ok && len(comp) == 1 {
		for el := range comp {
			return el
		}
	}
	return ""
}

// parseParams reads a params cell ("a=4.59;c=2.96;x=0.305") in its order.
func parseParams(s string) (names []string, values map[string]float64, err error) {
	values = map[string]float64{}
	for _, kv := range strings.Split(s, ";") {
		k, v, ok := strings.Cut(kv, "=")
		if !ok {
			return nil, nil, fmt.Errorf("params %q: %q has no =", s, kv)
		}
		x, err := strconv.ParseFloat(v, 64)
		if err != nil {
			return nil, nil, fmt.Errorf("params %q: %w", s, err)
		}
		names = append(names, k)
		values[k] = x
	}
	return names, values, nil
}

// cellGap compares a deposited cell with typed parameters: the largest
// relative gap of a length and the largest absolute gap of a coordinate.
func cellGap(typed, deposited map[string]float64) (length, fraction float64) {
	for k, t := range typed {
		d := deposited[k]
		if k == "a" || k == "c" {
			length = math.Max(length, math.Abs(d-t)/t)
		} else {
			fraction = math.Max(fraction, math.Abs(d-t))
		}
	}
	return length, fraction
}

// depositedParams returns the params cell a deposited structure gives
// for a kept compound, and the note that records the typed value beside
// it. ok is false when no structure file fits, or its cell lies outside
// cellTolerance of the typed one (then a warning names the gap).
func (g *generator) depositedParams(k map[string]string) (params, source, note string, ok bool) {
	if k["params"] == "" || k["params_source"] != "wyckoff1963" {
		return "", "", "", false
	}
	comp, _, okc := composition(k["formula"])
	if !okc {
		return "", "", "", false
	}
	c, found := g.cells[compKey(comp, 0)]
	if !found {
		return "", "", "", false
	}
	names, typed, err := parseParams(k["params"])
	if err != nil {
		g.warnf("kept compound %s: %v", k["formula"], err)
		return "", "", "", false
	}
	dep, fits := c.params(k["structure"], names, elementOf(k["cation"]), elementOf(k["anion"]))
	if !fits {
		g.warnf("kept compound %s: %s does not give every parameter of %s (%s)", k["formula"], c.file, k["structure"], k["params"])
		return "", "", "", false
	}
	if l, f := cellGap(typed, dep); l > cellTolerance.length || f > cellTolerance.fraction {
		g.warnf("kept compound %s: %s (COD %s) lies %.2f %% / %.4f from the typed cell %s: typed value kept", k["formula"], c.file, c.entry, 100*l, f, k["params"])
		return "", "", "", false
	}
	parts := make([]string, len(names))
	for i, n := range names {
		v := num(round6(dep[n]))
		if p, ok := c.printed[n]; ok {
			v = p
		}
		parts[i] = n + "=" + v
	}
	entry := c.entry
	if c.measured != "" {
		entry += " at " + c.measured
	}
	note = fmt.Sprintf("cell: COD %s (%s:%d); Wyckoff 1963 typed %s", entry, c.file, c.cellLine, k["params"])
	return strings.Join(parts, ";"), c.source, note, true
}
