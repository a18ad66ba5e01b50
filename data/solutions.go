package data

import (
	"io/fs"
	"strings"
	"sync"
)

// solutionTable is solution_enthalpies.csv, read on the first lookup of an
// enthalpy of solution (or the first call of Problems, or an overlay):
// only the solution cycle asks for one.
type solutionTable struct {
	once     sync.Once
	fsys     fs.FS // where the table is read from; nil: m is complete
	m        map[string]Value
	problems []string // the table's own, and its rows' errors (a row in error is left out)
}

// solutionMap returns the enthalpies of solution, reading the table first
// if needed.
func (db *DB) solutionMap() map[string]Value {
	t := db.solutions
	t.once.Do(func() {
		if t.fsys == nil {
			return
		}
		const file = "solution_enthalpies.csv"
		text, err := readText(t.fsys, file)
		if err != nil {
			if !isNotExist(err) {
				t.problems = append(t.problems, (&TableError{File: file, Err: err}).Error())
			}
			t.m = map[string]Value{}
			return
		}
		// A builder of its own: it writes to this table only and
		// reads the compounds and sources Load built.
		tmp := &DB{sourceIdx: db.sourceIdx, compoundIdx: db.compoundIdx, solutions: t}
		b := &builder{db: tmp}
		t.m = make(map[string]Value, strings.Count(text, "\n"))
		err = eachCSVText(file, text, tableColumns[file], func(r record) error {
			if err := b.apply(file, r); err != nil {
				t.problems = append(t.problems, err.Error())
			}
			return nil
		})
		if err != nil {
			t.problems = append(t.problems, err.Error())
		}
		t.problems = append(t.problems, tmp.problems...)
	})
	return t.m
}
