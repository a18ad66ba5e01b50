package cycle

import (
	"path/filepath"
	"strings"
	"testing"

	"enthalpath/thermo/cif"
)

// readCIF parses one of the repository's CIF files with the given charges
// by element.
func readCIF(t *testing.T, name string, charges map[string]float64) Structure {
	t.Helper()
	path := filepath.Join("..", "testdata", "cif", name)
	cell, err := cif.ParseFile(path, cif.Options{Charges: charges})
	if err != nil {
		t.Fatalf("%s: %v", name, err)
	}
	return Structure{CIF: path, Cell: cell}
}

// TestCIFOfAnotherCompoundIsRefused: a CIF file lends its Madelung
// constant, distance and volume only to the compound it holds. Rutile
// (Ti⁴⁺, O²⁻) and the invented NaKCl₂ (two ion pairs and a foreign K⁺ per
// formula unit) must not give NaCl their A (2.388 and 3.43 before the
// check); the NaCl file must still give rock salt's A = 1.747565 (the
// published Madelung constant of rock salt, C. Kittel, Introduction to
// Solid State Physics, ch. 3, from memory).
func TestCIFOfAnotherCompoundIsRefused(t *testing.T) {
	nacl := map[string]float64{"Na": 1, "Cl": -1}
	for _, tc := range []struct {
		file  string
		words []string // the refusal names the file, what it holds and what NaCl needs
	}{
		{"real_TiO2_rutile.cif", []string{"real_TiO2_rutile.cif", "Ti⁴⁺", "2 O²⁻", "1 Na⁺ and 1 Cl⁻"}},
		{"invented_tarnwick_NaKCl2_monoclinic.cif", []string{"NaKCl2_monoclinic.cif", "K⁺", "2 Cl⁻", "1 Na⁺ and 1 Cl⁻"}},
	} {
		c := build(t, "NaCl", Options{Settings: Settings{Structure: readCIF(t, tc.file, nacl)}})
		for _, m := range EvaluateModels(c) {
			if m.Model == ModelKapustinskii {
				if m.Err != nil {
					t.Errorf("%s: kapustinskii needs no structure but failed: %v", tc.file, m.Err)
				}
				continue
			}
			if m.Err == nil {
				t.Errorf("%s: %s accepted the file for NaCl (A = %g, d₀ = %g, V_m = %g)", tc.file, m.Model, m.Inputs.Madelung, m.Inputs.D0, m.Inputs.MolarVolume)
				continue
			}
			for _, w := range tc.words {
				if !strings.Contains(m.Err.Error(), w) {
					t.Errorf("%s: %s: %q does not say %q", tc.file, m.Model, m.Err, w)
				}
			}
		}
	}
	c := build(t, "NaCl", Options{Settings: Settings{Structure: readCIF(t, "real_NaCl_rocksalt_Fm-3m.cif", nacl)}})
	m, err := EvaluateModel(c, ModelEwald)
	if err != nil || !near(m.Inputs.Madelung, 1.747565, 1e-6) { // Kittel, from memory
		t.Errorf("NaCl with its own CIF: A = %g, %v; want 1.747565", m.Inputs.Madelung, err)
	}
}

// TestCIFChecks: charges in the right ratio but on another scale are
// accepted (A is referred to the nearest pair's charges, so it does not
// change: an invariance, no source needed); a cell whose Z counts two ion
// pairs as one formula unit is refused (its A per formula unit would be
// doubled).
func TestCIFChecks(t *testing.T) {
	st := readCIF(t, "real_NaCl_rocksalt_Fm-3m.cif", map[string]float64{"Na": 2, "Cl": -2})
	c := build(t, "NaCl", Options{Settings: Settings{Structure: st}})
	m, err := EvaluateModel(c, ModelEwald)
	if err != nil || !near(m.Inputs.Madelung, 1.747565, 1e-6) { // Kittel, from memory
		t.Errorf("NaCl file with charges ±2: A = %g, %v; want 1.747565", m.Inputs.Madelung, err)
	}
	st = readCIF(t, "real_NaCl_rocksalt_Fm-3m.cif", map[string]float64{"Na": 1, "Cl": -1})
	st.Cell.FormulaUnits /= 2
	c = build(t, "NaCl", Options{Settings: Settings{Structure: st}})
	if m, err := EvaluateModel(c, ModelEwald); err == nil || !strings.Contains(err.Error(), "2 Na⁺, 2 Cl⁻") {
		t.Errorf("NaCl cell with Z halved: A = %g, err %v; want a refusal naming 2 Na⁺, 2 Cl⁻ per formula unit", m.Inputs.Madelung, err)
	}
	// A site of a neighbouring element with the right charge is still another compound.
	st = readCIF(t, "real_NaCl_rocksalt_Fm-3m.cif", map[string]float64{"Na": 1, "Cl": -1})
	st.Cell.Sites[0].Species = "K"
	c = build(t, "NaCl", Options{Settings: Settings{Structure: st}})
	if _, err := EvaluateModel(c, ModelVolume); err == nil || !strings.Contains(err.Error(), "K⁺") {
		t.Errorf("NaCl cell with one K⁺: volume model gave %v; want a refusal naming K⁺", err)
	}
}
