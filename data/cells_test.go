package data

import (
	"math"
	"testing"

	"enthalpath/thermo/notation"
)

// cellFormulaUnits is Z, the formula units per conventional cell of each
// prototype with its cell parameters as the tables write them (a; a and c),
// and the cell's volume from them. Z and the cell shapes are those of the
// prototypes' standard descriptions (from memory: rock salt, zinc blende,
// fluorite 4 per cubic cell; CsCl 1; wurtzite, rutile, NiAs 2; CdI2 1 and
// corundum 6 and CdCl2 3 per hexagonal cell).
var cellFormulaUnits = map[string]struct {
	z      float64
	volume func(p map[string]float64) float64
}{
	"rock-salt":        {4, cubicVolume},
	"zinc-blende":      {4, cubicVolume},
	"fluorite":         {4, cubicVolume},
	"antifluorite":     {4, cubicVolume},
	"caesium-chloride": {1, cubicVolume},
	"wurtzite":         {2, hexagonalVolume},
	"nickel-arsenide":  {2, hexagonalVolume},
	"cadmium-iodide":   {1, hexagonalVolume},
	"corundum":         {6, hexagonalVolume},
	"cadmium-chloride": {3, hexagonalVolume},
	"rutile":           {2, func(p map[string]float64) float64 { return p["a"] * p["a"] * p["c"] }},
}

func cubicVolume(p map[string]float64) float64 { return math.Pow(p["a"], 3) }

func hexagonalVolume(p map[string]float64) float64 {
	return math.Sqrt(3) / 2 * p["a"] * p["a"] * p["c"]
}

// cellDensityExceptions are the compounds whose cell and CRC 2014 density
// disagree by more than the tolerance, as measured when the densities were
// vendored. The cells are typed from Wyckoff (1963) or, for Na2O, V2O3 and
// CdTe, read since from deposited COD entries (data/sources/cod-debian),
// which agree with the typed ones within 0.2 %: for those three the
// deposited cell is a second source against the CRC value. Where a cell is
// given the models use it, not the density (data/README.md), so these
// densities serve no result today. Several CRC values look like those of
// another form (K2SiF6: 2.27 against the cubic cell's 2.72) or like old
// handbook values.
var cellDensityExceptions = map[string]string{
	"RbF":    "cell a=5.6516 (rock-salt) gives 3.844 g/cm³, CRC 3.200 (-16.8 %)",
	"Na2O":   "cell a=5.55 (antifluorite, COD 9009063) gives 2.408 g/cm³, CRC 2.270 (-5.7 %)",
	"K2S":    "cell a=7.406 (antifluorite) gives 1.803 g/cm³, CRC 1.740 (-3.5 %)",
	"MgBr2":  "cell a=3.81, c=6.26 (cadmium-iodide) gives 3.885 g/cm³, CRC 3.720 (-4.2 %)",
	"BaO":    "cell a=5.523 (rock-salt) gives 6.045 g/cm³, CRC 5.720 (-5.4 %)",
	"AgF":    "cell a=4.92 (rock-salt) gives 7.076 g/cm³, CRC 5.852 (-17.3 %)",
	"CuBr":   "cell a=5.6905 (zinc-blende) gives 5.171 g/cm³, CRC 4.980 (-3.7 %)",
	"V2O3":   "cell a=4.952, c=14.002 (corundum, COD 9008083) gives 5.021 g/cm³, CRC 4.870 (-3.0 %)",
	"FeF2":   "cell a=4.697, c=3.309, x=0.3 (rutile) gives 4.269 g/cm³, CRC 4.090 (-4.2 %)",
	"MnBr2":  "cell a=3.82, c=6.19 (cadmium-iodide) gives 4.559 g/cm³, CRC 4.385 (-3.8 %)",
	"ZnSe":   "cell a=5.6676 (zinc-blende) gives 5.267 g/cm³, CRC 5.650 (+7.3 %)",
	"CdTe":   "cell a=6.480 (zinc-blende, COD 9008840) gives 5.859 g/cm³, CRC 6.200 (+5.9 %)",
	"K2SiF6": "cell a=8.134 (antifluorite) gives 2.719 g/cm³, CRC 2.270 (-16.5 %)",
}

// The cell parameters kept by hand (wyckoff1963, memory) are checked
// against a pinned source: the density the CRC 2014 table gives
// (crc-inorganic/, room temperature) and the X-ray density of the cell,
// Z·M/(N_A·V), with M from the CIAAW weights. Tolerance 3 %: measured
// densities of powders and crystals fall short of X-ray densities by up to
// a few per cent (common practice, no source).
func TestCellsAgreeWithPinnedDensities(t *testing.T) {
	db := mustLoad(t)
	const avogadro = 6.02214076e23 // mol⁻¹, exact (SI 2019)
	checked := 0
	for _, c := range db.Compounds() {
		proto, ok := cellFormulaUnits[c.Structure]
		if !ok || c.Params == nil || !c.Density.Known() || c.Density.Source != "crc2014-inorganic" {
			continue
		}
		f, err := notation.ParseFormula(c.Formula)
		if err != nil {
			t.Fatal(err)
		}
		mass := 0.0
		for el, n := range f.Composition() {
			e, err := db.Element(el)
			if err != nil || !e.AtomicMass.Known() {
				t.Fatalf("%s: no atomic weight of %s", c.Formula, el)
			}
			mass += float64(n) * e.AtomicMass.V
		}
		xray := proto.z * mass / (avogadro * proto.volume(c.Params) * 1e-24) // g/cm³
		gap := (c.Density.V - xray) / xray
		checked++
		if reason, ok := cellDensityExceptions[c.Formula]; ok {
			if math.Abs(gap) <= 0.03 {
				t.Errorf("%s: listed as an exception (%s) but agrees: remove it", c.Formula, reason)
			}
			continue
		}
		if math.Abs(gap) > 0.03 {
			t.Errorf("%s (%s, %v): cell gives %.3f g/cm³, CRC 2014 %.3f (%+.1f %%)", c.Formula, c.Structure, c.Params, xray, c.Density.V, 100*gap)
		}
	}
	t.Logf("%d cells compared with their CRC densities", checked)
	if checked < 50 {
		t.Errorf("only %d cells compared", checked)
	}
}
