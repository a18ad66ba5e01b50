package data

import (
	"errors"
	"slices"
	"strings"
	"testing"

	"enthalpath/thermo/notation"
)

// FindIon finds what Ion finds and reports a miss without an error. Mg+
// is not a row of ions.csv (the table lists Mg2+ only).
func TestFindIonAgreesWithIon(t *testing.T) {
	db := mustLoad(t)
	for _, in := range []string{"Na+", " Fe3+ ", "Ca+2", "O²⁻", "SO4 2-", "Mg+", "Qq+", ""} {
		got, ok := db.FindIon(in)
		want, err := db.Ion(in)
		if ok != (err == nil) || got.Symbol != want.Symbol || len(got.Radii) != len(want.Radii) {
			t.Errorf("FindIon(%q) = %q, %v; Ion gives %q, %v", in, got.Symbol, ok, want.Symbol, err)
		}
	}
	if _, ok := db.FindIon("Mg+"); ok {
		t.Error("FindIon(Mg+) found an ion the table does not list")
	}
	var nf *NotFoundError
	if _, err := db.Ion("Mg+"); !errors.As(err, &nf) || len(nf.Suggestions) == 0 {
		t.Errorf("Ion(Mg+) lost its suggestions: %v", err)
	}
}

// CompoundsIn is Compounds filtered by family, in table order, as copies.
// compounds.csv holds 20 alkali halides (Li–Cs with F, Cl, Br, I).
func TestCompoundsIn(t *testing.T) {
	db := mustLoad(t)
	got := slices.Collect(db.CompoundsIn("alkali halide", "alkaline-earth halide"))
	var want []string
	for _, c := range db.Compounds() {
		if c.Family == "alkali halide" || c.Family == "alkaline-earth halide" {
			want = append(want, c.Formula)
		}
	}
	var names []string
	for _, c := range got {
		names = append(names, c.Formula)
	}
	if !slices.Equal(names, want) || len(slices.Collect(db.CompoundsIn("alkali halide"))) != 20 || !slices.Contains(names, "NaCl") {
		t.Fatalf("CompoundsIn = %v, want %v (20 alkali halides)", names, want)
	}
	if len(slices.Collect(db.CompoundsIn())) != 0 || len(slices.Collect(db.CompoundsIn("no such family"))) != 0 {
		t.Error("CompoundsIn without a matching family returned compounds")
	}
	for _, c := range got {
		if c.Params != nil {
			c.Params["a"] = -1
		}
	}
	if c, _ := db.Compound("NaCl"); c.Params["a"] == -1 {
		t.Error("CompoundsIn shares its Params maps with the DB")
	}
	n := 0
	for range db.CompoundsIn("alkali halide") {
		if n++; n == 3 {
			break // stopping early must not panic
		}
	}
}

// Species of the NBS tables (data/sources/nbs-tables-1982): CO2(g) line
// 1675 (ΔfH° −393.509, ΔfG° −394.359 kJ/mol, S° 213.74 J/(mol·K)) and
// H2O(l) line 46 (ΔfH° −285.830 kJ/mol); read on first use, also after an overlay.
func TestSpecies(t *testing.T) {
	db := mustLoad(t)
	co2, ok := db.Species("CO2(g)")
	if !ok || co2.Formation.V != -393.509 || co2.GibbsFormation.V != -394.359 || co2.Entropy.V != 213.74 || co2.Formation.Source != "nbs1982" {
		t.Errorf("CO2(g) = %+v, %v", co2, ok)
	}
	if !strings.HasPrefix(co2.Formation.Locator, "nbs-tables-1982/") {
		t.Errorf("CO2(g) locator %q", co2.Formation.Locator)
	}
	if len(co2.Alternatives) == 0 {
		t.Error("CO2(g): no other compilation's value (NASA Glenn and ATcT both list it)")
	}
	if w, ok := db.Species("H2O (l)"); !ok || w.Formation.V != -285.830 {
		t.Errorf("H2O(l) = %+v, %v", w, ok)
	}
	if _, ok := db.Species("Na(s)"); !ok {
		t.Error("Na(s): the standard state of sodium is missing")
	}
	over, err := db.WithOverlay(strings.NewReader("[[species]]\nformula = \"XeF2(g)\"\nformation_kj_per_mol = -100\n"), "t.toml")
	if err != nil {
		t.Fatal(err)
	}
	if x, ok := over.Species("XeF2(g)"); !ok || x.Formation.V != -100 || !x.Formation.Override {
		t.Errorf("overlay species: %+v %v", x, ok)
	}
	if _, ok := over.Species("CO2(g)"); !ok {
		t.Error("overlay lost the built-in species")
	}
}

// Species may be asked for from several goroutines at once (SSH sessions
// share one DB); species.csv is then read exactly once (run with -race).
func TestSpeciesConcurrentFirstUse(t *testing.T) {
	db := mustLoad(t)
	done := make(chan bool)
	for range 8 {
		go func() {
			sp, ok := db.Species("O2(g)")
			done <- ok && sp.Formation.V == 0
		}()
	}
	for range 8 {
		if !<-done {
			t.Error("O2(g) not found, or ΔfH° not 0 (its own standard state, NBS 1982)")
		}
	}
}

// Every built-in ion's core is a formula the one reader accepts: Load skips
// the check for the built-in tables (an overlay's ions are still checked).
func TestIonCoresParse(t *testing.T) {
	db := mustLoad(t)
	for _, ion := range db.Ions() {
		if _, err := notation.ParseFormula(ion.Core); err != nil {
			t.Errorf("ion %s: core %q: %v", ion.Symbol, ion.Core, err)
		}
	}
}
