package main

import (
	"math"
	"strings"
	"testing"
)

// depositedCellGaps are the vendored cells that lie outside cellTolerance
// of the cell typed from Wyckoff (1963), as measured when they were
// vendored; the generator keeps the typed cell for them.
var depositedCellGaps = map[string]string{
	// COD 9007534 (Baur and Khan 1971) as converted by NCrystal: c=3.0159;
	// typed c=3.0519. The digits look transposed in one of the two; the
	// X-ray density of the typed cell (3.17 g/cm³) is the closer to CRC
	// 2014's 3.148 (data/cells_test.go), so the typed cell stays.
	"MgF2": "c 1.18 %",
}

// Every vendored deposited cell is compared with the cell typed from
// Wyckoff (1963) in kept/compounds.csv. Tolerance (cellTolerance): 1 % on
// lengths, 0.01 on fractional coordinates; cells refined at room
// temperature from different crystals differ by a few parts in a thousand
// (common practice, no source). Gaps above 0.2 % are logged.
func TestDepositedCells(t *testing.T) {
	g, err := newGenerator("../sources", ".", "../tables")
	if err != nil {
		t.Fatal(err)
	}
	kept, _, err := keptRows(".", "kept/compounds.csv")
	if err != nil {
		t.Fatal(err)
	}
	matched := map[string]bool{}
	for _, k := range kept {
		comp, _, ok := composition(k["formula"])
		if !ok {
			continue
		}
		c, ok := g.cells[compKey(comp, 0)]
		if !ok {
			continue
		}
		if k["params"] == "" {
			// A structure without a prototype's cell gives the
			// compound's X-ray density (TestXrayDensity).
			if _, ok := g.xrayDensity(c, comp); ok && k["density_g_cm3"] != "" {
				matched[c.file] = true
			}
			continue
		}
		matched[c.file] = true
		names, typed, err := parseParams(k["params"])
		if err != nil {
			t.Fatal(err)
		}
		dep, fits := c.params(k["structure"], names, elementOf(k["cation"]), elementOf(k["anion"]))
		if !fits {
			t.Errorf("%s: %s gives not every parameter of %s (%s)", k["formula"], c.file, k["structure"], k["params"])
			continue
		}
		l, f := cellGap(typed, dep)
		outside := l > cellTolerance.length || f > cellTolerance.fraction
		_, listed := depositedCellGaps[k["formula"]]
		switch {
		case outside && !listed:
			t.Errorf("%s: COD %s lies %.2f %% / %.4f from the typed %s: %v", k["formula"], c.entry, 100*l, f, k["params"], dep)
		case !outside && listed:
			t.Errorf("%s: listed in depositedCellGaps but agrees within tolerance: remove it", k["formula"])
		case l > 0.002 || f > 0.002:
			t.Logf("%s: COD %s %v, typed %s: %.2f %% / %.4f", k["formula"], c.entry, dep, k["params"], 100*l, f)
		}
	}
	if len(matched) != len(g.cells) {
		t.Errorf("%d vendored cells, %d matched a kept compound", len(g.cells), len(matched))
	}
	if len(g.cells) < 50 {
		t.Errorf("only %d vendored cells read", len(g.cells))
	}
}

// The reader against values the vendored files print in their comments,
// independent of @CELL: NaCl, "T = 25 C, P = 0.0 kbar, cell volume =
// 179.42 ang**3" (Walker et al. 2004, COD 9003308, header of
// NaCl_sg225_SodiumChloride.ncmat); rutile's O at (x, x, 0) and corundum's
// Al at (0, 0, z), O at (x, 0, 1/4) as the standard settings of P4₂/mnm
// and R-3c put them (from memory), with the values the files print.
func TestDepositedCellReader(t *testing.T) {
	g, err := newGenerator("../sources", ".", "../tables")
	if err != nil {
		t.Fatal(err)
	}
	get := func(formula string) depositedCell {
		comp, _, _ := composition(formula)
		c, ok := g.cells[compKey(comp, 0)]
		if !ok {
			t.Fatalf("no vendored cell of %s", formula)
		}
		return c
	}
	nacl := get("NaCl")
	if v := math.Pow(nacl.lengths[0], 3); math.Abs(v-179.42) > 0.01 {
		t.Errorf("NaCl: a³ = %.3f Å³, the file's comment says 179.42", v)
	}
	if nacl.entry != "9003308" {
		t.Errorf("NaCl: COD entry %q, want 9003308", nacl.entry)
	}
	for _, c := range []struct {
		formula, structure, cation, anion string
		names                             []string
		want                              map[string]float64
	}{
		{"TiO2", "rutile", "Ti", "O", []string{"a", "c", "x"}, map[string]float64{"a": 4.593, "c": 2.959, "x": 0.3051}},
		{"BeO", "wurtzite", "Be", "O", []string{"a", "c", "u"}, map[string]float64{"a": 2.698, "c": 4.38, "u": 0.378}},
		{"Al2O3", "corundum", "Al", "O", []string{"a", "c", "z_cation", "x_anion"},
			map[string]float64{"a": 4.757, "c": 12.9877, "z_cation": 0.35218, "x_anion": 0.30625}},
		{"Mg(OH)2", "cadmium-iodide", "Mg", "", []string{"a", "c"}, map[string]float64{"a": 3.14979, "c": 4.7702}},
	} {
		got, ok := get(c.formula).params(c.structure, c.names, c.cation, c.anion)
		if !ok {
			t.Errorf("%s: parameters not read", c.formula)
			continue
		}
		for k, w := range c.want {
			if math.Abs(got[k]-w) > 1e-9 {
				t.Errorf("%s: %s = %g, the file prints %g", c.formula, k, got[k], w)
			}
		}
	}
	// A cubic cell gives no c; a rutile cell does not fit rock salt.
	if _, ok := nacl.params("rock-salt", []string{"a", "c"}, "Na", "Cl"); ok {
		t.Error("a cubic cell gave a c parameter")
	}
	if _, ok := get("TiO2").params("rock-salt", []string{"a"}, "Ti", "O"); ok {
		t.Error("a tetragonal cell fitted rock salt")
	}
	if _, err := parseNCMATCell("NCMAT v5\n@CELL\n cubic 4\n@ATOMPOSITIONS\n Na 0 0 0\n"); err == nil || !strings.Contains(err.Error(), "entry") {
		t.Errorf("a file naming no COD entry: err %v", err)
	}
}
