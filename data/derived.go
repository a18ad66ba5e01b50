package data

import "sync"

// Derived returns the value compute gives for key, computing it at most
// once per DB: for results that depend only on the data set, such as the
// validation of the lattice models over every compound. The DB is
// immutable, so such a value never goes stale; a DB with an overlay is
// another DB with its own values. compute must not call Derived with the
// same key.
func (db *DB) Derived(key string, compute func() any) any {
	v, _ := db.derived.LoadOrStore(key, &derivedValue{})
	d := v.(*derivedValue)
	d.once.Do(func() { d.v = compute() })
	return d.v
}

type derivedValue struct {
	once sync.Once
	v    any
}
