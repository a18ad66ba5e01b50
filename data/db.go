package data

import (
	"bytes"
	"embed"
	"errors"
	"fmt"
	"io/fs"
	"iter"
	"maps"
	"slices"
	"strconv"
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

	elements       []Element
	elementIdx     map[string]int
	elementFoldIdx map[string]int // lower-case symbol or name

	steps map[string][]AtomizationStep
	born  map[string]Value

	ions       []Ion
	ionIdx     map[string]int // symbol as written in ions.csv
	ionKeyIdx  map[ionKey]int
	ionFoldIdx map[string]int // folded symbol (see foldIon)

	radii map[ionKey][]ShannonRadius

	compounds       []Compound
	compoundIdx     map[string]int // formula as written
	compoundFoldIdx map[string]int // lower-case formula
	comp            *compositions  // composition keys, built on first use

	solutions map[string]Value      // tabulated formula → ΔsolH° at infinite dilution
	derived   map[string]DerivedIon // ion symbol → family-fitted gas-phase enthalpy (derived.go)

	species *speciesTable // "CO2(g)" → species, read on first use

	overlays []string
	problems []string

	computed sync.Map // values computed from this data set once (computed.go)
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
		solutions:   map[string]Value{},
		species:     &speciesTable{m: map[string]Species{}},
	}
}

// Load reads the tables embedded in the program.
func Load() (*DB, error) {
	sub, err := fs.Sub(embedded, "tables")
	if err != nil {
		return nil, err
	}
	return LoadFS(sub)
}

// LoadFS reads the tables from the root of fsys (sources.csv, elements.csv
// …; ion_values.csv and compounds.csv may be absent).
func LoadFS(fsys fs.FS) (*DB, error) {
	b := &builder{db: newDB()}
	for _, t := range tableOrder {
		if t.file == "species.csv" {
			b.db.species.fsys, b.db.species.m = fsys, nil // read on first use (speciesMap)
			continue
		}
		raw, err := fs.ReadFile(fsys, t.file)
		if err != nil {
			if t.optional && isNotExist(err) {
				continue
			}
			return nil, &TableError{File: t.file, Err: err}
		}
		b.reserve(t.file, bytes.Count(raw, []byte{'\n'}))
		err = eachCSV(t.file, bytes.NewReader(raw), tableColumns[t.file], func(r record) error { return b.apply(t.file, r) })
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
	return append(slices.Clone(db.problems), db.species.problems...)
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
		solutions:   maps.Clone(db.solutions),
		species:     &speciesTable{},
		derived:     maps.Clone(db.derived),
		overlays:    slices.Clone(db.overlays),
		problems:    slices.Clone(db.problems),
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
	c.species.once.Do(func() {}) // the clone's table is complete from the start
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

// Element returns the element with symbol sym (exact case; "na" or
// "sodium" finds Na too). Its Ionization slice is shared with the DB
// (capped, so appending copies): do not write to its elements. Elements
// returns deep copies.
func (db *DB) Element(sym string) (Element, error) {
	if i, ok := db.elementIdx[sym]; ok {
		return sharedElement(db.elements[i]), nil
	}
	s := strings.TrimSpace(sym)
	if i, ok := db.elementIdx[s]; ok {
		return sharedElement(db.elements[i]), nil
	}
	if i, ok := db.elementFoldIdx[strings.ToLower(s)]; ok {
		return sharedElement(db.elements[i]), nil
	}
	return Element{}, &NotFoundError{Kind: "element", Query: sym, Suggestions: db.suggestElements(s)}
}

// Elements returns every element in order of atomic number.
func (db *DB) Elements() []Element {
	out := make([]Element, len(db.elements))
	for i, e := range db.elements {
		out[i] = copyElement(e)
	}
	slices.SortStableFunc(out, func(a, b Element) int { return a.Z - b.Z })
	return out
}

// AtomizationSteps returns the sub-steps that take element sym from its
// standard state to gaseous atoms, in order. For an element without
// tabulated sub-steps (a metal) it returns the one step "X(s) → X(g)" built
// from the element's atomization enthalpy (kind "sublimation", or
// "vaporization" for a liquid); for a monatomic gas, or an unknown symbol,
// it returns nil. The enthalpies of the steps sum to AtomsProduced of the
// last step times the element's atomization enthalpy.
func (db *DB) AtomizationSteps(sym string) []AtomizationStep {
	if s, ok := db.steps[sym]; ok {
		return slices.Clone(s)
	}
	i, ok := db.elementIdx[sym]
	if !ok {
		return nil
	}
	e := db.elements[i]
	if !e.Atomization.Known() || strings.HasSuffix(e.StandardState, "(g)") {
		return nil
	}
	kind, phase := "sublimation", "s"
	if strings.HasSuffix(e.StandardState, "(l)") {
		kind, phase = "vaporization", "l"
	}
	return []AtomizationStep{{
		Kind:          kind,
		Reaction:      sym + "(" + phase + ") → " + sym + "(g)",
		AtomsProduced: 1,
		Enthalpy:      e.Atomization,
		Element:       sym,
		Order:         1,
	}}
}

// BornExponent returns Pauling's Born exponent for a noble-gas configuration
// class ("He", "Ne", "Ar", "Kr", "Xe", and for d¹⁰ ions "[Ar]3d10",
// "[Kr]4d10", "[Xe]4f14 5d10"), spelled as in born_exponents.csv.
func (db *DB) BornExponent(config string) (Value, error) {
	if v, ok := db.born[config]; ok {
		return v, nil
	}
	return Value{}, &NotFoundError{Kind: "born exponent", Query: config, Suggestions: sortedKeys(db.born)}
}

// Ion returns the ion written as symbol: "Na+", "Ca2+", "O2-", "SO4^2-",
// "SO4 2-", "SO42-", "NH4+", "Fe+3", "Cl^-". Digits before the sign are
// read as the charge or as part of the formula, whichever names a tabulated
// ion (the charge first).
//
// The Radii and Hydrations slices of the result are shared with the DB
// (capped, so appending copies): do not write to their elements. Ions
// returns deep copies.
func (db *DB) Ion(symbol string) (Ion, error) {
	if in, ok := db.FindIon(symbol); ok {
		return in, nil
	}
	return Ion{}, &NotFoundError{Kind: "ion", Query: symbol, Suggestions: db.suggestIons(strings.TrimSpace(symbol))}
}

// FindIon is Ion without the error: it reports whether the tables hold the
// ion and skips building suggestions, so a miss costs no more than a hit
// (a hypothetical compound looks up ions the tables do not hold).
func (db *DB) FindIon(symbol string) (Ion, bool) {
	if i, ok := db.ionIdx[symbol]; ok {
		return sharedIon(db.ions[i]), true
	}
	s := strings.TrimSpace(symbol)
	if i, ok := db.ionIdx[s]; ok {
		return sharedIon(db.ions[i]), true
	}
	if i, ok := db.ionFoldIdx[foldIon(s)]; ok {
		return sharedIon(db.ions[i]), true
	}
	for _, cand := range ionReadings(s) {
		if i, ok := db.ionKeyIdx[cand]; ok {
			return sharedIon(db.ions[i]), true
		}
	}
	return Ion{}, false
}

// IonByCharge returns the ion with the given core ("Fe", "SO4") and charge.
func (db *DB) IonByCharge(core string, charge int) (Ion, error) {
	if i, ok := db.ionKeyIdx[ionKey{strings.TrimSpace(core), charge}]; ok {
		return sharedIon(db.ions[i]), nil
	}
	q := canonicalIonSymbol(core, charge, false)
	var sugg []string
	for _, ion := range db.ions {
		if ion.Core == core {
			sugg = append(sugg, ion.Symbol)
		}
	}
	if len(sugg) == 0 {
		sugg = db.suggestIons(q)
	}
	return Ion{}, &NotFoundError{Kind: "ion", Query: q, Suggestions: sugg}
}

// IonsOf returns copies of the ions whose core is core ("Fe" gives Fe2+
// and Fe3+; "SO4" gives SO4^2-), in table order, without copying the rest.
func (db *DB) IonsOf(core string) []Ion {
	var out []Ion
	for _, ion := range db.ions {
		if ion.Core == core {
			out = append(out, copyIon(ion))
		}
	}
	return out
}

// Ions returns every ion in table order (monatomic rows first).
func (db *DB) Ions() []Ion {
	out := make([]Ion, len(db.ions))
	for i, ion := range db.ions {
		out[i] = copyIon(ion)
	}
	return out
}

// Radius returns the Shannon radius of ion core^charge at coordination cn
// ("VI", "IVSQ", or a number such as "6") and spin ("HS", "LS" or "").
//
// Matching rules, in order:
//   - CN: the row with exactly that CN string; for a number, the row with
//     that coordination (a plain "IV" before "IVSQ"/"IVPY"); if none, the
//     nearest tabulated coordination (ties go to the lower one) and the
//     result's Substituted field says so. An empty cn means VI.
//   - Spin: the row with that spin; a spin-less row matches any asked spin;
//     with spin "" and both spins tabulated, high spin is used (and said so).
func (db *DB) Radius(core string, charge int, cn string, spin string) (ShannonRadius, error) {
	list := db.radii[ionKey{core, charge}]
	// Fast path: the row exactly as asked.
	for _, r := range list {
		if r.CN == cn && r.Spin == spin {
			return r, nil
		}
	}
	core = strings.TrimSpace(core)
	list = db.radii[ionKey{core, charge}]
	sym := canonicalIonSymbol(core, charge, false)
	if len(list) == 0 {
		return ShannonRadius{}, &NotFoundError{Kind: "radius", Query: sym, Detail: "no Shannon radii tabulated for this ion", Suggestions: db.ionsWithRadii(core)}
	}
	cn = strings.ToUpper(strings.TrimSpace(cn))
	if cn == "" {
		cn = "VI"
	}
	want, isNum := 0, false
	if n, err := strconv.Atoi(cn); err == nil {
		want, isNum = n, true
	} else if n, ok := romanCN(cn); ok {
		want = n
	} else {
		return ShannonRadius{}, &NotFoundError{Kind: "radius", Query: sym + " CN " + cn, Detail: "not a coordination number (II … XIV, IVSQ, IVPY or a number)"}
	}
	spin = strings.ToUpper(strings.TrimSpace(spin))
	if spin != "" && spin != "HS" && spin != "LS" {
		return ShannonRadius{}, &NotFoundError{Kind: "radius", Query: sym + " spin " + spin, Detail: "spin is HS, LS or empty"}
	}
	// Candidate rows at the chosen CN.
	var at []ShannonRadius
	if !isNum {
		for _, r := range list {
			if r.CN == cn {
				at = append(at, r)
			}
		}
	}
	if len(at) == 0 {
		target, bestD := 0, -1
		for _, r := range list {
			d := abs(r.Coordination - want)
			if bestD < 0 || d < bestD || (d == bestD && r.Coordination < target) {
				bestD, target = d, r.Coordination
			}
		}
		var same []ShannonRadius
		for _, r := range list {
			if r.Coordination == target {
				same = append(same, r)
			}
		}
		spelling := same[0].CN
		for _, r := range same {
			if isPlainCN(r.CN) {
				spelling = r.CN
				break
			}
		}
		for _, r := range same {
			if r.CN == spelling {
				at = append(at, r)
			}
		}
	}
	var note []string
	if len(at) > 0 && (at[0].Coordination != want || (!isNum && at[0].CN != cn)) {
		note = append(note, fmt.Sprintf("CN %s not tabulated for %s; nearest CN %s used", cn, sym, at[0].CN))
	}
	pick := -1
	for i, r := range at {
		if r.Spin == spin {
			pick = i
			break
		}
	}
	if pick < 0 {
		for i, r := range at {
			if r.Spin == "" {
				pick = i
				break
			}
		}
	}
	if pick < 0 && spin == "" {
		for i, r := range at {
			if r.Spin == "HS" {
				pick = i
				note = append(note, "spin not given: high spin used")
				break
			}
		}
	}
	if pick < 0 {
		var have []string
		for _, r := range at {
			have = append(have, r.CN+" "+r.Spin)
		}
		return ShannonRadius{}, &NotFoundError{Kind: "radius", Query: fmt.Sprintf("%s CN %s %s", sym, cn, spin), Detail: "tabulated at this CN: " + strings.Join(have, ", ")}
	}
	r := at[pick]
	r.Substituted = strings.Join(note, "; ")
	return r, nil
}

func isPlainCN(cn string) bool { return cn != "IVSQ" && cn != "IVPY" }

func abs(x int) int {
	if x < 0 {
		return -x
	}
	return x
}

// Radii returns every Shannon row of ion core^charge, sorted by coordination.
func (db *DB) Radii(core string, charge int) []ShannonRadius {
	return slices.Clone(db.radii[ionKey{core, charge}])
}

func (db *DB) ionsWithRadii(core string) []string {
	var out []string
	for k := range db.radii {
		if k.core == core {
			out = append(out, canonicalIonSymbol(k.core, k.charge, false))
		}
	}
	slices.Sort(out)
	return out
}

// Hydration returns the standard hydration enthalpy of an ion (kJ/mol) and
// its scale ("conventional", H+ = 0, or "absolute"): the first tabulated one.
func (db *DB) Hydration(ion string) (Value, string, error) {
	x, err := db.Ion(ion)
	if err != nil {
		return Value{}, "", err
	}
	if len(x.Hydrations) == 0 {
		return Value{}, "", &NotFoundError{Kind: "hydration", Query: x.Symbol, Detail: "no hydration enthalpy tabulated", Suggestions: db.ionsWithHydration()}
	}
	return x.Hydrations[0].Value, x.Hydrations[0].Scale, nil
}

// HydrationOnScale returns the hydration enthalpy of an ion on the named
// scale ("conventional" or "absolute").
func (db *DB) HydrationOnScale(ion, scale string) (Value, error) {
	x, err := db.Ion(ion)
	if err != nil {
		return Value{}, err
	}
	for _, h := range x.Hydrations {
		if h.Scale == scale {
			return h.Value, nil
		}
	}
	return Value{}, &NotFoundError{Kind: "hydration", Query: x.Symbol + " (" + scale + ")", Detail: "not tabulated on this scale"}
}

func (db *DB) ionsWithHydration() []string {
	var out []string
	for _, ion := range db.ions {
		if len(ion.Hydrations) > 0 && len(out) < 5 {
			out = append(out, ion.Symbol)
		}
	}
	return out
}

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
	if i, ok := db.compoundFoldIdx[strings.ToLower(s)]; ok {
		return copyCompound(db.compounds[i]), true
	}
	if f, err := ParseFormula(s); err == nil {
		if i, ok := db.compositions().byKey[f.compositionKey()]; ok {
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
	v, ok := db.solutions[c.Formula]
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
			f, err := ParseFormula(cp.Formula)
			if err != nil {
				continue
			}
			k := f.compositionKey()
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
// alternatives of its rows wait in pendingAlts until then.
type speciesTable struct {
	once        sync.Once
	fsys        fs.FS // where species.csv is read from; nil: nothing to read
	m           map[string]Species
	pendingAlts []record
	problems    []string
	err         error
}

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
		for _, r := range append(recs, t.pendingAlts...) {
			table := "species.csv"
			if r.file == "alternatives.csv" {
				table = "alternatives.csv"
			}
			if err := b.apply(table, r); err != nil {
				t.problems = append(t.problems, err.Error())
			}
		}
		t.pendingAlts = nil
		t.problems = append(t.problems, tmp.problems...)
	})
	return t.m
}
