package ewald

import (
	"math"

	"enthalpath/thermo/crystal"
)

// translationTolerance is the largest fractional mismatch accepted when a
// lattice translation maps one site onto another.
const translationTolerance = 1e-12

// positionKey is a site position rounded to a grid of 2⁻³⁰ in each
// fractional coordinate, with its charge: a hash key for translation search.
type positionKey struct {
	f [3]int64
	q float64
}

func keyOf(f crystal.Vec3, q float64) positionKey {
	const grid = 1 << 30
	var k positionKey
	for i := range f {
		k.f[i] = int64(math.Round(f[i]*grid)) % grid
	}
	k.q = q
	return k
}

// orbits finds the internal translations of the cell (fractional vectors t
// that map every site onto a site of equal charge, as in a supercell or a
// centred cell) and returns, for every site, the index of the first site of
// its translation orbit, and the number of translations g. Sites of one
// orbit have equal potentials. With g = 1 every site is its own
// representative.
func (s *system) orbits() (rep []int, g int) {
	n := len(s.q)
	rep = make([]int, n)
	for i := range rep {
		rep[i] = i
	}
	if n < 2 {
		return rep, 1
	}
	index := make(map[positionKey]int, n)
	for i, f := range s.frac {
		index[keyOf(f, s.q[i])] = i
	}
	lookup := func(f crystal.Vec3, q float64) int {
		for k := range f {
			f[k] -= math.Floor(f[k])
		}
		j, ok := index[keyOf(f, q)]
		if !ok {
			return -1
		}
		for k := range f {
			d := f[k] - s.frac[j][k]
			d -= math.Round(d)
			if math.Abs(d) > translationTolerance {
				return -1
			}
		}
		return j
	}
	var translations []crystal.Vec3
	for c := 1; c < n; c++ {
		if s.q[c] != s.q[0] {
			continue
		}
		t := s.frac[c].Sub(s.frac[0])
		ok := true
		for i := 0; i < n && ok; i++ {
			ok = lookup(s.frac[i].Add(t), s.q[i]) >= 0
		}
		if ok {
			translations = append(translations, t)
		}
	}
	if len(translations) == 0 {
		return rep, 1
	}
	for i := 0; i < n; i++ {
		if rep[i] != i {
			continue
		}
		for _, t := range translations {
			if j := lookup(s.frac[i].Add(t), s.q[i]); j > i && rep[j] == j {
				rep[j] = i
			}
		}
	}
	return rep, len(translations) + 1
}
