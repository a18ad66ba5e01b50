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

// TestDefaultPrototypeGivesShapeOnly: a prototype with its default
// parameters lends the Ewald model its Madelung constant (which depends on
// the shape only) but not its distance, which is the template crystal's
// (CdCl₂'s Cd–Cl 2.656 Å for MgCl₂ before; CsCl's a = 4.123 Å for NaCl).
func TestDefaultPrototypeGivesShapeOnly(t *testing.T) {
	// MgCl₂ has no cell parameters in the data: d₀ is the radii sum,
	// Mg²⁺ (CN VI) 0.72 Å + Cl⁻ (CN VI) 1.81 Å (R. D. Shannon, Acta Cryst.
	// A32, 751 (1976), from memory), as the Born–Mayer model takes it.
	c := build(t, "MgCl2", Options{})
	if c.Settings.Structure.Prototype != "cadmium-chloride" || len(c.Settings.Structure.Params) != 0 {
		t.Fatalf("MgCl2's structure in the data changed: %+v", c.Settings.Structure)
	}
	ew, err := EvaluateModel(c, ModelEwald)
	if err != nil {
		t.Fatal(err)
	}
	bm, err := EvaluateModel(c, ModelBornMayer)
	if err != nil {
		t.Fatal(err)
	}
	if !near(ew.Inputs.D0, 0.72+1.81, 1e-9) || !strings.Contains(ew.Inputs.D0From, "sum of radii") || !strings.Contains(ew.Inputs.D0From, "default cell") {
		t.Errorf("MgCl2 ewald d₀ = %g (%s); want 2.53 Å from the radii", ew.Inputs.D0, ew.Inputs.D0From)
	}
	// Same A (the prototype's), same d₀, same ρ: the two models agree.
	if !near(ew.Inputs.Madelung, bm.Inputs.Madelung, 1e-12) || !near(ew.Energy, bm.Energy, 1e-9) {
		t.Errorf("MgCl2: ewald A %g U %g, born-mayer A %g U %g; want equal", ew.Inputs.Madelung, ew.Energy, bm.Inputs.Madelung, bm.Energy)
	}
	// NaCl in the CsCl shape: A = 1.762675 (the CsCl Madelung constant,
	// C. Kittel, Introduction to Solid State Physics, ch. 3, from memory);
	// d₀ from NaCl's own rock-salt cell of the data, a/2.
	c = build(t, "NaCl", Options{Settings: Settings{Structure: Structure{Prototype: "caesium-chloride"}}})
	own := loadDB(t)
	comp, _ := own.FindCompound("NaCl")
	a := comp.Params["a"]
	if comp.Structure != "rock-salt" || !(a > 5.6 && a < 5.7) { // 5.6402 Å (data table)
		t.Fatalf("NaCl's cell in the data changed: %s %v", comp.Structure, comp.Params)
	}
	ew, err = EvaluateModel(c, ModelEwald)
	if err != nil {
		t.Fatal(err)
	}
	if !near(ew.Inputs.Madelung, 1.762675, 1e-6) || !near(ew.Inputs.D0, a/2, 1e-9) || !strings.Contains(ew.Inputs.D0From, "measured cell") {
		t.Errorf("NaCl as caesium-chloride: A = %g, d₀ = %g (%s); want 1.762675 and %g", ew.Inputs.Madelung, ew.Inputs.D0, ew.Inputs.D0From, a/2)
	}
	// With parameters the cell is measured: its own distance is used.
	c = build(t, "NaCl", Options{Settings: Settings{Structure: Structure{Prototype: "caesium-chloride", Params: map[string]float64{"a": 3.3}}}})
	if ew, err = EvaluateModel(c, ModelEwald); err != nil || !near(ew.Inputs.D0, 3.3*0.8660254037844386, 1e-9) { // √3/2·a, body diagonal
		t.Errorf("NaCl as caesium-chloride a = 3.3 Å: d₀ = %g, %v; want √3/2·3.3", ew.Inputs.D0, err)
	}
}
