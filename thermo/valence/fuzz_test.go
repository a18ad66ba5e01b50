package valence

import (
	"math"
	"os"
	"strings"
	"testing"

	"enthalpath/thermo/cif"
)

// FuzzAssign: any CIF text the reader accepts, with or without charges,
// partly occupied or not, is assigned charges or refused with an error,
// never a panic; an assignment leaves every charge finite.
func FuzzAssign(f *testing.F) {
	for _, name := range []string{"real_Fe3O4_magnetite_sym.cif", "invented_tarnwick_NaKCl_mixed_site_P1.cif", "real_TiO2_rutile_P1.cif"} {
		b, err := os.ReadFile("../../testdata/oxidation/" + name)
		if err != nil {
			f.Fatal(err)
		}
		f.Add(string(b))
	}
	p := loadParams(f)
	cand := Candidates{"Fe": {2, 3}, "O": {-2}, "Na": {1}, "K": {1}, "Cl": {-1}, "Ti": {2, 3, 4}, "H": {1, -1}}
	f.Fuzz(func(t *testing.T, src string) {
		c, err := cif.Read(strings.NewReader(src), "f.cif", cif.Options{})
		if err != nil || len(c.Sites) > 500 {
			return
		}
		d, _, err := Assign(c, cand, p)
		if err != nil {
			return
		}
		for _, s := range d.Sites {
			if math.IsNaN(s.Charge) || math.IsInf(s.Charge, 0) {
				t.Fatalf("site %s: charge %g", s.Species, s.Charge)
			}
		}
	})
}
