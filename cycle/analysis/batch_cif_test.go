package analysis

import (
	"bytes"
	"encoding/csv"
	"os"
	"path/filepath"
	"strings"
	"testing"
)

// TestBatchStructureColumnTakesCIF: a CIF path in the structure column is
// read relative to the batch file's folder (Dir), its charges assigned
// from the row's ions. The file (testdata/gen_oxidation.py, pymatgen's
// CifWriter, a = 5.6402 Å) holds the same rock-salt cell as the data's
// NaCl row (a = 5.6402 Å, Wyckoff), so both rows give the same lattice
// step; KCl with a NaCl file is refused, naming the foreign element.
func TestBatchStructureColumnTakesCIF(t *testing.T) {
	a := testAnalyst(t)
	dir := t.TempDir()
	src, err := os.ReadFile("../../testdata/oxidation/real_NaCl_rock_salt_P1.cif")
	if err != nil {
		t.Fatal(err)
	}
	if err := os.MkdirAll(filepath.Join(dir, "cells"), 0o755); err != nil {
		t.Fatal(err)
	}
	if err := os.WriteFile(filepath.Join(dir, "cells", "nacl.cif"), src, 0o644); err != nil {
		t.Fatal(err)
	}
	in := "formula,structure,model\nNaCl,cells/nacl.cif,born-mayer\nNaCl,,born-mayer\nKCl,cells/nacl.cif,born-mayer\n"
	var out bytes.Buffer
	if _, err := a.Batch(strings.NewReader(in), &out, BatchOptions{Dir: dir}); err != nil {
		t.Fatal(err)
	}
	rows, err := csv.NewReader(&out).ReadAll()
	if err != nil {
		t.Fatal(err)
	}
	if len(rows) != 4 {
		t.Fatalf("%d output rows:\n%v", len(rows), rows)
	}
	if rows[1][5] == "" || rows[1][5] != rows[2][5] || rows[1][11] != "" {
		t.Errorf("lattice from the CIF %q, from the data's cell %q (error %q)", rows[1][5], rows[2][5], rows[1][11])
	}
	if !strings.Contains(rows[3][11], "holds Na, which is not an element of KCl") {
		t.Errorf("KCl with a NaCl file: error %q", rows[3][11])
	}
}
