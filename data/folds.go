package data

import (
	"strings"
	"sync"

	"enthalpath/thermo/notation"
)

// foldIndexes find a compound, element or ion written in another case or
// spelling ("nacl", "iron", "Fe+3"). They are built on the first lookup
// that misses the spelling of the tables: building them costs Load a
// string per name, and most lookups name what the tables write.
type foldIndexes struct {
	once      sync.Once
	compounds map[string]int // lower-case formula
	elements  map[string]int // lower-case symbol or name
	ions      map[string]int // folded symbol (notation.FoldIon), caret and plain forms
}

func (db *DB) folds() *foldIndexes {
	f := db.fold
	f.once.Do(func() {
		f.compounds = make(map[string]int, len(db.compounds))
		for i, c := range db.compounds {
			f.compounds[strings.ToLower(c.Formula)] = i
		}
		f.elements = make(map[string]int, 2*len(db.elements))
		for i, e := range db.elements {
			f.elements[strings.ToLower(e.Symbol)] = i
			if e.Name != "" {
				f.elements[strings.ToLower(e.Name)] = i
			}
		}
		f.ions = make(map[string]int, 3*len(db.ions))
		for i, ion := range db.ions {
			for _, key := range []string{notation.FoldIon(ion.Symbol), notation.CaretIonSymbol(ion.Core, ion.Charge)} {
				if _, dup := f.ions[key]; !dup {
					f.ions[key] = i
				}
			}
			if !ion.Polyatomic {
				f.ions[notation.IonSymbol(ion.Core, ion.Charge, false)] = i
			}
		}
	})
	return f
}
