package cif_test

import (
	"errors"
	"fmt"
	"math"
	"path/filepath"
	"strings"
	"testing"

	"enthalpath/thermo/cif"
)

// Expected charges in these tests are those written into the inputs.
func TestChargeSources(t *testing.T) {
	const cell = header + "loop_\n_atom_site_label\n_atom_site_type_symbol\n_atom_site_fract_x\n_atom_site_fract_y\n_atom_site_fract_z\n"
	tests := []struct {
		name string
		src  string
		opt  cif.Options
		want map[string]float64 // label → charge
	}{
		{"charged type symbols", cell + "A Ca2+ 0 0 0\nB O2- 0.5 0.5 0.5\n", cif.Options{}, map[string]float64{"A": 2, "B": -2}},
		{"reversed sign order", cell + "A Ca+2 0 0 0\nB O-2 0.5 0.5 0.5\n", cif.Options{}, map[string]float64{"A": 2, "B": -2}},
		{"bare sign", cell + "A Na+ 0 0 0\nB Cl- 0.5 0.5 0.5\n", cif.Options{}, map[string]float64{"A": 1, "B": -1}},
		{"oxidation loop overrides type symbol", cell + "A Ca2+ 0 0 0\nB O2- 0.5 0.5 0.5\nloop_\n_atom_type_symbol\n_atom_type_oxidation_number\nCa2+ 1\nO2- -1\n",
			cif.Options{}, map[string]float64{"A": 1, "B": -1}},
		{"options by element override the file", cell + "A Ca2+ 0 0 0\nB O2- 0.5 0.5 0.5\n", cif.Options{Charges: map[string]float64{"Ca": 1.5, "O": -1.5}}, map[string]float64{"A": 1.5, "B": -1.5}},
		{"options by label first", cell + "A Ca 0 0 0\nB O 0.5 0.5 0.5\n", cif.Options{Charges: map[string]float64{"A": 2, "Ca": 7, "O": -2}}, map[string]float64{"A": 2, "B": -2}},
		{"options by type symbol", cell + "A Ca2+ 0 0 0\nB O2- 0.5 0.5 0.5\n", cif.Options{Charges: map[string]float64{"Ca2+": 0.5, "O2-": -0.5}}, map[string]float64{"A": 0.5, "B": -0.5}},
		{"label only, element from its letters", header + "loop_\n_atom_site_label\n_atom_site_fract_x\n_atom_site_fract_y\n_atom_site_fract_z\nCl2 0 0 0\nNA1 0.5 0.5 0.5\nloop_\n_atom_type_symbol\n_atom_type_oxidation_number\nCl -1\nNa 1\n",
			cif.Options{}, map[string]float64{"Cl2": -1, "NA1": 1}},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			c, err := cif.Parse(strings.NewReader(tc.src), "q.cif", tc.opt)
			if err != nil {
				t.Fatal(err)
			}
			for _, s := range c.Sites {
				if w, ok := tc.want[s.Label]; !ok || math.Abs(s.Charge-w) > 1e-15 {
					t.Errorf("site %s (%s) charge %g, want %g", s.Label, s.Species, s.Charge, w)
				}
			}
		})
	}
}

func TestFormulaUnitsFromComposition(t *testing.T) {
	// Without _cell_formula_units_Z, Z is the gcd of the element counts:
	// rutile's cell holds Ti2O4, so Z = 2 (Baur & Khan 1971, from memory:
	// two formula units per cell).
	path := filepath.Join(cifDir, "real_TiO2_rutile.cif")
	src := readFile(t, path)
	src = strings.Replace(src, "_cell_formula_units_Z             2\n", "", 1)
	c, err := cif.Parse(strings.NewReader(src), "rutile-noZ.cif", cif.Options{})
	if err != nil {
		t.Fatal(err)
	}
	if c.FormulaUnits != 2 {
		t.Errorf("Z = %d, want 2", c.FormulaUnits)
	}
}

func TestBlocks(t *testing.T) {
	path := filepath.Join(cifDir, "invented_tarnwick_MgS_wurtzite_type.cif")
	// The first block holds no atom sites; the reader takes the second.
	c, err := cif.ParseFile(path, cif.Options{})
	if err != nil {
		t.Fatal(err)
	}
	if len(c.Sites) != 4 { // wurtzite type: 2 cations + 2 anions per cell (structure type, common knowledge)
		t.Errorf("%d sites, want 4", len(c.Sites))
	}
	if _, err := cif.ParseFile(path, cif.Options{Block: "tarnwick_TW-0610"}); err != nil {
		t.Errorf("named block: %v", err)
	}
	_, err = cif.ParseFile(path, cif.Options{Block: "tarnwick_notes"})
	if !errors.Is(err, cif.ErrNoSites) {
		t.Errorf("block without sites: err = %v, want ErrNoSites", err)
	}
	_, err = cif.ParseFile(path, cif.Options{Block: "nope"})
	if err == nil || !strings.Contains(err.Error(), "data_tarnwick_notes, data_tarnwick_TW-0610") {
		t.Errorf("missing block: err = %v, want the list of blocks", err)
	}
}

func TestMergeTolerance(t *testing.T) {
	// Two images 0.004 Å apart (0.001 of a 4 Å cell): distinct atoms at the
	// default 1e-3 Å, one site at 0.01 Å.
	src := header + "loop_\n_symmetry_equiv_pos_as_xyz\nx,y,z\n-x,-y,-z\n" + sitesCsCl + "Cs1 0.0005 0 0\nCl1 0.5 0.5 0.5\n"
	if _, err := cif.Parse(strings.NewReader(src), "m.cif", cif.Options{}); err == nil {
		t.Error("0.004 Å apart merged at the default tolerance (or no error for the charged cell)")
	}
	c, err := cif.Parse(strings.NewReader(src), "m.cif", cif.Options{MergeTolerance: 0.01})
	if err != nil {
		t.Fatal(err)
	}
	if len(c.Sites) != 2 {
		t.Errorf("%d sites, want 2", len(c.Sites))
	}
	for _, bad := range []float64{-1, 0.6, math.NaN()} {
		if _, err := cif.Parse(strings.NewReader(src), "m.cif", cif.Options{MergeTolerance: bad}); err == nil {
			t.Errorf("tolerance %g accepted", bad)
		}
	}
}

func ExampleParse() {
	const src = `data_example
# A caesium-chloride-type cell (a made-up lattice parameter).
_cell_length_a    4.1(1)
_cell_length_b    4.1(1)
_cell_length_c    4.1(1)
_cell_angle_alpha 90
_cell_angle_beta  90
_cell_angle_gamma 90
loop_
_atom_site_label
_atom_site_type_symbol
_atom_site_fract_x
_atom_site_fract_y
_atom_site_fract_z
Cs1 Cs+ 0   0   0
Cl1 Cl- 0.5 0.5 0.5
`
	c, err := cif.Parse(strings.NewReader(src), "example.cif", cif.Options{})
	if err != nil {
		fmt.Println(err)
		return
	}
	for _, s := range c.Sites {
		fmt.Printf("%s %s %+g %v\n", s.Label, s.Species, s.Charge, s.Frac)
	}
	fmt.Printf("Z = %d, V = %.3f Å³\n", c.FormulaUnits, c.Volume())

	_, err = cif.Parse(strings.NewReader(strings.Replace(src, "0.5 0.5 0.5", "0.5x 0.5 0.5", 1)), "example.cif", cif.Options{})
	fmt.Println(err)
	// Output:
	// Cs1 Cs +1 [0 0 0]
	// Cl1 Cl -1 [0.5 0.5 0.5]
	// Z = 1, V = 68.921 Å³
	// example.cif:16: _atom_site_fract_x: cannot read "0.5x" as a number
}
