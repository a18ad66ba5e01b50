package data

import (
	"embed"
	"errors"
	"io/fs"
	"maps"
	"slices"
	"strings"
	"sync"
)

//go:embed tables/*.csv
var embedded embed.FS

// DB is the loaded reference data with its lookup indexes. It is immutable:
// share one between goroutines freely.
type DB struct {
	sources   []Source
	sourceIdx map[string]int

	elements   []Element
	elementIdx map[string]int

	steps map[string][]AtomizationStep
	born  map[string]Value

	ions      []Ion
	ionIdx    map[string]int // symbol as written in ions.csv
	ionKeyIdx map[ionKey]int

	radii map[ionKey][]ShannonRadius

	compounds   []Compound
	compoundIdx map[string]int // formula as written
	comp        *compositions  // composition keys, built on first use
	fold        *foldIndexes   // folded spellings, built on first use

	solutions *solutionTable        // tabulated formula → ΔsolH° at infinite dilution, read on first use
	derived   map[string]DerivedIon // ion symbol → family-fitted gas-phase enthalpy (derived.go)

	species *speciesTable // "CO2(g)" → species, read on first use

	heatCaps *heatCapacityTable // NASA Glenn polynomials, read on first use (heatcap.go)

	overlays []string
	problems []string

	computed sync.Map // values computed from this data set once (computed.go)

	builtIn bool // the embedded tables, perhaps with overlays (calibration.go)
}

type ionKey struct {
	core   string
	charge int
}

func newDB() *DB {
	return &DB{
		sourceIdx:   map[string]int{},
		elementIdx:  map[string]int{},
		steps:       map[string][]AtomizationStep{},
		born:        map[string]Value{},
		ionIdx:      map[string]int{},
		radii:       map[ionKey][]ShannonRadius{},
		compoundIdx: map[string]int{},
		solutions:   &solutionTable{m: map[string]Value{}},
		species:     &speciesTable{m: map[string]Species{}},
		heatCaps:    &heatCapacityTable{},
	}
}

// Load reads the tables embedded in the program.
func Load() (*DB, error) {
	sub, err := newEmbeddedTables(embedded)
	if err != nil {
		return nil, err
	}
	db, err := LoadFS(sub)
	if err != nil {
		return nil, err
	}
	db.builtIn = true
	return db, nil
}

// LoadFS reads the tables from the root of fsys (sources.csv, elements.csv
// …; ion_values.csv and compounds.csv may be absent).
func LoadFS(fsys fs.FS) (*DB, error) {
	b := &builder{db: newDB()}
	for _, t := range tableOrder {
		switch t.file {
		case "species.csv":
			b.db.species.fsys, b.db.species.m = fsys, nil // read on first use (speciesMap)
			continue
		case "solution_enthalpies.csv":
			b.db.solutions.fsys, b.db.solutions.m = fsys, nil // read on first use (solutionMap)
			continue
		}
		text, err := readText(fsys, t.file)
		if err != nil {
			if t.optional && isNotExist(err) {
				continue
			}
			return nil, &TableError{File: t.file, Err: err}
		}
		b.reserve(t.file, strings.Count(text, "\n"))
		err = eachCSVText(t.file, text, tableColumns[t.file], func(r record) error { return b.apply(t.file, r) })
		if err != nil {
			return nil, err
		}
	}
	b.finish()
	return b.db, nil
}

func isNotExist(err error) bool { return errors.Is(err, fs.ErrNotExist) }

// Problems lists inconsistencies found while loading the built-in tables
// that did not stop loading: values without a source, unknown source keys,
// compounds that name an ion missing from the ion table. Empty for good data.
func (db *DB) Problems() []string {
	db.speciesMap()
	db.solutionMap()
	return slices.Concat(db.problems, db.species.problems, db.solutions.problems)
}

// Overlays names the overlay files applied to this DB, in order.
func (db *DB) Overlays() []string { return slices.Clone(db.overlays) }

// clone returns a deep copy whose records may be changed without touching db.
func (db *DB) clone() *DB {
	c := &DB{
		sources:     slices.Clone(db.sources),
		sourceIdx:   maps.Clone(db.sourceIdx),
		elements:    make([]Element, len(db.elements)),
		elementIdx:  maps.Clone(db.elementIdx),
		steps:       make(map[string][]AtomizationStep, len(db.steps)),
		born:        maps.Clone(db.born),
		ions:        make([]Ion, len(db.ions)),
		ionIdx:      maps.Clone(db.ionIdx),
		radii:       make(map[ionKey][]ShannonRadius, len(db.radii)),
		compounds:   make([]Compound, len(db.compounds)),
		compoundIdx: maps.Clone(db.compoundIdx),
		solutions:   &solutionTable{},
		species:     &speciesTable{},
		heatCaps:    db.heatCaps, // read-only: shared
		derived:     maps.Clone(db.derived),
		overlays:    slices.Clone(db.overlays),
		problems:    slices.Clone(db.problems),
		builtIn:     db.builtIn,
	}
	for i, e := range db.elements {
		c.elements[i] = copyElement(e)
	}
	for k, s := range db.steps {
		c.steps[k] = slices.Clone(s)
	}
	for i, ion := range db.ions {
		c.ions[i] = copyIon(ion)
	}
	for k, r := range db.radii {
		c.radii[k] = slices.Clone(r)
	}
	for i, cp := range db.compounds {
		c.compounds[i] = copyCompound(cp)
	}
	c.species.once.Do(func() {}) // the clone's tables are complete from the start
	c.solutions.once.Do(func() {})
	c.solutions.m = maps.Clone(db.solutionMap())
	base := db.speciesMap()
	c.species.m = make(map[string]Species, len(base))
	for k, sp := range base {
		sp.Alternatives = slices.Clone(sp.Alternatives)
		c.species.m[k] = sp
	}
	c.problems = db.Problems()
	return c
}

func sharedElement(e Element) Element {
	e.Ionization = e.Ionization[:len(e.Ionization):len(e.Ionization)]
	e.AtomizationAlternatives = e.AtomizationAlternatives[:len(e.AtomizationAlternatives):len(e.AtomizationAlternatives)]
	return e
}

func copyElement(e Element) Element {
	e.Ionization = slices.Clone(e.Ionization)
	e.AtomizationAlternatives = slices.Clone(e.AtomizationAlternatives)
	return e
}

func copyIon(ion Ion) Ion {
	ion.Radii = slices.Clone(ion.Radii)
	ion.Hydrations = slices.Clone(ion.Hydrations)
	ion.GasFormationAlternatives = slices.Clone(ion.GasFormationAlternatives)
	return ion
}

// sharedIon returns ion with its slices capped at their length, so that an
// append by the caller allocates instead of writing into the DB. The
// elements are shared: treat them as read-only (see Ion).
func sharedIon(ion Ion) Ion {
	ion.Radii = ion.Radii[:len(ion.Radii):len(ion.Radii)]
	ion.Hydrations = ion.Hydrations[:len(ion.Hydrations):len(ion.Hydrations)]
	ion.GasFormationAlternatives = ion.GasFormationAlternatives[:len(ion.GasFormationAlternatives):len(ion.GasFormationAlternatives)]
	return ion
}

func copyCompound(c Compound) Compound {
	c.Params = maps.Clone(c.Params)
	c.Alternatives = slices.Clone(c.Alternatives)
	return c
}

// Source returns the citation with this key.
func (db *DB) Source(key string) (Source, error) {
	if i, ok := db.sourceIdx[key]; ok {
		return db.sources[i], nil
	}
	if key == userSource {
		return Source{Key: userSource, Citation: "value from the user's overlay file"}, nil
	}
	if key == FamilyFitSource {
		return Source{Key: FamilyFitSource, Citation: familyFitCitation}, nil
	}
	return Source{}, &NotFoundError{Kind: "source", Query: key, Suggestions: suggest(key, db.sourceKeys(), 3)}
}

// Sources returns every citation in table order.
func (db *DB) Sources() []Source { return slices.Clone(db.sources) }

func (db *DB) sourceKeys() []string {
	out := make([]string, len(db.sources))
	for i, s := range db.sources {
		out[i] = s.Key
	}
	return out
}
