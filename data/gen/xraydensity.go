package main

import (
	"fmt"
	"math"
	"strconv"
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
// structure into a row whose density no measured source gives, for a kept
// compound whose typed density is the only one (a prototype's cell is not
// needed: the structure's own atoms give Z). It says whether it wrote one.
func (g *generator) addXrayDensity(row, k map[string]string) bool {
	if k["density_g_cm3"] == "" {
		return false
	}
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
	row["note"] = fmtNote(row["note"], fmt.Sprintf("density: X-ray density Z·M/(N_A·V) of COD %s (%s:%d); typed %s", c.entry, c.file, c.cellLine, k["density_g_cm3"]))
	return true
}

// fmtNote appends a clause to a note.
func fmtNote(note, clause string) string {
	if note == "" {
		return clause
	}
	return note + "; " + clause
}

// readAtomicWeights reads the vendored CIAAW weights by symbol.
func readAtomicWeights(sourcesDir string) (map[string]float64, error) {
	rows, err := readCSVFile(sourcesDir, weightsFile)
	if err != nil {
		return nil, err
	}
	out := make(map[string]float64, len(rows))
	for _, r := range rows {
		if w, err := strconv.ParseFloat(r.Cells["atomic_weight"], 64); err == nil {
			out[r.Cells["symbol"]] = w
		}
	}
	return out, nil
}
