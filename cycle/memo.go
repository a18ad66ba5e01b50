package cycle

import (
	"fmt"
	"math"
	"slices"
	"strconv"
	"strings"
	"sync"

	"enthalpath/data"
	"enthalpath/thermo/crystal"
	"enthalpath/thermo/ewald"
)

// DefaultAccuracy is the Ewald accuracy used when Settings.Accuracy is 0:
// a relative 1e-8 is far below every other uncertainty of a cycle.
const DefaultAccuracy = 1e-8

// MadelungValue is the outcome of one Ewald sum for a structure with the
// compound's ions.
type MadelungValue struct {
	// A is the Madelung constant in thermo/ewald's convention (per formula
	// unit, referred to NearestDistance).
	A float64
	// NearestDistance is the shortest cation–anion distance in Å.
	NearestDistance float64
	// EnergyKJPerMol is the point-charge energy per mole of formula units.
	EnergyKJPerMol float64
	// Cell volume in Å³ and formula units per cell.
	Volume       float64
	FormulaUnits int
	// SitePotentials are the Madelung potentials in volt at the cell's
	// sites, in their order (see ewald.Result).
	SitePotentials []float64
}

// Memo remembers Ewald sums keyed by everything they depend on (structure,
// parameters, ion charges, accuracy), so that changing another setting
// never sums again. It is safe for concurrent use; share one among the
// cycles of a session or of a batch. The zero value is not usable: use
// NewMemo.
type Memo struct {
	mu sync.Mutex
	m  map[string]memoEntry
	// shapes holds the Ewald sums of the prototypes' canonical cells, by
	// shape (shape.go); m the sums of structures scaled from them.
	shapes map[string]MadelungValue
	// sums holds the extended model's pair sums per structure (extended.go).
	sums map[string]sumsEntry
	// ext holds the extended model's evaluations (extended.go).
	ext map[string]extendedEntry
	// validation is the last data set's validation (validation.go), kept
	// here so that a Solve asks the data set for it once.
	validationOf *data.DB
	validation   *Validation
}

type memoEntry struct {
	v   MadelungValue
	err error
}

// NewMemo returns an empty memo.
func NewMemo() *Memo { return &Memo{m: make(map[string]memoEntry)} }

// Len returns the number of sums remembered.
func (m *Memo) Len() int {
	m.mu.Lock()
	defer m.mu.Unlock()
	return len(m.m)
}

// maxMemo bounds the memo; when full it is emptied (a session rarely
// visits more structures than this).
const maxMemo = 4096

// Madelung returns the Ewald sum of structure st with the cation and anion
// of the compound placed on its cation and anion slots, from the memo when
// it has been computed before.
func (m *Memo) Madelung(st Structure, cation, anion Part, accuracy float64) (MadelungValue, error) {
	if accuracy == 0 {
		accuracy = DefaultAccuracy
	}
	key, e, ok := m.lookup(st, cation, anion, accuracy)
	if ok {
		return e.v, wordFit(e.err, cation, anion)
	}
	v, err := m.sumByShape(st, cation, anion, accuracy)
	m.mu.Lock()
	if len(m.m) >= maxMemo {
		clear(m.m)
	}
	m.m[key] = memoEntry{v, err}
	m.mu.Unlock()
	return v, wordFit(err, cation, anion)
}

// unfitIons is why a prototype does not take a compound's ions (crystal's
// WithIons, which names slots and charges only). The memo keeps it under
// the sum's key, which holds the ions' charges and not their symbols, and
// wordFit words it with the ions of the compound asked: remembered worded,
// every later compound of the same charges would get the first one's ions
// (with the batch's workers, a different first compound from run to run).
type unfitIons struct {
	prototype string
	err       error
}

func (u *unfitIons) Error() string {
	return "the " + u.prototype + " prototype does not fit the ions: " + u.err.Error()
}

// wordFit returns err, with an unfitIons worded for cation and anion.
func wordFit(err error, cation, anion Part) error {
	u, ok := err.(*unfitIons) // kept as buildCell returns it
	if !ok {
		return err
	}
	return &ModelError{Model: ModelEwald,
		Reason: "the " + u.prototype + " prototype does not fit " + cation.Ion.Symbol + " and " + anion.Ion.Symbol, Err: u.err}
}

// Remembered returns the sum Madelung would return if it has been
// computed already, without computing it (for a screen that must not wait).
func (m *Memo) Remembered(st Structure, cation, anion Part, accuracy float64) (MadelungValue, bool) {
	if accuracy == 0 {
		accuracy = DefaultAccuracy
	}
	_, e, ok := m.lookup(st, cation, anion, accuracy)
	return e.v, ok && e.err == nil
}

// lookup returns the memo's key for a sum and the entry kept under it.
func (m *Memo) lookup(st Structure, cation, anion Part, accuracy float64) (string, memoEntry, bool) {
	var buf [128]byte
	key := appendMemoKey(buf[:0], st, cation, anion, accuracy)
	m.mu.Lock()
	e, ok := m.m[string(key)] // no copy for a lookup
	m.mu.Unlock()
	if ok {
		return "", e, true // the key is not needed: nothing is stored
	}
	return string(key), e, false
}

func memoKey(st Structure, cation, anion Part, accuracy float64) string {
	return string(appendMemoKey(make([]byte, 0, 64), st, cation, anion, accuracy))
}

// appendMemoKey appends the memo's key for a sum to b: the charges, the
// accuracy and the structure (a cell's every site, or a prototype's name
// and its parameters by name).
func appendMemoKey(b []byte, st Structure, cation, anion Part, accuracy float64) []byte {
	b = strconv.AppendInt(b, int64(cation.Ion.Charge), 10)
	b = append(b, '|')
	b = strconv.AppendInt(b, int64(anion.Ion.Charge), 10)
	b = append(b, '|')
	b = strconv.AppendFloat(b, accuracy, 'g', -1, 64)
	b = append(b, '|')
	if st.Cell != nil {
		cell := st.Cell
		b = fmt.Appendf(b, "cell|%s|%d|%v|", cell.Name, cell.FormulaUnits, cell.Lattice)
		for _, s := range cell.Sites {
			b = fmt.Appendf(b, "%s,%g,%v;", s.Species, s.Charge, s.Frac)
		}
		return b
	}
	b = append(b, st.Prototype...)
	var names [8]string // a prototype has at most four parameters
	keys := names[:0]
	for k := range st.Params {
		keys = append(keys, k)
	}
	slices.Sort(keys)
	for _, k := range keys {
		b = append(b, '|')
		b = append(b, k...)
		b = append(b, '=')
		b = strconv.AppendFloat(b, st.Params[k], 'g', -1, 64)
	}
	return b
}

func sumStructure(st Structure, cation, anion Part, accuracy float64) (MadelungValue, error) {
	cell, err := buildCell(st, cation, anion)
	if err != nil {
		return MadelungValue{}, err
	}
	r, err := ewald.Sum(cell, ewald.Options{Accuracy: accuracy})
	if err != nil {
		return MadelungValue{}, &ModelError{Model: ModelEwald, Reason: "Ewald sum failed", Err: err}
	}
	if !(r.MadelungConstant > 0) || math.IsNaN(r.NearestDistance) {
		return MadelungValue{}, &ModelError{Model: ModelEwald, Reason: fmt.Sprintf("the structure gives A = %g, not a binding arrangement", r.MadelungConstant)}
	}
	return MadelungValue{A: r.MadelungConstant, NearestDistance: r.NearestDistance, EnergyKJPerMol: r.EnergyKJPerMol,
		Volume: cell.Volume(), FormulaUnits: cell.FormulaUnits, SitePotentials: r.SitePotentials}, nil
}

// buildCell returns the cell of st with the compound's ions on the
// prototype's cation and anion slots (or the cell read from a file).
func buildCell(st Structure, cation, anion Part) (*crystal.Crystal, error) {
	if st.Cell != nil {
		return st.Cell, nil
	}
	if st.CIF != "" {
		return nil, &ModelError{Model: ModelEwald, Reason: "the CIF file " + st.CIF + " has not been read", Remedy: RemedyReadCIF}
	}
	if st.Prototype == "" {
		return nil, &ModelError{Model: ModelEwald, Reason: "no structure chosen"}
	}
	proto, err := crystal.Build(st.Prototype, st.Params)
	if err != nil {
		return nil, &ModelError{Model: ModelEwald, Reason: "cannot build the structure", Err: err}
	}
	ions := map[string]crystal.Ion{
		"M": {Species: cation.Ion.Core, Charge: float64(cation.Ion.Charge)},
		"X": {Species: anion.Ion.Core, Charge: float64(anion.Ion.Charge)},
	}
	cell, err := proto.WithIons(ions)
	if err != nil {
		return nil, &unfitIons{prototype: st.Prototype, err: err} // worded by wordFit
	}
	return cell, nil
}

// cellFits checks that a cell read from a file holds the compound's ions:
// every positive site the cation and every negative site the anion (by
// element, for a monatomic ion), charges in the ratio of the ions' (the
// Ewald sum refers A to the nearest pair's charges, so a common scale does
// not matter), and per formula unit of the cell (Z) as many of each as the
// compound has. A cell of another compound would give its own Madelung
// constant, distance and volume to this one. model names the model refused.
func cellFits(model, name, formula string, cell *crystal.Crystal, cation, anion Part) error {
	type kind struct {
		species string
		charge  float64
		n       int
	}
	var kinds []kind
	var qPos, qNeg float64
	nPos, nNeg := 0, 0
	fits := true
	for _, s := range cell.Sites {
		i := slices.IndexFunc(kinds, func(k kind) bool { return k.species == s.Species && k.charge == s.Charge })
		if i < 0 {
			kinds = append(kinds, kind{species: s.Species, charge: s.Charge})
			i = len(kinds) - 1
		}
		kinds[i].n++
		switch {
		case s.Charge > 0:
			nPos++
			if qPos == 0 {
				qPos = s.Charge
			}
			if !sameCharge(s.Charge, qPos) || (!cation.Ion.Polyatomic && s.Species != cation.Ion.Core) {
				fits = false
			}
		case s.Charge < 0:
			nNeg++
			if qNeg == 0 {
				qNeg = s.Charge
			}
			if !sameCharge(s.Charge, qNeg) || (!anion.Ion.Polyatomic && s.Species != anion.Ion.Core) {
				fits = false
			}
		default:
			fits = false // an uncharged site is no ion of the compound
		}
	}
	zc, za := float64(cation.Ion.Charge), float64(anion.Ion.Charge)
	if fits && (nPos == 0 || nNeg == 0 || !sameCharge(qPos/qNeg, zc/za)) {
		fits = false
	}
	z := cell.FormulaUnits
	if fits && (z <= 0 || nPos != z*cation.Count || nNeg != z*anion.Count) {
		fits = false
	}
	if fits {
		return nil
	}
	held := make([]string, len(kinds))
	for i, k := range kinds {
		q := chargeNumber(k.charge)
		if k.n%max(z, 1) == 0 && z > 0 {
			held[i] = fmt.Sprintf("%d %s%s", k.n/z, k.species, q)
		} else {
			held[i] = fmt.Sprintf("%d/%d %s%s", k.n, max(z, 1), k.species, q)
		}
	}
	return &ModelError{Model: model, Reason: fmt.Sprintf("the CIF file %s does not fit %s: per formula unit (Z = %d) it holds %s; %s needs %d %s and %d %s",
		name, formula, z, strings.Join(held, ", "), formula, cation.Count, IonText(cation.Ion), anion.Count, IonText(anion.Ion))}
}

// sameCharge reports whether two charges (or charge ratios) agree to 1e-6
// relative (common practice, no source: far below any stated oxidation
// number's precision, far above rounding).
func sameCharge(a, b float64) bool { return math.Abs(a-b) <= 1e-6*math.Max(math.Abs(a), math.Abs(b)) }

// chargeNumber writes a site charge as a superscript when it is whole
// ("⁴⁺"), else as a signed number in parentheses ("(+1.5)").
func chargeNumber(q float64) string {
	if q == math.Trunc(q) && math.Abs(q) < 100 {
		return chargeText(int(q))
	}
	return fmt.Sprintf("(%+g)", q)
}
