package cycle

import (
	"fmt"
	"math"
	"sort"
	"strconv"
	"sync"

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
}

// Memo remembers Ewald sums keyed by everything they depend on (structure,
// parameters, ion charges, accuracy), so that changing another setting
// never sums again. It is safe for concurrent use; share one among the
// cycles of a session or of a batch. The zero value is not usable: use
// NewMemo.
type Memo struct {
	mu sync.Mutex
	m  map[string]memoEntry
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
	key := memoKey(st, cation, anion, accuracy)
	m.mu.Lock()
	e, ok := m.m[key]
	m.mu.Unlock()
	if ok {
		return e.v, e.err
	}
	v, err := sumStructure(st, cation, anion, accuracy)
	m.mu.Lock()
	if len(m.m) >= maxMemo {
		clear(m.m)
	}
	m.m[key] = memoEntry{v, err}
	m.mu.Unlock()
	return v, err
}

func memoKey(st Structure, cation, anion Part, accuracy float64) string {
	b := make([]byte, 0, 64)
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
		return string(b)
	}
	b = append(b, st.Prototype...)
	keys := make([]string, 0, len(st.Params))
	for k := range st.Params {
		keys = append(keys, k)
	}
	sort.Strings(keys)
	for _, k := range keys {
		b = append(b, '|')
		b = append(b, k...)
		b = append(b, '=')
		b = strconv.AppendFloat(b, st.Params[k], 'g', -1, 64)
	}
	return string(b)
}

func sumStructure(st Structure, cation, anion Part, accuracy float64) (MadelungValue, error) {
	var cell *crystal.Crystal
	if st.Cell != nil {
		cell = st.Cell
	} else {
		if st.CIF != "" {
			return MadelungValue{}, &ModelError{Model: ModelEwald, Reason: "the CIF file " + st.CIF + " has not been read; open it with --structure FILE.cif"}
		}
		if st.Prototype == "" {
			return MadelungValue{}, &ModelError{Model: ModelEwald, Reason: "no structure chosen"}
		}
		proto, err := crystal.Build(st.Prototype, st.Params)
		if err != nil {
			return MadelungValue{}, &ModelError{Model: ModelEwald, Reason: "cannot build the structure", Err: err}
		}
		ions := map[string]crystal.Ion{
			"M": {Species: cation.Ion.Core, Charge: float64(cation.Ion.Charge)},
			"X": {Species: anion.Ion.Core, Charge: float64(anion.Ion.Charge)},
		}
		cell, err = proto.WithIons(ions)
		if err != nil {
			return MadelungValue{}, &ModelError{Model: ModelEwald,
				Reason: fmt.Sprintf("the %s prototype does not fit %s and %s", st.Prototype, cation.Ion.Symbol, anion.Ion.Symbol), Err: err}
		}
	}
	r, err := ewald.Sum(cell, ewald.Options{Accuracy: accuracy})
	if err != nil {
		return MadelungValue{}, &ModelError{Model: ModelEwald, Reason: "Ewald sum failed", Err: err}
	}
	if !(r.MadelungConstant > 0) || math.IsNaN(r.NearestDistance) {
		return MadelungValue{}, &ModelError{Model: ModelEwald, Reason: fmt.Sprintf("the structure gives A = %g, not a binding arrangement", r.MadelungConstant)}
	}
	return MadelungValue{A: r.MadelungConstant, NearestDistance: r.NearestDistance, EnergyKJPerMol: r.EnergyKJPerMol,
		Volume: cell.Volume(), FormulaUnits: cell.FormulaUnits}, nil
}
