package main

import (
	"fmt"
	"math"
	"strconv"
	"strings"
)

// avogadroConstant is N_A in mol⁻¹ (exact, SI 2019).
const avogadroConstant = 6.02214076e23

// xrayDensity is the density of a deposited structure, Z·M/(N_A·V) in
// g/cm³: Z the formula units of comp in the cell's atoms, M the molar mass
// from the CIAAW weights, V the cell's volume. ok is false when the atoms
// are not a whole number of formula units of comp or a weight is missing.
func (g *generator) xrayDensity(c depositedCell, comp map[string]float64) (float64, bool) {
	count := map[string]float64{}
	for _, a := range c.atoms {
		count[a.element]++
	}
	z, mass := 0.0, 0.0
	for el, n := range comp {
		w, ok := g.weights[el]
		if !ok || n == 0 {
			return 0, false
		}
		mass += n * w
		zi := count[el] / n
		if z == 0 {
			z = zi
		}
		if zi != z || zi != math.Trunc(zi) || zi == 0 {
			return 0, false
		}
	}
	if len(count) != len(comp) {
		return 0, false
	}
	return z * mass / (avogadroConstant * cellVolume(c) * 1e-24), true
}

// cellVolume is the volume of a cell from its lengths (Å) and angles, in Å³.
func cellVolume(c depositedCell) float64 {
	var cos [3]float64
	for i, a := range c.angles {
		cos[i] = math.Cos(a * math.Pi / 180)
	}
	return c.lengths[0] * c.lengths[1] * c.lengths[2] *
		math.Sqrt(1-cos[0]*cos[0]-cos[1]*cos[1]-cos[2]*cos[2]+2*cos[0]*cos[1]*cos[2])
}

// addXrayDensity writes the X-ray density of the compound's deposited
// structure into the row (a prototype's cell is not needed: the
// structure's own atoms give Z), keeping a typed density in the note. It
// says whether it wrote one.
func (g *generator) addXrayDensity(row, k map[string]string) bool {
	comp, _, ok := composition(k["formula"])
	if !ok {
		return false
	}
	c, found := g.cells[compKey(comp, 0)]
	if !found {
		return false
	}
	rho, ok := g.xrayDensity(c, comp)
	if !ok {
		g.warnf("kept compound %s: %s gives no whole number of formula units", k["formula"], c.file)
		return false
	}
	row["density_g_cm3"], row["density_source"], row["density_locator"] = strconv.FormatFloat(rho, 'f', 3, 64), c.source, locator(c.file, c.cellLine)
	clause := fmt.Sprintf("density: X-ray density Z·M/(N_A·V) of COD %s (%s:%d)", c.entry, c.file, c.cellLine)
	if typed := k["density_g_cm3"]; typed != "" {
		clause += "; typed " + typed
	}
	row["note"] = fmtNote(row["note"], clause)
	return true
}

// fmtNote appends a clause to a note.
func fmtNote(note, clause string) string {
	if note == "" {
		return clause
	}
	return note + "; " + clause
}

// nistCompound is one material of the vendored NIST compound list
// (nist-compounds/): its name, density as printed, and mass fractions.
type nistCompound struct {
	line      int
	name      string
	density   string
	fractions map[string]float64
}

// fractionTolerance is how far a material's mass fraction may lie from
// the one a formula's atomic weights give and still be that formula: the
// list prints six decimals, and the 2016 weights differ from older ones
// by far less than 10⁻³ of a fraction (common practice, no source).
const fractionTolerance = 1e-3

// readNISTCompounds reads the vendored NIST compound list.
func readNISTCompounds(dir string) ([]nistCompound, error) {
	rows, err := readCSVFile(dir, nistCompoundsFile)
	if err != nil {
		return nil, err
	}
	out := make([]nistCompound, 0, len(rows))
	for _, r := range rows {
		els := strings.Split(r.Cells["elements"], ";")
		ws := strings.Split(r.Cells["mass_fractions"], ";")
		if len(els) != len(ws) {
			return nil, fmt.Errorf("%s:%d: %d elements, %d mass fractions", nistCompoundsFile, r.Line, len(els), len(ws))
		}
		m := nistCompound{line: r.Line, name: r.Cells["name"], density: r.Cells["density_g_cm3"], fractions: map[string]float64{}}
		for i, el := range els {
			w, err := strconv.ParseFloat(ws[i], 64)
			if err != nil {
				return nil, fmt.Errorf("%s:%d: %w", nistCompoundsFile, r.Line, err)
			}
			m.fractions[el] = w
		}
		out = append(out, m)
	}
	return out, nil
}

// massFractions are the mass fractions of a composition from the atomic
// weights; ok is false when a weight is missing.
func (g *generator) massFractions(comp map[string]float64) (map[string]float64, bool) {
	total := 0.0
	out := map[string]float64{}
	for el, n := range comp {
		w, ok := g.weights[el]
		if !ok {
			return nil, false
		}
		out[el] = n * w
		total += n * w
	}
	for el := range out {
		out[el] /= total
	}
	return out, true
}

// addCompiledDensity writes the density the NIST compound list gives for
// a material of the compound's composition (same elements, every mass
// fraction within fractionTolerance). A composition two materials fit is
// ambiguous and gets none.
func (g *generator) addCompiledDensity(row, k map[string]string) bool {
	comp, _, ok := composition(k["formula"])
	if !ok {
		return false
	}
	want, ok := g.massFractions(comp)
	if !ok {
		return false
	}
	var found []nistCompound
	for _, m := range g.nistCompounds {
		if len(m.fractions) != len(want) {
			continue
		}
		fits := true
		for el, w := range want {
			if f, ok := m.fractions[el]; !ok || math.Abs(f-w) > fractionTolerance {
				fits = false
				break
			}
		}
		if fits {
			found = append(found, m)
		}
	}
	switch {
	case len(found) == 0:
		return false
	case len(found) > 1:
		g.warnf("kept compound %s: the NIST compound list has %q and %q of its composition: no density taken", k["formula"], found[0].name, found[1].name)
		return false
	}
	m := found[0]
	row["density_g_cm3"], row["density_source"], row["density_locator"] = m.density, keyNISTCompounds, locator(nistCompoundsFile, m.line)
	clause := fmt.Sprintf("density: NIST compound list %q (%s:%d)", m.name, nistCompoundsFile, m.line)
	if typed := k["density_g_cm3"]; typed != "" {
		clause += "; typed " + typed
	}
	row["note"] = fmtNote(row["note"], clause)
	return true
}
