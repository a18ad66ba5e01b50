package analysis

import (
	"fmt"
	"io"
	"os"
	"path/filepath"
	"strings"
	"testing"
)

// BenchmarkBatch1000CIF: a batch of 1,000 rows whose structure column names
// a CIF file each (1,000 files, copies of the pymatgen-written NaCl, CaF2
// and TiO2 cells of testdata/oxidation, charges assigned from each row's
// ions), with the Born–Mayer model on the file's cell. The issue asks under
// 30 s for the whole batch.
func BenchmarkBatch1000CIF(b *testing.B) {
	a := testAnalyst(b)
	dir := b.TempDir()
	kinds := []struct{ formula, file string }{
		{"NaCl", "real_NaCl_rock_salt_P1.cif"},
		{"CaF2", "real_CaF2_fluorite_P1.cif"},
		{"TiO2", "real_TiO2_rutile_sym.cif"},
	}
	var in strings.Builder
	in.WriteString("formula,structure,model\n")
	for i := 0; i < 1000; i++ {
		k := kinds[i%len(kinds)]
		src, err := os.ReadFile(filepath.Join("../../testdata/oxidation", k.file))
		if err != nil {
			b.Fatal(err)
		}
		name := fmt.Sprintf("cell%04d.cif", i)
		if err := os.WriteFile(filepath.Join(dir, name), src, 0o644); err != nil {
			b.Fatal(err)
		}
		fmt.Fprintf(&in, "%s,%s,born-mayer\n", k.formula, name)
	}
	b.ReportAllocs()
	for b.Loop() {
		sum, err := a.Batch(strings.NewReader(in.String()), io.Discard, BatchOptions{Dir: dir})
		if err != nil || sum.Failed > 0 {
			b.Fatalf("%+v, %v", sum, err)
		}
	}
}
