package tui_test

import (
	"math"
	"os"
	"path/filepath"
	"testing"

	"enthalpath/cycle"
	"enthalpath/tui/internal/drive"
	"enthalpath/tui/screen"
)

// TestOpenCycleFileNamingACIF: a cycle file that names a CIF file (without
// charges, relative to the cycle file's folder) reopens with that cell, its
// charges assigned from the compound's ions; the Ewald model then gives
// rock salt's A = 1.747565 (handbook tables of Madelung constants, from
// memory) from the file written by pymatgen (testdata/oxidation).
func TestOpenCycleFileNamingACIF(t *testing.T) {
	db := loadDB(t)
	m, u, dir := newRoot(t, db, 100, 30)
	src, err := os.ReadFile("../testdata/oxidation/real_NaCl_rock_salt_P1.cif")
	if err != nil {
		t.Fatal(err)
	}
	if err := os.MkdirAll(filepath.Join(dir, "work", "cells"), 0o700); err != nil {
		t.Fatal(err)
	}
	if err := os.WriteFile(filepath.Join(dir, "work", "cells", "nacl.cif"), src, 0o600); err != nil {
		t.Fatal(err)
	}
	c, err := cycle.Build(db, "NaCl", cycle.Options{})
	if err != nil {
		t.Fatal(err)
	}
	c.Settings.Structure = cycle.Structure{CIF: "cells/nacl.cif"}
	b, err := cycle.Marshal(c)
	if err != nil {
		t.Fatal(err)
	}
	if err := os.WriteFile(filepath.Join(dir, "work", "salt.hesscycle"), b, 0o600); err != nil {
		t.Fatal(err)
	}
	drive.Run(u, screen.OpenMsg{File: "work/salt.hesscycle"})
	s := m.Session()
	if s.Cycle == nil || s.Cycle.Settings.Structure.Cell == nil {
		t.Fatalf("the cycle file's CIF was not read: %q", m.View())
	}
	res := s.Solved()
	if res == nil {
		t.Fatal("not solved")
	}
	mr, _ := res.Model(cycle.ModelEwald)
	if math.Abs(mr.Inputs.Madelung-1.747565) > 1e-5 {
		t.Errorf("Madelung constant from the reopened CIF = %.6f, want 1.747565", mr.Inputs.Madelung)
	}
}
