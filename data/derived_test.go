package data

import (
	"strings"
	"testing"
	"testing/fstest"
)

// derived_ions.csv loads into DB.DerivedIon with its provenance; the
// values themselves are checked where they are computed (cycle/analysis/
// derivegen compares the file with a fresh run).
func TestDerivedIons(t *testing.T) {
	db := mustLoad(t)
	d, ok := db.DerivedIon("SO₄²⁻")
	if !ok || d.Ion != "SO4^2-" || !d.GasFormation.Derived || d.GasFormation.Source != FamilyFitSource ||
		!(d.GasFormation.U > 0) || d.Model == "" || len(d.Salts) == 0 || !d.InFit("Na2SO4") {
		t.Fatalf("SO4^2-: %+v %v", d, ok)
	}
	if src, err := db.Source(FamilyFitSource); err != nil || src.Citation == "" {
		t.Errorf("source %s: %v", FamilyFitSource, err)
	}
	if _, ok := db.DerivedIon("Cl-"); ok {
		t.Error("Cl- is measured, yet has a derived value")
	}
	if len(db.DerivedIons()) == 0 {
		t.Error("no derived ions")
	}
	measured, err := LoadWithoutDerived()
	if err != nil {
		t.Fatal(err)
	}
	if n := len(measured.DerivedIons()); n != 0 {
		t.Errorf("LoadWithoutDerived has %d derived ions", n)
	}
	// An overlay replaces the value it gives and keeps the rest.
	over, err := db.WithOverlay(strings.NewReader("[[derived_ion]]\nion = \"SO4^2-\"\ngas_formation_kj_per_mol = -741\nstandard_error = 9\n"), "test")
	if err != nil {
		t.Fatal(err)
	}
	o, _ := over.DerivedIon("SO4^2-")
	if o.GasFormation.V != -741 || !o.GasFormation.Override || o.GasFormation.Replaced == nil || o.Model != d.Model || len(o.Salts) != len(d.Salts) {
		t.Errorf("after the overlay: %+v", o)
	}
	if again, _ := db.DerivedIon("SO4^2-"); again.GasFormation.V != d.GasFormation.V {
		t.Error("the overlay changed the DB it was applied to")
	}
}

func TestDerivedIonsRefused(t *testing.T) {
	base := fstest.MapFS{}
	for _, name := range TableFiles() {
		if name == DerivedIonsFile {
			continue
		}
		b, err := embedded.ReadFile("tables/" + name)
		if err != nil {
			continue // optional table absent
		}
		base[name] = &fstest.MapFile{Data: b}
	}
	head := "ion,gas_formation_kj_per_mol,standard_error,model,salts,outside_2sigma,skipped,derived,note\n"
	for _, tc := range []struct{ rows, want string }{
		{"SO4^2-,-700,10,volume,Na2SO4,,,yes,\nSO4^2-,-700,10,volume,Na2SO4,,,yes,\n", "twice"},
		{"SO4^2-,-700,-1,volume,Na2SO4,,,yes,\n", "negative"},
		{"SO4^2-,,10,volume,Na2SO4,,,yes,\n", "missing"},
	} {
		fs := fstest.MapFS{}
		for k, v := range base {
			fs[k] = v
		}
		fs[DerivedIonsFile] = &fstest.MapFile{Data: []byte(head + tc.rows)}
		if _, err := LoadFS(fs); err == nil || !strings.Contains(err.Error(), tc.want) {
			t.Errorf("%q: %v, want an error naming %q", tc.rows, err, tc.want)
		}
	}
}
