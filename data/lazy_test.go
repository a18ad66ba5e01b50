package data

import (
	"fmt"
	"io/fs"
	"reflect"
	"strings"
	"testing"
)

// embeddedRecords reads an embedded table through encoding/csv (readCSV),
// the reference path the lazily read tables are compared with.
func embeddedRecords(t *testing.T, file string) []record {
	t.Helper()
	f, err := embedded.Open("tables/" + file)
	if err != nil {
		t.Fatal(err)
	}
	defer f.Close()
	recs, err := readCSV(file, f, tableColumns[file])
	if err != nil {
		t.Fatal(err)
	}
	return recs
}

// speciesEagerly reads species.csv and the species rows of alternatives.csv
// from the embedded tables in table order, as Load did before it left them
// for the first use: the reference the lazily read table must equal.
func speciesEagerly(t *testing.T, db *DB) (map[string]Species, []string) {
	t.Helper()
	tmp := &DB{sourceIdx: db.sourceIdx, species: &speciesTable{m: map[string]Species{}}}
	b := &builder{db: tmp}
	for _, file := range []string{"species.csv", "alternatives.csv"} {
		for _, r := range embeddedRecords(t, file) {
			if file == "alternatives.csv" && r.str("kind") != "species_formation" {
				continue
			}
			if err := b.apply(file, r); err != nil {
				tmp.problems = append(tmp.problems, err.Error())
			}
		}
	}
	return tmp.species.m, tmp.problems
}

// The species table, read on first use with its rows of alternatives.csv,
// holds the same species, values and alternatives as reading both files
// eagerly (the reference is the embedded CSV text itself, read by the
// encoding/csv path).
func TestLazySpeciesEqualEager(t *testing.T) {
	db := mustLoad(t)
	if !db.species.deferred() {
		t.Fatal("Load read species.csv already: nothing lazy to compare")
	}
	eager, problems := speciesEagerly(t, db)
	lazy := db.speciesMap()
	if len(eager) < 1000 || len(lazy) != len(eager) {
		t.Fatalf("lazy %d species, eager %d (species.csv has over 1000 rows)", len(lazy), len(eager))
	}
	alts := 0
	for k, want := range eager {
		if got := lazy[k]; !reflect.DeepEqual(got, want) {
			t.Errorf("%s: lazy %+v\neager %+v", k, got, want)
		}
		alts += len(want.Alternatives)
	}
	if alts == 0 {
		t.Error("no species alternatives in the eager read: the comparison checks nothing of alternatives.csv")
	}
	if !reflect.DeepEqual(db.species.problems, problems) {
		t.Errorf("problems: lazy %q, eager %q", db.species.problems, problems)
	}
}

// An overlay applied before the species were first asked for adds its
// species alternative beside the built-in ones (CO2(g): NASA Glenn and
// ATcT rows of alternatives.csv), and its species replace the built-in
// value; the base DB keeps its own.
func TestOverlayOnLazySpecies(t *testing.T) {
	db := mustLoad(t)
	if !db.species.deferred() {
		t.Fatal("Load read species.csv already: the overlay would not meet a lazy table")
	}
	over, err := db.WithOverlay(strings.NewReader(`[[alternative]]
kind = "species_formation"
key = "CO2(g)"
value = -393.0
source = "user"

[[species]]
formula = "H2O(l)"
formation_kj_per_mol = -285.0
`), "lazy.toml")
	if err != nil {
		t.Fatal(err)
	}
	base, _ := db.Species("CO2(g)")
	co2, _ := over.Species("CO2(g)")
	if len(co2.Alternatives) != len(base.Alternatives)+1 || len(base.Alternatives) == 0 {
		t.Fatalf("CO2(g) alternatives: overlay %d, base %d; want base+1 and base > 0", len(co2.Alternatives), len(base.Alternatives))
	}
	if last := co2.Alternatives[len(co2.Alternatives)-1]; last.V != -393.0 || !last.Override {
		t.Errorf("overlay alternative = %+v", last)
	}
	// H2O(l): ΔfH° −285.830 kJ/mol, NBS 1982 (data/sources/nbs-tables-1982) line 46.
	if w, _ := over.Species("H2O(l)"); w.Formation.V != -285.0 || !w.Formation.Override || w.Formation.Replaced == nil || w.Formation.Replaced.V != -285.830 {
		t.Errorf("overlay H2O(l) = %+v", w.Formation)
	}
	if w, _ := db.Species("H2O(l)"); w.Formation.V != -285.830 {
		t.Errorf("base H2O(l) changed to %v", w.Formation.V)
	}
}

// The lookups by another spelling, whose indexes are built on first use,
// find what the tables write: each compound by its lower-case formula,
// each element by its lower-case symbol and upper-case name, Fe³⁺ in
// three spellings.
func TestFoldIndexesOnFirstUse(t *testing.T) {
	db := mustLoad(t)
	for _, c := range db.compounds {
		if got, ok := db.FindCompound(strings.ToLower(c.Formula)); !ok || got.Formula != db.compounds[db.folds().compounds[strings.ToLower(c.Formula)]].Formula {
			t.Errorf("compound %q by %q: %v %v", c.Formula, strings.ToLower(c.Formula), got.Formula, ok)
		}
	}
	for _, e := range db.elements {
		for _, q := range []string{strings.ToLower(e.Symbol), strings.ToUpper(e.Name)} {
			if q == "" {
				continue
			}
			if got, err := db.Element(q); err != nil || got.Symbol != e.Symbol {
				t.Errorf("element %s by %q: %v %v", e.Symbol, q, got.Symbol, err)
			}
		}
	}
	for _, q := range []string{"Fe+3", "Fe^3+", "Fe 3+"} {
		if ion, ok := db.FindIon(q); !ok || ion.Core != "Fe" || ion.Charge != 3 {
			t.Errorf("FindIon(%q) = %s %d %v", q, ion.Core, ion.Charge, ok)
		}
	}
}

// The tables embedded as strings for Load are the embedded files.
func TestEmbeddedTextsAreTheFiles(t *testing.T) {
	tables, err := newEmbeddedTables(embedded)
	if err != nil {
		t.Fatal(err)
	}
	n := 0
	for _, file := range TableFiles() {
		s, ok := tables.text(file)
		if !ok {
			continue
		}
		raw, err := fs.ReadFile(tables.FS, file)
		if err != nil || string(raw) != s {
			t.Errorf("%s: the string differs from the embedded file (%v)", file, err)
		}
		n++
	}
	if n == 0 {
		t.Error("no table is embedded as a string")
	}
}

// The enthalpies of solution, read on first use, are those of reading
// solution_enthalpies.csv eagerly through encoding/csv into a fresh table;
// an overlay applied before the first use replaces a built-in value and
// adds a row, and the base DB keeps its own.
func TestLazySolutionsEqualEager(t *testing.T) {
	db := mustLoad(t)
	if db.solutions.m != nil {
		t.Fatal("Load read solution_enthalpies.csv already: nothing lazy to compare")
	}
	recs := embeddedRecords(t, "solution_enthalpies.csv")
	eager := &DB{sourceIdx: db.sourceIdx, compoundIdx: db.compoundIdx, solutions: &solutionTable{m: map[string]Value{}}}
	b := &builder{db: eager}
	for _, r := range recs {
		if err := b.apply("solution_enthalpies.csv", r); err != nil {
			t.Errorf("eager read: %v", err)
		}
	}
	lazy := db.solutionMap()
	if len(eager.solutions.m) < 300 || !reflect.DeepEqual(lazy, eager.solutions.m) {
		t.Errorf("lazy %d enthalpies of solution, eager %d (the table has over 300 rows), or their values differ", len(lazy), len(eager.solutions.m))
	}
	if len(db.solutions.problems) != 0 || len(eager.problems) != 0 {
		t.Errorf("problems: lazy %q, eager %q", db.solutions.problems, eager.problems)
	}
}

func TestOverlayOnLazySolutions(t *testing.T) {
	db := mustLoad(t)
	if db.solutions.m != nil {
		t.Fatal("Load read solution_enthalpies.csv already: the overlay would not meet a lazy table")
	}
	base := eagerSolution(t, "NaCl")
	over, err := db.WithOverlay(strings.NewReader("[[solution_enthalpy]]\nformula = \"NaCl\"\nsolution_kj_per_mol = 4.0\n"), "sol.toml")
	if err != nil {
		t.Fatal(err)
	}
	v, err := over.SolutionEnthalpy("NaCl")
	if err != nil || v.V != 4.0 || !v.Override || v.Replaced == nil || v.Replaced.V != base {
		t.Errorf("overlay NaCl ΔsolH° = %+v, %v; want 4.0 replacing %v", v, err, base)
	}
	if v, err := db.SolutionEnthalpy("NaCl"); err != nil || v.V != base {
		t.Errorf("base NaCl ΔsolH° = %v, %v; want %v", v.V, err, base)
	}
}

// eagerSolution reads formula's enthalpy of solution straight from the
// embedded CSV text.
func eagerSolution(t *testing.T, formula string) float64 {
	t.Helper()
	for _, r := range embeddedRecords(t, "solution_enthalpies.csv") {
		if r.str("formula") == formula {
			v, _, err := r.float("solution_kj_per_mol")
			if err != nil {
				t.Fatal(err)
			}
			return v
		}
	}
	t.Fatalf("%s not in solution_enthalpies.csv", formula)
	return 0
}

// The tables and indexes read on first use may be first asked for from
// several goroutines at once (SSH sessions share one DB): each is built
// once (run with -race). NaCl's ΔsolH° is compared with the embedded row.
func TestLazyConcurrentFirstUse(t *testing.T) {
	db := mustLoad(t)
	want := eagerSolution(t, "NaCl")
	done := make(chan string)
	for range 8 {
		go func() {
			if v, err := db.SolutionEnthalpy("nacl"); err != nil || v.V != want {
				done <- fmt.Sprintf("NaCl ΔsolH° = %v, %v; want %v", v.V, err, want)
				return
			}
			if e, err := db.Element("SODIUM"); err != nil || e.Symbol != "Na" {
				done <- "element SODIUM not found"
				return
			}
			done <- ""
		}()
	}
	for range 8 {
		if msg := <-done; msg != "" {
			t.Error(msg)
		}
	}
}
