package data

// Loading from other file systems, lookup errors and the forms lookups accept.

import (
	"errors"
	"math"
	"strings"
	"testing"
	"testing/fstest"
)

func TestLoadFSErrorsNameFileLineField(t *testing.T) {
	base := fstest.MapFS{}
	for _, name := range TableFiles() {
		b, err := embedded.ReadFile("tables/" + name)
		if err != nil {
			continue
		}
		base[name] = &fstest.MapFile{Data: b}
	}
	if _, err := LoadFS(base); err != nil {
		t.Fatalf("LoadFS of the embedded tables: %v", err)
	}
	broken := fstest.MapFS{}
	for k, v := range base {
		broken[k] = v
	}
	broken["elements.csv"] = &fstest.MapFile{Data: []byte("symbol,z,name,standard_state,atomization_kj_per_mol,atomization_uncertainty,source,memory,note\nH,1,hydrogen,H2(g),21x7,,codata1989,,\n")}
	_, err := LoadFS(broken)
	var te *TableError
	if !errors.As(err, &te) || te.File != "elements.csv" || te.Line != 2 || te.Field != "atomization_kj_per_mol" {
		t.Fatalf("want TableError at elements.csv line 2 field atomization_kj_per_mol, got %v", err)
	}
	delete(broken, "elements.csv")
	if _, err := LoadFS(broken); err == nil {
		t.Fatal("LoadFS without elements.csv succeeded")
	}
}

func TestLookupErrorsSuggest(t *testing.T) {
	db := mustLoad(t)
	cases := []struct {
		kind string
		err  error
		want string
	}{
		{"element", func() error { _, err := db.Element("Nq"); return err }(), "Na"},
		{"element", func() error { _, err := db.Element("Clx"); return err }(), "Cl"},
		{"ion", func() error { _, err := db.Ion("Fe5+"); return err }(), "Fe3+"},
		{"ion", func() error { _, err := db.IonByCharge("Na", 2); return err }(), "Na+"},
		{"source", func() error { _, err := db.Source("nbs1983"); return err }(), "nbs1982"},
		{"radius", func() error { _, err := db.Radius("Na", 2, "VI", ""); return err }(), "Na+"},
	}
	for _, c := range cases {
		var nf *NotFoundError
		if !errors.As(c.err, &nf) {
			t.Errorf("%s: want *NotFoundError, got %v", c.kind, c.err)
			continue
		}
		if nf.Kind != c.kind || !contains(nf.Suggestions, c.want) {
			t.Errorf("%s: %v: want suggestion %q", c.kind, nf, c.want)
		}
	}
}

func TestIonSymbolForms(t *testing.T) {
	db := mustLoad(t)
	cases := map[string]string{
		"Na+": "Na+", "Ca2+": "Ca2+", "Ca+2": "Ca2+", "Ca++": "Ca2+", "O2-": "O2-", "O²⁻": "O2-",
		"Cl^-": "Cl-", " Fe3+ ": "Fe3+", "Fe^3+": "Fe3+",
	}
	for in, want := range cases {
		ion, err := db.Ion(in)
		if err != nil || ion.Symbol != want {
			t.Errorf("Ion(%q) = %q, %v; want %q", in, ion.Symbol, err, want)
		}
	}
	// Polyatomic forms, when the other table rows are present.
	if _, err := db.Ion("SO4^2-"); err == nil {
		for _, in := range []string{"SO4 2-", "SO42-", "SO4^2-", "SO₄²⁻"} {
			if ion, err := db.Ion(in); err != nil || ion.Symbol != "SO4^2-" {
				t.Errorf("Ion(%q) = %q, %v; want SO4^2-", in, ion.Symbol, err)
			}
		}
	}
	if ion, err := db.IonByCharge("Fe", 2); err != nil || ion.Symbol != "Fe2+" {
		t.Errorf("IonByCharge(Fe, 2) = %q, %v", ion.Symbol, err)
	}
}

// Radius fallback rules (see DB.Radius). Radii from Shannon 1976 Table 1
// (from memory).
func TestRadiusMatching(t *testing.T) {
	db := mustLoad(t)
	cases := []struct {
		core        string
		charge      int
		cn, spin    string
		wantCN      string
		wantSpin    string
		ionic       float64
		substituted bool
	}{
		{"Na", 1, "VI", "", "VI", "", 1.02, false},
		{"Na", 1, "6", "", "VI", "", 1.02, false},
		{"Na", 1, "", "", "VI", "", 1.02, false},
		{"Cs", 1, "VII", "", "VI", "", 1.67, true}, // VI and VIII equally near: the lower
		{"Cl", -1, "8", "", "VI", "", 1.81, true},
		{"Fe", 2, "VI", "LS", "VI", "LS", 0.61, false},
		{"Fe", 2, "VI", "HS", "VI", "HS", 0.78, false},
		{"Fe", 2, "VI", "", "VI", "HS", 0.78, true}, // spin not given: high spin
		{"Ni", 2, "IVSQ", "", "IVSQ", "", 0.49, false},
		{"Ni", 2, "4", "", "IV", "", 0.55, false},
		{"Mn", 2, "VIII", "HS", "VIII", "", 0.96, false}, // spin-less row matches any spin
	}
	for _, c := range cases {
		r, err := db.Radius(c.core, c.charge, c.cn, c.spin)
		if err != nil {
			t.Errorf("Radius(%s, %d, %q, %q): %v", c.core, c.charge, c.cn, c.spin, err)
			continue
		}
		if r.CN != c.wantCN || r.Spin != c.wantSpin || !near(r.Ionic.V, c.ionic, 1e-9) || (r.Substituted != "") != c.substituted {
			t.Errorf("Radius(%s, %d, %q, %q) = %s %s %g (%q)", c.core, c.charge, c.cn, c.spin, r.CN, r.Spin, r.Ionic.V, r.Substituted)
		}
	}
	if _, err := db.Radius("Na", 1, "XX", ""); err == nil {
		t.Error("CN XX accepted")
	}
	if _, err := db.Radius("Cr", 3, "VI", "LS"); err != nil {
		t.Errorf("Cr3+ VI LS should match the spin-less row: %v", err)
	}
}

// Returned records do not let a caller change the DB: Element and Ions
// return copies; Ion shares capped slices, so appending copies.
func TestLookupsReturnCopies(t *testing.T) {
	db := mustLoad(t)
	els := db.Elements()
	els[10].Ionization[0].V = 0 // Na
	ions := db.Ions()
	ions[1].Radii[0].Ionic.V = 0
	ion, _ := db.Ion("Na+")
	n := len(ion.Radii)
	_ = append(ion.Radii, ShannonRadius{CN: "XIV"})
	e2, _ := db.Element("Na")
	ion2, _ := db.Ion("Na+")
	all := db.Ions()
	if e2.Ionization[0].V == 0 || all[1].Radii[0].Ionic.V == 0 || db.Elements()[10].Symbol != "Na" {
		t.Fatal("a lookup result shares memory with the DB")
	}
	if len(ion2.Radii) != n || cap(ion2.Radii) != n {
		t.Fatal("appending to a returned slice reached the DB")
	}
}

// LoadFS works without the optional tables (compounds.csv, ion_values.csv,
// and solution_enthalpies.csv, whose rows name compounds).
func TestLoadFSWithoutOptionalTables(t *testing.T) {
	fsys := fstest.MapFS{}
	for _, name := range TableFiles() {
		if name == "compounds.csv" || name == "ion_values.csv" || name == "solution_enthalpies.csv" {
			continue
		}
		b, err := embedded.ReadFile("tables/" + name)
		if err != nil {
			t.Fatal(err)
		}
		fsys[name] = &fstest.MapFile{Data: b}
	}
	db, err := LoadFS(fsys)
	if err != nil {
		t.Fatal(err)
	}
	if len(db.Compounds()) != 0 {
		t.Errorf("%d compounds without compounds.csv", len(db.Compounds()))
	}
	if _, err := db.Compound("NaCl"); err == nil {
		t.Error("NaCl found without compounds.csv")
	}
}

// Every element but Tc (no stable isotope, so no standard atomic weight)
// carries a standard atomic weight, and the weights grow with Z except at
// the known inversions Ar/K, Co/Ni and Te/I (a property of the periodic
// table, no source needed).
func TestAtomicWeights(t *testing.T) {
	db := mustLoad(t)
	inversions := map[string]bool{"K": true, "Ni": true, "I": true}
	prev := Element{}
	for _, e := range db.Elements() {
		if e.Symbol == "Tc" {
			if e.AtomicMass.Known() {
				t.Errorf("Tc has an atomic weight %g; it has no standard atomic weight", e.AtomicMass.V)
			}
			continue
		}
		if !e.AtomicMass.Known() {
			t.Errorf("%s: no atomic weight", e.Symbol)
			continue
		}
		if e.AtomicMass.Unit != "g/mol" {
			t.Errorf("%s: atomic weight unit %q, want g/mol", e.Symbol, e.AtomicMass.Unit)
		}
		if prev.AtomicMass.Known() && e.AtomicMass.V <= prev.AtomicMass.V && !inversions[e.Symbol] {
			t.Errorf("%s (%g) is not heavier than %s (%g)", e.Symbol, e.AtomicMass.V, prev.Symbol, prev.AtomicMass.V)
		}
		prev = e
	}
}

// The tabulated enthalpies of solution load and are found by any spelling
// of the formula the compound lookup accepts. NaCl: +3.88 kJ/mol (NBS 1982
// aqueous and crystal values, as solution_enthalpies.csv derives it; CRC
// "Enthalpy of solution of electrolytes" 3.88, from memory).
func TestSolutionEnthalpy(t *testing.T) {
	db := mustLoad(t)
	for _, q := range []string{"NaCl", "ClNa", "nacl"} {
		v, err := db.SolutionEnthalpy(q)
		if err != nil {
			t.Fatalf("SolutionEnthalpy(%q): %v", q, err)
		}
		if math.Abs(v.V-3.88) > 0.05 || v.Unit != "kJ/mol" || v.Source == "" {
			t.Errorf("SolutionEnthalpy(%q) = %+v, want 3.88 kJ/mol with a source", q, v)
		}
	}
	var nf *NotFoundError
	if _, err := db.SolutionEnthalpy("MgO"); !errors.As(err, &nf) {
		t.Errorf("MgO (no row): err = %v, want a NotFoundError", err)
	}
	if _, err := db.SolutionEnthalpy("Xx2Q"); !errors.As(err, &nf) {
		t.Errorf("unknown formula: err = %v, want a NotFoundError", err)
	}
	over, err := db.WithOverlay(strings.NewReader("[[solution_enthalpy]]\nformula = \"NaCl\"\nsolution_kj_per_mol = 4.0\n"), "mine.toml")
	if err != nil {
		t.Fatal(err)
	}
	v, err := over.SolutionEnthalpy("NaCl")
	if err != nil || v.V != 4.0 || !v.Override || v.Replaced == nil {
		t.Errorf("overlay: %+v, %v; want 4.0 marked as an override of the built-in value", v, err)
	}
	if v, _ := db.SolutionEnthalpy("NaCl"); v.Override {
		t.Error("the overlay changed the built-in DB")
	}
}
