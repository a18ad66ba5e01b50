package data

import (
	"errors"
	"math"
	"os"
	"path/filepath"
	"strings"
	"testing"
)

// An invented measurement for the tests: not real data.
const testOverlay = `# user data
[[source]]
key = "lab-notebook-7"
citation = "Invented test entry: notebook 7 of a fictional laboratory, page 12, 2031"

[[element]]
symbol = "Na"
atomization_kj_per_mol = 108.0
atomization_uncertainty = 0.3
source = "lab-notebook-7"

[[ionization]]
symbol = "Na"
stage = 9
energy_ev = 299.8

[[shannon]]
core = "Na"
charge = 1
cn = "VI"
ionic_radius = 1.05

[[ion]]
symbol = "Qq+"
core = "Na"
charge = 1
shape = "monatomic"
born_config = "Ne"
`

func TestOverlayAddsAndOverrides(t *testing.T) {
	base := mustLoad(t)
	db, err := base.WithOverlay(strings.NewReader(testOverlay), "test.toml")
	if err != nil {
		t.Fatal(err)
	}
	na, _ := db.Element("Na")
	if na.Atomization.V != 108.0 || !na.Atomization.Override || na.Atomization.Replaced == nil || na.Atomization.Replaced.V != 107.32 {
		t.Errorf("Na atomization after overlay: %+v", na.Atomization)
	}
	if na.Atomization.Source != "lab-notebook-7" {
		t.Errorf("source %q", na.Atomization.Source)
	}
	if len(na.Ionization) != 9 || na.Ionization[8].Source != "user" || !na.Ionization[8].Override {
		t.Errorf("added fifth IE: %+v", na.Ionization)
	}
	r, err := db.Radius("Na", 1, "VI", "")
	if err != nil || r.Ionic.V != 1.05 || !r.Ionic.Override || r.Ionic.Replaced.V != 1.02 || r.Crystal.V != 1.16 {
		t.Errorf("Na+ VI after overlay: %+v %v", r, err)
	}
	if _, err := db.Source("lab-notebook-7"); err != nil {
		t.Error(err)
	}
	// The receiver is unchanged.
	na0, _ := base.Element("Na")
	r0, _ := base.Radius("Na", 1, "VI", "")
	if na0.Atomization.V != 107.32 || na0.Atomization.Override || len(na0.Ionization) != 8 || r0.Ionic.V != 1.02 {
		t.Errorf("the built-in DB changed: %+v %+v", na0.Atomization, r0.Ionic)
	}
	if got := db.Overlays(); len(got) != 1 || got[0] != "test.toml" {
		t.Errorf("Overlays() = %v", got)
	}
}

func TestOverlayErrorsNameLineAndField(t *testing.T) {
	base := mustLoad(t)
	cases := []struct {
		name  string
		text  string
		line  int
		field string
		msg   string
	}{
		{"syntax", "[[element]]\nsymbol = \"Na\"\natomization_kj_per_mol = = 3\n", 3, "element.atomization_kj_per_mol", "expected value"},
		{"bad number", "[[element]]\nsymbol = \"Na\"\natomization_kj_per_mol = \"1o7\"\n", 3, "atomization_kj_per_mol", "not a number"},
		{"unknown field", "[[element]]\nsymbol = \"Na\"\natomisation = 107\n", 3, "atomisation", "unknown field"},
		{"unknown table", "[[elements]]\nsymbol = \"Na\"\n", 1, "elements", "unknown table"},
		{"unknown element", "\n[[ionization]]\nsymbol = \"Qx\"\nstage = 1\nenergy_ev = 5\n", 3, "symbol", "not in the element table"},
		{"unknown source", "[[element]]\nsymbol = \"K\"\natomization_kj_per_mol = 89\nsource = \"nowhere\"\n", 4, "source", "unknown source key"},
		{"second entry", "[[element]]\nsymbol = \"K\"\n\n[[element]]\nsymbol = \"Na\"\natomization_kj_per_mol = -5\n", 6, "atomization_kj_per_mol", "negative"},
		{"gap in stages", "[[ionization]]\nsymbol = \"Na\"\nstage = 11\nenergy_ev = 300\n", 3, "stage", "in order"},
		{"compound with missing ion", "[[compound]]\nformula = \"NaQ\"\n", 2, "formula", "unknown element"},
	}
	for _, c := range cases {
		_, err := base.WithOverlay(strings.NewReader(c.text), "user.toml")
		var te *TableError
		if !errors.As(err, &te) {
			t.Errorf("%s: want *TableError, got %v", c.name, err)
			continue
		}
		if te.File != "user.toml" || te.Line != c.line || te.Field != c.field || !strings.Contains(te.Error(), c.msg) {
			t.Errorf("%s: %v (line %d field %q); want line %d field %q containing %q", c.name, err, te.Line, te.Field, c.line, c.field, c.msg)
		}
	}
	// The built-in data stay usable.
	if _, err := base.Element("Na"); err != nil {
		t.Fatal(err)
	}
}

func TestLoadWithUserFile(t *testing.T) {
	dir := t.TempDir()
	good := filepath.Join(dir, "data.toml")
	if err := os.WriteFile(good, []byte(testOverlay), 0o600); err != nil {
		t.Fatal(err)
	}
	db, err := LoadWithUserFile(good)
	if err != nil {
		t.Fatal(err)
	}
	if na, _ := db.Element("Na"); na.Atomization.V != 108 {
		t.Errorf("overlay not applied: %+v", na.Atomization)
	}
	bad := filepath.Join(dir, "bad.toml")
	os.WriteFile(bad, []byte("[[element]]\nsymbol = 3 = 4\n"), 0o600)
	db, err = LoadWithUserFile(bad)
	if err == nil || db == nil {
		t.Fatalf("malformed overlay: db %v err %v; want the built-in DB and an error", db, err)
	}
	if na, _ := db.Element("Na"); na.Atomization.V != 107.32 {
		t.Errorf("built-in DB not returned: %+v", na.Atomization)
	}
	if _, err := LoadWithUserFile(filepath.Join(dir, "absent.toml")); err == nil {
		t.Error("missing overlay file: no error")
	}
	p, err := DefaultOverlayPath()
	if err == nil && !strings.HasSuffix(p, filepath.Join("enthalpath", "data.toml")) {
		t.Errorf("DefaultOverlayPath() = %q", p)
	}
}

func TestOverlayCompound(t *testing.T) {
	db, err := mustLoad(t).WithOverlay(strings.NewReader(`
[[compound]]
formula = "NaCl"
formation_kj_per_mol = -411.0
formation_uncertainty = 0.5
memory = true

[[compound]]
formula = "KBr2"
name = "invented test compound"
cation = "K+"
cation_count = 1
anion = "Br-"
anion_count = 2
`), "c.toml")
	if err != nil {
		t.Fatal(err)
	}
	c, err := db.Compound("NaCl")
	if err != nil || c.Formation.V != -411 || !c.Formation.Override || !c.Formation.Memory || c.Formation.Source != "user" {
		t.Errorf("NaCl after overlay: %+v %v", c.Formation, err)
	}
	if c.Structure == "" && mustLoad(t).compounds[mustLoad(t).compoundIdx["NaCl"]].Structure != "" {
		t.Error("overlay erased fields it did not give")
	}
	if _, err := db.Compound("Br2K"); err != nil {
		t.Errorf("added compound not found by composition: %v", err)
	}
}

func TestCompoundLookupForms(t *testing.T) {
	db := mustLoad(t)
	if _, err := db.Compound("NaCl"); err != nil {
		t.Skip("no NaCl row yet")
	}
	for _, in := range []string{"NaCl", " NaCl ", "ClNa", "Na Cl", "nacl"} {
		c, err := db.Compound(in)
		if err != nil || c.Formula != "NaCl" {
			t.Errorf("Compound(%q) = %q, %v", in, c.Formula, err)
		}
	}
	_, err := db.Compound("NaQ")
	var nf *NotFoundError
	if !errors.As(err, &nf) || nf.Kind != "compound" {
		t.Errorf("Compound(NaQ): %v", err)
	}
	list := db.Compounds()
	list2 := db.Compounds()
	for i := range list {
		if list[i].Formula != list2[i].Formula {
			t.Fatal("Compounds() order is not stable")
		}
	}
}

func TestOverlayAtomicWeight(t *testing.T) {
	db := mustLoad(t)
	// Invented value for the test, not real data.
	next, err := db.WithOverlay(strings.NewReader("[[atomic_weight]]\nsymbol = \"Na\"\natomic_weight = 23.5\n"), "weights.toml")
	if err != nil {
		t.Fatal(err)
	}
	na, err := next.Element("Na")
	if err != nil {
		t.Fatal(err)
	}
	if !na.AtomicMass.Override || na.AtomicMass.Source != "user" || math.Abs(na.AtomicMass.V-23.5) > 1e-12 {
		t.Errorf("overlaid Na weight: %+v", na.AtomicMass)
	}
	// 22.98976928: CIAAW standard atomic weight of Na (Meija et al. 2016), as
	// vendored in data/sources/atomic-weights/ase_data_init.py (line 96).
	if na.AtomicMass.Replaced == nil || math.Abs(na.AtomicMass.Replaced.V-22.98976928) > 1e-9 {
		t.Errorf("overlaid Na weight should keep the built-in 22.98976928 (CIAAW) in Replaced: %+v", na.AtomicMass.Replaced)
	}
	if _, err := db.WithOverlay(strings.NewReader("[[atomic_weight]]\nsymbol = \"Na\"\natomic_weight = -1\n"), "bad.toml"); err == nil {
		t.Error("a negative atomic weight was accepted")
	}
}
