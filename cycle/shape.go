package cycle

// The Madelung sum per shape: a prototype's Madelung constant depends on its
// dimensionless parameters and its ions' charges, not on its size, so every
// rock-salt compound of one charge pattern shares one Ewald sum.

import (
	"math"
	"strconv"

	"enthalpath/thermo/crystal"
)

// shapeLength is the reference length in Å of a shape's canonical cell:
// its first length parameter (a) is set to this, its other lengths to
// their ratio to a times this. A power of two, so that the scaling to it
// multiplies by a ratio exactly; large enough that no cell of a real
// compound's shape falls below crystal.MinimumSeparation.
const shapeLength = 8

// shape is a prototype structure's shape: the key of its canonical cell
// and the factor from the canonical cell's lengths to the structure's.
type shape struct {
	key   string
	canon Structure
	scale float64 // structure length / canonical length
}

// shapeOf returns the shape of st with the compound's charges at the
// given accuracy; ok is false for a cell read from a file, an unknown
// prototype or parameters Build would refuse (the direct sum then gives
// the answer or its error).
//
// The key holds the prototype's name, the two charges, the accuracy and
// every parameter of the canonical cell (unset ones at their defaults) as
// the exact bits of its float64 (strconv's 'x' format): two structures
// share an entry only when their canonical cells are the same numbers,
// that is when every length ratio to a rounds to the same float64 and every
// fractional coordinate is equal. Nothing is rounded beyond that one
// division per length, which the direct sum of either structure would see
// as a relative change of c/a below 1.2e-16.
func shapeOf(st Structure, cation, anion Part, accuracy float64) (shape, bool) {
	if st.Cell != nil || st.CIF != "" || st.Prototype == "" {
		return shape{}, false
	}
	p, err := crystal.LookupPrototype(st.Prototype)
	if err != nil {
		return shape{}, false
	}
	values := p.Defaults()
	for k, v := range st.Params {
		if _, known := values[k]; !known {
			return shape{}, false
		}
		values[k] = v
	}
	var ref float64
	for _, q := range p.Params {
		if q.Unit == "Å" {
			ref = values[q.Key]
			break
		}
	}
	if !(ref > 0) || math.IsInf(ref, 0) {
		return shape{}, false
	}
	canon := make(map[string]float64, len(values))
	b := make([]byte, 0, 96)
	b = append(b, st.Prototype...)
	b = append(b, '|')
	b = strconv.AppendInt(b, int64(cation.Ion.Charge), 10)
	b = append(b, '|')
	b = strconv.AppendInt(b, int64(anion.Ion.Charge), 10)
	b = append(b, '|')
	b = strconv.AppendFloat(b, accuracy, 'x', -1, 64)
	for _, q := range p.Params { // the prototype's own order: no sort needed
		v := values[q.Key]
		if math.IsNaN(v) || math.IsInf(v, 0) {
			return shape{}, false
		}
		if q.Unit == "Å" {
			v = v / ref * shapeLength
		}
		canon[q.Key] = v
		b = append(b, '|')
		b = strconv.AppendFloat(b, v, 'x', -1, 64)
	}
	return shape{key: string(b), canon: Structure{Prototype: st.Prototype, Params: canon}, scale: ref / shapeLength}, true
}

// scaled returns the sum of the shape's canonical cell as the structure's:
// A and the charges are the same, lengths scale by s, energies and
// potentials (∝ 1/length) by 1/s, the volume by s³.
func (sh shape) scaled(v MadelungValue) MadelungValue {
	s := sh.scale
	out := v
	out.NearestDistance = v.NearestDistance * s
	out.EnergyKJPerMol = v.EnergyKJPerMol / s
	out.Volume = v.Volume * (s * s * s)
	if v.SitePotentials != nil {
		out.SitePotentials = make([]float64, len(v.SitePotentials))
		for i, p := range v.SitePotentials {
			out.SitePotentials[i] = p / s
		}
	}
	return out
}

// sumByShape is sumStructure through the memo's sums per shape: the
// structure is built at its own size first, so that it fails as the
// direct sum would (parameters out of range, ions that do not fit); its
// shape's canonical cell is summed once and scaled. A canonical cell that
// cannot be summed leaves the structure to the direct sum.
func (m *Memo) sumByShape(st Structure, cation, anion Part, accuracy float64) (MadelungValue, error) {
	sh, ok := shapeOf(st, cation, anion, accuracy)
	if !ok {
		return sumStructure(st, cation, anion, accuracy)
	}
	if _, err := buildCell(st, cation, anion); err != nil {
		return MadelungValue{}, err
	}
	m.mu.Lock()
	v, found := m.shapes[sh.key]
	m.mu.Unlock()
	if !found {
		var err error
		if v, err = sumStructure(sh.canon, cation, anion, accuracy); err != nil {
			return sumStructure(st, cation, anion, accuracy)
		}
		m.mu.Lock()
		if m.shapes == nil || len(m.shapes) >= maxMemo {
			m.shapes = map[string]MadelungValue{}
		}
		m.shapes[sh.key] = v
		m.mu.Unlock()
	}
	return sh.scaled(v), nil
}
