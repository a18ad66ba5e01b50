package data

import "sync"

// Computed returns the value compute gives for key, computing it at most
// once per DB: for results that depend only on the data set, such as the
// validation of the lattice models over every compound. The DB is
// immutable, so such a value never goes stale; a DB with an overlay is
// another DB with its own values. compute must not call Computed with the
// same key.
func (db *DB) Computed(key string, compute func() any) any {
	v, _ := db.computed.LoadOrStore(key, &computedValue{})
	d := v.(*computedValue)
	d.once.Do(func() { d.v = compute() })
	return d.v
}

type computedValue struct {
	once sync.Once
	v    any
}
