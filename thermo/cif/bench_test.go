package cif_test

import (
	"fmt"
	"path/filepath"
	"strings"
	"testing"

	"enthalpath/thermo/cif"
)

func BenchmarkParseRutile(b *testing.B) {
	src := readFileB(b, filepath.Join(cifDir, "real_TiO2_rutile.cif"))
	b.ReportAllocs()
	for i := 0; i < b.N; i++ {
		if _, err := cif.Parse(strings.NewReader(src), "rutile.cif", cif.Options{}); err != nil {
			b.Fatal(err)
		}
	}
}

// BenchmarkParseRockSalt192 reads the file with all 192 operations of
// Fm-3m (384 images merged to 8 sites).
func BenchmarkParseRockSalt192(b *testing.B) {
	src := readFileB(b, filepath.Join(cifDir, "real_NaCl_rocksalt_Fm-3m.cif"))
	opt := cif.Options{Charges: map[string]float64{"Na": 1, "Cl": -1}}
	b.ReportAllocs()
	for i := 0; i < b.N; i++ {
		if _, err := cif.Parse(strings.NewReader(src), "nacl.cif", opt); err != nil {
			b.Fatal(err)
		}
	}
}

// BenchmarkParseLargeExpansion puts 40 ion pairs on general positions of
// Fm-3m: 80 × 192 = 15360 sites, all distinct.
func BenchmarkParseLargeExpansion(b *testing.B) {
	src := readFileB(b, filepath.Join(cifDir, "real_NaCl_rocksalt_Fm-3m.cif"))
	cut := strings.Index(src, "loop_\n_atom_site_label")
	var sb strings.Builder
	sb.WriteString(strings.Replace(src[:cut], "_cell_formula_units_Z             4\n", "", 1))
	sb.WriteString("loop_\n_atom_site_label\n_atom_site_type_symbol\n_atom_site_fract_x\n_atom_site_fract_y\n_atom_site_fract_z\n")
	for k := 0; k < 40; k++ {
		// Points inside the asymmetric unit 0 < z < y < x < 1/4, spread so
		// that no two images coincide.
		x := 0.02 + 0.2*float64(k)/40
		fmt.Fprintf(&sb, "Na%d Na+ %.4f %.4f %.4f\n", k, x+0.011, x*0.61+0.003, x*0.27+0.001)
		fmt.Fprintf(&sb, "Cl%d Cl- %.4f %.4f %.4f\n", k, x+0.013, x*0.43+0.002, x*0.19+0.0005)
	}
	in := sb.String()
	c, err := cif.Parse(strings.NewReader(in), "big.cif", cif.Options{})
	if err != nil {
		b.Fatal(err)
	}
	b.ReportMetric(float64(len(c.Sites)), "sites")
	b.ReportAllocs()
	b.ResetTimer()
	for i := 0; i < b.N; i++ {
		if _, err := cif.Parse(strings.NewReader(in), "big.cif", cif.Options{}); err != nil {
			b.Fatal(err)
		}
	}
}

func readFileB(b *testing.B, path string) string {
	b.Helper()
	return mustRead(b, path)
}

// BenchmarkRefuseMillionSites: a file of 10⁶ atom-site rows (34 MB, read
// from a reader: files on disk are capped at MaxFileSize before this) is
// refused at row 50,001 while tokenising; -benchmem shows the memory taken
// beyond the input itself.
func BenchmarkRefuseMillionSites(b *testing.B) {
	var sb strings.Builder
	sb.WriteString("data_x\n_cell_length_a 400\n_cell_length_b 400\n_cell_length_c 400\n_cell_angle_alpha 90\n_cell_angle_beta 90\n_cell_angle_gamma 90\n")
	sb.WriteString("loop_\n_atom_site_label\n_atom_site_fract_x\n_atom_site_fract_y\n_atom_site_fract_z\n")
	for i := 0; i < 1000000; i++ {
		fmt.Fprintf(&sb, "Na%d 0.%06d 0.5 0.5\n", i, i)
	}
	src := sb.String()
	b.ReportAllocs()
	b.ResetTimer()
	for b.Loop() {
		if _, err := cif.Read(strings.NewReader(src), "million.cif", cif.Options{}); err == nil {
			b.Fatal("a 10⁶-site file was accepted")
		}
	}
}
