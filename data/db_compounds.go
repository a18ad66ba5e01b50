package data

// Lookups of substances: compounds, enthalpies of solution, species, and
// the composition keys built on first use.

import (
	"io/fs"
	"iter"
	"maps"
	"slices"
	"strings"
	"sync"

	"enthalpath/thermo/notation"
)

// Compound returns the compound with this formula: first an exact match of
// the formula as tabulated, then a case-insensitive one, then any compound
// with the same composition ("ClNa", "Na Cl", "F2Ca" find NaCl and CaF2;
// the first tabulated compound wins when polymorphs share a composition).
func (db *DB) Compound(formula string) (Compound, error) {
	if c, ok := db.FindCompound(formula); ok {
		return c, nil
	}
	return Compound{}, &NotFoundError{Kind: "compound", Query: formula, Suggestions: db.SuggestCompounds(formula)}
}

// FindCompound is Compound without the error: it reports whether the
// tables hold the formula and skips building suggestions, so a miss costs
// no more than a hit (batch screening looks up thousands of formulas the
// tables do not hold).
func (db *DB) FindCompound(formula string) (Compound, bool) {
	s := strings.TrimSpace(formula)
	if i, ok := db.compoundIdx[s]; ok {
		return copyCompound(db.compounds[i]), true
	}
	if i, ok := db.folds().compounds[strings.ToLower(s)]; ok {
		return copyCompound(db.compounds[i]), true
	}
	if f, err := notation.ParseFormula(s); err == nil {
		if i, ok := db.compositions().byKey[f.Hill()]; ok {
			return copyCompound(db.compounds[i]), true
		}
	}
	return Compound{}, false
}

// SolutionEnthalpy returns the standard enthalpy of solution at infinite
// dilution (kJ/mol of the compound, positive when dissolving absorbs heat)
// of a tabulated compound, from solution_enthalpies.csv or the overlay.
func (db *DB) SolutionEnthalpy(formula string) (Value, error) {
	c, ok := db.FindCompound(formula)
	if !ok {
		return Value{}, &NotFoundError{Kind: "compound", Query: formula, Suggestions: db.SuggestCompounds(formula)}
	}
	v, ok := db.solutionMap()[c.Formula]
	if !ok {
		return Value{}, &NotFoundError{Kind: "enthalpy of solution", Query: c.Formula,
			Detail: "solution_enthalpies.csv has no row for it; add one in your data file as [[solution_enthalpy]]"}
	}
	return v, nil
}

// SuggestCompounds returns up to six tabulated formulas near q: close in
// spelling, or made of the same elements.
func (db *DB) SuggestCompounds(q string) []string {
	return db.suggestCompounds(strings.TrimSpace(q))
}

// Compounds returns every compound in table order.
func (db *DB) Compounds() []Compound {
	out := make([]Compound, len(db.compounds))
	for i, c := range db.compounds {
		out[i] = copyCompound(c)
	}
	return out
}

// CompoundsIn yields copies of the compounds of the given families
// ("alkali halide"), in table order, one at a time: the other rows are not
// copied, nor is a slice of them all made.
func (db *DB) CompoundsIn(families ...string) iter.Seq[Compound] {
	return func(yield func(Compound) bool) {
		for i := range db.compounds {
			if slices.Contains(families, db.compounds[i].Family) && !yield(copyCompound(db.compounds[i])) {
				return
			}
		}
	}
}

// Species returns a substance of the thermochemical tables by its formula
// with the state in parentheses: "CO2(g)", "O2(g)", "H2O(l)", "Cl2(g)".
// Spaces are ignored and "(s)" is read as "(cr)". Its Alternatives are
// shared with the DB: do not write to them.
func (db *DB) Species(formulaWithState string) (Species, bool) {
	key := strings.ReplaceAll(strings.TrimSpace(formulaWithState), " ", "")
	if f, st, ok := splitState(key); ok && st == "s" {
		key = f + "(cr)"
	}
	sp, ok := db.speciesMap()[key]
	if ok {
		sp.Alternatives = sp.Alternatives[:len(sp.Alternatives):len(sp.Alternatives)]
	}
	return sp, ok
}

// SpeciesList returns every species, sorted by formula.
func (db *DB) SpeciesList() []Species {
	m := db.speciesMap()
	out := make([]Species, 0, len(m))
	for _, k := range slices.Sorted(maps.Keys(m)) {
		sp := m[k]
		sp.Alternatives = slices.Clone(sp.Alternatives)
		out = append(out, sp)
	}
	return out
}

// splitState splits "CO2(g)" into "CO2" and "g"; ok is false when the
// formula does not end in a parenthesised state.
func splitState(s string) (formula, state string, ok bool) {
	if !strings.HasSuffix(s, ")") {
		return "", "", false
	}
	i := strings.LastIndex(s, "(")
	if i <= 0 {
		return "", "", false
	}
	state = s[i+1 : len(s)-1]
	if state == "" || strings.ContainsAny(state, "()") {
		return "", "", false
	}
	return s[:i], state, true
}

// compositions holds the composition key of each compound (Hill order,
// "ClNa" for NaCl) and the first compound of each key. Parsing every
// formula costs more than the rest of loading, so it is done once, on the
// first lookup that needs it; the result never changes afterwards.
type compositions struct {
	once  sync.Once
	keys  map[string]string // formula → composition key
	byKey map[string]int    // composition key → first compound
}

func (db *DB) compositions() *compositions {
	c := db.comp
	c.once.Do(func() {
		c.keys = make(map[string]string, len(db.compounds))
		c.byKey = make(map[string]int, len(db.compounds))
		for i, cp := range db.compounds {
			f, err := notation.ParseFormula(cp.Formula)
			if err != nil {
				continue
			}
			k := f.Hill()
			c.keys[cp.Formula] = k
			if _, dup := c.byKey[k]; !dup {
				c.byKey[k] = i
			}
		}
	})
	return c
}

// speciesTable is species.csv, read on the first lookup of a species: it
// is the largest table and most runs never ask for a species. The
// species rows of alternatives.csv are read then too (hasAlts: Load met
// some), from the same file system.
type speciesTable struct {
	once     sync.Once
	fsys     fs.FS // where species.csv is read from; nil: nothing to read
	m        map[string]Species
	hasAlts  bool
	problems []string
	err      error
}

// deferred reports whether the table waits for its first use.
func (t *speciesTable) deferred() bool { return t.fsys != nil && t.m == nil }

// speciesMap returns the species, reading species.csv first if needed.
func (db *DB) speciesMap() map[string]Species {
	t := db.species
	t.once.Do(func() {
		if t.m == nil {
			t.m = map[string]Species{}
		}
		if t.fsys == nil {
			return
		}
		// A builder of its own: it writes to the species table only,
		// and keeps its problems apart from the DB's.
		tmp := &DB{sourceIdx: db.sourceIdx, species: t}
		b := &builder{db: tmp}
		f, err := t.fsys.Open("species.csv")
		if err != nil {
			if !isNotExist(err) {
				t.problems = append(t.problems, (&TableError{File: "species.csv", Err: err}).Error())
			}
			return
		}
		recs, err := readCSV("species.csv", f, tableColumns["species.csv"])
		f.Close()
		if err != nil {
			t.problems = append(t.problems, err.Error())
			return
		}
		t.m = make(map[string]Species, len(recs))
		for _, r := range recs {
			if err := b.apply("species.csv", r); err != nil {
				t.problems = append(t.problems, err.Error())
			}
		}
		if t.hasAlts {
			t.readAlternatives(b)
		}
		t.problems = append(t.problems, tmp.problems...)
	})
	return t.m
}

// readAlternatives applies the species rows of alternatives.csv, which
// Load left for the first use of the species (the others it applied).
func (t *speciesTable) readAlternatives(b *builder) {
	text, err := readText(t.fsys, "alternatives.csv")
	if err != nil {
		t.problems = append(t.problems, (&TableError{File: "alternatives.csv", Err: err}).Error())
		return
	}
	err = eachCSVText("alternatives.csv", text, tableColumns["alternatives.csv"], func(r record) error {
		if r.str("kind") != "species_formation" {
			return nil
		}
		if err := b.apply("alternatives.csv", r); err != nil {
			t.problems = append(t.problems, err.Error())
		}
		return nil
	})
	if err != nil {
		t.problems = append(t.problems, err.Error())
	}
}
